package org.twinlight.timing.period;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.stream.IntStream;

/**
 * Distinct peaks of a periodogram: local maxima, strongest first, none within a given frequency
 * distance of a stronger one.
 */
final class PeakFinder {
    private PeakFinder() {
    }

    /**
     * @param grid trial frequencies
     * @param power power at each frequency
     * @param separation smallest frequency distance between two listed peaks, cycles per day
     * @param max most peaks to return
     * @return indices of the peaks, strongest first
     */
    static List<Integer> distinctPeaks(FrequencyGrid grid, double[] power, double separation, int max) {
        int n = power.length;
        List<Integer> maxima = new ArrayList<>();
        for (int k = 0; k < n; k++) {
            boolean left = k == 0 || power[k] >= power[k - 1];
            boolean right = k == n - 1 || power[k] > power[k + 1];
            if (left && right && power[k] > 0) {
                maxima.add(k);
            }
        }
        maxima.sort(Comparator.comparingDouble((Integer k) -> power[k]).reversed());
        List<Integer> out = new ArrayList<>();
        for (int k : maxima) {
            double f = grid.frequency(k);
            boolean near = IntStream.range(0, out.size())
                    .anyMatch(j -> Math.abs(grid.frequency(out.get(j)) - f) < separation);
            if (!near) {
                out.add(k);
                if (out.size() == max) {
                    break;
                }
            }
        }
        return out;
    }
}
