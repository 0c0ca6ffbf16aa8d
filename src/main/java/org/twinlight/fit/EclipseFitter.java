package org.twinlight.fit;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.RealMatrix;
import org.apache.commons.math3.linear.SingularValueDecomposition;
import org.twinlight.WorkFailedException;
import org.twinlight.eclipse.BinaryModel;
import org.twinlight.eclipse.BinaryParameters;
import org.twinlight.eclipse.ModelFile;
import org.twinlight.photometry.RobustStatistics;
import org.twinlight.statistics.Covariance;
import org.twinlight.statistics.FitStatistics;

/**
 * Least-squares fit of the two-sphere model to one or more light curves: Levenberg–Marquardt
 * ({@link LeastSquaresSolver}) on the weighted residuals ({@link WeightedResiduals}) in the
 * internal coordinates of {@link ParameterLayout}, then outlier clipping against the model, then
 * one-sided limits for values at a physical bound ({@link BoundLimits}), covariance uncertainties
 * for the rest, and the model-adequacy checks ({@link ModelAdequacy}).
 *
 * <p>Uncertainties come from the inverse of JᵀJ at the optimum (J the Jacobian of the weighted
 * residuals, by central differences), scaled by the project's one rule
 * ({@link FitStatistics#varianceScale}: χ²ν for errors estimated from the scatter, max(1, χ²ν)
 * for stated errors), and are propagated to the
 * contract's parameters and to derived quantities by the Jacobian of that mapping.
 */
public final class EclipseFitter {
    /** Passes of clipping and refitting at most. */
    private static final int CLIP_PASSES = 5;
    /**
     * More than this fraction of points beyond the clipping level are not outliers but a model
     * that misses the data: then nothing is clipped and a note says so.
     */
    static final double MAX_CLIPPED_FRACTION = 0.01;

    private EclipseFitter() {
    }

    /** Builds the problem and solves it: {@code optimize(FitProblem.of(start, data, settings))}. */
    public static FitResult fit(ModelFile start, List<FitData> data, FitSettings settings) {
        return optimize(FitProblem.of(start, data, settings));
    }

    /** The same with priors: {@code optimize(FitProblem.of(start, data, settings, priors))}. */
    public static FitResult fit(ModelFile start, List<FitData> data, FitSettings settings, Priors priors) {
        return optimize(FitProblem.of(start, data, settings, priors));
    }

