package org.twinlight.timing.minima;

import org.twinlight.timing.Ephemeris;
import org.twinlight.timing.MinimumType;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;
import org.twinlight.BadInputException;
import org.twinlight.WorkFailedException;
import org.twinlight.photometry.LightCurve;

/**
 * Finds every primary and secondary eclipse covered by a light curve, given an ephemeris, and
 * measures its time of minimum with two methods:
 * <ol>
 * <li>{@link MinimumMethod#KVW}: Kwee &amp; van Woerden (1956), see {@link MinimumKweeVanWoerden}.
 * Its error is the standard deviation of the method's result over synthetic replicas of the
 * eclipse: the template model plus the fit residuals drawn again with replacement (a residual
 * bootstrap; Efron &amp; Tibshirani 1993, An Introduction to the Bootstrap, §9.5). The original
 * formula's error is kept as {@link MinimumTime#classicErrorDays()}.</li>
 * <li>{@link MinimumMethod#TEMPLATE}: a least-squares fit of a symmetric template, made by folding
 * all eclipses of that type on their Kwee–van Woerden minima, see {@link MinimumTemplateFit}.</li>
 * </ol>
 * <p>Both errors are multiplied by max(1, β), β the time-averaging factor of the out-of-eclipse
 * light within three eclipse durations of the eclipse (else of the whole curve) on the time scale
 * of the eclipse's branches (Winn et al. 2008, ApJ 683, 1076; see {@link CorrelatedNoise}), so that noise
 * correlated over tens of minutes (atmosphere, guiding, spots) does not make them too small.
 *
 * <p>Each eclipse window is centred on the ephemeris prediction (corrected by the mean offset seen in
 * the folded light curve). An eclipse whose coverage is one-sided (a branch with fewer than three
 * points) or partial (a gap longer than a quarter of the eclipse inside it) but which holds at
 * least six points inside the eclipse is timed from the template alone, with its shape and
 * fractional depth fixed by the well-covered eclipses of the same type (at least two), and flagged
 * {@link MinimumTime#partial()}; the Kwee–van Woerden method, which needs both branches, is not
 * applied to it. An eclipse is skipped, with the reason, when its window has too few points, when
 * it is partly covered and cannot be timed so, when no minimum is found near the expected time, or
 * when its depth is not significant.
 */
public final class MinimumFinder {

    /** Fewest points on each branch of an eclipse. */
    private static final int MIN_POINTS_PER_BRANCH = 3;
    /** Largest gap inside an eclipse, as a fraction of its duration. */
    private static final double MAX_GAP_FRACTION = 0.25;
    /** The minimum is searched within ± this fraction of the eclipse duration around the prediction. */
    private static final double SEARCH_FRACTION = 0.15;
    /** The search for a secondary elsewhere leaves out this many primary durations around phase 0. */
    private static final double EXCLUDE_PRIMARY_DURATIONS = 0.6;
    /** Out-of-eclipse light within this many eclipse durations of an eclipse gives its β. */
    private static final double NOISE_REACH_DURATIONS = 6;
    /** Fewest points inside a partly covered eclipse for a model-based time. */
    private static final int MIN_POINTS_PARTIAL = 6;
    /** Fewest well-covered eclipses of a type that fix the template for the partly covered ones. */
    private static final int MIN_FULL_FOR_PARTIAL = 2;
    private static final String TOO_FEW = "too few points";
    /** Smallest half-width of the reflected part of the eclipse, fraction of the eclipse duration. */
    private static final double MIN_REFLECT_FRACTION = 0.25;

    private MinimumFinder() {
    }

