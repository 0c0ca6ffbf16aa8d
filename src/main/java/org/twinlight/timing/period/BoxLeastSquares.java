package org.twinlight.timing.period;

import java.util.stream.IntStream;

/**
 * Box Least Squares periodogram of Kovács, Zucker &amp; Mazeh (2002, A&amp;A 391, 369), searching for
 * dips (eclipses), in its binned form: at each trial frequency the points are folded into phase bins
 * (O(N)), and every trial box (start bin × trial duration) is evaluated from cumulative sums of the
 * binned weights and weighted values (O(bins × durations)).
 *
 * <p>With weights w<sub>i</sub> = σ<sub>i</sub><sup>−2</sup>/Σσ<sub>j</sub><sup>−2</sup> (equal when
 * the data carry no errors) and values centred so that Σw<sub>i</sub>x<sub>i</sub> = 0, a box holding
 * the points with weight sum r and weighted sum s has SR = [s²/(r(1−r))]<sup>1/2</sup>; its levels are
 * L = s/r inside and H = −s/(1−r) outside, depth H − L (KZM 2002, Eqs. 4–6). Only boxes with s &lt; 0
 * (fainter inside) count. The power at a frequency is the largest SR over its boxes.
 */
final class BoxLeastSquares {
    /** Phase bins per shortest usable trial duration (quantisation of the box edges). */
    static final int BINS_PER_DURATION = 5;
    /** Fewest (effective) points a box must hold. */
    static final double MIN_POINTS_IN_BOX = 3;
    /** Coarse frequencies per parallel work unit. */
    private static final int COARSE_CHUNK = 64;

    private final double[] timesDays;
    private final double[] weights;
    private final double[] weightedValues;
    private final double[] durations;
    private final int n;
    private final double referenceTimeDays;

    /** The best box at one frequency. */
    record Box(double frequency, double signalResidue, double durationFraction, double centrePhase, double depth,
            double inFraction) {
    }

    /**
     * @param timesDays times, days (any zero point)
     * @param flux relative flux
     * @param errors 1σ errors or null for equal weights
     * @param durations trial durations, fractions of the period, increasing
     */
    BoxLeastSquares(double[] timesDays, double[] flux, double[] errors, double[] durations) {
        this.n = timesDays.length;
        this.durations = durations.clone();
        this.timesDays = new double[n];
        this.weights = new double[n];
        this.weightedValues = new double[n];
        double t0 = timesDays[0];
        this.referenceTimeDays = t0;
        double sumW = 0;
        for (int i = 0; i < n; i++) {
            // Times from the first point: the folding product t·f stays positive and small.
            this.timesDays[i] = timesDays[i] - t0;
            weights[i] = errors == null ? 1.0 : 1.0 / (errors[i] * errors[i]);
            sumW += weights[i];
        }
        double mean = 0;
        for (int i = 0; i < n; i++) {
            weights[i] /= sumW;
            mean += weights[i] * flux[i];
        }
        for (int i = 0; i < n; i++) {
            weightedValues[i] = weights[i] * (flux[i] - mean);
        }
    }

    /** The time of phase 0 of the boxes, days: the first point. */
    double referenceTimeDays() {
        return referenceTimeDays;
    }

