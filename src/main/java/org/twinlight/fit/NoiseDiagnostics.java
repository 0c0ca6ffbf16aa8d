package org.twinlight.fit;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.RealMatrix;
import org.apache.commons.math3.linear.SingularValueDecomposition;
import org.twinlight.eclipse.BinaryParameters;
import org.twinlight.photometry.LightCurve;
import org.twinlight.photometry.RobustStatistics;
import org.twinlight.photometry.TimeAveragingBeta;
import org.twinlight.photometry.ValueKind;

/**
 * Whether the residuals of a fit are white, and what their correlation does to the errors: the
 * time-averaging factor β (Pont, Zucker &amp; Queloz 2006, MNRAS 373, 231; Winn et al. 2008,
 * ApJ 683, 1076, §3; computed by {@link TimeAveragingBeta}) over several bin widths, and the
 * residual permutation ("prayer bead": Jenkins, Caldwell &amp; Gilliland 2002, ApJ 564, 495;
 * Southworth 2008, MNRAS 386, 1644, §2.3): the residuals are shifted cyclically along each light
 * curve, added back to the best model and refitted; the spread of the refitted values carries
 * whatever structure in time the noise has.
 *
 * <p>Computed once after a fit, from its problem and result; the fit itself is not changed.
 */
public final class NoiseDiagnostics {

    /** Bin widths tried, minutes. */
    static final double[] WIDTHS_MINUTES = {10, 15, 20, 30, 45, 60, 90, 120, 180, 240};
    /** Bins narrower than this many cadences hold too few points to average anything. */
    static final double MIN_CADENCES_PER_BIN = 3;
    /** The widths run at least up to this, minutes (also when the eclipses are shorter). */
    static final double MIN_LARGEST_WIDTH_MINUTES = 60;
    /**
     * Cyclic shifts of the residual permutation, at most. Each is a refit started at the optimum;
     * 40 keep a 20,000-point fit's permutation to about the cost of the fit (docs/performance.md),
     * and give the spread to about ±11 % (1/√(2·40)) were the shifts independent.
     */
    public static final int MAX_SHIFTS = 40;

    /**
     * Above this many points the permutation is not run (its Jacobian would be held in memory
     * and the fit's own cost dominates); β is still measured.
     */
    public static final int MAX_PERMUTED_POINTS = LeastSquaresSolver.LARGE_PROBLEM_ROWS;

    private NoiseDiagnostics() {
    }

    /** β and the permutation spread of a fit, with {@link #MAX_SHIFTS} shifts at most. */
    public static NoiseReport of(FitProblem problem, FitResult result) {
        return of(problem, result, MAX_SHIFTS);
    }

    /**
     * β and the permutation spread of a fit.
     *
     * @param problem the problem that was solved
     * @param result its solution
     * @param maxShifts cyclic shifts at most (fewer when there are fewer used points)
     */
    public static NoiseReport of(FitProblem problem, FitResult result, int maxShifts) {
        List<FittedCurve> curves = result.curves();
        double durationMinutes = longestEclipseMinutes(result.model().common());
        Map<Double, Double> byWidth = betaByWidth(curves, durationMinutes);
        List<Double> finite = byWidth.values().stream().filter(Double::isFinite).toList();
        double beta = finite.stream().mapToDouble(Double::doubleValue).max().orElse(Double.NaN);
        Permutation p = permute(problem, result, maxShifts);
        return new NoiseReport(beta, byWidth, durationMinutes, p.sigma, p.shifts, 1);
    }

    /**
     * The result with every uncertainty (parameters and derived quantities; for a one-sided limit
     * also the distance of its 95 % value from the best value) multiplied by {@code factor}: the
     * least-squares counterpart of fitting with the data errors multiplied by it. (The covariance
     * errors are scaled by the reduced χ², which the same factor on every error cancels; so the
     * errors are scaled here, once.)
     */
    public static FitResult inflate(FitResult r, double factor) {
        return new FitResult(r.model(), inflate(r.parameters(), factor), inflate(r.derived(), factor), r.freeNames(),
                r.correlation(), r.n(), r.freeCount(), r.chi2(), r.reducedChi2(), r.rms(), r.bic(), r.iterations(),
                r.evaluations(), r.errorsEstimated(), r.adequacy(), r.clipped(), r.notes(), r.curves());
    }

