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
 *
 * <p>Two refinements: the light-curve elements may come from the rows of a posterior chain
 * instead of normal draws (its non-normal shape and correlations kept), paired with normal draws
 * of what the chain does not hold (K, temperatures); and K1, K2 may follow each draw's period, e
 * and ω through a refit of the velocities (the semi-amplitudes of a fit at a fixed orbit do not
 * carry the orbit's uncertainty: for an eccentric orbit the masses' errors would be too small).
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
     * @param elementValues the elements the central dimensions come from, in the order of
     *     {@link #DRAWN}: the input's, or with velocity weights the weighted mean of the draws
     * @param elementErrors the spread of each drawn element (0 for exact ones)
     * @param effectiveDraws the effective number of draws, (Σw)²/Σw², with velocity weights; the
     *     number kept otherwise
     */
    public record Result(AbsoluteDimensions central, Map<Quantity, DimensionEstimate> estimates, int draws,
            int rejected, List<String> notes, double[] elementValues, double[] elementErrors, double effectiveDraws) {
    }

    /** The normal distribution's 1σ percentiles, Φ(−1) and Φ(1). */
    private static final double ONE_SIGMA_BELOW = 0.15865525;
    private static final double ONE_SIGMA_ABOVE = 0.84134475;

    /** Below this effective number of weighted draws a note asks for more draws. */
    public static final double FEW_EFFECTIVE_DRAWS = 500;

    /**
     * The names of the drawn elements: {@link BinaryElements#NAMES} followed by {@code omega}
     * (argument of periastron, degrees), which the dimensions do not use but the velocities'
     * semi-amplitudes do.
     */
    public static final List<String> DRAWN = java.util.stream.Stream.concat(BinaryElements.NAMES.stream(),
            java.util.stream.Stream.of("omega")).toList();

    private static final int K1 = BinaryElements.NAMES.indexOf("k1");
    private static final int K2 = BinaryElements.NAMES.indexOf("k2");
    private static final int PERIOD = BinaryElements.NAMES.indexOf("period");
    private static final int ECCENTRICITY = BinaryElements.NAMES.indexOf("eccentricity");
    private static final int OMEGA = DRAWN.indexOf("omega");

    /**
     * K1 and K2 (km/s) refitted to the velocities for an orbit other than the central one: how the
     * velocities' semi-amplitudes follow the period, e and ω drawn from the light-curve fit, and
     * how likely the velocities find that orbit.
     */
    @FunctionalInterface
    public interface SemiAmplitudesForOrbit {
        /**
         * Writes K1 and K2 for the orbit into {@code k}: the refitted values plus their errors at
         * that orbit times the standard normal deviates {@code z1}, {@code z2} (correlated as
         * their covariance says).
         *
         * @return ln of the velocities' likelihood of the orbit (K1, K2 and the rest marginalised;
         *     any constant shared by all orbits), NaN when the velocities cannot give K for it
         */
        double refit(double periodDays, double eccentricity, double omegaDeg, double z1, double z2, double[] k);
    }

    /**
     * What the errors are propagated from.
     *
     * @param central the elements' values
     * @param omegaDeg the central argument of periastron, degrees
     * @param covariance covariance of the {@link #DRAWN} elements (rows of zeros for exact or
     *     unused ones); with {@code semiAmplitudes}, its K1, K2 rows are not used
     * @param semiAmplitudes null when K1 and K2 do not depend on the orbit (given values);
     *     otherwise each draw's K is drawn from the refit at the draw's period, e and ω (so the
     *     uncertainty of the orbit enters K), and each draw is weighted by the
     *     velocities' likelihood of its orbit (importance sampling: the light curve's
     *     distribution of the orbit is the proposal, the velocities' likelihood the weight), so
     *     that what the velocities know of e and ω is used too
     * @param samples null, or rows of samples of the elements (a posterior chain), one value per
     *     {@link #DRAWN} name, NaN in a column that is not sampled; sampled columns come from the
     *     rows (with their correlations), the others from {@code covariance}
     * @param velocityOrbit what the velocities alone say of e and ω (null when unknown): with
     *     {@code semiAmplitudes} and no samples, the draws come from the light curve's
     *     distribution updated with it (a wider Gaussian near the combined one), so that few draws
     *     are wasted where the velocities exclude the orbit; the weights correct for it exactly
     */
    public record Inputs(BinaryElements central, double omegaDeg, double[][] covariance,
            SemiAmplitudesForOrbit semiAmplitudes, double[][] samples, VelocityOrbit velocityOrbit) {

        /** Without what the velocities alone say of the orbit. */
        public Inputs(BinaryElements central, double omegaDeg, double[][] covariance,
                SemiAmplitudesForOrbit semiAmplitudes, double[][] samples) {
            this(central, omegaDeg, covariance, semiAmplitudes, samples, null);
        }
    }

    /**
     * The eccentricity and argument of periastron a fit of the velocities alone gives.
     *
     * @param eccentricity e
     * @param omegaDeg ω, degrees
     * @param covariance 2 × 2 covariance of (e, ω in degrees)
     */
    public record VelocityOrbit(double eccentricity, double omegaDeg, double[][] covariance) {
    }

    /**
     * Widening of the velocities' orbit errors in the proposal: a proposal narrower than the
     * target would give a few huge weights, a wider one only costs some draws (common practice
     * in importance sampling, no source).
     */
    private static final double PROPOSAL_WIDENING = 1.5;

    /**
     * Propagates with K1 and K2 independent of the orbit and normal draws of every element.
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
        int n = BinaryElements.NAMES.size();
        if (covariance.length != n) {
            throw new IllegalArgumentException("covariance must be " + n + " x " + n + ", got " + covariance.length
                    + " rows");
        }
        double[][] cov = new double[n + 1][n + 1];
        for (int i = 0; i < n; i++) {
            if (covariance[i].length != n) {
                throw new IllegalArgumentException("covariance row " + i + " has " + covariance[i].length + " entries");
            }
            System.arraycopy(covariance[i], 0, cov[i], 0, n);
        }
        return propagate(new Inputs(central, 90.0, cov, null, null), draws, seed);
    }

    /**
     * Propagates.
     *
     * @param in the elements, their covariance or samples, and how K follows the orbit
     * @param draws number of draws (≥ 100); with samples, at most this many rows, evenly spaced
     * @param seed seed of the random numbers (the same seed gives the same result)
     * @throws IllegalArgumentException when the central elements cannot give dimensions or the
     *     covariance is not a covariance
     */
    public static Result propagate(Inputs in, int draws, long seed) {
        BinaryElements central = in.central();
        AbsoluteDimensions centre = AbsoluteDimensions.of(central);
        double[] mean = Arrays.copyOf(central.toVector(), DRAWN.size());
        mean[OMEGA] = in.omegaDeg();
        double[][] covariance = in.covariance();
        int[] uncertain = uncertainIndices(mean, covariance);
        boolean[] sampled = sampledColumns(in.samples());
        boolean refit = in.semiAmplitudes() != null;
        int[] drawnNormal = Arrays.stream(uncertain).filter(i -> !sampled[i] && !(refit && (i == K1 || i == K2)))
                .toArray();
        Proposal proposal = refit && in.samples() == null && in.velocityOrbit() != null
                ? Proposal.of(mean, covariance, in.velocityOrbit()) : null;
        double[] drawMean = proposal == null ? mean : proposal.mean;
        double[][] root = root(proposal == null ? covariance : proposal.covariance, drawnNormal);
        int total = in.samples() == null ? draws : Math.min(draws, in.samples().length);
        int nq = Quantity.values().length;
        double[][] samples = new double[nq][total];
        double[][] elements = new double[total][];
        double[] logWeights = new double[total];
        int kept = 0;
        int rejected = 0;
        RandomGenerator rng = new Well19937c(seed);
        double[] x = new double[mean.length];
        double[] z = new double[root.length == 0 ? 0 : root[0].length];
        double[] out = new double[nq];
        double[] k = new double[2];
        for (int d = 0; d < total; d++) {
            for (int j = 0; j < z.length; j++) {
                z[j] = rng.nextGaussian();
            }
            System.arraycopy(drawMean, 0, x, 0, mean.length);
            if (in.samples() != null) {
                double[] row = in.samples()[(int) ((long) d * in.samples().length / total)];
                for (int i = 0; i < x.length; i++) {
                    if (sampled[i]) {
                        x[i] = row[i];
                    }
                }
            }
            for (int i = 0; i < drawnNormal.length; i++) {
                double s = 0;
                for (int j = 0; j < z.length; j++) {
                    s += root[i][j] * z[j];
                }
                x[drawnNormal[i]] += s;
            }
            double logWeight = refit ? withOrbitalK(x, in.semiAmplitudes(), rng.nextGaussian(), rng.nextGaussian(), k)
                    : 0.0;
            if (proposal != null) {
                logWeight += proposal.logDensityRatio(x);
            }
            BinaryElements el = BinaryElements.fromVector(x);
            if (Double.isNaN(logWeight) || el.problem() != null) {
                rejected++;
                continue;
            }
            Arrays.fill(out, Double.NaN);
            AbsoluteDimensions.fill(el, out);
            for (int q = 0; q < nq; q++) {
                samples[q][kept] = out[q];
            }
            elements[kept] = x.clone();
            logWeights[kept] = logWeight;
            kept++;
        }
        if (kept < Math.max(10, total / 2)) {
            throw new IllegalArgumentException("only " + kept + " of " + total + " draws of the elements are "
                    + "physical (e in [0, 1), K, radii and temperatures > 0): the uncertainties are too large for "
                    + "dimensions to mean anything");
        }
        double[] w = weights(logWeights, kept, in.semiAmplitudes() != null);
        double effective = effectiveCount(w);
        double[][] elementCov = weightedCovariance(elements, w, kept);
        double[] elementMean = weightedMean(elements, w, kept);
        double[] centreVector = mean;
        double[][] firstOrderCov = covariance;
        AbsoluteDimensions centreDims = centre;
        if (in.semiAmplitudes() != null) {
            // the velocities moved the orbit (and with it K): the centre and the linear propagation
            // follow the weighted draws, whose covariance combines the light curve and the velocities
            centreVector = elementMean;
            firstOrderCov = elementCov;
            BinaryElements weightedCentre = BinaryElements.fromVector(centreVector);
            if (weightedCentre.problem() == null) {
                centreDims = AbsoluteDimensions.of(weightedCentre);
            }
        }
        double[] firstOrder = firstOrder(centreVector, firstOrderCov, uncertainIndices(centreVector, firstOrderCov));
        Map<Quantity, DimensionEstimate> estimates = new EnumMap<>(Quantity.class);
        for (Quantity q : Quantity.values()) {
            double value = centreDims.get(q);
            if (Double.isNaN(value)) {
                continue;
            }
            double[] s = Arrays.copyOf(samples[q.ordinal()], kept);
            double sd = Math.sqrt(weightedVariance(s, w));
            double[] band = refit ? weightedPercentiles(s, w, ONE_SIGMA_BELOW, ONE_SIGMA_ABOVE)
                    : percentiles(s, ONE_SIGMA_BELOW, ONE_SIGMA_ABOVE);
            estimates.put(q, new DimensionEstimate(q, value, sd, band[0], band[1], firstOrder[q.ordinal()]));
        }
        List<String> notes = new ArrayList<>();
        if (rejected > 0) {
            notes.add(String.format(Locale.ROOT, "%d of %d draws of the elements were unphysical (e outside [0, 1), "
                    + "K, a radius or a temperature <= 0)%s and were dropped%s", rejected, total,
                    in.semiAmplitudes() != null ? " or gave no K from the velocities" : "",
                    rejected > 0.05 * total ? "; with so many dropped the errors of quantities that depend on them "
                            + "are understated: treat them as lower limits" : ""));
        }
        if (in.semiAmplitudes() != null && effective < FEW_EFFECTIVE_DRAWS) {
            notes.add(String.format(Locale.ROOT, "the velocities pin the orbit (e, omega, period) much more tightly "
                    + "than the light curve: weighted by the velocities, the %d draws count as only %.0f, so the "
                    + "errors are themselves uncertain by about %.0f%%; raise --draws", kept, effective,
                    100 / Math.sqrt(2 * Math.max(1, effective))));
        }
        double[] elementErrors = new double[elementCov.length];
        for (int i = 0; i < elementErrors.length; i++) {
            elementErrors[i] = Math.sqrt(Math.max(0, elementCov[i][i]));
        }
        return new Result(centreDims, estimates, total, rejected, notes, centreVector.clone(), elementErrors,
                effective);
    }

    /**
     * The light curve's normal distribution of the elements updated with the velocities' (widened)
     * information on e and ω: the Gaussian conditioning (Kalman) update x' = x + G(v − x_o),
     * C' = C − G C_o·, G = C_·o (C_oo + R)⁻¹, over the orbit elements o the light curve leaves
     * uncertain. Draws from it are weighted by N(x_o; light curve)/N(x_o; proposal); the other
     * elements' conditional distribution given o is the same in both and cancels.
     */
    private static final class Proposal {
        final double[] mean;
        final double[][] covariance;
        private final int[] orbit;
        private final double[] lcMean;
        private final org.apache.commons.math3.linear.RealMatrix lcInverse;
        private final org.apache.commons.math3.linear.RealMatrix proposalInverse;
        private final double logDetRatio;

        private Proposal(double[] mean, double[][] covariance, int[] orbit, double[] lcMean, RealMatrix lcInverse,
                RealMatrix proposalInverse, double logDetRatio) {
            this.mean = mean;
            this.covariance = covariance;
            this.orbit = orbit;
            this.lcMean = lcMean;
            this.lcInverse = lcInverse;
            this.proposalInverse = proposalInverse;
            this.logDetRatio = logDetRatio;
        }

        static Proposal of(double[] mean, double[][] cov, VelocityOrbit v) {
            int[] candidates = {ECCENTRICITY, OMEGA};
            int[] orbit = Arrays.stream(candidates).filter(i -> cov[i][i] > 0).toArray();
            if (orbit.length == 0) {
                return null;
            }
            int m = orbit.length;
            double omega = v.omegaDeg() + 360 * Math.rint((mean[OMEGA] - v.omegaDeg()) / 360);
            double[] observed = {v.eccentricity(), omega};
            RealMatrix s = new Array2DRowRealMatrix(m, m);
            double[] innovation = new double[m];
            for (int a = 0; a < m; a++) {
                innovation[a] = observed[orbit[a] == ECCENTRICITY ? 0 : 1] - mean[orbit[a]];
                for (int b = 0; b < m; b++) {
                    int ra = orbit[a] == ECCENTRICITY ? 0 : 1;
                    int rb = orbit[b] == ECCENTRICITY ? 0 : 1;
                    s.setEntry(a, b, cov[orbit[a]][orbit[b]]
                            + PROPOSAL_WIDENING * PROPOSAL_WIDENING * v.covariance()[ra][rb]);
                }
            }
            RealMatrix sInverse;
            try {
                sInverse = new org.apache.commons.math3.linear.LUDecomposition(s).getSolver().getInverse();
            } catch (org.apache.commons.math3.linear.SingularMatrixException e) {
                return null;
            }
            int n = mean.length;
            double[][] gain = new double[n][m];
            for (int i = 0; i < n; i++) {
                for (int b = 0; b < m; b++) {
                    double g = 0;
                    for (int a = 0; a < m; a++) {
                        g += cov[i][orbit[a]] * sInverse.getEntry(a, b);
                    }
                    gain[i][b] = g;
                }
            }
            double[] newMean = mean.clone();
            double[][] newCov = new double[n][n];
            for (int i = 0; i < n; i++) {
                for (int a = 0; a < m; a++) {
                    newMean[i] += gain[i][a] * innovation[a];
                }
                for (int j = 0; j < n; j++) {
                    double c = cov[i][j];
                    for (int a = 0; a < m; a++) {
                        c -= gain[i][a] * cov[orbit[a]][j];
                    }
                    newCov[i][j] = c;
                }
            }
            // symmetrise and keep variances ≥ 0 against rounding
            for (int i = 0; i < n; i++) {
                newCov[i][i] = Math.max(0, newCov[i][i]);
                for (int j = 0; j < i; j++) {
                    double avg = 0.5 * (newCov[i][j] + newCov[j][i]);
                    newCov[i][j] = avg;
                    newCov[j][i] = avg;
                }
            }
            RealMatrix lc = block(cov, orbit);
            RealMatrix prop = block(newCov, orbit);
            try {
                org.apache.commons.math3.linear.LUDecomposition lcLu = new org.apache.commons.math3.linear.LUDecomposition(lc);
                org.apache.commons.math3.linear.LUDecomposition propLu =
                        new org.apache.commons.math3.linear.LUDecomposition(prop);
                double logDetRatio = Math.log(propLu.getDeterminant()) - Math.log(lcLu.getDeterminant());
                if (!Double.isFinite(logDetRatio)) {
                    return null;
                }
                double[] lcMean = new double[m];
                for (int a = 0; a < m; a++) {
                    lcMean[a] = mean[orbit[a]];
                }
                return new Proposal(newMean, newCov, orbit, lcMean, lcLu.getSolver().getInverse(),
                        propLu.getSolver().getInverse(), logDetRatio);
            } catch (org.apache.commons.math3.linear.SingularMatrixException e) {
                return null;
            }
        }

        private static RealMatrix block(double[][] cov, int[] idx) {
            RealMatrix b = new Array2DRowRealMatrix(idx.length, idx.length);
            for (int a = 0; a < idx.length; a++) {
                for (int c = 0; c < idx.length; c++) {
                    b.setEntry(a, c, cov[idx[a]][idx[c]]);
                }
            }
            return b;
        }

        /** ln N(x_o; light curve) − ln N(x_o; proposal). */
        double logDensityRatio(double[] x) {
            int m = orbit.length;
            double[] dl = new double[m];
            double[] dp = new double[m];
            for (int a = 0; a < m; a++) {
                dl[a] = x[orbit[a]] - lcMean[a];
                dp[a] = x[orbit[a]] - mean[orbit[a]];
            }
            return -0.5 * (quadratic(lcInverse, dl) - quadratic(proposalInverse, dp)) + 0.5 * logDetRatio;
        }

        private static double quadratic(RealMatrix inverse, double[] d) {
            double q = 0;
            for (int a = 0; a < d.length; a++) {
                for (int b = 0; b < d.length; b++) {
                    q += d[a] * inverse.getEntry(a, b) * d[b];
                }
            }
            return q;
        }
    }

    /** Normalised weights exp(ln w − max ln w); all 1 without velocity weights. */
    private static double[] weights(double[] logWeights, int n, boolean weighted) {
        double[] w = new double[n];
        if (!weighted) {
            Arrays.fill(w, 1.0);
            return w;
        }
        double max = Double.NEGATIVE_INFINITY;
        for (int i = 0; i < n; i++) {
            max = Math.max(max, logWeights[i]);
        }
        for (int i = 0; i < n; i++) {
            w[i] = Math.exp(logWeights[i] - max);
        }
        return w;
    }

    /** Kish's effective sample size (Σw)²/Σw² (Kish 1965, <i>Survey Sampling</i>, §11.7). */
    private static double effectiveCount(double[] w) {
        double sum = 0;
        double sumSq = 0;
        for (double v : w) {
            sum += v;
            sumSq += v * v;
        }
        return sum * sum / sumSq;
    }

    private static double[] weightedMean(double[][] rows, double[] w, int n) {
        int m = rows[0].length;
        double[] mean = new double[m];
        double total = 0;
        for (int i = 0; i < n; i++) {
            total += w[i];
            for (int j = 0; j < m; j++) {
                mean[j] += w[i] * rows[i][j];
            }
        }
        for (int j = 0; j < m; j++) {
            mean[j] /= total;
        }
        return mean;
    }

    /** Weighted covariance of the rows (NaN columns give NaN; callers look at finite ones only). */
    private static double[][] weightedCovariance(double[][] rows, double[] w, int n) {
        double[] mean = weightedMean(rows, w, n);
        int m = mean.length;
        double[][] cov = new double[m][m];
        double total = 0;
        double totalSq = 0;
        for (int i = 0; i < n; i++) {
            total += w[i];
            totalSq += w[i] * w[i];
            for (int a = 0; a < m; a++) {
                double da = rows[i][a] - mean[a];
                for (int b = a; b < m; b++) {
                    cov[a][b] += w[i] * da * (rows[i][b] - mean[b]);
                }
            }
        }
        // the unbiased form for reliability weights: Σw / ((Σw)² − Σw²)
        double norm = total / (total * total - totalSq);
        for (int a = 0; a < m; a++) {
            for (int b = a; b < m; b++) {
                double v = Double.isNaN(cov[a][b]) ? 0.0 : cov[a][b] * norm;
                cov[a][b] = v;
                cov[b][a] = v;
            }
        }
        return cov;
    }

    /** Which of the {@link #DRAWN} columns the samples carry (any finite value in the column). */
    private static boolean[] sampledColumns(double[][] samples) {
        boolean[] sampled = new boolean[DRAWN.size()];
        if (samples == null) {
            return sampled;
        }
        if (samples.length == 0) {
            throw new IllegalArgumentException("the samples hold no rows");
        }
        for (double[] row : samples) {
            if (row.length != sampled.length) {
                throw new IllegalArgumentException("a sample must hold " + sampled.length + " values, got " + row.length);
            }
            for (int i = 0; i < row.length; i++) {
                sampled[i] |= !Double.isNaN(row[i]);
            }
        }
        return sampled;
    }

    /**
     * Sets K1 and K2 of a drawn vector from the refit at its orbit, and returns the velocities'
     * log-likelihood of that orbit; NaN when the orbit is unphysical or the velocities give no K
     * for it.
     */
    private static double withOrbitalK(double[] x, SemiAmplitudesForOrbit semiAmplitudes, double z1, double z2,
            double[] k) {
        double e = x[ECCENTRICITY];
        if (!(x[PERIOD] > 0) || !(e >= 0 && e < 1) || !Double.isFinite(x[OMEGA])) {
            return Double.NaN;
        }
        double logLikelihood = semiAmplitudes.refit(x[PERIOD], e, x[OMEGA], z1, z2, k);
        x[K1] = k[0];
        x[K2] = k[1];
        return logLikelihood;
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
                throw new IllegalArgumentException("variance of " + DRAWN.get(i)
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
    private static double[] firstOrder(double[] mean, double[][] cov, int[] idx) {
        int nq = Quantity.values().length;
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

    /** Weighted variance with the reliability-weights correction (equal weights: the usual n − 1 form). */
    private static double weightedVariance(double[] s, double[] w) {
        double total = 0;
        double totalSq = 0;
        double mean = 0;
        for (int i = 0; i < s.length; i++) {
            total += w[i];
            totalSq += w[i] * w[i];
            mean += w[i] * s[i];
        }
        mean /= total;
        double ss = 0;
        for (int i = 0; i < s.length; i++) {
            ss += w[i] * (s[i] - mean) * (s[i] - mean);
        }
        return ss * total / (total * total - totalSq);
    }

    /** Linear interpolation between order statistics; sorts {@code s}. */
    private static double[] percentiles(double[] s, double... p) {
        Arrays.sort(s);
        double[] out = new double[p.length];
        for (int k = 0; k < p.length; k++) {
            double pos = p[k] * (s.length - 1);
            int lo = (int) Math.floor(pos);
            int hi = Math.min(lo + 1, s.length - 1);
            out[k] = s[lo] + (pos - lo) * (s[hi] - s[lo]);
        }
        return out;
    }

    /**
     * Weighted percentiles: the values where the cumulative weight, with each sample's weight
     * centred on it, reaches {@code p}; linear between neighbours (equal weights give
     * {@link #percentiles}).
     */
    private static double[] weightedPercentiles(double[] s, double[] w, double... p) {
        Integer[] order = new Integer[s.length];
        for (int i = 0; i < order.length; i++) {
            order[i] = i;
        }
        Arrays.sort(order, (a, b) -> Double.compare(s[a], s[b]));
        double total = 0;
        for (double v : w) {
            total += v;
        }
        double first = w[order[0]];
        double last = w[order[order.length - 1]];
        // positions (c_i − w_i/2 − w_1/2)/(Σw − w_1/2 − w_n/2) in [0, 1]; for equal weights i/(n−1)
        double span = total - 0.5 * first - 0.5 * last;
        double[] out = new double[p.length];
        for (int k = 0; k < p.length; k++) {
            out[k] = s[order[order.length - 1]];
            double cumulative = 0;
            double previousPos = 0;
            double previousValue = s[order[0]];
            for (int i = 0; i < order.length; i++) {
                double wi = w[order[i]];
                double pos = span > 0 ? (cumulative + 0.5 * wi - 0.5 * first) / span : 0;
                cumulative += wi;
                double value = s[order[i]];
                if (pos >= p[k]) {
                    out[k] = i == 0 || pos == previousPos ? value
                            : previousValue + (p[k] - previousPos) / (pos - previousPos) * (value - previousValue);
                    break;
                }
                previousPos = pos;
                previousValue = value;
            }
        }
        return out;
    }
}
