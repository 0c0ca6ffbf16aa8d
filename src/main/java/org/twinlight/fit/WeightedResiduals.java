package org.twinlight.fit;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import org.twinlight.eclipse.BinaryModel;
import org.twinlight.photometry.LightCurve;
import org.twinlight.photometry.RobustStatistics;

/**
 * The light curves of a fit as one {@link FitDataSet}: weighted residuals (y − model·baseline)/σ of every data
 * point, with the per-segment baseline polynomials solved exactly for every trial model (variable
 * projection: Golub &amp; Pereyra 1973, SIAM J. Numer. Anal. 10, 413). Points left out (clipped
 * outliers) keep their place with a residual of 0 and no weight in the baselines.
 */
final class WeightedResiduals implements FitDataSet {
    private static final double LN_SQRT_2PI = 0.5 * Math.log(2 * Math.PI);
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

    private WeightedResiduals(WeightedResiduals base, List<Prepared> sets) {
        this.layout = base.layout;
        this.sets = sets;
        this.size = base.size;
        this.degree = base.degree;
        this.errorsEstimated = base.errorsEstimated;
    }

    /** The same data with the points flagged in {@code leftOut} (one array per light curve) unused. */
    WeightedResiduals withLeftOut(List<boolean[]> leftOut) {
        List<Prepared> out = new ArrayList<>();
        for (int s = 0; s < sets.size(); s++) {
            out.add(sets.get(s).withLeftOut(leftOut.get(s)));
        }
        return new WeightedResiduals(this, List.copyOf(out));
    }

    /** All points, used or not. */
    @Override
    public int size() {
        return size;
    }

    /** Points that take part in the fit. */
    @Override
    public int usedCount() {
        int n = 0;
        for (Prepared p : sets) {
            n += p.usedCount;
        }
        return n;
    }

    boolean errorsEstimated() {
        return errorsEstimated;
    }

