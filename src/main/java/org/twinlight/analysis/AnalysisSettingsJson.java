package org.twinlight.analysis;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Iterator;
import java.util.List;
import java.util.Map;
import org.twinlight.BadInputException;
import org.twinlight.eclipse.LimbDarkening;
import org.twinlight.report.ModelFileJson;

/**
 * The settings file of {@code analyse} ({@code --settings FILE.json}, documented in
 * {@code docs/analyse.md}) and {@code settings-used.json}, which holds every setting of a run
 * made explicit so that it repeats the run.
 */
public final class AnalysisSettingsJson {
    private static final ObjectMapper JSON = new ObjectMapper();

    private AnalysisSettingsJson() {
    }

    /**
     * Reads a settings file over {@code base}: keys present replace the base's values. File names
     * under {@code files} and {@code model} resolve against the settings file's folder. The result is
     * not yet validated (options may still complete it): call {@link AnalysisSettings#validated}.
     *
     * @throws BadInputException naming the file and the key for anything unreadable or unknown
     */
    public static AnalysisSettings read(Path file, AnalysisSettings base) {
        JsonNode root;
        try {
            root = JSON.readTree(Files.readString(file));
        } catch (IOException e) {
            throw new BadInputException(file + ": cannot read the settings file as JSON: " + e.getMessage());
        }
        if (root == null || !root.isObject()) {
            throw new BadInputException(file + ": a settings file is one JSON object {\"key\": value, ...}");
        }
        Path folder = file.toAbsolutePath().getParent();
        Reader r = new Reader(file.toString(), folder);
        AnalysisSettings s = base;
        for (Iterator<Map.Entry<String, JsonNode>> it = root.fields(); it.hasNext();) {
            Map.Entry<String, JsonNode> e = it.next();
            s = r.apply(s, e.getKey(), e.getValue());
        }
        return s;
    }

    /** Every setting as JSON, explicit (nulls where the value is found from the data). */
    public static ObjectNode toJson(AnalysisSettings s) {
        ObjectNode o = JSON.createObjectNode();
        strings(o.putArray("files"), s.files());
        o.put("label", s.label());
        strings(o.putArray("bands"), s.bands());
        o.put("timeScale", s.timeScale());
        o.put("timeOffset", s.timeOffsetDays());
        o.put("timeColumn", s.timeColumn());
        o.put("valueColumn", s.valueColumn());
        o.put("errorColumn", s.errorColumn());
        o.put("bandColumn", s.bandColumn());
        o.put("qualityColumn", s.qualityColumn());
        o.put("values", s.values());
        o.put("hdu", s.hdu());
        o.put("period", s.periodDays());
        o.put("epoch", s.epochDays());
        o.put("minPeriod", s.minPeriodDays());
        o.put("maxPeriod", s.maxPeriodDays());
        o.put("model", s.model());
        strings(o.putArray("free"), s.free());
        o.put("baseline", s.baseline());
        o.put("segmentGap", s.segmentGapDays());
        if (Double.isNaN(s.clipSigma())) {
            o.put("clip", "none");
        } else {
            o.put("clip", s.clipSigma());
        }
        o.put("maxIterations", s.maxIterations());
        o.put("starts", s.starts());
        o.set("limbDarkening1", ModelFileJson.limbDarkeningJson(s.limbDarkening1()));
        o.set("limbDarkening2", ModelFileJson.limbDarkeningJson(s.limbDarkening2()));
        o.put("exposureTime", s.exposureTimeDays());
        o.put("supersample", s.supersample());
        o.put("seed", s.seed());
        AfterFitSettings a = s.afterFit();
        o.put("posterior", a.posterior());
        o.put("jitter", a.jitter());
        o.put("maxSteps", a.maxSteps());
        o.put("walkers", a.walkers());
        o.put("threads", a.threads());
        strings(o.putArray("velocities"), a.velocities());
        o.put("k1", a.k1Kms());
        o.put("k1Error", a.k1ErrorKms());
        o.put("k2", a.k2Kms());
        o.put("k2Error", a.k2ErrorKms());
        o.put("teff1", a.teff1K());
        o.put("teff1Error", a.teff1ErrorK());
        o.put("teff2", a.teff2K());
        o.put("teff2Error", a.teff2ErrorK());
        o.put("draws", a.draws());
        return o;
    }

    private static void strings(ArrayNode a, List<String> values) {
        values.forEach(a::add);
    }