    /**
     * Power (largest SR) at every frequency of the grid.
     *
     * <p>Folding all N points at every trial frequency costs N per frequency. Here the baseline is cut
     * into S segments of length T/S; each segment is folded on a grid S times coarser (whose step keeps
     * the phase drift within one segment inside the same bound as the fine grid over the whole
     * baseline), and the binned fold at a fine frequency f is the sum of the segments' binned folds at
     * the nearest coarse frequency f<sub>c</sub>, each rotated by the phase f·τ<sub>s</sub> of its
     * start τ<sub>s</sub> plus the mean drift (f − f<sub>c</sub>)·(t̄<sub>s</sub> − τ<sub>s</sub>) of
     * its points. The cost per fine frequency falls from N to N/S + S·bins; the extra smearing is
     * below half a phase bin (a tenth of the shortest duration) from the rotation plus the residual
     * drift inside a segment, a quarter of the grid bound.
     */
    double[] power(FrequencyGrid grid, double baselineDays, boolean parallel) {
        int nf = grid.size();
        double[] power = new double[nf];
        int maxBins = maxBins(grid.effectiveShortestDuration(grid.frequency(0)));
        int segments = (int) Math.max(1, Math.min(64, Math.round(Math.sqrt(2.0 * n / maxBins))));
        Segments seg = new Segments(segments, baselineDays);
        FrequencyGrid coarse = grid.coarser(segments);
        // For each fine frequency, the nearest coarse one; fine frequencies sharing it are contiguous.
        int[] nearest = new int[nf];
        int c = 0;
        for (int k = 0; k < nf; k++) {
            double f = grid.frequency(k);
            while (c + 1 < coarse.size() && Math.abs(coarse.frequency(c + 1) - f) < Math.abs(coarse.frequency(c) - f)) {
                c++;
            }
            nearest[k] = c;
        }
        int[] firstFine = new int[coarse.size() + 1];
        java.util.Arrays.fill(firstFine, nf);
        for (int k = nf - 1; k >= 0; k--) {
            firstFine[nearest[k]] = k;
        }
        for (int j = coarse.size() - 1; j >= 0; j--) {
            firstFine[j] = Math.min(firstFine[j], firstFine[j + 1]);
        }
        int chunks = (coarse.size() + COARSE_CHUNK - 1) / COARSE_CHUNK;
        IntStream range = IntStream.range(0, chunks);
        (parallel ? range.parallel() : range).forEach(ch -> {
            Workspace ws = new Workspace(maxBins);
            double[][] segW = new double[segments][maxBins];
            double[][] segS = new double[segments][maxBins];
            int end = Math.min(coarse.size(), (ch + 1) * COARSE_CHUNK);
            for (int j = ch * COARSE_CHUNK; j < end; j++) {
                if (firstFine[j] == firstFine[j + 1]) {
                    continue;
                }
                double fc = coarse.frequency(j);
                int bins = binsFor(coarse.effectiveShortestDuration(fc));
                seg.fold(fc, bins, segW, segS);
                for (int k = firstFine[j]; k < firstFine[j + 1]; k++) {
                    seg.combine(grid.frequency(k), fc, bins, segW, segS, ws);
                    power[k] = scanBins(bins, ws, null);
                }
            }
        });
        return power;
    }

    /** The data cut into segments of equal time span. */
    private final class Segments {
        final int count;
        final int[] from;
        final double[] start;
        final double[] meanOffset;

        Segments(int count, double baselineDays) {
            this.count = count;
            from = new int[count + 1];
            start = new double[count];
            meanOffset = new double[count];
            double span = baselineDays / count;
            int i = 0;
            for (int s = 0; s < count; s++) {
                from[s] = i;
                start[s] = timesDays[i < n ? i : n - 1];
                double limit = s == count - 1 ? Double.POSITIVE_INFINITY : (s + 1) * span;
                double sum = 0;
                int m = 0;
                while (i < n && timesDays[i] < limit) {
                    sum += timesDays[i];
                    m++;
                    i++;
                }
                meanOffset[s] = m == 0 ? 0 : sum / m - start[s];
            }
            from[count] = n;
        }

        /** Folds each segment at fc, phase 0 at the segment's start. */
        void fold(double fc, int bins, double[][] segW, double[][] segS) {
            double[] t = timesDays;
            double[] w = weights;
            double[] wx = weightedValues;
            for (int s = 0; s < count; s++) {
                double[] bw = segW[s];
                double[] bs = segS[s];
                java.util.Arrays.fill(bw, 0, bins, 0.0);
                java.util.Arrays.fill(bs, 0, bins, 0.0);
                double t0 = start[s];
                for (int i = from[s]; i < from[s + 1]; i++) {
                    // t − t0 ≥ 0 inside the segment, so the cast to long is the floor.
                    double p = (t[i] - t0) * fc;
                    int b = (int) ((p - (long) p) * bins);
                    bw[b] += w[i];
                    bs[b] += wx[i];
                }
            }
        }

