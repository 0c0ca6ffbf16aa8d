package org.twinlight.timing.period;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.ArrayRealVector;
import org.apache.commons.math3.linear.LUDecomposition;
import org.apache.commons.math3.linear.RealMatrix;
import org.apache.commons.math3.linear.RealVector;
import org.apache.commons.math3.linear.SingularValueDecomposition;

/**
 * Compares the eclipses at even and odd cycles of a period Pₛ, model-based: the template is the eclipse
 * folded at Pₛ (all cycles), D(φ) below the out-of-eclipse level; each group of cycles of one parity is
 * fitted by linear least squares with x = c<sub>k</sub> − a·D(φ) − s·D′(φ) − v·φ·D′(φ), a level c<sub>k</sub>
 * per cycle that has out-of-eclipse data (nightly zero points), a depth scale a, a time shift s and a width
 * stretch v (the first-order changes of the template in depth, time and width). The parities' (a, s, v)
 * are averaged with their information matrices; their scatter about the average inflates the errors when
 * it exceeds the point errors (correlated noise, zero points). The difference even − odd gives
 * χ² = Δᵀ(C<sub>even</sub> + C<sub>odd</sub>)⁻¹Δ for 3 degrees of freedom; the refinement's period error
 * enters as the change of Δ when Pₛ moves by ±1σ, added to the covariance. Using one template for both
 * parities, evaluated at each point's own phase, compares like with like whatever the sampling: equal
 * eclipses agree within the errors (no "difference" made by where the points fall).
 */
final class AlternateEclipses {
    /** Template bins across the window ±(full width) around the eclipse. */
    private static final int TEMPLATE_BINS = 48;
    /** Fewest points in the inner half of an eclipse for a group of cycles. */
    private static final int MIN_CORE_POINTS = 3;

    private AlternateEclipses() {
    }

    /** Fitted (a, s, v) of one parity with its covariance and number of groups. */
    private record ParityFit(RealVector mean, RealMatrix covariance, int groups) {
    }

    static OddEvenComparison compare(SearchData data, RefinedPeriod ps) {
        double p = ps.periodDays();
        Result mid = differences(data, p, ps.epochDays(), ps.widthPhase());
        if (mid == null) {
            return OddEvenComparison.notCovered(p, 0, 0);
        }
        if (mid.even == null || mid.odd == null) {
            return OddEvenComparison.notCovered(p, mid.even == null ? 0 : mid.even.groups,
                    mid.odd == null ? 0 : mid.odd.groups);
        }
        RealVector delta = mid.even.mean.subtract(mid.odd.mean);
        RealMatrix cov = mid.even.covariance.add(mid.odd.covariance);
        // The period's own error: alternate eclipses drift apart by δP per cycle.
        Result lo = differences(data, p - ps.periodErrorDays(), ps.epochDays(), ps.widthPhase());
        Result hi = differences(data, p + ps.periodErrorDays(), ps.epochDays(), ps.widthPhase());
        if (lo != null && hi != null && lo.even != null && lo.odd != null && hi.even != null && hi.odd != null) {
            RealVector dLo = lo.even.mean.subtract(lo.odd.mean);
            RealVector dHi = hi.even.mean.subtract(hi.odd.mean);
            for (int i = 0; i < 3; i++) {
                double half = 0.5 * (dHi.getEntry(i) - dLo.getEntry(i));
                cov.addToEntry(i, i, half * half);
            }
        }
        RealMatrix inv = new SingularValueDecomposition(cov).getSolver().getInverse();
        double chi2 = delta.dotProduct(inv.operate(delta));
        double[] sigma = new double[3];
        for (int i = 0; i < 3; i++) {
            sigma[i] = delta.getEntry(i) / Math.sqrt(cov.getEntry(i, i));
        }
        return OddEvenComparison.measured(p, mid.even.groups, mid.odd.groups, sigma[0], sigma[2], sigma[1],
                Math.abs(delta.getEntry(1)) * p, chi2);
    }

    private record Result(ParityFit even, ParityFit odd) {
    }

    private record Point(double phase, double flux, long cycle) {
    }

