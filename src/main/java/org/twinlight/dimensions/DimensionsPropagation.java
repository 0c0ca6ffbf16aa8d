package org.twinlight.dimensions;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.EnumMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.NonPositiveDefiniteMatrixException;
import org.apache.commons.math3.linear.RealMatrix;
import org.apache.commons.math3.linear.RectangularCholeskyDecomposition;
import org.apache.commons.math3.random.RandomGenerator;
import org.apache.commons.math3.random.Well19937c;

/**
 * Propagates the uncertainties of the elements into the absolute dimensions by sampling:
 * multivariate normal draws of the elements with their covariance (the root from a rectangular
 * Cholesky decomposition, so fixed elements with zero variance are allowed), each turned into
 * dimensions; the spread of the results is the uncertainty. Draws that leave the physical range
 * (e ≥ 1 or &lt; 0, K ≤ 0, a radius ≤ 0, a temperature ≤ 0) are dropped and counted. First-order
 * (linear) errors are computed beside, from central-difference derivatives.
 */
public final class DimensionsPropagation {

    /** Pivots below this (in correlation units) end the root: perfectly correlated elements. */
    private static final double ROOT_TOLERANCE = 1e-10;

    private DimensionsPropagation() {
    }

    /**
     * The result.
     *
     * @param central dimensions at the central elements
     * @param estimates every quantity that could be computed
     * @param draws number of draws requested
     * @param rejected draws dropped as unphysical
     * @param notes what the reader should know (dropped draws)
     */
    public record Result(AbsoluteDimensions central, Map<Quantity, DimensionEstimate> estimates, int draws,
            int rejected, List<String> notes) {
    }

    /**
     * Propagates.
     *
     * @param central the elements' values
     * @param covariance their covariance, in the order of {@link BinaryElements#NAMES}; rows of
     *     zeros for exact or unused elements
     * @param draws number of draws (≥ 100)
     * @param seed seed of the random numbers (the same seed gives the same result)
     * @throws IllegalArgumentException when the central elements cannot give dimensions or the
     *     covariance is not a covariance
     */
    public static Result propagate(BinaryElements central, double[][] covariance, int draws, long seed) {
        AbsoluteDimensions centre = AbsoluteDimensions.of(central);
        double[] mean = central.toVector();
        int[] uncertain = uncertainIndices(mean, covariance);
        double[][] root = root(covariance, uncertain);
        int nq = Quantity.values().length;
        double[][] samples = new double[nq][draws];
        int kept = 0;
        int rejected = 0;
        RandomGenerator rng = new Well19937c(seed);
        double[] x = new double[mean.length];
        double[] z = new double[root.length == 0 ? 0 : root[0].length];
        double[] out = new double[nq];
        for (int d = 0; d < draws; d++) {
            for (int k = 0; k < z.length; k++) {
                z[k] = rng.nextGaussian();
            }
            System.arraycopy(mean, 0, x, 0, mean.length);
            for (int i = 0; i < uncertain.length; i++) {
                double s = 0;
                for (int k = 0; k < z.length; k++) {
                    s += root[i][k] * z[k];
                }
                x[uncertain[i]] += s;
            }
            BinaryElements el = BinaryElements.fromVector(x);
            if (el.problem() != null) {
                rejected++;
                continue;
            }
            Arrays.fill(out, Double.NaN);
            AbsoluteDimensions.fill(el, out);
            for (int q = 0; q < nq; q++) {
                samples[q][kept] = out[q];
            }
            kept++;
        }
        if (kept < Math.max(10, draws / 2)) {
            throw new IllegalArgumentException("only " + kept + " of " + draws + " draws of the elements are "
                    + "physical (e in [0, 1), K, radii and temperatures > 0): the uncertainties are too large for "
                    + "dimensions to mean anything");
        }
        double[] firstOrder = firstOrder(central, covariance, uncertain);
        Map<Quantity, DimensionEstimate> estimates = new EnumMap<>(Quantity.class);
        for (Quantity q : Quantity.values()) {
            double value = centre.get(q);
            if (Double.isNaN(value)) {
                continue;
            }
            double[] s = Arrays.copyOf(samples[q.ordinal()], kept);
            estimates.put(q, new DimensionEstimate(q, value, standardDeviation(s), percentile(s, 0.15865525),
                    percentile(s, 0.84134475), firstOrder[q.ordinal()]));
        }
        List<String> notes = new ArrayList<>();
        if (rejected > 0) {
            notes.add(String.format(Locale.ROOT, "%d of %d draws of the elements were unphysical (e outside [0, 1), "
                    + "K, a radius or a temperature <= 0) and were dropped%s", rejected, draws,
                    rejected > 0.05 * draws ? "; with so many dropped the errors of quantities that depend on them "
                            + "are understated: treat them as lower limits" : ""));
        }
        return new Result(centre, estimates, draws, rejected, notes);
    }

