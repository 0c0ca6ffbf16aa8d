package org.twinlight.analysis;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import org.twinlight.WorkFailedException;
import org.twinlight.eclipse.ModelFile;
import org.twinlight.fit.EclipseFitter;
import org.twinlight.fit.Estimate;
import org.twinlight.fit.FitData;
import org.twinlight.fit.FitResult;
import org.twinlight.fit.FitSettings;
import org.twinlight.fit.FittedCurve;
import org.twinlight.fit.Prior;
import org.twinlight.fit.Priors;
import org.twinlight.photometry.LightCurve;
import org.twinlight.statistics.FitStatistics;

/**
 * The profile of χ² along the inclination, for a fit in which the inclination is strongly
 * correlated with another parameter (partial eclipses: i with the radius ratio, the limb darkening,
 * e sin ω). There the covariance error assumes a parabolic χ² along a straight valley; the valley
 * is curved and flatter, and the covariance errors of i and of the parameters that move with it
 * are too small. The profile fixes i at steps away from the best value, refits every other free
 * parameter on the points the fit used, and finds on each side where χ² (data and normal priors)
 * has risen by the fit's variance scale (Δχ² = 1 scaled as the covariance errors are: the profile
 * likelihood interval, e.g. Press et al. 2007, Numerical Recipes 3rd ed., §15.6.5). The quoted
 * error of i is then the larger of the covariance error and the profile's half-widths; every other
 * free parameter and derived quantity gets the larger of its covariance error and its shift between
 * the best fit and those two points of the profile. Never narrower than the covariance errors.
 */
final class InclinationProfile {
    /** Profiled when the inclination correlates with another free parameter beyond this (common practice, no source). */
    static final double CORRELATION_LEVEL = 0.95;
    /** Steps outwards on each side at most. */
    private static final int MAX_STEPS = 6;
    /** Factor between successive steps (in units of the covariance error). */
    private static final double STEP_FACTOR = 1.8;
    /** Iterations of one profile fit (it starts next to its minimum). */
    private static final int PROFILE_ITERATIONS = 40;

    /**
     * The profile and what it changed.
     *
     * @param bestDeg the best inclination
     * @param covarianceSigmaDeg the covariance error of the inclination
     * @param lowerDeg where χ² has risen by the variance scale below the best value (or the last value reached)
     * @param upperDeg the same above (90° when the profile stays flat up to it)
     * @param sigmaDeg the error of the inclination after the profile
     * @param varianceScale the rise of χ² that marks 1σ
     * @param correlatedWith the parameter most correlated with the inclination, and its correlation
     * @param points the profile: inclination and Δχ², in the order computed
     * @param widened quantities whose error the profile widened: name (with band) → [covariance, profile] error
     */
    record Result(double bestDeg, double covarianceSigmaDeg, double lowerDeg, double upperDeg, double sigmaDeg,
            double varianceScale, String correlatedWith, double correlation, List<double[]> points,
            Map<String, double[]> widened) {

        /** Whether the profile widened the inclination's error. */
        boolean widenedInclination() {
            return sigmaDeg > covarianceSigmaDeg * 1.0001;
        }

        /** A sentence for the notes and the report's cautions. */
        String sentence() {
            return String.format(Locale.ROOT, "the inclination is correlated with %s (ρ = %.3f): its χ² was "
                    + "profiled (i fixed at %d values, every other parameter refitted); χ² rises by %.2f (1σ) at "
                    + "i = %.3f° and %.3f°, so its error is %.3f° (the covariance error, a parabola, says %.3f°)%s",
                    correlatedWith, correlation, points.size(), varianceScale, lowerDeg, upperDeg, sigmaDeg,
                    covarianceSigmaDeg, widened.size() > 1 ? "; the errors of " + String.join(", ",
                            widened.keySet().stream().filter(n -> !n.equals("inclination")).toList())
                            + " were widened to their shifts along the profile" : "");
        }
    }

    private InclinationProfile() {
    }