        /** The binned fold at f: every segment's fold at fc, rotated by its phase at f. */
        void combine(double f, double fc, int bins, double[][] segW, double[][] segS, Workspace ws) {
            double[] binW = ws.binW;
            double[] binS = ws.binS;
            java.util.Arrays.fill(binW, 0, bins, 0.0);
            java.util.Arrays.fill(binS, 0, bins, 0.0);
            for (int s = 0; s < count; s++) {
                if (from[s] == from[s + 1]) {
                    continue;
                }
                double phase = f * start[s] + (f - fc) * meanOffset[s];
                phase -= Math.floor(phase);
                int shift = (int) Math.round(phase * bins) % bins;
                double[] bw = segW[s];
                double[] bs = segS[s];
                int split = bins - shift;
                for (int b = 0; b < split; b++) {
                    binW[b + shift] += bw[b];
                    binS[b + shift] += bs[b];
                }
                for (int b = split; b < bins; b++) {
                    binW[b - split] += bw[b];
                    binS[b - split] += bs[b];
                }
            }
        }
    }

    /** Phase bins used at a frequency whose shortest usable duration is q. */
    private static int binsFor(double shortestDuration) {
        return (int) Math.ceil(BINS_PER_DURATION / shortestDuration);
    }

    /** The best box at frequency f, with durations down to {@code shortestDuration}. */
    Box bestBox(double f, double shortestDuration) {
        Workspace ws = new Workspace(maxBins(shortestDuration));
        double[] detail = new double[3];
        double sr = scan(f, shortestDuration, ws, detail);
        return new Box(f, sr, detail[0], detail[1], detail[2], ws.bestIn);
    }

    private int maxBins(double shortestDuration) {
        return binsFor(Math.min(shortestDuration, durations[0]));
    }

    /** Reusable bin arrays of one worker. */
    private final class Workspace {
        final double[] binW;
        final double[] binS;
        final double[] cumW;
        final double[] cumS;
        double bestIn;

        Workspace(int bins) {
            binW = new double[bins];
            binS = new double[bins];
            cumW = new double[2 * bins + 1];
            cumS = new double[2 * bins + 1];
        }
    }

    /**
     * Folds at f and scans the boxes. When {@code detail} is not null it receives the duration
     * (fraction), centre phase (phase 0 at the first point) and depth of the best box.
     */
    private double scan(double f, double shortestDuration, Workspace ws, double[] detail) {
        int bins = binsFor(shortestDuration);
        double[] binW = ws.binW;
        double[] binS = ws.binS;
        java.util.Arrays.fill(binW, 0, bins, 0.0);
        java.util.Arrays.fill(binS, 0, bins, 0.0);
        for (int i = 0; i < n; i++) {
            double p = timesDays[i] * f;
            int b = (int) ((p - (long) p) * bins);
            binW[b] += weights[i];
            binS[b] += weightedValues[i];
        }
        return scanBins(bins, ws, detail);
    }

    /** Scans every box (start bin × trial duration) of the folded bins in {@code ws}. */
    private double scanBins(int bins, Workspace ws, double[] detail) {
        double shortestDuration = (double) BINS_PER_DURATION / bins;
        double[] binW = ws.binW;
        double[] binS = ws.binS;
        int maxWidth = Math.min(bins, (int) Math.round(durations[durations.length - 1] * bins));
        double[] cumW = ws.cumW;
        double[] cumS = ws.cumS;
        cumW[0] = 0;
        cumS[0] = 0;
        for (int j = 0; j < bins + maxWidth; j++) {
            int b = j < bins ? j : j - bins;
            cumW[j + 1] = cumW[j] + binW[b];
            cumS[j + 1] = cumS[j] + binS[b];
        }
        double minR = MIN_POINTS_IN_BOX / n;
        double best = 0;
        int lastWidth = -1;
        for (int d = 0; d < durations.length; d++) {
            // Durations shorter than the data can show are replaced by the shortest usable one.
            double q = Math.max(durations[d], shortestDuration);
            int width = Math.max(1, (int) Math.round(q * bins));
            if (width == lastWidth) {
                continue;
            }
            lastWidth = width;
            for (int j = 0; j < bins; j++) {
                double s = cumS[j + width] - cumS[j];
                if (s >= 0) {
                    continue;
                }
                double r = cumW[j + width] - cumW[j];
                if (r < minR || r >= 1) {
                    continue;
                }
                // s²/(r(1−r)) > best without a division in the loop.
                double den = r * (1 - r);
                if (s * s > best * den) {
                    best = s * s / den;
                    if (detail != null) {
                        detail[0] = (double) width / bins;
                        detail[1] = (j + 0.5 * width) / bins % 1.0;
                        detail[2] = -s / (r * (1 - r));
                        ws.bestIn = r;
                    }
                }
            }
        }
        return Math.sqrt(best);
    }
}