    /**
     * Solves a fit problem.
     *
     * @throws WorkFailedException when the fit does not converge or the parameters are degenerate,
     *     saying what was tried and why it failed
     */
    public static FitResult optimize(FitProblem problem) {
        FitSettings settings = problem.settings();
        FitObjective all = problem.objective();
        ParameterLayout layout = all.layout();
        double[] x0 = all.validator(layout.startInternal()).apply(layout.startInternal());
        if (all.lightCurves().eclipsedPoints(layout.toExternal(x0)) == 0) {
            throw new WorkFailedException("the starting model predicts no eclipse at any data point; check period "
                    + "and epoch (the period and minima commands find them), radii and inclination, or start "
                    + "from the data with --start auto");
        }
        Passes passes = new Passes();
        LeastSquaresSolver.Solution s = passes.solve(all, x0, settings, layout);
        FitObjective used = all;
        Map<String, Integer> clipped = new LinkedHashMap<>();
        List<String> clipNotes = new ArrayList<>();
        if (settings.clips()) {
            List<boolean[]> current = null;
            for (int pass = 0; pass < CLIP_PASSES; pass++) {
                Outliers o = outliers(all.lightCurves().curves(layout.toExternal(s.internal())), settings.clipSigma());
                if (o.fraction > MAX_CLIPPED_FRACTION) {
                    clipNotes.add(String.format(Locale.ROOT, "%.1f%% of the points lie more than %.1f robust "
                            + "standard deviations from the model: too many to be outliers, so none were clipped; "
                            + "the model probably misses part of the data", 100 * o.fraction, settings.clipSigma()));
                    used = all;
                    if (current != null) {
                        s = passes.solve(all, s.internal(), settings, layout);
                    }
                    current = null;
                    break;
                }
                if (current != null && sameFlags(current, o.leftOut)) {
                    break;
                }
                if (current == null && o.count == 0) {
                    break;
                }
                current = o.leftOut;
                used = all.withLeftOut(o.leftOut);
                s = passes.solve(used, s.internal(), settings, layout);
            }
            if (current != null) {
                used = all.withLeftOut(current);
                clipped.putAll(Outliers.byReason(current, all.lightCurves().curves(layout.toExternal(s.internal()))));
            }
        }
        double[] ext = layout.toExternal(s.internal());
        if (used.lightCurves().eclipsedPoints(ext) == 0) {
            throw new WorkFailedException("the fit ended with a model that has no eclipse at any data point (inclination "
                    + String.format(Locale.ROOT, "%.1f°", ext[ParameterLayout.INCLINATION])
                    + "): the data show no eclipse the model can follow. Check that the file holds eclipses "
                    + "(inspect, period) and that period and epoch put them where the model expects");
        }
        FitResult r = Summary.of(problem, used, s, passes.iterations, passes.evaluations, clipped);
        if (clipNotes.isEmpty()) {
            return r;
        }
        List<String> notes = new ArrayList<>(clipNotes);
        notes.addAll(r.notes());
        return new FitResult(r.model(), r.parameters(), r.derived(), r.freeNames(), r.correlation(), r.n(),
                r.freeCount(), r.chi2(), r.reducedChi2(), r.rms(), r.bic(), r.iterations(), r.evaluations(),
                r.errorsEstimated(), r.adequacy(), r.clipped(), List.copyOf(notes), r.curves());
    }

    /** Counts the solver's work over all passes and turns its failures into messages. */
    private static final class Passes {
        int iterations;
        int evaluations;

        LeastSquaresSolver.Solution solve(FitObjective objective, double[] start, FitSettings settings,
                ParameterLayout layout) {
            try {
                LeastSquaresSolver.Solution s = LeastSquaresSolver.optimize(objective, start, settings.maxIterations());
                iterations += s.iterations();
                evaluations += s.evaluations();
                return s;
            } catch (LeastSquaresSolver.NotConverged e) {
                throw new WorkFailedException("the fit stopped: " + e.getMessage() + ". It started from "
                        + describe(layout, layout.toExternal(start)) + " with free " + String.join(", ",
                        settings.free()) + " (solver coordinates: " + String.join(", ", layout.internalNames())
                        + "). Try: --start auto (starting values from the eclipses' depths, widths and the "
                        + "secondary's phase), check period and epoch first, or raise --max-iterations");
            }
        }
    }

    private static String describe(ParameterLayout layout, double[] ext) {
        List<String> parts = new ArrayList<>();
        for (int i = 0; i < layout.externalSize(); i++) {
            FitParameter p = layout.parameter(i);
            if (p.free()) {
                parts.add(p.label(layout.bands().size() > 1) + " = " + String.format(Locale.ROOT, "%.6g", ext[i]));
            }
        }
        return String.join(", ", parts);
    }

    private static boolean sameFlags(List<boolean[]> a, List<boolean[]> b) {
        for (int i = 0; i < a.size(); i++) {
            if (!Arrays.equals(a.get(i), b.get(i))) {
                return false;
            }
        }
        return true;
    }

    /** Points beyond the clipping level, per curve, against the current model. */
    private record Outliers(List<boolean[]> leftOut, int count, double fraction) {
        /** Counts of the flagged points above and below the model. */
        static Map<String, Integer> byReason(List<boolean[]> flags, List<FittedCurve> curves) {
            int above = 0;
            int below = 0;
            for (int c = 0; c < curves.size(); c++) {
                for (int i = 0; i < flags.get(c).length; i++) {
                    if (flags.get(c)[i]) {
                        if (curves.get(c).residual(i) > 0) {
                            above++;
                        } else {
                            below++;
                        }
                    }
                }
            }
            Map<String, Integer> m = new LinkedHashMap<>();
            m.put("aboveModel", above);
            m.put("belowModel", below);
            return m;
        }
    }

