package org.twinlight.fit;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.stream.IntStream;
import org.apache.commons.math3.exception.ConvergenceException;
import org.apache.commons.math3.exception.TooManyEvaluationsException;
import org.apache.commons.math3.exception.TooManyIterationsException;
import org.apache.commons.math3.fitting.leastsquares.LeastSquaresBuilder;
import org.apache.commons.math3.fitting.leastsquares.LeastSquaresOptimizer;
import org.apache.commons.math3.fitting.leastsquares.LeastSquaresProblem;
import org.apache.commons.math3.fitting.leastsquares.LevenbergMarquardtOptimizer;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.RealMatrix;
import org.apache.commons.math3.linear.SingularValueDecomposition;
import org.twinlight.WorkFailedException;
import org.twinlight.eclipse.BandValues;
import org.twinlight.eclipse.BinaryModel;
import org.twinlight.eclipse.BinaryParameters;
import org.twinlight.eclipse.ModelFile;
import org.twinlight.photometry.LightCurve;

/**
 * Least-squares fit of the two-sphere model to one or more light curves with the
 * Levenberg–Marquardt method (Commons Math; Moré 1978, in <i>Numerical Analysis</i>, Lecture Notes
 * in Mathematics 630, 105).
 *
 * <p>The per-segment baseline polynomials enter linearly and are solved exactly for every trial
 * model (variable projection: Golub &amp; Pereyra 1973, SIAM J. Numer. Anal. 10, 413), so the
 * solver only sees the model parameters, in the unbounded internal coordinates of
 * {@link ParameterLayout}. Uncertainties come from the inverse of JᵀJ at the optimum (J the
 * Jacobian of the weighted residuals, by central differences), scaled by the reduced χ², and are
 * propagated to the contract's parameters and to derived quantities by the Jacobian of that
 * mapping.
 */
public final class EclipseFitter {
    /** Residual given to parameter sets outside the model's domain, so the solver backs off. */
    private static final double OUTSIDE_DOMAIN_RESIDUAL = 1e3;

    private EclipseFitter() {
    }

    /**
     * Fits the model to the data.
     *
     * @param start starting model (fixed parameters keep its values)
     * @param data light curves with their band names
     * @param settings free parameters, baseline, segment gap, iteration limit
     * @throws WorkFailedException when the fit does not converge or the parameters are degenerate
     * @throws org.twinlight.BadInputException for unknown free-parameter names
     */
    public static FitResult fit(ModelFile start, List<FitData> data, FitSettings settings) {
        if (data.isEmpty()) {
            throw new IllegalArgumentException("no data to fit");
        }
        if (settings.baseline() == Baseline.NONE) {
            for (FitData d : data) {
                double[] f = d.lightCurve().fluxes();
                java.util.Arrays.sort(f);
                double median = f[f.length / 2];
                if (!(Math.abs(median - 1) < 0.5)) {
                    throw new org.twinlight.BadInputException(d.lightCurve().source() + ": with --baseline none the "
                            + "flux must be normalised to about 1 out of eclipse, but its median is " + median
                            + "; use --baseline offset (the default) to fit the normalisation");
                }
            }
        }
        List<String> bands = data.stream().map(FitData::band).distinct().toList();
        ParameterLayout layout = new ParameterLayout(start, bands, settings.free());
        Residuals residuals = new Residuals(layout, data, settings);

        double[] x0 = layout.startInternal();
        if (residuals.eclipsedPoints(layout.toExternal(x0)) == 0) {
            throw new WorkFailedException("the starting model predicts no eclipse at any data point; check period "
                    + "and epoch (the period and minima commands find them), radii and inclination");
        }
        double[] steps = layout.steps();
        int m = residuals.size();
        LeastSquaresProblem problem = new LeastSquaresBuilder()
                .start(x0)
                .target(new double[m])
                // the Jacobian is computed only for points the solver accepts (lazy evaluation)
                .model(residuals::evaluate, x -> jacobian(residuals::evaluate, x, null, steps, true, m))
                .maxIterations(settings.maxIterations())
                .maxEvaluations(settings.maxIterations() * 4)
                .lazyEvaluation(true)
                .build();
        LeastSquaresOptimizer.Optimum optimum;
        try {
            optimum = new LevenbergMarquardtOptimizer()
                    .withCostRelativeTolerance(1e-10)
                    .withParameterRelativeTolerance(1e-10)
                    .withOrthoTolerance(1e-12)
                    .optimize(problem);
        } catch (TooManyIterationsException | TooManyEvaluationsException e) {
            throw new WorkFailedException("the fit did not converge within " + settings.maxIterations()
                    + " iterations. Try: start closer to the data (check period and epoch first), free fewer "
                    + "parameters (e.g. keep limb darkening and third light fixed), or raise --max-iterations");
        } catch (ConvergenceException e) {
            throw new WorkFailedException("the fit failed: " + e.getMessage() + ". Try fewer free parameters or a "
                    + "starting model closer to the data");
        }
        double[] best = optimum.getPoint().toArray();
        if (residuals.eclipsedPoints(layout.toExternal(best)) == 0) {
            throw new WorkFailedException("the fit ended with a model that has no eclipse at any data point (inclination "
                    + String.format(java.util.Locale.ROOT, "%.1f°", layout.toExternal(best)[ParameterLayout.INCLINATION])
                    + "): the data show no eclipse the model can follow. Check that the file holds eclipses "
                    + "(inspect, period) and that period and epoch put them where the model expects");
        }
        return summarise(layout, residuals, settings, start, best, steps, optimum.getIterations(),
                optimum.getEvaluations());
    }

