package org.twinlight.analysis;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Locale;
import java.util.Set;
import java.util.function.Consumer;
import org.twinlight.WorkFailedException;
import org.twinlight.eclipse.BinaryParameters;
import org.twinlight.eclipse.LimbDarkening;
import org.twinlight.eclipse.ModelFile;
import org.twinlight.fit.EclipseFitter;
import org.twinlight.fit.Estimate;
import org.twinlight.fit.FitData;
import org.twinlight.fit.FitProblem;
import org.twinlight.fit.FitResult;
import org.twinlight.fit.FitSettings;
import org.twinlight.fit.GlobalSearch;
import org.twinlight.fit.Prior;
import org.twinlight.fit.Priors;
import org.twinlight.fit.NoiseDiagnostics;
import org.twinlight.fit.NoiseReport;
import org.twinlight.fit.StartingValues;
import org.twinlight.photometry.LightCurve;

/**
 * The least-squares fit from several well-spread starting points found from the eclipses, then
 * the global search: each start is run a few Levenberg–Marquardt iterations on a thinned copy of
 * the data (every point in eclipse, a sample of the rest); from the lowest χ² the fit's global
 * search ({@link GlobalSearch}: a Latin-hypercube multistart over the free parameters' ranges, and
 * the radii swapped) runs on the same thinned copy, and its best minimum is refined on all the data
 * with the requested settings. With e and ω free the circular orbit is fitted too and the lower BIC
 * kept ({@link OrbitChoice}); a strongly correlated inclination gets its error from the profile of
 * χ² ({@link InclinationProfile}); then the correlated-noise diagnostics every fit gets
 * ({@link NoiseDiagnostics}). Free limb-darkening coefficients carry a normal prior
 * ({@link #LIMB_DARKENING_PRIOR_SIGMA}) throughout. The starts and the search use a third of the
 * sub-exposures of the final fit. Competing minima (Δχ² &lt; 10 on the thinned data, which keeps
 * every point in eclipse) are named in the notes.
 */
final class MultiStartFit {
    /** Points of the thinned copy the starts are compared on, at most (out of eclipse thinned first). */
    static final int TRIAL_POINTS = 2000;
    /** Points out of eclipse the thinned copy keeps at least (when there are so many). */
    static final int MIN_OUT_OF_ECLIPSE = 200;
    /** The starts and the global search average this many times fewer sub-exposures than the final fit. */
    static final int TRIAL_SUB_EXPOSURE_DIVISOR = 3;
    /** Iterations of each trial. */
    static final int TRIAL_ITERATIONS = 15;
    /** A second minimum within this Δχ² of the best (on the thinned data) is reported as a rival. */
    static final double RIVAL_DELTA_CHI2 = 10;

    private MultiStartFit() {
    }

    /**
     * One starting point.
     *
     * @param label what it is, in words
     * @param model the starting model
     */
    record Start(String label, ModelFile model) {
    }

    /**
     * Where a start ended on the thinned data.
     *
     * @param start the start
     * @param chi2 χ² reached (infinite when it failed)
     * @param end the model reached (null when it failed)
     * @param failure why it failed (null when it did not)
     */
    record Trial(Start start, double chi2, ModelFile end, String failure) {
    }

    /**
     * The fit and how it was found.
     *
     * @param result the fit on all the data
     * @param trials every start and where it ended, in the order tried
     * @param thinnedPoints points of the thinned copy
     * @param notes remarks (rival minima, correlated noise)
     * @param noise the correlated-noise diagnostics of the fit (β, residual permutation, the error to quote)
     * @param priors the priors of the fit (those on the limb darkening)
     * @param orbit the choice between an eccentric and a circular orbit, null when e and ω were not free
     * @param inclinationProfile the profile of χ² along the inclination, null when not run
     * @param problem the problem of the final fit (its free parameters after the orbit choice, its
     *     priors), which the stages after the fit start from
     */
    record Outcome(FitResult result, List<Trial> trials, int thinnedPoints, List<String> notes, NoiseReport noise,
            Priors priors, OrbitChoice orbit, InclinationProfile.Result inclinationProfile, FitProblem problem) {
    }

