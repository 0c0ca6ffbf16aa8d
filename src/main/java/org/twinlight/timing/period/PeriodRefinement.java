package org.twinlight.timing.period;

import org.twinlight.timing.Ephemeris;

import java.util.ArrayList;
import java.util.List;

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
    record Trapezoid(double width, double ingress, double depth, double level) {
        /** Model flux at phase distance d from the centre. */
        double model(double d) {
            return level - depth * profile(d);
        }

        double profile(double d) {
            double half = 0.5 * width;
            if (d >= half) {
                return 0;
            }
            double flat = half - ingress;
            return d <= flat ? 1 : (half - d) / ingress;
        }
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
     * Times the primary eclipses folded at the trial ephemeris and fits a straight line; null when
     * fewer than two timings with distinct cycles can be made.
     */
    Ephemeris refine(double periodDays, double epochDays, Trapezoid shape) {
        double halfWidthDays = 0.5 * shape.width() * periodDays;
        double ingressDays = Math.max(0.5 * cadenceDays, shape.ingress() * periodDays);
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
            double[] t = timeGroup(cycles.subList(c0, c1), periodDays, epochDays, shape, halfWidthDays, ingressDays);
            if (t != null) {
                timings.add(t);
            }
        }
        return fitLine(timings, periodDays, epochDays);
    }

    /** {mean cycle, shift (days), shift error (days)} of one group, or null without ingress/egress points. */
    private double[] timeGroup(List<int[]> group, double periodDays, double epochDays, Trapezoid shape,
            double halfWidthDays, double ingressDays) {
        List<double[]> pts = new ArrayList<>();
        for (int[] c : group) {
            for (int i = c[0]; i < c[1]; i++) {
                double dt = timesDays[i] - (epochDays + c[2] * periodDays);
                if (Math.abs(dt) <= 1.5 * halfWidthDays) {
                    pts.add(new double[] {dt, flux[i], c[2]});
                }
            }
        }
        double range = 0.5 * halfWidthDays;
        java.util.function.DoubleUnaryOperator chi2 = shift -> {
            double s = 0;
            for (double[] p : pts) {
                double r = p[1] - shape.model(Math.abs(p[0] - shift) / periodDays);
                s += r * r;
            }
            return s;
        };
        // Coarse scan, then Brent's method around the best point.
        int steps = 40;
        double bestShift = 0;
        double bestChi2 = Double.POSITIVE_INFINITY;
        for (int k = -steps; k <= steps; k++) {
            double s = range * k / steps;
            double c = chi2.applyAsDouble(s);
            if (c < bestChi2) {
                bestChi2 = c;
                bestShift = s;
            }
        }
        double step = range / steps;
        org.apache.commons.math3.optim.univariate.BrentOptimizer brent =
                new org.apache.commons.math3.optim.univariate.BrentOptimizer(1e-10, 1e-12 * periodDays);
        double shift = brent.optimize(new org.apache.commons.math3.optim.MaxEval(200),
                new org.apache.commons.math3.optim.univariate.UnivariateObjectiveFunction(chi2::applyAsDouble),
                org.apache.commons.math3.optim.nonlinear.scalar.GoalType.MINIMIZE,
                new org.apache.commons.math3.optim.univariate.SearchInterval(bestShift - step, bestShift + step,
                        bestShift)).getPoint();
        double fisher = 0;
        double cycleWeight = 0;
        double slope = shape.depth() / ingressDays;
        double halfDays = 0.5 * shape.width() * periodDays;
        double flatDays = halfDays - ingressDays;
        for (double[] p : pts) {
            double d = Math.abs(p[0] - shift);
            if (d > flatDays && d < halfDays) {
                fisher += slope * slope;
                cycleWeight += p[2];
            }
        }
        if (fisher == 0) {
            return null;
        }
        double meanCycle = cycleWeight / (fisher / (slope * slope));
        return new double[] {meanCycle, shift, scatter / Math.sqrt(fisher)};
    }

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
        double inflate = dof > 0 ? Math.sqrt(Math.max(1, reduced)) : 1;
        double period = periodDays + slope;
        double periodError = inflate / Math.sqrt(see);
        long refCycle = Math.round(meanCycle);
        double epoch = epochDays + refCycle * periodDays + intercept + slope * (refCycle - meanCycle);
        double epochError = inflate * Math.sqrt(1 / sw + Math.pow(refCycle - meanCycle, 2) / see);
        // The epoch is returned for cycle refCycle of the trial ephemeris, i.e. cycle 0 of the new one.
        return new Ephemeris(period, periodError, epoch, epochError, timings.size(), reduced);
    }
}
