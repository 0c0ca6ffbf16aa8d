package org.twinlight.timing.period;

import java.util.Arrays;
import org.twinlight.photometry.RobustStatistics;

/**
 * A light curve folded at one period, with simple box measurements of its dips: depth against the
 * out-of-eclipse level, equivalent duration and centre. Phases run from 0 at {@code referenceDays}.
 */
final class FoldedEclipses {
    /** Fine phase bins for the dip search. */
    private static final int SEARCH_BINS = 1000;

    private final double[] flux;
    private final double[] phase;
    /** Phases in increasing order, and the prefix sums of the fluxes in that order. */
    private final double[] sortedPhase;
    private final double[] prefixFlux;
    private final double periodDays;
    private final double scatter;

    /**
     * A measured dip: centre and full box width in phase, the box's depth and error (for detection),
     * the depth in the inner half of the box (the level at minimum) and its error, the equivalent
     * duration with its error, the points in the box and the out-of-eclipse level.
     */
    record Dip(double centre, double width, double depth, double depthError, double coreDepth,
            double coreDepthError, double duration, double durationError, int pointsIn, double level) {
        double signalToNoise() {
            return depthError > 0 ? depth / depthError : 0;
        }

        /** As an {@link EclipseEvent}: depth at minimum (inner half of the box), phase from the primary. */
        EclipseEvent toEvent(double primaryCentre) {
            double ph = centre - primaryCentre;
            ph -= Math.floor(ph);
            return new EclipseEvent(ph, coreDepth, coreDepthError, duration, durationError,
                    coreDepthError > 0 ? coreDepth / coreDepthError : 0);
        }
    }

    /**
     * @param timesDays times, days
     * @param flux relative flux (normalised near 1)
     * @param periodDays folding period
     * @param referenceDays time of phase 0
     */
    FoldedEclipses(double[] timesDays, double[] flux, double periodDays, double referenceDays) {
        int n = flux.length;
        this.flux = flux;
        this.periodDays = periodDays;
        this.phase = new double[n];
        for (int i = 0; i < n; i++) {
            phase[i] = wrap((timesDays[i] - referenceDays) / periodDays);
        }
        // Bucket sort by phase (n buckets, insertion sort inside each): O(n) for phases spread over [0, 1),
        // and no boxing; this runs once per trial period.
        int[] start = new int[n + 1];
        for (int i = 0; i < n; i++) {
            start[Math.min(n - 1, (int) (phase[i] * n)) + 1]++;
        }
        for (int b = 0; b < n; b++) {
            start[b + 1] += start[b];
        }
        int[] fill = java.util.Arrays.copyOf(start, n);
        sortedPhase = new double[n];
        double[] sortedFlux = new double[n];
        for (int i = 0; i < n; i++) {
            int k = fill[Math.min(n - 1, (int) (phase[i] * n))]++;
            sortedPhase[k] = phase[i];
            sortedFlux[k] = flux[i];
        }
        for (int b = 0; b < n; b++) {
            for (int k = start[b] + 1; k < start[b + 1]; k++) {
                double ph = sortedPhase[k];
                double fx = sortedFlux[k];
                int j = k - 1;
                while (j >= start[b] && sortedPhase[j] > ph) {
                    sortedPhase[j + 1] = sortedPhase[j];
                    sortedFlux[j + 1] = sortedFlux[j];
                    j--;
                }
                sortedPhase[j + 1] = ph;
                sortedFlux[j + 1] = fx;
            }
        }
        prefixFlux = new double[n + 1];
        for (int k = 0; k < n; k++) {
            prefixFlux[k + 1] = prefixFlux[k] + sortedFlux[k];
        }
        this.scatter = robustScatter(flux);
    }

    double periodDays() {
        return periodDays;
    }

    /** Point-to-point scatter: 1.4826 × median absolute deviation (a Gaussian σ; eclipses are few points). */
    double scatter() {
        return scatter;
    }

    static double robustScatter(double[] x) {
        return RobustStatistics.madSigma(x);
    }

    /** Median of values already sorted (they are not sorted again). */
    static double median(double[] sorted) {
        return RobustStatistics.medianInPlace(sorted, sorted.length);
    }

    /** Distance between two phases on the circle, in [0, 0.5]. */
    static double distance(double a, double b) {
        double d = Math.abs(a - b) % 1.0;
        return d > 0.5 ? 1 - d : d;
    }