    /**
     * Normalised residuals (data − model)/σ of every point, centred on their median and compared
     * with k × 1.4826 × their median absolute deviation (the MAD's Gaussian consistency factor:
     * Rousseeuw &amp; Croux 1993, J. Am. Stat. Assoc. 88, 1273).
     */
    private static Outliers outliers(List<FittedCurve> curves, double k) {
        int n = curves.stream().mapToInt(FittedCurve::size).sum();
        double[] z = new double[n];
        int j = 0;
        for (FittedCurve c : curves) {
            for (int i = 0; i < c.size(); i++) {
                z[j++] = c.residual(i) / c.errors()[i];
            }
        }
        double med = RobustStatistics.median(z);
        double sigma = RobustStatistics.madSigma(z);
        List<boolean[]> flags = new ArrayList<>();
        int count = 0;
        j = 0;
        for (FittedCurve c : curves) {
            boolean[] f = new boolean[c.size()];
            for (int i = 0; i < c.size(); i++) {
                f[i] = sigma > 0 && Math.abs(z[j++] - med) > k * sigma;
                count += f[i] ? 1 : 0;
            }
            flags.add(f);
        }
        return new Outliers(flags, count, n == 0 ? 0 : count / (double) n);
    }


    /** Statistics, uncertainties, limits and checks at the optimum. */
    private static final class Summary {