    /**
     * The choice between an eccentric and a circular orbit: both fitted on all the data, the lower
     * Bayesian information criterion kept (Schwarz 1978, Ann. Stat. 6, 461).
     *
     * @param circular whether the circular orbit (e and ω held at 0) was kept
     * @param bicEccentric BIC of the fit with e and ω free (NaN when it failed)
     * @param bicCircular BIC of the fit with e = 0 (NaN when it failed or was not needed)
     * @param eccentricSigmas the larger of |e cos ω| and |e sin ω| in standard errors of the eccentric fit
     *     (NaN when unknown)
     */
    record OrbitChoice(boolean circular, double bicEccentric, double bicCircular, double eccentricSigmas) {
        /** A sentence for the notes and the report. */
        String sentence() {
            if (Double.isNaN(bicCircular) && Double.isFinite(eccentricSigmas)) {
                return String.format(Locale.ROOT, "the orbit is clearly eccentric (e cos ω or e sin ω %.0f standard "
                        + "errors from 0): the circular orbit, far worse by BIC, was not fitted", eccentricSigmas);
            }
            return String.format(Locale.ROOT, "the orbit was fitted both eccentric (BIC %.1f) and circular (BIC %.1f); "
                    + "the %s orbit has the lower BIC and is kept%s", bicEccentric, bicCircular,
                    circular ? "circular" : "eccentric", circular ? " (e and ω held at 0)" : "");
        }
    }

    /**
     * Beyond this many standard errors of e cos ω or e sin ω from 0 (plus the BIC's penalty for two
     * parameters, √(2 ln n) each way) the circular orbit cannot have the lower BIC: Δχ² ≈ z² against
     * a penalty of 2 ln n (Schwarz 1978); it is then not fitted.
     */
    static final double CLEARLY_ECCENTRIC_MARGIN_SIGMAS = 3;

    /**
     * Width of the normal prior on each free limb-darkening coefficient, centred on its start value:
     * coefficients of model atmospheres and those fitted to well-observed eclipses commonly differ by
     * about 0.1–0.2 (common practice, no source). Free with no prior, the coefficient wanders along
     * the valley of partial eclipses and biases the radii of noisy ground-based data.
     */
    static final double LIMB_DARKENING_PRIOR_SIGMA = 0.15;

    /**
     * The well-spread starts around the estimate from the data: the estimate itself; the radius
     * ratio inverted (partial eclipses hardly tell k from 1/k); grazing, intermediate and central
     * impact parameters; and a circular orbit. The first {@code n} of these.
     */
    static List<Start> starts(ModelFile base, Map<String, StartingValues> estimates, Set<String> free, int n) {
        List<Start> list = new ArrayList<>();
        list.add(new Start("estimate from the eclipses", StartingValues.apply(base, estimates, free)));
        StartingValues g = estimates.values().iterator().next();
        double k = g.radiusRatio();
        double sum = g.sumOfRadii();
        double[][] variants = {{1 / k, Double.NaN}, {k, 0.1}, {k, 0.5}, {k, 0.8}, {1 / k, 0.5}, {1 / k, 0.1},
            {k, 0.95}, {1 / k, 0.8}};
        for (double[] v : variants) {
            double incl = Double.isNaN(v[1]) ? g.inclinationDeg() : Math.toDegrees(Math.acos(v[1] * sum));
            StartingValues s = new StartingValues(g.secondaryPhase(), g.secondarySeen(), g.primaryDepth(),
                    g.secondaryDepth(), g.primaryWidth(), g.secondaryWidth(), g.flatBottomed(), g.eCosOmega(),
                    g.eSinOmega(), sum, v[0], incl, g.surfaceBrightnessRatio());
            String label = String.format(Locale.ROOT, "k = %.3f, %s", v[0], Double.isNaN(v[1])
                    ? "i from the eclipse shape" : String.format(Locale.ROOT, "cos i = %.2f (r₁ + r₂)", v[1]));
            add(list, label, base, estimates, s, free);
        }
        if (Math.hypot(g.eCosOmega(), g.eSinOmega()) > 0) {
            StartingValues c = new StartingValues(0.5, g.secondarySeen(), g.primaryDepth(), g.secondaryDepth(),
                    g.primaryWidth(), g.secondaryWidth(), g.flatBottomed(), 0, 0, sum, k, g.inclinationDeg(),
                    g.surfaceBrightnessRatio());
            int before = list.size();
            add(list, "circular orbit", base, estimates, c, free);
            if (list.size() > before) {
                Start circular = list.remove(list.size() - 1);
                list.add(Math.min(list.size(), 3), circular);
            }
        }
        return List.copyOf(list.subList(0, Math.min(n, list.size())));
    }

