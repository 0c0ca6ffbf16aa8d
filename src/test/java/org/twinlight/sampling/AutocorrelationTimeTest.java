package org.twinlight.sampling;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.data.Offset.offset;

import java.util.Random;
import org.junit.jupiter.api.Test;

class AutocorrelationTimeTest {

    /** x_t = φ x_{t−1} + ε_t, started from its stationary distribution. */
    private static double[] ar1(double phi, int n, Random rng) {
        double[] x = new double[n];
        x[0] = rng.nextGaussian() / Math.sqrt(1 - phi * phi);
        for (int t = 1; t < n; t++) {
            x[t] = phi * x[t - 1] + rng.nextGaussian();
        }
        return x;
    }

    @Test
    void ar1IntegratedTimeMatchesTheClosedForm() {
        // AR(1): ρ(t) = φ^|t|, so τ = 1 + 2 Σ φ^t = (1 + φ)/(1 − φ) (Sokal 1997, Sect. 3, exponential autocorrelation)
        for (double phi : new double[] {0.5, 0.9, 0.97}) {
            double expected = (1 + phi) / (1 - phi);
            for (long seed = 1; seed <= 3; seed++) {
                Random rng = new Random(seed);
                double[][] series = new double[16][];
                for (int w = 0; w < series.length; w++) {
                    series[w] = ar1(phi, 20_000, rng);
                }
                double tau = AutocorrelationTime.of(series);
                // Sokal's (1997) variance of the windowed estimate: var(τ)/τ² ≈ 2(2M + 1)/N, M ≈ 5τ; N = 320,000
                double rel = Math.sqrt(2 * (10 * expected + 1) / 320_000.0);
                assertThat(tau).as("phi %s seed %d", phi, seed).isCloseTo(expected, offset(4 * rel * expected + 0.05));
            }
        }
    }

    @Test
    void whiteNoiseHasTauOne() {
        Random rng = new Random(4);
        double[] x = new double[50_000];
        for (int i = 0; i < x.length; i++) {
            x[i] = rng.nextGaussian();
        }
        assertThat(AutocorrelationTime.of(x)).isCloseTo(1.0, offset(0.05));
    }

    @Test
    void fourierAutocovarianceEqualsTheDirectSum() {
        Random rng = new Random(2);
        double[] x = ar1(0.8, 777, rng);
        double mean = java.util.Arrays.stream(x).average().orElseThrow();
        double[] y = ar1(0.3, 777, rng);
        double meanY = java.util.Arrays.stream(y).average().orElseThrow();
        double[] c = AutocorrelationTime.autocovariance(x);
        double[][] pair = AutocorrelationTime.autocovariances(x, y);
        for (int t : new int[] {0, 1, 5, 100, 776}) {
            double direct = 0;
            double directY = 0;
            for (int i = 0; i + t < x.length; i++) {
                direct += (x[i] - mean) * (x[i + t] - mean);
                directY += (y[i] - meanY) * (y[i + t] - meanY);
            }
            direct /= x.length;
            directY /= y.length;
            assertThat(c[t]).isCloseTo(direct, offset(1e-10 * Math.abs(c[0])));
            assertThat(pair[0][t]).isCloseTo(direct, offset(1e-10 * Math.abs(c[0])));
            assertThat(pair[1][t]).isCloseTo(directY, offset(1e-10 * Math.abs(pair[1][0])));
        }
    }

    @Test
    void aConstantSeriesHasNoDefinedTime() {
        assertThat(AutocorrelationTime.of(new double[] {2, 2, 2, 2})).isNaN();
    }
}
