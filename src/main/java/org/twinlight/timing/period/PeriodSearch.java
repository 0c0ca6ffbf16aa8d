package org.twinlight.timing.period;

import org.twinlight.timing.Ephemeris;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
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
 * <li>Half-period resolution: the highest peak P of a binary with near-equal eclipses is half the
 * orbital period. If another significant dip shows folded at P, P stands; otherwise the data are folded
 * at 2P and alternate eclipses compared in depth and duration: a significant difference means 2P; no
 * difference leaves an ambiguity that photometry cannot settle, and 2P is reported (an eclipsing binary
 * shows two eclipses per orbit) with the ambiguity stated.</li>
 * <li>Refinement and uncertainty from eclipse timings ({@link PeriodRefinement}).</li>
 * <li>Confirmation with phase dispersion minimisation (Stellingwerf 1978, ApJ 224, 953) at the period,
 * its half and double, and the runners-up.</li>
 * </ol>
 */
public final class PeriodSearch {
    /** Fewest points for a search. */
    public static final int MIN_POINTS = 50;
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
    /** Difference in σ above which alternate eclipses count as different (common practice, no source). */
    public static final double ODD_EVEN_SIGMA = 3.0;
    /** Distinct runners-up listed. */
    public static final int RUNNERS_UP = 5;
    /** Reduced χ² of the eclipse timings above which they do not follow one period (common practice, no source). */
    public static final double CYCLE_COUNT_CHI2 = 9.0;
    /** Shortest default trial period, days. */
    public static final double DEFAULT_MIN_PERIOD_DAYS = 0.2;

    private PeriodSearch() {
    }

    /** "a/b·P" when p is within {@code tolerance} (in frequency) of a/b times P for a, b ≤ 5, else null. */
    static String harmonic(double p, double periodDays, double tolerance) {
        for (int a = 1; a <= 5; a++) {
            for (int b = 1; b <= 5; b++) {
                if (a == b || gcd(a, b) != 1) {
                    continue;
                }
                double hp = periodDays * a / b;
                if (Math.abs(1 / p - 1 / hp) < tolerance) {
                    return b == 1 ? a + "P" : a == 1 ? "P/" + b : a + "P/" + b;
                }
            }
        }
        return null;
    }

    private static int gcd(int a, int b) {
        return b == 0 ? a : gcd(b, a % b);
    }

