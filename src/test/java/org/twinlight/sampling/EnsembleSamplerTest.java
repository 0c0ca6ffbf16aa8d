package org.twinlight.sampling;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.Random;
import org.junit.jupiter.api.Test;

/**
 * The ensemble sampler against densities whose marginals and moments are known in closed form,
 * over several seeds, and its determinism whatever the number of threads.
 */
class EnsembleSamplerTest {
    private static final int WALKERS = 32;

    /** Bivariate normal, σx = 1, σy = 2, correlation 0.95: marginals N(0, σ²) (any statistics text). */
    private static final double SX = 1;
    private static final double SY = 2;
    private static final double RHO = 0.95;

    private static double gaussian2d(double[] p) {
        double u = p[0] / SX;
        double v = p[1] / SY;
        return -0.5 * (u * u - 2 * RHO * u * v + v * v) / (1 - RHO * RHO);
    }

    /**
     * A banana (Rosenbrock-like) density: x ~ N(0, 1), y | x ~ N(x², 0.5²). Its moments follow
     * from those of the normal distribution: E[y] = E[x²] = 1, Var[y] = 0.25 + Var[x²] = 0.25 + 2
     * = 2.25, E[xy] = E[x³] = 0 (independent computation, no source needed beyond the normal moments).
     */
    private static double banana(double[] p) {
        double r = (p[1] - p[0] * p[0]) / 0.5;
        return -0.5 * (p[0] * p[0] + r * r);
    }

    private static double[][] ball(int walkers, int dim, long seed, double size) {
        Random rng = new Random(seed);
        double[][] s = new double[walkers][dim];
        for (double[] w : s) {
            for (int k = 0; k < dim; k++) {
                w[k] = size * rng.nextGaussian();
            }
        }
        return s;
    }

    private static EnsembleSampler.Result run(LogDensity d, long seed, int threads, int maxSteps) {
        return EnsembleSampler.sample(() -> d, ball(WALKERS, 2, seed + 1000, 0.1),
                SamplerSettings.of(WALKERS, maxSteps, seed, threads), SamplingProgress.NONE, () -> false);
    }

    private static double[] retained(EnsembleSampler.Result r, int k) {
        Chain c = r.chain();
        int from = r.convergence().burnIn();
        double[][] s = c.series(k, from);
        double[] out = new double[s.length * s[0].length];
        int i = 0;
        for (double[] w : s) {
            for (double v : w) {
                out[i++] = v;
            }
        }
        return out;
    }

    @Test
    void correlatedGaussianMarginalsMatchTheirQuantilesOverSeeds() {
        for (long seed = 1; seed <= 4; seed++) {
            EnsembleSampler.Result r = run(EnsembleSamplerTest::gaussian2d, seed, 1, 20_000);
            assertThat(r.convergence().converged()).as(r.convergence().reason()).isTrue();
            assertThat(r.convergence().acceptanceFraction()).isBetween(0.3, 0.9);
            double tau = r.convergence().maxAutocorrelationTime();
            for (int k = 0; k < 2; k++) {
                double sigma = k == 0 ? SX : SY;
                double[] x = retained(r, k);
                Marginal m = Marginal.of(x, tau, Double.NaN, Double.NaN);
                // effective sample size n/τ; a quantile's standard error is about 1.25–2.5 σ/√neff
                double err = 2.5 * sigma / Math.sqrt(x.length / tau);
                assertThat(m.median()).isCloseTo(0, org.assertj.core.data.Offset.offset(4 * err));
                // 68.27 % central interval of N(0, σ²) is ±σ, the 95 % one ±1.95996 σ (normal tables)
                assertThat(m.lower68()).isCloseTo(-sigma, org.assertj.core.data.Offset.offset(4 * err));
                assertThat(m.upper68()).isCloseTo(sigma, org.assertj.core.data.Offset.offset(4 * err));
                assertThat(m.lower95()).isCloseTo(-1.959964 * sigma, org.assertj.core.data.Offset.offset(6 * err));
                assertThat(m.upper95()).isCloseTo(1.959964 * sigma, org.assertj.core.data.Offset.offset(6 * err));
                assertThat(m.limit()).isNull();
            }
            double[] x = retained(r, 0);
            double[] y = retained(r, 1);
            double sxy = 0;
            for (int i = 0; i < x.length; i++) {
                sxy += x[i] * y[i];
            }
            // the sample correlation's variance is about (1 + ρ²)/neff for these zero-mean normals
            double neff = x.length / tau;
            assertThat(sxy / x.length / (SX * SY)).isCloseTo(RHO,
                    org.assertj.core.data.Offset.offset(4 * Math.sqrt((1 + RHO * RHO) / neff)));
        }
    }

