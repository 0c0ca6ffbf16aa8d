package org.twinlight.batch;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.twinlight.BadInputException;
import org.twinlight.WorkFailedException;
import org.twinlight.eclipse.BinaryParameters;
import org.twinlight.eclipse.LimbDarkening;
import org.twinlight.eclipse.ModelFile;
import org.twinlight.fit.EclipseFitter;
import org.twinlight.fit.Estimate;
import org.twinlight.fit.FitData;
import org.twinlight.fit.FitResult;
import org.twinlight.fit.FitSettings;
import org.twinlight.fit.StartingValues;
import org.twinlight.photometry.LightCurve;
import org.twinlight.photometry.LightCurveReader;
import org.twinlight.photometry.ReadOptions;
import org.twinlight.report.EphemerisJson;
import org.twinlight.report.FitFiles;
import org.twinlight.report.FitPlot;
import org.twinlight.report.InputDigest;
import org.twinlight.report.MinimaCsv;
import org.twinlight.report.ModelFileJson;
import org.twinlight.report.OcPlot;
import org.twinlight.report.PeriodResultJson;
import org.twinlight.report.PeriodogramPlot;
import org.twinlight.report.ResultSet;
import org.twinlight.timing.Ephemeris;
import org.twinlight.timing.minima.MinimumFinder;
import org.twinlight.timing.minima.MinimumMethod;
import org.twinlight.timing.minima.MinimumSearchResult;
import org.twinlight.timing.minima.MinimumSettings;
import org.twinlight.timing.minima.MinimumTime;
import org.twinlight.timing.minima.OcAnalysis;
import org.twinlight.timing.minima.OcResult;
import org.twinlight.timing.period.EclipseEvent;
import org.twinlight.timing.period.PeriodDecision;
import org.twinlight.timing.period.PeriodSearch;
import org.twinlight.timing.period.PeriodSearchResult;
import org.twinlight.timing.period.PeriodSearchSettings;

/**
 * The unit of work of a batch target, made of the commands' stages: read the light curve(s),
 * search the period (unless the target gives one, or a model file gives period and epoch), time
 * the minima and fit the ephemeris, then the least-squares fit of the two-sphere model started
 * from values estimated from the folded data ({@code fit --start auto}). Writes into the target's
 * folder, as one result set, the files of those commands: {@code period.json},
 * {@code periodogram.png}, {@code minima.csv}, {@code ephemeris.json}, {@code o-c.png},
 * {@code fit.json}, {@code residuals.csv}, {@code model.json}, {@code fit.png}.
 *
 * <p>Holds only its settings: one instance serves every target and thread. The period search runs
 * on one thread; a batch is parallel across targets.
 */
public final class CommandPipeline implements UnitOfWork {
    /**
     * Limb darkening of both stars when no model file gives it: the linear law with u = 0.6, a
     * value typical of solar-type stars in visual light (common practice, no source); a model file
     * in the manifest sets the law of a target.
     */
    static final double DEFAULT_LINEAR_LIMB_DARKENING = 0.6;
    /** The band of a file that names none, as in the fit command. */
    private static final String DEFAULT_BAND = "default";

    private final ReadOptions readOptions;
    private final String softwareVersion;

    /**
     * @param readOptions how every light curve of the batch is read (columns, time scale, ...)
     * @param softwareVersion the version written into the result files
     */
    public CommandPipeline(ReadOptions readOptions, String softwareVersion) {
        this.readOptions = readOptions;
        this.softwareVersion = softwareVersion;
    }

