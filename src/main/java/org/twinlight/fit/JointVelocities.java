package org.twinlight.fit;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.ArrayRealVector;
import org.apache.commons.math3.linear.QRDecomposition;
import org.apache.commons.math3.linear.RealMatrix;
import org.twinlight.BadInputException;
import org.twinlight.eclipse.BinaryParameters;
import org.twinlight.orbit.RadialVelocityCurve;
import org.twinlight.statistics.FitStatistics;
import org.twinlight.velocity.StarVelocities;
import org.twinlight.velocity.VelocityData;
import org.twinlight.velocity.VelocityParameters;

/**
 * The radial velocities of a joint fit: one or more velocity files, the errors used for each
 * measurement, and the velocity parameters the fit adds to the light curve's — K1, K2, the
 * systemic velocity γ (on the scale of the first instrument of the first file) and one offset
 * per further instrument (named {@code offset.INSTRUMENT}, the file's name for a file without an
 * instrument column). Period, epoch, e and ω are the light curve's.
 *
 * <p>Starting values come from a velocity-only fit with the model's period, epoch, e and ω held:
 * the model is then linear in K1, K2, γ and the offsets, so it is solved exactly by weighted
 * linear least squares (QR). A star without stated errors gets the RMS of its residuals from an
 * unweighted first solution (scaled by √(n/(n−p)) for the fitted quantities) as its error, as
 * the velocities command does. Without velocities of star 2, K2 is held fixed (its value is a
 * placeholder the data do not touch) and a note says so.
 */
public final class JointVelocities {
    /** Names of the velocity parameters before the offsets. */
    static final List<String> MAIN_NAMES = List.of("k1", "k2", "gamma");
    /** Smallest scale of a velocity parameter, km/s (the finite-difference step is 1% of it). */
    private static final double MIN_SCALE_KMS = 1e-3;

    private final List<VelocityData> files;
    private final double[][] sigma1;
    private final double[][] sigma2;
    /** Per file, per instrument: index into the offsets (−1 for the reference instrument). */
    private final int[][] offsetOf;
    private final List<String> offsetNames;
    private final double[] startValues;
    private final double[] scales;
    private final boolean doubleLined;
    private final boolean errorsEstimated;
    private final List<String> notes;

    private JointVelocities(List<VelocityData> files, double[][] sigma1, double[][] sigma2, int[][] offsetOf,
            List<String> offsetNames, double[] startValues, double[] scales, boolean doubleLined,
            boolean errorsEstimated, List<String> notes) {
        this.files = files;
        this.sigma1 = sigma1;
        this.sigma2 = sigma2;
        this.offsetOf = offsetOf;
        this.offsetNames = offsetNames;
        this.startValues = startValues;
        this.scales = scales;
        this.doubleLined = doubleLined;
        this.errorsEstimated = errorsEstimated;
        this.notes = notes;
    }

