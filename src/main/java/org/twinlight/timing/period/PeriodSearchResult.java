package org.twinlight.timing.period;

import java.util.List;
import java.util.Optional;

/**
 * The outcome of a period search.
 *
 * @param periodDays the period reported, days (see {@code decision} for whether it is certain)
 * @param periodUncertaintyDays its 1σ uncertainty, days
 * @param uncertaintyMethod how the uncertainty was obtained, in words
 * @param epochDays time of a primary minimum, days (data time scale)
 * @param epochUncertaintyDays its 1σ uncertainty, days
 * @param sde signal detection efficiency of the highest periodogram peak (robust form, see {@link PeriodSearch})
 * @param significanceNote the detection decision in words
 * @param primary the primary (deeper) eclipse folded at the period
 * @param secondary the secondary eclipse, empty when none is seen
 * @param decision the period decision: confident, ambiguous or not significant, with the evidence
 * @param oddEven the comparison of alternate eclipses, when it was needed
 * @param candidates the candidate periods compared, each refined
 * @param periodogram the BLS periodogram
 * @param search what was searched
 * @param periodCaution a warning that goes with the period (so few eclipses timed that the next minimum
 *     should be observed to confirm it), empty when there is none
 */
public record PeriodSearchResult(double periodDays, double periodUncertaintyDays, String uncertaintyMethod,
        double epochDays, double epochUncertaintyDays, double sde, String significanceNote, EclipseEvent primary,
        Optional<EclipseEvent> secondary, PeriodDecision decision, Optional<OddEvenComparison> oddEven,
        List<PeriodCandidate> candidates, Periodogram periodogram, SearchSummary search,
        Optional<String> periodCaution) {

    public PeriodSearchResult {
        candidates = List.copyOf(candidates);
    }

    /** True when the eclipse signal is significant. */
    public boolean significant() {
        return decision.status() != PeriodDecision.Status.NOT_SIGNIFICANT;
    }

    /**
     * What was searched.
     *
     * @param points number of points used
     * @param baselineDays span of the data, days
     * @param cadenceDays median spacing of the points, days
     * @param resolutionDays spacing of the closest points, days (sets the finest trial eclipse)
     * @param minPeriodDays shortest trial period, days
     * @param maxPeriodDays longest trial period, days
     * @param frequencies number of trial frequencies
     * @param durationFractions trial durations, fractions of the period
     * @param weighted true when the points were weighted by their errors
     */
    public record SearchSummary(int points, double baselineDays, double cadenceDays, double resolutionDays,
            double minPeriodDays, double maxPeriodDays, int frequencies, List<Double> durationFractions,
            boolean weighted) {
    }
}
