package org.twinlight.analysis;

import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.ForkJoinPool;
import java.util.function.Consumer;
import org.twinlight.BadInputException;
import org.twinlight.WorkFailedException;
import org.twinlight.eclipse.BandValues;
import org.twinlight.eclipse.BinaryParameters;
import org.twinlight.eclipse.ModelFile;
import org.twinlight.fit.FitData;
import org.twinlight.fit.FitSettings;
import org.twinlight.fit.StartingValues;
import org.twinlight.photometry.LightCurve;
import org.twinlight.photometry.LightCurveReader;
import org.twinlight.photometry.LightCurveSummary;
import org.twinlight.photometry.ReadOptions;
import org.twinlight.report.InputDigest;
import org.twinlight.report.ModelFileJson;
import org.twinlight.timing.Ephemeris;
import org.twinlight.timing.MinimumType;
import org.twinlight.timing.minima.MinimumFinder;
import org.twinlight.timing.minima.MinimumMethod;
import org.twinlight.timing.minima.MinimumSettings;
import org.twinlight.timing.minima.MinimumTime;
import org.twinlight.timing.minima.OcAnalysis;
import org.twinlight.timing.period.PeriodDecision;
import org.twinlight.timing.period.PeriodSearch;
import org.twinlight.timing.period.PeriodSearchResult;
import org.twinlight.timing.period.PeriodSearchSettings;

/**
 * The whole analysis of one target as one function: read → period search (unless the period is
 * given) → times of minimum and ephemeris → starting values from the eclipses → least-squares fit
 * from several starts → optionally the joint fit with radial velocities, the posterior sample and the
 * absolute dimensions → {@code report.html}, {@code results.json}, {@code settings-used.json} and
 * the files of each stage, written together into the output folder.
 *
 * <p>Self-contained: no shared mutable state, no exit of the virtual machine, no console output
 * except through the sink given; many targets may run at once.
 */
public final class TargetAnalysis {
    /**
     * Sub-exposures for the smearing of one exposure: one per 2 minutes, so that a 30-minute
     * integration is averaged over 15 sub-exposures and a 2-minute one is taken at its mid-time
     * (common practice, no source).
     */
    static final double SUB_EXPOSURE_DAYS = 120.0 / 86400.0;
    /**
     * A skipped eclipse with at least this many points in its window counts as covered by the data
     * (seen, if not timed on its own; common practice, no source).
     */
    static final int MIN_POINTS_COVERED = 5;
    /** Phase bins of the fold that places the epoch when only the period is given. */
    private static final int EPOCH_BINS = 200;

    private TargetAnalysis() {
    }

    /** Runs one analysis, silently. */
    public static AnalysisOutcome run(AnalysisRequest request) {
        return run(request, message -> { });
    }

    /**
     * Runs one analysis; progress and remarks go to {@code sink}, one line each.
     *
     * @return exit code 0 (done, answer certain), 1 (stopped or uncertain; the report explains) or 2
     *     (bad input or settings; nothing written), the message, key results and files written
     */
    public static AnalysisOutcome run(AnalysisRequest request, Consumer<String> sink) {
        if (request.threads() == 0) {
            return runHere(request, sink);
        }
        // parallel streams started inside a pool's task run in that pool: with one thread, sequentially
        ForkJoinPool pool = new ForkJoinPool(request.threads());
        try {
            return pool.submit(() -> runHere(request, sink)).join();
        } finally {
            pool.shutdown();
        }
    }