    /**
     * @throws BadInputException when the window is wider than the spacing of primary and secondary
     * @throws WorkFailedException when no primary eclipse is seen near phase 0 and no window was given
     */
    public static MinimumSearchResult find(LightCurve lc, Ephemeris eph, MinimumSettings settings) {
        double[] t = lc.timesDays();
        double[] f = lc.fluxes();
        double[] w = weights(lc);
        double p = eph.periodDays();
        double sp = settings.secondaryPhase();
        double spacing = Math.min(sp, 1 - sp);
        MinimumProfileEstimate primary = MinimumProfileEstimate.estimate(t, f, eph, 0.0, spacing / 2);
        MinimumProfileEstimate secondary = MinimumProfileEstimate.estimate(t, f, eph, sp, spacing / 2);
        if (primary == null && settings.estimateWindow()) {
            throw new WorkFailedException(String.format(Locale.ROOT,
                    "no primary eclipse is seen near phase 0 of the ephemeris (epoch %.6f, period %.8f d) in %s; "
                            + "check --period and --epoch, or give the eclipse window with --window",
                    eph.epochDays(), p, lc.source()));
        }
        List<String> notes = new ArrayList<>();
        if (secondary != null && Math.abs(secondary.centreShiftDays()) >= 0.5 * secondary.durationDays()) {
            // The deepest dip of the look range lies away from the expected phase (an eccentric orbit):
            // it is not the secondary at sp, and the search below places it.
            secondary = null;
        }
        if (secondary == null && primary != null) {
            // No secondary where expected: look at every other phase (an eccentric orbit can put it
            // anywhere, even right next to the primary).
            double exclude = EXCLUDE_PRIMARY_DURATIONS * primary.durationDays() / p;
            MinimumProfileEstimate other = MinimumProfileEstimate.estimate(t, f, eph, 0.5, 0.5 - exclude);
            double phase = other == null ? Double.NaN : 0.5 + other.centreShiftDays() / p;
            if (other != null && Math.abs(phase - sp) > other.durationDays() / p) {
                double newSpacing = Math.min(phase, 1 - phase);
                double widest = settings.estimateWindow() ? MinimumSettings.WINDOW_PER_DURATION
                        * Math.max(primary.durationDays(), other.durationDays()) : settings.windowDays();
                if (widest < newSpacing * p) {
                    notes.add(String.format(Locale.ROOT, "no secondary eclipse at phase %.4f; one is seen at phase "
                            + "%.4f (depth %.3g) and measured there; give --secondary-phase %.4f to say so", sp, phase,
                            other.depth(), phase));
                    sp = phase;
                    spacing = newSpacing;
                    MinimumProfileEstimate narrower = MinimumProfileEstimate.estimate(t, f, eph, 0.0, spacing / 2);
                    primary = narrower != null ? narrower : primary;
                    secondary = MinimumProfileEstimate.estimate(t, f, eph, sp, spacing / 2);
                } else {
                    notes.add(String.format(Locale.ROOT, "no secondary eclipse at phase %.4f; a dip is seen at phase "
                            + "%.4f (depth %.3g), too close to the primary to be measured with a %.4f d window",
                            sp, phase, other.depth(), widest));
                }
            }
        }
        double pWindow = settings.estimateWindow()
                ? MinimumSettings.WINDOW_PER_DURATION * primary.durationDays() : settings.windowDays();
        double sWindow = !settings.estimateWindow() ? settings.windowDays()
                : secondary != null ? MinimumSettings.WINDOW_PER_DURATION * secondary.durationDays() : pWindow;
        if (Math.max(pWindow, sWindow) >= spacing * p) {
            throw new BadInputException(String.format(Locale.ROOT,
                    "option --window: %.5f d is not less than the %.5f d between primary and secondary minima; "
                            + "give a narrower window", Math.max(pWindow, sWindow), spacing * p));
        }
        double pDuration = pWindow / MinimumSettings.WINDOW_PER_DURATION;
        double sDuration = sWindow / MinimumSettings.WINDOW_PER_DURATION;
        double pShift = primary == null ? 0 : clampShift(primary.centreShiftDays(), pDuration);
        double sShift = secondary == null ? 0 : clampShift(secondary.centreShiftDays(), sDuration);

        List<MinimumTime> minima = new ArrayList<>();
        List<MinimumSkip> skipped = new ArrayList<>();
        boolean[] inEclipse = new boolean[t.length];
        for (int i = 0; i < t.length; i++) {
            inEclipse[i] = Math.abs(phaseFrom(t[i] - pShift, eph, 0.0)) * p < pWindow / 2
                    || Math.abs(phaseFrom(t[i] - sShift, eph, sp)) * p < sWindow / 2;
        }
        double[][] outside = CorrelatedNoise.outOfEclipseResiduals(t, f, w, inEclipse, Math.max(pDuration, sDuration));
        measureType(MinimumType.PRIMARY, 0.0, pWindow, pDuration, pShift, t, f, w, eph, settings, outside, minima,
                skipped);
        measureType(MinimumType.SECONDARY, sp, sWindow, sDuration, sShift, t, f, w, eph, settings, outside, minima,
                skipped);
        minima.sort(Comparator.comparingDouble(MinimumTime::cycle).thenComparing(MinimumTime::method));
        skipped.sort(Comparator.comparingDouble(MinimumSkip::predictedTimeDays));
        return new MinimumSearchResult(minima, skipped, pWindow, sWindow, pDuration, sDuration,
                primary == null ? Double.NaN : primary.depth(), secondary == null ? Double.NaN : secondary.depth(),
                lc.timeScale(), primary == null || secondary == null ? Double.NaN
                        : (sp - 0.5) * p + secondary.centreShiftDays() - primary.centreShiftDays(),
                primary == null || secondary == null ? Double.NaN
                        : Math.hypot(primary.binWidthDays(), secondary.binWidthDays()), sp, notes);
    }

