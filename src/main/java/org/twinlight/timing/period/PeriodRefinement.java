package org.twinlight.timing.period;

import java.util.ArrayList;
import java.util.List;
import org.apache.commons.math3.analysis.MultivariateFunction;
import org.apache.commons.math3.analysis.UnivariateFunction;
import org.apache.commons.math3.optim.InitialGuess;
import org.apache.commons.math3.optim.MaxEval;
import org.apache.commons.math3.distribution.TDistribution;
import org.apache.commons.math3.exception.TooManyEvaluationsException;
import org.apache.commons.math3.optim.nonlinear.scalar.GoalType;
import org.apache.commons.math3.optim.nonlinear.scalar.ObjectiveFunction;
import org.apache.commons.math3.optim.nonlinear.scalar.noderiv.NelderMeadSimplex;
import org.apache.commons.math3.optim.nonlinear.scalar.noderiv.SimplexOptimizer;
import org.apache.commons.math3.optim.univariate.BrentOptimizer;
import org.apache.commons.math3.optim.univariate.SearchInterval;
import org.apache.commons.math3.optim.univariate.UnivariateObjectiveFunction;
import org.twinlight.eclipse.LimbDarkening;
import org.twinlight.statistics.FitStatistics;

/**
 * Refines a period and gives its uncertainty from eclipse timings.
 *
 * <p>The folded primary eclipse is described by a symmetric trapezoid (total width, ingress, depth;
 * grid search with the depth by linear least squares). The eclipses the data cover on both sides
 * (points before the ingress and after the egress) are put in
 * at most {@link #MAX_GROUPS} groups of consecutive cycles; for each group the trapezoid is shifted
 * in time to its least-squares position (Brent's minimiser), and the shift's error follows from the
 * Fisher information of the shift, σ<sub>Δ</sub>² = σ²/Σ(∂m/∂t)², where only points on the
 * ingress and egress (slope depth/ingress) contribute; the ingress is taken no shorter than half a
 * cadence, the smearing of one exposure. A weighted straight line through the group times against
 * their mean cycle numbers gives the period and its error, σ<sub>P</sub>² = 1/Σw<sub>g</sub>(E<sub>g</sub>
 * − Ē)², scaled by √χ²<sub>ν</sub> when the scatter exceeds the errors. For N equally good, equally
 * spaced timings this is σ<sub>P</sub> = σ<sub>T</sub>[12/(N³ − N)]<sup>1/2</sup> (Deeg 2015, arXiv:1503.05368).
 */
final class PeriodRefinement {
    /** Largest number of timing groups. */
    static final int MAX_GROUPS = 40;

    /** Refined ephemeris of the primary eclipse. */
    record Ephemeris(double periodDays, double periodErrorDays, double epochDays, double epochErrorDays,
            int timings, double reducedChiSquare) {
    }

    /** Shape of the folded primary: total width and ingress (phase), depth and out-of-eclipse level. */
    record Trapezoid(double width, double ingress, double depth, double level) implements EclipseProfile {
        @Override
        public double halfWidth() {
            return 0.5 * width;
        }

        @Override
        public double profile(double d) {
            double a = Math.abs(d);
            double half = 0.5 * width;
            if (a >= half) {
                return 0;
            }
            double flat = half - ingress;
            return a <= flat ? 1 : (half - a) / ingress;
        }

        @Override
        public double slope(double d) {
            double a = Math.abs(d);
            return a > 0.5 * width - ingress && a < 0.5 * width ? -Math.signum(d) / ingress : 0;
        }
    }

    /** The shape of an eclipse against the distance d from mid-eclipse (phase): 1 at mid-eclipse, 0 outside. */
    interface EclipseProfile {
        /** Half of the full width, phase. */
        double halfWidth();

        /** Hidden share of the depth at mid-eclipse, at distance d (either sign). */
        double profile(double d);

        /** Derivative of {@link #profile} with respect to d. */
        double slope(double d);
    }

    /**
     * A template fitted to the folded primary: its shape, its depth, the scatter about it (never below the
     * light curve's), the χ² of the fold about it (unweighted) and its name.
     */
    record TimingTemplate(EclipseProfile shape, double depth, double sigma, double chi2, String name) {
    }

    private final double[] timesDays;
    private final double[] flux;
    private final double scatter;
    private final double cadenceDays;

    PeriodRefinement(double[] timesDays, double[] flux, double scatter, double cadenceDays) {
        this.timesDays = timesDays;
        this.flux = flux;
        this.scatter = scatter;
        this.cadenceDays = cadenceDays;
    }

