package org.twinlight.timing.minima;

import java.util.Locale;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.LUDecomposition;
import org.apache.commons.math3.linear.RealMatrix;
import org.apache.commons.math3.linear.SingularMatrixException;
import org.apache.commons.math3.optim.MaxEval;
import org.apache.commons.math3.optim.nonlinear.scalar.GoalType;
import org.apache.commons.math3.optim.univariate.BrentOptimizer;
import org.apache.commons.math3.optim.univariate.SearchInterval;
import org.apache.commons.math3.optim.univariate.UnivariateObjectiveFunction;

/**
 * Least-squares fit of a symmetric template to one eclipse: flux = a − b·ψ(t − T), with the
 * baseline a, the depth b and the time of minimum T free. For each T the linear parameters are
 * solved exactly, so χ²(T) is a function of T alone (variable projection, Golub &amp; Pereyra
 * 1973); it is scanned on a grid and refined with Brent's method. The uncertainties are the
 * covariance (JᵀWJ)⁻¹ of the three parameters scaled by the reduced χ², χ²/(n − 3)
 * (Press et al., Numerical Recipes, 3rd ed., §15.4 and §15.6), so they hold whether or not the
 * point errors were given or are right.
 */
final class MinimumTemplateFit {

    /**
     * @param timeDays fitted time of minimum, input coordinates
     * @param errorDays 1σ, scaled by the reduced χ²
     * @param depth b, flux units
     * @param depthError 1σ of b, scaled
     * @param model a − b·ψ at every input point
     * @param reducedChi2 χ²/(n − 3) with the given weights
     * @param failure null when fitted, else the reason
     */
    record Result(double timeDays, double errorDays, double depth, double depthError, double[] model,
            double reducedChi2, String failure) {
        static Result failed(String why) {
            return new Result(Double.NaN, Double.NaN, Double.NaN, Double.NaN, null, Double.NaN, why);
        }

        boolean ok() {
            return failure == null;
        }
    }

    private static final int SCAN = 41;

    private MinimumTemplateFit() {
    }

    /**
     * @param x times relative to a reference, days
     * @param f flux
     * @param w weights 1/σ² (all 1 when the data carry no errors)
     * @param template the symmetric profile
     * @param guess expected minimum, same coordinates as x
     * @param searchHalfDays T is looked for within guess ± this
     */
    static Result fit(double[] x, double[] f, double[] w, MinimumTemplate template, double guess, double searchHalfDays) {
        int n = x.length;
        if (n < 6) {
            return Result.failed("too few points for the template fit (" + n + ")");
        }
        double lo = guess - searchHalfDays;
        double step = 2 * searchHalfDays / (SCAN - 1);
        int best = 0;
        double bestChi2 = Double.POSITIVE_INFINITY;
        for (int j = 0; j < SCAN; j++) {
            double c = chi2(x, f, w, template, lo + j * step);
            if (c < bestChi2) {
                bestChi2 = c;
                best = j;
            }
        }
        if (best == 0 || best == SCAN - 1) {
            return Result.failed(String.format(Locale.ROOT,
                    "template fit: minimum not found within ±%.1f min of the expected time", searchHalfDays * 1440));
        }
        double a0 = lo + (best - 1) * step;
        double b0 = lo + (best + 1) * step;
        double t = new BrentOptimizer(1e-12, 1e-9 * step).optimize(new MaxEval(200),
                new UnivariateObjectiveFunction(tt -> chi2(x, f, w, template, tt)), GoalType.MINIMIZE,
                new SearchInterval(a0, b0, lo + best * step)).getPoint();
        double[] ab = linear(x, f, w, template, t);
        double a = ab[0];
        double b = ab[1];
        double[][] fisher = new double[3][3];
        double chi2 = 0;
        double[] model = new double[n];
        for (int i = 0; i < n; i++) {
            double psi = template.value(x[i] - t);
            model[i] = a - b * psi;
            double r = f[i] - model[i];
            chi2 += w[i] * r * r;
            double[] grad = {1, -psi, b * template.slope(x[i] - t)};
            for (int p = 0; p < 3; p++) {
                for (int q = 0; q < 3; q++) {
                    fisher[p][q] += w[i] * grad[p] * grad[q];
                }
            }
        }
        RealMatrix cov;
        try {
            cov = new LUDecomposition(new Array2DRowRealMatrix(fisher), 1e-300).getSolver().getInverse();
        } catch (SingularMatrixException e) {
            return Result.failed("template fit: time, depth and baseline cannot be separated (flat data)");
        }
        double red = chi2 / (n - 3);
        double sigmaT = Math.sqrt(cov.getEntry(2, 2) * red);
        double sigmaB = Math.sqrt(cov.getEntry(1, 1) * red);
        if (!Double.isFinite(sigmaT) || !(sigmaT > 0)) {
            return Result.failed("template fit: the time of minimum is not constrained");
        }
        return new Result(t, sigmaT, b, sigmaB, model, red, null);
    }