    private static List<Estimate> inflate(List<Estimate> list, double factor) {
        List<Estimate> out = new ArrayList<>();
        for (Estimate e : list) {
            Estimate.Limit limit = e.isLimit() ? new Estimate.Limit(e.limit().side(),
                    e.value() + factor * (e.limit().value95() - e.value())) : null;
            out.add(new Estimate(e.name(), e.band(), e.value(), e.uncertainty() * factor, e.free(), limit));
        }
        return out;
    }

    /**
     * The result as the sampler should start from it when the errors are inflated by
     * {@code factor}: the sampler scales the errors so that the best model has its reduced χ²
     * equal to 1 ({@link PosteriorDensity}), which would undo a factor on the data errors; so the
     * factor enters as the reduced χ² times factor², the errors of the likelihood becoming
     * σ·√χ²ν·factor, the same as the least-squares errors after {@link #inflate}.
     */
    public static FitResult forInflatedSampling(FitResult r, double factor) {
        return new FitResult(r.model(), r.parameters(), r.derived(), r.freeNames(), r.correlation(), r.n(),
                r.freeCount(), r.chi2(), r.reducedChi2() * factor * factor, r.rms(), r.bic(), r.iterations(),
                r.evaluations(), r.errorsEstimated(), r.adequacy(), r.clipped(), r.notes(), r.curves());
    }

    /**
     * The longer of the two eclipses, first to fourth contact, minutes:
     * (P/π)·arcsin(√((r₁+r₂)² − cos²i)/sin i) in a circular orbit (Winn 2010, in Exoplanets, ed.
     * Seager, eq. 14, with the radii in units of a), times √(1−e²)/(1 − e|sin ω|) for the slower
     * conjunction of an eccentric orbit (eq. 16). NaN when the orbit is not eclipsing at all.
     */
    static double longestEclipseMinutes(BinaryParameters p) {
        double i = Math.toRadians(p.inclinationDeg());
        double s = p.sumOfRadii();
        double chord = s * s - Math.cos(i) * Math.cos(i);
        if (!(chord > 0)) {
            return Double.NaN;
        }
        double arg = Math.min(1, Math.sqrt(chord) / Math.sin(i));
        double e = p.eccentricity();
        double slow = Math.sqrt(1 - e * e) / (1 - e * Math.abs(Math.sin(Math.toRadians(p.omegaDeg()))));
        return p.periodDays() / Math.PI * Math.asin(arg) * slow * 1440;
    }

    /**
     * β_w per width (minutes) over the used points' normalised residuals, pooled over the light
     * curves (each curve's β_w weighted by its number of points), counting the fitted baseline
     * coefficients as means removed ({@link TimeAveragingBeta#atWidth(double[], double[], double, int)}). Widths run from the larger of
     * 10 min and three cadences up to the larger of 60 min and the eclipse duration.
     */
    static Map<Double, Double> betaByWidth(List<FittedCurve> curves, double durationMinutes) {
        List<double[][]> series = new ArrayList<>();
        List<Integer> removed = new ArrayList<>();
        double cadenceMinutes = Double.POSITIVE_INFINITY;
        for (FittedCurve c : curves) {
            double[][] tz = usedResiduals(c);
            if (tz[0].length < 2 * TimeAveragingBeta.MIN_BINS) {
                continue;
            }
            series.add(tz);
            int coefficients = 0;
            for (double[] segment : c.baselineCoefficients()) {
                coefficients += segment.length;
            }
            removed.add(Math.max(1, coefficients));
            double[] steps = new double[tz[0].length - 1];
            for (int i = 0; i < steps.length; i++) {
                steps[i] = tz[0][i + 1] - tz[0][i];
            }
            cadenceMinutes = Math.min(cadenceMinutes, RobustStatistics.median(steps) * 1440);
        }
        double largest = Math.max(MIN_LARGEST_WIDTH_MINUTES, Double.isNaN(durationMinutes) ? 0 : durationMinutes);
        Map<Double, Double> out = new LinkedHashMap<>();
        for (double w : WIDTHS_MINUTES) {
            if (w < MIN_CADENCES_PER_BIN * cadenceMinutes || w > largest) {
                continue;
            }
            double sum = 0;
            int weight = 0;
            for (int k = 0; k < series.size(); k++) {
                double[][] tz = series.get(k);
                double b = TimeAveragingBeta.atWidth(tz[0], tz[1], w / 1440, removed.get(k));
                if (Double.isFinite(b)) {
                    sum += b * tz[0].length;
                    weight += tz[0].length;
                }
            }
            out.put(w, weight == 0 ? Double.NaN : sum / weight);
        }
        return out;
    }

