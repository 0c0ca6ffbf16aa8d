package org.twinlight.fit;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.SplittableRandom;
import java.util.stream.IntStream;
import org.twinlight.WorkFailedException;
import org.twinlight.eclipse.BinaryParameters;

/**
 * Global search for the minima of a fit's objective: a Latin-hypercube multistart (McKay, Beckman
 * &amp; Conover 1979, Technometrics 21, 239) over a box of the free parameters. χ² is computed at
 * {@link #SCREEN_FACTOR} points of the hypercube per start; the best of them (and the starting
 * model) are each finished by Levenberg–Marquardt on the same {@link FitObjective} the ordinary
 * fit uses, the screen and the starts run in parallel (the result does not depend on the number of threads: each start has its own random
 * stream split from the seed and the minima are merged in start order). Solutions that agree in
 * every free parameter to within {@link #SAME_SCALES} of its scale are one minimum. With both
 * radii free, one more fit starts from the best minimum's radii swapped and keeps k = r₂/r₁ on
 * the other side of 1: in a partial eclipse k against 1/k is often a shallow valley rather than
 * two minima, and this fit says how much worse the other side is.
 *
 * <p>The box (in the sampled coordinates): sum of the radii from 0.6 to 1.5 times the start's,
 * ratio k = r₂/r₁ log-uniform over [1/3, 3] (so that k and 1/k both get starts), cos i uniform
 * from 0 to where the spheres stop eclipsing, surface-brightness ratio log-uniform over a factor 4
 * either side of the start, third light [0, 0.5], e [0, 0.5] with ω uniform, limb-darkening
 * coefficients ±0.2; period and epoch start at their starting values (the ordinary fit refines
 * them; they are found by the period and minima commands, not here).
 */
public final class GlobalSearch {
    /** Least-squares starts at least, and per free parameter. */
    static final int MIN_STARTS = 8;
    static final int STARTS_PER_PARAMETER = 1;
    /** Points of the hypercube screened by their χ² per least-squares start. */
    static final int SCREEN_FACTOR = 16;
    /** Iterations of each start's least-squares finish. */
    static final int ITERATIONS_PER_START = 40;
    /** Relative change of χ² at which a start is finished (the ordinary fit then polishes the best). */
    static final double START_TOLERANCE = 1e-7;
    /** Two solutions within this many scales in every free parameter are the same minimum. */
    static final double SAME_SCALES = 5.0;
    /** Minima closer in χ² than this to the best are reported as competing (Δχ² = 9: 3σ for one parameter). */
    public static final double COMPETING_DELTA_CHI2 = 9.0;
    /** The radius ratio the mirrored fit may reach at most (and 1/this at least). */
    static final double MAX_RADIUS_RATIO = 10;
    /** The seed used when none is given. */
    public static final long DEFAULT_SEED = 1;

    private GlobalSearch() {
    }

    /**
     * One minimum.
     *
     * @param chi2 the minimised sum of squares (data, plus normal priors) over every point
     * @param external every parameter, in the order of {@link FitObjective#parameters()}
     * @param parameters the free parameters by label, then radiusRatio and sumOfRadii
     * @param starts how many starts ended here
     */
    public record Minimum(double chi2, double[] external, Map<String, Double> parameters, int starts) {
    }

    /**
     * The outcome.
     *
     * @param minima the distinct minima, best first
     * @param notes one per minimum that competes with the best (Δχ² &lt; 9), in words
     * @param starts least-squares starts run
     * @param best the problem started from the best minimum, for the ordinary fit
     */
    public record Result(List<Minimum> minima, List<String> notes, int starts, FitProblem best) {
    }

    /** The search with {@link #DEFAULT_SEED} and the default number of starts. */
    public static Result run(FitProblem problem) {
        return run(problem, DEFAULT_SEED, 0);
    }