    /** Number of points with phase in [a, b), 0 ≤ a ≤ b ≤ 1, and the sum of their fluxes in {@code sum[0]}. */
    private int range(double a, double b, double[] sum) {
        int i = lowerBound(a);
        int j = lowerBound(b);
        sum[0] += prefixFlux[j] - prefixFlux[i];
        return j - i;
    }

    private int lowerBound(double x) {
        int lo = 0;
        int hi = sortedPhase.length;
        while (lo < hi) {
            int mid = (lo + hi) >>> 1;
            if (sortedPhase[mid] < x) {
                lo = mid + 1;
            } else {
                hi = mid;
            }
        }
        return lo;
    }

    /**
     * Count and flux sum of the points inside the union of the circular intervals centre ± half-width,
     * given as {centre, halfWidth} pairs.
     */
    private int union(double[][] intervals, double[] sum) {
        java.util.List<double[]> segs = new java.util.ArrayList<>();
        for (double[] iv : intervals) {
            double h = Math.min(0.5, iv[1]);
            double a = wrap(iv[0] - h);
            double b = a + 2 * h;
            if (b <= 1) {
                segs.add(new double[] {a, b});
            } else {
                segs.add(new double[] {a, 1});
                segs.add(new double[] {0, b - 1});
            }
        }
        segs.sort((x, y) -> Double.compare(x[0], y[0]));
        int count = 0;
        double curA = -1;
        double curB = -1;
        for (double[] sg : segs) {
            if (sg[0] > curB) {
                if (curB > curA) {
                    count += range(curA, curB, sum);
                }
                curA = sg[0];
                curB = sg[1];
            } else {
                curB = Math.max(curB, sg[1]);
            }
        }
        if (curB > curA) {
            count += range(curA, Math.min(1, curB), sum);
        }
        return count;
    }

    /**
     * Measures a box dip at {@code centre} of full width {@code width} (phase). The out-of-eclipse
     * level is the mean of the points farther than one width from the centre and outside the
     * {@code others} dips (each excluded within one of its widths).
     */
    Dip measure(double centre, double width, Dip... others) {
        double[] s = new double[1];
        int nIn = union(new double[][] {{centre, 0.5 * width}}, s);
        double sumIn = s[0];
        s[0] = 0;
        int nWindow = union(new double[][] {{centre, width}}, s);
        double sumWindow = s[0];
        double[][] excluded = new double[others.length + 1][];
        excluded[0] = new double[] {centre, width};
        for (int k = 0; k < others.length; k++) {
            excluded[k + 1] = new double[] {others[k].centre, others[k].width};
        }
        s[0] = 0;
        int nExcluded = union(excluded, s);
        int nOut = flux.length - nExcluded;
        double sumOut = prefixFlux[flux.length] - s[0];
        if (nIn < BoxLeastSquares.MIN_POINTS_IN_BOX || nOut < 2) {
            double inf = Double.POSITIVE_INFINITY;
            return new Dip(centre, width, 0, inf, 0, inf, 0, inf, nIn, Double.NaN);
        }
        double out = sumOut / nOut;
        double depth = out - sumIn / nIn;
        double depthError = scatter * Math.sqrt(1.0 / nIn + 1.0 / nOut);
        // The level at minimum: the inner half of the box, flat for a box-like eclipse whose edges the
        // box brackets, so it hardly depends on the exact width and centre chosen.
        s[0] = 0;
        int nCore = union(new double[][] {{centre, 0.25 * width}}, s);
        double coreDepth = depth;
        double coreError = depthError;
        if (nCore >= BoxLeastSquares.MIN_POINTS_IN_BOX) {
            coreDepth = out - s[0] / nCore;
            coreError = scatter * Math.sqrt(1.0 / nCore + 1.0 / nOut);
        }
        // Equivalent duration: the area of the dip over the window ±width (twice the box, so the whole
        // eclipse) divided by the depth at minimum.
        double area = 2 * width * (out - sumWindow / nWindow);
        double areaError = 2 * width * scatter * Math.sqrt(1.0 / nWindow + 1.0 / nOut);
        double duration = coreDepth > 0 ? area / coreDepth : 0;
        double durationError = coreDepth > 0 && area > 0
                ? duration * Math.hypot(areaError / area, coreError / coreDepth) : Double.POSITIVE_INFINITY;
        return new Dip(centre, width, depth, depthError, coreDepth, coreError, duration, durationError, nIn, out);
    }

