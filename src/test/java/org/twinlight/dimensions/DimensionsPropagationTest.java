package org.twinlight.dimensions;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;

class DimensionsPropagationTest {

    private static final BinaryElements CENTRAL = new BinaryElements(3.2145, 0.02, 87.5, 95.0, 118.0, 0.105, 0.071,
            6400, 5600, Double.NaN);

    private static double[][] diagonal(double... sigmas) {
        double[][] c = new double[sigmas.length][sigmas.length];
        for (int i = 0; i < sigmas.length; i++) {
            c[i][i] = sigmas[i] * sigmas[i];
        }
        return c;
    }

    @Test
    void aLinearQuantityGetsExactlyTheInputSpread() {
        // R₁ = r₁·a is linear in r₁: with only r₁ uncertain, σ(R₁) = a·σ(r₁) exactly; 10,000 draws
        // estimate a standard deviation to 0.7 % (1/√(2N)), so 3 % is a 4σ band.
        double[][] cov = diagonal(0, 0, 0, 0, 0, 0.002, 0, 0, 0, 0);
        DimensionsPropagation.Result r = DimensionsPropagation.propagate(CENTRAL, cov, 10_000, 7);
        double a = r.central().get(Quantity.SEMI_MAJOR_AXIS);
        DimensionEstimate radius = r.estimates().get(Quantity.RADIUS1);
        assertThat(radius.uncertainty()).isCloseTo(a * 0.002, within(0.03 * a * 0.002));
        assertThat(radius.firstOrderUncertainty()).isCloseTo(a * 0.002, within(1e-6 * a));
        assertThat(r.estimates().get(Quantity.MASS1).uncertainty()).isLessThan(1e-9);
    }

    @Test
    void massErrorFromTheVelocitiesFollowsTheHandbookForm() {
        // M₁ ∝ (K₁+K₂)² K₂ (Torres et al. 2010, §3): to first order
        // σ(M₁)/M₁ = √[(2σ₁/(K₁+K₂))² + (2/(K₁+K₂) + 1/K₂)² σ₂²] for independent K errors.
        double s1 = 0.4;
        double s2 = 0.6;
        double[][] cov = diagonal(0, 0, 0, s1, s2, 0, 0, 0, 0, 0);
        DimensionsPropagation.Result r = DimensionsPropagation.propagate(CENTRAL, cov, 10_000, 11);
        double sum = CENTRAL.k1Kms() + CENTRAL.k2Kms();
        double rel = Math.hypot(2 * s1 / sum, (2 / sum + 1 / CENTRAL.k2Kms()) * s2);
        DimensionEstimate m1 = r.estimates().get(Quantity.MASS1);
        assertThat(m1.uncertainty() / m1.value()).isCloseTo(rel, within(0.03 * rel));
        assertThat(m1.firstOrderUncertainty() / m1.value()).isCloseTo(rel, within(0.01 * rel));
        assertThat(m1.firstOrderDiffers()).isFalse();
    }

    @Test
    void perfectlyCorrelatedRadiiMoveTogether() {
        // r₁ and r₂ with correlation +1 and σ in the ratio of the values: R₂/R₁ then never changes,
        // so the sum of radii has σ = a(σ₁+σ₂), not a√(σ₁²+σ₂²).
        double[][] cov = new double[10][10];
        cov[5][5] = 0.003 * 0.003;
        cov[6][6] = 0.002 * 0.002;
        cov[5][6] = cov[6][5] = 0.003 * 0.002;
        DimensionsPropagation.Result r = DimensionsPropagation.propagate(CENTRAL, cov, 10_000, 3);
        double a = r.central().get(Quantity.SEMI_MAJOR_AXIS);
        assertThat(r.estimates().get(Quantity.RADIUS1).uncertainty()).isCloseTo(a * 0.003, within(0.03 * a * 0.003));
        assertThat(r.estimates().get(Quantity.RADIUS2).uncertainty()).isCloseTo(a * 0.002, within(0.03 * a * 0.002));
    }

    @Test
    void theSameSeedGivesTheSameResult() {
        double[][] cov = diagonal(1e-6, 0.005, 0.3, 0.5, 0.7, 0.001, 0.001, 100, 120, 0);
        DimensionsPropagation.Result a = DimensionsPropagation.propagate(CENTRAL, cov, 2000, 5);
        DimensionsPropagation.Result b = DimensionsPropagation.propagate(CENTRAL, cov, 2000, 5);
        assertThat(a.estimates().get(Quantity.LUMINOSITY2).uncertainty())
                .isEqualTo(b.estimates().get(Quantity.LUMINOSITY2).uncertainty());
        // e = 0.02 ± 0.005 keeps almost every draw physical
        assertThat(a.rejected()).isLessThan(20);
    }