    @Override
    public TargetResult run(BatchTarget t) {
        refuseUnusedInputs(t);
        List<LightCurve> curves = new ArrayList<>();
        for (Path f : t.files()) {
            curves.add(LightCurveReader.read(f, readOptions));
        }
        LightCurve first = curves.get(0);
        Path firstFile = t.files().get(0);
        ModelFile given = t.model() == null ? null : ModelFileJson.read(t.model());
        List<String> notes = new ArrayList<>();

        PeriodSearchResult search = null;
        Ephemeris ephemeris;
        double secondaryPhase = 0.5;
        if (given != null) {
            BinaryParameters c = given.common();
            ephemeris = new Ephemeris(c.epochDays(), t.periodDays() != null ? t.periodDays() : c.periodDays());
        } else {
            search = periodSearch(first, firstFile, t.periodDays(), notes);
            ephemeris = new Ephemeris(search.epochDays(), t.periodDays() != null ? t.periodDays() : search.periodDays());
            secondaryPhase = search.secondary().map(EclipseEvent::phase).filter(p -> p > 0 && p < 1).orElse(0.5);
        }

        MinimumSearchResult minima = MinimumFinder.find(first, ephemeris,
                MinimumSettings.defaults().withSecondaryPhase(secondaryPhase));
        List<MinimumTime> timings = minima.minima(MinimumMethod.TEMPLATE);
        OcResult oc = timings.stream().mapToDouble(MinimumTime::cycle).distinct().count() >= 2
                ? OcAnalysis.analyse(timings, ephemeris, true, minima.secondaryOffsetDays(),
                        minima.secondaryOffsetErrorDays())
                : null;
        if (timings.isEmpty()) {
            notes.add("no eclipse could be timed (" + minima.skipped().size() + " skipped)");
        }
        Ephemeris refined = oc != null ? oc.linear().linearPart() : ephemeris;

        List<FitData> data = new ArrayList<>();
        for (int i = 0; i < curves.size(); i++) {
            LightCurve lc = curves.get(i);
            String band = lc.band() != null ? lc.band() : curves.size() > 1
                    ? TargetDiscovery.baseName(t.files().get(i).getFileName().toString()) : DEFAULT_BAND;
            data.add(new FitData(lc, band));
        }
        FitSettings settings = FitSettings.defaults();
        ModelFile start = startModel(given, refined);
        Map<String, StartingValues> estimates = StartingValues.fromData(data, start);
        start = StartingValues.apply(start, estimates, settings.free());
        FitResult fit = EclipseFitter.fit(start, data, settings);

        List<String> written = write(t, curves, search, minima, oc, ephemeris, secondaryPhase, fit, data);
        String message = message(search, oc, timings.size(), fit, notes);
        return new TargetResult(0, message, keyResults(search, oc, fit), written, "fit.png");
    }

    /** The columns of a manifest this unit does not use are refused, so that no input is silently ignored. */
    private static void refuseUnusedInputs(BatchTarget t) {
        if (t.settings() != null || t.velocities() != null) {
            throw new BadInputException(t.origin() + ", column '" + (t.settings() != null ? "settings" : "velocities")
                    + "': this batch runs period search, minima and the model fit; settings files and velocities "
                    + "are used by the one-command analysis. Leave the cell empty, or fit the velocities with the "
                    + "velocities and dimensions commands");
        }
    }

    private static PeriodSearchResult periodSearch(LightCurve lc, Path file, Double periodDays, List<String> notes) {
        PeriodSearchSettings s = PeriodSearchSettings.defaults().withParallel(false);
        if (periodDays != null) {
            // the given period is kept; the search near it finds the epoch
            s = s.withMinPeriodDays(periodDays * 0.99).withMaxPeriodDays(periodDays * 1.01);
        }
        PeriodSearchResult r = PeriodSearch.search(lc, s);
        PeriodDecision d = r.decision();
        if (d.status() == PeriodDecision.Status.NOT_SIGNIFICANT) {
            throw new WorkFailedException(file + ": no significant eclipse period (" + r.significanceNote()
                    + "); give the period in the manifest's period column if it is known, or more data");
        }
        if (d.status() == PeriodDecision.Status.AMBIGUOUS && periodDays == null) {
            StringBuilder alt = new StringBuilder();
            d.alternativesDays().forEach(a -> alt.append(alt.length() == 0 ? "" : ", ")
                    .append(String.format(Locale.ROOT, "%.7f", a)));
            notes.add(String.format(Locale.ROOT, "period AMBIGUOUS: %.7f d used, the data also allow %s d (see "
                    + "period.json for the evidence and what would settle it)", r.periodDays(), alt));
        }
        return r;
    }

    /** The starting model: the model file's, or circular uniform-brightness guesses, at the refined ephemeris. */
    private static ModelFile startModel(ModelFile given, Ephemeris eph) {
        if (given != null) {
            BinaryParameters c = given.common().withPeriodDays(eph.periodDays()).withEpochDays(eph.epochDays());
            return new ModelFile(c, given.bands(), given.commonComplete());
        }
        LimbDarkening ld = LimbDarkening.of(org.twinlight.eclipse.LimbDarkeningLaw.LINEAR,
                DEFAULT_LINEAR_LIMB_DARKENING);
        BinaryParameters c = new BinaryParameters(eph.periodDays(), eph.epochDays(), 0.1, 0.1, 88, 0, 90, 0.5, 0,
                ld, ld, 0, 1);
        return ModelFile.of(c);
    }

