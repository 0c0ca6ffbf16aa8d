package org.twinlight.photometry;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.Random;
import org.junit.jupiter.api.Test;

/** β of white and of first-order autoregressive noise against the variance of a mean worked out here. */
class TimeAveragingBetaTest {

    private static double[] times(int n, double stepDays) {
        double[] t = new double[n];
        for (int i = 0; i < n; i++) {
            t[i] = i * stepDays;
        }
        return t;
    }

    /** White noise: β_w = 1 within its sampling spread (~1/√(2·N_w) with N_w = 500 bins: 0.03). */
    @Test
    void whiteNoiseGivesOne() {
        Random random = new Random(5);
        double[] z = new double[20000];
        for (int i = 0; i < z.length; i++) {
            z[i] = random.nextGaussian();
        }
        assertThat(TimeAveragingBeta.atWidth(times(z.length, 1.0), z, 40.0)).isBetween(0.9, 1.1);
    }

    /**
     * AR(1) noise z_i = ρ z_{i−1} + √(1−ρ²) ε_i: the mean of M consecutive points has variance
     * (σ²/M)·[1 + 2 Σ_{k=1}^{M−1} (1 − k/M) ρ^k] (variance of a sum of a stationary series, e.g.
     * Priestley 1981, Spectral Analysis and Time Series, eq. 5.3.6, from memory), so β² is the
     * bracket. With ρ = 0.9, M = 40 the bracket is 16.4 (β = 4.05), computed below independently.
     */
    @Test
    void autoregressiveNoiseGivesTheVarianceOfItsMean() {
        double rho = 0.9;
        int m = 40;
        double bracket = 1;
        for (int k = 1; k < m; k++) {
            bracket += 2 * (1 - k / (double) m) * Math.pow(rho, k);
        }
        Random random = new Random(11);
        double[] z = new double[200000];
        z[0] = random.nextGaussian();
        for (int i = 1; i < z.length; i++) {
            z[i] = rho * z[i - 1] + Math.sqrt(1 - rho * rho) * random.nextGaussian();
        }
        // 5000 bins: β² known to about √(2/5000) = 2 %, so β within ±3 % (a 3σ band)
        assertThat(TimeAveragingBeta.atWidth(times(z.length, 1.0), z, m)).isCloseTo(Math.sqrt(bracket),
                org.assertj.core.data.Percentage.withPercentage(3));
    }

    /**
     * White noise in 200 nights of 40 points, each night's mean taken out (a fitted offset per
     * night), bins of 20 points (two per night): the bin means of a night cancel in pairs, so
     * Σ M·m² has 400 − 200 degrees of freedom, and β = 1 only when the 200 removed means are
     * counted; dividing by N − 1 = 399 gives β ≈ √(200/399) = 0.71 (expectation of a sum of
     * squares of residuals after fitting means; e.g. any regression text, n − p degrees of freedom).
     */
    @Test
    void meansRemovedPerNightAreCounted() {
        Random random = new Random(3);
        int nights = 200;
        int per = 40;
        double[] t = new double[nights * per];
        double[] z = new double[t.length];
        for (int n = 0; n < nights; n++) {
            double mean = 0;
            for (int i = 0; i < per; i++) {
                t[n * per + i] = n + i * 0.01;
                z[n * per + i] = random.nextGaussian();
                mean += z[n * per + i] / per;
            }
            for (int i = 0; i < per; i++) {
                z[n * per + i] -= mean;
            }
        }
        // 200 degrees of freedom: β² to ±10 % (1σ), β within ±12 % is about 2.4σ
        assertThat(TimeAveragingBeta.atWidth(t, z, 0.2 - 1e-9, nights)).isBetween(0.88, 1.12);
        assertThat(TimeAveragingBeta.atWidth(t, z, 0.2 - 1e-9)).isBetween(0.6, 0.82);
    }

    @Test
    void tooFewBinsGiveNaN() {
        double[] z = {1, -1, 1, -1, 1, -1, 1, -1};
        assertThat(TimeAveragingBeta.atWidth(times(8, 1.0), z, 2.0)).isNaN();
        assertThat(TimeAveragingBeta.atWidth(times(8, 1.0), new double[8], 1.0)).isNaN();
    }
}
