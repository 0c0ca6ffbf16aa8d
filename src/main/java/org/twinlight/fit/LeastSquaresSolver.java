package org.twinlight.fit;

import java.util.stream.IntStream;
import org.apache.commons.math3.exception.ConvergenceException;
import org.apache.commons.math3.exception.TooManyEvaluationsException;
import org.apache.commons.math3.exception.TooManyIterationsException;
import org.apache.commons.math3.fitting.leastsquares.LeastSquaresBuilder;
import org.apache.commons.math3.fitting.leastsquares.LeastSquaresOptimizer;
import org.apache.commons.math3.fitting.leastsquares.LeastSquaresProblem;
import org.apache.commons.math3.fitting.leastsquares.LevenbergMarquardtOptimizer;
import org.apache.commons.math3.linear.ArrayRealVector;

/**
 * Levenberg–Marquardt minimisation of the weighted residuals (Commons Math; Moré 1978, in
 * <i>Numerical Analysis</i>, Lecture Notes in Mathematics 630, 105) in the internal coordinates of
 * a {@link ParameterLayout}, with the layout's validator keeping trial points inside the model's
 * domain and its finite-difference steps.
 *
 * <p>Above {@link #LARGE_PROBLEM_ROWS} residuals (millions of space-mission points) the same
 * Levenberg–Marquardt iteration is run on the normal equations (Marquardt 1963, J. Soc. Indust.
 * Appl. Math. 11, 431: (JᵀJ + λ·diag JᵀJ)·δ = −Jᵀr), which are built from the Jacobian's columns
 * without the n × k row copies the QR-based solver makes, so a fit of 2,000,000 points stays within
 * a 512 MB heap. For well-scaled internal coordinates the squared condition number of JᵀJ is harmless.
 */
final class LeastSquaresSolver {

    /** Where the solver stopped. */
    record Solution(double[] internal, double chi2, int iterations, int evaluations) {
    }

    /** The solver ran out of iterations or failed numerically; {@code reason} says which. */
    static final class NotConverged extends RuntimeException {
        private static final long serialVersionUID = 1L;

        NotConverged(String reason) {
            super(reason, null, false, false);
        }
    }

    /** Residual count above which the normal-equations iteration is used. */
    static final int LARGE_PROBLEM_ROWS = 300_000;

    private LeastSquaresSolver() {
    }

    /** Minimises χ² from {@code start}. */
    static Solution optimize(FitObjective objective, double[] start, int maxIterations) {
        return optimize(objective, start, maxIterations, 1e-10);
    }

    /**
     * Minimises χ² from {@code start}, stopping when an iteration lowers it by less than
     * {@code tolerance} relatively (a global search's starts need less than the final fit).
     */
    static Solution optimize(FitObjective objective, double[] start, int maxIterations, double tolerance) {
        ParameterLayout layout = objective.layout();
        if (layout.internalSize() == 0) {
            return new Solution(start.clone(), objective.chi2(start), 0, 1);
        }
        if (objective.size() > LARGE_PROBLEM_ROWS) {
            return optimizeByNormalEquations(objective::evaluate, objective.validator(start), start, layout.steps(),
                    objective.size(), maxIterations);
        }
        double[] steps = layout.steps();
        int m = objective.size();
        java.util.function.UnaryOperator<double[]> validator = objective.validator(start);
        LeastSquaresProblem problem = new LeastSquaresBuilder()
                .start(start)
                .target(new double[m])
                // the Jacobian is computed only for points the solver accepts (lazy evaluation)
                .model(objective::evaluate, x -> jacobian(objective::evaluate, x, steps, m))
                .parameterValidator(p -> new ArrayRealVector(validator.apply(p.toArray()), false))
                .maxIterations(maxIterations)
                .maxEvaluations(maxIterations * 4)
                .lazyEvaluation(true)
                .build();
        try {
            LeastSquaresOptimizer.Optimum o = new LevenbergMarquardtOptimizer()
                    .withCostRelativeTolerance(tolerance)
                    .withParameterRelativeTolerance(tolerance)
                    .withOrthoTolerance(1e-12)
                    .optimize(problem);
            double[] best = o.getPoint().toArray();
            return new Solution(best, objective.chi2(best), o.getIterations(), o.getEvaluations());
        } catch (TooManyIterationsException | TooManyEvaluationsException e) {
            throw new NotConverged("no convergence within " + maxIterations + " iterations");
        } catch (ConvergenceException e) {
            throw new NotConverged("the solver failed (" + e.getMessage() + ")");
        }
    }