    /**
     * Prepares the velocities of a joint fit and their starting values.
     *
     * @param files the velocity files (at least one)
     * @param orbit period, epoch, e and ω of the starting light-curve model
     * @throws BadInputException when a file has no velocities of star 1, there are too few
     *     velocities for the fitted quantities, or the starting solution has a clearly negative
     *     semi-amplitude (columns of the stars swapped, or the epoch of the other eclipse)
     */
    public static JointVelocities of(List<VelocityData> files, BinaryParameters orbit) {
        if (files.isEmpty()) {
            throw new IllegalArgumentException("no velocity files");
        }
        List<String> offsetNames = new ArrayList<>();
        int[][] offsetOf = new int[files.size()][];
        boolean doubleLined = false;
        int n = 0;
        for (int f = 0; f < files.size(); f++) {
            VelocityData d = files.get(f);
            if (d.star1().size() == 0) {
                throw new BadInputException(d.source() + ": column 'v1': no velocities of star 1; the joint fit "
                        + "needs them for K1");
            }
            doubleLined |= d.star2().size() > 0;
            n += d.size();
            offsetOf[f] = new int[d.instruments().size()];
            for (int j = 0; j < offsetOf[f].length; j++) {
                if (f == 0 && j == 0) {
                    offsetOf[f][j] = -1;
                    continue;
                }
                String inst = d.instruments().get(j);
                String name = inst.isEmpty() ? baseName(d.source()) : inst;
                if (offsetNames.contains(name) || f == 0 && name.equals(files.get(0).instruments().get(0))) {
                    name = baseName(d.source()) + "/" + (inst.isEmpty() ? "default" : inst);
                }
                offsetNames.add(name);
                offsetOf[f][j] = offsetNames.size() - 1;
            }
        }
        int p = (doubleLined ? 3 : 2) + offsetNames.size();
        if (n <= p) {
            throw new BadInputException(files.get(0).source() + ": " + n + " velocities for " + p + " velocity "
                    + "quantities (K1" + (doubleLined ? ", K2" : "") + ", gamma" + (offsetNames.isEmpty() ? ""
                            : ", " + offsetNames.size() + " instrument offset(s)") + "); at least one more is needed");
        }
        double[][] s1 = new double[files.size()][];
        double[][] s2 = new double[files.size()][];
        boolean estimated = false;
        for (int f = 0; f < files.size(); f++) {
            s1[f] = statedOrOnes(files.get(f).star1());
            s2[f] = statedOrOnes(files.get(f).star2());
            estimated |= !files.get(f).star1().hasErrors() || files.get(f).star2().size() > 0
                    && !files.get(f).star2().hasErrors();
        }
        JointVelocities draft = new JointVelocities(files, s1, s2, offsetOf, List.copyOf(offsetNames),
                new double[3 + offsetNames.size()], filled(3 + offsetNames.size(), 1.0), doubleLined, estimated,
                List.of());
        RadialVelocityCurve curve = new RadialVelocityCurve(orbit.periodDays(), orbit.epochDays(),
                orbit.eccentricity(), orbit.omegaDeg());
        Linear sol = draft.solveLinear(curve);
        if (estimated) {
            for (int f = 0; f < files.size(); f++) {
                for (int star = 1; star <= 2; star++) {
                    StarVelocities sv = files.get(f).star(star);
                    if (sv.size() > 0 && !sv.hasErrors()) {
                        double[] r = draft.rawResiduals(sol.values, curve, f, star);
                        double e = FitStatistics.rms(r) * Math.sqrt((double) n / (n - p));
                        Arrays.fill(star == 1 ? s1[f] : s2[f], e > 0 ? e : 1.0);
                    }
                }
            }
            sol = draft.solveLinear(curve);
        }
        List<String> notes = new ArrayList<>();
        String k = String.format(Locale.ROOT, "K1 = %.2f ± %.2f km/s%s", sol.values[0], sol.sigmas[0], doubleLined
                ? String.format(Locale.ROOT, ", K2 = %.2f ± %.2f km/s", sol.values[1], sol.sigmas[1]) : "");
        boolean neg1 = sol.values[0] < -3 * sol.sigmas[0];
        boolean neg2 = doubleLined && sol.values[1] < -3 * sol.sigmas[1];
        if (neg1 || neg2) {
            throw new BadInputException(files.get(0).source() + ": with the light curve's period, epoch, e and omega "
                    + "the velocities give " + k + ": " + (neg1 && neg2 ? "both stars move opposite to the model's "
                            + "orbit (the velocity columns of the stars swapped, or the model's epoch that of the "
                            + "other eclipse)" : "a star moves opposite to the model's orbit (the columns 'v1' and "
                                    + "'v2' do not hold the two stars of a double-lined orbit?)")
                    + "; star 1 is the star eclipsed at primary minimum. Check --v1-column/--v2-column and the epoch");
        }
        double[] start = sol.values.clone();
        double[] scale = new double[start.length];
        for (int i = 0; i < start.length; i++) {
            scale[i] = Math.max(MIN_SCALE_KMS, Double.isFinite(sol.sigmas[i]) ? sol.sigmas[i] : 1.0);
        }
        start[0] = Math.max(start[0], scale[0]);
        if (doubleLined) {
            start[1] = Math.max(start[1], scale[1]);
        } else {
            start[1] = 0.0;
            notes.add("the velocity files give no velocities of star 2: K2 is held fixed and not determined (its "
                    + "value is a placeholder, not a measurement), so the mass ratio and the masses cannot follow");
        }
        notes.add("velocity starting values from a velocity-only fit with the light curve's period, epoch, e and "
                + "omega held: " + k);
        if (estimated) {
            notes.add("some velocity files give no errors: those velocities' errors were estimated from their scatter "
                    + "about a velocity-only fit");
        }
        return new JointVelocities(files, s1, s2, offsetOf, draft.offsetNames, start, scale, doubleLined, estimated,
                List.copyOf(notes));
    }

