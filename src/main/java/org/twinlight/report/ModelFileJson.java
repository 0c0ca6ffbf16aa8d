package org.twinlight.report;

import com.fasterxml.jackson.core.JsonParser;
import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.Iterator;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Set;
import org.twinlight.BadInputException;
import org.twinlight.eclipse.BandValues;
import org.twinlight.eclipse.BinaryParameters;
import org.twinlight.eclipse.LimbDarkening;
import org.twinlight.eclipse.LimbDarkeningLaw;
import org.twinlight.eclipse.ModelFile;
import org.twinlight.fit.Prior;
import org.twinlight.fit.Priors;

/**
 * Reads and writes the JSON model file of the interface contract: the common parameters and
 * optional per-band values under {@code "bands"}. Missing optional keys take the defaults e = 0,
 * ω = 90°, ℓ₃ = 0, uniform discs, no exposure smearing; unknown keys, duplicate keys and text
 * after the model's closing brace are errors naming the key or line. The common
 * {@code surfaceBrightnessRatio} may be left out when every band gives its own.
 */
public final class ModelFileJson {

    /** Duplicate keys are an error, not a silent "last one wins". */
    private static final ObjectMapper JSON = new ObjectMapper(com.fasterxml.jackson.core.JsonFactory.builder()
            .enable(com.fasterxml.jackson.core.StreamReadFeature.STRICT_DUPLICATE_DETECTION).build());
    private static final Set<String> TOP_KEYS = Set.of("period", "epoch", "radius1", "radius2", "inclination",
            "eccentricity", "omega", "surfaceBrightnessRatio", "thirdLight", "limbDarkening1", "limbDarkening2",
            "exposureTime", "supersample", "bands", "priors");
    private static final Set<String> BAND_KEYS = Set.of("surfaceBrightnessRatio", "thirdLight", "limbDarkening1",
            "limbDarkening2");

    /** Reads and checks a model file. */
    public static ModelFile read(Path file) {
        return parse(readTree(file), file);
    }

    /**
     * The priors of a model file ({@code "priors": {NAME: {"uniform": [lo, hi]} | {"normal": [mean,
     * sigma]}}}), none when the key is absent. Their shape is checked here; whether each name is a
     * free parameter of the fit is checked when the fit is built.
     */
    public static Priors readPriors(Path file) {
        return priors(readTree(file), file);
    }

    /** The priors of a parsed model; {@code file} is only used in messages and may be null. */
    public static Priors priors(JsonNode root, Path file) {
        JsonNode node = root == null ? null : root.get("priors");
        String source = file == null ? "" : file.toString();
        if (node == null || node.isNull()) {
            return new Priors(Map.of(), source);
        }
        if (!node.isObject()) {
            throw BadInputException.at(file, "key 'priors'", null,
                    "expected an object {NAME: {\"uniform\": [lo, hi]} | {\"normal\": [mean, sigma]}, ...}");
        }
        Map<String, Prior> out = new LinkedHashMap<>();
        for (Iterator<Map.Entry<String, JsonNode>> it = node.fields(); it.hasNext();) {
            Map.Entry<String, JsonNode> e = it.next();
            out.put(e.getKey(), prior(e.getValue(), file, "priors." + e.getKey()));
        }
        return new Priors(out, source);
    }

    private static Prior prior(JsonNode node, Path file, String key) {
        String where = "key '" + key + "'";
        String expected = "expected {\"uniform\": [lo, hi]} or {\"normal\": [mean, sigma]}";
        if (!node.isObject() || node.size() != 1) {
            throw BadInputException.at(file, where, null, expected + ", got " + node);
        }
        String kind = node.fieldNames().next();
        JsonNode pair = node.get(kind);
        if (!kind.equals("uniform") && !kind.equals("normal")) {
            throw BadInputException.at(file, where, null, "unknown kind of prior '" + kind + "'; " + expected);
        }
        if (!pair.isArray() || pair.size() != 2 || !pair.get(0).isNumber() || !pair.get(1).isNumber()) {
            throw BadInputException.at(file, where + "." + kind, null, "expected two numbers "
                    + (kind.equals("uniform") ? "[lo, hi]" : "[mean, sigma]") + ", got " + pair);
        }
        double a = pair.get(0).doubleValue();
        double b = pair.get(1).doubleValue();
        try {
            return kind.equals("uniform") ? new Prior.Uniform(a, b) : new Prior.Normal(a, b);
        } catch (IllegalArgumentException e) {
            throw BadInputException.at(file, where + "." + kind, null, e.getMessage());
        }
    }