    /**
     * Runs the search.
     *
     * @param seed seed of the Latin hypercube
     * @param starts number of least-squares starts; 0 for max(8, number of solver coordinates)
     * @throws WorkFailedException when no start reaches a model with eclipses
     */
    public static Result run(FitProblem problem, long seed, int starts) {
        FitObjective objective = problem.objective();
        ParameterLayout layout = objective.layout();
        Box box = new Box(layout);
        int n = starts > 0 ? starts : Math.max(MIN_STARTS, STARTS_PER_PARAMETER * layout.internalSize());
        int screened = SCREEN_FACTOR * n;
        double[][] unit = latinHypercube(screened, box.dimensions(), seed);
        // screen: χ² at every point of the hypercube (one model evaluation each), then finish the
        // n best, and the starting model, by least squares
        double[] screenChi2 = IntStream.range(0, screened).parallel().mapToDouble(s -> {
            double[] x = layout.validate(layout.toInternal(box.point(unit[s])));
            try {
                double c = objective.chi2(x);
                return Double.isNaN(c) ? Double.POSITIVE_INFINITY : c;
            } catch (IllegalArgumentException e) {
                return Double.POSITIVE_INFINITY;
            }
        }).toArray();
        Integer[] order = IntStream.range(0, screened).boxed().toArray(Integer[]::new);
        java.util.Arrays.sort(order, Comparator.comparingDouble(s -> screenChi2[s]));
        double[][] startPoints = new double[n][];
        startPoints[0] = layout.startExternal();
        for (int s = 1; s < n; s++) {
            startPoints[s] = box.point(unit[order[s - 1]]);
        }
        List<double[]> ends = IntStream.range(0, n).parallel().mapToObj(s -> finish(objective, startPoints[s]))
                .toList();
        List<double[]> all = new ArrayList<>(ends);
        List<Minimum> minima = merge(objective, all);
        if (minima.isEmpty()) {
            throw new WorkFailedException("the global search found no model with eclipses from " + n + " starts; "
                    + "check period and epoch (the period and minima commands find them)");
        }
        double[] mirrored = mirrored(objective, minima.get(0));
        if (mirrored != null) {
            all.add(mirrored);
            minima = merge(objective, all);
        }
        List<String> notes = notes(minima, layout);
        FitProblem best = problem.startingFrom(layout.modelFile(minima.get(0).external()));
        return new Result(minima, notes, n, best);
    }

    /**
     * The best fit with k = r₂/r₁ on the other side of 1 than the best minimum's (started from the
     * swapped radii, k held there by a uniform prior): whether the primary may be the smaller star.
     * In a partial eclipse the radii can often be swapped with little change of the light curve,
     * and a multistart alone may not find that branch when it is a shallow valley rather than a
     * separate minimum. Null when the radii are not both free or the fit fails.
     */
    private static double[] mirrored(FitObjective objective, Minimum best) {
        ParameterLayout layout = objective.layout();
        if (!layout.isFree(ParameterLayout.RADIUS1) || !layout.isFree(ParameterLayout.RADIUS2)) {
            return null;
        }
        double[] ext = best.external().clone();
        double r1 = ext[ParameterLayout.RADIUS1];
        double r2 = ext[ParameterLayout.RADIUS2];
        ext[ParameterLayout.RADIUS1] = r2;
        ext[ParameterLayout.RADIUS2] = r1;
        double k = r1 / r2;
        Prior side = k >= 1 ? new Prior.Uniform(1, MAX_RADIUS_RATIO) : new Prior.Uniform(1 / MAX_RADIUS_RATIO, 1);
        if (!side.allows(k)) {
            return null;
        }
        try {
            return finish(objective.startingAt(ext, "radiusRatio", side), ext);
        } catch (org.twinlight.BadInputException e) {
            return null;
        }
    }

    /** Least squares from one start; null when it fails or ends without eclipses. */
    private static double[] finish(FitObjective objective, double[] startExt) {
        ParameterLayout layout = objective.layout();
        // a start outside a uniform prior is moved inside by the objective's validator
        double[] x0 = layout.validate(layout.toInternal(startExt));
        try {
            LeastSquaresSolver.Solution s = LeastSquaresSolver.optimize(objective, x0, ITERATIONS_PER_START,
                    START_TOLERANCE);
            double[] ext = layout.toExternal(s.internal());
            if (objective.lightCurves().eclipsedPoints(ext) == 0) {
                return null;
            }
            double[] out = java.util.Arrays.copyOf(ext, ext.length + 1);
            out[ext.length] = s.chi2();
            return out;
        } catch (LeastSquaresSolver.NotConverged | IllegalArgumentException e) {
            return null;
        }
    }

