package org.twinlight.report;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.io.Reader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.twinlight.BadInputException;
import org.twinlight.eclipse.BinaryParameters;
import org.twinlight.eclipse.ModelFile;
import org.twinlight.planning.EclipseExtent;
import org.twinlight.planning.PlanningTarget;
import org.twinlight.planning.PredictionEphemeris;
import org.twinlight.sky.Site;
import org.twinlight.time.SkyDirection;
import org.twinlight.time.TimeScale;
import org.twinlight.timing.Ephemeris;

/**
 * Reads what {@code predict} plans from: an {@code ephemeris.json} (from {@code minima}), a
 * {@code fit.json} (from {@code fit}), a target list (CSV) and a site file.
 */
public final class PlanningInputs {

    private static final ObjectMapper JSON = new ObjectMapper();

    /**
     * An ephemeris read from a file, with what the reader had to assume.
     *
     * @param ephemeris the ephemeris
     * @param notes assumptions and cautions, for the user
     */
    public record ReadEphemeris(PredictionEphemeris ephemeris, List<String> notes) {
    }

    private PlanningInputs() {
    }

    /**
     * Reads {@code ephemeris.json}: {@code epoch} and {@code period} as {@code {"value",
     * "uncertainty"}}, {@code timeScale}, and when present {@code secondaryPhaseMeasured} and the
     * epoch–period covariance ({@code "epochPeriodCovariance"} in d², or a {@code "correlation"}
     * block {@code {"names", "matrix"}} as in {@code fit.json}). Without a covariance the errors
     * are taken as uncorrelated and a note says so.
     */
    public static ReadEphemeris readEphemerisJson(Path file) {
        JsonNode root = readJson(file);
        List<String> notes = new ArrayList<>();
        double phase = 0.5;
        if (root.path("secondaryPhaseMeasured").path("value").isNumber()) {
            phase = root.get("secondaryPhaseMeasured").get("value").asDouble();
        }
        PredictionEphemeris eph = ephemeris(root, root, file, phase, notes);
        String preferred = root.path("bic").path("preferred").asText("");
        if (!preferred.isEmpty() && !preferred.equals("linear")) {
            notes.add(file + ": the O−C analysis prefers the " + preferred + " ephemeris; predictions use the linear"
                    + " one, which drifts from it with time: check recent O−C before relying on far-off minima");
        }
        return new ReadEphemeris(eph, notes);
    }

    /**
     * Reads the ephemeris of a {@code fit.json}: {@code parameters.epoch}, {@code parameters.period}
     * with uncertainties, the epoch–period correlation from {@code correlation}, the
     * {@code timeScale}, and the secondary phase of the fitted orbit.
     */
    public static ReadEphemeris readFitEphemeris(Path file) {
        JsonNode root = readJson(file);
        List<String> notes = new ArrayList<>();
        JsonNode params = root.path("parameters");
        if (!params.isObject()) {
            throw BadInputException.at(file, "key 'parameters'", null, "missing: is this a fit.json written by fit?");
        }
        double phase = readFitModel(file).orbit().secondaryPhase();
        return new ReadEphemeris(ephemeris(params, root, file, phase, notes), notes);
    }

    /** The fitted model of a {@code fit.json} (its {@code model} block, a model file). */
    public static BinaryParameters readFitModel(Path file) {
        JsonNode model = readJson(file).path("model");
        if (!model.isObject()) {
            throw BadInputException.at(file, "key 'model'", null, "missing: is this a fit.json written by fit?");
        }
        return ModelFileJson.parse(model, file).common();
    }