    /** The JSON object of a model file, read strictly (duplicate keys and trailing text are errors). */
    private static JsonNode readTree(Path file) {
        String text;
        try {
            text = Files.readString(file);
        } catch (NoSuchFileException e) {
            throw BadInputException.at(file, null, null, "model file not found");
        } catch (IOException e) {
            throw BadInputException.at(file, null, null, "cannot read the model file (" + e.getMessage() + ")");
        }
        JsonNode root;
        try (JsonParser parser = JSON.createParser(text)) {
            root = JSON.readTree(parser);
            if (parser.nextToken() != null) {
                throw BadInputException.at(file, "line " + parser.currentTokenLocation().getLineNr(), null,
                        "text after the end of the model's JSON object; a model file holds one object only");
            }
        } catch (JsonProcessingException e) {
            long line = e.getLocation() == null ? -1 : e.getLocation().getLineNr();
            throw BadInputException.at(file, line > 0 ? "line " + line : null, null,
                    "not valid JSON (" + e.getOriginalMessage() + ")");
        } catch (IOException e) {
            throw BadInputException.at(file, null, null, "cannot read the model file (" + e.getMessage() + ")");
        }
        return root;
    }

    /** Checks a parsed model; {@code file} is only used in messages and may be null. */
    public static ModelFile parse(JsonNode root, Path file) {
        if (root == null || !root.isObject()) {
            throw BadInputException.at(file, null, null, "a model file must be a JSON object of parameters");
        }
        checkKeys(root, TOP_KEYS, file, "");
        LimbDarkening ld1 = root.has("limbDarkening1") ? limbDarkening(root.get("limbDarkening1"), file,
                "limbDarkening1") : LimbDarkening.uniform();
        LimbDarkening ld2 = root.has("limbDarkening2") ? limbDarkening(root.get("limbDarkening2"), file,
                "limbDarkening2") : LimbDarkening.uniform();
        boolean commonJ = root.has("surfaceBrightnessRatio") && !root.get("surfaceBrightnessRatio").isNull();
        Double firstBandJ = commonJ ? null : firstBandBrightness(root.get("bands"), file);
        BinaryParameters common;
        try {
            common = new BinaryParameters(
                    number(root, "period", null, file), number(root, "epoch", null, file),
                    number(root, "radius1", null, file), number(root, "radius2", null, file),
                    number(root, "inclination", null, file), number(root, "eccentricity", 0.0, file),
                    number(root, "omega", 90.0, file), number(root, "surfaceBrightnessRatio", firstBandJ, file),
                    number(root, "thirdLight", 0.0, file), ld1, ld2,
                    number(root, "exposureTime", 0.0, file), (int) integer(root, "supersample", 1, file));
        } catch (IllegalArgumentException e) {
            throw BadInputException.at(file, null, null, e.getMessage());
        }
        Map<String, BandValues> bands = new LinkedHashMap<>();
        if (root.has("bands")) {
            JsonNode b = root.get("bands");
            if (!b.isObject()) {
                throw BadInputException.at(file, "key 'bands'", null, "expected an object {BAND: {...}, ...}");
            }
            for (Iterator<Map.Entry<String, JsonNode>> it = b.fields(); it.hasNext();) {
                Map.Entry<String, JsonNode> e = it.next();
                bands.put(e.getKey(), band(e.getValue(), file, e.getKey(), common));
            }
        }
        return new ModelFile(common, bands, commonJ);
    }