    /** null when the template cannot be made. */
    private static Result differences(SearchData data, double period, double epoch, double width) {
        double half = Math.min(0.45, width);
        double[] t = data.timesDays();
        double[] x = data.flux();
        List<Point> pts = new ArrayList<>();
        for (int i = 0; i < t.length; i++) {
            double e = (t[i] - epoch) / period;
            long c = Math.round(e);
            double ph = e - c;
            if (Math.abs(ph) <= half) {
                pts.add(new Point(ph, x[i], c));
            }
        }
        double[] template = template(pts, half, width);
        if (template == null) {
            return null;
        }
        double binWidth = 2 * half / TEMPLATE_BINS;
        Map<Long, List<Point>> byCycle = new TreeMap<>();
        for (Point pt : pts) {
            byCycle.computeIfAbsent(pt.cycle, k -> new ArrayList<>()).add(pt);
        }
        List<List<List<Point>>> groups = List.of(new ArrayList<>(), new ArrayList<>());
        List<List<Point>> open = new ArrayList<>(List.of(new ArrayList<>(), new ArrayList<>()));
        List<List<List<Point>>> openCycles = List.of(new ArrayList<>(), new ArrayList<>());
        for (Map.Entry<Long, List<Point>> en : byCycle.entrySet()) {
            int parity = (int) Math.floorMod(en.getKey(), 2L);
            open.get(parity).addAll(en.getValue());
            openCycles.get(parity).add(en.getValue());
            if (enough(open.get(parity), width)) {
                List<List<Point>> g = new ArrayList<>(openCycles.get(parity));
                groups.get(parity).add(flatten(g));
                open.get(parity).clear();
                openCycles.get(parity).clear();
            }
        }
        List<double[]> residuals = new ArrayList<>();
        List<List<Fit>> fits = List.of(new ArrayList<>(), new ArrayList<>());
        for (int parity = 0; parity < 2; parity++) {
            for (List<Point> g : groups.get(parity)) {
                Fit f = fitGroup(g, template, half, binWidth, width);
                if (f != null) {
                    fits.get(parity).add(f);
                    residuals.add(new double[] {f.rss, f.dof});
                }
            }
        }
        double rss = residuals.stream().mapToDouble(r -> r[0]).sum();
        double dof = residuals.stream().mapToDouble(r -> r[1]).sum();
        if (!(dof > 0)) {
            return new Result(null, null);
        }
        double variance = rss / dof;
        return new Result(combine(fits.get(0), variance), combine(fits.get(1), variance));
    }

    private static List<Point> flatten(List<List<Point>> cycles) {
        List<Point> all = new ArrayList<>();
        cycles.forEach(all::addAll);
        return all;
    }

    /** Enough to fit depth, time and width: points in the core, on both flanks and out of eclipse. */
    private static boolean enough(List<Point> g, double width) {
        int core = 0;
        int before = 0;
        int after = 0;
        int out = 0;
        for (Point p : g) {
            double a = Math.abs(p.phase);
            core += a < 0.25 * width ? 1 : 0;
            before += p.phase < -0.1 * width && a < 0.5 * width ? 1 : 0;
            after += p.phase > 0.1 * width && a < 0.5 * width ? 1 : 0;
            out += a > 0.6 * width ? 1 : 0;
        }
        return core >= MIN_CORE_POINTS && before >= 2 && after >= 2 && out >= 2;
    }

    /** Template dip D at the bin centres across [−half, half]; null when too many bins are empty. */
    private static double[] template(List<Point> pts, double half, double width) {
        double[] sum = new double[TEMPLATE_BINS];
        int[] count = new int[TEMPLATE_BINS];
        double outSum = 0;
        int outCount = 0;
        for (Point p : pts) {
            int b = Math.min(TEMPLATE_BINS - 1, (int) ((p.phase + half) / (2 * half) * TEMPLATE_BINS));
            sum[b] += p.flux;
            count[b]++;
            if (Math.abs(p.phase) > 0.6 * width) {
                outSum += p.flux;
                outCount++;
            }
        }
        if (outCount == 0) {
            return null;
        }
        double level = outSum / outCount;
        double[] d = new double[TEMPLATE_BINS];
        int filled = 0;
        for (int b = 0; b < TEMPLATE_BINS; b++) {
            d[b] = count[b] > 0 ? level - sum[b] / count[b] : Double.NaN;
            filled += count[b] > 0 ? 1 : 0;
        }
        if (filled < TEMPLATE_BINS / 2) {
            return null;
        }
        // Empty bins: linear interpolation between filled neighbours (the ends take the nearest value).
        for (int b = 0; b < TEMPLATE_BINS; b++) {
            if (Double.isNaN(d[b])) {
                int l = b - 1;
                while (l >= 0 && count[l] == 0) {
                    l--;
                }
                int r = b + 1;
                while (r < TEMPLATE_BINS && count[r] == 0) {
                    r++;
                }
                double vl = l >= 0 ? level - sum[l] / count[l] : Double.NaN;
                double vr = r < TEMPLATE_BINS ? level - sum[r] / count[r] : Double.NaN;
                d[b] = Double.isNaN(vl) ? vr : Double.isNaN(vr) ? vl : vl + (vr - vl) * (b - l) / (double) (r - l);
            }
        }
        return d;
    }

