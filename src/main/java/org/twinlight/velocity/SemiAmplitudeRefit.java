package org.twinlight.velocity;

import org.twinlight.orbit.RadialVelocityCurve;

/**
 * K1 and K2 of a velocity set refitted for another orbit (period, e, ω), with the errors,
 * jitter and error scaling of a fit already made. This carries the uncertainty of an orbit taken
 * from elsewhere (the light-curve fit's P, e and ω) into K1 and K2: draw the orbit, refit K per
 * draw.
 *
 * <p>At a fixed orbit and jitter the model v = γ + δⱼ ± K_n [cos(ν+ω) + e cos ω]
 * ({@link VelocityModel}) is linear in K1, K2, γ and the instrument offsets δⱼ, so the refit is
 * one weighted linear least-squares solve (normal equations, e.g. Press et al. 2007, Numerical
 * Recipes 3rd ed., §15.4): the minimum Levenberg–Marquardt reaches, without iterating. The epoch
 * stays the fit's.
 *
 * <p>The refit also gives the likelihood of the orbit given the velocities, with K1, K2, γ and the
 * offsets marginalised under flat priors: ln L = −½ χ²_min/s − ½ ln det(AᵀWA) + const, where s is
 * the error scale max(1, χ²/ν) of the original fit (for a linear-Gaussian model the integral over
 * the linear parameters is exact: e.g. Gregory 2005, <i>Bayesian Logical Data Analysis for the
 * Physical Sciences</i>, §10.5). Weighting draws of the orbit from the light curve by it combines
 * what the light curve and the velocities each know of e and ω.
 */
public final class SemiAmplitudeRefit {

    private final double[] times;
    private final double[] velocities;
    private final double[] weights;
    /** +1 for star 1, −1 for star 2: the sign of K in the model. */
    private final double[] sign;
    private final int[] instruments;
    private final int unknowns;
    private final double epochDays;
    private final double errorScale;

    private SemiAmplitudeRefit(double[] times, double[] velocities, double[] weights, double[] sign,
            int[] instruments, int instrumentCount, double epochDays, double errorScale) {
        this.times = times;
        this.velocities = velocities;
        this.weights = weights;
        this.sign = sign;
        this.instruments = instruments;
        this.unknowns = 2 + instrumentCount;
        this.epochDays = epochDays;
        this.errorScale = errorScale;
    }

    /**
     * The refit of {@code data} with the weights of {@code fit}: its errors (stated or estimated),
     * its jitter, and its covariance scaling max(1, χ²/ν).
     */
    public static SemiAmplitudeRefit of(VelocityData data, VelocityFitResult fit) {
        int n1 = data.star1().size();
        int n = data.size();
        double[] t = new double[n];
        double[] v = new double[n];
        double[] w = new double[n];
        double[] s = new double[n];
        int[] inst = new int[n];
        for (int star = 1; star <= 2; star++) {
            StarVelocities sv = data.star(star);
            double[] sigma = star == 1 ? fit.sigma1() : fit.sigma2();
            double jitter = fit.best().jitterKms(star);
            int base = star == 1 ? 0 : n1;
            for (int i = 0; i < sv.size(); i++) {
                t[base + i] = sv.timesDays()[i];
                v[base + i] = sv.velocitiesKms()[i];
                w[base + i] = 1.0 / (sigma[i] * sigma[i] + jitter * jitter);
                s[base + i] = star == 1 ? 1.0 : -1.0;
                inst[base + i] = sv.instruments()[i];
            }
        }
        return new SemiAmplitudeRefit(t, v, w, s, inst, data.instruments().size(), fit.best().epochDays(),
                Math.max(1.0, fit.reducedChi2()));
    }

    /**
     * The refitted semi-amplitudes.
     *
     * @param k1Kms K1, km/s
     * @param k2Kms K2, km/s
     * @param covariance their 2 × 2 covariance at this orbit (γ and offsets marginalised), scaled
     *     as the original fit's
     * @param logLikelihood ln of the velocities' likelihood of this orbit, K1, K2, γ and the offsets
     *     marginalised (up to a constant shared by every orbit of this refit)
     */
    public record Refit(double k1Kms, double k2Kms, double[][] covariance, double logLikelihood) {
    }

    /**
     * Refits K1, K2, γ and the offsets for the orbit (period, e, ω) at the fit's epoch.
     *
     * @return null when the orbit leaves the velocities unable to tell K1, K2, γ and the offsets
     *     apart (a singular normal matrix)
     */
    public Refit refit(double periodDays, double eccentricity, double omegaDeg) {
        RadialVelocityCurve curve = new RadialVelocityCurve(periodDays, epochDays, eccentricity, omegaDeg);
        int p = unknowns;
        // columns: K1, K2, γ, offsets of instruments 1..; the offset of instrument 0 is 0
        double[][] normal = new double[p][p];
        double[] rhs = new double[p];
        double[] row = new double[p];
        double[] shapes = new double[times.length];
        for (int i = 0; i < times.length; i++) {
            java.util.Arrays.fill(row, 0.0);
            shapes[i] = curve.shape(times[i]);
            fillRow(i, shapes[i], row);
            for (int a = 0; a < p; a++) {
                if (row[a] == 0) {
                    continue;
                }
                double wa = weights[i] * row[a];
                rhs[a] += wa * velocities[i];
                for (int b = 0; b < p; b++) {
                    normal[a][b] += wa * row[b];
                }
            }
        }
        double[] logDet = new double[1];
        double[][] inverse = invertPositiveDefinite(normal, logDet);
        if (inverse == null) {
            return null;
        }
        double[] solution = new double[p];
        for (int a = 0; a < p; a++) {
            for (int b = 0; b < p; b++) {
                solution[a] += inverse[a][b] * rhs[b];
            }
        }
        double chi2 = 0;
        for (int i = 0; i < times.length; i++) {
            java.util.Arrays.fill(row, 0.0);
            fillRow(i, shapes[i], row);
            double model = 0;
            for (int a = 0; a < p; a++) {
                model += row[a] * solution[a];
            }
            double r = velocities[i] - model;
            chi2 += weights[i] * r * r;
        }
        double[][] cov = {{inverse[0][0] * errorScale, inverse[0][1] * errorScale},
            {inverse[1][0] * errorScale, inverse[1][1] * errorScale}};
        double logLikelihood = -0.5 * chi2 / errorScale - 0.5 * logDet[0];
        return new Refit(solution[0], solution[1], cov, logLikelihood);
    }