    /**
     * Fit of a partly covered eclipse with the template's shape and fractional depth fixed by the
     * well-covered eclipses: flux = a·(1 − D·ψ(t − T)), baseline a and time T free. The error of T
     * is the covariance of (a, T) scaled by χ²/(n − 2), combined in quadrature with the shift of T
     * when D moves by ±σ_D (the scatter of the depths of the well-covered eclipses).
     *
     * @param depth D, fractional depth at ψ = 1
     * @param depthSigma σ_D
     * @return the result; its {@code depth} is D·a (flux units), {@code depthError} its share of σ_D
     */
    static Result fitFixedDepth(double[] x, double[] f, double[] w, MinimumTemplate template, double depth,
            double depthSigma, double guess, double searchHalfDays) {
        int n = x.length;
        if (n < 6) {
            return Result.failed("too few points for the template fit (" + n + ")");
        }
        double t = fixedDepthTime(x, f, w, template, depth, guess, searchHalfDays);
        if (Double.isNaN(t)) {
            return Result.failed(String.format(Locale.ROOT,
                    "template fit: minimum not found within ±%.1f min of the expected time", searchHalfDays * 1440));
        }
        double a = fixedDepthBaseline(x, f, w, template, depth, t);
        double[][] fisher = new double[2][2];
        double chi2 = 0;
        double[] model = new double[n];
        for (int i = 0; i < n; i++) {
            double psi = template.value(x[i] - t);
            model[i] = a * (1 - depth * psi);
            double r = f[i] - model[i];
            chi2 += w[i] * r * r;
            double[] grad = {1 - depth * psi, a * depth * template.slope(x[i] - t)};
            for (int p = 0; p < 2; p++) {
                for (int q = 0; q < 2; q++) {
                    fisher[p][q] += w[i] * grad[p] * grad[q];
                }
            }
        }
        double det = fisher[0][0] * fisher[1][1] - fisher[0][1] * fisher[1][0];
        if (!(det > 0)) {
            return Result.failed("template fit: the time of minimum is not constrained by the covered part");
        }
        double red = chi2 / (n - 2);
        double sigmaFit = Math.sqrt(fisher[0][0] / det * red);
        double shift = 0;
        if (depthSigma > 0) {
            double up = fixedDepthTime(x, f, w, template, depth + depthSigma, t, searchHalfDays);
            double down = fixedDepthTime(x, f, w, template, Math.max(1e-6, depth - depthSigma), t, searchHalfDays);
            shift = Double.isNaN(up) || Double.isNaN(down) ? Double.POSITIVE_INFINITY : Math.abs(up - down) / 2;
        }
        double sigmaT = Math.hypot(sigmaFit, shift);
        if (!Double.isFinite(sigmaT) || !(sigmaT > 0)) {
            return Result.failed("template fit: the time of minimum is not constrained by the covered part");
        }
        double sigmaA = Math.sqrt(fisher[1][1] / det * red);
        return new Result(t, sigmaT, depth * a, depth * sigmaA + depthSigma * a, model, red, null);
    }

    /** The best T for a fixed fractional depth, NaN when it lies at the edge of the search. */
    private static double fixedDepthTime(double[] x, double[] f, double[] w, MinimumTemplate template, double depth,
            double guess, double searchHalfDays) {
        double lo = guess - searchHalfDays;
        double step = 2 * searchHalfDays / (SCAN - 1);
        int best = 0;
        double bestChi2 = Double.POSITIVE_INFINITY;
        for (int j = 0; j < SCAN; j++) {
            double c = fixedDepthChi2(x, f, w, template, depth, lo + j * step);
            if (c < bestChi2) {
                bestChi2 = c;
                best = j;
            }
        }
        if (best == 0 || best == SCAN - 1) {
            return Double.NaN;
        }
        return new BrentOptimizer(1e-12, 1e-9 * step).optimize(new MaxEval(200),
                new UnivariateObjectiveFunction(tt -> fixedDepthChi2(x, f, w, template, depth, tt)),
                GoalType.MINIMIZE, new SearchInterval(lo + (best - 1) * step, lo + (best + 1) * step,
                        lo + best * step)).getPoint();
    }

    private static double fixedDepthChi2(double[] x, double[] f, double[] w, MinimumTemplate template, double depth,
            double t) {
        double a = fixedDepthBaseline(x, f, w, template, depth, t);
        double sum = 0;
        for (int i = 0; i < x.length; i++) {
            double r = f[i] - a * (1 - depth * template.value(x[i] - t));
            sum += w[i] * r * r;
        }
        return sum;
    }

    /** a = Σw·f·g / Σw·g², g = 1 − D·ψ(x − T). */
    private static double fixedDepthBaseline(double[] x, double[] f, double[] w, MinimumTemplate template,
            double depth, double t) {
        double sfg = 0;
        double sgg = 0;
        for (int i = 0; i < x.length; i++) {
            double g = 1 - depth * template.value(x[i] - t);
            sfg += w[i] * f[i] * g;
            sgg += w[i] * g * g;
        }
        return sfg / sgg;
    }

    /** χ²(T) with the baseline and depth solved for. */
    static double chi2(double[] x, double[] f, double[] w, MinimumTemplate template, double t) {
        double[] ab = linear(x, f, w, template, t);
        double sum = 0;
        for (int i = 0; i < x.length; i++) {
            double r = f[i] - (ab[0] - ab[1] * template.value(x[i] - t));
            sum += w[i] * r * r;
        }
        return sum;
    }

    /** Weighted linear least squares of f = a − b·ψ(x − t); returns {a, b}. */
    private static double[] linear(double[] x, double[] f, double[] w, MinimumTemplate template, double t) {
        double sw = 0;
        double sp = 0;
        double spp = 0;
        double sf = 0;
        double spf = 0;
        for (int i = 0; i < x.length; i++) {
            double psi = template.value(x[i] - t);
            sw += w[i];
            sp += w[i] * psi;
            spp += w[i] * psi * psi;
            sf += w[i] * f[i];
            spf += w[i] * psi * f[i];
        }
        double det = sw * spp - sp * sp;
        if (!(Math.abs(det) > 0)) {
            return new double[] {sf / sw, 0};
        }
        double a = (spp * sf - sp * spf) / det;
        double slope = (sw * spf - sp * sf) / det;
        return new double[] {a, -slope};
    }
}
