package org.twinlight.timing.period;

import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import org.twinlight.BadInputException;
import org.twinlight.photometry.LightCurve;

/**
 * Period search for eclipsing binaries.
 *
 * <ol>
 * <li>Box Least Squares periodogram (Kovács, Zucker &amp; Mazeh 2002, A&amp;A 391, 369) over the
 * grid of {@link FrequencyGrid}, with trial durations from the settings.</li>
 * <li>Significance: the depth signal-to-noise ratio of the folded eclipse, and the signal detection
 * efficiency of the highest peak in a robust form, SDE = (SR<sub>peak</sub> − median SR)/(1.4826·MAD SR)
 * (KZM 2002, Sect. 3 use the mean and standard deviation; median and MAD keep the many harmonic peaks
 * of an eclipsing binary from hiding the main one).</li>
 * <li>Confirmation ({@link CandidateComparison}): the highest peak, its multiples 2P, P/2, 2P/3, 3P/2, 3P and
 * the strong runners-up, each refined from its own eclipse timings ({@link RefinedPeriod}), then compared
 * by phase dispersion (Stellingwerf 1978, ApJ 224, 953) at a common time resolution and by the χ² of
 * their timings.</li>
 * <li>Half-period resolution and verdict ({@link PeriodDecider}): coverage of the eclipses, a second
 * eclipse, alternate eclipses compared ({@link AlternateEclipses}) and the eclipse shape give a confident
 * period or an ambiguity with the candidates and what would settle it ({@link PeriodDecision}).</li>
 * <li>Measurement at the period decided: epoch, eclipses, and across a long gap an uncertainty of at
 * least the alias spacing.</li>
 * </ol>
 */
public final class PeriodSearch {
    /** Fewest points for a search. */
    public static final int MIN_POINTS = SearchData.MIN_POINTS;
    /**
     * Robust SDE a peak needs to stand out of the periodogram (common practice, no source). On our own
     * white-noise light curves (60 seeds, 2300–3900 points) the highest peak reached 4–7; it is the depth
     * test below that rejects noise, this one guards against correlated noise that fools the depth test.
     */
    public static final double SDE_THRESHOLD = 5.0;
    /**
     * Depth signal-to-noise ratio the primary eclipse needs for a detection. Calibrated on our own
     * white-noise light curves: the best box of the whole search reached at most 5.9 in 60 seeds
     * (the look-elsewhere effect of ~10⁸ trial boxes); 7 leaves a margin for larger data sets.
     */
    public static final double DETECTION_SNR = 7.0;
    /**
     * Depth signal-to-noise ratio above which a dip counts as real even when its peak does not stand out
     * of the periodogram: nightly or seasonal gaps fill the periodogram with aliases of a real signal,
     * which lowers the SDE of every peak (common practice, no source).
     */
    public static final double STRONG_DETECTION_SNR = 30.0;
    /** Signal-to-noise ratio a second dip needs to count as a secondary eclipse (common practice, no source). */
    public static final double SECONDARY_SNR = 5.0;
    /**
     * Signal-to-noise ratio a dip exactly half a period from the primary needs to count as a secondary
     * eclipse: a single trial, so a 3σ one-sided threshold (common practice, no source).
     */
    public static final double TARGETED_SECONDARY_SNR = 3.0;
    /** Difference in σ above which the second eclipse counts as the deeper one (common practice, no source). */
    public static final double ODD_EVEN_SIGMA = 3.0;
    /** Reduced χ² of the eclipse timings above which they do not follow one period (common practice, no source). */
    public static final double CYCLE_COUNT_CHI2 = 9.0;
    /** Shortest default trial period, days. */
    public static final double DEFAULT_MIN_PERIOD_DAYS = 0.2;

    private PeriodSearch() {
    }

