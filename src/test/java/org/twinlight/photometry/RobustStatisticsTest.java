package org.twinlight.photometry;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.Arrays;
import java.util.Random;
import org.junit.jupiter.api.Test;

class RobustStatisticsTest {

    /** Independent: the median read off a fully sorted copy. */
    private static double sortedMedian(double[] v) {
        double[] s = v.clone();
        Arrays.sort(s);
        int n = s.length;
        return n % 2 == 1 ? s[n / 2] : 0.5 * (s[n / 2 - 1] + s[n / 2]);
    }

    @Test
    void selectionGivesTheMedianOfASortedCopy() {
        Random r = new Random(3);
        for (int trial = 0; trial < 400; trial++) {
            int n = 1 + r.nextInt(300);
            double[] v = new double[n];
            int kind = trial % 4;
            for (int i = 0; i < n; i++) {
                v[i] = switch (kind) {
                    case 0 -> r.nextGaussian();
                    case 1 -> i; // sorted
                    case 2 -> n - i; // reversed
                    default -> r.nextInt(3); // many ties
                };
            }
            double expected = sortedMedian(v);
            assertThat(RobustStatistics.medianBySelection(v.clone(), n)).as("trial %d", trial).isEqualTo(expected);
        }
        assertThat(RobustStatistics.medianBySelection(new double[0], 0)).isNaN();
    }
}