    private static AnalysisOutcome runHere(AnalysisRequest request, Consumer<String> sink) {
        AnalysisState st = new AnalysisState(request, Instant.now());
        try {
            st.settings = request.settings().validated("settings");
            read(st, sink);
            AfterFit.readVelocities(st, sink);
            timed(st, "period search", () -> period(st, sink));
            timed(st, "times of minimum", () -> minima(st, sink));
            timed(st, "fit", () -> fit(st, sink));
            if (!st.velocityData.isEmpty()) {
                timed(st, "joint fit with the velocities", () -> AfterFit.jointFit(st, sink));
            }
            if (st.settings.afterFit().posterior()) {
                timed(st, "posterior sample", () -> AfterFit.posterior(st, sink));
            }
        } catch (BadInputException e) {
            return new AnalysisOutcome(2, e.getMessage(), Map.of(), List.of(), null);
        } catch (WorkFailedException e) {
            st.failure = e.getMessage();
            sink.accept("failed (" + st.failedStage + "): " + e.getMessage());
        }
        return AnalysisFiles.write(st, sink);
    }

    private static void timed(AnalysisState st, String stage, Runnable work) {
        long t0 = System.nanoTime();
        st.failedStage = stage;
        work.run();
        st.stageSeconds.put(stage, (System.nanoTime() - t0) / 1e9);
    }

    /** Reads every file; the largest becomes the light curve of the period search and minima. */
    private static void read(AnalysisState st, Consumer<String> sink) {
        st.failedStage = "reading";
        AnalysisSettings s = st.settings;
        ReadOptions options = s.readOptions("settings");
        List<String> files = s.files();
        for (String name : files) {
            AnalysisFiles.refuseOverwrite(st.request.outputDir(), Path.of(name));
        }
        for (int i = 0; i < files.size(); i++) {
            Path f = Path.of(files.get(i));
            if (!Files.isRegularFile(f)) {
                throw new BadInputException(f + ": no such file");
            }
            LightCurve lc = LightCurveReader.read(f, options);
            if (lc.size() < 20) {
                throw BadInputException.at(f, null, null, "only " + lc.size() + " usable point(s); an analysis needs "
                        + "at least 20");
            }
            String bandSource = !s.bands().isEmpty() ? "settings 'bands'" : lc.band() != null ? "band column"
                    : files.size() > 1 ? "file name" : "default";
            String band = switch (bandSource) {
                case "band column" -> lc.band();
                case "file name" -> baseName(f);
                case "default" -> "default";
                default -> s.bands().get(i);
            };
            if (st.timeScale == null) {
                st.timeScale = lc.timeScale();
            } else if (!st.timeScale.equals(lc.timeScale())) {
                throw new BadInputException(f + ": its times are " + lc.timeScale().label() + " but "
                        + st.inputs.get(0).file() + " has " + st.timeScale.label()
                        + "; convert them to one time scale first (the time command)");
            }
            LightCurveSummary summary = LightCurveSummary.of(lc, s.segmentGapDays());
            st.inputs.add(new AnalysisState.Input(f, InputDigest.sha256(f), band, bandSource, lc, summary));
            sink.accept(String.format(Locale.ROOT, "%s: %d points over %.2f d, time scale %s%s", f, lc.size(),
                    summary.spanDays(), lc.timeScale().label(), lc.rejectedCount() > 0 ? ", " + lc.rejectedCount()
                            + " row(s) not used: " + lc.rejectedRows() : ""));
            lc.notes().forEach(n -> sink.accept("note: " + f + ": " + n));
        }
        st.main = st.inputs.stream().map(AnalysisState.Input::lightCurve)
                .max(java.util.Comparator.comparingInt(LightCurve::size)).orElseThrow();
        if (!st.timeScale.isKnown()) {
            st.notes.add("the time scale of the data is not declared (time scale unknown): the epoch and times of "
                    + "minimum cannot be compared with other data; declare it with --time-scale");
        }
        AnalysisState.Input first = st.inputs.stream().filter(in -> in.lightCurve() == st.main).findFirst()
                .orElseThrow();
        double cadence = first.summary().medianCadenceDays();
        Double exposure = s.exposureTimeDays() != null ? s.exposureTimeDays()
                : Double.isFinite(cadence) ? cadence : 0.0;
        Integer sub = s.supersample() != null ? s.supersample()
                : (int) Math.min(200, Math.max(1, Math.ceil(exposure / SUB_EXPOSURE_DAYS - 1e-9)));
        st.settings = s.withExposure(exposure, sub);
    }

