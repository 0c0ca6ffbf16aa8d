package org.twinlight.analysis;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.awt.RenderingHints;
import java.awt.image.BufferedImage;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.function.Consumer;
import javax.imageio.ImageIO;
import org.twinlight.BadInputException;
import org.twinlight.WorkFailedException;
import org.twinlight.fit.Estimate;
import org.twinlight.fit.FitResult;
import org.twinlight.fit.Prior;
import org.twinlight.fit.NoiseReport;
import org.twinlight.photometry.LightCurveSummary;
import org.twinlight.report.AtomicFiles;
import org.twinlight.report.EphemerisJson;
import org.twinlight.report.FitFiles;
import org.twinlight.report.FitPlot;
import org.twinlight.report.MinimaCsv;
import org.twinlight.report.ModelFileJson;
import org.twinlight.report.OcPlot;
import org.twinlight.report.PeriodResultJson;
import org.twinlight.report.PeriodogramPlot;
import org.twinlight.report.ResultSet;
import org.twinlight.report.SoftwareVersion;
import org.twinlight.timing.Ephemeris;
import org.twinlight.timing.minima.MinimumMethod;
import org.twinlight.timing.minima.MinimumTime;
import org.twinlight.timing.minima.OcPoint;

/**
 * Writes what an analysis found as one {@link ResultSet}: the files of each stage through the
 * writers of the single commands ({@code period.json}, {@code ephemeris.json}, {@code fit.json},
 * their plots, ...), then {@code results.json} made of those same documents (so every number is
 * under the name it has there), {@code settings-used.json} and {@code report.html} rendered from
 * {@code results.json}.
 */
