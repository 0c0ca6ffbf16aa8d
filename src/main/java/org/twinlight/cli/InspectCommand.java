package org.twinlight.cli;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;
import java.util.stream.Collectors;
import org.twinlight.BadInputException;
import org.twinlight.photometry.LightCurve;
import org.twinlight.photometry.LightCurveSummary;
import org.twinlight.photometry.Magnitudes;
import org.twinlight.photometry.ValueKind;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/** {@code inspect FILE}: a summary of a photometry file, per band, for people or as JSON. */
@Command(name = "inspect",
        mixinStandardHelpOptions = true,
        description = {
            "Summarise a photometry file (delimited text or FITS binary table): points used and rejected "
                    + "(by reason), time span and scale, cadence, gaps and segments, flux range, scatter and outliers. "
                    + "A file with a band column is summarised band by band.",
            "Exit codes: 0 success, 2 bad usage or unusable input."
        })
public final class InspectCommand implements Callable<Integer> {

    /** What the scatter row says when there are too few points to measure it. */
    private static final String NO_SCATTER = "not measured (too few points in a segment)";

    /** Segments listed one by one in the text output; the JSON lists all. */
    private static final int SEGMENTS_LISTED = 20;

    @Parameters(index = "0", paramLabel = "FILE", description = "Photometry file: delimited text or FITS.")
    Path file;

    @Mixin
    PhotometryOptions photometry;

    @Option(names = "--segment-gap", paramLabel = "DAYS", defaultValue = "0.5",
            description = "Split the light curve into segments at gaps longer than this many days (default: ${DEFAULT-VALUE}).")
    double segmentGapDays;

    @Option(names = "--json", description = "Print the summary as JSON instead of text.")
    boolean json;

    @Spec
    CommandSpec spec;

    @Override
    public Integer call() {
        if (!(segmentGapDays > 0) || Double.isInfinite(segmentGapDays)) {
            throw new BadInputException("option --segment-gap: expected a positive number of days, got "
                    + segmentGapDays);
        }
        Map<String, LightCurve> bands = photometry.readBands(file, spec.commandLine().getOut());
        List<LightCurveSummary> summaries = new ArrayList<>();
        List<Double> magnitudeErrors = new ArrayList<>();
        for (LightCurve lc : bands.values()) {
            summaries.add(LightCurveSummary.of(lc, segmentGapDays));
            magnitudeErrors.add(medianMagnitudeError(lc));
        }
        PrintWriter out = spec.commandLine().getOut();
        out.print(json ? json(summaries, magnitudeErrors) : text(summaries, magnitudeErrors));
        out.flush();
        return 0;
    }

    /**
     * Median of the points' magnitude errors σ_m = σ_F / (0.4 ln 10 · F), the errors as the file
     * gave them; NaN without errors or for flux input.
     */
    private static double medianMagnitudeError(LightCurve lc) {
        if (lc.originalKind() != ValueKind.MAGNITUDE || !lc.hasErrors()) {
            return Double.NaN;
        }
        double[] e = new double[lc.size()];
        for (int i = 0; i < e.length; i++) {
            e[i] = Magnitudes.toMagnitudeError(lc.flux(i), lc.fluxError(i));
        }
        return org.twinlight.photometry.RobustStatistics.medianBySelection(e, e.length);
    }