    /**
     * Reads a site file: either one line {@code LAT,LON[,HEIGHT_M]} or lines {@code latitude: ..},
     * {@code longitude: ..}, {@code height: ..} ({@code =} also accepted); {@code #} starts a comment.
     */
    public static Site readSiteFile(Path file) {
        List<String> lines;
        try {
            lines = Files.readAllLines(file, StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw BadInputException.at(file, null, null, "cannot read the site file (" + e.getMessage() + ")");
        }
        Map<String, String> keys = new HashMap<>();
        for (int i = 0; i < lines.size(); i++) {
            String line = lines.get(i).replaceAll("#.*", "").trim();
            if (line.isEmpty()) {
                continue;
            }
            String[] kv = line.split("\\s*[:=]\\s*", 2);
            if (kv.length == 2 && kv[0].matches("[A-Za-z_]+")) {
                keys.put(kv[0].toLowerCase(Locale.ROOT), kv[1]);
            } else if (keys.isEmpty()) {
                return Site.parse(line, file + ": line " + (i + 1));
            }
        }
        String lat = keys.get("latitude");
        String lon = keys.get("longitude");
        if (lat == null || lon == null) {
            throw BadInputException.at(file, null, null, "a site file needs 'latitude: DEG' and 'longitude: DEG'"
                    + " (east positive; optional 'height: M'), or one line LAT,LON[,HEIGHT_M]");
        }
        return Site.parse(lat + "," + lon + "," + keys.getOrDefault("height", "0"), file.toString());
    }

    /**
     * Reads a target list (CSV with a header): {@code name}, {@code ra}, {@code dec} (J2000, degrees
     * or sexagesimal), then either {@code ephemeris} (an ephemeris.json or fit.json, relative to the
     * list's folder) or {@code period}, {@code epoch} and {@code time_scale} (with optional
     * {@code period_error}, {@code epoch_error}); optional {@code duration_hours} (else
     * {@code defaultExtent}) or {@code fit} (a fit.json whose model gives the contacts).
     *
     * @param notes collects what the reader had to assume
     */
    public static List<PlanningTarget> readTargetList(Path file, EclipseExtent defaultExtent, List<String> notes) {
        List<PlanningTarget> out = new ArrayList<>();
        CSVFormat format = CSVFormat.DEFAULT.builder().setHeader().setSkipHeaderRecord(true).setCommentMarker('#')
                .setIgnoreSurroundingSpaces(true).setIgnoreEmptyLines(true).get();
        try (Reader r = Files.newBufferedReader(file, StandardCharsets.UTF_8); CSVParser csv = CSVParser.parse(r, format)) {
            Map<String, Integer> header = new HashMap<>();
            csv.getHeaderMap().forEach((k, v) -> header.put(k.trim().toLowerCase(Locale.ROOT), v));
            for (String need : List.of("name", "ra", "dec")) {
                if (!header.containsKey(need)) {
                    throw BadInputException.at(file, "header", need, "missing; a target list needs the columns name,"
                            + " ra, dec and either ephemeris or period, epoch, time_scale");
                }
            }
            for (CSVRecord rec : csv) {
                out.add(target(file, rec, header, defaultExtent, notes));
            }
        } catch (NoSuchFileException e) {
            throw BadInputException.at(file, null, null, "target list not found");
        } catch (IOException | java.io.UncheckedIOException e) {
            throw BadInputException.at(file, null, null, "cannot read the target list (" + e.getMessage() + ")");
        }
        if (out.isEmpty()) {
            throw BadInputException.at(file, null, null, "the target list has no targets");
        }
        return out;
    }

    private static PlanningTarget target(Path file, CSVRecord rec, Map<String, Integer> header,
            EclipseExtent defaultExtent, List<String> notes) {
        String where = "line " + rec.getParser().getCurrentLineNumber();
        String name = cell(rec, header, "name");
        if (name.isEmpty()) {
            throw BadInputException.at(file, where, "name", "empty; every target needs a name");
        }
        SkyDirection direction;
        try {
            direction = new SkyDirection(SkyDirection.parseRaDeg(cell(rec, header, "ra")),
                    SkyDirection.parseDecDeg(cell(rec, header, "dec")));
        } catch (IllegalArgumentException e) {
            throw BadInputException.at(file, where, "ra/dec", e.getMessage());
        }
        Path base = file.toAbsolutePath().getParent();
        PredictionEphemeris eph;
        String ephFile = cell(rec, header, "ephemeris");
        if (!ephFile.isEmpty()) {
            Path p = base.resolve(ephFile);
            ReadEphemeris read = isFitJson(p) ? readFitEphemeris(p) : readEphemerisJson(p);
            read.notes().forEach(n -> notes.add(name + ": " + n));
            eph = read.ephemeris();
        } else {
            double period = number(file, where, rec, header, "period", Double.NaN);
            double epoch = number(file, where, rec, header, "epoch", Double.NaN);
            String label = cell(rec, header, "time_scale");
            TimeScale scale = TimeScale.parse(label).orElseThrow(() -> BadInputException.at(file, where, "time_scale",
                    "'" + label + "' is not a time scale; expected one of " + TimeScale.acceptedLabels()));
            try {
                eph = new PredictionEphemeris(new Ephemeris(epoch, period),
                        number(file, where, rec, header, "epoch_error", 0), number(file, where, rec, header,
                                "period_error", 0), 0, scale, 0.5);
            } catch (BadInputException e) {
                throw BadInputException.at(file, where, null, e.getMessage());
            }
        }
        EclipseExtent extent = defaultExtent;
        String fit = cell(rec, header, "fit");
        double hours = number(file, where, rec, header, "duration_hours", Double.NaN);
        if (!fit.isEmpty()) {
            extent = EclipseExtent.ofModel(readFitModel(base.resolve(fit)));
        } else if (!Double.isNaN(hours)) {
            extent = EclipseExtent.ofDuration(hours / 24, "duration_hours " + hours);
        } else if (extent == null) {
            throw BadInputException.at(file, where, "duration_hours", "no eclipse length for target '" + name
                    + "': give a duration_hours or fit column, or --duration for every target");
        }
        if (!fit.isEmpty() && !ephFile.isEmpty() && isFitJson(base.resolve(ephFile))) {
            eph = eph.withSecondaryPhase(readFitModel(base.resolve(fit)).orbit().secondaryPhase());
        }
        return new PlanningTarget(name, direction, eph, extent);
    }

    /** True when the file looks like a fit.json (has a "model" block). */
    public static boolean isFitJson(Path file) {
        return readJson(file).has("model");
    }

    private static String cell(CSVRecord rec, Map<String, Integer> header, String column) {
        Integer i = header.get(column);
        return i == null || i >= rec.size() ? "" : rec.get(i).trim();
    }

    private static double number(Path file, String where, CSVRecord rec, Map<String, Integer> header, String column,
            double missing) {
        String text = cell(rec, header, column);
        if (text.isEmpty()) {
            if (Double.isNaN(missing) && !column.equals("duration_hours")) {
                throw BadInputException.at(file, where, column, "empty; give a number or an ephemeris file");
            }
            return missing;
        }
        try {
            return Double.parseDouble(text);
        } catch (NumberFormatException e) {
            throw BadInputException.at(file, where, column, "'" + text + "' is not a number");
        }
    }

    /**
     * The ephemeris from {@code epoch} and {@code period} entries in {@code holder}, with the time
     * scale and covariance from {@code root}.
     */
    private static PredictionEphemeris ephemeris(JsonNode holder, JsonNode root, Path file, double phase,
            List<String> notes) {
        double epoch = value(holder, file, "epoch");
        double period = value(holder, file, "period");
        double sEpoch = uncertainty(holder, file, "epoch", notes);
        double sPeriod = uncertainty(holder, file, "period", notes);
        TimeScale scale = timeScale(root, file);
        double cov = covariance(root, file, "epoch", "period", sEpoch, sPeriod, notes);
        try {
            return new PredictionEphemeris(new Ephemeris(epoch, period), sEpoch, sPeriod, cov, scale, phase);
        } catch (BadInputException e) {
            throw BadInputException.at(file, null, null, e.getMessage());
        }
    }

    private static JsonNode readJson(Path file) {
        try {
            return JSON.readTree(Files.readString(file));
        } catch (NoSuchFileException e) {
            throw BadInputException.at(file, null, null, "file not found");
        } catch (JsonProcessingException e) {
            long line = e.getLocation() == null ? -1 : e.getLocation().getLineNr();
            throw BadInputException.at(file, line > 0 ? "line " + line : null, null,
                    "not valid JSON (" + e.getOriginalMessage() + ")");
        } catch (IOException e) {
            throw BadInputException.at(file, null, null, "cannot read (" + e.getMessage() + ")");
        }
    }

    private static double value(JsonNode holder, Path file, String key) {
        JsonNode v = holder.path(key).path("value");
        if (!v.isNumber()) {
            throw BadInputException.at(file, "key '" + key + ".value'", null, "missing or not a number");
        }
        return v.asDouble();
    }

    private static double uncertainty(JsonNode holder, Path file, String key, List<String> notes) {
        if (holder.path(key).path("free").isBoolean() && !holder.path(key).path("free").asBoolean()) {
            notes.add(file + ": '" + key + "' was held fixed in the fit, so its uncertainty is unknown and taken as 0:"
                    + " the predicted times' errors are underestimated; prefer an ephemeris.json from minima");
            return 0;
        }
        JsonNode v = holder.path(key).path("uncertainty");
        if (!v.isNumber() || !(v.asDouble() >= 0)) {
            notes.add(file + ": no uncertainty for '" + key + "'; taken as 0, so the predicted times' errors are"
                    + " underestimated");
            return 0;
        }
        return v.asDouble();
    }

    private static TimeScale timeScale(JsonNode root, Path file) {
        String label = root.path("timeScale").asText("");
        TimeScale scale = TimeScale.parse(label).orElse(TimeScale.UNKNOWN);
        if (!scale.isKnown()) {
            throw BadInputException.at(file, "key 'timeScale'", null, (label.isEmpty() ? "missing" : "'" + label + "'")
                    + ": an ephemeris without a time scale cannot be turned into UTC at the site; re-run with the"
                    + " photometry's --time-scale declared, or give --period, --epoch and --time-scale");
        }
        return scale;
    }

    private static double covariance(JsonNode root, Path file, String a, String b, double sa, double sb,
            List<String> notes) {
        if (root.path("epochPeriodCovariance").isNumber()) {
            return root.get("epochPeriodCovariance").asDouble();
        }
        JsonNode corr = root.path("correlation");
        JsonNode names = corr.path("names");
        if (names.isArray()) {
            int ia = -1;
            int ib = -1;
            for (int i = 0; i < names.size(); i++) {
                ia = names.get(i).asText().equals(a) ? i : ia;
                ib = names.get(i).asText().equals(b) ? i : ib;
            }
            if (ia >= 0 && ib >= 0) {
                return corr.path("matrix").path(ia).path(ib).asDouble(0) * sa * sb;
            }
        }
        if (sa > 0 && sb > 0) {
            notes.add(file + ": no epoch–period covariance; the errors are taken as uncorrelated, so the predicted"
                    + " errors may be too large or too small (exact only near the epoch)");
        }
        return 0;
    }
}