    /** The period and epoch: given, from the model file, or searched. */
    private static void period(AnalysisState st, Consumer<String> sink) {
        AnalysisSettings s = st.settings;
        Double p = s.periodDays();
        Double t0 = s.epochDays();
        if (p == null && s.model() != null) {
            BinaryParameters m = ModelFileJson.read(Path.of(s.model())).common();
            p = m.periodDays();
            t0 = t0 != null ? t0 : m.epochDays();
            st.ephemerisSource = "the model file " + s.model();
        }
        if (p != null) {
            st.ephemerisSource = st.ephemerisSource != null ? st.ephemerisSource : "the settings";
            if (t0 == null) {
                t0 = deepestFold(st.main, p);
                st.ephemerisSource += " (period; the epoch at the deepest point of the folded light curve)";
            }
            st.searchEphemeris = new Ephemeris(t0, p);
            sink.accept(String.format(Locale.ROOT, "period %.8f d, epoch %.6f from %s", p, t0, st.ephemerisSource));
            return;
        }
        PeriodSearchSettings ps = PeriodSearchSettings.defaults().withMinPeriodDays(s.minPeriodDays())
                .withMaxPeriodDays(s.maxPeriodDays()).withParallel(true);
        sink.accept("period search ...");
        PeriodSearchResult r = PeriodSearch.search(st.main, ps);
        st.period = r;
        st.ephemerisSource = "the period search";
        PeriodDecision d = r.decision();
        sink.accept("period: " + d.headline());
        if (!r.significant()) {
            throw new WorkFailedException("no significant period: " + r.significanceNote() + ". "
                    + singleEclipseHint(r) + "If the period is known from elsewhere, give it with --period");
        }
        if (d.status() == PeriodDecision.Status.AMBIGUOUS) {
            StringBuilder alt = new StringBuilder();
            d.alternativesDays().forEach(a -> alt.append(alt.length() == 0 ? "" : ", ")
                    .append(String.format(Locale.ROOT, "%.8g d", a)));
            st.doubts.add(String.format(Locale.ROOT, "the period is ambiguous: the analysis went on with P = %.8g d, "
                    + "but the data allow %s as well (%s). Everything below rests on that choice; to choose "
                    + "another, run again with --period", r.periodDays(), alt, String.join("; ", d.toSettle())));
        }
        st.searchEphemeris = new Ephemeris(r.epochDays(), r.periodDays());
        st.secondaryPhase = r.secondary().map(e -> e.phase()).orElse(0.5);
        if (!(st.secondaryPhase > 0.05 && st.secondaryPhase < 0.95)) {
            st.secondaryPhase = 0.5;
        }
    }

    /** Why a search may find no period in a light curve with an eclipse: one eclipse only. */
    private static String singleEclipseHint(PeriodSearchResult r) {
        if (r.primary() != null && r.primary().signalToNoise() >= 7) {
            return String.format(Locale.ROOT, "A dip of depth %.4f stands out (S/N %.0f) but does not repeat within "
                    + "the data: with one eclipse only a period cannot be measured; longer data would settle it. ",
                    r.primary().depth(), r.primary().signalToNoise());
        }
        return "No eclipse stands out of the noise. ";
    }

    /** The time of the deepest bin of the light curve folded on {@code periodDays}, nearest the data's middle. */
    static double deepestFold(LightCurve lc, double periodDays) {
        double t0 = lc.time(0);
        double[][] sums = new double[EPOCH_BINS][2];
        for (int i = 0; i < lc.size(); i++) {
            double ph = (lc.time(i) - t0) / periodDays;
            ph -= Math.floor(ph);
            int b = Math.min(EPOCH_BINS - 1, (int) (ph * EPOCH_BINS));
            sums[b][0] += lc.flux(i);
            sums[b][1]++;
        }
        int best = -1;
        for (int b = 0; b < EPOCH_BINS; b++) {
            if (sums[b][1] > 0 && (best < 0 || sums[b][0] / sums[b][1] < sums[best][0] / sums[best][1])) {
                best = b;
            }
        }
        double epoch = t0 + (best + 0.5) / EPOCH_BINS * periodDays;
        double middle = 0.5 * (lc.startDays() + lc.endDays());
        return epoch + Math.rint((middle - epoch) / periodDays) * periodDays;
    }