    /**
     * Levenberg–Marquardt on the normal equations (Marquardt 1963): from {@code start}, minimises
     * the sum of squares of {@code f}; {@code validate} keeps each trial point in the model's domain.
     */
    static Solution optimizeByNormalEquations(VectorFunction f, java.util.function.UnaryOperator<double[]> validate,
            double[] start, double[] steps, int rows, int maxIterations) {
        int k = start.length;
        double[] x = validate.apply(start.clone());
        double[] r = f.apply(x);
        double chi2 = sumOfSquares(r);
        int evaluations = 1;
        double lambda = 1e-3;
        for (int iteration = 1; iteration <= maxIterations; iteration++) {
            Normal n = normalEquations(f, x, steps, rows, r);
            evaluations += 2 * k;
            boolean accepted = false;
            while (!accepted) {
                double[] step = dampedStep(n, lambda);
                if (step == null) {
                    lambda *= 10;
                } else {
                    double[] trial = new double[k];
                    for (int j = 0; j < k; j++) {
                        trial[j] = x[j] + step[j];
                    }
                    trial = validate.apply(trial);
                    double[] rt = f.apply(trial);
                    evaluations++;
                    double chi2t = sumOfSquares(rt);
                    if (chi2t <= chi2) {
                        boolean small = chi2 - chi2t <= 1e-10 * chi2 || maxRelativeStep(step, steps) < 1e-10;
                        x = trial;
                        r = rt;
                        chi2 = chi2t;
                        lambda = Math.max(lambda / 10, 1e-12);
                        accepted = true;
                        if (small) {
                            return new Solution(x, chi2, iteration, evaluations);
                        }
                    } else {
                        lambda *= 10;
                    }
                }
                if (lambda > 1e12) {
                    // no step lowers χ² any more: this is the minimum to the precision of the steps
                    return new Solution(x, chi2, iteration, evaluations);
                }
            }
        }
        throw new NotConverged("no convergence within " + maxIterations + " iterations");
    }

    /** JᵀJ and Jᵀr at a point, from central-difference columns of the Jacobian. */
    record Normal(double[][] jtj, double[] jtr) {
    }

    /** The normal equations at {@code x} with residuals {@code r}; the Jacobian itself is not kept. */
    static Normal normalEquations(VectorFunction f, double[] x, double[] steps, int rows, double[] r) {
        double[][] cols = columns(f, x, steps, rows);
        int k = cols.length;
        double[][] jtj = new double[k][k];
        double[] jtr = new double[k];
        IntStream.range(0, k).parallel().forEach(a -> {
            for (int b = a; b < k; b++) {
                double s = 0;
                for (int i = 0; i < rows; i++) {
                    s += cols[a][i] * cols[b][i];
                }
                jtj[a][b] = s;
                jtj[b][a] = s;
            }
            if (r != null) {
                double s = 0;
                for (int i = 0; i < rows; i++) {
                    s += cols[a][i] * r[i];
                }
                jtr[a] = s;
            }
        });
        return new Normal(jtj, jtr);
    }

    /** Solves (JᵀJ + λ·diag JᵀJ)·δ = −Jᵀr; null when the damped matrix is not positive definite. */
    private static double[] dampedStep(Normal n, double lambda) {
        int k = n.jtr().length;
        double[][] a = new double[k][k];
        for (int i = 0; i < k; i++) {
            a[i] = n.jtj()[i].clone();
            a[i][i] += lambda * Math.max(n.jtj()[i][i], 1e-300);
        }
        try {
            org.apache.commons.math3.linear.DecompositionSolver solver =
                    new org.apache.commons.math3.linear.CholeskyDecomposition(
                            new org.apache.commons.math3.linear.Array2DRowRealMatrix(a, false), 1e-14, 1e-300)
                            .getSolver();
            double[] minusG = new double[k];
            for (int i = 0; i < k; i++) {
                minusG[i] = -n.jtr()[i];
            }
            return solver.solve(new ArrayRealVector(minusG, false)).toArray();
        } catch (org.apache.commons.math3.exception.MathArithmeticException
                | org.apache.commons.math3.linear.NonPositiveDefiniteMatrixException
                | org.apache.commons.math3.linear.NonSymmetricMatrixException e) {
            return null;
        }
    }

    private static double sumOfSquares(double[] r) {
        double s = 0;
        for (double v : r) {
            s += v * v;
        }
        return s;
    }

    /** Largest step relative to its coordinate's finite-difference step. */
    private static double maxRelativeStep(double[] step, double[] steps) {
        double m = 0;
        for (int j = 0; j < step.length; j++) {
            m = Math.max(m, Math.abs(step[j]) / Math.max(steps[j], 1e-300) * 1e-2);
        }
        return m;
    }

    /** A vector function of the internal coordinates. */
    @FunctionalInterface
    interface VectorFunction {
        double[] apply(double[] x);
    }

    /** Jacobian by central differences, one column per internal coordinate, columns in parallel. */
    static double[][] jacobian(VectorFunction f, double[] x, double[] steps, int rows) {
        double[][] cols = columns(f, x, steps, rows);
        int k = cols.length;
        double[][] jac = new double[rows][k];
        for (int j = 0; j < k; j++) {
            for (int i = 0; i < rows; i++) {
                jac[i][j] = cols[j][i];
            }
        }
        return jac;
    }

    /** The Jacobian's columns by central differences, computed in parallel. */
    private static double[][] columns(VectorFunction f, double[] x, double[] steps, int rows) {
        int k = x.length;
        double[][] cols = new double[k][];
        IntStream.range(0, k).parallel().forEach(j -> {
            double h = steps[j];
            double[] xp = x.clone();
            xp[j] += h;
            double[] xm = x.clone();
            xm[j] -= h;
            double[] fp = f.apply(xp);
            double[] fm = f.apply(xm);
            for (int i = 0; i < rows; i++) {
                fp[i] = (fp[i] - fm[i]) / (2 * h);
            }
            cols[j] = fp;
        });
        return cols;
    }
}
