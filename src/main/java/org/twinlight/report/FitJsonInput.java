package org.twinlight.report;

import com.fasterxml.jackson.databind.JsonNode;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.twinlight.BadInputException;
import org.twinlight.eclipse.ModelFile;
import org.twinlight.time.TimeScale;

/**
 * What the {@code dimensions} command takes from a {@code fit.json}: the values and
 * uncertainties of the light-curve parameters, their correlation matrix, the time scale and the
 * model.
 *
 * @param file the fit.json
 * @param timeScale time scale of the fit's times and epoch
 * @param model the fitted model
 * @param values value of each parameter (top-level ones, and per-band ones of the first band)
 * @param uncertainties 1σ of each (0 for fixed ones)
 * @param correlationNames names of the fitted parameters in the order of {@code correlation}
 * @param correlation their correlation matrix
 * @param posterior whether the file holds a posterior (from a sampler)
 * @param lightCurveName file name of the fitted light curve ({@code input.file}), or null when
 *     fit.json does not say
 * @param convergence the sampler's verdict and chain file, null when fit.json has no
 *     {@code convergence} block
 * @param firstBand the band whose per-band values are in {@code values}, null for a fit without bands
 */
public record FitJsonInput(Path file, TimeScale timeScale, ModelFile model, Map<String, Double> values,
        Map<String, Double> uncertainties, List<String> correlationNames, double[][] correlation, boolean posterior,
        String lightCurveName, Convergence convergence, String firstBand) {

    /**
     * The {@code convergence} block of a fit made with a posterior sampler.
     *
     * @param converged whether the sampler judged its chain converged
     * @param reason why (or why not), as the sampler said; empty when it did not
     * @param chainFile the chain's file resolved against fit.json's folder, null when none is named
     */
    public record Convergence(boolean converged, String reason, Path chainFile) {
    }

    /** The parameters a fit.json must hold for absolute dimensions. */
    public static final List<String> REQUIRED = List.of("period", "radius1", "radius2", "inclination");

    /**
     * Reads {@code file}.
     *
     * @throws BadInputException naming the file and the key that is missing or malformed
     */
    public static FitJsonInput read(Path file) {
        JsonNode root = ModelInput.readJson(file);
        JsonNode params = root.get("parameters");
        if (params == null || !params.isObject()) {
            throw BadInputException.at(file, "key 'parameters'", null, "missing; expected the fit.json written "
                    + "by the fit command (is this a model file, or a fit.json from another tool version?)");
        }
        Map<String, Double> values = new LinkedHashMap<>();
        Map<String, Double> sigmas = new LinkedHashMap<>();
        collect(file, params, "parameters.", values, sigmas);
        JsonNode bands = params.get("bands");
        String firstBand = null;
        if (bands != null && bands.isObject() && bands.fields().hasNext()) {
            Map.Entry<String, JsonNode> first = bands.fields().next();
            firstBand = first.getKey();
            Map<String, Double> bv = new LinkedHashMap<>();
            Map<String, Double> bs = new LinkedHashMap<>();
            collect(file, first.getValue(), "parameters.bands." + first.getKey() + ".", bv, bs);
            bv.forEach(values::putIfAbsent);
            bs.forEach(sigmas::putIfAbsent);
        }
        for (String key : REQUIRED) {
            if (!values.containsKey(key)) {
                throw BadInputException.at(file, "key 'parameters." + key + "'", null, "missing; absolute dimensions "
                        + "need " + String.join(", ", REQUIRED) + " with value and uncertainty (a fit.json from "
                        + "another tool version?)");
            }
        }
        List<String> names = new ArrayList<>();
        double[][] corr = new double[0][0];
        JsonNode c = root.get("correlation");
        if (c != null && c.has("names") && c.has("matrix")) {
            c.get("names").forEach(n -> names.add(n.asText()));
            JsonNode m = c.get("matrix");
            corr = new double[names.size()][names.size()];
            if (m.size() != names.size()) {
                throw BadInputException.at(file, "key 'correlation.matrix'", null, "has " + m.size() + " rows for "
                        + names.size() + " names; expected a square matrix");
            }
            for (int i = 0; i < names.size(); i++) {
                if (m.get(i).size() != names.size()) {
                    throw BadInputException.at(file, "key 'correlation.matrix'", null, "row " + (i + 1) + " has "
                            + m.get(i).size() + " entries for " + names.size() + " names");
                }
                for (int j = 0; j < names.size(); j++) {
                    corr[i][j] = m.get(i).get(j).asDouble();
                }
            }
        }
        JsonNode model = root.get("model");
        if (model == null) {
            throw BadInputException.at(file, "key 'model'", null, "missing; expected the fitted model as the fit "
                    + "command writes it");
        }
        return new FitJsonInput(file, ModelInput.timeScale(root, file), ModelFileJson.parse(model, file), values, sigmas,
                names, corr, root.has("posterior"), lightCurveName(root), convergence(root, file), firstBand);
    }

    private static Convergence convergence(JsonNode root, Path file) {
        JsonNode c = root.get("convergence");
        if (c == null || c.isNull()) {
            return null;
        }
        JsonNode converged = c.get("converged");
        if (!c.isObject() || converged == null || !converged.isBoolean()) {
            throw BadInputException.at(file, "key 'convergence.converged'", null, "missing or not true/false; "
                    + "expected the convergence block the fit command writes with --posterior");
        }
        JsonNode chain = c.get("chainFile");
        Path chainFile = null;
        if (chain != null && !chain.isNull()) {
            if (!chain.isTextual() || chain.asText().isBlank()) {
                throw BadInputException.at(file, "key 'convergence.chainFile'", null, "expected a file name, got "
                        + chain);
            }
            Path folder = file.getParent();
            chainFile = folder == null ? Path.of(chain.asText()) : folder.resolve(chain.asText());
        }
        JsonNode reason = c.get("reason");
        return new Convergence(converged.asBoolean(), reason == null || reason.isNull() ? "" : reason.asText(),
                chainFile);
    }

    private static String lightCurveName(JsonNode root) {
        JsonNode f = root.path("input").path("file");
        if (!f.isTextual() || f.asText().isBlank()) {
            return null;
        }
        String name = f.asText().replace('\\', '/');
        return name.substring(name.lastIndexOf('/') + 1);
    }

    private static void collect(Path file, JsonNode params, String prefix, Map<String, Double> values,
            Map<String, Double> sigmas) {
        params.fields().forEachRemaining(e -> {
            if (e.getKey().equals("bands") || !e.getValue().isObject()) {
                return;
            }
            JsonNode v = e.getValue().get("value");
            if (v == null || !v.isNumber()) {
                throw BadInputException.at(file, "key '" + prefix + e.getKey() + ".value'", null,
                        "missing or not a number");
            }
            JsonNode s = e.getValue().get("uncertainty");
            boolean free = !e.getValue().has("free") || e.getValue().get("free").asBoolean();
            double sigma = s == null || s.isNull() || !free ? 0.0 : s.asDouble();
            if (!(sigma >= 0) || !Double.isFinite(sigma)) {
                throw BadInputException.at(file, "key '" + prefix + e.getKey() + ".uncertainty'", null,
                        "expected a finite number >= 0, got " + s);
            }
            values.put(e.getKey(), v.asDouble());
            sigmas.put(e.getKey(), sigma);
        });
    }

    /** Covariance of two parameters: σₐσ_b ρ_ab, ρ from the matrix (0 when either is not in it). */
    public double covariance(String a, String b) {
        double sa = uncertainties.getOrDefault(a, 0.0);
        double sb = uncertainties.getOrDefault(b, 0.0);
        if (a.equals(b)) {
            return sa * sa;
        }
        int i = correlationNames.indexOf(a);
        int j = correlationNames.indexOf(b);
        return i < 0 || j < 0 ? 0.0 : sa * sb * correlation[i][j];
    }
}