    private String text(List<LightCurveSummary> summaries, List<Double> magnitudeErrors) {
        StringBuilder sb = new StringBuilder();
        sb.append(row("File", file.toString()));
        if (summaries.size() > 1) {
            sb.append(row("Bands", summaries.size() + ": " + summaries.stream().map(LightCurveSummary::band)
                    .collect(Collectors.joining(", "))));
        }
        for (LightCurveSummary s : summaries) {
            sb.append('\n');
            sb.append(row("Band", s.band() == null ? "not given" : s.band()));
            sb.append(row("Points", s.points() + " used, " + s.rejectedCount() + " rejected" + reasons(s)));
            sb.append(row("Time scale", s.timeScale().isKnown() ? s.timeScale().label()
                    : "unknown (declare it with --time-scale)"));
            sb.append(row("Values", s.valueKind() == ValueKind.MAGNITUDE
                    ? "magnitudes, read as relative flux 10^(-0.4 m)" : "flux"));
            sb.append(row("Time span", fmt("%.6f to %.6f (%s)", s.startDays(), s.endDays(), days(s.spanDays()))));
            if (s.points() > 1) {
                sb.append(row("Cadence", "median " + days(s.medianCadenceDays())));
                sb.append(row("Gaps", s.gapCount() + " longer than " + days(s.gapThresholdDays()) + " ("
                        + fmt("%.0f", LightCurveSummary.GAP_CADENCE_MULTIPLE) + " x cadence); longest interval "
                        + days(s.largestIntervalDays())));
            }
            sb.append(row("Segments", s.segments().size() + " (split at gaps longer than "
                    + days(s.segmentGapDays()) + ")"));
            for (int k = 0; k < Math.min(s.segments().size(), SEGMENTS_LISTED); k++) {
                LightCurveSummary.Segment g = s.segments().get(k);
                sb.append(row("", fmt("%3d  %.6f to %.6f  %s, %s", k + 1, g.startDays(), g.endDays(),
                        days(g.spanDays()), Messages.count(g.points(), "point", "points"))));
            }
            if (s.segments().size() > SEGMENTS_LISTED) {
                sb.append(row("", "... and " + (s.segments().size() - SEGMENTS_LISTED) + " more (see --json)"));
            }
            if (s.valueKind() == ValueKind.MAGNITUDE && s.minFlux() > 0) {
                // in the unit the file gave: magnitudes (brightest = smallest)
                double medianMag = Magnitudes.fromRelativeFlux(s.medianFlux());
                sb.append(row("Magnitudes", fmt("brightest %.4f, median %.4f, faintest %.4f (depth %.4f mag)",
                        Magnitudes.fromRelativeFlux(s.maxFlux()), medianMag, Magnitudes.fromRelativeFlux(s.minFlux()),
                        Magnitudes.fromRelativeFlux(s.minFlux()) - medianMag)));
                double magErr = magnitudeErrors.get(summaries.indexOf(s));
                sb.append(row("Errors", Double.isFinite(magErr) ? fmt("median %.4f mag", magErr) : "none in the file"));
                sb.append(row("Scatter", Double.isFinite(s.scatterFlux()) && s.medianFlux() > 0
                        ? fmt("%.4f mag", Magnitudes.toMagnitudeError(s.medianFlux(), s.scatterFlux()))
                                + ", robust point-to-point noise" : NO_SCATTER));
            } else {
                sb.append(row("Flux", fmt("min %.6g, median %.6g, max %.6g", s.minFlux(), s.medianFlux(),
                        s.maxFlux())));
                sb.append(row("Errors", s.hasErrors() ? fmt("median %.3g", s.medianErrorFlux())
                        + relative(s.medianErrorFlux(), s.medianFlux()) : "none in the file"));
                sb.append(row("Scatter", Double.isFinite(s.scatterFlux()) ? fmt("%.3g", s.scatterFlux())
                        + relative(s.scatterFlux(), s.medianFlux()) + ", robust point-to-point noise" : NO_SCATTER));
            }
            sb.append(row("Outliers", s.outlierCount() + " more than " + fmt("%.0f", LightCurveSummary.OUTLIER_SIGMAS)
                    + " sigma from the running median and from lines through the neighbours on either side"
                    + " (counted, not removed)"));
        }
        return sb.toString();
    }

    /** " (0.37 % of the median flux, 0.0040 mag)" for a flux-unit spread, when the median flux is positive. */
    private static String relative(double spreadFlux, double medianFlux) {
        if (!(medianFlux > 0) || !Double.isFinite(spreadFlux)) {
            return "";
        }
        return fmt(" (%.3g %% of the median flux, %.2g mag)", 100 * spreadFlux / medianFlux,
                Magnitudes.toMagnitudeError(medianFlux, spreadFlux));
    }