    /** Phase of time {@code time} from the eclipse at {@code phase}, in [−0.5, 0.5). */
    private static double phaseFrom(double time, Ephemeris eph, double phase) {
        double c = eph.cyclesSinceEpoch(time) - phase;
        return c - Math.floor(c + 0.5);
    }

    private static double clampShift(double shift, double duration) {
        return Math.abs(shift) < 0.5 * duration ? shift : 0;
    }

    /** One eclipse that passed the coverage checks, with its points and its reflection minimum. */
    private record Candidate(double cycle, double predicted, double centre, int from, int to,
            MinimumKweeVanWoerden.Result kvw) {
    }

    private static void measureType(MinimumType type, double phase, double window, double duration, double shift,
            double[] t, double[] f, double[] w, Ephemeris eph, MinimumSettings settings, double[][] outside,
            List<MinimumTime> minima, List<MinimumSkip> skipped) {
        double half = window / 2;
        double branch = duration / 2;
        double search = SEARCH_FRACTION * duration;
        long first = (long) Math.floor(eph.cyclesSinceEpoch(t[0]) - phase) - 1;
        long last = (long) Math.ceil(eph.cyclesSinceEpoch(t[t.length - 1]) - phase) + 1;
        List<Candidate> candidates = new ArrayList<>();
        List<Partial> partials = new ArrayList<>();
        for (long n = first; n <= last; n++) {
            double cycle = n + type.cycleOffset();
            double predicted = eph.timeOf(n + phase);
            double centre = predicted + shift;
            int from = lowerBound(t, centre - half);
            int to = lowerBound(t, centre + half + Math.ulp(centre));
            int count = to - from;
            if (count == 0) {
                continue;
            }
            String why = coverageProblem(t, from, to, centre, branch, settings.minPoints());
            if (why != null) {
                if (!why.startsWith(TOO_FEW) && inEclipseCount(t, from, to, centre, branch) >= MIN_POINTS_PARTIAL) {
                    partials.add(new Partial(cycle, predicted, centre, from, to, why));
                } else {
                    skipped.add(new MinimumSkip(cycle, type, predicted, count, why));
                }
                continue;
            }
            double[] x = offsets(t, from, to, centre);
            MinimumKweeVanWoerden.Result kvw = MinimumKweeVanWoerden.measure(x, Arrays.copyOfRange(f, from, to), 0.0,
                    search, half, MIN_REFLECT_FRACTION * duration);
            if (!kvw.ok()) {
                skipped.add(new MinimumSkip(cycle, type, predicted, count, kvw.failure()));
                continue;
            }
            candidates.add(new Candidate(cycle, predicted, centre, from, to, kvw));
        }
        MinimumTemplate template = candidates.isEmpty() ? null : buildTemplate(candidates, t, f, w, branch, half);
        double globalBeta = CorrelatedNoise.beta(outside[0], outside[1], branch);
        List<Double> fractionalDepths = new ArrayList<>();
        for (Candidate c : candidates) {
            int count = c.to() - c.from();
            if (template == null) {
                skipped.add(new MinimumSkip(c.cycle(), type, c.predicted(), count,
                        "no " + type.label() + " eclipse is seen in the folded light curve"));
                continue;
            }
            double[] x = offsets(t, c.from(), c.to(), c.centre());
            double[] fc = Arrays.copyOfRange(f, c.from(), c.to());
            double[] wc = Arrays.copyOfRange(w, c.from(), c.to());
            MinimumTemplateFit.Result fit = MinimumTemplateFit.fit(x, fc, wc, template, c.kvw().timeDays(), search);
            if (!fit.ok()) {
                skipped.add(new MinimumSkip(c.cycle(), type, c.predicted(), count, fit.failure()));
                continue;
            }
            double significance = fit.depth() / fit.depthError();
            if (!(significance >= settings.minDepthSignificance())) {
                skipped.add(new MinimumSkip(c.cycle(), type, c.predicted(), count, String.format(Locale.ROOT,
                        "no significant dip: depth %.3g ± %.2g (%.1fσ, need %.1fσ)", fit.depth(), fit.depthError(),
                        significance, settings.minDepthSignificance())));
                continue;
            }
            fractionalDepths.add(fit.depth() / (fit.model()[0] + fit.depth() * template.value(x[0] - fit.timeDays())));
            double beta = betaNear(outside, c.centre(), half + NOISE_REACH_DURATIONS * duration, branch, globalBeta);
            double inflate = Double.isFinite(beta) ? Math.max(1, beta) : 1;
            double kvwError = inflate * replicaError(x, fc, wc, fit, c.kvw().trialStepDays(), search, half,
                    MIN_REFLECT_FRACTION * duration, settings, c.cycle());
            if (Double.isNaN(kvwError)) {
                skipped.add(new MinimumSkip(c.cycle(), type, c.predicted(), count,
                        "reflection method only: most synthetic replicas had no reflection minimum, so its error "
                                + "is unknown; the template time is kept"));
            } else {
                minima.add(new MinimumTime(c.cycle(), type, c.centre() + c.kvw().timeDays(), kvwError,
                        MinimumMethod.KVW, count, c.kvw().classicErrorDays(), beta, false));
            }
            minima.add(new MinimumTime(c.cycle(), type, c.centre() + fit.timeDays(), inflate * fit.errorDays(),
                    MinimumMethod.TEMPLATE, count, Double.NaN, beta, false));
        }
        measurePartials(type, partials, template, fractionalDepths, t, f, w, duration, outside, globalBeta, minima,
                skipped);
    }

