package org.twinlight.fit;

import java.util.Optional;

/**
 * One-sided limits for parameters whose best value sits at a physical bound (i = 90°, e = 0,
 * ℓ₃ = 0), from the profile of χ²: the parameter is held at trial values while every other free
 * parameter is fitted again.
 *
 * <p>The best value "sits at the bound" when holding it at the bound raises χ² by less than 2.71:
 * the bound then lies inside the one-sided 95% interval, and a symmetric error bar (from a
 * linearisation that is poor so close to a fold) would mislead. The reported uncertainty is the one-sided distance to where the profile has risen by 1, and the 95%
 * limit is where it has risen by 2.71 = 1.645²: at a bound the likelihood-ratio statistic follows
 * the mixture ½χ²₀ + ½χ²₁ (Chernoff 1954, Ann. Math. Stat. 25, 573; Self &amp; Liang 1987, J. Am.
 * Stat. Assoc. 82, 605), whose 95% point is the one-sided 2.71.
 */
final class BoundLimits {
    /** Δχ² below which the bound is inside the one-sided 95% interval. */
    static final double AT_BOUND_DELTA_CHI2 = 1.645 * 1.645;
    /** Δχ² of the one-sided 68% distance reported as the uncertainty. */
    static final double ONE_SIGMA_DELTA_CHI2 = 1.0;
    /** Δχ² of the one-sided 95% limit (1.645²). */
    static final double LIMIT95_DELTA_CHI2 = 1.645 * 1.645;
    /**
     * A best value further than this many linear σ from its bound is not profiled. Generous,
     * because near a fold (χ² depending on cos² i) the linear σ understates the distance to the
     * bound in χ²: a value 4 linear σ from i = 90° can be 2 profile σ from it.
     */
    static final double SCREEN_SIGMAS = 10.0;
    private static final int PROFILE_ITERATIONS = 60;
    private static final int ROOT_STEPS = 8;

    /**
     * A profile result.
     *
     * @param index external index of the parameter
     * @param best best value
     * @param at68 value where Δχ² = 1 on the far side of the bound
     * @param at95 value where Δχ² = 2.71 (or the far end of the range, when χ² never rises so far)
     * @param reachedLimit whether Δχ² reached 2.71 inside the range
     * @param ext68 every external parameter at the 68% point (for derived quantities)
     * @param ext95 every external parameter at the 95% point
     * @param deltaChi2AtBound Δχ² with the parameter held at its bound
     * @param profileFits least-squares fits run for the profile
     * @param atBound whether the value sits at its bound (else only {@code deltaChi2AtBound} is set)
     */
    record Profile(int index, double best, double at68, double at95, boolean reachedLimit, double[] ext68,
            double[] ext95, double deltaChi2AtBound, int profileFits, boolean atBound) {

        /**
         * For a value near its bound but not at it, the 1σ distance towards the bound from the
         * quadratic through the profile's minimum and its value at the bound: near a fold the
         * linearised σ understates it.
         */
        double sigmaTowardsBound(double edge) {
            return Math.abs(best - edge) / Math.sqrt(deltaChi2AtBound);
        }
    }

    private final FitObjective objective;
    private final double[] bestExt;
    private final double chi2Min;
    private int fits;

    BoundLimits(FitObjective objective, double[] bestInternal, double chi2Min) {
        this.objective = objective;
        this.bestExt = objective.layout().toExternal(bestInternal);
        this.chi2Min = chi2Min;
    }

