package org.twinlight.timing.minima;

import org.twinlight.timing.Ephemeris;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import org.apache.commons.math3.fitting.leastsquares.LeastSquaresBuilder;
import org.apache.commons.math3.fitting.leastsquares.EvaluationRmsChecker;
import org.apache.commons.math3.fitting.leastsquares.LeastSquaresOptimizer;
import org.apache.commons.math3.fitting.leastsquares.LeastSquaresProblem;
import org.apache.commons.math3.optim.ConvergenceChecker;
import org.apache.commons.math3.fitting.leastsquares.LevenbergMarquardtOptimizer;
import org.apache.commons.math3.fitting.leastsquares.MultivariateJacobianFunction;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.ArrayRealVector;
import org.apache.commons.math3.linear.DiagonalMatrix;
import org.apache.commons.math3.linear.RealMatrix;
import org.apache.commons.math3.linear.RealVector;
import org.apache.commons.math3.linear.SingularMatrixException;
import org.apache.commons.math3.util.Pair;
import org.twinlight.WorkFailedException;

/**
 * Fits a linear ephemeris plus the light-travel-time effect of a third body (Irwin 1952, ApJ 116,
 * 211; see {@link EphemerisLightTime}) to an O−C diagram.
 *
 * <p>The outer period P₃ is found first on a logarithmic grid from a few times the typical
 * spacing of the timings to twice their span, fitting at each trial period a circular orbit, which
 * is linear in its sine and cosine amplitudes. From the best three grid periods, with e = 0.2 and
 * four arguments of periastron, the full model is fitted by Levenberg–Marquardt
 * (Commons Math; Moré 1978), a few iterations from each start and then the two best to
 * convergence, in the parameters ΔT₀, ΔP, [s], P₃, K, e·cos ω, e·sin ω, T_peri; the
 * best χ² wins. The covariance is the inverse of JᵀWJ at the optimum, scaled like the other fits.
 */
final class EphemerisLightTimeFitter {

    private static final int GRID = 300;
    private static final int CANDIDATES = 3;
    static final double MAX_ECCENTRICITY = 0.95;
    /** A start that has not converged by then is abandoned (others usually reach the optimum). */
    private static final int MAX_ITERATIONS = 150;
    /** Iterations from each start before the best starts are polished. */
    private static final int SCOUT_ITERATIONS = 25;

    private EphemerisLightTimeFitter() {
    }

    /**
     * Outer periods the timings can constrain, days: from three times the typical spacing of the
     * timings (at least one binary period), and at least a thirtieth of their span, to twice the span.
     */
    record SearchRange(double minDays, double maxDays, double spanDays) {
    }

    /** The range of outer periods searched for timings at {@code times} of a binary of period {@code periodDays}. */
    static SearchRange searchRange(double[] times, double periodDays) {
        double[] sortedTimes = times.clone();
        Arrays.sort(sortedTimes);
        int n = sortedTimes.length;
        double span = sortedTimes[n - 1] - sortedTimes[0];
        double[] gaps = new double[Math.max(1, n - 1)];
        for (int i = 1; i < n; i++) {
            gaps[i - 1] = sortedTimes[i] - sortedTimes[i - 1];
        }
        Arrays.sort(gaps);
        double typicalGap = Math.max(gaps[gaps.length / 2], periodDays);
        return new SearchRange(Math.max(3 * typicalGap, span / 30), 2 * span, span);
    }