    private static double at(double[] d, double phase, double half, double binWidth) {
        double u = (phase + half) / binWidth - 0.5;
        int b = (int) Math.floor(u);
        if (b < 0) {
            return d[0];
        }
        if (b >= d.length - 1) {
            return d[d.length - 1];
        }
        double f = u - b;
        return d[b] * (1 - f) + d[b + 1] * f;
    }

    private record Fit(RealVector shape, RealMatrix unscaledCovariance, double rss, double dof) {
    }

    /** Least squares of one group: a level per cycle with out-of-eclipse data (or one shared), then a, s, v. */
    private static Fit fitGroup(List<Point> g, double[] d, double half, double binWidth, double width) {
        Map<Long, Integer> outCount = new TreeMap<>();
        for (Point p : g) {
            if (Math.abs(p.phase) > 0.6 * width) {
                outCount.merge(p.cycle, 1, Integer::sum);
            }
        }
        Map<Long, Integer> levelIndex = new TreeMap<>();
        int levels = 0;
        boolean shared = false;
        for (Point p : g) {
            if (levelIndex.containsKey(p.cycle)) {
                continue;
            }
            if (outCount.getOrDefault(p.cycle, 0) >= 3) {
                levelIndex.put(p.cycle, levels++);
            } else {
                shared = true;
            }
        }
        int sharedIndex = shared ? levels++ : -1;
        int cols = levels + 3;
        int n = g.size();
        if (n <= cols) {
            return null;
        }
        double[][] a = new double[n][cols];
        double[] y = new double[n];
        for (int i = 0; i < n; i++) {
            Point p = g.get(i);
            a[i][levelIndex.getOrDefault(p.cycle, sharedIndex)] = 1;
            double dv = at(d, p.phase, half, binWidth);
            double slope = (at(d, p.phase + binWidth, half, binWidth) - at(d, p.phase - binWidth, half, binWidth))
                    / (2 * binWidth);
            a[i][levels] = -dv;
            a[i][levels + 1] = -slope;
            a[i][levels + 2] = -p.phase * slope;
            y[i] = p.flux;
        }
        RealMatrix am = new Array2DRowRealMatrix(a, false);
        RealMatrix normal = am.transpose().multiply(am);
        LUDecomposition lu = new LUDecomposition(normal, 1e-14);
        if (!lu.getSolver().isNonSingular()) {
            return null;
        }
        SingularValueDecomposition svd = new SingularValueDecomposition(normal);
        if (svd.getConditionNumber() > 1e12) {
            return null;
        }
        RealMatrix inv = lu.getSolver().getInverse();
        RealVector beta = inv.operate(am.transpose().operate(new ArrayRealVector(y, false)));
        RealVector resid = new ArrayRealVector(y, false).subtract(am.operate(beta));
        RealVector shape = beta.getSubVector(levels, 3);
        RealMatrix cov = inv.getSubMatrix(levels, levels + 2, levels, levels + 2);
        return new Fit(shape, cov, resid.dotProduct(resid), n - cols);
    }

    /** Information-weighted mean of the groups' (a, s, v), errors inflated by their scatter when larger. */
    private static ParityFit combine(List<Fit> fits, double variance) {
        if (fits.isEmpty()) {
            return null;
        }
        RealMatrix info = new Array2DRowRealMatrix(3, 3);
        RealVector weighted = new ArrayRealVector(3);
        List<RealMatrix> infos = new ArrayList<>();
        for (Fit f : fits) {
            RealMatrix ik = new SingularValueDecomposition(f.unscaledCovariance.scalarMultiply(variance)).getSolver()
                    .getInverse();
            infos.add(ik);
            info = info.add(ik);
            weighted = weighted.add(ik.operate(f.shape));
        }
        RealMatrix cov = new SingularValueDecomposition(info).getSolver().getInverse();
        RealVector mean = cov.operate(weighted);
        if (fits.size() > 1) {
            double chi2 = 0;
            for (int k = 0; k < fits.size(); k++) {
                RealVector r = fits.get(k).shape.subtract(mean);
                chi2 += r.dotProduct(infos.get(k).operate(r));
            }
            double reduced = chi2 / (3.0 * (fits.size() - 1));
            if (reduced > 1) {
                cov = cov.scalarMultiply(reduced);
            }
        }
        return new ParityFit(mean, cov, fits.size());
    }
}