    private static String reasons(LightCurveSummary s) {
        if (s.rejectedRows().isEmpty()) {
            return "";
        }
        return ": " + s.rejectedRows().entrySet().stream().map(e -> e.getKey() + ": " + e.getValue())
                .collect(Collectors.joining(", "));
    }

    private static String row(String label, String value) {
        return String.format(Locale.ROOT, "%-12s %s%n", label, value);
    }

    private static String fmt(String format, Object... args) {
        return String.format(Locale.ROOT, format, args);
    }

    /** A duration in days, with minutes or hours added when that reads better. */
    static String days(double d) {
        if (!Double.isFinite(d)) {
            return "n/a";
        }
        if (d < 1.0 / 24) {
            return fmt("%.4g d = %.3g min", d, d * 1440);
        }
        if (d < 1) {
            return fmt("%.4g d = %.3g h", d, d * 24);
        }
        return fmt("%.4f d", d);
    }

    private String json(List<LightCurveSummary> summaries, List<Double> magnitudeErrors) {
        Map<String, Object> root = new LinkedHashMap<>();
        root.put("file", file.toString());
        List<Map<String, Object>> list = new ArrayList<>();
        for (LightCurveSummary s : summaries) {
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("source", s.source());
            m.put("band", s.band());
            m.put("timeScale", s.timeScale().label());
            m.put("valueKind", s.valueKind().name().toLowerCase(Locale.ROOT));
            m.put("points", s.points());
            m.put("rejected", s.rejectedCount());
            m.put("rejectedByReason", s.rejectedRows());
            m.put("start", finite(s.startDays()));
            m.put("end", finite(s.endDays()));
            m.put("spanDays", finite(s.spanDays()));
            m.put("medianCadenceDays", finite(s.medianCadenceDays()));
            m.put("gapThresholdDays", finite(s.gapThresholdDays()));
            m.put("gaps", s.gapCount());
            m.put("largestIntervalDays", finite(s.largestIntervalDays()));
            m.put("segmentGapDays", s.segmentGapDays());
            List<Map<String, Object>> segs = new ArrayList<>();
            for (LightCurveSummary.Segment g : s.segments()) {
                Map<String, Object> sm = new LinkedHashMap<>();
                sm.put("start", g.startDays());
                sm.put("end", g.endDays());
                sm.put("points", g.points());
                segs.add(sm);
            }
            m.put("segments", segs);
            m.put("hasErrors", s.hasErrors());
            m.put("medianError", finite(s.medianErrorFlux()));
            m.put("minFlux", finite(s.minFlux()));
            m.put("medianFlux", finite(s.medianFlux()));
            m.put("maxFlux", finite(s.maxFlux()));
            m.put("scatter", finite(s.scatterFlux()));
            m.put("outlierSigmas", LightCurveSummary.OUTLIER_SIGMAS);
            m.put("outliers", s.outlierCount());
            if (s.valueKind() == ValueKind.MAGNITUDE && s.minFlux() > 0) {
                Map<String, Object> mag = new LinkedHashMap<>();
                mag.put("brightest", finite(Magnitudes.fromRelativeFlux(s.maxFlux())));
                mag.put("median", finite(Magnitudes.fromRelativeFlux(s.medianFlux())));
                mag.put("faintest", finite(Magnitudes.fromRelativeFlux(s.minFlux())));
                mag.put("medianError", finite(magnitudeErrors.get(summaries.indexOf(s))));
                mag.put("scatter", finite(Magnitudes.toMagnitudeError(s.medianFlux(), s.scatterFlux())));
                m.put("magnitudes", mag);
            }
            list.add(m);
        }
        root.put("bands", list);
        try {
            return new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT).writeValueAsString(root)
                    + System.lineSeparator();
        } catch (JsonProcessingException e) {
            throw new IllegalStateException("cannot write the summary as JSON", e);
        }
    }

    /** JSON has no NaN: undefined values are written as null. */
    private static Double finite(double v) {
        return Double.isFinite(v) ? v : null;
    }
}