    private static FitResult summarise(ParameterLayout layout, Residuals residuals, FitSettings settings,
            ModelFile start, double[] best, double[] steps, int iterations, int evaluations) {
        int m = residuals.size();
        double[] r = residuals.evaluate(best);
        double chi2 = 0;
        for (double v : r) {
            chi2 += v * v;
        }
        if (!Double.isFinite(chi2) || Arrays.stream(r).anyMatch(v -> v == OUTSIDE_DOMAIN_RESIDUAL)) {
            throw new WorkFailedException("the fit ended outside the model's domain (radii ≥ 1 or similar); start "
                    + "from values closer to the data");
        }
        int k = layout.internalSize();
        int freeCount = k + residuals.baselineCoefficientCount();
        int dof = m - freeCount;
        if (dof <= 0) {
            throw new WorkFailedException("there are " + m + " data points for " + freeCount
                    + " fitted quantities; fix some parameters or use more data");
        }
        double reducedChi2 = chi2 / dof;

        double[][] jac = jacobian(residuals::evaluate, best, r, steps, true, m);
        RealMatrix jm = new Array2DRowRealMatrix(jac, false);
        RealMatrix normal = jm.transpose().multiply(jm);
        SingularValueDecomposition svd = new SingularValueDecomposition(normal);
        double[] sv = svd.getSingularValues();
        if (sv[sv.length - 1] <= sv[0] * 1e-14) {
            throw new WorkFailedException("the free parameters " + String.join(", ", settings.free())
                    + " cannot all be determined from these data (in the solver's coordinates: "
                    + String.join(", ", layout.internalNames()) + "). Check that the starting epoch and period put "
                    + "the eclipses on the data, then free fewer parameters (limb darkening and third light are "
                    + "the usual culprits)");
        }
        RealMatrix cov = svd.getSolver().getInverse().scalarMultiply(reducedChi2);

        // Everything reported, as a function of the internal point: external parameters, then derived.
        double startEpoch = start.common().epochDays();
        double[] extBest = layout.toExternal(best);
        long epochShift = Math.round((extBest[ParameterLayout.EPOCH] - startEpoch) / extBest[ParameterLayout.PERIOD]);
        double midTime = residuals.midTime();
        long midCycle = Math.round((midTime - extBest[ParameterLayout.EPOCH]) / extBest[ParameterLayout.PERIOD]);
        ReportFunction report = x -> reported(layout, x, epochShift, midCycle).values();
        Reported named = reported(layout, best, epochShift, midCycle);
        List<String> derivedNames = named.names();
        List<String> derivedBands = named.bands();
        double[] values = named.values();
        double[][] g = jacobian(report::apply, best, values, steps, true, values.length);
        RealMatrix gm = new Array2DRowRealMatrix(g, false);
        RealMatrix repCov = gm.multiply(cov).multiply(gm.transpose());

        int nExt = layout.externalSize();
        boolean multiBand = layout.bands().size() > 1;
        List<Estimate> params = new ArrayList<>();
        List<Integer> freeIdx = new ArrayList<>();
        List<String> freeNames = new ArrayList<>();
        for (int i = 0; i < nExt; i++) {
            String band = layout.band(i) != null && multiBand ? layout.band(i) : null;
            boolean free = layout.isFree(i);
            params.add(new Estimate(layout.name(i), band, values[i],
                    free ? Math.sqrt(Math.max(0, repCov.getEntry(i, i))) : 0.0, free));
            if (free) {
                freeIdx.add(i);
                freeNames.add(band == null ? layout.name(i) : layout.name(i) + "@" + band);
            }
        }
        List<Estimate> derived = new ArrayList<>();
        for (int j = 0; j < derivedNames.size(); j++) {
            int i = nExt + j;
            boolean depends = Arrays.stream(g[i]).anyMatch(v -> v != 0);
            derived.add(new Estimate(derivedNames.get(j), derivedBands.get(j), values[i],
                    Math.sqrt(Math.max(0, repCov.getEntry(i, i))), depends));
        }
        double[][] corr = new double[freeIdx.size()][freeIdx.size()];
        for (int a = 0; a < freeIdx.size(); a++) {
            for (int b = 0; b < freeIdx.size(); b++) {
                int ia = freeIdx.get(a);
                int ib = freeIdx.get(b);
                double den = Math.sqrt(repCov.getEntry(ia, ia) * repCov.getEntry(ib, ib));
                corr[a][b] = den > 0 ? repCov.getEntry(ia, ib) / den : (a == b ? 1 : 0);
            }
        }

        double[] extReported = Arrays.copyOf(values, nExt);
        ModelFile bestModel = bestModel(layout, extReported, start);
        List<FittedCurve> curves = residuals.curves(layout.toExternal(best));
        double sumSq = 0;
        int count = 0;
        for (FittedCurve c : curves) {
            for (int i = 0; i < c.size(); i++) {
                double d = c.residual(i);
                sumSq += d * d;
                count++;
            }
        }
        double rms = Math.sqrt(sumSq / count);
        double bic = chi2 + freeCount * Math.log(m);

        List<String> notes = new ArrayList<>(layout.adjustments());
        for (Estimate e : params) {
            boolean geometry = e.name().equals("radius1") || e.name().equals("radius2");
            if (geometry && e.free() && e.uncertainty() > 0.5 * e.value()) {
                notes.add(String.format(java.util.Locale.ROOT, "%s is barely constrained (%.3g ± %.3g): treat the "
                        + "geometry as undetermined", e.name(), e.value(), e.uncertainty()));
            }
        }
        if (residuals.errorsEstimated()) {
            notes.add("some data had no errors: they were estimated from the point-to-point scatter");
        }
        if (reducedChi2 > 2 && !residuals.errorsEstimated()) {
            notes.add(String.format(java.util.Locale.ROOT, "reduced chi-square is %.2f: the errors look too small or "
                    + "the model misses something (spots, proximity effects, a wrong limb-darkening law); "
                    + "uncertainties were scaled by its square root", reducedChi2));
        }
        for (int b = 0; b < layout.bands().size(); b++) {
            BinaryParameters bp = bestModel.forBand(layout.bands().get(b));
            String where = layout.bands().size() > 1 ? " in band " + layout.bands().get(b) : "";
            for (int star = 1; star <= 2; star++) {
                if (!(star == 1 ? bp.limbDarkening1() : bp.limbDarkening2()).isNonNegative()) {
                    notes.add("the fitted limb darkening of star " + star + where + " gives a negative intensity near "
                            + "the limb: the data do not constrain it; fix its coefficients or choose another law");
                }
            }
        }
        for (int a = 0; a < corr.length; a++) {
            for (int b = a + 1; b < corr.length; b++) {
                if (Math.abs(corr[a][b]) > 0.98) {
                    notes.add(String.format(java.util.Locale.ROOT, "%s and %s are strongly correlated (%.3f): their "
                            + "errors are not independent; use the correlation matrix when propagating them", freeNames.get(a), freeNames.get(b), corr[a][b]));
                }
            }
        }
        return new FitResult(bestModel, params, derived, freeNames, corr, m, freeCount, chi2, reducedChi2, rms, bic,
                iterations, evaluations, residuals.errorsEstimated(), notes, curves);
    }