    /** Distinct minima, best first; each keeps its lowest-χ² member. */
    private static List<Minimum> merge(FitObjective objective, List<double[]> ends) {
        ParameterLayout layout = objective.layout();
        List<double[]> sorted = ends.stream().filter(e -> e != null).sorted(Comparator.comparingDouble(
                e -> e[e.length - 1])).toList();
        List<double[]> kept = new ArrayList<>();
        List<Integer> counts = new ArrayList<>();
        for (double[] e : sorted) {
            int same = -1;
            for (int m = 0; m < kept.size() && same < 0; m++) {
                if (same(layout, kept.get(m), e)) {
                    same = m;
                }
            }
            if (same < 0) {
                kept.add(e);
                counts.add(1);
            } else {
                counts.set(same, counts.get(same) + 1);
            }
        }
        List<Minimum> out = new ArrayList<>();
        boolean multiBand = layout.bands().size() > 1;
        for (int m = 0; m < kept.size(); m++) {
            double[] e = kept.get(m);
            double[] ext = java.util.Arrays.copyOf(e, e.length - 1);
            Map<String, Double> named = new LinkedHashMap<>();
            for (int i = 0; i < layout.externalSize(); i++) {
                if (layout.isFree(i)) {
                    named.put(layout.parameter(i).label(multiBand), ext[i]);
                }
            }
            BinaryParameters p = layout.parameters(ext, 0);
            named.put("radiusRatio", p.radiusRatio());
            named.put("sumOfRadii", p.sumOfRadii());
            out.add(new Minimum(e[e.length - 1], ext, java.util.Collections.unmodifiableMap(named), counts.get(m)));
        }
        return List.copyOf(out);
    }

    private static boolean same(ParameterLayout layout, double[] a, double[] b) {
        for (int i = 0; i < layout.externalSize(); i++) {
            FitParameter p = layout.parameter(i);
            if (p.free() && Math.abs(a[i] - b[i]) > SAME_SCALES * p.scale()) {
                return false;
            }
        }
        return true;
    }

    /** A note for each minimum within Δχ² of the best, naming what differs. */
    private static List<String> notes(List<Minimum> minima, ParameterLayout layout) {
        List<String> out = new ArrayList<>();
        Minimum best = minima.get(0);
        for (int m = 1; m < minima.size(); m++) {
            Minimum other = minima.get(m);
            double delta = other.chi2() - best.chi2();
            if (!(delta < COMPETING_DELTA_CHI2)) {
                continue;
            }
            double kb = best.parameters().get("radiusRatio");
            double ko = other.parameters().get("radiusRatio");
            if ((kb - 1) * (ko - 1) <= 0 && Math.abs(ko - 1) < 0.01) {
                out.add(String.format(Locale.ROOT, "k = %.2f fits best, but k %s 1 is only Δχ² = %.1f worse: the "
                        + "primary may be the smaller star, and the data hardly constrain k. A spectroscopic light "
                        + "ratio (a prior on lightRatio in the model file) or the second star's velocities would "
                        + "settle it", kb, kb < 1 ? "≥" : "≤", delta));
            } else if ((kb - 1) * (ko - 1) < 0) {
                out.add(String.format(Locale.ROOT, "k = %.2f and k = %.2f fit almost equally well (Δχ² = %.1f): the "
                        + "primary may be the smaller star. A spectroscopic light ratio (a prior on lightRatio in "
                        + "the model file) or the second star's velocities would settle it", Math.min(kb, ko),
                        Math.max(kb, ko), delta));
            } else {
                out.add(String.format(Locale.ROOT, "two solutions fit almost equally well (Δχ² = %.1f): %s. The data "
                        + "cannot choose between them; the fit reports the better one", delta,
                        differences(layout, best, other)));
            }
        }
        return out;
    }