    /**
     * Profiles the inclination of {@code r} when it is free, not a one-sided limit, and correlated
     * beyond {@link #CORRELATION_LEVEL} with another free parameter; empty otherwise.
     *
     * @param data the data the fit used (the clipped points are left out here)
     */
    static java.util.Optional<Result> of(FitResult r, List<FitData> data, FitSettings settings, Priors priors) {
        int ii = r.freeNames().indexOf("inclination");
        Estimate inc = r.get("inclination");
        if (ii < 0 || inc.isLimit() || !(inc.uncertainty() > 0)) {
            return java.util.Optional.empty();
        }
        int partner = -1;
        for (int j = 0; j < r.freeNames().size(); j++) {
            if (j != ii && (partner < 0 || Math.abs(r.correlation()[ii][j]) > Math.abs(r.correlation()[ii][partner]))) {
                partner = j;
            }
        }
        if (partner < 0 || !(Math.abs(r.correlation()[ii][partner]) > CORRELATION_LEVEL)) {
            return java.util.Optional.empty();
        }
        List<FitData> used = usedData(data, r);
        double scale = FitStatistics.varianceScale(r.chi2(), r.n() - r.freeCount(), r.errorsEstimated());
        Set<String> free = new LinkedHashSet<>(settings.free());
        free.remove("inclination");
        FitSettings fixedI = settings.withFree(free).withClipSigma(Double.NaN).withMaxIterations(PROFILE_ITERATIONS);
        double best = inc.value();
        double sigma = inc.uncertainty();
        double total = objective(r, priors);
        List<double[]> points = new ArrayList<>();
        double[] edges = new double[2];
        FitResult[] at = new FitResult[2];
        for (int side = 0; side < 2; side++) {
            double sign = side == 0 ? -1 : 1;
            double prevStep = 0;
            double prevDelta = 0;
            FitResult prevFit = null;
            FitResult from = r;
            edges[side] = best;
            double step = sigma;
            for (int k = 0; k < MAX_STEPS; k++, step *= STEP_FACTOR) {
                double i = best + sign * step;
                if (i >= 90) {
                    // flat up to the edge of the physical range: the side reaches 90°
                    edges[side] = 90;
                    at[side] = prevFit;
                    break;
                }
                FitResult f;
                try {
                    f = EclipseFitter.optimize(org.twinlight.fit.FitProblem.of(withInclination(from.model(), i), used,
                            fixedI, priors));
                } catch (WorkFailedException | IllegalArgumentException e) {
                    edges[side] = best + sign * (prevStep > 0 ? prevStep : sigma);
                    at[side] = prevFit;
                    break;
                }
                double delta = Math.max(0, objective(f, priors) - total);
                points.add(new double[] {i, delta});
                if (delta >= scale) {
                    // linear in √Δχ² between the last two points (√Δχ² is linear in the offset for a parabola)
                    double a = Math.sqrt(prevDelta);
                    double b = Math.sqrt(delta);
                    double t = b > a ? (Math.sqrt(scale) - a) / (b - a) : 1;
                    edges[side] = best + sign * (prevStep + t * (step - prevStep));
                    at[side] = interpolate(prevFit == null ? r : prevFit, f, t);
                    break;
                }
                prevStep = step;
                prevDelta = delta;
                prevFit = f;
                from = f;
                edges[side] = i;
                at[side] = f;
            }
        }
        double sigmaDeg = Math.max(sigma, Math.max(best - edges[0], edges[1] - best));
        Map<String, double[]> widened = new LinkedHashMap<>();
        if (sigmaDeg > sigma) {
            widened.put("inclination", new double[] {sigma, sigmaDeg});
        }
        for (List<Estimate> list : List.of(r.parameters(), r.derived())) {
            for (Estimate e : list) {
                if (!e.free() || e.isLimit() || e.name().equals("inclination")) {
                    continue;
                }
                double shift = 0;
                for (FitResult f : at) {
                    if (f != null) {
                        shift = Math.max(shift, Math.abs(f.get(e.name(), e.band()).value() - e.value()));
                    }
                }
                if (shift > e.uncertainty()) {
                    widened.put(e.band() == null ? e.name() : e.name() + "@" + e.band(),
                            new double[] {e.uncertainty(), shift});
                }
            }
        }
        return java.util.Optional.of(new Result(best, sigma, edges[0], edges[1], sigmaDeg, scale,
                r.freeNames().get(partner), r.correlation()[ii][partner], List.copyOf(points), widened));
    }