    /** Fits the trapezoid to the primary eclipse folded at {@code periodDays} with centre {@code epochDays}. */
    Trapezoid fitShape(double periodDays, double epochDays, double width, double level) {
        double minIngress = 0.5 * cadenceDays / periodDays;
        Trapezoid best = null;
        double bestChi2 = Double.POSITIVE_INFINITY;
        double window = 1.2 * width;
        List<double[]> pts = new ArrayList<>();
        for (int i = 0; i < flux.length; i++) {
            double d = FoldedEclipses.distance(FoldedEclipses.wrap((timesDays[i] - epochDays) / periodDays), 0);
            if (d <= window) {
                pts.add(new double[] {d, level - flux[i]});
            }
        }
        for (int a = 0; a <= 16; a++) {
            double w = width * (0.5 + 0.0625 * a);
            for (int b = 1; b <= 10; b++) {
                double ingress = Math.max(minIngress, 0.5 * w * b / 10.0);
                if (ingress > 0.5 * w) {
                    continue;
                }
                Trapezoid shape = new Trapezoid(w, ingress, 1, level);
                double sgy = 0;
                double sgg = 0;
                for (double[] p : pts) {
                    double g = shape.profile(p[0]);
                    sgy += g * p[1];
                    sgg += g * g;
                }
                if (sgg == 0) {
                    continue;
                }
                double depth = sgy / sgg;
                double chi2 = 0;
                for (double[] p : pts) {
                    double r = p[1] - depth * shape.profile(p[0]);
                    chi2 += r * r;
                }
                if (chi2 < bestChi2 && depth > 0) {
                    bestChi2 = chi2;
                    best = new Trapezoid(w, ingress, depth, level);
                }
            }
        }
        return best;
    }

    /**
     * Fits the disc template ({@link DiscTemplate}: half width, radius ratio, impact parameter) to the
     * primary eclipse folded at the trial ephemeris, starting from the trapezoid; the depth and the
     * out-of-eclipse levels (one per well-covered cycle, ground nights having zero-point offsets) by linear
     * least squares at each trial shape, the shape by the Nelder–Mead simplex (Commons Math). The trapezoid
     * is judged on the same points with the same levels. Returns both, the one with the lower χ² first (two
     * limb-darkened stars are best described by the discs; a template that does not match the eclipse's
     * shape makes timings depend on where the points fall); empty when the fold holds too few points or no
     * dip. Which templates: {@link #TRAPEZOID_ONLY} (a first pass that only needs to bring the trial period
     * close), {@link #WITH_DISCS}, or {@link #WITH_UNIFORM_DISCS} (also discs without limb darkening, the other
     * extreme of the law, to see how much the timings depend on it).
     */
    List<TimingTemplate> fitTemplates(double periodDays, double epochDays, Trapezoid start, int templates) {
        double startHalf = 0.5 * start.width();
        double window = WINDOW_HALF_WIDTHS * startHalf;
        List<double[]> pts = new ArrayList<>();
        for (int i = 0; i < flux.length; i++) {
            double e = (timesDays[i] - epochDays) / periodDays;
            long cycle = Math.round(e);
            double d = e - cycle;
            if (Math.abs(d) <= window) {
                pts.add(new double[] {d, flux[i], cycle});
            }
        }
        LevelPools pools = LevelPools.of(pts, 2);
        if (pts.size() < pools.count() + 4) {
            return List.of();
        }
        double[][] p = pts.toArray(double[][]::new);
        int[] pool = pools.indices();
        List<TimingTemplate> out = new ArrayList<>();
        if (templates >= WITH_DISCS) {
            addTemplate(out, fitDiscs(p, pool, pools.count(), startHalf, DiscTemplate.TYPICAL_LIMB_DARKENING),
                    "two limb-darkened discs", 4, p, pool, pools.count());
        }
        if (templates >= WITH_UNIFORM_DISCS) {
            addTemplate(out, fitDiscs(p, pool, pools.count(), startHalf, DiscTemplate.NO_LIMB_DARKENING),
                    "two uniform discs", 4, p, pool, pools.count());
        }
        addTemplate(out, start, "trapezoid", 3, p, pool, pools.count());
        out.sort(java.util.Comparator.comparingDouble(TimingTemplate::chi2));
        return out;
    }