    /** The same velocities started from other velocity values (k1, k2, γ, offsets, in that order). */
    JointVelocities startingAt(double[] values) {
        return new JointVelocities(files, sigma1, sigma2, offsetOf, offsetNames, values.clone(), scales,
                doubleLined, errorsEstimated, notes);
    }

    /** The velocity parameters as fit parameters (K2 fixed for single-lined data), in external order. */
    List<FitParameter> parameters() {
        List<FitParameter> out = new ArrayList<>();
        for (int i = 0; i < startValues.length; i++) {
            String name = i < 3 ? MAIN_NAMES.get(i) : "offset." + offsetNames.get(i - 3);
            boolean positive = i < 2;
            out.add(new FitParameter(name, null, startValues[i], scales[i], positive ? 0 : Double.NEGATIVE_INFINITY,
                    Double.POSITIVE_INFINITY, FitParameter.Edge.NONE, i != 1 || doubleLined));
        }
        return out;
    }

    /** The velocity files. */
    public List<VelocityData> files() {
        return files;
    }

    /** Whether any file has velocities of star 2 (K2 is then fitted). */
    public boolean doubleLined() {
        return doubleLined;
    }

    /** Whether some velocity errors were estimated from the scatter. */
    public boolean errorsEstimated() {
        return errorsEstimated;
    }

    /** Remarks on the velocities: starting values, K2 held, errors estimated. */
    public List<String> notes() {
        return notes;
    }

    /** Number of velocity measurements. */
    int size() {
        return files.stream().mapToInt(VelocityData::size).sum();
    }

    /** Errors used for star {@code star}'s measurements of file {@code file}, km/s. */
    public double[] errorsKms(int file, int star) {
        return (star == 1 ? sigma1[file] : sigma2[file]).clone();
    }

    /**
     * The velocity model of file {@code file} for an orbit and the velocity values (k1, k2, γ,
     * offsets): the offsets in that file's instrument order, no jitter.
     */
    public VelocityParameters parameters(int file, double periodDays, double epochDays, double eccentricity,
            double omegaDeg, double[] velocityValues) {
        double[] off = new double[offsetOf[file].length];
        for (int j = 0; j < off.length; j++) {
            off[j] = offsetOf[file][j] < 0 ? 0.0 : velocityValues[3 + offsetOf[file][j]];
        }
        return new VelocityParameters(periodDays, epochDays, eccentricity, omegaDeg, velocityValues[0],
                velocityValues[1], velocityValues[2], off, 0.0, 0.0);
    }

    /** The velocity model of file {@code file} at the solution of a joint fit. */
    public VelocityParameters solution(FitResult r, int file) {
        double[] v = new double[startValues.length];
        for (int i = 0; i < v.length; i++) {
            v[i] = i == 1 && !doubleLined ? 0.0 : r.get(i < 3 ? MAIN_NAMES.get(i) : "offset." + offsetNames.get(i - 3))
                    .value();
        }
        return parameters(file, r.get("period").value(), r.get("epoch").value(), r.get("eccentricity").value(),
                r.get("omega").value(), v);
    }

    /** RMS of the observed − model velocities of star {@code star} over every file at a joint solution, km/s. */
    public double rmsKms(FitResult r, int star) {
        List<Double> all = new ArrayList<>();
        for (int f = 0; f < files.size(); f++) {
            VelocityParameters p = solution(r, f);
            StarVelocities s = files.get(f).star(star);
            double[] m = org.twinlight.velocity.VelocityModel.model(s, star, p);
            for (int i = 0; i < m.length; i++) {
                all.add(s.velocitiesKms()[i] - m[i]);
            }
        }
        return all.isEmpty() ? Double.NaN : FitStatistics.rms(all.stream().mapToDouble(Double::doubleValue).toArray());
    }