    /**
     * Searches {@code lc} for an eclipse period.
     *
     * @throws BadInputException when the light curve cannot support a search (too few points, too short a
     *     baseline for two eclipses, a period range outside the data)
     */
    public static PeriodSearchResult search(LightCurve lc, PeriodSearchSettings settings) {
        int n = lc.size();
        if (n < MIN_POINTS) {
            throw new BadInputException(lc.source() + ": only " + n + (n == 1 ? " usable point" : " usable points") + "; a period search needs at least "
                    + MIN_POINTS);
        }
        Prepared data = prepare(lc);
        double[] t = data.timesDays();
        double[] x = data.flux();
        double[] err = data.errors();
        double baseline = data.baselineDays();
        double cadence = data.cadenceDays();
        double[] range = periodRange(lc, settings, baseline, cadence);
        double minP = range[0];
        double maxP = range[1];

        FrequencyGrid grid = FrequencyGrid.build(baseline, cadence, minP, maxP, settings.shortestDuration(),
                settings.oversampling());
        BoxLeastSquares bls = new BoxLeastSquares(t, x, err, settings.durationFractions());
        double[] power = bls.power(grid, baseline, settings.parallel());
        double[] periods = new double[grid.size()];
        for (int k = 0; k < periods.length; k++) {
            periods[k] = 1 / grid.frequency(k);
        }
        // Robust level and spread of the periodogram: an eclipsing binary fills it with harmonics, which
        // would inflate a plain standard deviation and hide the very peak being measured.
        double[] sortedPower = power.clone();
        Arrays.sort(sortedPower);
        double level = FoldedEclipses.median(sortedPower);
        double spread = FoldedEclipses.robustScatter(power);
        List<Integer> peaks = PeakFinder.distinctPeaks(grid, power, settings.longestDuration() * 2 / baseline,
                RUNNERS_UP + 4);
        if (peaks.isEmpty()) {
            throw new org.twinlight.WorkFailedException(lc.source()
                    + ": the periodogram has no dip-like peak; check that the values are flux (not magnitude)");
        }
        int top = peaks.get(0);
        double sde = spread > 0 ? (power[top] - level) / spread : 0;
        double fTop = grid.frequency(top);
        BoxLeastSquares.Box box = bls.bestBox(fTop, grid.effectiveShortestDuration(fTop));
        double blsPeriod = 1 / fTop;
        double ref = bls.referenceTimeDays();

        FoldedEclipses fold1 = new FoldedEclipses(t, x, blsPeriod, ref);
        FoldedEclipses.Dip prim1 = fold1.refine(fold1.measure(box.centrePhase(), box.durationFraction()));
        boolean standsOut = sde >= SDE_THRESHOLD;
        boolean significant = prim1.signalToNoise() >= DETECTION_SNR
                && (standsOut || prim1.signalToNoise() >= STRONG_DETECTION_SNR);
        String note = significant && standsOut
                ? String.format(java.util.Locale.ROOT,
                        "significant: SDE %.1f ≥ %.1f and eclipse depth S/N %.1f ≥ %.1f at the highest peak", sde,
                        SDE_THRESHOLD, prim1.signalToNoise(), DETECTION_SNR)
                : significant
                ? String.format(java.util.Locale.ROOT,
                        "significant: eclipse depth S/N %.1f ≥ %.1f, but the peak does not stand out of the "
                                + "periodogram (SDE %.1f < %.1f): gaps in the data make aliases, so check the "
                                + "runners-up against other data", prim1.signalToNoise(), STRONG_DETECTION_SNR, sde,
                        SDE_THRESHOLD)
                : String.format(java.util.Locale.ROOT,
                        "NOT significant: SDE %.1f (needs ≥ %.1f), eclipse depth S/N %.1f (needs ≥ %.1f); the best"
                                + " peak is probably noise", sde, SDE_THRESHOLD, prim1.signalToNoise(), DETECTION_SNR);

        HalfPeriodResolver.Resolution res = significant
                ? HalfPeriodResolver.resolve(t, x, fold1, prim1, ref, settings.durationFractions())
                : HalfPeriodResolver.noDetection(blsPeriod, prim1);

        // Refine the period from eclipse timings at the chosen period.
        double period = res.periodDays();
        double epoch = ref + res.primary().centre() * period;
        double periodError = period * period * res.primary().width() / (2 * baseline);
        double epochError = res.primary().width() * period / 2;
        String uncertaintyMethod = "half-width of the periodogram peak, P²·q/(2T) (no timing possible)";
        double width = res.primary().width();
        double timingReducedChi2 = Double.NaN;
        if (significant) {
            PeriodRefinement pr = new PeriodRefinement(t, x, fold1.scatter(), cadence);
            for (int pass = 0; pass < 2; pass++) {
                PeriodRefinement.Trapezoid shape = pr.fitShape(period, epoch, width, res.primary().level());
                if (shape == null) {
                    break;
                }
                PeriodRefinement.Ephemeris eph = pr.refine(period, epoch, shape);
                if (eph == null) {
                    break;
                }
                period = eph.periodDays();
                epoch = eph.epochDays();
                periodError = eph.periodErrorDays();
                epochError = eph.epochErrorDays();
                timingReducedChi2 = eph.reducedChiSquare();
                uncertaintyMethod = String.format(java.util.Locale.ROOT,
                        "weighted linear fit of %d primary-eclipse timings (trapezoid template, Fisher-information"
                                + " errors%s)", eph.timings(),
                        eph.reducedChiSquare() > 1 ? String.format(java.util.Locale.ROOT,
                                ", scaled by √χ²ν = %.2f", Math.sqrt(eph.reducedChiSquare())) : "");
            }
        }

        // Final measurement folded at the refined ephemeris: primary at phase 0.
        FoldedEclipses fold = new FoldedEclipses(t, x, period, epoch);
        FoldedEclipses.Dip primary = fold.refine(fold.measure(0, width));
        EclipseEvent secondary = null;
        if (res.secondaryPhase() != null) {
            FoldedEclipses.Dip sec = fold.refine(fold.measure(primary.centre() + res.secondaryPhase(),
                    res.secondaryWidth(), primary), primary);
            // Each eclipse's out-of-eclipse level must leave the other eclipse out.
            primary = fold.refine(fold.measure(primary.centre(), primary.width(), sec), sec);
            sec = fold.measure(sec.centre(), sec.width(), primary);
            if (sec.coreDepth() - primary.coreDepth()
                    > ODD_EVEN_SIGMA * Math.hypot(sec.coreDepthError(), primary.coreDepthError())) {
                // The primary is the deeper eclipse; within the errors the label is a matter of choice and the
                // timed eclipse keeps it (its epoch is the more precise).
                FoldedEclipses.Dip deeper = sec;
                sec = primary;
                primary = deeper;
                double shift = FoldedEclipses.wrap(primary.centre() - sec.centre());
                epoch += shift * period;
                epochError = Math.hypot(epochError, primary.width() * period / 40);
            }
            secondary = sec.toEvent(primary.centre());
        }

        // PDM at the period, its half and double and the runners-up, bins of a fifth of the eclipse duration.
        PhaseDispersion pdm = new PhaseDispersion(t, x);
        double binDays = Math.max(cadence, 0.2 * Math.max(primary.duration(), primary.width() / 2) * period);
        List<PeriodCandidate> candidates = candidates(period, peaks, power, grid, bls, pdm, binDays,
                2 * settings.longestDuration() / baseline, level, spread, minP, maxP);
        boolean pdmAgrees = pdmAgrees(candidates);

        // Across a gap much longer than the data on either side, the cycle count can be wrong by one or
        // more: the timings then disagree with one period, or PDM prefers another. Say so, and let the
        // uncertainty be at least the spacing of the aliases, P²/gap (one cycle more or less).
        double[] gap = longestGap(t);
        boolean timingsDisagree = timingReducedChi2 > CYCLE_COUNT_CHI2;
        if (significant && gap[0] > 2 * Math.max(gap[1], gap[2]) && (timingsDisagree || !pdmAgrees)) {
            double aliasSpacing = period * period / gap[0];
            periodError = Math.max(periodError, aliasSpacing);
            uncertaintyMethod += String.format(java.util.Locale.ROOT, "; raised to the alias spacing P²/gap = %.3g d",
                    aliasSpacing);
            note += String.format(java.util.Locale.ROOT, ". CAUTION: the data have a %.1f-d gap, much longer than "
                    + "the data on either side, and %s: the number of cycles across the gap may be wrong. Periods "
                    + "P = gap/N for neighbouring N fit about as well; check them with other data", gap[0],
                    timingsDisagree ? String.format(java.util.Locale.ROOT,
                            "the eclipse timings do not follow one period (χ²ν = %.1f)", timingReducedChi2)
                            : "phase dispersion minimisation does not single out this period");
        }

        PeriodSearchResult.SearchSummary summary = new PeriodSearchResult.SearchSummary(n, baseline, cadence, minP,
                maxP, grid.size(), Arrays.stream(settings.durationFractions()).boxed().toList(), err != null);
        return new PeriodSearchResult(period, periodError, uncertaintyMethod, epoch, epochError, significant, sde, note,
                primary.toEvent(primary.centre()), secondary, res.check(), pdmAgrees, candidates,
                new Periodogram(periods, power), summary);
    }

