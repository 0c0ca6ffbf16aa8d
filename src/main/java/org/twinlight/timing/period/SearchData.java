package org.twinlight.timing.period;

import java.util.Arrays;
import java.util.Locale;
import org.twinlight.BadInputException;
import org.twinlight.photometry.LightCurve;
import org.twinlight.photometry.RobustStatistics;

/**
 * The light curve as the period search uses it: times, fluxes divided by their median, errors as
 * weights (or null), the baseline, the typical spacing of the points and the spacing of the closest
 * points (the time resolution of an eclipse).
 *
 * @param source where the data came from, for messages
 * @param timesDays times, days
 * @param flux relative flux, median 1
 * @param errors 1σ errors of the relative flux, or null when the data carry none (or unusable ones)
 * @param baselineDays span of the data, days
 * @param cadenceDays median spacing of consecutive points, days
 * @param resolutionDays spacing of the closest consecutive points (10th percentile), days: an eclipse
 *     cannot look shorter than this, whatever the spacing of most points (sparse survey data take a
 *     few points a night, so their median spacing is a day or more, but each point is a short exposure)
 */
record SearchData(String source, double[] timesDays, double[] flux, double[] errors, double baselineDays,
        double cadenceDays, double resolutionDays) {

    /** Fewest points for a search. */
    static final int MIN_POINTS = 50;

    static SearchData of(LightCurve lc) {
        int n = lc.size();
        if (n < MIN_POINTS) {
            throw new BadInputException(lc.source() + ": only " + n + (n == 1 ? " usable point" : " usable points") + "; a period search needs at least "
                    + MIN_POINTS);
        }
        double[] t = lc.timesDays();
        double[] raw = lc.fluxes();
        for (int i = 0; i < n; i++) {
            if (!Double.isFinite(raw[i]) || !Double.isFinite(t[i])) {
                throw new BadInputException(String.format(Locale.ROOT,
                        "%s: point %d (time %s) has a time or flux that is not a finite number", lc.source(), i + 1,
                        t[i]));
            }
        }
        double median = RobustStatistics.median(raw);
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
        double[] gaps = new double[n - 1];
        for (int i = 1; i < n; i++) {
            gaps[i - 1] = t[i] - t[i - 1];
        }
        Arrays.sort(gaps);
        double cadence = RobustStatistics.medianInPlace(gaps, gaps.length);
        double resolution = Math.max(gaps[(int) (0.1 * (gaps.length - 1))], 1e-6);
        return new SearchData(lc.source(), t, x, err, t[n - 1] - t[0], cadence, resolution);
    }

    int size() {
        return flux.length;
    }

    /** {longest gap, span of the data before it, span after it}, days. */
    double[] longestGap() {
        double[] t = timesDays;
        int at = 1;
        for (int i = 2; i < t.length; i++) {
            if (t[i] - t[i - 1] > t[at] - t[at - 1]) {
                at = i;
            }
        }
        return new double[] {t[at] - t[at - 1], t[at - 1] - t[0], t[t.length - 1] - t[at]};
    }

    /**
     * Red-noise factor β on a time scale (time-averaging method, Winn et al. 2008, AJ 135, 1625, Sect. 3;
     * Pont, Zucker &amp; Queloz 2006, MNRAS 373, 231): the residuals (data minus a model of the periodic
     * signal) are put in bins of {@code timescaleDays}; for white noise of σ the mean of M residuals
     * scatters by σ/√M, so β² = mean over bins of M·(bin mean)² / σ², and β = max(1, β). Correlated
     * noise (nightly zero points, trends) makes β &gt; 1; a dip's S/N from white-noise errors must then be
     * divided by β.
     */
    double redNoiseFactor(double[] residuals, double timescaleDays) {
        double sigma = RobustStatistics.madSigma(residuals);
        if (residuals.length < 10 || !(sigma > 0) || !(timescaleDays > 0)) {
            return 1;
        }
        double sum = 0;
        int bins = 0;
        int from = 0;
        for (int i = 1; i <= residuals.length; i++) {
            if (i == residuals.length || timesDays[i] - timesDays[from] > timescaleDays) {
                int m = i - from;
                if (m >= 3) {
                    double mean = 0;
                    for (int k = from; k < i; k++) {
                        mean += residuals[k];
                    }
                    mean /= m;
                    sum += m * mean * mean;
                    bins++;
                }
                from = i;
            }
        }
        return bins < 3 ? 1 : Math.max(1, Math.sqrt(sum / bins) / sigma);
    }
}