    /**
     * The profile of the parameter at {@code index} near its physical bound: at the bound (a
     * limit) or only its Δχ² there; empty when the value is far from the bound.
     *
     * @param linearSigma its linear (covariance) uncertainty, NaN or infinite when unknown
     */
    Optional<Profile> atBound(int index, double linearSigma) {
        FitParameter p = objective.layout().parameter(index);
        double edge = p.edgeValue();
        double best = bestExt[index];
        if (Double.isNaN(edge)) {
            return Optional.empty();
        }
        if (Double.isFinite(linearSigma) && linearSigma > 0 && Math.abs(best - edge) > SCREEN_SIGMAS * linearSigma) {
            return Optional.empty();
        }
        fits = 0;
        Point atEdge = profile(index, edge);
        if (atEdge.delta >= AT_BOUND_DELTA_CHI2) {
            return Optional.of(new Profile(index, best, Double.NaN, Double.NaN, false, null, null, atEdge.delta, fits,
                    false));
        }
        double direction = p.edge() == FitParameter.Edge.UPPER ? -1 : 1;
        double far = p.edge() == FitParameter.Edge.UPPER ? p.lower() : farLimit(p);
        double step = Math.max(5 * p.scale(), Double.isFinite(linearSigma) ? linearSigma : 0);
        double from = Math.abs(best - edge) < step ? edge : best;
        Point lo = atEdge.value == from ? atEdge : profile(index, from);
        Point hi = null;
        Point first68 = null;
        Point lo68 = lo;
        for (double s = step; ; s *= 2) {
            double v = from + direction * s;
            boolean last = direction * (v - far) >= 0;
            Point pt = profile(index, last ? far : v);
            if (first68 == null && pt.delta >= ONE_SIGMA_DELTA_CHI2) {
                first68 = pt;
            } else if (first68 == null) {
                lo68 = pt;
            }
            if (pt.delta >= LIMIT95_DELTA_CHI2 || last) {
                hi = pt;
                break;
            }
            lo = pt;
        }
        boolean reached = hi.delta >= LIMIT95_DELTA_CHI2;
        Point p68 = first68 == null ? hi : root(index, lo68, first68, ONE_SIGMA_DELTA_CHI2);
        Point p95 = reached ? root(index, lo, hi, LIMIT95_DELTA_CHI2) : hi;
        return Optional.of(new Profile(index, best, p68.value, p95.value, reached, p68.ext, p95.ext, atEdge.delta,
                fits, true));
    }

    private static double farLimit(FitParameter p) {
        return switch (p.name()) {
            case "eccentricity" -> 0.9;
            case "thirdLight" -> 0.95;
            default -> p.upper();
        };
    }

    /** Δχ² at one value of the profiled parameter, and the external vector of that fit. */
    private record Point(double value, double delta, double[] ext) {
    }

    private Point profile(int index, double value) {
        ParameterLayout layout = objective.layout();
        double[] ext = bestExt.clone();
        ext[index] = value;
        ParameterLayout fixed = layout.fixing(index, ext);
        FitObjective held = objective.withLayout(fixed);
        double[] start = fixed.validate(fixed.startInternal());
        fits++;
        double chi2;
        double[] best;
        try {
            LeastSquaresSolver.Solution s = LeastSquaresSolver.optimize(held, start, PROFILE_ITERATIONS);
            chi2 = s.chi2();
            best = fixed.toExternal(s.internal());
        } catch (LeastSquaresSolver.NotConverged e) {
            chi2 = held.chi2(start);
            best = fixed.toExternal(start);
        }
        return new Point(value, Math.max(0, chi2 - chi2Min), best);
    }

    /**
     * The value where Δχ² = target between a (below) and b (above), by regula falsi in √Δχ²,
     * which is close to linear in the parameter away from the bound.
     */
    private Point root(int index, Point a, Point b, double target) {
        double t = Math.sqrt(target);
        Point lo = a;
        Point hi = b;
        for (int k = 0; k < ROOT_STEPS; k++) {
            double ga = Math.sqrt(lo.delta) - t;
            double gb = Math.sqrt(hi.delta) - t;
            double v = gb == ga ? 0.5 * (lo.value + hi.value) : lo.value - ga * (hi.value - lo.value) / (gb - ga);
            if (!(Math.min(lo.value, hi.value) < v && v < Math.max(lo.value, hi.value))) {
                v = 0.5 * (lo.value + hi.value);
            }
            Point m = profile(index, v);
            double gm = Math.sqrt(m.delta) - t;
            if (Math.abs(gm) < 0.01) {
                return m;
            }
            if (gm < 0) {
                lo = m;
            } else {
                hi = m;
            }
        }
        return Math.abs(Math.sqrt(lo.delta) - t) < Math.abs(Math.sqrt(hi.delta) - t) ? lo : hi;
    }
}