    /** {times, (data − model)/σ} of the points that took part in the fit. */
    private static double[][] usedResiduals(FittedCurve c) {
        int n = c.size() - c.clippedCount();
        double[][] tz = new double[2][n];
        int j = 0;
        for (int i = 0; i < c.size(); i++) {
            if (!c.clipped()[i]) {
                tz[0][j] = c.timesDays()[i];
                tz[1][j++] = c.residual(i) / c.errors()[i];
            }
        }
        return tz;
    }

    private record Permutation(Map<String, Double> sigma, int shifts) {
    }

    /**
     * The residual permutation: for shift j = 1..K every light curve's used residuals move by
     * round(j·m/(K+1)) places (m its used points, cyclically), are added to the best model, and
     * the problem is refitted from the optimum with the same points left out, by Gauss–Newton
     * steps with the Jacobian of the optimum held fixed (the chord method; e.g. Kelley 1995,
     * Iterative Methods for Linear and Nonlinear Equations, SIAM, §5.4): the shifted data differ
     * from the fitted ones by noise only, so the Jacobian barely changes, and each refit costs a
     * few model evaluations instead of a Jacobian per iteration. Where those steps do not settle
     * (a value folded at its bound, a strongly curved valley) the shift is refitted by
     * Levenberg–Marquardt instead. The spread per
     * free parameter is the standard deviation of the K refitted values and the best fit's value
     * (the unshifted residuals) about their mean.
     */
    private static Permutation permute(FitProblem problem, FitResult result, int maxShifts) {
        List<FittedCurve> curves = result.curves();
        int fewest = curves.stream().mapToInt(c -> c.size() - c.clippedCount()).min().orElse(0);
        int shifts = Math.min(maxShifts, fewest - 1);
        Map<String, Double> sigma = new LinkedHashMap<>();
        int used = curves.stream().mapToInt(c -> c.size() - c.clippedCount()).sum();
        // a joint fit's velocities are not permuted with the light curve: no permutation spread then
        if (shifts < 2 || used > MAX_PERMUTED_POINTS || problem.objective().layout().velocities() != null) {
            return new Permutation(sigma, 0);
        }
        FitSettings settings = problem.settings().withClipSigma(Double.NaN);
        List<boolean[]> leftOut = curves.stream().map(FittedCurve::clipped).toList();
        ParameterLayout layout = problem.objective().layout();
        List<Integer> freeIdx = new ArrayList<>();
        for (int i = 0; i < layout.externalSize(); i++) {
            if (layout.parameter(i).free()) {
                freeIdx.add(i);
            }
        }
        double[][] values = new double[freeIdx.size()][shifts + 1];
        FitObjective atBest = FitProblem.of(result.model(), problem.data(), settings, problem.objective().priors()).objective()
                .withLeftOut(leftOut);
        ParameterLayout l = atBest.layout();
        double[] x0 = l.startInternal();
        double[] best = l.toExternal(x0);
        for (int a = 0; a < freeIdx.size(); a++) {
            values[a][0] = best[freeIdx.get(a)];
        }
        Chord chord = new Chord(LeastSquaresSolver.jacobian(atBest::evaluate, x0, l.steps(), atBest.size()));
        for (int j = 1; j <= shifts; j++) {
            List<FitData> shifted = new ArrayList<>();
            for (int c = 0; c < curves.size(); c++) {
                shifted.add(shifted(problem.data().get(c), curves.get(c), j, shifts));
            }
            FitObjective objective = FitProblem.of(result.model(), shifted, settings, problem.objective().priors()).objective()
                    .withLeftOut(leftOut);
            double[] x = chord.refit(objective, x0);
            if (x == null) {
                // the fixed Jacobian does not lead to the optimum (near a fold at a bound, or a strongly
                // curved valley): a full Levenberg–Marquardt refit from the optimum
                try {
                    x = LeastSquaresSolver.optimize(objective, x0, settings.maxIterations()).internal();
                } catch (LeastSquaresSolver.NotConverged e) {
                    x = null;
                }
            }
            double[] ext = x == null ? null : l.toExternal(x);
            for (int a = 0; a < freeIdx.size(); a++) {
                // a shift whose refit fails tells nothing about the spread: left out
                values[a][j] = ext == null ? Double.NaN : ext[freeIdx.get(a)];
            }
        }
        boolean multiBand = layout.bands().size() > 1;
        for (int a = 0; a < freeIdx.size(); a++) {
            sigma.put(layout.parameter(freeIdx.get(a)).label(multiBand), standardDeviation(values[a]));
        }
        return new Permutation(sigma, shifts);
    }

