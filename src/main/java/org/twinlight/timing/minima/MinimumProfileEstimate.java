package org.twinlight.timing.minima;

import org.twinlight.timing.Ephemeris;

import java.util.Arrays;
import org.twinlight.photometry.RobustStatistics;

/**
 * Where and how wide an eclipse is in the light curve folded on a trial ephemeris: the folded
 * points near the expected phase are binned (bin medians), the deepest bin is found and the
 * eclipse edges are where the bins come back to within max(5 % of the depth, 3σ of a bin) of the
 * out-of-eclipse level (the median of all points). Common practice, no source.
 *
 * @param centreShiftDays where the folded eclipse centre lies relative to the expected time, days
 * @param binWidthDays width of the phase bins the centre was found with, days: its resolution
 * @param durationDays width between the two edges, days
 * @param depth fractional depth of the deepest bin below the out-of-eclipse level
 */
record MinimumProfileEstimate(double centreShiftDays, double durationDays, double depth, double binWidthDays) {

    /**
     * @param t times, days
     * @param f flux
     * @param eph the ephemeris
     * @param phase expected phase of the eclipse (0 primary, the secondary phase otherwise)
     * @param maxHalfPhase look within phase ± this
     * @return the estimate, or null when no significant dip is seen there
     */
    static MinimumProfileEstimate estimate(double[] t, double[] f, Ephemeris eph, double phase, double maxHalfPhase) {
        int n = t.length;
        if (n < 20) {
            return null;
        }
        double baseline = median(f.clone());
        double sigma = pointScatter(f);
        int sel = 0;
        double[] ph = new double[n];
        for (int i = 0; i < n; i++) {
            double c = eph.cyclesSinceEpoch(t[i]) - phase;
            ph[i] = c - Math.floor(c + 0.5);
            if (Math.abs(ph[i]) < maxHalfPhase) {
                sel++;
            }
        }
        int bins = Math.max(20, Math.min(400, sel / 10));
        double width = 2 * maxHalfPhase / bins;
        double[][] members = new double[bins][];
        int[] count = new int[bins];
        for (int i = 0; i < n; i++) {
            if (Math.abs(ph[i]) < maxHalfPhase) {
                count[Math.min(bins - 1, (int) ((ph[i] + maxHalfPhase) / width))]++;
            }
        }
        for (int b = 0; b < bins; b++) {
            members[b] = new double[count[b]];
            count[b] = 0;
        }
        for (int i = 0; i < n; i++) {
            if (Math.abs(ph[i]) < maxHalfPhase) {
                int b = Math.min(bins - 1, (int) ((ph[i] + maxHalfPhase) / width));
                members[b][count[b]++] = f[i];
            }
        }
        double[] level = new double[bins];
        int deepest = -1;
        for (int b = 0; b < bins; b++) {
            level[b] = count[b] == 0 ? Double.NaN : median(members[b]);
            if (count[b] > 0 && (deepest < 0 || level[b] < level[deepest])) {
                deepest = b;
            }
        }
        if (deepest < 0) {
            return null;
        }
        double depth = baseline - level[deepest];
        double binSigma = sigma / Math.sqrt(Math.max(1, count[deepest]));
        if (!(depth > 5 * binSigma) || !(baseline > 0)) {
            return null;
        }
        double typical = Math.max(1, sel / (double) bins);
        double threshold = baseline - Math.max(0.05 * depth, 3 * sigma / Math.sqrt(typical));
        int left = deepest;
        while (left > 0 && !(level[left - 1] >= threshold)) {
            left--;
        }
        int right = deepest;
        while (right < bins - 1 && !(level[right + 1] >= threshold)) {
            right++;
        }
        // Edges at the outer borders of the last in-eclipse bins.
        double leftPhase = -maxHalfPhase + left * width;
        double rightPhase = -maxHalfPhase + (right + 1) * width;
        double p = eph.periodDays();
        return new MinimumProfileEstimate((leftPhase + rightPhase) / 2 * p, (rightPhase - leftPhase) * p, depth / baseline,
                width * p);
    }

    /** Robust point-to-point scatter of a series: 1.4826·MAD of successive differences / √2. */
    static double pointScatter(double[] f) {
        return RobustStatistics.pointToPointSigma(f);
    }

    /** Median; sorts its argument. */
    /** Median of the values, which are sorted in place. */
    static double median(double[] v) {
        return RobustStatistics.medianInPlace(v, v.length);
    }
}