    /**
     * Improves the centre and width of a dip: the centre within ±half a width, the width within a
     * factor of two, each chosen for the largest depth signal-to-noise ratio.
     */
    Dip refine(Dip start, Dip... others) {
        Dip best = start;
        for (int pass = 0; pass < 2; pass++) {
            Dip c = best;
            for (int k = -20; k <= 20; k++) {
                Dip d = measure(wrap(c.centre + k * c.width / 40), c.width, others);
                if (d.signalToNoise() > best.signalToNoise()) {
                    best = d;
                }
            }
            c = best;
            for (int k = -10; k <= 10; k++) {
                double w = c.width * Math.pow(2, k / 10.0);
                if (w >= 0.45) {
                    continue;
                }
                Dip d = measure(c.centre, w, others);
                if (d.signalToNoise() > best.signalToNoise()) {
                    best = d;
                }
            }
        }
        return best;
    }

    /**
     * The dip of largest signal-to-noise ratio among boxes of the given widths (fractions of the
     * period) that do not overlap {@code avoid}; null when there is no room or no dip.
     */
    /**
     * Half-width in phase of the whole dip around {@code avoid}: from its centre outwards until two
     * bins in a row (with points) are back within 3σ of the level. The periodogram's box can be much
     * narrower than a wide eclipse (a close pair folded at half its period), and a second box in the
     * remaining wings would be the same eclipse.
     */
    private double extentHalfWidth(double[] sum, int[] count, Dip avoid, double level) {
        int bins = sum.length;
        int centreBin = Math.min(bins - 1, (int) (avoid.centre * bins));
        double widest = 0;
        for (int dir = -1; dir <= 1; dir += 2) {
            int quiet = 0;
            for (int k = 1; k < bins / 2; k++) {
                int b = Math.floorMod(centreBin + dir * k, bins);
                if (count[b] == 0) {
                    continue;
                }
                double sigma = scatter / Math.sqrt(count[b]);
                if (level - sum[b] / count[b] < 3 * sigma) {
                    if (++quiet == 2) {
                        widest = Math.max(widest, (k - 1.0) / bins);
                        break;
                    }
                } else {
                    quiet = 0;
                }
            }
        }
        return widest;
    }

    Dip search(double[] widths, Dip avoid) {
        int bins = SEARCH_BINS;
        double[] sum = new double[bins];
        int[] count = new int[bins];
        for (int i = 0; i < flux.length; i++) {
            int b = Math.min(bins - 1, (int) (phase[i] * bins));
            sum[b] += flux[i];
            count[b]++;
        }
        double restSum = 0;
        int restCount = 0;
        for (int b = 0; b < bins; b++) {
            if (distance((b + 0.5) / bins, avoid.centre) > avoid.width) {
                restSum += sum[b];
                restCount += count[b];
            }
        }
        double avoidHalfWidth = Math.max(avoid.width, extentHalfWidth(sum, count, avoid, restCount > 0
                ? restSum / restCount : avoid.level));
        double[] cumSum = new double[2 * bins + 1];
        int[] cumCount = new int[2 * bins + 1];
        for (int j = 0; j < 2 * bins; j++) {
            cumSum[j + 1] = cumSum[j] + sum[j % bins];
            cumCount[j + 1] = cumCount[j] + count[j % bins];
        }
        double bestSnr = 0;
        double bestCentre = Double.NaN;
        double bestWidth = Double.NaN;
        for (double w : widths) {
            int m = Math.max(1, (int) Math.round(w * bins));
            for (int j = 0; j < bins; j++) {
                double centre = (j + 0.5 * m) / bins % 1.0;
                // The windows ±width of the two dips must not overlap: a box just beside the primary would
                // measure the primary's own wings.
                if (distance(centre, avoid.centre) < avoidHalfWidth + (double) m / bins) {
                    continue;
                }
                int nIn = cumCount[j + m] - cumCount[j];
                int nOut = restCount - nIn;
                if (nIn < BoxLeastSquares.MIN_POINTS_IN_BOX || nOut < 2) {
                    continue;
                }
                double depth = (restSum - (cumSum[j + m] - cumSum[j])) / nOut - (cumSum[j + m] - cumSum[j]) / nIn;
                double snr = depth / (scatter * Math.sqrt(1.0 / nIn + 1.0 / nOut));
                if (snr > bestSnr) {
                    bestSnr = snr;
                    bestCentre = centre;
                    bestWidth = (double) m / bins;
                }
            }
        }
        if (Double.isNaN(bestCentre)) {
            return null;
        }
        return refine(measure(bestCentre, bestWidth, avoid), avoid);
    }

    static double wrap(double p) {
        return p - Math.floor(p);
    }
}
