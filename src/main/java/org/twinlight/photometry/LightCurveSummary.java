package org.twinlight.photometry;

import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.twinlight.time.TimeScale;

/**
 * What a photometrist wants to know about a light curve before working with it. Times and
 * durations in days, in the light curve's time scale; flux in its relative units.
 *
 * <ul>
 *   <li>Cadence: the median of the intervals between consecutive points.</li>
 *   <li>Gaps: intervals longer than {@value #GAP_CADENCE_MULTIPLE} × the median cadence (common
 *       practice, no source), counted, with the longest interval.</li>
 *   <li>Segments: the parts left after splitting at intervals longer than the segment gap
 *       ({@link Segments}).</li>
 *   <li>Scatter and outliers: each point's residual from the median of up to
 *       {@value RunningMedianResiduals#HALF_WINDOW_POINTS} neighbours on each side in its segment,
 *       scaled for the median's own noise; scatter σ = 1.4826 × MAD of the scaled residuals, an
 *       estimate of the point-to-point noise; outliers are the points more than
 *       {@value #OUTLIER_SIGMAS} σ from the running median (a Hampel filter: Hampel 1974, J. Am.
 *       Stat. Assoc. 69, 383; Rousseeuw &amp; Croux 1993, J. Am. Stat. Assoc. 88, 1273) and, on the
 *       same side, from straight lines through their neighbours on the left and on the right. Details in
 *       {@code RunningMedianResiduals}. Nothing is removed.</li>
 * </ul>
 *
 * @param source where the data came from
 * @param band band label, or null
 * @param timeScale time scale of the times
 * @param valueKind what the file held (flux or magnitude)
 * @param points number of points used
 * @param rejectedRows rows read but not used, by reason
 * @param startDays first time, days
 * @param endDays last time, days
 * @param spanDays last minus first time, days
 * @param medianCadenceDays median interval between consecutive points, days (NaN for one point)
 * @param gapThresholdDays intervals longer than this count as gaps, days (NaN for one point)
 * @param gapCount number of gaps
 * @param largestIntervalDays the longest interval between consecutive points, days (NaN for one point)
 * @param segmentGapDays the gap that splits segments, days
 * @param segments the segments in time order
 * @param hasErrors whether the points carry errors
 * @param medianErrorFlux median 1σ flux error (NaN without errors)
 * @param minFlux smallest flux
 * @param medianFlux median flux
 * @param maxFlux largest flux
 * @param scatterFlux robust point-to-point scatter σ, flux units
 * @param outlierCount points more than {@value #OUTLIER_SIGMAS} σ from the running median
 */
public record LightCurveSummary(String source, String band, TimeScale timeScale, ValueKind valueKind, int points,
        Map<String, Integer> rejectedRows, double startDays, double endDays, double spanDays,
        double medianCadenceDays, double gapThresholdDays, int gapCount, double largestIntervalDays,
        double segmentGapDays, List<Segment> segments, boolean hasErrors, double medianErrorFlux, double minFlux,
        double medianFlux, double maxFlux, double scatterFlux, int outlierCount) {

    /** Intervals longer than this many median cadences are gaps. */
    public static final double GAP_CADENCE_MULTIPLE = 5.0;
    /** Points further than this many σ from the running median are outliers. */
    public static final double OUTLIER_SIGMAS = 5.0;

    /**
     * One segment.
     *
     * @param startDays first time, days
     * @param endDays last time, days
     * @param points number of points
     */
    public record Segment(double startDays, double endDays, int points) {
        /** Last minus first time, days. */
        public double spanDays() {
            return endDays - startDays;
        }
    }

    public LightCurveSummary {
        rejectedRows = Collections.unmodifiableMap(new LinkedHashMap<>(rejectedRows));
        segments = List.copyOf(segments);
    }

    /** Total number of rejected rows. */
    public int rejectedCount() {
        return rejectedRows.values().stream().mapToInt(Integer::intValue).sum();
    }

    /**
     * Summarises {@code lightCurve}.
     *
     * @param segmentGapDays the gap that splits segments, days; positive
     * @throws IllegalArgumentException when the light curve is empty or the gap is not positive
     */
    public static LightCurveSummary of(LightCurve lightCurve, double segmentGapDays) {
        int n = lightCurve.size();
        if (n == 0) {
            throw new IllegalArgumentException("cannot summarise an empty light curve");
        }
        double[] t = lightCurve.timesDays();
        double[] steps = new double[Math.max(n - 1, 0)];
        double largest = Double.NaN;
        for (int i = 1; i < n; i++) {
            steps[i - 1] = t[i] - t[i - 1];
            largest = i == 1 ? steps[0] : Math.max(largest, steps[i - 1]);
        }
        double cadence = RobustStatistics.medianBySelection(steps.clone(), steps.length);
        double gapThreshold = GAP_CADENCE_MULTIPLE * cadence;
        int gaps = 0;
        for (double s : steps) {
            if (s > gapThreshold) {
                gaps++;
            }
        }
        int[] starts = Segments.starts(lightCurve, segmentGapDays);
        List<Segment> segments = new ArrayList<>(starts.length);
        for (int k = 0; k < starts.length; k++) {
            int end = k + 1 < starts.length ? starts[k + 1] : n;
            segments.add(new Segment(t[starts[k]], t[end - 1], end - starts[k]));
        }
        double[] f = lightCurve.fluxes();
        double min = Double.POSITIVE_INFINITY;
        double max = Double.NEGATIVE_INFINITY;
        for (double v : f) {
            min = Math.min(min, v);
            max = Math.max(max, v);
        }
        double medianFlux = RobustStatistics.medianBySelection(f, n);
        double medianError = lightCurve.hasErrors()
                ? RobustStatistics.medianBySelection(lightCurve.fluxErrors(), n) : Double.NaN;
        RunningMedianResiduals residuals = new RunningMedianResiduals(lightCurve, segmentGapDays);
        return new LightCurveSummary(lightCurve.source(), lightCurve.band(), lightCurve.timeScale(),
                lightCurve.originalKind(), n, lightCurve.rejectedRows(), t[0], t[n - 1], t[n - 1] - t[0], cadence,
                gapThreshold, gaps, largest, segmentGapDays, segments, lightCurve.hasErrors(), medianError, min,
                medianFlux, max, residuals.sigma(), residuals.countBeyond(OUTLIER_SIGMAS));
    }
}