    /** The fit, or null when the timings cannot constrain an orbit (too short a span, no convergence). */
    static EphemerisFit fit(double[] cycle, boolean[] secondary, double[] oc, double[] sigma, Ephemeris reference,
            boolean withSecondary) {
        int n = cycle.length;
        double[] times = new double[n];
        for (int i = 0; i < n; i++) {
            times[i] = reference.timeOf(cycle[i]);
        }
        double[] sortedTimes = times.clone();
        Arrays.sort(sortedTimes);
        SearchRange range = searchRange(times, reference.periodDays());
        double pMin = range.minDays();
        double pMax = range.maxDays();
        if (!(pMin < pMax)) {
            return null;
        }
        int base = withSecondary ? 3 : 2;
        double[] gridChi2 = new double[GRID];
        double[][] gridCoeff = new double[GRID][];
        for (int g = 0; g < GRID; g++) {
            double p3 = pMin * Math.pow(pMax / pMin, g / (GRID - 1.0));
            double[][] design = new double[n][base + 2];
            for (int i = 0; i < n; i++) {
                design[i][0] = 1;
                design[i][1] = cycle[i];
                if (withSecondary) {
                    design[i][2] = secondary[i] ? 1 : 0;
                }
                double x = 2 * Math.PI * (times[i] - sortedTimes[0]) / p3;
                design[i][base] = Math.sin(x);
                design[i][base + 1] = Math.cos(x);
            }
            try {
                EphemerisLeastSquares.Solution sol = EphemerisLeastSquares.solve(design, oc, sigma);
                gridChi2[g] = sol.chi2();
                gridCoeff[g] = sol.coefficients();
            } catch (WorkFailedException e) {
                gridChi2[g] = Double.POSITIVE_INFINITY;
            }
        }
        List<Integer> minima = new ArrayList<>();
        for (int g = 0; g < GRID; g++) {
            boolean left = g == 0 || gridChi2[g] <= gridChi2[g - 1];
            boolean right = g == GRID - 1 || gridChi2[g] <= gridChi2[g + 1];
            if (left && right && Double.isFinite(gridChi2[g])) {
                minima.add(g);
            }
        }
        minima.sort((a, b) -> Double.compare(gridChi2[a], gridChi2[b]));
        Problem problem = new Problem(cycle, secondary, times, reference, withSecondary, pMin);
        List<LeastSquaresOptimizer.Optimum> scouts = new ArrayList<>();
        double[] best = null;
        double bestChi2 = Double.POSITIVE_INFINITY;
        RealMatrix bestCov = null;
        for (int c = 0; c < Math.min(CANDIDATES, minima.size()); c++) {
            int g = minima.get(c);
            double p3 = pMin * Math.pow(pMax / pMin, g / (GRID - 1.0));
            double[] co = gridCoeff[g];
            double amp = Math.hypot(co[base], co[base + 1]);
            double phase0 = Math.atan2(co[base + 1], co[base]);
            for (double e0 : new double[] {0.2}) {
                for (int q = 0; q < 4; q++) {
                    double w = q * Math.PI / 2;
                    // Circular start: K·sin(M + ω) = amp·sin(x + phase0) with M = 2π(t − T_peri)/P₃.
                    double tPeri = sortedTimes[0] + (w - phase0) * p3 / (2 * Math.PI);
                    double[] start = new double[base + 5];
                    start[0] = co[0];
                    start[1] = co[1];
                    if (withSecondary) {
                        start[2] = co[2];
                    }
                    start[base] = p3;
                    start[base + 1] = Math.max(amp, 1e-7);
                    start[base + 2] = e0 * Math.cos(w);
                    start[base + 3] = e0 * Math.sin(w);
                    start[base + 4] = tPeri;
                    LeastSquaresOptimizer.Optimum opt = optimise(problem, oc, sigma, start, SCOUT_ITERATIONS);
                    if (opt != null) {
                        scouts.add(opt);
                    }
                }
            }
        }
        // Polish the two best scouting results to convergence.
        scouts.sort((a, b) -> Double.compare(a.getCost(), b.getCost()));
        for (LeastSquaresOptimizer.Optimum scout : scouts.subList(0, Math.min(2, scouts.size()))) {
            LeastSquaresOptimizer.Optimum opt = optimise(problem, oc, sigma, scout.getPoint().toArray(),
                    MAX_ITERATIONS);
            if (opt == null) {
                opt = scout;
            }
            double chi2 = opt.getCost() * opt.getCost();
            if (chi2 < bestChi2) {
                bestChi2 = chi2;
                best = problem.normalise(opt.getPoint().toArray());
                try {
                    bestCov = opt.getCovariances(1e-14);
                } catch (SingularMatrixException ex) {
                    bestCov = null;
                }
            }
        }
        if (best == null) {
            return null;
        }
        return toFit(best, bestCov, bestChi2, n, base, reference, withSecondary);
    }

