package org.twinlight.timing.period;

/** How the choice between the periodogram's period P and 2P was made. */
public enum HalfPeriodVerdict {
    /** A second, distinct eclipse shows at P: P is the orbital period. */
    SECONDARY_AT_BLS_PERIOD,
    /**
     * Folded at 2P, alternate eclipses differ in depth or duration, or the second is away from phase 0.5:
     * the orbital period is 2P.
     */
    ODD_EVEN_DIFFER,
    /**
     * Folded at 2P, alternate eclipses are equal and no other eclipse shows at P: either two equal
     * eclipses per orbit at 2P (reported) or one visible eclipse per orbit at P. Photometry alone
     * cannot tell these apart.
     */
    EQUAL_ECLIPSES_AMBIGUOUS,
    /** No significant eclipse signal: nothing to resolve. */
    NO_DETECTION
}