    @Test
    void bananaMomentsMatchTheNormalMoments() {
        double[] meanY = new double[3];
        for (long seed = 1; seed <= 3; seed++) {
            EnsembleSampler.Result r = run(EnsembleSamplerTest::banana, seed, 2, 30_000);
            assertThat(r.convergence().converged()).as(r.convergence().reason()).isTrue();
            double[] x = retained(r, 0);
            double[] y = retained(r, 1);
            double neff = x.length / r.convergence().maxAutocorrelationTime();
            double my = 0;
            double vy = 0;
            double mxy = 0;
            for (int i = 0; i < y.length; i++) {
                my += y[i];
                mxy += x[i] * y[i];
            }
            my /= y.length;
            mxy /= y.length;
            for (double v : y) {
                vy += (v - my) * (v - my);
            }
            vy /= y.length;
            meanY[(int) seed - 1] = my;
            // standard error of the mean √(2.25/neff); of the variance about √(Var[(y−μ)²]/neff) ≈ 5/√neff
            assertThat(my).isCloseTo(1.0, org.assertj.core.data.Offset.offset(4 * 1.5 / Math.sqrt(neff)));
            assertThat(vy).isCloseTo(2.25, org.assertj.core.data.Offset.offset(4 * 5 / Math.sqrt(neff)));
            // E[xy] = E[x³] = 0; Var[xy] = E[x⁶] + 0.25 E[x²] = 15.25
            assertThat(mxy).isCloseTo(0.0, org.assertj.core.data.Offset.offset(4 * Math.sqrt(15.25 / neff)));
            // x marginal is N(0, 1): 68 % interval ±1
            Marginal mx = Marginal.of(x, Double.NaN, Double.NaN, Double.NaN);
            assertThat(mx.upper68() - mx.lower68()).isCloseTo(2.0, org.assertj.core.data.Offset.offset(0.2));
        }
        assertThat(meanY).doesNotHaveDuplicates();
    }

    @Test
    void sameSeedGivesTheSameChainWithOneOrTwoThreads() {
        EnsembleSampler.Result one = run(EnsembleSamplerTest::banana, 7, 1, 300);
        EnsembleSampler.Result two = run(EnsembleSamplerTest::banana, 7, 2, 300);
        // three threads: the walkers of a half do not divide evenly, and which thread takes which varies
        EnsembleSampler.Result three = run(EnsembleSamplerTest::banana, 7, 3, 300);
        EnsembleSampler.Result other = run(EnsembleSamplerTest::banana, 8, 2, 300);
        assertThat(one.chain().steps()).isEqualTo(two.chain().steps()).isEqualTo(three.chain().steps());
        boolean differs = false;
        for (int t = 0; t < one.chain().steps(); t++) {
            for (int w = 0; w < WALKERS; w++) {
                assertThat(two.chain().position(t, w)).containsExactly(one.chain().position(t, w));
                assertThat(two.chain().logDensity(t, w)).isEqualTo(one.chain().logDensity(t, w));
                assertThat(three.chain().position(t, w)).containsExactly(one.chain().position(t, w));
                differs |= other.chain().value(t, w, 0) != one.chain().value(t, w, 0);
            }
        }
        assertThat(differs).isTrue();
    }

    @Test
    void aShortRunIsReportedUnconvergedWithTheReason() {
        EnsembleSampler.Result r = run(EnsembleSamplerTest::banana, 3, 1, 400);
        assertThat(r.convergence().converged()).isFalse();
        assertThat(r.convergence().reason()).contains("step limit of 400").contains("autocorrelation times long");
        assertThat(r.convergence().steps()).isEqualTo(400);
        // the coordinate the reason points at is named when the caller knows the names
        assertThat(r.convergence().withCoordinateNames(java.util.List.of("x", "y")).reason())
                .containsPattern("coordinate [01], [xy], τ");
    }

    @Test
    void aStopRequestEndsTheRunAsCancelled() {
        int[] calls = {0};
        EnsembleSampler.Result r = EnsembleSampler.sample(() -> EnsembleSamplerTest::banana, ball(WALKERS, 2, 1, 0.1),
                SamplerSettings.of(WALKERS, 10_000, 1, 1), SamplingProgress.NONE, () -> ++calls[0] > 50);
        assertThat(r.convergence().cancelled()).isTrue();
        assertThat(r.convergence().converged()).isFalse();
        assertThat(r.chain().steps()).isEqualTo(50);
    }

    @Test
    void aStartOutsideTheSupportNamesTheWalker() {
        double[][] start = ball(WALKERS, 2, 1, 0.1);
        start[5][0] = 10;
        LogDensity positive = p -> p[0] > 5 ? Double.NEGATIVE_INFINITY : gaussian2d(p);
        assertThatThrownBy(() -> EnsembleSampler.sample(() -> positive, start, SamplerSettings.of(WALKERS, 100, 1, 1),
                SamplingProgress.NONE, () -> false)).isInstanceOf(EnsembleSampler.StartRejected.class)
                .satisfies(e -> assertThat(((EnsembleSampler.StartRejected) e).walker()).isEqualTo(5));
    }
}