    /**
     * Levenberg–Marquardt from {@code start}, stopped at convergence or after {@code iterations}
     * iterations; null when the model cannot be evaluated.
     */
    private static LeastSquaresOptimizer.Optimum optimise(Problem problem, double[] oc, double[] sigma, double[] start,
            int iterations) {
        ConvergenceChecker<LeastSquaresProblem.Evaluation> converged = new EvaluationRmsChecker(1e-10, 1e-12);
        try {
            return new LevenbergMarquardtOptimizer().optimize(new LeastSquaresBuilder()
                    .model(problem).target(oc).weight(weights(sigma)).start(start)
                    .parameterValidator(problem::validate).maxEvaluations(iterations * 4).maxIterations(iterations + 1)
                    .checker((iteration, previous, current) -> iteration >= iterations
                            || converged.converged(iteration, previous, current))
                    .lazyEvaluation(false).build());
        } catch (RuntimeException ex) {
            return null;
        }
    }

    private static RealMatrix weights(double[] sigma) {
        double[] w = new double[sigma.length];
        for (int i = 0; i < w.length; i++) {
            w[i] = 1 / (sigma[i] * sigma[i]);
        }
        return new DiagonalMatrix(w);
    }

    private static EphemerisFit toFit(double[] p, RealMatrix cov, double chi2, int n, int base, Ephemeris reference,
            boolean withSecondary) {
        int k = base + 5;
        double scale = OcAnalysis.errorScale(chi2, n, k);
        double[] sd = new double[k];
        for (int i = 0; i < k; i++) {
            sd[i] = cov == null ? Double.NaN : scale * Math.sqrt(cov.getEntry(i, i));
        }
        double h = p[base + 2];
        double kk = p[base + 3];
        double e = Math.hypot(h, kk);
        double omega = Math.toDegrees(Math.atan2(kk, h));
        omega = omega < 0 ? omega + 360 : omega;
        double sigmaE = Double.NaN;
        double sigmaOmega = Double.NaN;
        if (cov != null && e > 0) {
            double chh = cov.getEntry(base + 2, base + 2);
            double ckk = cov.getEntry(base + 3, base + 3);
            double chk = cov.getEntry(base + 2, base + 3);
            sigmaE = scale * Math.sqrt(Math.max(0, (h * h * chh + kk * kk * ckk + 2 * h * kk * chk) / (e * e)));
            sigmaOmega = scale * Math.toDegrees(Math.sqrt(Math.max(0,
                    (kk * kk * chh + h * h * ckk - 2 * h * kk * chk) / (e * e * e * e))));
        }
        EphemerisLightTime orbit = new EphemerisLightTime(p[base], p[base + 1], e, omega, p[base + 4]);
        List<EphemerisParameter> params = new ArrayList<>();
        params.add(new EphemerisParameter("epoch", reference.epochDays() + p[0], sd[0], "d"));
        params.add(new EphemerisParameter("period", reference.periodDays() + p[1], sd[1], "d"));
        double s = 0;
        if (withSecondary) {
            s = p[2];
            params.add(new EphemerisParameter("secondaryOffset", s, sd[2], "d"));
        }
        params.add(new EphemerisParameter("lightTimePeriod", p[base], sd[base], "d"));
        params.add(new EphemerisParameter("lightTimeAmplitude", p[base + 1], sd[base + 1], "d"));
        // Its uncertainty from K's alone (e and ω enter only at second order for small e).
        params.add(new EphemerisParameter("semiAmplitude", orbit.semiAmplitudeDays(),
                sd[base + 1] * orbit.semiAmplitudeDays() / p[base + 1], "d"));
        params.add(new EphemerisParameter("eccentricity", e, sigmaE, "1"));
        params.add(new EphemerisParameter("omega", omega, sigmaOmega, "deg"));
        params.add(new EphemerisParameter("periastronTime", p[base + 4], sd[base + 4], "d"));
        return new EphemerisFit(EphemerisModel.LIGHT_TIME, reference, p[0], p[1], 0, s, orbit, params, chi2, n, k,
                OcAnalysis.bic(chi2, k, n), scale, cov == null ? Double.NaN : scale * scale * cov.getEntry(0, 1));
    }

