package org.twinlight.statistics;

import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.RealMatrix;
import org.apache.commons.math3.linear.SingularValueDecomposition;

/**
 * The covariance of least-squares parameters, (JᵀJ)⁻¹ times the variance scale, J the Jacobian of
 * the weighted residuals at the optimum. Inverted by singular value decomposition; when the
 * smallest singular value is below {@link #SINGULAR_RATIO} of the largest, the data cannot
 * determine one combination of the parameters and {@link Degenerate} says which.
 */
public final class Covariance {
    /** Relative size of the smallest singular value below which JᵀJ counts as singular. */
    public static final double SINGULAR_RATIO = 1e-14;

    private Covariance() {
    }

    /** JᵀJ has a direction the data do not determine. */
    public static final class Degenerate extends RuntimeException {
        private static final long serialVersionUID = 1L;
        private final double[] direction;

        Degenerate(double[] direction) {
            super("singular normal matrix", null, false, false);
            this.direction = direction.clone();
        }

        /** The unit vector in parameter space along which χ² does not change. */
        public double[] direction() {
            return direction.clone();
        }

        /** Indices of the parameters taking part in that direction (component above 0.2 in size). */
        public int[] involved() {
            return java.util.stream.IntStream.range(0, direction.length).filter(i -> Math.abs(direction[i]) > 0.2)
                    .toArray();
        }
    }

    /**
     * (JᵀJ)⁻¹ · scale.
     *
     * @throws Degenerate when JᵀJ is singular
     */
    public static double[][] fromNormalMatrix(double[][] jtj, double varianceScale) {
        if (jtj.length == 0) {
            return new double[0][0];
        }
        SingularValueDecomposition svd = new SingularValueDecomposition(new Array2DRowRealMatrix(jtj, true));
        double[] sv = svd.getSingularValues();
        if (!(sv[sv.length - 1] > sv[0] * SINGULAR_RATIO)) {
            throw new Degenerate(svd.getV().getColumn(sv.length - 1));
        }
        RealMatrix inv = svd.getSolver().getInverse().scalarMultiply(varianceScale);
        return inv.getData();
    }

    /** JᵀJ of a Jacobian given as rows × columns. */
    public static double[][] normalMatrix(double[][] jacobian) {
        int k = jacobian.length == 0 ? 0 : jacobian[0].length;
        double[][] out = new double[k][k];
        for (double[] row : jacobian) {
            for (int a = 0; a < k; a++) {
                for (int b = a; b < k; b++) {
                    out[a][b] += row[a] * row[b];
                }
            }
        }
        for (int a = 0; a < k; a++) {
            for (int b = 0; b < a; b++) {
                out[a][b] = out[b][a];
            }
        }
        return out;
    }
}
