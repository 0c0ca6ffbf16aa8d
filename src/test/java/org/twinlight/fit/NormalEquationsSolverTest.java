package org.twinlight.fit;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.Random;
import org.apache.commons.math3.fitting.leastsquares.LeastSquaresBuilder;
import org.apache.commons.math3.fitting.leastsquares.LevenbergMarquardtOptimizer;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.ArrayRealVector;
import org.apache.commons.math3.util.Pair;
import org.junit.jupiter.api.Test;

/**
 * The normal-equations Levenberg–Marquardt iteration used for millions of points must reach the
 * same minimum as Commons Math's QR-based Levenberg–Marquardt optimizer (a general-purpose library,
 * the independent reference here) on a nonlinear problem: a Gaussian dip with a sloping baseline.
 */
class NormalEquationsSolverTest {

    private static double[] residuals(double[] p, double[] t, double[] y) {
        double[] r = new double[t.length];
        for (int i = 0; i < t.length; i++) {
            double d = (t[i] - p[2]) / p[3];
            r[i] = p[0] + p[4] * t[i] - p[1] * Math.exp(-0.5 * d * d) - y[i];
        }
        return r;
    }

    @Test
    void reachesTheSameMinimumAsTheLibraryOptimizer() {
        Random random = new Random(7);
        int n = 4000;
        double[] t = new double[n];
        double[] y = new double[n];
        double[] truth = {1.0, 0.3, 0.52, 0.04, 0.01};
        for (int i = 0; i < n; i++) {
            t[i] = i / (double) n;
            y[i] = -residuals(truth, new double[] {t[i]}, new double[] {0})[0] + 0.002 * random.nextGaussian();
        }
        double[] start = {0.98, 0.2, 0.5, 0.06, 0.0};
        double[] steps = {1e-6, 1e-6, 1e-6, 1e-6, 1e-6};
        LeastSquaresSolver.Solution ours = LeastSquaresSolver.optimizeByNormalEquations(p -> residuals(p, t, y),
                p -> p, start, steps, n, 200);

        LeastSquaresBuilder b = new LeastSquaresBuilder().start(start).target(new double[n]).maxIterations(200)
                .maxEvaluations(1000).model(p -> {
                    double[] x = p.toArray();
                    double[] r = residuals(x, t, y);
                    double[][] jac = LeastSquaresSolver.jacobian(q -> residuals(q, t, y), x, steps, n);
                    return new Pair<>(new ArrayRealVector(r, false), new Array2DRowRealMatrix(jac, false));
                });
        double[] reference = new LevenbergMarquardtOptimizer().optimize(b.build()).getPoint().toArray();
        for (int j = 0; j < start.length; j++) {
            assertThat(ours.internal()[j]).as("parameter " + j).isCloseTo(reference[j], within(1e-6));
        }
        double referenceChi2 = 0;
        for (double v : residuals(reference, t, y)) {
            referenceChi2 += v * v;
        }
        assertThat(ours.chi2()).isCloseTo(referenceChi2, within(1e-9 * referenceChi2));
    }
}
