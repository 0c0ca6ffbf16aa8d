package org.twinlight.fit;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import org.twinlight.eclipse.BinaryModel;
import org.twinlight.photometry.LightCurve;
import org.twinlight.photometry.RobustStatistics;

/**
 * The objective of the light-curve fit: weighted residuals (y − model·baseline)/σ of every data
 * point, with the per-segment baseline polynomials solved exactly for every trial model (variable
 * projection: Golub &amp; Pereyra 1973, SIAM J. Numer. Anal. 10, 413). Points left out (clipped
 * outliers) keep their place with a residual of 0 and no weight in the baselines.
 */
final class WeightedResiduals {
    private final ParameterLayout layout;
    private final List<Prepared> sets;
    private final int size;
    private final int degree;
    private final boolean errorsEstimated;

    WeightedResiduals(ParameterLayout layout, List<FitData> data, FitSettings settings) {
        this.layout = layout;
        this.degree = settings.baseline().degree();
        List<Prepared> list = new ArrayList<>();
        boolean est = false;
        int total = 0;
        for (FitData d : data) {
            Prepared p = new Prepared(d, layout.bands().indexOf(d.band()), settings.segmentGapDays(), degree);
            est |= p.errorsEstimated;
            total += p.t.length;
            list.add(p);
        }
        this.sets = List.copyOf(list);
        this.size = total;
        this.errorsEstimated = est;
    }

    private WeightedResiduals(WeightedResiduals base, ParameterLayout layout, List<Prepared> sets) {
        this.layout = layout;
        this.sets = sets;
        this.size = base.size;
        this.degree = base.degree;
        this.errorsEstimated = base.errorsEstimated;
    }

    /** The same data seen through another layout (a parameter fixed for a profile). */
    WeightedResiduals withLayout(ParameterLayout other) {
        return new WeightedResiduals(this, other, sets);
    }

    /** The same data with the points flagged in {@code leftOut} (one array per light curve) unused. */
    WeightedResiduals withLeftOut(List<boolean[]> leftOut) {
        List<Prepared> out = new ArrayList<>();
        for (int s = 0; s < sets.size(); s++) {
            out.add(sets.get(s).withLeftOut(leftOut.get(s)));
        }
        return new WeightedResiduals(this, layout, List.copyOf(out));
    }

    ParameterLayout layout() {
        return layout;
    }

    /** All points, used or not. */
    int size() {
        return size;
    }

    /** Points that take part in the fit. */
    int usedCount() {
        int n = 0;
        for (Prepared p : sets) {
            n += p.usedCount;
        }
        return n;
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

    /** Number of used points the model for an external vector puts in eclipse. */
    int eclipsedPoints(double[] ext) {
        int count = 0;
        for (Prepared p : sets) {
            BinaryModel model = new BinaryModel(layout.parameters(ext, p.band));
            for (int i = 0; i < p.t.length; i++) {
                if (p.used[i] && model.flux(p.t[i]) < 1 - 1e-9) {
                    count++;
                }
            }
        }
        return count;
    }

    /** Weighted residuals for an internal point (the solver keeps it inside the domain). */
    double[] evaluate(double[] internal) {
        double[] out = new double[size];
        double[] ext = layout.toExternal(internal);
        BinaryModel[] models = new BinaryModel[layout.bands().size()];
        for (int b = 0; b < models.length; b++) {
            models[b] = new BinaryModel(layout.parameters(ext, b));
        }
        int off = 0;
        for (Prepared p : sets) {
            p.weightedResiduals(models[p.band].flux(p.t), out, off, null);
            off += p.t.length;
        }
        return out;
    }

    /** χ² of the used points for an internal point. */
    double chi2(double[] internal) {
        double s = 0;
        for (double v : evaluate(internal)) {
            s += v * v;
        }
        return s;
    }

    /**
     * χ² of the used points for an external vector, computed in the work arrays {@code work}
     * (one per thread, from {@link #workspace()}): no allocation per point.
     */
    double chi2External(double[] ext, Workspace work) {
        double s = 0;
        for (int b = 0; b < layout.bands().size(); b++) {
            work.models[b] = new BinaryModel(layout.parameters(ext, b));
        }
        for (int k = 0; k < sets.size(); k++) {
            Prepared p = sets.get(k);
            double[] m = work.flux[k];
            work.models[p.band].flux(p.t, m);
            s += p.chi2(m, work.residuals[k]);
        }
        return s;
    }

    /** Work arrays for {@link #chi2External(double[], Workspace)}; one thread at a time. */
    Workspace workspace() {
        double[][] flux = new double[sets.size()][];
        double[][] residuals = new double[sets.size()][];
        for (int k = 0; k < sets.size(); k++) {
            flux[k] = new double[sets.get(k).t.length];
            residuals[k] = new double[sets.get(k).t.length];
        }
        return new Workspace(flux, residuals, new BinaryModel[layout.bands().size()]);
    }

    /** Per-thread model and residual arrays, one per light curve. */
    record Workspace(double[][] flux, double[][] residuals, BinaryModel[] models) {
    }

    /** The fitted curves, baselines divided out, for an external vector. */
    List<FittedCurve> curves(double[] ext) {
        List<FittedCurve> out = new ArrayList<>();
        for (Prepared p : sets) {
            BinaryModel model = new BinaryModel(layout.parameters(ext, p.band));
            double[] m = model.flux(p.t);
            Baselines kept = new Baselines(new double[p.segmentCount()][], new double[p.t.length]);
            p.weightedResiduals(m, new double[p.t.length], 0, kept);
            double[] flux = new double[p.t.length];
            double[] err = new double[p.t.length];
            boolean[] clipped = new boolean[p.t.length];
            for (int i = 0; i < flux.length; i++) {
                flux[i] = p.y[i] / kept.values[i];
                err[i] = p.sigma[i] / Math.abs(kept.values[i]);
                clipped[i] = !p.used[i];
            }
            out.add(new FittedCurve(p.source, layout.bands().get(p.band), p.t.clone(), flux, err, m,
                    p.segmentCount(), degree < 0 ? new double[0][] : kept.coefficients, clipped));
        }
        return out;
    }

    /** Fitted baselines: coefficients per segment and the value at each point. */
    private record Baselines(double[][] coefficients, double[] values) {
    }

    /** One light curve's arrays, weights, segments and used points. */
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
        final boolean[] used;
        final double[] weight;
        final int usedCount;

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
                double s = RobustStatistics.pointToPointSigma(y);
                e = new double[n];
                Arrays.fill(e, s > 0 ? s : 1);
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
            used = new boolean[n];
            Arrays.fill(used, true);
            usedCount = n;
            weight = weights(sigma, used);
        }