final class AnalysisFiles {
    private static final ObjectMapper JSON = new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT);
    /** Every file an analysis may write. */
    static final List<String> NAMES = List.of("report.html", "results.json", "settings-used.json", "period.json",
            "periodogram.png", "minima.csv", "ephemeris.json", "o-c.png", "fit.json", "residuals.csv", "model.json",
            "fit.png", "thumbnail.png", "chain.csv.gz", "trace.png", "corner.png", "velocities.png", "dimensions.json",
            "dimensions.txt", "mass-radius.png", "mass-luminosity.png");
    /** Width of the thumbnail for an index page, pixels. */
    static final int THUMBNAIL_WIDTH = 320;
    /** The names of the key results, in order. */
    static final List<String> KEY_NAMES = List.of("period", "epoch", "radius1", "radius2", "inclination",
            "eccentricity", "omega", "surfaceBrightnessRatio", "sumOfRadii", "radiusRatio", "lightRatio");

    private AnalysisFiles() {
    }

    /** Refuses an output folder in which a result file would replace the input {@code input}. */
    static void refuseOverwrite(Path outputDir, Path input) {
        for (String name : NAMES) {
            Path target = outputDir.resolve(name).toAbsolutePath().normalize();
            if (target.equals(input.toAbsolutePath().normalize())) {
                throw new BadInputException(input + ": the input would be overwritten by the result file " + name
                        + "; choose another output folder");
            }
        }
    }

    static AnalysisOutcome write(AnalysisState st, Consumer<String> sink) {
        String version = SoftwareVersion.version();
        ObjectNode results = JSON.createObjectNode();
        Map<String, byte[]> images = new LinkedHashMap<>();
        List<Path> written = new ArrayList<>();
        Path thumbnail = null;
        int exit = 1;
        String message = null;
        Path out = st.request.outputDir();
        try (ResultSet set = ResultSet.open(out, "analyse")) {
            results.put("target", st.request.label());
            ObjectNode status = results.putObject("status");
            results.set("data", data(st));
            AnalysisState.Input main = st.inputs.isEmpty() ? null
                    : st.inputs.stream().filter(in -> in.lightCurve() == st.main).findFirst().orElseThrow();
            if (st.period != null) {
                PeriodResultJson.write(set.file("period.json"), st.period, st.timeScaleLabel(),
                        main.file().getFileName().toString(), main.sha256(), st.main.rejectedCount(), version,
                        st.main.notes());
                PeriodogramPlot.write(set.file("periodogram.png"), st.period, st.main);
                results.set("period", readJson(set.file("period.json")));
                images.put("periodogram.png", bytes(set.file("periodogram.png")));
            }
            if (st.minima != null && !st.minima.minima(MinimumMethod.TEMPLATE).isEmpty()) {
                writeMinima(st, set, main, version, results, images);
            }
            if (st.fit != null) {
                writeFit(st, set, version, results, images);
                AfterFitFiles.writeDimensions(st, set, version, results, images);
            }
            exit = st.failure != null || !st.doubts.isEmpty() ? 1 : 0;
            message = message(st);
            status.put("exitCode", exit);
            status.put("verdict", st.failure != null ? "failed" : exit == 0 ? "ok" : "uncertain");
            status.put("message", message);
            status.put("failedStage", st.failure != null ? st.failedStage : null);
            strings(status.putArray("doubts"), st.doubts);
            strings(status.putArray("notes"), st.notes);
            results.set("starts", starts(st));
            String thumbSource = images.containsKey("fit.png") ? "fit.png"
                    : images.containsKey("periodogram.png") ? "periodogram.png" : null;
            if (thumbSource != null) {
                AtomicFiles.writeBytes(set.file("thumbnail.png"), thumbnail(images.get(thumbSource)));
            }
            ObjectNode settingsUsed = AnalysisSettingsJson.toJson(st.settings);
            FitFiles.writeJson(set.file("settings-used.json"), settingsUsed);
            results.set("provenance", provenance(st, version, settingsUsed));
            FitFiles.writeJson(set.file("results.json"), results);
            AtomicFiles.writeString(set.file("report.html"), AnalysisReport.html(results, images));
            set.commit();
            for (String n : NAMES) {
                if (Files.isRegularFile(set.directory().resolve(n))) {
                    written.add(set.directory().resolve(n));
                }
            }
            thumbnail = thumbSource == null ? null : set.directory().resolve("thumbnail.png");
        } catch (WorkFailedException | UncheckedIOException e) {
            return new AnalysisOutcome(1, "the results could not be written to " + out + ": " + e.getMessage(),
                    Map.of(), List.of(), null);
        }
        sink.accept(message);
        sink.accept("wrote report.html, results.json and settings-used.json with the files of each stage to " + out);
        return new AnalysisOutcome(exit, message, keyResults(st), written, thumbnail);
    }

    /** The one-paragraph verdict of the run. */
    private static String message(AnalysisState st) {
        if (st.failure != null) {
            return "The analysis stopped at the " + st.failedStage + ": " + st.failure;
        }
        FitResult r = st.fit.result();
        Map<String, AnalysisOutcome.Value> key = keyResults(st);
        String head = String.format(Locale.ROOT, "P = %s d, r1 = %s, r2 = %s, i = %s deg (chi2/nu = %.2f; errors "
                + "as quoted: the larger of covariance x max(1, beta) and the residual permutation)",
                withError(key.get("period")), withError(key.get("radius1")), withError(key.get("radius2")),
                withError(key.get("inclination")), r.reducedChi2());
        if (key.containsKey("mass1")) {
            head += String.format(Locale.ROOT, "; M1 = %s, M2 = %s, R1 = %s, R2 = %s (nominal solar units, "
                    + "dimensions.txt)", withError(key.get("mass1")), withError(key.get("mass2")),
                    withError(key.get("radius1Rsun")), withError(key.get("radius2Rsun")));
        }
        return st.doubts.isEmpty() ? "Done: " + head + "."
                : "Results with a doubt: " + head + ". " + String.join(" ", st.doubts);
    }

    private static String withError(AnalysisOutcome.Value v) {
        return AnalysisReport.withError(v.value(), v.uncertainty());
    }

    /** The key results with the errors to quote (correlated noise allowed for: {@link NoiseReport#quoted}). */
    private static Map<String, AnalysisOutcome.Value> keyResults(AnalysisState st) {
        Map<String, AnalysisOutcome.Value> m = new LinkedHashMap<>();
        if (st.fit != null) {
            for (String name : KEY_NAMES) {
                Estimate e = st.fit.result().get(name);
                double sigma = e.free() ? st.fit.noise().quoted(name, e.uncertainty())
                        : e.uncertainty() > 0 ? e.uncertainty() : Double.NaN;
                m.put(name, new AnalysisOutcome.Value(e.value(), sigma));
            }
            m.put("reducedChi2", new AnalysisOutcome.Value(st.fit.result().reducedChi2(), Double.NaN));
            AfterFitFiles.keyResults(st, m);
        } else if (st.ephemeris != null) {
            m.put("period", new AnalysisOutcome.Value(st.ephemeris.periodDays(), Double.NaN));
            m.put("epoch", new AnalysisOutcome.Value(st.ephemeris.epochDays(), Double.NaN));
        }
        return m;
    }

    private static void writeMinima(AnalysisState st, ResultSet set, AnalysisState.Input main, String version,
            ObjectNode results, Map<String, byte[]> images) {
        String source = main.file().getFileName().toString();
        Ephemeris given = st.searchEphemeris;
        MinimaCsv.write(set.file("minima.csv"), st.minima.minima(), st.timeScale, source, given);
        EphemerisJson.write(set.file("ephemeris.json"), new EphemerisJson.Content(given, st.oc, st.minima,
                MinimumMethod.TEMPLATE, st.secondaryPhase, source, main.sha256(), version), st.main.notes());
        List<MinimumTime> timings = st.minima.minima(MinimumMethod.TEMPLATE);
        List<OcPoint> points = st.oc != null ? st.oc.points() : timings.stream()
                .map(m -> new OcPoint(m.cycle(), m.type(), m.timeDays(), m.errorDays(),
                        m.timeDays() - given.timeOf(m.cycle()), m.partial())).toList();
        Ephemeris ref = st.oc != null ? st.oc.reference() : given;
        OcPlot.write(set.file("o-c.png"), points, st.oc, String.format(Locale.ROOT, "T0 = %.6f, P = %.8f d",
                ref.epochDays(), ref.periodDays()), st.timeScale, MinimumMethod.TEMPLATE.label(),
                st.minima.secondaryPhase(), ref.periodDays());
        results.set("ephemeris", readJson(set.file("ephemeris.json")));
        ArrayNode table = results.putArray("minima");
        for (OcPoint p : points) {
            MinimumTime m = timings.stream().filter(t -> t.cycle() == p.cycle() && t.type() == p.type()).findFirst()
                    .orElseThrow();
            ObjectNode row = table.addObject();
            row.put("cycle", MinimaCsv.cycleText(m.cycle()));
            row.put("type", m.type().label());
            value(row.putObject("time"), m.timeDays(), m.errorDays());
            row.put("method", m.method().label());
            row.put("n_points", m.nPoints());
            row.put("beta", Double.isFinite(m.beta()) ? m.beta() : null);
            row.put("partial", m.partial());
            row.put("oMinusCDays", p.ocDays());
        }
        ArrayNode skipped = results.putArray("skippedMinima");
        st.minima.skipped().forEach(s -> {
            ObjectNode row = skipped.addObject();
            row.put("cycle", MinimaCsv.cycleText(s.cycle()));
            row.put("type", s.type().label());
            row.put("predictedTime", s.predictedTimeDays());
            row.put("n_points", s.nPoints());
            row.put("reason", s.reason());
        });
        images.put("o-c.png", bytes(set.file("o-c.png")));
    }

    private static void writeFit(AnalysisState st, ResultSet set, String version, ObjectNode results,
            Map<String, byte[]> images) {
        FitResult r = st.fit.result();
        List<FitFiles.InputRecord> inputs = st.inputs.stream().map(in -> new FitFiles.InputRecord(in.file()
                .toString(), in.sha256(), in.band(), in.bandSource(), in.lightCurve().size())).toList();
        ObjectNode doc = FitFiles.fitJson(r, st.fit.problem().settings(), st.timeScale, inputs, version);
        ArrayNode notes = (ArrayNode) doc.get("notes");
        st.estimates.forEach((band, e) -> notes.add((st.estimates.size() > 1 ? "band " + band + ": " : "")
                + e.describe()));
        FitFiles.putNoise(doc, st.fit.noise(), r);
        AfterFitFiles.addToFitJson(st, doc);
        putFitChoices(doc, st.fit);
        List<String> present = new ArrayList<>();
        notes.forEach(n -> present.add(n.asText()));
        st.fit.notes().stream().filter(n -> !present.contains(n)).forEach(notes::add);
        FitFiles.writeJson(set.file("fit.json"), doc);
        FitFiles.writeResiduals(set.file("residuals.csv"), r, st.timeScale);
        FitFiles.writeJson(set.file("model.json"), ModelFileJson.toJson(r.model()));
        List<String> bands = st.fitData.stream().map(d -> d.band()).distinct().toList();
        FitPlot.write(r, bands.get(0), set.file("fit.png"), "Fit of " + st.request.label(), st.timeScaleLabel());
        images.put("fit.png", bytes(set.file("fit.png")));
        for (int b = 1; b < bands.size(); b++) {
            String name = "fit-" + bands.get(b).replaceAll("[^A-Za-z0-9_.-]", "_") + ".png";
            FitPlot.write(r, bands.get(b), set.file(name), "Fit of " + st.request.label() + ", band " + bands.get(b),
                    st.timeScaleLabel());
            images.put(name, bytes(set.file(name)));
        }
        AfterFitFiles.writeFitExtras(st, set, images);
        results.set("fit", readJson(set.file("fit.json")));
    }

    /**
     * What the fit stage chose beyond a plain fit: the priors on the limb darkening, the orbit kept
     * by BIC, and the profile of χ² that widened the inclination's error.
     */
    private static void putFitChoices(ObjectNode doc, MultiStartFit.Outcome fit) {
        if (!fit.priors().isEmpty()) {
            ObjectNode pri = doc.putObject("limbDarkeningPriors");
            fit.priors().byName().forEach((name, prior) -> {
                if (prior instanceof Prior.Normal n) {
                    ObjectNode o = pri.putObject(name);
                    o.put("mean", n.mean());
                    o.put("sigma", n.sigma());
                }
            });
        }
        if (fit.orbit() != null) {
            ObjectNode o = doc.putObject("orbit");
            o.put("chosen", fit.orbit().circular() ? "circular" : "eccentric");
            o.put("bicEccentric", Double.isFinite(fit.orbit().bicEccentric()) ? fit.orbit().bicEccentric() : null);
            o.put("bicCircular", Double.isFinite(fit.orbit().bicCircular()) ? fit.orbit().bicCircular() : null);
            o.put("reason", fit.orbit().sentence());
        }
        InclinationProfile.Result p = fit.inclinationProfile();
        if (p != null) {
            ObjectNode o = doc.putObject("inclinationProfile").put("from", "profileOfChi2").put("bestDeg", p.bestDeg())
                    .put("covarianceSigmaDeg", p.covarianceSigmaDeg()).put("sigmaDeg", p.sigmaDeg())
                    .put("lowerDeg", p.lowerDeg()).put("upperDeg", p.upperDeg())
                    .put("deltaChi2At1Sigma", p.varianceScale()).put("correlatedWith", p.correlatedWith())
                    .put("correlation", p.correlation());
            ArrayNode pts = o.putArray("points");
            p.points().forEach(q -> pts.addObject().put("inclinationDeg", q[0]).put("deltaChi2", q[1]));
            ObjectNode w = o.putObject("widened");
            p.widened().forEach((name, v) -> w.putObject(name).put("covariance", v[0]).put("profile", v[1]));
        }
    }

    private static ArrayNode starts(AnalysisState st) {
        ArrayNode a = JSON.createArrayNode();
        if (st.fit == null) {
            return a;
        }
        for (MultiStartFit.Trial t : st.fit.trials()) {
            ObjectNode o = a.addObject();
            o.put("start", t.start().label());
            o.put("chi2", Double.isFinite(t.chi2()) ? t.chi2() : null);
            if (t.end() != null) {
                var p = t.end().common();
                o.put("radius1", p.radius1());
                o.put("radius2", p.radius2());
                o.put("inclination", p.inclinationDeg());
                o.put("eccentricity", p.eccentricity());
            } else {
                o.put("failure", t.failure());
            }
        }
        return a;
    }

    private static ArrayNode data(AnalysisState st) {
        ArrayNode a = JSON.createArrayNode();
        for (AnalysisState.Input in : st.inputs) {
            LightCurveSummary s = in.summary();
            ObjectNode o = a.addObject();
            o.put("file", in.file().getFileName().toString());
            o.put("sha256", in.sha256());
            o.put("band", in.band());
            o.put("bandSource", in.bandSource());
            o.put("valueKind", s.valueKind().toString().toLowerCase(Locale.ROOT));
            o.put("timeScale", s.timeScale().label());
            o.put("points", s.points());
            ObjectNode rej = o.putObject("rejectedRows");
            s.rejectedRows().forEach(rej::put);
            o.put("start", s.startDays());
            o.put("end", s.endDays());
            o.put("span", s.spanDays());
            o.put("cadence", s.medianCadenceDays());
            o.put("gaps", s.gapCount());
            o.put("segments", s.segments().size());
            o.put("medianError", Double.isFinite(s.medianErrorFlux()) ? s.medianErrorFlux() : null);
            o.put("scatter", s.scatterFlux());
            o.put("outliers", s.outlierCount());
            strings(o.putArray("notes"), in.lightCurve().notes());
        }
        return a;
    }

    private static ObjectNode provenance(AnalysisState st, String version, ObjectNode settings) {
        ObjectNode p = JSON.createObjectNode();
        p.put("software", "twinlight");
        p.put("version", version);
        p.put("started", st.started.truncatedTo(ChronoUnit.SECONDS).toString());
        p.put("finished", Instant.now().truncatedTo(ChronoUnit.SECONDS).toString());
        p.put("timeScale", st.timeScaleLabel());
        p.put("seed", st.settings.seed());
        p.put("ephemerisSource", st.ephemerisSource);
        ObjectNode secs = p.putObject("stageSeconds");
        st.stageSeconds.forEach(secs::put);
        ArrayNode inputs = p.putArray("inputs");
        st.inputs.forEach(in -> inputs.addObject().put("file", in.file().toString()).put("sha256", in.sha256()));
        p.put("fitMethod", "Levenberg-Marquardt least squares from " + (st.fit == null ? 0 : st.fit.trials().size())
                + " starts compared on a thinned copy of the data (" + (st.fit == null ? 0 : st.fit.thinnedPoints())
                + " points), the best refined on all points; uncertainties from the covariance scaled by the reduced "
                + "chi-square");
        p.set("settings", settings);
        return p;
    }

    static void value(ObjectNode o, double value, double uncertainty) {
        o.put("value", value);
        o.put("uncertainty", Double.isFinite(uncertainty) ? uncertainty : null);
    }

    private static void strings(ArrayNode a, List<String> values) {
        values.forEach(a::add);
    }

    static JsonNode readJson(Path f) {
        try {
            return JSON.readTree(f.toFile());
        } catch (IOException e) {
            throw new UncheckedIOException("cannot read back " + f.getFileName() + ": " + e.getMessage(), e);
        }
    }

    static byte[] bytes(Path f) {
        try {
            return Files.readAllBytes(f);
        } catch (IOException e) {
            throw new UncheckedIOException("cannot read back " + f.getFileName() + ": " + e.getMessage(), e);
        }
    }

    /** A PNG scaled to {@value #THUMBNAIL_WIDTH} pixels wide. */
    static byte[] thumbnail(byte[] png) {
        try {
            BufferedImage src = ImageIO.read(new java.io.ByteArrayInputStream(png));
            int h = Math.max(1, src.getHeight() * THUMBNAIL_WIDTH / src.getWidth());
            BufferedImage dst = new BufferedImage(THUMBNAIL_WIDTH, h, BufferedImage.TYPE_INT_RGB);
            java.awt.Graphics2D g = dst.createGraphics();
            g.setRenderingHint(RenderingHints.KEY_INTERPOLATION, RenderingHints.VALUE_INTERPOLATION_BICUBIC);
            g.setRenderingHint(RenderingHints.KEY_RENDERING, RenderingHints.VALUE_RENDER_QUALITY);
            g.drawImage(src.getScaledInstance(THUMBNAIL_WIDTH, h, java.awt.Image.SCALE_SMOOTH), 0, 0, null);
            g.dispose();
            ByteArrayOutputStream buf = new ByteArrayOutputStream();
            ImageIO.write(dst, "png", buf);
            return buf.toByteArray();
        } catch (IOException e) {
            throw new UncheckedIOException("cannot draw the thumbnail: " + e.getMessage(), e);
        }
    }
}