        static FitResult of(FitProblem problem, FitObjective objective, LeastSquaresSolver.Solution s,
                int iterations, int evaluations, Map<String, Integer> clipped) {
            ParameterLayout layout = objective.layout();
            double[] best = s.internal();
            int m = objective.size();
            double minimised = objective.chi2(best);
            double chi2 = objective.dataChi2(best);
            int k = layout.internalSize();
            int freeCount = k + objective.nuisanceCount();
            int nUsed = objective.usedCount();
            int dof = nUsed - freeCount;
            if (dof <= 0) {
                throw new WorkFailedException("there are " + nUsed + " data points for " + freeCount
                        + " fitted quantities; fix some parameters or use more data");
            }
            double reducedChi2 = chi2 / dof;
            boolean estimated = objective.errorsEstimated();
            double varianceScale = FitStatistics.varianceScale(chi2, dof, estimated);
            double[] steps = layout.steps();
            // JᵀJ straight from the Jacobian's columns: no n × k row copies of millions of points
            RealMatrix normal = new Array2DRowRealMatrix(
                    LeastSquaresSolver.normalEquations(objective::evaluate, best, steps, m, null).jtj(), false);

            // Everything reported, as a function of the internal point: external parameters, then derived.
            double startEpoch = problem.start().common().epochDays();
            double[] extBest = layout.toExternal(best);
            long epochShift = Math.round((extBest[ParameterLayout.EPOCH] - startEpoch) / extBest[ParameterLayout.PERIOD]);
            long midCycle = Math.round((objective.lightCurves().midTime() - extBest[ParameterLayout.EPOCH])
                    / extBest[ParameterLayout.PERIOD]);
            Reported named = Reported.at(layout, extBest, epochShift, midCycle);
            double[] values = named.values();
            double[][] g = LeastSquaresSolver.jacobian(x -> Reported.at(layout, layout.toExternal(x), epochShift,
                    midCycle).values(), best, steps, values.length);
            RealMatrix gm = new Array2DRowRealMatrix(g, false);

            // Linear uncertainties (pseudo-inverse) only to decide which bounded values need a profile.
            // (when JᵀJ is near singular, as on a fold, every bounded value is profiled)
            // (in a joint fit the velocity coordinates are scaled up to the light curve's largest diagonal
            // entry first, so that a few velocities' K beside 20,000 points' radii do not look degenerate)
            SingularValueDecomposition fullSvd = new SingularValueDecomposition(normal);
            double[] fullSv = new SingularValueDecomposition(velocitiesScaled(normal, layout)).getSingularValues();
            boolean conditioned = fullSv.length > 0 && fullSv[fullSv.length - 1] > fullSv[0] * 1e-10;
            RealMatrix linear = gm.multiply(fullSvd.getSolver().getInverse()).multiply(gm.transpose())
                    .scalarMultiply(varianceScale);
            BoundLimits limits = new BoundLimits(objective, best, minimised);
            Map<Integer, BoundLimits.Profile> profiles = new HashMap<>();
            Map<String, BoundLimits.Profile> nearBound = new HashMap<>();
            List<Integer> excluded = new ArrayList<>();
            int profileFits = 0;
            for (int i = 0; i < layout.externalSize(); i++) {
                FitParameter p = layout.parameter(i);
                if (!p.free() || p.edge() == FitParameter.Edge.NONE) {
                    continue;
                }
                double sigma = Math.sqrt(Math.max(0, linear.getEntry(i, i)));
                Optional<BoundLimits.Profile> pr = limits.atBound(i, conditioned && sigma > 0 ? sigma : Double.NaN);
                pr.ifPresent(near -> nearBound.put(p.name(), near));
                profileFits += pr.map(BoundLimits.Profile::profileFits).orElse(0);
                if (pr.isPresent() && pr.get().atBound()) {
                    profiles.put(i, pr.get());
                    int c = layout.foldedCoordinate(i);
                    if (c >= 0) {
                        excluded.add(c);
                    }
                }
            }
            RealMatrix cov = covariance(normal, excluded, varianceScale, layout, problem.settings());
            RealMatrix repCov = gm.multiply(cov).multiply(gm.transpose());
            // A value reported as a limit is left out of the covariance, which then holds it fixed;
            // the others' uncertainties get back what it contributes, from the profile: the shift
            // of each reported quantity between the best fit and the profile's 68% point.
            for (BoundLimits.Profile pr : profiles.values()) {
                if (layout.foldedCoordinate(pr.index()) < 0) {
                    continue;
                }
                double[] at68 = Reported.at(layout, pr.ext68(), epochShift, midCycle).values();
                for (int a = 0; a < values.length; a++) {
                    double d = at68[a] - values[a];
                    repCov.addToEntry(a, a, d * d);
                }
            }

            int nExt = layout.externalSize();
            boolean multiBand = layout.bands().size() > 1;
            List<Estimate> params = new ArrayList<>();
            List<Integer> freeIdx = new ArrayList<>();
            List<String> freeNames = new ArrayList<>();
            for (int i = 0; i < nExt; i++) {
                FitParameter p = layout.parameter(i);
                String band = p.band() != null && multiBand ? p.band() : null;
                BoundLimits.Profile pr = profiles.get(i);
                if (pr != null) {
                    String side = p.edge() == FitParameter.Edge.UPPER ? "lower" : "upper";
                    params.add(new Estimate(p.name(), band, values[i], Math.abs(pr.at68() - values[i]), true,
                            new Estimate.Limit(side, pr.at95())));
                } else {
                    double sigma = p.free() ? Math.sqrt(Math.max(0, repCov.getEntry(i, i))) : 0.0;
                    BoundLimits.Profile near = nearBound.get(p.name());
                    if (near != null && p.band() == null) {
                        sigma = Math.max(sigma, near.sigmaTowardsBound(p.edgeValue()));
                    }
                    params.add(new Estimate(p.name(), band, values[i], sigma, p.free()));
                }
                if (p.free()) {
                    freeIdx.add(i);
                    freeNames.add(p.label(multiBand));
                }
            }
            BoundLimits.Profile inclination = profiles.get(ParameterLayout.INCLINATION);
            List<Estimate> derived = new ArrayList<>();
            for (int j = 0; j < named.names().size(); j++) {
                int i = nExt + j;
                String name = named.names().get(j);
                boolean depends = Arrays.stream(g[i]).anyMatch(v -> v != 0) || inclination != null
                        && name.startsWith("impactParameter");
                if (inclination != null && name.startsWith("impactParameter")) {
                    double v68 = Reported.at(layout, inclination.ext68(), epochShift, midCycle).values()[i];
                    double v95 = Reported.at(layout, inclination.ext95(), epochShift, midCycle).values()[i];
                    derived.add(new Estimate(name, named.bands().get(j), values[i], Math.abs(v68 - values[i]), true,
                            new Estimate.Limit("upper", v95)));
                } else {
                    derived.add(new Estimate(name, named.bands().get(j), values[i],
                            Math.sqrt(Math.max(0, repCov.getEntry(i, i))), depends));
                }
            }
            int[] freeRows = freeIdx.stream().mapToInt(Integer::intValue).toArray();
            double[][] corr = freeRows.length == 0 ? new double[0][0]
                    : FitStatistics.correlation(repCov.getSubMatrix(freeRows, freeRows).getData());

            ModelFile bestModel = layout.modelFile(Arrays.copyOf(values, nExt));
            List<FittedCurve> curves = objective.lightCurves().curves(extBest);
            double[] usedResiduals = new double[nUsed];
            int u = 0;
            for (FittedCurve c : curves) {
                for (int i = 0; i < c.size(); i++) {
                    if (!c.clipped()[i]) {
                        usedResiduals[u++] = c.residual(i);
                    }
                }
            }
            double rms = FitStatistics.rms(usedResiduals);
            double bic = FitStatistics.bic(chi2, freeCount, nUsed);
            ModelAdequacy.Result adequacy = ModelAdequacy.check(curves,
                    c -> bestModel.forBand(curves.get(c).band()), freeCount, estimated);
            FitResult draft = new FitResult(bestModel, params, derived, freeNames, corr, nUsed, freeCount, chi2,
                    reducedChi2, rms, bic, iterations, evaluations + profileFits, estimated,
                    adequacy, Map.copyOf(clipped.isEmpty() ? Map.of() : clipped), List.of(), curves);
            List<String> notes = FitNotes.of(draft, layout.bands(), profiles.values().stream()
                    .filter(p -> !p.reachedLimit()).map(p -> layout.parameter(p.index()).name()).toList());
            return new FitResult(bestModel, params, derived, freeNames, corr, nUsed, freeCount, chi2, reducedChi2,
                    rms, bic, iterations, evaluations + profileFits, estimated, adequacy,
                    new LinkedHashMap<>(clipped), notes, curves);
        }