    /**
     * Without a common surface-brightness ratio, every band must give its own: the first one's
     * value then stands in the common parameters; null when there are no bands (the key is then
     * reported missing).
     */
    private static Double firstBandBrightness(JsonNode bands, Path file) {
        if (bands == null || !bands.isObject() || bands.isEmpty()) {
            return null;
        }
        Double first = null;
        for (Iterator<Map.Entry<String, JsonNode>> it = bands.fields(); it.hasNext();) {
            Map.Entry<String, JsonNode> e = it.next();
            JsonNode j = e.getValue().get("surfaceBrightnessRatio");
            if (j == null || !j.isNumber()) {
                throw BadInputException.at(file, "key 'surfaceBrightnessRatio'", null, "missing; it is required "
                        + "unless every band gives its own, and band '" + e.getKey() + "' does not");
            }
            if (first == null) {
                first = j.doubleValue();
            }
        }
        return first;
    }

    private static BandValues band(JsonNode node, Path file, String band, BinaryParameters common) {
        String where = "bands." + band + ".";
        if (!node.isObject()) {
            throw BadInputException.at(file, "key 'bands." + band + "'", null, "expected an object of band values");
        }
        checkKeys(node, BAND_KEYS, file, where);
        Double j = node.has("surfaceBrightnessRatio") ? number(node, "surfaceBrightnessRatio", null, file, where) : null;
        Double l3 = node.has("thirdLight") ? number(node, "thirdLight", null, file, where) : null;
        LimbDarkening ld1 = node.has("limbDarkening1")
                ? limbDarkening(node.get("limbDarkening1"), file, where + "limbDarkening1") : null;
        LimbDarkening ld2 = node.has("limbDarkening2")
                ? limbDarkening(node.get("limbDarkening2"), file, where + "limbDarkening2") : null;
        BandValues v = new BandValues(j, l3, ld1, ld2);
        try {
            v.applyTo(common);
        } catch (IllegalArgumentException e) {
            throw BadInputException.at(file, "band '" + band + "'", null, e.getMessage());
        }
        return v;
    }

    private static void checkKeys(JsonNode node, Set<String> allowed, Path file, String prefix) {
        for (Iterator<String> it = node.fieldNames(); it.hasNext();) {
            String k = it.next();
            if (!allowed.contains(k)) {
                throw BadInputException.at(file, "key '" + prefix + k + "'", null,
                        "unknown key; allowed keys are " + String.join(", ", allowed.stream().sorted().toList()));
            }
        }
    }

    private static double number(JsonNode node, String key, Double dflt, Path file) {
        return number(node, key, dflt, file, "");
    }

    private static double number(JsonNode node, String key, Double dflt, Path file, String prefix) {
        JsonNode v = node.get(key);
        if (v == null || v.isNull()) {
            if (dflt == null) {
                throw BadInputException.at(file, "key '" + prefix + key + "'", null, "missing; it is required");
            }
            return dflt;
        }
        if (!v.isNumber()) {
            throw BadInputException.at(file, "key '" + prefix + key + "'", null, "expected a number, got " + v);
        }
        return v.doubleValue();
    }

    private static long integer(JsonNode node, String key, long dflt, Path file) {
        JsonNode v = node.get(key);
        if (v == null || v.isNull()) {
            return dflt;
        }
        if (!v.canConvertToInt() || !v.isIntegralNumber()) {
            throw BadInputException.at(file, "key '" + key + "'", null, "expected an integer, got " + v);
        }
        return v.intValue();
    }