    /** Reported quantities at an internal point: external parameters, then derived ones with their names. */
    private record Reported(double[] values, List<String> names, List<String> bands) {
    }

    private static Reported reported(ParameterLayout layout, double[] x, long epochShift, long midCycle) {
        double[] ext = layout.toExternal(x);
        ext[ParameterLayout.EPOCH] -= epochShift * ext[ParameterLayout.PERIOD];
        List<Double> out = new ArrayList<>();
        for (double v : ext) {
            out.add(v);
        }
        List<String> names = new ArrayList<>();
        List<String> bands = new ArrayList<>();
        BinaryParameters p0 = layout.parameters(ext, 0);
        double w = Math.toRadians(p0.omegaDeg());
        Object[][] common = {
            {"sumOfRadii", p0.sumOfRadii()},
            {"radiusRatio", p0.radiusRatio()},
            {"impactParameterPrimary", p0.impactParameterPrimary()},
            {"impactParameterSecondary", p0.impactParameterSecondary()},
            {"eCosOmega", p0.eccentricity() * Math.cos(w)},
            {"eSinOmega", p0.eccentricity() * Math.sin(w)},
            {"secondaryPhase", p0.orbit().secondaryPhase()},
            {"epochMidData", ext[ParameterLayout.EPOCH] + midCycle * ext[ParameterLayout.PERIOD]},
        };
        for (Object[] c : common) {
            names.add((String) c[0]);
            bands.add(null);
            out.add((Double) c[1]);
        }
        boolean multiBand = layout.bands().size() > 1;
        for (int b = 0; b < layout.bands().size(); b++) {
            names.add("lightRatio");
            bands.add(multiBand ? layout.bands().get(b) : null);
            out.add(layout.parameters(ext, b).lightRatio());
        }
        return new Reported(out.stream().mapToDouble(Double::doubleValue).toArray(), names, bands);
    }