    private List<String> write(BatchTarget t, List<LightCurve> curves, PeriodSearchResult search,
            MinimumSearchResult minima, OcResult oc, Ephemeris given, double secondaryPhase, FitResult fit,
            List<FitData> data) {
        LightCurve first = curves.get(0);
        Path firstFile = t.files().get(0);
        String source = firstFile.getFileName().toString();
        String sha = InputDigest.sha256(firstFile);
        List<FitFiles.InputRecord> inputs = new ArrayList<>();
        for (int i = 0; i < curves.size(); i++) {
            Path f = t.files().get(i);
            inputs.add(new FitFiles.InputRecord(f.toString(), i == 0 ? sha : InputDigest.sha256(f), data.get(i).band(),
                    curves.get(i).band() != null ? "band column" : curves.size() > 1 ? "file name" : "default",
                    curves.get(i).size()));
        }
        var scale = first.timeScale();
        try (ResultSet set = ResultSet.open(t.outputDir(), "batch")) {
            if (search != null) {
                PeriodResultJson.write(set.file("period.json"), search, scale.label(), source, sha,
                        first.rejectedCount(), softwareVersion, first.notes());
                PeriodogramPlot.write(set.file("periodogram.png"), search, first);
            }
            if (!minima.minima().isEmpty()) {
                MinimaCsv.write(set.file("minima.csv"), minima.minima(), scale, source, given);
                EphemerisJson.write(set.file("ephemeris.json"), new EphemerisJson.Content(given, oc, minima,
                        MinimumMethod.TEMPLATE, secondaryPhase, source, sha, softwareVersion), first.notes());
                if (oc != null) {
                    Ephemeris ref = oc.reference();
                    OcPlot.write(set.file("o-c.png"), oc.points(), oc, String.format(Locale.ROOT,
                            "T0 = %.6f, P = %.8f d", ref.epochDays(), ref.periodDays()), scale,
                            MinimumMethod.TEMPLATE.label(), minima.secondaryPhase(), ref.periodDays());
                }
            }
            var doc = FitFiles.fitJson(fit, FitSettings.defaults(), scale, inputs, softwareVersion);
            FitFiles.writeJson(set.file("fit.json"), doc);
            FitFiles.writeResiduals(set.file("residuals.csv"), fit, scale);
            FitFiles.writeJson(set.file("model.json"), ModelFileJson.toJson(fit.model()));
            FitPlot.write(fit, data.get(0).band(), set.file("fit.png"), "Fit of " + t.label(), scale.label());
            set.commit();
        }
        List<String> written = new ArrayList<>(List.of("fit.png", "fit.json", "residuals.csv", "model.json"));
        if (search != null) {
            written.addAll(List.of("period.json", "periodogram.png"));
        }
        if (!minima.minima().isEmpty()) {
            written.addAll(List.of("minima.csv", "ephemeris.json"));
            if (oc != null) {
                written.add("o-c.png");
            }
        }
        return written;
    }

    /** One line: the period's verdict, the fit's χ²ν and what to look at. */
    private static String message(PeriodSearchResult search, OcResult oc, int timings, FitResult fit,
            List<String> notes) {
        List<String> parts = new ArrayList<>();
        if (search != null && search.decision().status() == PeriodDecision.Status.CONFIDENT) {
            parts.add("period confident");
        } else if (search == null) {
            parts.add("period and epoch from the model file");
        }
        parts.addAll(notes);
        if (timings > 0) {
            parts.add(timings + " times of minimum" + (oc != null && oc.periodChangeFound()
                    ? ", a period change (" + oc.preferred().label() + " ephemeris preferred)" : ""));
        }
        parts.add(String.format(Locale.ROOT, "fit: reduced chi2 %.2f, rms %.3g", fit.reducedChi2(), fit.rms()));
        if (!fit.adequacy().describesData()) {
            parts.add("the model does not describe the data well (see fit.json adequacy)");
        }
        return String.join("; ", parts);
    }

    /** Period and epoch from the ephemeris (else the search), the fitted geometry, the fit's χ²ν. */
    private static Map<String, TargetResult.KeyValue> keyResults(PeriodSearchResult search, OcResult oc,
            FitResult fit) {
        Map<String, TargetResult.KeyValue> m = new LinkedHashMap<>();
        if (oc != null) {
            oc.linear().parameter("period").ifPresent(p -> m.put("period", kv(p.value(), p.uncertainty())));
        } else if (search != null) {
            m.put("period", kv(search.periodDays(), search.periodUncertaintyDays()));
        } else {
            m.put("period", kv(fit.get("period").value(), Double.NaN));
        }
        for (String name : List.of("epoch", "radius1", "radius2", "inclination", "surfaceBrightnessRatio",
                "sumOfRadii", "radiusRatio", "lightRatio")) {
            Estimate e = find(fit, name);
            if (e != null) {
                m.put(name, kv(e.value(), e.free() || fit.derived().contains(e) ? e.uncertainty() : Double.NaN));
            }
        }
        m.put("reducedChi2", kv(fit.reducedChi2(), Double.NaN));
        return m;
    }

    private static Estimate find(FitResult fit, String name) {
        try {
            return fit.get(name);
        } catch (IllegalArgumentException e) {
            return null;
        }
    }

    private static TargetResult.KeyValue kv(double value, double uncertainty) {
        return new TargetResult.KeyValue(value, uncertainty);
    }
}
