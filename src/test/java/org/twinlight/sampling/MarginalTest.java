package org.twinlight.sampling;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.data.Offset.offset;

import java.util.Random;
import org.junit.jupiter.api.Test;

class MarginalTest {

    @Test
    void aHalfNormalAtALowerBoundGivesAnUpperLimit() {
        Random rng = new Random(1);
        double[] s = new double[200_000];
        for (int i = 0; i < s.length; i++) {
            s[i] = Math.abs(rng.nextGaussian()) * 0.01;
        }
        Marginal m = Marginal.of(s, 1, 0, Double.NaN);
        assertThat(m.limit()).isNotNull();
        assertThat(m.limit().side()).isEqualTo("upper");
        // half-normal quantiles: P(|Z| < z) = 2Φ(z) − 1, so the 95 % point is z = 1.959964 and the 68.27 % point 1 (normal tables)
        assertThat(m.limit().value95()).isCloseTo(0.01959964, offset(2e-4));
        assertThat(m.limit().value68()).isCloseTo(0.01, offset(2e-4));
    }

    @Test
    void aFlatPosteriorUpToNinetyDegreesGivesALowerLimit() {
        Random rng = new Random(2);
        double[] s = new double[100_000];
        for (int i = 0; i < s.length; i++) {
            s[i] = 88 + 2 * rng.nextDouble();
        }
        Marginal m = Marginal.of(s, 1, Double.NaN, 90);
        assertThat(m.limit().side()).isEqualTo("lower");
        // uniform on [88, 90]: the 5 % quantile is 88.1
        assertThat(m.limit().value95()).isCloseTo(88.1, offset(0.01));
    }

    @Test
    void aPeakAwayFromTheBoundIsTwoSided() {
        Random rng = new Random(3);
        double[] s = new double[100_000];
        for (int i = 0; i < s.length; i++) {
            s[i] = 0.05 + 0.01 * rng.nextGaussian();
        }
        Marginal m = Marginal.of(s, 1, 0, Double.NaN);
        assertThat(m.limit()).isNull();
        assertThat(m.median()).isCloseTo(0.05, offset(2e-4));
        assertThat(m.upper95()).isCloseTo(0.05 + 0.0195996, offset(3e-4));
    }

    @Test
    void quantilesInterpolateBetweenOrderStatistics() {
        // Hyndman & Fan (1996) type 7: h = (n − 1) p
        double[] sorted = {1, 2, 3, 4};
        assertThat(Marginal.quantile(sorted, 0.5)).isEqualTo(2.5);
        assertThat(Marginal.quantile(sorted, 0.25)).isEqualTo(1.75);
        assertThat(Marginal.quantile(sorted, 1.0)).isEqualTo(4);
    }
}
