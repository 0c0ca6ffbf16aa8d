package org.twinlight.timing.period;

import java.util.List;

/**
 * The outcome of a period search.
 *
 * @param periodDays the orbital period chosen, days
 * @param periodUncertaintyDays its 1σ uncertainty, days
 * @param uncertaintyMethod how the uncertainty was obtained, in words
 * @param epochDays time of a primary minimum near the middle of the data, days (data time scale)
 * @param epochUncertaintyDays its 1σ uncertainty, days
 * @param significant true when the eclipse signal is significant (see {@code significanceNote})
 * @param sde signal detection efficiency of the highest periodogram peak (robust form, see {@link PeriodSearch})
 * @param significanceNote the detection decision in words
 * @param primary the primary (deeper) eclipse folded at the period
 * @param secondary the secondary eclipse, or null when none is seen
 * @param halfPeriod the evidence for P against 2P
 * @param pdmAgrees true when Stellingwerf's Θ is lower at the period than at every distinct runner-up
 * @param candidates the chosen period, its half and double, and the distinct runners-up
 * @param periodogram the BLS periodogram
 * @param search what was searched
 */
public record PeriodSearchResult(double periodDays, double periodUncertaintyDays, String uncertaintyMethod,
        double epochDays, double epochUncertaintyDays, boolean significant, double sde, String significanceNote,
        EclipseEvent primary, EclipseEvent secondary, HalfPeriodCheck halfPeriod, boolean pdmAgrees,
        List<PeriodCandidate> candidates, Periodogram periodogram, SearchSummary search) {

    public PeriodSearchResult {
        candidates = List.copyOf(candidates);
    }

    /**
     * What was searched.
     *
     * @param points number of points used
     * @param baselineDays span of the data, days
     * @param cadenceDays median spacing of the points, days
     * @param minPeriodDays shortest trial period, days
     * @param maxPeriodDays longest trial period, days
     * @param frequencies number of trial frequencies
     * @param durationFractions trial durations, fractions of the period
     * @param weighted true when the points were weighted by their errors
     */
    public record SearchSummary(int points, double baselineDays, double cadenceDays, double minPeriodDays,
            double maxPeriodDays, int frequencies, List<Double> durationFractions, boolean weighted) {
    }
}