    private static int[] uncertainIndices(double[] mean, double[][] cov) {
        int n = mean.length;
        if (cov.length != n) {
            throw new IllegalArgumentException("covariance must be " + n + " x " + n + ", got " + cov.length + " rows");
        }
        List<Integer> idx = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            if (cov[i].length != n) {
                throw new IllegalArgumentException("covariance row " + i + " has " + cov[i].length + " entries");
            }
            if (!(cov[i][i] >= 0) || !Double.isFinite(cov[i][i])) {
                throw new IllegalArgumentException("variance of " + BinaryElements.NAMES.get(i)
                        + " must be finite and >= 0, got " + cov[i][i]);
            }
            if (cov[i][i] > 0 && !Double.isNaN(mean[i])) {
                idx.add(i);
            }
        }
        return idx.stream().mapToInt(Integer::intValue).toArray();
    }

    private static double[][] root(double[][] cov, int[] idx) {
        if (idx.length == 0) {
            return new double[0][0];
        }
        // decompose the correlation matrix, not the covariance: the variances span 20 orders of
        // magnitude (a period known to 1e-7 d beside a temperature known to 100 K), which a
        // tolerance on the covariance itself cannot serve
        int n = idx.length;
        double[] sigma = new double[n];
        for (int i = 0; i < n; i++) {
            sigma[i] = Math.sqrt(cov[idx[i]][idx[i]]);
        }
        RealMatrix m = new Array2DRowRealMatrix(n, n);
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                m.setEntry(i, j, 0.5 * (cov[idx[i]][idx[j]] + cov[idx[j]][idx[i]]) / (sigma[i] * sigma[j]));
            }
        }
        try {
            double[][] root = new RectangularCholeskyDecomposition(m, ROOT_TOLERANCE).getRootMatrix().getData();
            for (int i = 0; i < n; i++) {
                for (int k = 0; k < root[i].length; k++) {
                    root[i][k] *= sigma[i];
                }
            }
            return root;
        } catch (NonPositiveDefiniteMatrixException e) {
            throw new IllegalArgumentException("the covariance of the elements is not positive semi-definite "
                    + "(a correlation outside [-1, 1], or inconsistent correlations)", e);
        }
    }

    /** √(J C Jᵀ) per quantity, J by central differences with steps of 1e-3 σ. */
    private static double[] firstOrder(BinaryElements central, double[][] cov, int[] idx) {
        int nq = Quantity.values().length;
        double[] mean = central.toVector();
        double[][] jac = new double[idx.length][];
        for (int a = 0; a < idx.length; a++) {
            int i = idx[a];
            double h = 1e-3 * Math.sqrt(cov[i][i]);
            double[] up = mean.clone();
            double[] down = mean.clone();
            up[i] += h;
            down[i] -= h;
            double[] vu = evaluate(up);
            double[] vd = evaluate(down);
            jac[a] = new double[nq];
            for (int q = 0; q < nq; q++) {
                jac[a][q] = (vu[q] - vd[q]) / (2 * h);
            }
        }
        double[] out = new double[nq];
        for (int q = 0; q < nq; q++) {
            double s = 0;
            for (int a = 0; a < idx.length; a++) {
                for (int b = 0; b < idx.length; b++) {
                    s += jac[a][q] * cov[idx[a]][idx[b]] * jac[b][q];
                }
            }
            out[q] = Math.sqrt(Math.max(0, s));
        }
        return out;
    }

    private static double[] evaluate(double[] v) {
        double[] out = new double[Quantity.values().length];
        Arrays.fill(out, Double.NaN);
        BinaryElements el = BinaryElements.fromVector(v);
        if (el.problem() == null) {
            AbsoluteDimensions.fill(el, out);
        }
        return out;
    }

    private static double standardDeviation(double[] s) {
        double mean = 0;
        for (double v : s) {
            mean += v;
        }
        mean /= s.length;
        double ss = 0;
        for (double v : s) {
            ss += (v - mean) * (v - mean);
        }
        return Math.sqrt(ss / (s.length - 1));
    }

    /** Linear interpolation between order statistics; sorts {@code s}. */
    private static double percentile(double[] s, double p) {
        Arrays.sort(s);
        double pos = p * (s.length - 1);
        int lo = (int) Math.floor(pos);
        int hi = Math.min(lo + 1, s.length - 1);
        return s[lo] + (pos - lo) * (s[hi] - s[lo]);
    }
}