    /** Adds a start whose geometry (the first band's estimate) is {@code s}. */
    private static void add(List<Start> list, String label, ModelFile base, Map<String, StartingValues> estimates,
            StartingValues s, Set<String> free) {
        Map<String, StartingValues> varied = new LinkedHashMap<>(estimates);
        varied.put(estimates.keySet().iterator().next(), s);
        try {
            Start start = new Start(label, StartingValues.apply(base, varied, free));
            BinaryParameters p = start.model().common();
            boolean repeated = list.stream().map(x -> x.model().common()).anyMatch(q -> Math.abs(q.radius1()
                    - p.radius1()) < 1e-9 && Math.abs(q.radius2() - p.radius2()) < 1e-9
                    && Math.abs(q.inclinationDeg() - p.inclinationDeg()) < 1e-9
                    && Math.abs(q.eccentricity() - p.eccentricity()) < 1e-9);
            if (!repeated) {
                // (k = 1 makes the inverted ratio the same start)
                list.add(start);
            }
        } catch (IllegalArgumentException impossible) {
            // a variant outside the physical range (spheres touching) is no start
        }
    }

    /**
     * Runs every start on the thinned data, then the best on all data.
     *
     * @throws WorkFailedException when no start converges, with each start's reason
     */
    static Outcome fit(List<Start> starts, List<FitData> data, FitSettings settings, double eclipseHalfWidthPhase,
            Consumer<String> sink) {
        return fit(starts, data, settings, eclipseHalfWidthPhase, sink, GlobalSearch.DEFAULT_SEED);
    }

