package org.twinlight.timing.period;

/**
 * The evidence for choosing between the periodogram's best period P and 2P: an eclipsing binary with
 * near-equal eclipses folds best at half its orbital period.
 *
 * @param verdict the decision
 * @param blsPeriodDays P, the period of the highest periodogram peak, days
 * @param doublePeriodDays 2P, days
 * @param secondaryAtBlsPeriodSnr signal-to-noise ratio of the deepest other dip folded at P (0 when none)
 * @param secondaryThresholdSnr the signal-to-noise ratio a dip needs to count as a secondary eclipse
 * @param oddEclipse the eclipse at the primary's phase folded at 2P (null when not measured)
 * @param evenEclipse the eclipse half a cycle later folded at 2P (null when not measured)
 * @param depthDifferenceSigma |depth odd − depth even| over its 1σ error, depths measured in the inner half
 *     of each eclipse (same box width for both)
 * @param durationDifferenceSigma |duration odd − duration even| over its 1σ error
 * @param phaseOffsetFromHalf how far the even eclipse lies from phase 0.5 after the odd one folded at 2P,
 *     fraction of 2P (an eccentric orbit moves the secondary away from 0.5)
 * @param phaseOffsetSigma that offset over its 1σ error (NaN when not measured)
 * @param thresholdSigma the difference in σ above which alternate eclipses count as different
 * @param explanation the decision in words, for people
 */
public record HalfPeriodCheck(HalfPeriodVerdict verdict, double blsPeriodDays, double doublePeriodDays,
        double secondaryAtBlsPeriodSnr, double secondaryThresholdSnr, EclipseEvent oddEclipse,
        EclipseEvent evenEclipse, double depthDifferenceSigma, double durationDifferenceSigma,
        double phaseOffsetFromHalf, double phaseOffsetSigma, double thresholdSigma, String explanation) {

    /** True when the period cannot be told from its half by photometry alone. */
    public boolean ambiguous() {
        return verdict == HalfPeriodVerdict.EQUAL_ECLIPSES_AMBIGUOUS;
    }
}