    /** Times of every covered minimum, O−C and the linear ephemeris the fit starts from. */
    private static void minima(AnalysisState st, Consumer<String> sink) {
        MinimumSettings ms = MinimumSettings.defaults().withSecondaryPhase(st.secondaryPhase)
                .withSeed(st.settings.seed());
        st.minima = MinimumFinder.find(st.main, st.searchEphemeris, ms);
        List<MinimumTime> timings = st.minima.minima(MinimumMethod.TEMPLATE);
        long primaries = timings.stream().filter(m -> m.type() == MinimumType.PRIMARY).count();
        sink.accept(String.format(Locale.ROOT, "times of minimum: %d primary, %d secondary, %d skipped", primaries,
                timings.size() - primaries, st.minima.skipped().size()));
        // primary eclipses the data cover with points, timed or not: the fit measures the period from all of them
        long coveredPrimaries = primaries + st.minima.skipped().stream().filter(m -> m.type() == MinimumType.PRIMARY
                && m.nPoints() >= MIN_POINTS_COVERED).count();
        boolean fitCanTime = st.period != null && coveredPrimaries >= 2;
        if (timings.isEmpty() && !fitCanTime) {
            throw new WorkFailedException(String.format(Locale.ROOT, "no eclipse could be timed at P = %.8g d, "
                    + "epoch %.6f (%d eclipse(s) skipped: see the report); check the period and epoch", st
                    .searchEphemeris.periodDays(), st.searchEphemeris.epochDays(), st.minima.skipped().size()));
        }
        if (timings.isEmpty() || primaries < 2 && fitCanTime) {
            // each eclipse holds too few points to be timed alone (long cadence, short eclipses), but the
            // data cover several: the fit of the whole light curve measures period and epoch
            st.ephemeris = st.searchEphemeris;
            st.notes.add(String.format(Locale.ROOT, "%d primary eclipse(s) are covered by the data but %d could be "
                    + "timed on their own (too few points in each; see the skipped minima): no ephemeris was fitted "
                    + "to times of minimum, and the period and epoch come from the fit of the whole light curve, "
                    + "started at the period search's", coveredPrimaries, primaries));
            return;
        }
        if (st.period != null && primaries < 2) {
            throw new WorkFailedException(String.format(Locale.ROOT, "one eclipse only: %d primary and %d secondary "
                    + "eclipse(s) could be timed at the searched P = %.6g d, and a period needs two eclipses of the "
                    + "same kind; the search's period is a guess from the data's length, not a measurement. Longer "
                    + "data (a second eclipse) would settle it; if the period is known from elsewhere, give it with "
                    + "--period", primaries, timings.size() - primaries, st.searchEphemeris.periodDays()));
        }
        long cycles = timings.stream().mapToDouble(MinimumTime::cycle).distinct().count();
        st.ephemeris = st.searchEphemeris;
        if (cycles >= 2) {
            st.oc = OcAnalysis.analyse(timings, st.searchEphemeris, true, st.minima.secondaryOffsetDays(),
                    st.minima.secondaryOffsetErrorDays());
            st.ephemeris = st.oc.linear().linearPart();
        } else {
            st.notes.add("only one eclipse was timed: no ephemeris was fitted to times of minimum; the fit starts "
                    + "from the period and epoch of " + st.ephemerisSource);
        }
    }