    /** Times, fluxes divided by their median, errors as weights (or null), baseline and cadence. */
    private record Prepared(double[] timesDays, double[] flux, double[] errors, double baselineDays,
            double cadenceDays) {
    }

    private static Prepared prepare(LightCurve lc) {
        int n = lc.size();
        double[] t = lc.timesDays();
        double[] raw = lc.fluxes();
        for (int i = 0; i < n; i++) {
            if (!Double.isFinite(raw[i]) || !Double.isFinite(t[i])) {
                throw new BadInputException(String.format(java.util.Locale.ROOT,
                        "%s: point %d (time %s) has a time or flux that is not a finite number", lc.source(), i + 1,
                        t[i]));
            }
        }
        double[] sorted = raw.clone();
        Arrays.sort(sorted);
        double median = FoldedEclipses.median(sorted);
        if (!(median > 0) || !Double.isFinite(median)) {
            throw new BadInputException(lc.source() + ": the median flux is " + median
                    + "; a period search needs positive relative flux (read magnitudes with --values magnitude)");
        }
        double[] x = new double[n];
        for (int i = 0; i < n; i++) {
            x[i] = raw[i] / median;
        }
        double[] err = null;
        if (lc.hasErrors()) {
            err = lc.fluxErrors();
            boolean usable = true;
            for (int i = 0; i < n; i++) {
                err[i] /= median;
                usable &= err[i] > 0 && Double.isFinite(err[i]);
            }
            if (!usable) {
                err = null;
            }
        }
        double baseline = t[n - 1] - t[0];
        double[] gaps = new double[n - 1];
        for (int i = 1; i < n; i++) {
            gaps[i - 1] = t[i] - t[i - 1];
        }
        Arrays.sort(gaps);
        double cadence = FoldedEclipses.median(gaps);
        return new Prepared(t, x, err, baseline, cadence);
    }