    private static LimbDarkening limbDarkening(JsonNode node, Path file, String key) {
        String where = "key '" + key + "'";
        if (!node.isObject() || !node.has("law")) {
            throw BadInputException.at(file, where, null,
                    "expected {\"law\": NAME, \"coefficients\": [...]} with NAME one of "
                            + LimbDarkeningLaw.acceptedNames());
        }
        for (Iterator<String> it = node.fieldNames(); it.hasNext();) {
            String k = it.next();
            if (!k.equals("law") && !k.equals("coefficients")) {
                throw BadInputException.at(file, "key '" + key + "." + k + "'", null,
                        "unknown key; a limb-darkening entry has 'law' and 'coefficients'");
            }
        }
        String name = node.get("law").asText();
        LimbDarkeningLaw law = LimbDarkeningLaw.byFileName(name).orElseThrow(() -> BadInputException.at(file,
                where, null, "unknown limb-darkening law '" + name + "'; expected one of "
                        + LimbDarkeningLaw.acceptedNames()));
        JsonNode c = node.get("coefficients");
        double[] coeffs = new double[c == null ? 0 : c.size()];
        if (c != null && !c.isArray()) {
            throw BadInputException.at(file, where, null, "'coefficients' must be an array of numbers");
        }
        for (int i = 0; i < coeffs.length; i++) {
            if (!c.get(i).isNumber()) {
                throw BadInputException.at(file, where, null, "coefficient " + (i + 1) + " is not a number");
            }
            coeffs[i] = c.get(i).doubleValue();
        }
        LimbDarkening ld;
        try {
            ld = LimbDarkening.of(law, coeffs);
        } catch (IllegalArgumentException e) {
            throw BadInputException.at(file, where, null, e.getMessage());
        }
        if (!ld.isNonNegative()) {
            double mu = ld.lowestIntensityMu();
            throw BadInputException.at(file, where, null, String.format(java.util.Locale.ROOT,
                    "these coefficients give a negative intensity I(μ=%.2f) = %.3f; a stellar disc cannot emit "
                            + "negative light", mu, ld.intensity(mu)));
        }
        return ld;
    }

    /** A model as a JSON object in the model-file layout. */
    public static ObjectNode toJson(ModelFile model) {
        ObjectNode o = JSON.createObjectNode();
        BinaryParameters p = model.common();
        Map<String, BandValues> bands = model.bands();
        o.put("period", p.periodDays());
        o.put("epoch", p.epochDays());
        o.put("radius1", p.radius1());
        o.put("radius2", p.radius2());
        o.put("inclination", p.inclinationDeg());
        o.put("eccentricity", p.eccentricity());
        o.put("omega", p.omegaDeg());
        if (model.commonComplete()) {
            o.put("surfaceBrightnessRatio", p.surfaceBrightnessRatio());
        }
        o.put("thirdLight", p.thirdLight());
        o.set("limbDarkening1", limbDarkeningJson(p.limbDarkening1()));
        o.set("limbDarkening2", limbDarkeningJson(p.limbDarkening2()));
        if (p.exposureTimeDays() > 0) {
            o.put("exposureTime", p.exposureTimeDays());
            o.put("supersample", p.supersample());
        }
        if (!bands.isEmpty()) {
            ObjectNode b = o.putObject("bands");
            bands.forEach((name, v) -> {
                ObjectNode bo = b.putObject(name);
                if (v.surfaceBrightnessRatio() != null) {
                    bo.put("surfaceBrightnessRatio", v.surfaceBrightnessRatio());
                }
                if (v.thirdLight() != null) {
                    bo.put("thirdLight", v.thirdLight());
                }
                if (v.limbDarkening1() != null) {
                    bo.set("limbDarkening1", limbDarkeningJson(v.limbDarkening1()));
                }
                if (v.limbDarkening2() != null) {
                    bo.set("limbDarkening2", limbDarkeningJson(v.limbDarkening2()));
                }
            });
        }
        return o;
    }

    /** {@code {"law": .., "coefficients": [..]}}. */
    public static ObjectNode limbDarkeningJson(LimbDarkening ld) {
        ObjectNode o = JSON.createObjectNode();
        o.put("law", ld.law().fileName());
        ArrayNode a = o.putArray("coefficients");
        for (double c : ld.coefficients()) {
            a.add(c);
        }
        return o;
    }

    private ModelFileJson() {
    }
}