    /** The fit with the errors the profile widened (values, correlations and everything else unchanged). */
    static FitResult widen(FitResult r, Result p) {
        List<Estimate> params = widened(r.parameters(), p);
        List<Estimate> derived = widened(r.derived(), p);
        return new FitResult(r.model(), params, derived, r.freeNames(), r.correlation(), r.n(), r.freeCount(),
                r.chi2(), r.reducedChi2(), r.rms(), r.bic(), r.iterations(), r.evaluations(), r.errorsEstimated(),
                r.adequacy(), r.clipped(), r.notes(), r.curves());
    }

    private static List<Estimate> widened(List<Estimate> list, Result p) {
        List<Estimate> out = new ArrayList<>();
        for (Estimate e : list) {
            double[] w = p.widened().get(e.band() == null ? e.name() : e.name() + "@" + e.band());
            out.add(w == null ? e : new Estimate(e.name(), e.band(), e.value(), w[1], e.free(), e.limit()));
        }
        return out;
    }

    /** χ² of the data and the normal priors' pseudo-residuals squared: what the solver minimises. */
    static double objective(FitResult r, Priors priors) {
        double sum = r.chi2();
        for (Map.Entry<String, Prior> e : priors.byName().entrySet()) {
            if (e.getValue() instanceof Prior.Normal n) {
                int at = e.getKey().indexOf('@');
                String name = at < 0 ? e.getKey() : e.getKey().substring(0, at);
                String band = at < 0 ? null : e.getKey().substring(at + 1);
                double z = n.residual(r.get(name, band).value());
                sum += z * z;
            }
        }
        return sum;
    }

    /** A stand-in fit whose values lie a fraction {@code t} of the way from {@code a} to {@code b}. */
    private static FitResult interpolate(FitResult a, FitResult b, double t) {
        double u = Math.max(0, Math.min(1, t));
        return new FitResult(b.model(), mix(a.parameters(), b.parameters(), u), mix(a.derived(), b.derived(), u),
                b.freeNames(), b.correlation(), b.n(), b.freeCount(), b.chi2(), b.reducedChi2(), b.rms(), b.bic(),
                b.iterations(), b.evaluations(), b.errorsEstimated(), b.adequacy(), b.clipped(), b.notes(),
                b.curves());
    }

    private static List<Estimate> mix(List<Estimate> a, List<Estimate> b, double t) {
        List<Estimate> out = new ArrayList<>();
        for (int k = 0; k < b.size(); k++) {
            Estimate y = b.get(k);
            double x = k < a.size() && a.get(k).name().equals(y.name()) ? a.get(k).value() : y.value();
            out.add(new Estimate(y.name(), y.band(), x + t * (y.value() - x), y.uncertainty(), y.free(), y.limit()));
        }
        return out;
    }

    private static ModelFile withInclination(ModelFile m, double deg) {
        return new ModelFile(m.common().withInclinationDeg(deg), m.bands(), m.commonComplete());
    }

    /**
     * The data without the points the fit clipped, with the errors the fit used (given, or estimated
     * from the scatter: then carried over so that every profile fit weighs the points alike).
     */
    static List<FitData> usedData(List<FitData> data, FitResult r) {
        if (r.curves().size() != data.size()) {
            return data;
        }
        List<FitData> out = new ArrayList<>();
        for (int c = 0; c < data.size(); c++) {
            LightCurve lc = data.get(c).lightCurve();
            FittedCurve fc = r.curves().get(c);
            if (fc.size() != lc.size()) {
                return data;
            }
            int n = lc.size() - fc.clippedCount();
            double[] t = new double[n];
            double[] f = new double[n];
            double[] e = new double[n];
            int j = 0;
            for (int i = 0; i < lc.size(); i++) {
                if (fc.clipped()[i]) {
                    continue;
                }
                t[j] = lc.time(i);
                f[j] = lc.flux(i);
                e[j] = lc.hasErrors() ? lc.fluxError(i) : fc.errors()[i] * lc.flux(i) / fc.flux()[i];
                j++;
            }
            out.add(new FitData(new LightCurve(lc.source(), lc.band(), lc.timeScale(), lc.originalKind(), t, f, e,
                    lc.rejectedRows()), data.get(c).band()));
        }
        return out;
    }
}
