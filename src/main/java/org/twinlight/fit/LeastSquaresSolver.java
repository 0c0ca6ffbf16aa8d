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

    private LeastSquaresSolver() {
    }

    /** Minimises χ² from {@code start}. */
    static Solution optimize(WeightedResiduals objective, double[] start, int maxIterations) {
        ParameterLayout layout = objective.layout();
        if (layout.internalSize() == 0) {
            return new Solution(start.clone(), objective.chi2(start), 0, 1);
        }
        double[] steps = layout.steps();
        int m = objective.size();
        LeastSquaresProblem problem = new LeastSquaresBuilder()
                .start(start)
                .target(new double[m])
                // the Jacobian is computed only for points the solver accepts (lazy evaluation)
                .model(objective::evaluate, x -> jacobian(objective::evaluate, x, steps, m))
                .parameterValidator(p -> new ArrayRealVector(layout.validate(p.toArray()), false))
                .maxIterations(maxIterations)
                .maxEvaluations(maxIterations * 4)
                .lazyEvaluation(true)
                .build();
        try {
            LeastSquaresOptimizer.Optimum o = new LevenbergMarquardtOptimizer()
                    .withCostRelativeTolerance(1e-10)
                    .withParameterRelativeTolerance(1e-10)
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

    /** A vector function of the internal coordinates. */
    @FunctionalInterface
    interface VectorFunction {
        double[] apply(double[] x);
    }

    /** Jacobian by central differences, one column per internal coordinate, columns in parallel. */
    static double[][] jacobian(VectorFunction f, double[] x, double[] steps, int rows) {
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
            double[] col = new double[rows];
            for (int i = 0; i < rows; i++) {
                col[i] = (fp[i] - fm[i]) / (2 * h);
            }
            cols[j] = col;
        });
        double[][] jac = new double[rows][k];
        for (int j = 0; j < k; j++) {
            for (int i = 0; i < rows; i++) {
                jac[i][j] = cols[j][i];
            }
        }
        return jac;
    }
}
