package org.twinlight.timing.period;

import java.util.Arrays;

/**
 * Settings of a period search. Immutable; change one setting with a {@code withX} copy.
 *
 * @param minPeriodDays shortest trial period, days; null: max(0.2 d, 3 cadences / longest duration
 *     fraction), so that the widest trial eclipse spans at least three cadences
 * @param maxPeriodDays longest trial period, days; null: half the baseline (two eclipses of the same
 *     kind must be covered)
 * @param durationFractions trial eclipse durations as fractions of the period, increasing, each in
 *     (0, 0.5); detached eclipsing binaries have eclipses of about 1–15 % of the period
 * @param oversampling frequency-grid oversampling: the step is chosen so that the phase drift over
 *     the baseline is 1/oversampling of the shortest usable trial duration (see {@link FrequencyGrid})
 * @param parallel use all cores for the periodogram
 */
public record PeriodSearchSettings(Double minPeriodDays, Double maxPeriodDays, double[] durationFractions,
        double oversampling, boolean parallel) {

    /** Default trial durations: geometric steps of about 1.6 from 1 % to 15 % of the period. */
    static final double[] DEFAULT_DURATIONS = {0.01, 0.016, 0.025, 0.04, 0.063, 0.1, 0.15};

    public PeriodSearchSettings {
        if (minPeriodDays != null && !(minPeriodDays > 0 && Double.isFinite(minPeriodDays))) {
            throw new IllegalArgumentException("minimum period must be a positive number of days, got " + minPeriodDays);
        }
        if (maxPeriodDays != null && !(maxPeriodDays > 0 && Double.isFinite(maxPeriodDays))) {
            throw new IllegalArgumentException("maximum period must be a positive number of days, got " + maxPeriodDays);
        }
        if (minPeriodDays != null && maxPeriodDays != null && !(maxPeriodDays > minPeriodDays)) {
            throw new IllegalArgumentException("maximum period " + maxPeriodDays
                    + " d must exceed the minimum period " + minPeriodDays + " d");
        }
        durationFractions = durationFractions.clone();
        if (durationFractions.length == 0) {
            throw new IllegalArgumentException("at least one trial duration is needed");
        }
        for (int i = 0; i < durationFractions.length; i++) {
            double q = durationFractions[i];
            if (!(q > 0 && q < 0.5) || (i > 0 && !(q > durationFractions[i - 1]))) {
                throw new IllegalArgumentException("trial durations must increase and lie in (0, 0.5), got "
                        + Arrays.toString(durationFractions));
            }
        }
        if (!(oversampling >= 1 && oversampling <= 20)) {
            throw new IllegalArgumentException("oversampling must lie in [1, 20], got " + oversampling);
        }
    }

    /** Defaults: period range from the data, durations 1–15 % of P, oversampling 2, parallel. */
    public static PeriodSearchSettings defaults() {
        return new PeriodSearchSettings(null, null, DEFAULT_DURATIONS, 2.0, true);
    }

    public PeriodSearchSettings withMinPeriodDays(Double days) {
        return new PeriodSearchSettings(days, maxPeriodDays, durationFractions, oversampling, parallel);
    }

    public PeriodSearchSettings withMaxPeriodDays(Double days) {
        return new PeriodSearchSettings(minPeriodDays, days, durationFractions, oversampling, parallel);
    }

    public PeriodSearchSettings withParallel(boolean p) {
        return new PeriodSearchSettings(minPeriodDays, maxPeriodDays, durationFractions, oversampling, p);
    }

    @Override
    public double[] durationFractions() {
        return durationFractions.clone();
    }

    /** Shortest trial duration, fraction of the period. */
    public double shortestDuration() {
        return durationFractions[0];
    }

    /** Longest trial duration, fraction of the period. */
    public double longestDuration() {
        return durationFractions[durationFractions.length - 1];
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof PeriodSearchSettings s && java.util.Objects.equals(minPeriodDays, s.minPeriodDays)
                && java.util.Objects.equals(maxPeriodDays, s.maxPeriodDays)
                && Arrays.equals(durationFractions, s.durationFractions) && oversampling == s.oversampling
                && parallel == s.parallel;
    }

    @Override
    public int hashCode() {
        return java.util.Objects.hash(minPeriodDays, maxPeriodDays, Arrays.hashCode(durationFractions), oversampling,
                parallel);
    }

    @Override
    public String toString() {
        return "PeriodSearchSettings[min=" + minPeriodDays + ", max=" + maxPeriodDays + ", durations="
                + Arrays.toString(durationFractions) + ", oversampling=" + oversampling + ", parallel=" + parallel + "]";
    }
}