    /**
     * Searches {@code lc} for an eclipse period: detection, candidates refined and compared, the half-period
     * resolution and verdict, and the final measurement at the period decided.
     *
     * @throws BadInputException when the light curve cannot support a search (too few points, too short a
     *     baseline for two eclipses, a period range outside the data)
     */
    public static PeriodSearchResult search(LightCurve lc, PeriodSearchSettings settings) {
        SearchData data = SearchData.of(lc);
        SearchRange range = SearchRange.of(data, settings);
        Detection det = Detection.run(data, range, settings);
        PeriodSearchResult.SearchSummary summary = new PeriodSearchResult.SearchSummary(data.size(),
                data.baselineDays(), data.cadenceDays(), data.resolutionDays(), range.minPeriodDays(),
                range.maxPeriodDays(), det.grid().size(), Arrays.stream(settings.durationFractions()).boxed().toList(),
                data.errors() != null);
        double scatter = FoldedEclipses.robustScatter(data.flux());
        if (!det.significant()) {
            RefinedPeriod peak = RefinedPeriod.fromPeak(det.topPeriodDays(), det.bls().referenceTimeDays()
                    + det.dip().centre() * det.topPeriodDays(), det.dip().width(), det.dip().level(),
                    data.baselineDays());
            PeriodCandidate top = new PeriodCandidate(peak, "highest peak", det.power()[det.peaks().get(0)], det.sde(),
                    new PhaseDispersion(data.timesDays(), data.flux()).thetaWithBinWidth(peak.periodDays(),
                            CandidateComparison.binDays(data, det)).theta(), false, "not significant");
            return new PeriodSearchResult(peak.periodDays(), peak.periodErrorDays(), peak.method(), peak.epochDays(),
                    peak.epochErrorDays(), det.sde(), det.note(), det.dip().toEvent(det.dip().centre()),
                    Optional.empty(), PeriodDecision.notSignificant(peak.periodDays(), det.note()), Optional.empty(),
                    List.of(top), det.periodogram(), summary, Optional.empty());
        }
        CandidateComparison.Comparison comparison = CandidateComparison.compare(data, det, range, scatter);
        PeriodDecider.Outcome outcome = PeriodDecider.decide(data, range, comparison, settings.durationFractions());
        return measure(data, det, outcome, comparison.candidates(), scatter, settings, summary);
    }

    /** The final measurement at the period decided: refined period, epoch, eclipses, and the caution for gaps. */
    private static PeriodSearchResult measure(SearchData data, Detection det, PeriodDecider.Outcome outcome,
            List<PeriodCandidate> candidates, double scatter, PeriodSearchSettings settings,
            PeriodSearchResult.SearchSummary summary) {
        PeriodDecision decision = outcome.decision();
        double target = decision.periodDays();
        RefinedPeriod refined = candidates.stream().map(PeriodCandidate::refined)
                .filter(r -> Math.abs(r.periodDays() - target) <= 3 * r.periodErrorDays() + 1e-9 * target)
                .findFirst().orElseGet(() -> RefinedPeriod.at(data, det.bls(), det.grid(), scatter, target));
        double period = refined.periodDays();
        double epoch = refined.epochDays();
        double epochError = refined.epochErrorDays();
        SecondaryEclipse found = SecondaryEclipse.find(data, period, epoch, refined.widthPhase(),
                settings.durationFractions());
        FoldedEclipses.Dip primary = found.primary();
        Optional<EclipseEvent> secondary = Optional.empty();
        if (found.found()) {
            FoldedEclipses.Dip sec = found.secondary();
            if (sec.coreDepth() - primary.coreDepth()
                    > ODD_EVEN_SIGMA * Math.hypot(sec.coreDepthError(), primary.coreDepthError())) {
                // The primary is the deeper eclipse; within the errors the label is a matter of choice and the
                // timed eclipse keeps it (its epoch is the more precise).
                FoldedEclipses.Dip deeper = sec;
                sec = primary;
                primary = deeper;
                epoch += FoldedEclipses.wrap(primary.centre() - sec.centre()) * period;
                epochError = Math.hypot(epochError, primary.width() * period / 40);
            }
            secondary = Optional.of(sec.toEvent(primary.centre()));
        }
        // Across a gap much longer than the data on either side, the cycle count can be wrong by one or
        // more: the timings then disagree with one period, or unrelated candidates fold as well. Say so,
        // and let the uncertainty be at least the spacing of the aliases, P²/gap (one cycle more or less).
        String note = det.note();
        double[] gap = data.longestGap();
        boolean timingsDisagree = refined.timingsScatterBeyond(CYCLE_COUNT_CHI2);
        boolean unrelatedFit = !decision.confident();
        if (gap[0] > 2 * Math.max(gap[1], gap[2]) && (timingsDisagree || unrelatedFit)) {
            double aliasSpacing = period * period / gap[0];
            refined = refined.withPeriodErrorAtLeast(aliasSpacing, String.format(Locale.ROOT,
                    "raised to the alias spacing P²/gap = %.3g d", aliasSpacing));
            note += String.format(Locale.ROOT, ". CAUTION: the data have a %.1f-d gap, much longer than the data on"
                    + " either side, and %s: the number of cycles across the gap may be wrong. Periods P = gap/N for"
                    + " neighbouring N fit about as well; check them with other data", gap[0], timingsDisagree
                            ? String.format(Locale.ROOT, "the eclipse timings do not follow one period (χ²ν = %.1f)",
                                    refined.timingReducedChiSquare().orElse(Double.NaN))
                            : "the period is not decided");
        }
        return new PeriodSearchResult(period, refined.periodErrorDays(), refined.method(), epoch, epochError,
                det.sde(), note, primary.toEvent(primary.centre()), secondary, decision.withPeriodDays(period),
                Optional.ofNullable(outcome.oddEven()), candidates, det.periodogram(), summary, refined.caution());
    }
}