    @Test
    void sampledErrorsCoverTheTruthOverManyMeasurements() {
        // Injection: 150 "measurements" of the elements, each the truth plus correlated normal noise
        // (r2–i correlated at −0.9 as in partial eclipses, r1–i at −0.6, r1–r2 at +0.5, K errors of 1 %); for each, dimensions and
        // their sampled errors. The pulls (estimate − truth)/σ of M1, R2 and L2 must have a spread
        // near 1; 150 values estimate a spread to ±0.06, so [0.8, 1.2] is a ±3σ band.
        double[] s = {1e-7, 0.01, 0.4, 0.95, 1.18, 0.002, 0.002, 150, 150, 0};
        double[][] cov = diagonal(s);
        cov[2][6] = cov[6][2] = -0.9 * s[2] * s[6];
        cov[5][6] = cov[6][5] = 0.5 * s[5] * s[6];
        cov[2][5] = cov[5][2] = -0.6 * s[2] * s[5];
        // the test's own noise: independent normals, and for (i, r1, r2) the Commons Math Cholesky
        // factor of their 3 x 3 correlation matrix
        int[] block = {2, 5, 6};
        double[][] corr = new double[3][3];
        for (int a = 0; a < 3; a++) {
            for (int b = 0; b < 3; b++) {
                corr[a][b] = cov[block[a]][block[b]] / (s[block[a]] * s[block[b]]);
            }
        }
        org.apache.commons.math3.linear.RealMatrix chol = new org.apache.commons.math3.linear.CholeskyDecomposition(
                new org.apache.commons.math3.linear.Array2DRowRealMatrix(corr)).getL();
        AbsoluteDimensions truth = AbsoluteDimensions.of(CENTRAL);
        java.util.Random rng = new java.util.Random(42);
        Quantity[] checked = {Quantity.MASS1, Quantity.RADIUS2, Quantity.LUMINOSITY2};
        double[][] pulls = new double[checked.length][150];
        for (int k = 0; k < 150; k++) {
            double[] x = CENTRAL.toVector();
            for (int i = 0; i < x.length; i++) {
                x[i] += s[i] * rng.nextGaussian();
            }
            double[] blockNoise = chol.operate(new double[] {rng.nextGaussian(), rng.nextGaussian(), rng.nextGaussian()});
            for (int a = 0; a < 3; a++) {
                x[block[a]] = CENTRAL.toVector()[block[a]] + s[block[a]] * blockNoise[a];
            }
            DimensionsPropagation.Result r = DimensionsPropagation.propagate(BinaryElements.fromVector(x), cov, 1000, k);
            for (int q = 0; q < checked.length; q++) {
                DimensionEstimate e = r.estimates().get(checked[q]);
                pulls[q][k] = (e.value() - truth.get(checked[q])) / e.uncertainty();
            }
        }
        for (double[] p : pulls) {
            double mean = java.util.Arrays.stream(p).average().orElseThrow();
            double sd = Math.sqrt(java.util.Arrays.stream(p).map(v -> (v - mean) * (v - mean)).sum() / (p.length - 1));
            assertThat(sd).isBetween(0.8, 1.2);
            assertThat(mean).isCloseTo(0, within(0.3));
        }
    }

    @Test
    void nearEdgeOnTheLinearErrorOfTheMassIsTooSmallAndIsReportedBeside() {
        // M ∝ 1/sin³i: at i = 88° ± 3° the first-order error 3 cot(i) σ_i (relative) understates the
        // spread, because sin i peaks at 90°. The exact relative spread is the standard deviation of
        // sin³(88°)/sin³(i) over a normal i, integrated here with Commons Math (Simpson, ±6σ).
        BinaryElements el = new BinaryElements(3.2145, 0.0, 88.0, 95.0, 118.0, 0.105, 0.071, Double.NaN,
                Double.NaN, Double.NaN);
        double[][] cov = diagonal(0, 0, 3.0, 0, 0, 0, 0, 0, 0, 0);
        DimensionsPropagation.Result r = DimensionsPropagation.propagate(el, cov, 20_000, 17);
        double mu = Math.toRadians(88.0);
        double sd = Math.toRadians(3.0);
        org.apache.commons.math3.analysis.integration.SimpsonIntegrator simpson =
                new org.apache.commons.math3.analysis.integration.SimpsonIntegrator(1e-10, 1e-12, 3, 30);
        java.util.function.DoubleUnaryOperator density = x -> Math.exp(-0.5 * Math.pow((x - mu) / sd, 2))
                / (sd * Math.sqrt(2 * Math.PI));
        double m1 = simpson.integrate(1_000_000, x -> density.applyAsDouble(x) / Math.pow(Math.sin(x), 3),
                mu - 6 * sd, mu + 6 * sd);
        double m2 = simpson.integrate(1_000_000, x -> density.applyAsDouble(x) / Math.pow(Math.sin(x), 6),
                mu - 6 * sd, mu + 6 * sd);
        double exactRelative = Math.sqrt(m2 - m1 * m1) * Math.pow(Math.sin(mu), 3);
        DimensionEstimate mass = r.estimates().get(Quantity.MASS1);
        assertThat(mass.uncertainty() / mass.value()).isCloseTo(exactRelative, within(0.05 * exactRelative));
        assertThat(mass.firstOrderUncertainty() / mass.value()).isCloseTo(3 / Math.tan(mu) * sd, within(1e-3 * sd));
        assertThat(mass.firstOrderDiffers()).isTrue();
    }
}