    /** Gauss–Newton steps with a fixed Jacobian J: δ = −(JᵀJ)⁺·Jᵀr, the pseudo-inverse from its SVD. */
    private static final class Chord {
        /** Steps at most per refit. */
        private static final int MAX_STEPS = 8;
        /** Converged when no internal coordinate (in units of its scale) moves more than this. */
        private static final double TOLERANCE = 1e-4;

        private final double[][] jacobian;
        private final RealMatrix pseudoInverse;

        Chord(double[][] jacobian) {
            this.jacobian = jacobian;
            int k = jacobian.length == 0 ? 0 : jacobian[0].length;
            double[][] jtj = new double[k][k];
            for (double[] row : jacobian) {
                for (int a = 0; a < k; a++) {
                    for (int b = a; b < k; b++) {
                        jtj[a][b] += row[a] * row[b];
                    }
                }
            }
            for (int a = 0; a < k; a++) {
                for (int b = 0; b < a; b++) {
                    jtj[a][b] = jtj[b][a];
                }
            }
            // the pseudo-inverse leaves a coordinate with no leverage (a value folded at its bound) where it is
            this.pseudoInverse = new SingularValueDecomposition(new Array2DRowRealMatrix(jtj, false)).getSolver()
                    .getInverse();
        }

        /** The refitted internal point, or null when the steps leave the domain or do not settle. */
        double[] refit(FitObjective objective, double[] start) {
            ParameterLayout layout = objective.layout();
            double[] x = start.clone();
            for (int step = 0; step < MAX_STEPS; step++) {
                double[] r = objective.evaluate(x);
                double[] jtr = new double[x.length];
                for (int i = 0; i < r.length; i++) {
                    for (int a = 0; a < x.length; a++) {
                        jtr[a] += jacobian[i][a] * r[i];
                    }
                }
                double[] delta = pseudoInverse.operate(jtr);
                double largest = 0;
                for (int a = 0; a < x.length; a++) {
                    x[a] -= delta[a];
                    largest = Math.max(largest, Math.abs(delta[a]));
                }
                double[] valid = layout.validate(x);
                if (!java.util.Arrays.equals(valid, x)) {
                    return null;
                }
                if (largest < TOLERANCE) {
                    return x;
                }
            }
            return null;
        }
    }

    /** The light curve of the best model plus the used residuals moved by the j-th of K shifts. */
    private static FitData shifted(FitData original, FittedCurve c, int j, int shifts) {
        int[] used = new int[c.size() - c.clippedCount()];
        int m = 0;
        for (int i = 0; i < c.size(); i++) {
            if (!c.clipped()[i]) {
                used[m++] = i;
            }
        }
        int by = (int) Math.round(j * (double) m / (shifts + 1));
        double[] flux = c.flux().clone();
        for (int k = 0; k < m; k++) {
            flux[used[k]] = c.model()[used[k]] + c.residual(used[(k + by) % m]);
        }
        LightCurve lc = original.lightCurve();
        return new FitData(new LightCurve(lc.source(), lc.band(), lc.timeScale(), ValueKind.FLUX, c.timesDays(), flux,
                c.errors(), Map.of()), original.band());
    }

    private static double standardDeviation(double[] v) {
        double sum = 0;
        int n = 0;
        for (double x : v) {
            if (Double.isFinite(x)) {
                sum += x;
                n++;
            }
        }
        if (n < 3) {
            return Double.NaN;
        }
        double mean = sum / n;
        double ss = 0;
        for (double x : v) {
            if (Double.isFinite(x)) {
                ss += (x - mean) * (x - mean);
            }
        }
        return Math.sqrt(ss / (n - 1));
    }
}