    /** Starting values from the eclipses, then the fit from several starts. */
    private static void fit(AnalysisState st, Consumer<String> sink) {
        AnalysisSettings s = st.settings;
        ModelFile base = baseModel(st);
        st.baseModel = base;
        st.fitSettings = new FitSettings(freeNames(s.free(), base.common(), st.notes), s.baselineKind("settings"),
                s.segmentGapDays(), s.maxIterations(), s.clipSigma());
        List<FitData> data = new ArrayList<>();
        for (AnalysisState.Input in : st.inputs) {
            data.add(new FitData(in.lightCurve(), in.band()));
        }
        st.fitData = data;
        st.estimates = StartingValues.fromData(data, base);
        st.estimates.forEach((band, e) -> sink.accept((st.estimates.size() > 1 ? "band " + band + ": " : "")
                + e.describe()));
        List<MultiStartFit.Start> starts = new ArrayList<>();
        if (s.model() != null) {
            starts.add(new MultiStartFit.Start("the model file", base));
        }
        starts.addAll(MultiStartFit.starts(base, st.estimates, st.fitSettings.free(),
                Math.max(0, s.starts() - starts.size())));
        StartingValues first = st.estimates.values().iterator().next();
        sink.accept("fit from " + starts.size() + " start(s) ...");
        st.fit = MultiStartFit.fit(starts, data, st.fitSettings, 0.5 * first.primaryWidth(), sink, s.seed());
        sink.accept(String.format(Locale.ROOT, "fit: χ²ν = %.3f, rms %.0f ppm, %d points", st.fit.result()
                .reducedChi2(), st.fit.result().rms() * 1e6, st.fit.result().n()));
        if (!st.fit.result().adequacy().describesData()) {
            st.notes.add("the model does not describe the data within their errors (see Diagnostics): the "
                    + "uncertainties are then lower limits");
        }
    }

    /**
     * The model the starts are built on: the model file's (with the measured ephemeris), else the
     * settings' limb darkening and exposure with placeholder geometry (replaced by the estimates).
     */
    private static ModelFile baseModel(AnalysisState st) {
        AnalysisSettings s = st.settings;
        Ephemeris e = st.ephemeris;
        if (s.model() != null) {
            ModelFile m = ModelFileJson.read(Path.of(s.model()));
            BinaryParameters c = m.common().withPeriodDays(e.periodDays()).withEpochDays(e.epochDays());
            return new ModelFile(c, m.bands(), m.commonComplete());
        }
        BinaryParameters c = new BinaryParameters(e.periodDays(), e.epochDays(), 0.1, 0.1, 89, 0, 90, 0.5, 0,
                s.limbDarkening1(), s.limbDarkening2(), s.exposureTimeDays(), s.supersample());
        List<String> bands = st.inputs.stream().map(AnalysisState.Input::band).distinct().toList();
        if (bands.size() == 1) {
            return ModelFile.of(c);
        }
        Map<String, BandValues> perBand = new LinkedHashMap<>();
        bands.forEach(b -> perBand.put(b, new BandValues(0.5, null, null, null)));
        return new ModelFile(c, perBand, true);
    }

    /**
     * The free names with the default first limb-darkening coefficient ({@code limbDarkeningN.a}, of
     * the quadratic law) renamed to the first coefficient of the star's law, or left out for uniform
     * discs (with a note).
     */
    static java.util.Set<String> freeNames(List<String> names, BinaryParameters model, List<String> notes) {
        java.util.Set<String> out = new LinkedHashSet<>();
        for (String n : names) {
            int star = n.equals("limbDarkening1.a") ? 1 : n.equals("limbDarkening2.a") ? 2 : 0;
            if (star == 0) {
                out.add(n);
                continue;
            }
            String[] coefficients = (star == 1 ? model.limbDarkening1() : model.limbDarkening2()).law()
                    .coefficientNames();
            if (coefficients.length == 0) {
                notes.add("star " + star + " has uniform discs: no limb-darkening coefficient fitted");
            } else {
                out.add("limbDarkening" + star + "." + coefficients[0]);
            }
        }
        return out;
    }

    static String baseName(Path f) {
        String n = f.getFileName().toString();
        int dot = n.lastIndexOf('.');
        return dot > 0 ? n.substring(0, dot) : n;
    }

}