    /** A partly covered eclipse: enough points inside it for a fit of the fixed template. */
    private record Partial(double cycle, double predicted, double centre, int from, int to, String coverage) {
    }

    /**
     * Times of partly covered eclipses from the template whose shape and fractional depth are
     * fixed by the well-covered eclipses of the same type (at least {@link #MIN_FULL_FOR_PARTIAL});
     * the depth's scatter between those eclipses enters the error.
     */
    private static void measurePartials(MinimumType type, List<Partial> partials, MinimumTemplate template,
            List<Double> fractionalDepths, double[] t, double[] f, double[] w, double duration, double[][] outside,
            double globalBeta, List<MinimumTime> minima, List<MinimumSkip> skipped) {
        double half = duration * MinimumSettings.WINDOW_PER_DURATION / 2;
        double depth = fractionalDepths.stream().mapToDouble(Double::doubleValue).average().orElse(Double.NaN);
        double depthSigma = fractionalDepths.size() < 2 ? Double.NaN : Math.sqrt(fractionalDepths.stream()
                .mapToDouble(d -> (d - depth) * (d - depth)).sum() / (fractionalDepths.size() - 1));
        for (Partial pc : partials) {
            int count = pc.to() - pc.from();
            if (template == null || fractionalDepths.size() < MIN_FULL_FOR_PARTIAL) {
                skipped.add(new MinimumSkip(pc.cycle(), type, pc.predicted(), count, pc.coverage() + "; fewer than "
                        + MIN_FULL_FOR_PARTIAL + " well-covered " + type.label() + " eclipses to fix the template "
                        + "for a model-based time"));
                continue;
            }
            double[] x = offsets(t, pc.from(), pc.to(), pc.centre());
            double[] fc = Arrays.copyOfRange(f, pc.from(), pc.to());
            double[] wc = Arrays.copyOfRange(w, pc.from(), pc.to());
            MinimumTemplateFit.Result fit = MinimumTemplateFit.fitFixedDepth(x, fc, wc, template, depth, depthSigma,
                    0.0, SEARCH_FRACTION * duration);
            if (!fit.ok()) {
                skipped.add(new MinimumSkip(pc.cycle(), type, pc.predicted(), count, pc.coverage() + "; "
                        + fit.failure()));
                continue;
            }
            double beta = betaNear(outside, pc.centre(), half + NOISE_REACH_DURATIONS * duration, duration / 2,
                    globalBeta);
            double inflate = Double.isFinite(beta) ? Math.max(1, beta) : 1;
            minima.add(new MinimumTime(pc.cycle(), type, pc.centre() + fit.timeDays(), inflate * fit.errorDays(),
                    MinimumMethod.TEMPLATE, count, Double.NaN, beta, true));
        }
    }