    /** The model and its numerical Jacobian (central differences). */
    private static final class Problem implements MultivariateJacobianFunction {
        private final double[] cycle;
        private final boolean[] secondary;
        private final double[] times;
        private final boolean withSecondary;
        private final int base;
        private final double pFloor;
        private final double tMid;

        Problem(double[] cycle, boolean[] secondary, double[] times, Ephemeris reference, boolean withSecondary,
                double pMin) {
            this.cycle = cycle;
            this.secondary = secondary;
            this.times = times;
            this.withSecondary = withSecondary;
            this.base = withSecondary ? 3 : 2;
            this.pFloor = pMin / 2;
            this.tMid = 0.5 * (Arrays.stream(times).min().orElse(0) + Arrays.stream(times).max().orElse(0));
            if (reference == null) {
                throw new IllegalArgumentException("reference");
            }
        }

        /** Keeps the parameters physical during the search: P₃ ≥ half the smallest grid period, e ≤ 0.95. */
        RealVector validate(RealVector v) {
            double[] p = v.toArray();
            p[base] = Math.max(p[base], pFloor);
            double e = Math.hypot(p[base + 2], p[base + 3]);
            if (e > MAX_ECCENTRICITY) {
                p[base + 2] *= MAX_ECCENTRICITY / e;
                p[base + 3] *= MAX_ECCENTRICITY / e;
            }
            return new ArrayRealVector(p, false);
        }

        /** The same orbit with K ≥ 0 (K &lt; 0 is ω + 180°) and T_peri in the orbit nearest mid-data. */
        double[] normalise(double[] point) {
            double[] p = validate(new ArrayRealVector(point)).toArray();
            if (p[base + 1] < 0) {
                p[base + 1] = -p[base + 1];
                p[base + 2] = -p[base + 2];
                p[base + 3] = -p[base + 3];
            }
            p[base + 4] -= Math.floor((p[base + 4] - tMid) / p[base] + 0.5) * p[base];
            return p;
        }

        double[] values(double[] p) {
            double e = Math.hypot(p[base + 2], p[base + 3]);
            EphemerisLightTime orbit = new EphemerisLightTime(p[base], p[base + 1], Math.min(e, MAX_ECCENTRICITY),
                    Math.toDegrees(Math.atan2(p[base + 3], p[base + 2])), p[base + 4]);
            double[] out = new double[cycle.length];
            for (int i = 0; i < cycle.length; i++) {
                out[i] = p[0] + p[1] * cycle[i] + (withSecondary && secondary[i] ? p[2] : 0)
                        + orbit.delayDays(times[i]);
            }
            return out;
        }

        @Override
        public Pair<RealVector, RealMatrix> value(RealVector point) {
            double[] p = point.toArray();
            double[] f0 = values(p);
            double[][] jac = new double[cycle.length][p.length];
            for (int i = 0; i < cycle.length; i++) {
                // The linear terms have exact derivatives.
                jac[i][0] = 1;
                jac[i][1] = cycle[i];
                if (withSecondary) {
                    jac[i][2] = secondary[i] ? 1 : 0;
                }
            }
            for (int j = base; j < p.length; j++) {
                double step = stepFor(j, p);
                double keep = p[j];
                p[j] = keep + step;
                double[] up = values(p);
                p[j] = keep - step;
                double[] down = values(p);
                p[j] = keep;
                for (int i = 0; i < cycle.length; i++) {
                    jac[i][j] = (up[i] - down[i]) / (2 * step);
                }
            }
            return new Pair<>(new ArrayRealVector(f0, false), new Array2DRowRealMatrix(jac, false));
        }

        private double stepFor(int j, double[] p) {
            if (j == base || j == base + 4) {
                return 1e-6 * p[base];
            }
            if (j == base + 2 || j == base + 3) {
                return 1e-6;
            }
            return 1e-6 * Math.max(Math.abs(p[j]), 1e-7);
        }
    }
}