        /**
         * S N S with S diagonal: 1 for the light-curve coordinates, and for each velocity coordinate
         * the factor that brings its diagonal entry to the largest light-curve one (N itself without
         * velocities). The light-curve coordinates' conditioning, folds included, is judged as before.
         */
        private static RealMatrix velocitiesScaled(RealMatrix n, ParameterLayout layout) {
            int k = n.getRowDimension();
            double[] d = new double[k];
            Arrays.fill(d, 1.0);
            if (layout.velocities() == null) {
                return n;
            }
            List<String> owners = layout.internalOwners();
            Set<String> velocityNames = new java.util.HashSet<>();
            for (int i = layout.velocityBase(); i < layout.externalSize(); i++) {
                velocityNames.add(layout.parameter(i).name());
            }
            double max = 0;
            for (int i = 0; i < k; i++) {
                if (!velocityNames.contains(owners.get(i))) {
                    max = Math.max(max, n.getEntry(i, i));
                }
            }
            for (int i = 0; i < k; i++) {
                double v = n.getEntry(i, i);
                if (velocityNames.contains(owners.get(i)) && v > 0 && max > 0) {
                    d[i] = Math.sqrt(max / v);
                }
            }
            RealMatrix out = n.copy();
            for (int i = 0; i < k; i++) {
                for (int j = 0; j < k; j++) {
                    out.setEntry(i, j, n.getEntry(i, j) * d[i] * d[j]);
                }
            }
            return out;
        }