    /** β of the out-of-eclipse light within {@code reach} of {@code centre}, else the whole curve's. */
    private static double betaNear(double[][] outside, double centre, double reach, double branch, double globalBeta) {
        double[][] near = CorrelatedNoise.between(outside, centre - reach, centre + reach);
        double beta = CorrelatedNoise.beta(near[0], near[1], branch);
        return Double.isFinite(beta) ? beta : globalBeta;
    }

    /** Times t[from..to) relative to {@code centre}. */
    private static double[] offsets(double[] t, int from, int to, double centre) {
        double[] x = new double[to - from];
        for (int i = 0; i < x.length; i++) {
            x[i] = t[from + i] - centre;
        }
        return x;
    }

    private static int inEclipseCount(double[] t, int from, int to, double centre, double branch) {
        int n = 0;
        for (int i = from; i < to; i++) {
            n += Math.abs(t[i] - centre) < branch ? 1 : 0;
        }
        return n;
    }

    /** Why an eclipse window cannot be measured, or null when its coverage is good. */
    static String coverageProblem(double[] t, int from, int to, double centre, double branch, int minPoints) {
        int count = to - from;
        if (count < minPoints) {
            return TOO_FEW + ": " + count + " in the window, need at least " + minPoints;
        }
        int before = 0;
        int after = 0;
        double gap = 0;
        double previous = centre - branch;
        for (int i = from; i < to; i++) {
            double dt = t[i] - centre;
            if (dt < -branch || dt > branch) {
                continue;
            }
            if (dt < 0) {
                before++;
            } else if (dt > 0) {
                after++;
            }
            gap = Math.max(gap, t[i] - previous);
            previous = t[i];
        }
        gap = Math.max(gap, centre + branch - previous);
        if (before < MIN_POINTS_PER_BRANCH || after < MIN_POINTS_PER_BRANCH) {
            return "one-sided coverage: " + before + " points on the descending and " + after
                    + " on the ascending branch, need at least " + MIN_POINTS_PER_BRANCH + " on each";
        }
        if (gap > MAX_GAP_FRACTION * 2 * branch) {
            return String.format(Locale.ROOT, "partial coverage: a gap of %.1f min inside the %.1f min eclipse",
                    gap * 1440, 2 * branch * 1440);
        }
        return null;
    }