    /** Applies one key of a settings file. */
    private record Reader(String where, Path folder) {

        AnalysisSettings apply(AnalysisSettings s, String key, JsonNode v) {
            return switch (key) {
                case "files" -> s.withFiles(paths(key, v));
                case "label" -> s.with(key, text(key, v));
                case "bands" -> s.with(key, textList(key, v));
                case "timeScale", "timeColumn", "valueColumn", "errorColumn", "bandColumn", "qualityColumn", "values",
                        "baseline" -> s.with(key, text(key, v));
                case "model" -> s.with(key, v.isNull() ? null : folder.resolve(text(key, v)).normalize().toString());
                case "timeOffset", "period", "epoch", "minPeriod", "maxPeriod", "exposureTime" ->
                        s.with(key, number(key, v));
                case "segmentGap" -> s.with(key, required(key, number(key, v)));
                case "clip" -> s.with(key, v.isTextual() && v.asText().trim().equalsIgnoreCase("none") ? Double.NaN
                        : required(key, number(key, v)));
                case "hdu", "supersample" -> s.with(key, integer(key, v));
                case "maxIterations", "starts" -> s.with(key, required(key, integer(key, v)));
                case "seed" -> s.with(key, (long) required(key, integer(key, v)));
                case "posterior", "jitter" -> s.with(key, bool(key, v));
                case "maxSteps", "walkers", "threads" -> s.with(key, integer(key, v));
                case "draws" -> s.with(key, required(key, integer(key, v)));
                case "velocities" -> s.with(key, paths(key, v));
                case "k1", "k2", "teff1", "teff2" -> s.with(key, number(key, v));
                case "k1Error", "k2Error", "teff1Error", "teff2Error" -> s.with(key, required(key, number(key, v)));
                case "free" -> s.with(key, textList(key, v));
                case "limbDarkening1", "limbDarkening2" ->
                        s.with(key, ModelFileJson.limbDarkening(v, Path.of(where), key));
                default -> throw AnalysisSettings.bad(where, key, "unknown key; the keys are those of docs/analyse.md ("
                        + "files, label, bands, timeScale, timeOffset, timeColumn, valueColumn, errorColumn, "
                        + "bandColumn, qualityColumn, values, hdu, period, epoch, minPeriod, maxPeriod, model, free, "
                        + "baseline, segmentGap, clip, maxIterations, starts, limbDarkening1, limbDarkening2, "
                        + "exposureTime, supersample, seed, " + String.join(", ", AfterFitSettings.KEYS) + ")");
            };
        }

        private List<String> paths(String key, JsonNode v) {
            List<String> out = new ArrayList<>();
            for (String f : textList(key, v)) {
                out.add(folder.resolve(f).normalize().toString());
            }
            return out;
        }

        private boolean bool(String key, JsonNode v) {
            if (!v.isBoolean()) {
                throw AnalysisSettings.bad(where, key, "expected true or false, got " + v);
            }
            return v.booleanValue();
        }

        private String text(String key, JsonNode v) {
            if (v.isNull()) {
                return null;
            }
            if (!v.isTextual()) {
                throw AnalysisSettings.bad(where, key, "expected a string, got " + v);
            }
            return v.asText();
        }

        private List<String> textList(String key, JsonNode v) {
            if (!v.isArray()) {
                throw AnalysisSettings.bad(where, key, "expected an array of strings, got " + v);
            }
            List<String> out = new ArrayList<>();
            for (JsonNode e : v) {
                if (!e.isTextual() || e.asText().isBlank()) {
                    throw AnalysisSettings.bad(where, key, "expected an array of non-empty strings, got " + e);
                }
                out.add(e.asText().trim());
            }
            return out;
        }

        private Double number(String key, JsonNode v) {
            if (v.isNull()) {
                return null;
            }
            if (!v.isNumber()) {
                throw AnalysisSettings.bad(where, key, "expected a number, got " + v);
            }
            return v.doubleValue();
        }

        private Integer integer(String key, JsonNode v) {
            if (v.isNull()) {
                return null;
            }
            if (!v.isIntegralNumber() || !v.canConvertToInt()) {
                throw AnalysisSettings.bad(where, key, "expected an integer, got " + v);
            }
            return v.intValue();
        }

        private <T> T required(String key, T v) {
            if (v == null) {
                throw AnalysisSettings.bad(where, key, "may not be null");
            }
            return v;
        }
    }
}