        /**
         * The covariance of the internal coordinates, scaled by the variance scale; coordinates in {@code excluded}
         * (folded coordinates of values reported as limits) get zero rows and columns.
         *
         * @throws WorkFailedException naming the combination the data cannot determine
         */
        private static RealMatrix covariance(RealMatrix normal, List<Integer> excluded, double varianceScale,
                ParameterLayout layout, FitSettings settings) {
            int k = normal.getRowDimension();
            int[] keep = java.util.stream.IntStream.range(0, k).filter(i -> !excluded.contains(i)).toArray();
            RealMatrix full = new Array2DRowRealMatrix(k, k);
            if (keep.length == 0) {
                return full;
            }
            double[][] inv;
            try {
                inv = Covariance.fromNormalMatrix(normal.getSubMatrix(keep, keep).getData(), varianceScale);
            } catch (Covariance.Degenerate d) {
                List<String> owners = layout.internalOwners();
                List<String> involved = new ArrayList<>();
                for (int a : d.involved()) {
                    String o = owners.get(keep[a]);
                    if (!involved.contains(o)) {
                        involved.add(o);
                    }
                }
                throw new WorkFailedException("the data cannot determine " + (involved.size() == 1
                        ? involved.get(0) + ": the light curve does not change when it changes"
                        : "these together: " + String.join(" and ", involved) + " (one combination of them leaves "
                                + "the light curve unchanged)") + ". Free parameters were " + String.join(", ",
                        settings.free()) + ". Fix one of them at a value from elsewhere, or add data that "
                        + "separate them (both eclipses, another band)");
            }
            for (int a = 0; a < keep.length; a++) {
                for (int b = 0; b < keep.length; b++) {
                    full.setEntry(keep[a], keep[b], inv[a][b]);
                }
            }
            return full;
        }
    }

    /** Reported quantities at an external point: external parameters, then derived ones with their names. */
    record Reported(double[] values, List<String> names, List<String> bands) {

        static Reported at(ParameterLayout layout, double[] extIn, long epochShift, long midCycle) {
            double[] ext = extIn.clone();
            ext[ParameterLayout.EPOCH] -= epochShift * ext[ParameterLayout.PERIOD];
            List<Double> out = new ArrayList<>();
            for (double v : ext) {
                out.add(v);
            }
            List<String> names = new ArrayList<>();
            List<String> bands = new ArrayList<>();
            BinaryParameters p0 = layout.parameters(ext, 0);
            for (String name : Priors.DERIVED_NAMES) {
                if (!Derived.perBand(name)) {
                    names.add(name);
                    bands.add(null);
                    out.add(Derived.value(name, p0));
                }
            }
            names.add("epochMidData");
            bands.add(null);
            out.add(ext[ParameterLayout.EPOCH] + midCycle * ext[ParameterLayout.PERIOD]);
            boolean multiBand = layout.bands().size() > 1;
            for (int b = 0; b < layout.bands().size(); b++) {
                names.add("lightRatio");
                bands.add(multiBand ? layout.bands().get(b) : null);
                out.add(layout.parameters(ext, b).lightRatio());
                for (Map.Entry<String, Double> a : new BinaryModel(layout.parameters(ext, b)).proximityAmplitudes()
                        .entrySet()) {
                    names.add(a.getKey());
                    bands.add(multiBand ? layout.bands().get(b) : null);
                    out.add(a.getValue());
                }
            }
            return new Reported(out.stream().mapToDouble(Double::doubleValue).toArray(), names, bands);
        }
    }
}