    /** The disc template of least χ² over the points {d, flux, cycle} with their level pools. */
    private static DiscTemplate fitDiscs(double[][] p, int[] pool, int pools, double startHalf, LimbDarkening ld) {
        MultivariateFunction chi2 = x -> {
            DiscTemplate t = template(x, startHalf, ld);
            return t == null ? Double.MAX_VALUE : LevelPools.fit(p, pool, pools, t, 0)[1];
        };
        double[] best = null;
        double bestChi2 = Double.POSITIVE_INFINITY;
        for (double k : new double[] {0.3, 0.6, 1.0, 1.7}) {
            for (double b : new double[] {0.1, 0.5, 0.8}) {
                double[] x = {Math.log(1.15), Math.log(k), b};
                double c = chi2.value(x);
                if (c < bestChi2) {
                    bestChi2 = c;
                    best = x;
                }
            }
        }
        // The simplex stops at a relative change of 1e-6 in χ² or after MAX_SHAPE_EVALUATIONS; the best shape
        // seen is kept either way.
        double[][] seen = {best.clone(), {bestChi2}};
        MultivariateFunction tracked = x -> {
            double c = chi2.value(x);
            if (c < seen[1][0]) {
                seen[1][0] = c;
                seen[0] = x.clone();
            }
            return c;
        };
        try {
            new SimplexOptimizer(1e-6, 1e-12).optimize(new MaxEval(MAX_SHAPE_EVALUATIONS), new ObjectiveFunction(tracked),
                    GoalType.MINIMIZE, new InitialGuess(best), new NelderMeadSimplex(new double[] {0.08, 0.3, 0.15}));
        } catch (TooManyEvaluationsException e) {
            // keep the best shape seen
        }
        best = seen[0];
        return template(best, startHalf, ld);
    }

    private void addTemplate(List<TimingTemplate> out, EclipseProfile shape, String name, int shapeParameters,
            double[][] p, int[] pool, int pools) {
        if (shape == null) {
            return;
        }
        double[] fit = LevelPools.fit(p, pool, pools, shape, 0);
        int dof = p.length - pools - shapeParameters;
        if (fit[0] > 0 && dof > 0) {
            out.add(new TimingTemplate(shape, fit[0], Math.max(scatter, Math.sqrt(fit[1] / dof)), fit[1], name));
        }
    }

    /** Templates fitted by {@link #fitTemplates}: the trapezoid alone. */
    static final int TRAPEZOID_ONLY = 0;
    /** The trapezoid and the limb-darkened discs. */
    static final int WITH_DISCS = 1;
    /** The trapezoid, the limb-darkened and the uniform discs. */
    static final int WITH_UNIFORM_DISCS = 2;
    /** Most evaluations of the disc template's χ² in one shape fit. */
    private static final int MAX_SHAPE_EVALUATIONS = 300;
    /** Half widths of the trapezoid around each eclipse used to fit the disc template. */
    private static final double WINDOW_HALF_WIDTHS = 1.8;
    /** Widest disc template, in half widths of the trapezoid (it must leave out-of-eclipse points in the window). */
    private static final double MAX_WIDTH_STRETCH = 1.5;

    /** The template for simplex coordinates {ln(half width / trapezoid's), ln k, b/(1 + k)}; null out of range. */
    private static DiscTemplate template(double[] x, double startHalf, LimbDarkening ld) {
        double stretch = Math.exp(x[0]);
        double k = Math.exp(x[1]);
        if (stretch < 0.3 || stretch > MAX_WIDTH_STRETCH || k < 0.05 || k > 20 || x[2] < 0
                || x[2] > DiscTemplate.MAX_IMPACT_SHARE) {
            return null;
        }
        return new DiscTemplate(stretch * startHalf, k, x[2], ld);
    }

    /**
     * Out-of-eclipse levels: each cycle with at least {@link #OWN_LEVEL_POINTS} points in the window has its
     * own (nightly zero points), the others share one (sparse data would otherwise have a level per point).
     */
    record LevelPools(int[] indices, int count) {
        static final int OWN_LEVEL_POINTS = 10;

        /** Pools of points {.., .., cycle at {@code cycleColumn}}. */
        static LevelPools of(List<double[]> pts, int cycleColumn) {
            java.util.Map<Long, Integer> perCycle = new java.util.HashMap<>();
            for (double[] q : pts) {
                perCycle.merge((long) q[cycleColumn], 1, Integer::sum);
            }
            java.util.Map<Long, Integer> own = new java.util.HashMap<>();
            int[] idx = new int[pts.size()];
            int count = 1;
            for (int i = 0; i < idx.length; i++) {
                long c = (long) pts.get(i)[cycleColumn];
                if (perCycle.get(c) >= OWN_LEVEL_POINTS) {
                    Integer k = own.get(c);
                    if (k == null) {
                        k = count++;
                        own.put(c, k);
                    }
                    idx[i] = k;
                }
            }
            return new LevelPools(idx, count);
        }