    /** As {@link #fit(List, List, FitSettings, double, Consumer)}, with the seed of the global search. */
    static Outcome fit(List<Start> starts, List<FitData> data, FitSettings settings, double eclipseHalfWidthPhase,
            Consumer<String> sink, long seed) {
        List<FitData> thinned = new ArrayList<>();
        int total = data.stream().mapToInt(d -> d.lightCurve().size()).sum();
        BinaryParameters ephemeris = starts.get(0).model().common();
        for (FitData d : data) {
            int share = (int) Math.max(200, (long) TRIAL_POINTS * d.lightCurve().size() / Math.max(1, total));
            thinned.add(new FitData(thin(d.lightCurve(), ephemeris, eclipseHalfWidthPhase, share), d.band()));
        }
        int thinnedPoints = thinned.stream().mapToInt(d -> d.lightCurve().size()).sum();
        FitSettings trialSettings = settings.withClipSigma(Double.NaN).withMaxIterations(TRIAL_ITERATIONS);
        Priors priors = limbDarkeningPriors(starts.get(0).model(), settings.free(),
                data.stream().map(FitData::band).distinct().toList());
        // the starts and the search choose the basin; a third of the sub-exposures (at least one) do for that
        int fullSub = ephemeris.supersample();
        int trialSub = Math.max(1, (int) Math.ceil(fullSub / (double) TRIAL_SUB_EXPOSURE_DIVISOR));
        List<Trial> trials = new ArrayList<>();
        Trial best = null;
        for (Start s : starts) {
            Trial t;
            try {
                FitResult r = EclipseFitter.fit(withSubExposures(s.model(), trialSub), thinned, trialSettings, priors);
                t = new Trial(s, r.chi2(), r.model(), null);
            } catch (WorkFailedException | IllegalArgumentException e) {
                t = new Trial(s, Double.POSITIVE_INFINITY, null, firstSentence(e.getMessage()));
            }
            trials.add(t);
            sink.accept(String.format(Locale.ROOT, "  start %d/%d (%s): %s", trials.size(), starts.size(),
                    s.label(), t.end() == null ? "dropped: " + t.failure() : String.format(Locale.ROOT, "χ² %.1f", t.chi2())));
            if (t.end() != null && (best == null || t.chi2() < best.chi2())) {
                best = t;
            }
        }
        List<String> notes = new ArrayList<>(best == null ? List.of() : rivals(trials, best));
        // no trial converged within its few iterations: the global search, with longer finishes, starts
        // from the estimate
        ModelFile from = best == null ? withSubExposures(starts.get(0).model(), trialSub) : best.end();
        long searchStart = System.nanoTime();
        try {
            GlobalSearch.Result search = GlobalSearch.run(FitProblem.of(from, thinned, trialSettings, priors), seed, 0);
            from = search.best().start();
            sink.accept(String.format(Locale.ROOT, "  global search: %d starts, %d distinct minim%s (%.1f s)",
                    search.starts(), search.minima().size(), search.minima().size() == 1 ? "um" : "a",
                    (System.nanoTime() - searchStart) / 1e9));
            notes.addAll(search.notes());
        } catch (WorkFailedException e) {
            if (best == null) {
                StringBuilder why = new StringBuilder("the fit did not converge from any of " + starts.size()
                        + " starts, nor did the global search (" + firstSentence(e.getMessage()) + ")");
                for (Trial t : trials) {
                    why.append("; ").append(t.start().label()).append(": ").append(t.failure());
                }
                throw new WorkFailedException(why + ". Give a starting model (--model) or fix the period and epoch");
            }
            sink.accept("  global search: " + firstSentence(e.getMessage()) + "; the best start is refined");
        }
        FitProblem problem = FitProblem.of(withSubExposures(from, fullSub), data, settings, priors);
        FitResult result = EclipseFitter.optimize(problem);
        OrbitChoice orbit = null;
        if (settings.free().contains("eccentricity") || settings.free().contains("omega")) {
            Set<String> circularFree = new LinkedHashSet<>(settings.free());
            circularFree.removeAll(List.of("eccentricity", "omega"));
            BinaryParameters c = result.model().common();
            ModelFile circularStart = new ModelFile(c.withEccentricityOmega(0, c.omegaDeg()), result.model().bands(),
                    result.model().commonComplete());
            double z = Math.max(sigmasFromZero(result, "eCosOmega"), sigmasFromZero(result, "eSinOmega"));
            if (z > Math.sqrt(2 * Math.log(result.n())) + CLEARLY_ECCENTRIC_MARGIN_SIGMAS) {
                orbit = new OrbitChoice(false, result.bic(), Double.NaN, z);
            } else {
                FitProblem circular = FitProblem.of(circularStart, data, settings.withFree(circularFree), priors);
                try {
                    FitResult rc = EclipseFitter.optimize(circular);
                    orbit = new OrbitChoice(rc.bic() <= result.bic(), result.bic(), rc.bic(), z);
                    if (orbit.circular()) {
                        problem = circular;
                        result = rc;
                    }
                } catch (WorkFailedException e) {
                    orbit = new OrbitChoice(false, result.bic(), Double.NaN, Double.NaN);
                }
            }
            sink.accept("  " + orbit.sentence());
            notes.add(orbit.sentence());
        }
        InclinationProfile.Result profile = null;
        long profileStart = System.nanoTime();
        java.util.Optional<InclinationProfile.Result> pr = InclinationProfile.of(result, data, problem.settings(),
                priors);
        if (pr.isPresent()) {
            profile = pr.get();
            result = InclinationProfile.widen(result, profile);
            sink.accept(String.format(Locale.ROOT, "  profile of χ² along i: %d fits, σ(i) %.3f° → %.3f° (%.1f s)",
                    profile.points().size(), profile.covarianceSigmaDeg(), profile.sigmaDeg(),
                    (System.nanoTime() - profileStart) / 1e9));
            notes.add(profile.sentence());
        }
        NoiseReport noise = NoiseDiagnostics.of(problem, result);
        notes.addAll(noise.notes(result));
        return new Outcome(result, trials, thinnedPoints, List.copyOf(notes), noise, priors, orbit, profile, problem);
    }

    /**
     * A normal prior of width {@link #LIMB_DARKENING_PRIOR_SIGMA} on every free limb-darkening
     * coefficient, centred on its start value (per band when there are several).
     */
    static Priors limbDarkeningPriors(ModelFile start, Set<String> free, List<String> bands) {
        Map<String, Prior> m = new LinkedHashMap<>();
        for (String name : free) {
            int star = name.startsWith("limbDarkening1.") ? 1 : name.startsWith("limbDarkening2.") ? 2 : 0;
            if (star == 0) {
                continue;
            }
            String coefficient = name.substring(name.indexOf('.') + 1);
            for (String band : bands) {
                BinaryParameters p = start.forBand(band);
                LimbDarkening ld = star == 1 ? p.limbDarkening1() : p.limbDarkening2();
                int k = List.of(ld.law().coefficientNames()).indexOf(coefficient);
                if (k >= 0) {
                    m.put(bands.size() > 1 ? name + "@" + band : name,
                            new Prior.Normal(ld.coefficient(k), LIMB_DARKENING_PRIOR_SIGMA));
                }
            }
        }
        return m.isEmpty() ? Priors.none() : new Priors(m, "analysis defaults");
    }

    /** |value| / error of a derived quantity (0 when it has no error). */
    private static double sigmasFromZero(FitResult r, String name) {
        Estimate e = r.get(name);
        return e.uncertainty() > 0 ? Math.abs(e.value()) / e.uncertainty() : 0;
    }