    /** {shortest, longest} trial period, days, checked against the data. */
    private static double[] periodRange(LightCurve lc, PeriodSearchSettings settings, double baseline,
            double cadence) {
        double minP = settings.minPeriodDays() != null ? settings.minPeriodDays()
                : Math.max(DEFAULT_MIN_PERIOD_DAYS, 3 * cadence / settings.longestDuration());
        double halfBaseline = baseline / 2;
        double maxP;
        if (settings.maxPeriodDays() != null) {
            if (settings.maxPeriodDays() > halfBaseline) {
                throw new BadInputException(String.format(java.util.Locale.ROOT,
                        "%s: maximum period %.6g d exceeds half the baseline (%.6g d of %.6g d): two eclipses of the"
                                + " same kind must be covered; lower --max-period or add data",
                        lc.source(), settings.maxPeriodDays(), halfBaseline, baseline));
            }
            maxP = settings.maxPeriodDays();
        } else {
            maxP = halfBaseline;
        }
        if (!(maxP > minP)) {
            if (settings.minPeriodDays() != null || settings.maxPeriodDays() != null) {
                throw new BadInputException(String.format(java.util.Locale.ROOT,
                        "%s: nothing to search: the shortest trial period %.6g d%s is not below the longest %.6g d%s",
                        lc.source(), minP, settings.minPeriodDays() != null ? " (--min-period)" : "", maxP,
                        settings.maxPeriodDays() != null ? " (--max-period)"
                                : String.format(java.util.Locale.ROOT, " (half the baseline of %.6g d)", baseline)));
            }
            throw new BadInputException(String.format(java.util.Locale.ROOT,
                    "%s: the baseline of %.6g d is too short: two eclipses must be covered, so the longest period"
                            + " that can be searched is %.6g d, which is not above the shortest trial period %.6g d",
                    lc.source(), baseline, maxP, minP));
        }
        return new double[] {minP, maxP};
    }

    /**
     * The chosen period, its half and double, then up to {@link #RUNNERS_UP} distinct periodogram peaks
     * that are none of these, each with its BLS power, robust SDE and PDM Θ.
     */
    private static List<PeriodCandidate> candidates(double period, List<Integer> peaks, double[] power,
            FrequencyGrid grid, BoxLeastSquares bls, PhaseDispersion pdm, double binDays, double tolerance,
            double level, double spread, double minP, double maxP) {
        List<PeriodCandidate> candidates = new ArrayList<>();
        double[] multiples = {period, period / 2, 2 * period};
        String[] roles = {"best", "half", "double"};
        for (int m = 0; m < 3; m++) {
            double p = multiples[m];
            double sr = p >= minP && p <= maxP
                    ? bls.bestBox(1 / p, grid.effectiveShortestDuration(1 / p)).signalResidue() : Double.NaN;
            candidates.add(new PeriodCandidate(p, sr, spread > 0 ? (sr - level) / spread : Double.NaN,
                    pdm.thetaWithBinWidth(p, binDays), roles[m]));
        }
        int runners = 0;
        for (int k : peaks) {
            double p = 1 / grid.frequency(k);
            boolean multiple = false;
            for (double mp : multiples) {
                multiple |= Math.abs(1 / p - 1 / mp) < tolerance;
            }
            if (multiple) {
                continue;
            }
            if (runners == RUNNERS_UP) {
                break;
            }
            double theta = pdm.thetaWithBinWidth(p, binDays);
            String harmonic = harmonic(p, period, tolerance);
            double sde = spread > 0 ? (power[k] - level) / spread : Double.NaN;
            candidates.add(new PeriodCandidate(p, power[k], sde, theta,
                    harmonic == null ? "runner-up" : "runner-up, harmonic " + harmonic));
            runners++;
        }
        return candidates;
    }

    /**
     * True when Θ at the period (first candidate) is below 1 and below Θ at every runner-up that is not a
     * harmonic: a harmonic folds the same eclipses, so only unrelated periods can contradict PDM.
     */
    private static boolean pdmAgrees(List<PeriodCandidate> candidates) {
        double best = candidates.get(0).pdmTheta();
        boolean agrees = best < 1;
        for (PeriodCandidate c : candidates) {
            if (c.role().equals("runner-up")) {
                agrees &= !(c.pdmTheta() <= best);
            }
        }
        return agrees;
    }

    /** {longest gap, span of the data before it, span after it}, days. */
    static double[] longestGap(double[] t) {
        int at = 1;
        for (int i = 2; i < t.length; i++) {
            if (t[i] - t[i - 1] > t[at] - t[at - 1]) {
                at = i;
            }
        }
        return new double[] {t[at] - t[at - 1], t[at - 1] - t[0], t[t.length - 1] - t[at]};
    }
}