        /**
         * Linear least squares of flux = level(pool) − depth·profile(d − shift) over points {d, flux, ..}:
         * {depth, χ² (unweighted)}; with {@code fixedDepth} &gt; 0 only the levels are fitted.
         */
        static double[] fit(double[][] p, int[] pool, int count, EclipseProfile t, double shift, double fixedDepth) {
            double[] n = new double[count];
            double[] sy = new double[count];
            double[] sg = new double[count];
            double syy = 0;
            double sgg = 0;
            double syg = 0;
            for (int i = 0; i < p.length; i++) {
                double g = t.profile(p[i][0] - shift);
                double y = p[i][1];
                int k = pool[i];
                n[k]++;
                sy[k] += y;
                sg[k] += g;
                syy += y * y;
                sgg += g * g;
                syg += y * g;
            }
            for (int k = 0; k < count; k++) {
                if (n[k] > 0) {
                    syy -= sy[k] * sy[k] / n[k];
                    sgg -= sg[k] * sg[k] / n[k];
                    syg -= sy[k] * sg[k] / n[k];
                }
            }
            if (fixedDepth > 0) {
                return new double[] {fixedDepth, syy + 2 * fixedDepth * syg + fixedDepth * fixedDepth * sgg};
            }
            if (!(sgg > 0)) {
                return new double[] {0, Double.MAX_VALUE};
            }
            double depth = -syg / sgg;
            return new double[] {depth, depth > 0 ? syy - syg * syg / sgg : Double.MAX_VALUE};
        }

        static double[] fit(double[][] p, int[] pool, int count, EclipseProfile t, double fixedDepth) {
            return fit(p, pool, count, t, 0, fixedDepth);
        }
    }

    /**
     * Times the primary eclipses folded at the trial ephemeris with a fitted template and fits a
     * straight line; null when fewer than two timings with distinct cycles can be made.
     */
    Ephemeris refine(double periodDays, double epochDays, TimingTemplate shape) {
        double halfWidthDays = shape.shape().halfWidth() * periodDays;
        // Points near a primary eclipse, by cycle.
        List<int[]> cycles = new ArrayList<>();
        int i = 0;
        while (i < flux.length) {
            double e = (timesDays[i] - epochDays) / periodDays;
            long cycle = Math.round(e);
            if (Math.abs(e - cycle) * periodDays > 1.5 * halfWidthDays) {
                i++;
                continue;
            }
            int from = i;
            boolean before = false;
            boolean after = false;
            while (i < flux.length && Math.round((timesDays[i] - epochDays) / periodDays) == cycle) {
                double dt = timesDays[i] - (epochDays + cycle * periodDays);
                before |= dt < -0.5 * halfWidthDays && dt > -1.5 * halfWidthDays;
                after |= dt > 0.5 * halfWidthDays && dt < 1.5 * halfWidthDays;
                i++;
            }
            // Only eclipses covered on both sides are timed: a one-sided one pins its time on the template
            // shape alone.
            if (before && after) {
                cycles.add(new int[] {from, i, (int) cycle});
            }
        }
        if (cycles.size() < 2) {
            return null;
        }
        int groups = Math.min(MAX_GROUPS, cycles.size());
        List<double[]> timings = new ArrayList<>();
        for (int g = 0; g < groups; g++) {
            int c0 = g * cycles.size() / groups;
            int c1 = (g + 1) * cycles.size() / groups;
            double[] t = timeGroup(cycles.subList(c0, c1), periodDays, epochDays, shape, halfWidthDays);
            if (t != null) {
                timings.add(t);
            }
        }
        return fitLine(timings, periodDays, epochDays);
    }