        private Prepared(Prepared base, boolean[] leftOut) {
            source = base.source;
            band = base.band;
            t = base.t;
            y = base.y;
            sigma = base.sigma;
            tau = base.tau;
            segmentStart = base.segmentStart;
            degree = base.degree;
            errorsEstimated = base.errorsEstimated;
            used = new boolean[t.length];
            int c = 0;
            for (int i = 0; i < used.length; i++) {
                used[i] = !leftOut[i];
                c += used[i] ? 1 : 0;
            }
            usedCount = c;
            weight = weights(sigma, used);
        }

        /**
         * χ² of the used points with the baselines solved, as {@link #weightedResiduals} would give
         * it; without a baseline or with an offset per segment the normal equation is one number
         * (c = Σ w m y / Σ w m², w = 1/σ²) and no residual is stored. {@code scratch} (the length
         * of the curve) serves the polynomial baselines.
         */
        double chi2(double[] model, double[] scratch) {
            double s = 0;
            if (degree > 0) {
                weightedResiduals(model, scratch, 0, null);
                for (double v : scratch) {
                    s += v * v;
                }
                return s;
            }
            for (int g = 0; g + 1 < segmentStart.length; g++) {
                int a = segmentStart[g];
                int b = segmentStart[g + 1];
                double c = 1;
                if (degree == 0) {
                    double mm = 0;
                    double my = 0;
                    for (int i = a; i < b; i++) {
                        double wm = weight[i] * model[i];
                        mm += wm * model[i];
                        my += wm * y[i];
                    }
                    // as solveSmall: no usable point leaves the baseline at 1
                    c = mm != 0 ? my / mm : 1;
                }
                for (int i = a; i < b; i++) {
                    double r = y[i] - model[i] * c;
                    s += weight[i] * r * r;
                }
            }
            return s;
        }

        /** 1/σ² of the used points, 0 for those left out. */
        private static double[] weights(double[] sigma, boolean[] used) {
            double[] w = new double[sigma.length];
            for (int i = 0; i < w.length; i++) {
                w[i] = used[i] ? 1 / (sigma[i] * sigma[i]) : 0;
            }
            return w;
        }

        Prepared withLeftOut(boolean[] leftOut) {
            return new Prepared(this, leftOut);
        }

        int segmentCount() {
            return segmentStart.length - 1;
        }

        /**
         * Fills out[off..] with (y − model·baseline)/σ (0 for unused points), the baseline per
         * segment solved by weighted linear least squares over the used points; {@code keep},
         * when given, receives the coefficients and the baseline at every point.
         */
        void weightedResiduals(double[] model, double[] out, int off, Baselines keep) {
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
                        if (!used[i]) {
                            continue;
                        }
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
                    out[off + i] = used[i] ? (y[i] - model[i] * base) / sigma[i] : 0.0;
                    if (keep != null) {
                        keep.values[i] = base;
                    }
                }
                if (keep != null) {
                    keep.coefficients[s] = c;
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
    }
}