    /** The template from all candidates of one type, each folded on its own reflection minimum. */
    private static MinimumTemplate buildTemplate(List<Candidate> candidates, double[] t, double[] f, double[] w,
            double branch, double half) {
        int total = candidates.stream().mapToInt(c -> c.to() - c.from()).sum();
        double[] offsets = new double[total];
        double[] depths = new double[total];
        double[] depthWeights = new double[total];
        double global = MinimumProfileEstimate.median(f.clone());
        int k = 0;
        for (Candidate c : candidates) {
            double minimum = c.centre() + c.kvw().timeDays();
            List<Double> outside = new ArrayList<>();
            for (int i = c.from(); i < c.to(); i++) {
                if (Math.abs(t[i] - minimum) > branch) {
                    outside.add(f[i]);
                }
            }
            double baseline = outside.size() >= 3
                    ? MinimumProfileEstimate.median(outside.stream().mapToDouble(Double::doubleValue).toArray())
                    : global;
            for (int i = c.from(); i < c.to(); i++) {
                offsets[k] = t[i] - minimum;
                depths[k] = 1 - f[i] / baseline;
                // σ(depth) = σ(flux)/baseline; unit weights stay unit (no errors in the data).
                depthWeights[k] = w[i] == 1.0 ? 1.0 : w[i] * baseline * baseline;
                k++;
            }
        }
        return MinimumTemplate.build(offsets, depths, depthWeights, half);
    }

    /**
     * Error of the reflection method: it is applied to replicas made of the template model plus the
     * template fit's residuals (standardised by the point errors) drawn with replacement and
     * inflated by √(n/(n − 3)) for the three fitted parameters; the replicas are measured with the
     * same spacing of trial times as the eclipse itself, and the error is the standard deviation of
     * their minima.
     */
    private static double replicaError(double[] x, double[] f, double[] w, MinimumTemplateFit.Result fit,
            double trialStep, double search, double reflectMax, double reflectMin, MinimumSettings settings, double cycle) {
        int n = x.length;
        double[] standardised = new double[n];
        double inflate = Math.sqrt(n / (n - 3.0));
        for (int i = 0; i < n; i++) {
            standardised[i] = (f[i] - fit.model()[i]) * Math.sqrt(w[i]) * inflate;
        }
        // The replicas scatter by about the template error: a narrower search is enough and faster.
        double narrow = Math.min(search, Math.max(20 * fit.errorDays(), 3 * MinimumKweeVanWoerden.medianSpacing(x)));
        SplittableRandom random = new SplittableRandom(settings.seed() * 1_000_003L + Double.hashCode(cycle));
        double[] replica = new double[n];
        double[] found = new double[settings.bootstrapSamples()];
        int good = 0;
        for (int b = 0; b < settings.bootstrapSamples(); b++) {
            for (int i = 0; i < n; i++) {
                replica[i] = fit.model()[i] + standardised[random.nextInt(n)] / Math.sqrt(w[i]);
            }
            MinimumKweeVanWoerden.Result r = MinimumKweeVanWoerden.measure(x, replica, fit.timeDays(), narrow,
                    reflectMax, reflectMin, trialStep);
            if (r.ok()) {
                found[good++] = r.timeDays();
            }
        }
        if (good < settings.bootstrapSamples() / 2) {
            return Double.NaN;
        }
        double mean = 0;
        for (int b = 0; b < good; b++) {
            mean += found[b] / good;
        }
        double ss = 0;
        for (int b = 0; b < good; b++) {
            ss += (found[b] - mean) * (found[b] - mean);
        }
        return Math.sqrt(ss / (good - 1));
    }

    /** Weights 1/σ² from the flux errors, or all 1 when the light curve has none (or a bad one). */
    private static double[] weights(LightCurve lc) {
        double[] w = new double[lc.size()];
        for (int i = 0; i < w.length; i++) {
            double e = lc.fluxError(i);
            w[i] = lc.hasErrors() && e > 0 && Double.isFinite(e) ? 1 / (e * e) : 1.0;
        }
        return w;
    }

    /** First index with t[i] ≥ value. */
    static int lowerBound(double[] t, double value) {
        int lo = 0;
        int hi = t.length;
        while (lo < hi) {
            int mid = (lo + hi) >>> 1;
            if (t[mid] < value) {
                lo = mid + 1;
            } else {
                hi = mid;
            }
        }
        return lo;
    }
}