    /** Σ ln σ over every measurement (for the log-likelihood's normalisation). */
    double sumLogSigma() {
        double s = 0;
        for (int f = 0; f < files.size(); f++) {
            for (double e : sigma1[f]) {
                s += Math.log(e);
            }
            for (double e : sigma2[f]) {
                s += Math.log(e);
            }
        }
        return s;
    }

    private record Linear(double[] values, double[] sigmas) {
    }

    /** Weighted linear least squares for k1, k2, γ and the offsets with the orbit held. */
    private Linear solveLinear(RadialVelocityCurve curve) {
        int cols = startValues.length;
        List<double[]> rows = new ArrayList<>();
        List<Double> rhs = new ArrayList<>();
        for (int f = 0; f < files.size(); f++) {
            for (int star = 1; star <= 2; star++) {
                StarVelocities s = files.get(f).star(star);
                double[] sigma = star == 1 ? sigma1[f] : sigma2[f];
                for (int i = 0; i < s.size(); i++) {
                    double[] a = new double[cols];
                    double shape = curve.shape(s.timesDays()[i]);
                    a[star == 1 ? 0 : 1] = star == 1 ? shape : -shape;
                    a[2] = 1.0;
                    int o = offsetOf[f][s.instruments()[i]];
                    if (o >= 0) {
                        a[3 + o] = 1.0;
                    }
                    for (int c = 0; c < cols; c++) {
                        a[c] /= sigma[i];
                    }
                    rows.add(a);
                    rhs.add(s.velocitiesKms()[i] / sigma[i]);
                }
            }
        }
        int[] keep = java.util.stream.IntStream.range(0, cols).filter(c -> c != 1 || doubleLined).toArray();
        double[][] a = new double[rows.size()][keep.length];
        for (int i = 0; i < a.length; i++) {
            for (int c = 0; c < keep.length; c++) {
                a[i][c] = rows.get(i)[keep[c]];
            }
        }
        RealMatrix m = new Array2DRowRealMatrix(a, false);
        QRDecomposition qr = new QRDecomposition(m, 1e-12);
        if (!qr.getSolver().isNonSingular()) {
            throw new BadInputException(files.get(0).source() + ": the velocities cannot separate K1"
                    + (doubleLined ? ", K2" : "") + ", gamma and the instrument offsets (an instrument whose "
                    + "velocities all fall at one phase, or velocities only at conjunction?)");
        }
        double[] x = qr.getSolver().solve(new ArrayRealVector(rhs.stream().mapToDouble(Double::doubleValue)
                .toArray(), false)).toArray();
        double[][] cov = org.twinlight.statistics.Covariance.fromNormalMatrix(m.transpose().multiply(m).getData(), 1.0);
        double[] values = new double[cols];
        double[] sig = filled(cols, Double.NaN);
        for (int c = 0; c < keep.length; c++) {
            values[keep[c]] = x[c];
            sig[keep[c]] = Math.sqrt(cov[c][c]);
        }
        return new Linear(values, sig);
    }

    private double[] rawResiduals(double[] values, RadialVelocityCurve curve, int f, int star) {
        VelocityParameters p = parameters(f, curve.periodDays(), curve.epochDays(), curve.eccentricity(),
                curve.omegaDeg(), values);
        StarVelocities s = files.get(f).star(star);
        double[] m = org.twinlight.velocity.VelocityModel.model(s, star, p);
        double[] r = new double[m.length];
        for (int i = 0; i < m.length; i++) {
            r[i] = s.velocitiesKms()[i] - m[i];
        }
        return r;
    }

    private static double[] statedOrOnes(StarVelocities s) {
        return s.hasErrors() ? s.errorsKms().clone() : filled(s.size(), 1.0);
    }

    private static double[] filled(int n, double v) {
        double[] a = new double[n];
        Arrays.fill(a, v);
        return a;
    }

    /** The base name of velocity file {@code file} (no directory, no extension), for labels. */
    String fileLabel(int file) {
        return baseName(files.get(file).source());
    }

    private static String baseName(String source) {
        String n = source.substring(Math.max(source.lastIndexOf('/'), source.lastIndexOf('\\')) + 1);
        int dot = n.lastIndexOf('.');
        return dot > 0 ? n.substring(0, dot) : n;
    }
}
