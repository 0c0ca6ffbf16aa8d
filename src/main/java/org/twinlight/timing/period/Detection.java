package org.twinlight.timing.period;

import java.util.List;
import java.util.Locale;
import org.twinlight.WorkFailedException;
import org.twinlight.photometry.RobustStatistics;

/**
 * The detection step: the BLS periodogram over the grid, its distinct peaks, the robust signal
 * detection efficiency of the highest one and the depth signal-to-noise ratio of its eclipse.
 *
 * @param grid the trial frequencies
 * @param bls the periodogram's engine (for boxes at other trial periods)
 * @param power BLS signal residue at each trial frequency
 * @param peaks indices of the distinct peaks, strongest first
 * @param level median of the power
 * @param spread robust scatter of the power (1.4826 MAD)
 * @param topPeriodDays period of the highest peak, days
 * @param dip the eclipse of the highest peak's best box, folded at that period (phase 0 at the data's
 *     reference time)
 * @param sde robust SDE of the highest peak
 * @param significant true when the eclipse signal is significant
 * @param note the detection decision in words
 */
record Detection(FrequencyGrid grid, BoxLeastSquares bls, double[] power, List<Integer> peaks, double level,
        double spread, double topPeriodDays, FoldedEclipses.Dip dip, double sde, boolean significant, String note) {

    /** Distinct peaks kept for the comparison of candidates. */
    static final int PEAKS = 12;

    static Detection run(SearchData data, SearchRange range, PeriodSearchSettings settings) {
        FrequencyGrid grid = FrequencyGrid.build(data.baselineDays(), data.resolutionDays(), range.minPeriodDays(),
                range.maxPeriodDays(), settings.shortestDuration(), settings.oversampling());
        BoxLeastSquares bls = new BoxLeastSquares(data.timesDays(), data.flux(), data.errors(),
                settings.durationFractions());
        double[] power = bls.power(grid, data.baselineDays(), settings.parallel());
        // Robust level and spread of the periodogram: an eclipsing binary fills it with harmonics, which
        // would inflate a plain standard deviation and hide the very peak being measured.
        double level = RobustStatistics.median(power);
        double spread = RobustStatistics.madSigma(power);
        List<Integer> peaks = PeakFinder.distinctPeaks(grid, power,
                settings.longestDuration() * 2 / data.baselineDays(), PEAKS);
        if (peaks.isEmpty()) {
            throw new WorkFailedException(data.source()
                    + ": the periodogram has no dip-like peak; check that the values are flux (not magnitude)");
        }
        int top = peaks.get(0);
        double sde = spread > 0 ? (power[top] - level) / spread : 0;
        double fTop = grid.frequency(top);
        BoxLeastSquares.Box box = bls.bestBox(fTop, grid.effectiveShortestDuration(fTop));
        FoldedEclipses fold = new FoldedEclipses(data.timesDays(), data.flux(), 1 / fTop, bls.referenceTimeDays());
        FoldedEclipses.Dip dip = fold.refine(fold.measure(box.centrePhase(), box.durationFraction()));
        double snr = dip.signalToNoise();
        boolean standsOut = sde >= PeriodSearch.SDE_THRESHOLD;
        boolean significant = snr >= PeriodSearch.DETECTION_SNR
                && (standsOut || snr >= PeriodSearch.STRONG_DETECTION_SNR);
        String note = significant && standsOut
                ? String.format(Locale.ROOT,
                        "significant: SDE %.1f ≥ %.1f and eclipse depth S/N %.1f ≥ %.1f at the highest peak", sde,
                        PeriodSearch.SDE_THRESHOLD, snr, PeriodSearch.DETECTION_SNR)
                : significant
                ? String.format(Locale.ROOT,
                        "significant: eclipse depth S/N %.1f ≥ %.1f, but the peak does not stand out of the "
                                + "periodogram (SDE %.1f < %.1f): gaps in the data make aliases, so check the "
                                + "candidates against other data", snr, PeriodSearch.STRONG_DETECTION_SNR, sde,
                        PeriodSearch.SDE_THRESHOLD)
                : String.format(Locale.ROOT,
                        "NOT significant: SDE %.1f (needs ≥ %.1f), eclipse depth S/N %.1f (needs ≥ %.1f); the best"
                                + " peak is probably noise", sde, PeriodSearch.SDE_THRESHOLD, snr,
                        PeriodSearch.DETECTION_SNR);
        return new Detection(grid, bls, power, peaks, level, spread, 1 / fTop, dip, sde, significant, note);
    }

    /** Robust SDE of a power value. */
    double sdeOf(double srPower) {
        return spread > 0 ? (srPower - level) / spread : Double.NaN;
    }

    /** The periodogram with periods (decreasing along the arrays). */
    Periodogram periodogram() {
        double[] periods = new double[grid.size()];
        for (int k = 0; k < periods.length; k++) {
            periods[k] = 1 / grid.frequency(k);
        }
        return new Periodogram(periods, power);
    }
}