    /** The model with {@code n} sub-exposures per exposure (the exposure time unchanged). */
    private static ModelFile withSubExposures(ModelFile m, int n) {
        BinaryParameters c = m.common();
        return c.supersample() == n ? m : new ModelFile(c.withExposure(c.exposureTimeDays(), n), m.bands(),
                m.commonComplete());
    }

    /** The first sentence of a message (the solver's messages go on with its coordinates). */
    static String firstSentence(String message) {
        if (message == null) {
            return "no reason given";
        }
        int end = message.indexOf(". ");
        return end > 0 ? message.substring(0, end) : message;
    }

    /** Notes on minima other than the best that fit the thinned data nearly as well with another geometry. */
    private static List<String> rivals(List<Trial> trials, Trial best) {
        List<String> notes = new ArrayList<>();
        BinaryParameters b = best.end().common();
        for (Trial t : trials) {
            if (t == best || t.end() == null || t.chi2() - best.chi2() > RIVAL_DELTA_CHI2) {
                continue;
            }
            BinaryParameters o = t.end().common();
            boolean otherRatio = Math.abs(Math.log(o.radiusRatio() / b.radiusRatio())) > 0.1;
            boolean otherInclination = Math.abs(o.inclinationDeg() - b.inclinationDeg()) > 1;
            if (otherRatio || otherInclination) {
                notes.add(String.format(Locale.ROOT, "a second solution fits nearly as well (Δχ² = %.1f on the "
                        + "thinned data): k = %.3f, i = %.2f° against k = %.3f, i = %.2f°; the data hardly tell them "
                        + "apart: a spectroscopic light ratio or a total eclipse would settle it", t.chi2()
                        - best.chi2(), o.radiusRatio(), o.inclinationDeg(), b.radiusRatio(), b.inclinationDeg()));
                break;
            }
        }
        return notes;
    }

    /**
     * Every point within 1.5 eclipse half-widths of either eclipse (every k-th when they are more than
     * half of {@code target}), and every k-th point of the rest, no more of those than are kept in
     * eclipse ({@link #MIN_OUT_OF_ECLIPSE} at least): the starts and the global search are decided by
     * the eclipses, and the whole light curve is used by the final fit. The light curve unchanged
     * when it has no more points.
     */
    static LightCurve thin(LightCurve lc, BinaryParameters p, double halfWidthPhase, int target) {
        int n = lc.size();
        double secondary = p.orbit().secondaryPhase();
        double reach = 1.5 * halfWidthPhase;
        boolean[] inEclipse = new boolean[n];
        int eclipsed = 0;
        for (int i = 0; i < n; i++) {
            double ph = (lc.time(i) - p.epochDays()) / p.periodDays();
            ph -= Math.floor(ph);
            double d1 = Math.min(ph, 1 - ph);
            double d2 = Math.abs(ph - secondary);
            d2 = Math.min(d2, 1 - d2);
            inEclipse[i] = d1 <= reach || d2 <= reach;
            eclipsed += inEclipse[i] ? 1 : 0;
        }
        // the points out of eclipse set little but the baseline: no more of them than in eclipse (and a floor)
        int keptIn = Math.min(eclipsed, target / 2);
        int rest = Math.max(MIN_OUT_OF_ECLIPSE, Math.min(target - keptIn, keptIn));
        if (eclipsed <= target / 2 && n - eclipsed <= rest) {
            return lc;
        }
        int stride = Math.max(1, (n - eclipsed) / rest);
        int strideIn = Math.max(1, eclipsed / Math.max(1, target / 2));
        List<Integer> keep = new ArrayList<>();
        int countOut = 0;
        int countIn = 0;
        for (int i = 0; i < n; i++) {
            if (inEclipse[i] ? countIn++ % strideIn == 0 : countOut++ % stride == 0) {
                keep.add(i);
            }
        }
        double[] t = new double[keep.size()];
        double[] f = new double[keep.size()];
        double[] e = lc.hasErrors() ? new double[keep.size()] : null;
        for (int j = 0; j < keep.size(); j++) {
            int i = keep.get(j);
            t[j] = lc.time(i);
            f[j] = lc.flux(i);
            if (e != null) {
                e[j] = lc.fluxError(i);
            }
        }
        return new LightCurve(lc.source(), lc.band(), lc.timeScale(), lc.originalKind(), t, f, e, lc.rejectedRows());
    }
}