    /** The two parameters that differ most between two minima, in units of their scales, in words. */
    private static String differences(ParameterLayout layout, Minimum a, Minimum b) {
        boolean multiBand = layout.bands().size() > 1;
        List<int[]> order = new ArrayList<>();
        for (int i = 0; i < layout.externalSize(); i++) {
            if (layout.isFree(i)) {
                order.add(new int[] {i});
            }
        }
        order.sort(Comparator.comparingDouble(ix -> -Math.abs(a.external()[ix[0]] - b.external()[ix[0]])
                / layout.parameter(ix[0]).scale()));
        List<String> parts = new ArrayList<>();
        for (int j = 0; j < Math.min(2, order.size()); j++) {
            int i = order.get(j)[0];
            parts.add(String.format(Locale.ROOT, "%s = %.4g or %.4g", layout.parameter(i).label(multiBand),
                    a.external()[i], b.external()[i]));
        }
        return String.join(", ", parts);
    }

    /** n points of a Latin hypercube in [0, 1)^d: each coordinate takes each of n strata once. */
    static double[][] latinHypercube(int n, int d, long seed) {
        SplittableRandom root = new SplittableRandom(seed);
        double[][] u = new double[n][d];
        for (int j = 0; j < d; j++) {
            SplittableRandom r = root.split();
            int[] perm = IntStream.range(0, n).toArray();
            for (int i = n - 1; i > 0; i--) {
                int k = r.nextInt(i + 1);
                int t = perm[i];
                perm[i] = perm[k];
                perm[k] = t;
            }
            for (int i = 0; i < n; i++) {
                u[i][j] = (perm[i] + r.nextDouble()) / n;
            }
        }
        return u;
    }

    /** The search box over the free parameters, in sampled coordinates. */
    private static final class Box {
        private final ParameterLayout layout;
        private final double[] start;
        private final List<Integer> sampled = new ArrayList<>();
        private final boolean radiusPair;

        Box(ParameterLayout layout) {
            this.layout = layout;
            this.start = layout.startExternal();
            radiusPair = layout.isFree(ParameterLayout.RADIUS1) && layout.isFree(ParameterLayout.RADIUS2);
            for (int i = 0; i < layout.externalSize(); i++) {
                if (layout.isFree(i) && i != ParameterLayout.PERIOD && i != ParameterLayout.EPOCH) {
                    sampled.add(i);
                }
            }
        }

        int dimensions() {
            return Math.max(1, sampled.size());
        }

        double[] point(double[] u) {
            double[] ext = start.clone();
            double sum = start[ParameterLayout.RADIUS1] + start[ParameterLayout.RADIUS2];
            for (int j = 0; j < sampled.size(); j++) {
                int i = sampled.get(j);
                FitParameter p = layout.parameter(i);
                double v = p.value();
                double x = u[j];
                ext[i] = switch (p.name()) {
                    case "radius1" -> radiusPair ? Math.log(1.0 / 3) + x * Math.log(9) : v * (0.6 + 0.9 * x);
                    case "radius2" -> radiusPair ? sum * (0.6 + 0.9 * x) : v * (0.6 + 0.9 * x);
                    case "inclination" -> Double.NaN;
                    case "eccentricity" -> 0.5 * x;
                    case "omega" -> 360 * x;
                    case "surfaceBrightnessRatio" -> v * Math.exp(Math.log(4) * (2 * x - 1));
                    case "thirdLight" -> 0.5 * x;
                    default -> v + 0.2 * (2 * x - 1);
                };
            }
            if (radiusPair) {
                // radius1 holds ln k and radius2 the sum: turn them into the radii
                double k = Math.exp(ext[ParameterLayout.RADIUS1]);
                double s = ext[ParameterLayout.RADIUS2];
                ext[ParameterLayout.RADIUS1] = s / (1 + k);
                ext[ParameterLayout.RADIUS2] = s * k / (1 + k);
            }
            int inc = sampled.indexOf(ParameterLayout.INCLINATION);
            if (inc >= 0) {
                double s = ext[ParameterLayout.RADIUS1] + ext[ParameterLayout.RADIUS2];
                double e = ext[ParameterLayout.ECCENTRICITY];
                double cosMax = Math.min(0.99, s / (1 - e) * 1.1);
                ext[ParameterLayout.INCLINATION] = Math.toDegrees(Math.acos(cosMax * u[inc]));
            }
            return ext;
        }
    }
}