    /**
     * {@link #refit} in the shape the error propagation takes: K1 and K2 drawn from their normal
     * distribution at this orbit, K̂ + L z with L the Cholesky root of their covariance.
     *
     * @param z1 a standard normal deviate (0 for the best K)
     * @param z2 another
     * @param k receives K1 and K2, km/s
     * @return the log-likelihood of the orbit, NaN when the velocities give no K for it
     */
    public double drawInto(double periodDays, double eccentricity, double omegaDeg, double z1, double z2,
            double[] k) {
        Refit r = refit(periodDays, eccentricity, omegaDeg);
        if (r == null) {
            return Double.NaN;
        }
        double[][] c = r.covariance();
        double l11 = Math.sqrt(c[0][0]);
        double l21 = c[1][0] / l11;
        double l22 = Math.sqrt(Math.max(0, c[1][1] - l21 * l21));
        k[0] = r.k1Kms() + l11 * z1;
        k[1] = r.k2Kms() + l21 * z1 + l22 * z2;
        return r.logLikelihood();
    }

    /**
     * The covariance of (e, ω in degrees) of a fit with e and ω free, from its (e cos ω, e sin ω)
     * covariance to first order: ∂e/∂h = h/e, ∂e/∂k = k/e, ∂ω/∂h = −k/e², ∂ω/∂k = h/e².
     *
     * @return null when the fit did not free e and ω or e is 0
     */
    public static double[][] eccentricityOmegaCovariance(VelocityFitResult fit) {
        int ih = fit.freeNames().indexOf("eCosOmega");
        int ik = fit.freeNames().indexOf("eSinOmega");
        double e = fit.best().eccentricity();
        if (ih < 0 || ik < 0 || !(e > 0)) {
            return null;
        }
        double w = Math.toRadians(fit.best().omegaDeg());
        double h = e * Math.cos(w);
        double k = e * Math.sin(w);
        double deg = Math.toDegrees(1);
        double[][] j = {{h / e, k / e}, {-k / (e * e) * deg, h / (e * e) * deg}};
        double[][] c = {{fit.covariance()[ih][ih], fit.covariance()[ih][ik]},
            {fit.covariance()[ik][ih], fit.covariance()[ik][ik]}};
        double[][] out = new double[2][2];
        for (int a = 0; a < 2; a++) {
            for (int b = 0; b < 2; b++) {
                for (int x = 0; x < 2; x++) {
                    for (int y = 0; y < 2; y++) {
                        out[a][b] += j[a][x] * c[x][y] * j[b][y];
                    }
                }
            }
        }
        return out;
    }

    /**
     * Inverse of a small symmetric positive-definite matrix by Cholesky decomposition, with
     * ln det into {@code logDet[0]}; null when not positive definite. Written out rather than
     * through Commons Math because it runs once per draw (ten thousand times per command) on a
     * 3 × 3 to 6 × 6 matrix, where the library's matrix objects and checks cost more than the
     * arithmetic.
     */
    static double[][] invertPositiveDefinite(double[][] a, double[] logDet) {
        int n = a.length;
        double[][] l = new double[n][n];
        double sumLog = 0;
        for (int i = 0; i < n; i++) {
            for (int j = 0; j <= i; j++) {
                double sum = a[i][j];
                for (int k = 0; k < j; k++) {
                    sum -= l[i][k] * l[j][k];
                }
                if (i == j) {
                    // a pivot this small against the diagonal: the columns are (nearly) dependent
                    if (!(sum > 1e-12 * Math.abs(a[i][i])) || !Double.isFinite(sum)) {
                        return null;
                    }
                    l[i][i] = Math.sqrt(sum);
                    sumLog += Math.log(sum);
                } else {
                    l[i][j] = sum / l[j][j];
                }
            }
        }
        // inverse of L (lower triangular), then A⁻¹ = L⁻ᵀ L⁻¹
        double[][] li = new double[n][n];
        for (int i = 0; i < n; i++) {
            li[i][i] = 1 / l[i][i];
            for (int j = 0; j < i; j++) {
                double sum = 0;
                for (int k = j; k < i; k++) {
                    sum -= l[i][k] * li[k][j];
                }
                li[i][j] = sum / l[i][i];
            }
        }
        double[][] inv = new double[n][n];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j <= i; j++) {
                double sum = 0;
                for (int k = i; k < n; k++) {
                    sum += li[k][i] * li[k][j];
                }
                inv[i][j] = sum;
                inv[j][i] = sum;
            }
        }
        logDet[0] = sumLog;
        return inv;
    }

    /** The design row of measurement i: K1 or K2 (with its sign) times the shape, γ, its offset. */
    private void fillRow(int i, double shape, double[] row) {
        row[sign[i] > 0 ? 0 : 1] = sign[i] * shape;
        row[2] = 1.0;
        if (instruments[i] > 0) {
            row[2 + instruments[i]] = 1.0;
        }
    }
}