    /** {mean cycle, shift (days), shift error (days)} of one group, or null without ingress/egress points. */
    private double[] timeGroup(List<int[]> group, double periodDays, double epochDays, TimingTemplate shape,
            double halfWidthDays) {
        List<double[]> pts = new ArrayList<>();
        for (int[] c : group) {
            for (int i = c[0]; i < c[1]; i++) {
                double dt = timesDays[i] - (epochDays + c[2] * periodDays);
                if (Math.abs(dt) <= 1.5 * halfWidthDays) {
                    pts.add(new double[] {dt / periodDays, flux[i], c[2]});
                }
            }
        }
        LevelPools pools = LevelPools.of(pts, 2);
        double[][] p = pts.toArray(double[][]::new);
        int[] pool = pools.indices();
        EclipseProfile t = shape.shape();
        double range = 0.5 * t.halfWidth();
        UnivariateFunction chi2 = shift -> LevelPools.fit(p, pool, pools.count(), t, shift, shape.depth())[1];
        // Coarse scan, then Brent's method around the best point (shifts in phase).
        int steps = 40;
        double bestShift = 0;
        double bestChi2 = Double.POSITIVE_INFINITY;
        for (int k = -steps; k <= steps; k++) {
            double s = range * k / steps;
            double c = chi2.value(s);
            if (c < bestChi2) {
                bestChi2 = c;
                bestShift = s;
            }
        }
        double step = range / steps;
        double shift = new BrentOptimizer(1e-10, 1e-12).optimize(new MaxEval(200), new UnivariateObjectiveFunction(chi2),
                GoalType.MINIMIZE, new SearchInterval(bestShift - step, bestShift + step, bestShift)).getPoint();
        // Fisher information of the shift with the levels marginalised: Σ over pools of Σm'² − (Σm')²/n.
        double[] n = new double[pools.count()];
        double[] sd = new double[pools.count()];
        double fisher = 0;
        double cycleWeight = 0;
        for (int i = 0; i < p.length; i++) {
            double d = shape.depth() * t.slope(p[i][0] - shift) / periodDays;
            n[pool[i]]++;
            sd[pool[i]] += d;
            fisher += d * d;
            cycleWeight += d * d * p[i][2];
        }
        double sumSquares = fisher;
        for (int k = 0; k < n.length; k++) {
            if (n[k] > 0) {
                fisher -= sd[k] * sd[k] / n[k];
            }
        }
        if (!(fisher > 0)) {
            return null;
        }
        return new double[] {cycleWeight / sumSquares, shift * periodDays, shape.sigma() / Math.sqrt(fisher)};
    }

    /**
     * The quantile of Student's t with {@code dof} degrees of freedom at the Gaussian 1σ point (0.8413): the
     * factor that gives an error scaled by the scatter of few points the coverage of a Gaussian 1σ.
     */
    static double smallSampleFactor(int dof) {
        return new TDistribution(null, dof).inverseCumulativeProbability(GAUSSIAN_ONE_SIGMA_QUANTILE);
    }

    /** Φ(1), the probability of a standard normal variable below 1. */
    private static final double GAUSSIAN_ONE_SIGMA_QUANTILE = 0.8413447460685429;

    private static Ephemeris fitLine(List<double[]> timings, double periodDays, double epochDays) {
        if (timings.size() < 2) {
            return null;
        }
        double sw = 0;
        double swe = 0;
        for (double[] t : timings) {
            double w = 1 / (t[2] * t[2]);
            sw += w;
            swe += w * t[0];
        }
        double meanCycle = swe / sw;
        double see = 0;
        double sey = 0;
        double sy = 0;
        for (double[] t : timings) {
            double w = 1 / (t[2] * t[2]);
            double de = t[0] - meanCycle;
            see += w * de * de;
            sey += w * de * t[1];
            sy += w * t[1];
        }
        if (!(see > 0)) {
            return null;
        }
        // Shifts are relative to the trial ephemeris: shift = a + b·(E − Ē), so P = P0 + b.
        double slope = sey / see;
        double intercept = sy / sw;
        double chi2 = 0;
        for (double[] t : timings) {
            double r = t[1] - intercept - slope * (t[0] - meanCycle);
            chi2 += r * r / (t[2] * t[2]);
        }
        int dof = timings.size() - 2;
        double reduced = dof > 0 ? chi2 / dof : Double.NaN;
        double inflate = Math.sqrt(FitStatistics.varianceScale(chi2, dof, false));
        if (inflate > 1) {
            // The errors now come from the timings' own scatter, estimated on ν degrees of freedom: the
            // slope over its error then follows Student's t with ν degrees of freedom, not a Gaussian
            // (Student 1908, Biometrika 6, 1). Widen to the t quantile of a Gaussian 1σ (68.27 %, two-sided):
            // 1.84 for ν = 1, 1.32 for ν = 2, 1.20 for ν = 3, 1.05 for ν = 10.
            inflate *= smallSampleFactor(dof);
        }
        double period = periodDays + slope;
        double periodError = inflate / Math.sqrt(see);
        long refCycle = Math.round(meanCycle);
        double epoch = epochDays + refCycle * periodDays + intercept + slope * (refCycle - meanCycle);
        double epochError = inflate * Math.sqrt(1 / sw + Math.pow(refCycle - meanCycle, 2) / see);
        // The epoch is returned for cycle refCycle of the trial ephemeris, i.e. cycle 0 of the new one.
        return new Ephemeris(period, periodError, epoch, epochError, timings.size(), reduced);
    }
}
