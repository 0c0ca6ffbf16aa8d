package org.twinlight.timing.period;

import org.twinlight.eclipse.LimbDarkening;
import org.twinlight.eclipse.Occultation;

/**
 * The shape of an eclipse as an opaque disc crossing a limb-darkened disc in a straight line: the
 * template that times eclipses ({@link PeriodRefinement}). Lengths are in units of the eclipsed star's
 * radius: the front disc has radius {@code radiusRatio} (above 1 for an occultation of the smaller star)
 * and passes at {@code impact} from the centre. The hidden fraction comes from the project's occultation
 * integrals ({@link Occultation#hiddenFraction}, Mandel &amp; Agol 2002, ApJ 580, L171, for the quadratic
 * law); the profile is normalised to 1 at mid-eclipse and tabulated against the distance from
 * mid-eclipse in units of the half width (first to last contact), between samples linearly.
 */
final class DiscTemplate implements PeriodRefinement.EclipseProfile {
    /**
     * Quadratic limb darkening (u₁, u₂) = (0.4, 0.25), typical of Sun-like stars in the visual (recalled
     * from memory of the tables of Claret 2000, A&amp;A 363, 1081; order of magnitude only). The radii and
     * the impact parameter are fitted, so the law only needs to give the right kind of curvature.
     */
    static final LimbDarkening TYPICAL_LIMB_DARKENING = LimbDarkening.quadratic(0.4, 0.25);
    /**
     * Discs of uniform brightness: the other extreme of limb darkening, whose timings show how much the
     * period depends on the law assumed.
     */
    static final LimbDarkening NO_LIMB_DARKENING = LimbDarkening.uniform();
    /** Largest impact parameter, as a fraction of the sum of the radii (a grazing eclipse keeps some depth). */
    static final double MAX_IMPACT_SHARE = 0.95;
    /** Table samples from mid-eclipse to the last contact. */
    private static final int SAMPLES = 96;

    private final double halfWidth;
    private final double radiusRatio;
    private final double impact;
    private final double[] table;

    /**
     * @param halfWidth half of the eclipse's full width (first to last contact), in the unit of the distances
     *     given to {@link #profile} (phase)
     * @param radiusRatio radius of the front disc over that of the eclipsed star, &gt; 0
     * @param impactShare impact parameter over the sum of the radii, in [0, {@link #MAX_IMPACT_SHARE}]
     * @param ld intensity profile of the eclipsed star
     */
    DiscTemplate(double halfWidth, double radiusRatio, double impactShare, LimbDarkening ld) {
        this.halfWidth = halfWidth;
        this.radiusRatio = radiusRatio;
        double sum = 1 + radiusRatio;
        this.impact = Math.max(0, Math.min(MAX_IMPACT_SHARE, impactShare)) * sum;
        double chord = Math.sqrt((sum - impact) * (sum + impact));
        double centre = Occultation.hiddenFraction(ld, radiusRatio, impact);
        table = new double[SAMPLES + 2];
        for (int j = 0; j < SAMPLES; j++) {
            double x = chord * j / SAMPLES;
            table[j] = Occultation.hiddenFraction(ld, radiusRatio, Math.hypot(impact, x)) / centre;
        }
    }

    @Override
    public double halfWidth() {
        return halfWidth;
    }

    double radiusRatio() {
        return radiusRatio;
    }

    double impactShare() {
        return impact / (1 + radiusRatio);
    }

    /** Hidden light at distance {@code d} from mid-eclipse (same unit as the half width), 1 at mid-eclipse. */
    @Override
    public double profile(double d) {
        // Beyond the last contact j = SAMPLES, where the table holds zeros.
        double x = Math.abs(d) / halfWidth * SAMPLES;
        int j = (int) Math.min(x, SAMPLES);
        return table[j] + (x - j) * (table[j + 1] - table[j]);
    }

    /** Derivative of {@link #profile} with respect to d (negative after mid-eclipse, positive before). */
    @Override
    public double slope(double d) {
        int j = (int) Math.min(Math.abs(d) / halfWidth * SAMPLES, SAMPLES);
        return Math.signum(d) * (table[j + 1] - table[j]) * SAMPLES / halfWidth;
    }
}
