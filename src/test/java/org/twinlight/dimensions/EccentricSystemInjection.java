package org.twinlight.dimensions;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import java.util.Set;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.CholeskyDecomposition;
import org.apache.commons.math3.linear.RealMatrix;
import org.twinlight.velocity.SemiAmplitudeRefit;
import org.twinlight.velocity.SyntheticVelocities;
import org.twinlight.velocity.VelocityData;
import org.twinlight.velocity.VelocityFitResult;
import org.twinlight.velocity.VelocityFitSettings;
import org.twinlight.velocity.VelocityFitter;
import org.twinlight.velocity.VelocityParameters;

/**
 * Injection over noise seeds of a synthetic eccentric double-lined eclipsing binary, as the
 * {@code dimensions --velocities} command treats it: the light-curve elements are "measured" as
 * the truth plus correlated normal noise with a known covariance (the light-curve fit's own
 * calibration is tested by the fit's injection tests); the velocities are simulated, noisy, and
 * fitted for K1, K2 and γ at the measured orbit (e and ω fixed, as the command does); the errors
 * of the dimensions are then propagated either with K refitted per draw of (P, e, ω) or, the
 * former way, with K independent of the orbit. Pull = (estimate − truth)/σ for M1, M2, R1, R2, a.
 */
public final class EccentricSystemInjection {

    /** The quantities whose pulls are collected. */
    public static final Quantity[] CHECKED = {Quantity.MASS1, Quantity.MASS2, Quantity.RADIUS1, Quantity.RADIUS2,
        Quantity.SEMI_MAJOR_AXIS};

    /** e = 0.3, ω = 140°: an eccentric orbit whose eclipses constrain e sin ω loosely. */
    private static final VelocityParameters TRUTH_VELOCITIES = new VelocityParameters(5.71, 2460200.0, 0.30, 140.0,
            55.0, 70.0, 3.0, new double[] {0.0}, 0.0, 0.0);
    private static final double INCLINATION = 86.5;
    private static final double RADIUS1 = 0.090;
    private static final double RADIUS2 = 0.070;

    /**
     * Light-curve errors in the order of {@link DimensionsPropagation#DRAWN}: P, e, i, (K1, K2),
     * r1, r2, (Teff1, Teff2, J), ω. e and ω as loosely known as a light curve with a poorly timed
     * secondary eclipse leaves them.
     */
    private static final double[] SIGMA = {2e-5, 0.04, 0.3, 0, 0, 0.0012, 0.0012, 0, 0, 0, 6.0};

    /** Mean effective number of draws of the last {@link #pulls} run (for the bench's report). */
    static double effectiveDraws;

    private EccentricSystemInjection() {
    }

    /** The mean effective number of draws per seed in the last run. */
    public static double lastEffectiveDraws() {
        return effectiveDraws;
    }