    private static ModelFile bestModel(ParameterLayout layout, double[] ext, ModelFile start) {
        BinaryParameters common = layout.parameters(ext, 0);
        if (layout.bands().size() == 1 && start.bands().isEmpty()) {
            return ModelFile.of(common);
        }
        Map<String, BandValues> bands = new LinkedHashMap<>(start.bands());
        for (int b = 0; b < layout.bands().size(); b++) {
            bands.put(layout.bands().get(b), layout.bandValues(ext, b));
        }
        BinaryParameters geometry = new BinaryParameters(common.periodDays(), common.epochDays(), common.radius1(),
                common.radius2(), common.inclinationDeg(), common.eccentricity(), common.omegaDeg(),
                start.common().surfaceBrightnessRatio(), start.common().thirdLight(), start.common().limbDarkening1(),
                start.common().limbDarkening2(), common.exposureTimeDays(), common.supersample());
        return new ModelFile(geometry, bands);
    }

    @FunctionalInterface
    private interface ReportFunction {
        double[] apply(double[] x);
    }

    /** Jacobian by finite differences, one column per internal coordinate, columns in parallel. */
    private static double[][] jacobian(ReportFunction f, double[] x, double[] f0, double[] steps, boolean central,
            int rows) {
        int k = x.length;
        double[][] cols = new double[k][];
        IntStream.range(0, k).parallel().forEach(j -> {
            double h = steps[j];
            double[] xp = x.clone();
            xp[j] += h;
            double[] fp = f.apply(xp);
            double[] col = new double[rows];
            if (central) {
                double[] xm = x.clone();
                xm[j] -= h;
                double[] fm = f.apply(xm);
                for (int i = 0; i < rows; i++) {
                    col[i] = (fp[i] - fm[i]) / (2 * h);
                }
            } else {
                for (int i = 0; i < rows; i++) {
                    col[i] = (fp[i] - f0[i]) / h;
                }
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

    /** Weighted residuals of all data for an internal point, with the baselines solved exactly. */
    private static final class Residuals {
        private final ParameterLayout layout;
        private final List<Prepared> sets = new ArrayList<>();
        private final int size;
        private final int degree;
        private final boolean errorsEstimated;

        Residuals(ParameterLayout layout, List<FitData> data, FitSettings settings) {
            this.layout = layout;
            this.degree = settings.baseline().degree();
            boolean est = false;
            int total = 0;
            for (FitData d : data) {
                Prepared p = new Prepared(d, layout.bands().indexOf(d.band()), settings.segmentGapDays(), degree);
                est |= p.errorsEstimated;
                total += p.t.length;
                sets.add(p);
            }
            this.size = total;
            this.errorsEstimated = est;
        }

        int size() {
            return size;
        }

        boolean errorsEstimated() {
            return errorsEstimated;
        }

        int baselineCoefficientCount() {
            int c = 0;
            for (Prepared p : sets) {
                c += p.segmentCount() * (degree + 1);
            }
            return c;
        }

        double midTime() {
            double lo = Double.POSITIVE_INFINITY;
            double hi = Double.NEGATIVE_INFINITY;
            for (Prepared p : sets) {
                lo = Math.min(lo, p.t[0]);
                hi = Math.max(hi, p.t[p.t.length - 1]);
            }
            return 0.5 * (lo + hi);
        }

        int eclipsedPoints(double[] ext) {
            int count = 0;
            for (Prepared p : sets) {
                BinaryModel model = new BinaryModel(layout.parameters(ext, p.band));
                for (double t : p.t) {
                    if (model.flux(t) < 1 - 1e-9) {
                        count++;
                    }
                }
            }
            return count;
        }

        double[] evaluate(double[] internal) {
            double[] out = new double[size];
            double[] ext = layout.toExternal(internal);
            BinaryModel[] models = new BinaryModel[layout.bands().size()];
            try {
                for (int b = 0; b < models.length; b++) {
                    models[b] = new BinaryModel(layout.parameters(ext, b));
                }
            } catch (IllegalArgumentException outside) {
                Arrays.fill(out, OUTSIDE_DOMAIN_RESIDUAL);
                return out;
            }
            int off = 0;
            for (Prepared p : sets) {
                double[] model = models[p.band].flux(p.t);
                p.weightedResiduals(model, out, off, null);
                off += p.t.length;
            }
            return out;
        }

        List<FittedCurve> curves(double[] ext) {
            List<FittedCurve> out = new ArrayList<>();
            for (Prepared p : sets) {
                BinaryModel model = new BinaryModel(layout.parameters(ext, p.band));
                double[] m = model.flux(p.t);
                double[][] coeffs = new double[p.segmentCount()][];
                double[] baseline = new double[p.t.length];
                p.weightedResiduals(m, new double[p.t.length], 0, new Object[] {coeffs, baseline});
                double[] flux = new double[p.t.length];
                double[] err = new double[p.t.length];
                for (int i = 0; i < flux.length; i++) {
                    flux[i] = p.y[i] / baseline[i];
                    err[i] = p.sigma[i] / Math.abs(baseline[i]);
                }
                out.add(new FittedCurve(p.source, layout.bands().get(p.band), p.t.clone(), flux, err, m,
                        p.segmentCount(), degree < 0 ? new double[0][] : coeffs));
            }
            return out;
        }
    }

    /** One light curve's arrays, weights and segments. */
    private static final class Prepared {
        final String source;
        final int band;
        final double[] t;
        final double[] y;
        final double[] sigma;
        final double[] tau;
        final int[] segmentStart;
        final int degree;
        final boolean errorsEstimated;

        Prepared(FitData d, int band, double gapDays, int degree) {
            LightCurve lc = d.lightCurve();
            this.source = lc.source();
            this.band = band;
            this.degree = degree;
            int n = lc.size();
            t = lc.timesDays();
            y = lc.fluxes();
            double[] e = lc.fluxErrors();
            errorsEstimated = e == null;
            if (e == null) {
                double s = scatter(y);
                e = new double[n];
                Arrays.fill(e, s);
            }
            sigma = e;
            List<Integer> starts = new ArrayList<>();
            starts.add(0);
            for (int i = 1; i < n; i++) {
                if (t[i] - t[i - 1] > gapDays) {
                    starts.add(i);
                }
            }
            starts.add(n);
            segmentStart = starts.stream().mapToInt(Integer::intValue).toArray();
            tau = new double[n];
            for (int s = 0; s + 1 < segmentStart.length; s++) {
                int a = segmentStart[s];
                int b = segmentStart[s + 1];
                double mid = 0.5 * (t[a] + t[b - 1]);
                double half = 0.5 * (t[b - 1] - t[a]);
                for (int i = a; i < b; i++) {
                    tau[i] = half > 0 ? (t[i] - mid) / half : 0.0;
                }
            }
        }

        int segmentCount() {
            return segmentStart.length - 1;
        }

        /**
         * Fills out[off..] with (y − model·baseline)/σ, the baseline per segment solved by weighted
         * linear least squares. When {@code keep} is given it receives {coefficients[][], baseline[]}.
         */
        void weightedResiduals(double[] model, double[] out, int off, Object[] keep) {
            int nc = degree + 1;
            for (int s = 0; s + 1 < segmentStart.length; s++) {
                int a = segmentStart[s];
                int b = segmentStart[s + 1];
                double[] c = new double[Math.max(nc, 1)];
                if (degree < 0) {
                    c[0] = 1;
                } else {
                    double[][] ata = new double[nc][nc];
                    double[] atb = new double[nc];
                    double[] pw = new double[2 * nc - 1];
                    for (int i = a; i < b; i++) {
                        double w = 1 / (sigma[i] * sigma[i]);
                        double mm = model[i] * model[i] * w;
                        double my = model[i] * y[i] * w;
                        double p = 1;
                        for (int q = 0; q < pw.length; q++) {
                            pw[q] = p;
                            p *= tau[i];
                        }
                        for (int r = 0; r < nc; r++) {
                            atb[r] += my * pw[r];
                            for (int q = 0; q < nc; q++) {
                                ata[r][q] += mm * pw[r + q];
                            }
                        }
                    }
                    c = solveSmall(ata, atb);
                }
                for (int i = a; i < b; i++) {
                    double base = polynomial(c, tau[i]);
                    out[off + i] = (y[i] - model[i] * base) / sigma[i];
                    if (keep != null) {
                        ((double[]) keep[1])[i] = base;
                    }
                }
                if (keep != null) {
                    ((double[][]) keep[0])[s] = c;
                }
            }
        }

        private static double polynomial(double[] c, double x) {
            double v = 0;
            for (int k = c.length - 1; k >= 0; k--) {
                v = v * x + c[k];
            }
            return v;
        }

        /** Gaussian elimination with partial pivoting for the tiny normal equations (≤ 3×3). */
        private static double[] solveSmall(double[][] a, double[] b) {
            int n = b.length;
            for (int col = 0; col < n; col++) {
                int piv = col;
                for (int r = col + 1; r < n; r++) {
                    if (Math.abs(a[r][col]) > Math.abs(a[piv][col])) {
                        piv = r;
                    }
                }
                double[] tmp = a[col];
                a[col] = a[piv];
                a[piv] = tmp;
                double tb = b[col];
                b[col] = b[piv];
                b[piv] = tb;
                if (a[col][col] == 0) {
                    double[] c = new double[n];
                    c[0] = 1;
                    return c;
                }
                for (int r = col + 1; r < n; r++) {
                    double f = a[r][col] / a[col][col];
                    for (int q = col; q < n; q++) {
                        a[r][q] -= f * a[col][q];
                    }
                    b[r] -= f * b[col];
                }
            }
            double[] x = new double[n];
            for (int r = n - 1; r >= 0; r--) {
                double s = b[r];
                for (int q = r + 1; q < n; q++) {
                    s -= a[r][q] * x[q];
                }
                x[r] = s / a[r][r];
            }
            return x;
        }

        /** σ of white noise from successive differences (1 when it cannot be estimated). */
        private static double scatter(double[] y) {
            double s = org.twinlight.photometry.RobustStatistics.pointToPointSigma(y);
            return s > 0 ? s : 1;
        }
    }
}