    @Override
    public int nuisanceCount() {
        int c = 0;
        for (Prepared p : sets) {
            c += p.segmentCount() * (degree + 1 + (p.airmassDeviation != null ? 1 : 0));
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
                if (p.used[i] && model.inEclipse(p.t[i])) {
                    count++;
                }
            }
        }
        return count;
    }

    @Override
    public double logNormalisation() {
        double s = 0;
        for (Prepared p : sets) {
            for (int i = 0; i < p.t.length; i++) {
                if (p.used[i]) {
                    s -= Math.log(p.sigma[i]) + LN_SQRT_2PI;
                }
            }
        }
        return s;
    }

    /** Weighted residuals for an external vector inside the model's domain. */
    @Override
    public void residuals(double[] ext, double[] out, int offset) {
        BinaryModel[] models = new BinaryModel[layout.bands().size()];
        for (int b = 0; b < models.length; b++) {
            models[b] = new BinaryModel(layout.parameters(ext, b));
        }
        int off = offset;
        for (Prepared p : sets) {
            double[] m = new double[p.t.length];
            p.flux(models[p.band], m);
            p.weightedResiduals(m, out, off, null, 0);
            off += p.t.length;
        }
    }

    /**
     * χ² of the used points for an external vector, computed in the work arrays {@code work}
     * (one per thread, from {@link #workspace()}): no allocation per point.
     */
    double chi2External(double[] ext, Workspace work) {
        return sum(ext, work, null);
    }

    /**
     * ln L of the used points with a jitter term: −½ Σ [r²/(σ² + s²) + ln(σ² + s²) + ln 2π], s
     * the jitter of each light curve's band ({@code jitterByBand}, in the units of the flux, in the
     * order of the layout's bands), the baselines solved with the weights 1/(σ² + s²). Work arrays
     * as {@link #chi2External(double[], Workspace)}.
     */
    double logLikelihood(double[] ext, Workspace work, double[] jitterByBand) {
        return sum(ext, work, jitterByBand);
    }

    /** χ² without a jitter ({@code jitterByBand} null), ln L with one. */
    private double sum(double[] ext, Workspace work, double[] jitterByBand) {
        double s = 0;
        for (int b = 0; b < layout.bands().size(); b++) {
            work.models[b] = new BinaryModel(layout.parameters(ext, b));
        }
        for (int k = 0; k < sets.size(); k++) {
            Prepared p = sets.get(k);
            double[] m = work.flux[k];
            int[] windows = p.flux(work.models[p.band], m);
            if (jitterByBand == null) {
                s += windows != null && p.outsideSums != null ? p.chi2InWindows(m, windows)
                        : p.chi2(m, work.residuals[k], 0);
            } else {
                double s2 = jitterByBand[p.band] * jitterByBand[p.band];
                s += -0.5 * p.chi2(m, work.residuals[k], s2) + p.logVarianceTerm(s2) - p.usedCount * LN_SQRT_2PI;
            }
        }
        return s;
    }

    /** The median stated (or estimated) error of the used points of each band, in the order of the layout's bands. */
    double[] medianErrorByBand() {
        double[] out = new double[layout.bands().size()];
        for (int b = 0; b < out.length; b++) {
            List<Double> e = new ArrayList<>();
            for (Prepared p : sets) {
                for (int i = 0; p.band == b && i < p.t.length; i++) {
                    if (p.used[i]) {
                        e.add(p.sigma[i]);
                    }
                }
            }
            out[b] = RobustStatistics.median(e.stream().mapToDouble(Double::doubleValue).toArray());
        }
        return out;
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
            double[] m = new double[p.t.length];
            p.flux(model, m);
            Baselines kept = new Baselines(new double[p.segmentCount()][], new double[p.t.length]);
            p.weightedResiduals(m, new double[p.t.length], 0, kept, 0);
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
        /** Airmass minus its mean over the point's segment, one more baseline column; null without. */
        final double[] airmassDeviation;
        /**
         * Per segment, over the used points, {Σw, Σwy/Σw, Σw(y − ȳ)²} (w = 1/σ²), the sums of χ²
         * over the points whose model is exactly 1; null with a baseline of higher degree or an
         * airmass term.
         */
        final double[][] outsideSums;

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
            airmassDeviation = airmassDeviation(lc.airmass(), segmentStart, degree);
            outsideSums = outsideSums();
        }

        /**
         * X − mean X per segment, so that the baseline's constant stays the segment's level at its
         * mean airmass; null without airmass.
         */
        private static double[] airmassDeviation(double[] x, int[] segmentStart, int degree) {
            if (x == null) {
                return null;
            }
            if (degree < 0) {
                throw new IllegalArgumentException("an airmass term needs a fitted baseline (offset or higher), "
                        + "not none");
            }
            double[] dev = new double[x.length];
            for (int s = 0; s + 1 < segmentStart.length; s++) {
                double mean = 0;
                for (int i = segmentStart[s]; i < segmentStart[s + 1]; i++) {
                    mean += x[i];
                }
                mean /= segmentStart[s + 1] - segmentStart[s];
                for (int i = segmentStart[s]; i < segmentStart[s + 1]; i++) {
                    dev[i] = x[i] - mean;
                }
            }
            return dev;
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
            airmassDeviation = base.airmassDeviation;
            used = new boolean[t.length];
            int c = 0;
            for (int i = 0; i < used.length; i++) {
                used[i] = !leftOut[i];
                c += used[i] ? 1 : 0;
            }
            usedCount = c;
            weight = weights(sigma, used);
            outsideSums = outsideSums();
        }

        /** The model at this curve's times into {@code out}; the index ranges outside which it is exactly 1, or null. */
        int[] flux(BinaryModel model, double[] out) {
            // a light curve's times strictly increase (LightCurve refuses others)
            return model.fluxOfAscendingTimes(t, out);
        }

        private double[][] outsideSums() {
            if (degree > 0 || airmassDeviation != null) {
                return null;
            }
            double[][] sums = new double[segmentCount()][];
            for (int g = 0; g < sums.length; g++) {
                double w = 0;
                double wy = 0;
                for (int i = segmentStart[g]; i < segmentStart[g + 1]; i++) {
                    w += weight[i];
                    wy += weight[i] * y[i];
                }
                double mean = w > 0 ? wy / w : 0;
                double spread = 0;
                for (int i = segmentStart[g]; i < segmentStart[g + 1]; i++) {
                    spread += weight[i] * (y[i] - mean) * (y[i] - mean);
                }
                sums[g] = new double[] {w, mean, spread};
            }
            return sums;
        }

        /**
         * {@link #chi2(double[], double[], double)} without a jitter, for a model that is exactly 1
         * outside the index ranges {@code windows} ({a₀, b₀, ...}, ascending): the points at 1 enter
         * through the segment's sums, so only the points in the ranges are visited. With the
         * segment's Σw = W, weighted mean ȳ, spread A = Σw(y − ȳ)² and c its baseline (1 without one):
         * Σw(y − c m)² = A + W(ȳ − c)² + Σ_in w[(y − c m)² − (y − c)²], and c = Σwmy / Σwm² with
         * Σwmy = Wȳ + Σ_in w(m − 1)y and Σwm² = W + Σ_in w(m² − 1) (every term of the size of χ²
         * itself: no cancellation of large sums).
         */
        double chi2InWindows(double[] model, int[] windows) {
            double s = 0;
            int k = 0;
            for (int g = 0; g + 1 < segmentStart.length; g++) {
                int a = segmentStart[g];
                int b = segmentStart[g + 1];
                while (k < windows.length && windows[k + 1] <= a) {
                    k += 2;
                }
                double[] sums = outsideSums[g];
                double c = 1;
                if (degree == 0) {
                    double mm = sums[0];
                    double my = sums[0] * sums[1];
                    for (int r = k; r < windows.length && windows[r] < b; r += 2) {
                        for (int i = Math.max(a, windows[r]), end = Math.min(b, windows[r + 1]); i < end; i++) {
                            double wm = weight[i] * (model[i] - 1);
                            mm += wm * (model[i] + 1);
                            my += wm * y[i];
                        }
                    }
                    // as solveSmall: no usable point leaves the baseline at 1
                    c = mm != 0 ? my / mm : 1;
                }
                s += sums[2] + sums[0] * (sums[1] - c) * (sums[1] - c);
                for (int r = k; r < windows.length && windows[r] < b; r += 2) {
                    for (int i = Math.max(a, windows[r]), end = Math.min(b, windows[r + 1]); i < end; i++) {
                        // (y − cm)² − (y − c)² = c(1 − m)(2y − c(1 + m))
                        s += weight[i] * c * (1 - model[i]) * (2 * y[i] - c * (1 + model[i]));
                    }
                }
            }
            return s;
        }

        /**
         * χ² of the used points with the baselines solved, as {@link #weightedResiduals} would give
         * it; without a baseline or with an offset per segment the normal equation is one number
         * (c = Σ w m y / Σ w m², w = 1/σ²) and no residual is stored. {@code scratch} (the length
         * of the curve) serves the polynomial baselines. {@code jitter2} (s², 0 for none) is added
         * to every σ², weights and baselines included.
         */
        double chi2(double[] model, double[] scratch, double jitter2) {
            double s = 0;
            if (degree > 0 || airmassDeviation != null) {
                weightedResiduals(model, scratch, 0, null, jitter2);
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
                        double wm = weight(i, jitter2) * model[i];
                        mm += wm * model[i];
                        my += wm * y[i];
                    }
                    // as solveSmall: no usable point leaves the baseline at 1
                    c = mm != 0 ? my / mm : 1;
                }
                for (int i = a; i < b; i++) {
                    double r = y[i] - model[i] * c;
                    s += weight(i, jitter2) * r * r;
                }
            }
            return s;
        }

        /** 1/(σ² + s²) of point i, 0 when it is left out. */
        private double weight(int i, double jitter2) {
            return jitter2 == 0 ? weight[i] : used[i] ? 1 / (sigma[i] * sigma[i] + jitter2) : 0;
        }

        /** −½ Σ ln(σ² + s²) over the used points. */
        double logVarianceTerm(double jitter2) {
            double s = 0;
            for (int i = 0; i < sigma.length; i++) {
                if (used[i]) {
                    s += Math.log(sigma[i] * sigma[i] + jitter2);
                }
            }
            return -0.5 * s;
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
         * Fills out[off..] with (y − model·baseline)/√(σ² + s²) (0 for unused points, s² =
         * {@code jitter2}, 0 without a jitter term), the baseline per segment solved by weighted linear
         * least squares over the used points; {@code keep}, when given, receives the coefficients and
         * the baseline at every point.
         */
        void weightedResiduals(double[] model, double[] out, int off, Baselines keep, double jitter2) {
            int nc = degree + 1;
            // the columns: 1, τ, τ², ... up to the degree, then the airmass deviation when there is one
            int nb = nc + (airmassDeviation != null ? 1 : 0);
            double[] basis = new double[Math.max(nb, 1)];
            for (int s = 0; s + 1 < segmentStart.length; s++) {
                int a = segmentStart[s];
                int b = segmentStart[s + 1];
                double[] c = new double[Math.max(nb, 1)];
                if (degree < 0) {
                    c[0] = 1;
                } else {
                    double[][] ata = new double[nb][nb];
                    double[] atb = new double[nb];
                    for (int i = a; i < b; i++) {
                        if (!used[i]) {
                            continue;
                        }
                        double w = 1 / (sigma[i] * sigma[i] + jitter2);
                        double mm = model[i] * model[i] * w;
                        double my = model[i] * y[i] * w;
                        basis(i, nc, basis);
                        for (int r = 0; r < nb; r++) {
                            atb[r] += my * basis[r];
                            for (int q = 0; q < nb; q++) {
                                ata[r][q] += mm * basis[r] * basis[q];
                            }
                        }
                    }
                    c = solveSmall(ata, atb);
                }
                double[] poly = nb > nc && degree >= 0 ? Arrays.copyOf(c, nc) : c;
                for (int i = a; i < b; i++) {
                    double base = polynomial(poly, tau[i]);
                    if (poly != c) {
                        base += c[nc] * airmassDeviation[i];
                    }
                    double sd = jitter2 == 0 ? sigma[i] : Math.sqrt(sigma[i] * sigma[i] + jitter2);
                    out[off + i] = used[i] ? (y[i] - model[i] * base) / sd : 0.0;
                    if (keep != null) {
                        keep.values[i] = base;
                    }
                }
                if (keep != null) {
                    keep.coefficients[s] = poly;
                }
            }
        }

        /** The baseline's columns at point i: τ⁰..τ^(nc−1), then the airmass deviation if any. */
        private void basis(int i, int nc, double[] out) {
            double p = 1;
            for (int q = 0; q < nc; q++) {
                out[q] = p;
                p *= tau[i];
            }
            if (airmassDeviation != null) {
                out[nc] = airmassDeviation[i];
            }
        }

        private static double polynomial(double[] c, double x) {
            double v = 0;
            for (int k = c.length - 1; k >= 0; k--) {
                v = v * x + c[k];
            }
            return v;
        }

        /** Gaussian elimination with partial pivoting for the tiny normal equations (≤ 5×5). */
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