    /** The light-curve covariance: e–ω +0.6, r2–i −0.8, r1–i −0.5, r1–r2 +0.4, e–r2 +0.3. */
    static double[][] lightCurveCovariance() {
        int n = SIGMA.length;
        double[][] corr = new double[n][n];
        for (int i = 0; i < n; i++) {
            corr[i][i] = 1;
        }
        setPair(corr, 1, 10, 0.6);
        setPair(corr, 6, 2, -0.8);
        setPair(corr, 5, 2, -0.5);
        setPair(corr, 5, 6, 0.4);
        setPair(corr, 1, 6, 0.3);
        double[][] cov = new double[n][n];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                cov[i][j] = corr[i][j] * SIGMA[i] * SIGMA[j];
            }
        }
        return cov;
    }

    private static void setPair(double[][] c, int a, int b, double rho) {
        c[a][b] = rho;
        c[b][a] = rho;
    }

    /** The truth's dimensions. */
    static AbsoluteDimensions truth() {
        VelocityParameters t = TRUTH_VELOCITIES;
        return AbsoluteDimensions.of(new BinaryElements(t.periodDays(), t.eccentricity(), INCLINATION, t.k1Kms(),
                t.k2Kms(), RADIUS1, RADIUS2, Double.NaN, Double.NaN, Double.NaN));
    }

    /**
     * Pulls of {@link #CHECKED} over {@code seeds} seeds.
     *
     * @param epochs velocity epochs per seed (both stars at each)
     * @param draws draws of the propagation
     * @param refit whether K is refitted for each draw of the orbit
     * @return pulls[quantity][seed]
     */
    public static double[][] pulls(int seeds, int epochs, int draws, boolean refit) {
        double[][] cov = lightCurveCovariance();
        int[] noisy = {0, 1, 2, 5, 6, 10};
        double[][] block = new double[noisy.length][noisy.length];
        for (int a = 0; a < noisy.length; a++) {
            for (int b = 0; b < noisy.length; b++) {
                block[a][b] = cov[noisy[a]][noisy[b]];
            }
        }
        // the test's own noise: the Commons Math Cholesky factor of the light-curve covariance
        RealMatrix chol = new CholeskyDecomposition(new Array2DRowRealMatrix(block)).getL();
        AbsoluteDimensions truth = truth();
        VelocityParameters t = TRUTH_VELOCITIES;
        double[] truthVector = {t.periodDays(), t.eccentricity(), INCLINATION, t.k1Kms(), t.k2Kms(), RADIUS1, RADIUS2,
            Double.NaN, Double.NaN, Double.NaN, t.omegaDeg()};
        List<double[]> rows = new ArrayList<>();
        effectiveDraws = 0;
        for (int seed = 1; seed <= seeds; seed++) {
            Random rng = new Random(1000 + seed);
            double[] z = new double[noisy.length];
            for (int a = 0; a < z.length; a++) {
                z[a] = rng.nextGaussian();
            }
            double[] noise = chol.operate(z);
            double[] measured = truthVector.clone();
            for (int a = 0; a < noisy.length; a++) {
                measured[noisy[a]] += noise[a];
            }
            VelocityData data = SyntheticVelocities.make(t, epochs, 1.5, 2.5, 1, 1.0, seed);
            VelocityParameters start = new VelocityParameters(measured[0], t.epochDays(), measured[1], measured[10],
                    t.k1Kms() * 0.9, t.k2Kms() * 1.1, 0.0, new double[] {0.0}, 0.0, 0.0);
            VelocityFitResult fit = VelocityFitter.fit(data, start, new VelocityFitSettings(Set.of(), 0, false, 200));
            double[] mean = measured.clone();
            mean[3] = fit.best().k1Kms();
            mean[4] = fit.best().k2Kms();
            double[][] c = lightCurveCovariance();
            c[3][3] = fit.covariance("k1", "k1");
            c[4][4] = fit.covariance("k2", "k2");
            c[3][4] = c[4][3] = fit.covariance("k1", "k2");
            DimensionsPropagation.SemiAmplitudesForOrbit k = null;
            DimensionsPropagation.VelocityOrbit velocityOrbit = null;
            if (refit) {
                // the weights, jitter and error scale from the velocities' own best orbit, as the command does
                VelocityFitResult free = VelocityFitter.fit(data, start, new VelocityFitSettings(
                        Set.of("eccentricity", "omega"), 0, false, 200));
                k = SemiAmplitudeRefit.of(data, free)::drawInto;
                velocityOrbit = new DimensionsPropagation.VelocityOrbit(free.best().eccentricity(),
                        free.best().omegaDeg(), SemiAmplitudeRefit.eccentricityOmegaCovariance(free));
            }
            DimensionsPropagation.Result result = DimensionsPropagation.propagate(new DimensionsPropagation.Inputs(
                    BinaryElements.fromVector(mean), mean[10], c, k, null, velocityOrbit), draws, seed);
            effectiveDraws += result.effectiveDraws();
            double[] row = new double[CHECKED.length];
            for (int q = 0; q < CHECKED.length; q++) {
                DimensionEstimate est = result.estimates().get(CHECKED[q]);
                row[q] = (est.value() - truth.get(CHECKED[q])) / est.uncertainty();
            }
            rows.add(row);
        }
        effectiveDraws /= seeds;
        double[][] out = new double[CHECKED.length][rows.size()];
        for (int s = 0; s < rows.size(); s++) {
            for (int q = 0; q < CHECKED.length; q++) {
                out[q][s] = rows.get(s)[q];
            }
        }
        return out;
    }

    /** Standard deviation of the pulls. */
    public static double spread(double[] p) {
        double mean = java.util.Arrays.stream(p).average().orElseThrow();
        return Math.sqrt(java.util.Arrays.stream(p).map(v -> (v - mean) * (v - mean)).sum() / (p.length - 1));
    }

    /** Fraction of pulls with |pull| ≤ {@code limit}. */
    public static double within(double[] p, double limit) {
        return (double) java.util.Arrays.stream(p).filter(v -> Math.abs(v) <= limit).count() / p.length;
    }
}
