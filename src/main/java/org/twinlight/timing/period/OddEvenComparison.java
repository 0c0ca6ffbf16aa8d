package org.twinlight.timing.period;

import java.util.Locale;

/**
 * Alternate eclipses compared at twice a period Pₛ: do the eclipses at even cycles of Pₛ (phase 0 of
 * 2Pₛ) and at odd cycles (phase 0.5 of 2Pₛ) differ in depth, width or time? If they do, 2Pₛ is the
 * orbital period; if not, photometry cannot tell two equal eclipses per orbit from one.
 *
 * @param shortPeriodDays Pₛ, days
 * @param evenGroups groups of even cycles measured (0 when phase 0 of 2Pₛ is not covered)
 * @param oddGroups groups of odd cycles measured (0 when phase 0.5 of 2Pₛ is not covered)
 * @param depthDifferenceSigma (even − odd) depth scale over its 1σ error
 * @param widthDifferenceSigma (even − odd) width stretch over its 1σ error
 * @param shiftDifferenceSigma (even − odd) time shift over its 1σ error
 * @param shiftDays the odd eclipses' shift from phase 0.5 of 2Pₛ, days
 * @param chiSquare the three differences together, χ² for 3 degrees of freedom
 * @param covered true when both kinds of cycle are covered
 * @param differ true when covered and χ² exceeds {@link #CHI2_THRESHOLD}
 */
public record OddEvenComparison(double shortPeriodDays, int evenGroups, int oddGroups, double depthDifferenceSigma,
        double widthDifferenceSigma, double shiftDifferenceSigma, double shiftDays, double chiSquare,
        boolean covered, boolean differ) {

    /** Tail probability of the difference test: that of a two-sided 3σ for one normal variable. */
    public static final double FALSE_ALARM = 0.0027;
    /** χ² for 3 degrees of freedom with tail probability {@link #FALSE_ALARM} (about 14.16). */
    public static final double CHI2_THRESHOLD = new org.apache.commons.math3.distribution.ChiSquaredDistribution(
            null, 3).inverseCumulativeProbability(1 - FALSE_ALARM);

    /** Phase 0 or phase 0.5 of 2Pₛ has no usable data: nothing to compare. */
    static OddEvenComparison notCovered(double shortPeriodDays, int evenGroups, int oddGroups) {
        return new OddEvenComparison(shortPeriodDays, evenGroups, oddGroups, Double.NaN, Double.NaN, Double.NaN,
                Double.NaN, Double.NaN, false, false);
    }

    static OddEvenComparison measured(double shortPeriodDays, int evenGroups, int oddGroups, double depthSigma,
            double widthSigma, double shiftSigma, double shiftDays, double chiSquare) {
        return new OddEvenComparison(shortPeriodDays, evenGroups, oddGroups, depthSigma, widthSigma, shiftSigma,
                shiftDays, chiSquare, true, chiSquare > CHI2_THRESHOLD);
    }

    /** The comparison in words. */
    public String describe() {
        if (!covered) {
            return String.format(Locale.ROOT, "alternate eclipses at 2P = %.8g d cannot be compared: %s has no"
                    + " usable data (unknown, not \"equal\")", 2 * shortPeriodDays,
                    oddGroups == 0 && evenGroups == 0 ? "neither phase 0 nor phase 0.5"
                            : oddGroups == 0 ? "phase 0.5" : "phase 0");
        }
        return String.format(Locale.ROOT, "alternate eclipses at 2P = %.8g d (%d even, %d odd groups of cycles) %s:"
                + " depth %.1fσ, width %.1fσ, time %.1fσ (odd ones %.2f min from phase 0.5), χ² = %.1f for 3 degrees"
                + " of freedom against %.2f", 2 * shortPeriodDays, evenGroups, oddGroups,
                differ ? "DIFFER" : "agree", depthDifferenceSigma, widthDifferenceSigma, shiftDifferenceSigma,
                shiftDays * 1440, chiSquare, CHI2_THRESHOLD);
    }
}
