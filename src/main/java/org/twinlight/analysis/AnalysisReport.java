package org.twinlight.analysis;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import java.util.Base64;
import java.util.Iterator;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.twinlight.fit.Estimate;
import org.twinlight.report.EphemerisJson;
import org.twinlight.report.FitFiles;

/**
 * {@code report.html}: one self-contained page (styles inline, plots embedded as data URIs,
 * nothing fetched from the network) rendered from {@code results.json}, so that the page and the
 * file never disagree. Every text that comes from an input (file names, labels, notes) is
 * HTML-escaped. A print stylesheet keeps tables and plots whole on paper.
 */
final class AnalysisReport {
    private static final ObjectMapper JSON = new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT);
    /** The colours of the page: Okabe &amp; Ito (2008), "Color Universal Design", colour-blind safe. */
    private static final String STYLE = """
            :root { --ink: #1b1b1b; --muted: #555; --rule: #ccc; --ok: #009E73; --warn: #E69F00; \
            --bad: #D55E00; --accent: #0072B2; }
            body { font: 15px/1.45 system-ui, sans-serif; color: var(--ink); max-width: 1100px; margin: 0 auto; \
            padding: 1em 1.5em 3em; }
            h1 { font-size: 1.6em; margin-bottom: 0.2em; } h2 { border-bottom: 2px solid var(--accent); \
            padding-bottom: 0.15em; margin-top: 1.8em; } h3 { margin-bottom: 0.3em; }
            table { border-collapse: collapse; margin: 0.5em 0 1em; font-variant-numeric: tabular-nums; }
            th, td { border-bottom: 1px solid var(--rule); padding: 0.2em 0.7em; text-align: left; \
            vertical-align: top; }
            td.num { text-align: right; font-family: ui-monospace, monospace; white-space: nowrap; }
            img { max-width: 100%; height: auto; border: 1px solid var(--rule); }
            .wide { overflow-x: auto; }
            .verdict { padding: 0.7em 1em; border-left: 6px solid var(--ok); background: #eef8f4; }
            .verdict.uncertain { border-color: var(--warn); background: #fdf5e6; }
            .verdict.failed { border-color: var(--bad); background: #fbeee6; }
            .caution { border-left: 6px solid var(--warn); padding: 0.5em 1em; background: #fdf5e6; }
            .muted { color: var(--muted); } td.strong { color: var(--bad); font-weight: bold; }
            pre { background: #f4f4f4; padding: 0.7em; overflow-x: auto; font-size: 0.85em; }
            nav a { margin-right: 0.8em; }
            @media print { body { max-width: none; font-size: 10pt; padding: 0; } nav { display: none; } \
            h2 { break-after: avoid; } table, figure, img, .verdict { break-inside: avoid; } \
            a { color: inherit; text-decoration: none; } pre { white-space: pre-wrap; } \
            .wide { overflow: visible; } .wide table { font-size: 7pt; } }
            """;

    private AnalysisReport() {
    }

    /** The page for {@code results} (the content of results.json) with the PNGs by file name. */
    static String html(JsonNode results, Map<String, byte[]> images) {
        StringBuilder b = new StringBuilder(64 * 1024);
        String target = results.path("target").asText();
        b.append("<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n")
                .append("<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\">\n")
                .append("<title>").append(esc(target)).append(" — twinlight analysis</title>\n<style>\n")
                .append(STYLE).append("</style>\n</head>\n<body>\n");
        b.append("<h1>").append(esc(target)).append("</h1>\n<p class=\"muted\">Eclipsing-binary analysis by twinlight ")
                .append(esc(results.path("provenance").path("version").asText())).append(", ")
                .append(esc(results.path("provenance").path("finished").asText())).append(" UTC; times in ")
                .append(esc(results.path("provenance").path("timeScale").asText())).append(".</p>\n");
        b.append("<nav><a href=\"#data\">Data</a><a href=\"#period\">Period</a><a href=\"#minima\">Minima</a>")
                .append("<a href=\"#fit\">Fit</a><a href=\"#parameters\">Parameters</a>")
                .append(results.path("fit").has("posterior") ? "<a href=\"#posterior\">Posterior</a>" : "")
                .append(results.has("dimensions") ? "<a href=\"#dimensions\">Dimensions</a>" : "")
                .append("<a href=\"#correlations\">Correlations</a><a href=\"#diagnostics\">Diagnostics</a>")
                .append("<a href=\"#cautions\">Cautions</a><a href=\"#provenance\">Provenance</a></nav>\n");
        verdict(b, results.path("status"));
        data(b, results.path("data"));
        period(b, results.path("period"), images);
        minima(b, results, images);
        fit(b, results, images);
        parameters(b, results.path("fit"));
        AfterFitReport.posterior(b, results.path("fit"), images);
        AfterFitReport.dimensions(b, results.path("dimensions"), images);
        correlations(b, results.path("fit").path("correlation"));
        diagnostics(b, results);
        cautions(b, results);
        provenance(b, results.path("provenance"));
        b.append("</body>\n</html>\n");
        return b.toString();
    }

    private static void verdict(StringBuilder b, JsonNode status) {
        String v = status.path("verdict").asText();
        b.append("<div class=\"verdict ").append(esc(v)).append("\"><strong>")
                .append(switch (v) {
                    case "ok" -> "";
                    case "uncertain" -> "Results with a doubt (exit code 1).";
                    default -> "The analysis could not be completed (exit code 1).";
                })
                .append("</strong> ").append(esc(status.path("message").asText())).append("</div>\n");
        list(b, "Notes", status.path("notes"));
    }

    private static void data(StringBuilder b, JsonNode data) {
        b.append("<h2 id=\"data\">Data</h2>\n<table><tr><th>file</th><th>band</th><th>points used</th>")
                .append("<th>rows not used (reason)</th><th>span (d)</th><th>cadence (min)</th><th>segments</th>")
                .append("<th>scatter (ppm)</th><th>time scale</th><th>values</th></tr>\n");
        for (JsonNode d : data) {
            StringBuilder rejected = new StringBuilder();
            for (Iterator<Map.Entry<String, JsonNode>> it = d.path("rejectedRows").fields(); it.hasNext();) {
                Map.Entry<String, JsonNode> e = it.next();
                rejected.append(rejected.length() == 0 ? "" : "; ").append(e.getValue().asInt()).append(" × ")
                        .append(e.getKey());
            }
            b.append("<tr><td>").append(esc(d.path("file").asText())).append("</td><td>")
                    .append(esc(d.path("band").asText())).append("</td><td class=\"num\">")
                    .append(d.path("points").asInt()).append("</td><td>")
                    .append(rejected.length() == 0 ? "none" : esc(rejected.toString())).append("</td>")
                    .append(num(d.path("span"), "%.3f")).append(num(d.path("cadence"), 1440, "%.2f"))
                    .append("<td class=\"num\">").append(d.path("segments").asInt()).append("</td>")
                    .append(num(d.path("scatter"), 1e6, "%.0f")).append("<td>")
                    .append(esc(d.path("timeScale").asText())).append("</td><td>")
                    .append(esc(d.path("valueKind").asText())).append("</td></tr>\n");
        }
        b.append("</table>\n");
        for (JsonNode d : data) {
            list(b, "Reader's notes on " + d.path("file").asText(), d.path("notes"));
        }
    }

    private static void period(StringBuilder b, JsonNode p, Map<String, byte[]> images) {
        b.append("<h2 id=\"period\">Period</h2>\n");
        if (p.isMissingNode()) {
            b.append("<p>No period search: the period was given.</p>\n");
            return;
        }
        JsonNode d = p.path("decision");
        b.append("<p><strong>").append(esc(d.path("status").asText())).append("</strong>: P = ")
                .append(esc(valueText(p.path("period")))).append(" d (").append(esc(p.path("uncertaintyMethod")
                        .asText())).append("); ").append(esc(p.path("significance").asText())).append(".</p>\n");
        if (p.path("caution").isTextual()) {
            b.append("<p><strong>Caution:</strong> ").append(esc(p.path("caution").asText())).append("</p>\n");
        }
        if (d.path("alternatives").size() > 0) {
            b.append("<p>Other periods the data allow: ");
            for (JsonNode a : d.path("alternatives")) {
                b.append(esc(String.format(Locale.ROOT, "%.8g d", a.asDouble()))).append(" ");
            }
            b.append("</p>\n");
        }
        image(b, images, "periodogram.png", "Box-least-squares periodogram: signal residue against trial period "
                + "(days), candidates marked.");
        list(b, "Evidence", d.path("evidence"));
        list(b, "What would settle it", d.path("toSettle"));
        list(b, "Remarks", d.path("notes"));
    }

    private static void minima(StringBuilder b, JsonNode results, Map<String, byte[]> images) {
        b.append("<h2 id=\"minima\">Times of minimum and ephemeris</h2>\n");
        JsonNode e = results.path("ephemeris");
        if (e.isMissingNode()) {
            b.append("<p>No eclipse was timed.</p>\n");
            return;
        }
        b.append("<p>Linear ephemeris (").append(esc(e.path("timeScale").asText())).append("): T0 = ")
                .append(esc(valueText(e.path("epoch")))).append(", P = ").append(esc(valueText(e.path("period"))))
                .append(" d; ").append(esc(e.path("modelChoice").path("verdict").asText("one eclipse timed: no "
                        + "ephemeris fitted"))).append(".</p>\n");
        image(b, images, "o-c.png", "O−C diagram: observed minus computed times of minimum (minutes) against cycle "
                + "number.");
        b.append("<table><tr><th>cycle</th><th>type</th><th>time (").append(esc(e.path("timeScale").asText()))
                .append(")</th><th>σ (s)</th><th>O−C (min)</th><th>points</th><th>β</th><th>coverage</th></tr>\n");
        for (JsonNode m : results.path("minima")) {
            b.append("<tr><td>").append(esc(m.path("cycle").asText())).append("</td><td>")
                    .append(esc(m.path("type").asText())).append("</td>").append(num(m.path("time").path("value"),
                            "%.6f")).append(num(m.path("time").path("uncertainty"), 86400, "%.1f"))
                    .append(num(m.path("oMinusCDays"), 1440, "%.3f")).append("<td class=\"num\">")
                    .append(m.path("n_points").asInt()).append("</td>").append(num(m.path("beta"), "%.2f"))
                    .append("<td>").append(m.path("partial").asBoolean() ? "partial (template)" : "full")
                    .append("</td></tr>\n");
        }
        b.append("</table>\n");
        if (results.path("skippedMinima").size() > 0) {
            b.append("<h3>Eclipses not timed</h3>\n<ul>\n");
            for (JsonNode s : results.path("skippedMinima")) {
                b.append("<li>cycle ").append(esc(s.path("cycle").asText())).append(" (")
                        .append(esc(s.path("type").asText())).append("): ").append(esc(s.path("reason").asText()))
                        .append("</li>\n");
            }
            b.append("</ul>\n");
        }
        list(b, "Ephemeris notes", e.path("modelChoice").path("notes"));
    }

    private static void fit(StringBuilder b, JsonNode results, Map<String, byte[]> images) {
        b.append("<h2 id=\"fit\">Model fit</h2>\n");
        JsonNode f = results.path("fit");
        if (f.isMissingNode()) {
            b.append("<p>No fit.</p>\n");
            return;
        }
        for (String name : images.keySet()) {
            if (name.startsWith("fit")) {
                image(b, images, name, "Phase-folded light curve with the fitted model, residuals below (ppt), and "
                        + "both eclipses close up; phase from the fitted epoch and period.");
            }
        }
        for (String name : images.keySet()) {
            if (name.startsWith("velocities")) {
                image(b, images, name, "Radial velocities of both stars with the jointly fitted orbit, residuals "
                        + "below (km/s); phase from the fitted epoch and period.");
            }
        }
        b.append("<h3>Starting points</h3>\n<table><tr><th>start</th><th>χ² reached (thinned data)</th>")
                .append("<th>r₁</th><th>r₂</th><th>i (°)</th><th>e</th></tr>\n");
        for (JsonNode s : results.path("starts")) {
            b.append("<tr><td>").append(esc(s.path("start").asText())).append("</td>");
            if (s.has("failure")) {
                b.append("<td colspan=\"5\">dropped: ").append(esc(s.path("failure").asText())).append("</td></tr>\n");
                continue;
            }
            b.append(num(s.path("chi2"), "%.1f")).append(num(s.path("radius1"), "%.5f"))
                    .append(num(s.path("radius2"), "%.5f")).append(num(s.path("inclination"), "%.3f"))
                    .append(num(s.path("eccentricity"), "%.4f")).append("</tr>\n");
        }
        b.append("</table>\n");
        list(b, "Notes of the fit", f.path("notes"));
    }

    private static void parameters(StringBuilder b, JsonNode f) {
        b.append("<h2 id=\"parameters\">Parameters</h2>\n");
        if (f.isMissingNode()) {
            b.append("<p>No fit.</p>\n");
            return;
        }
        b.append("<table><tr><th>parameter</th><th>value</th><th>uncertainty (1σ)</th><th>prior</th>")
                .append("<th>free or fixed</th></tr>\n");
        for (Iterator<Map.Entry<String, JsonNode>> it = f.path("parameters").fields(); it.hasNext();) {
            Map.Entry<String, JsonNode> e = it.next();
            JsonNode p = e.getValue();
            boolean free = p.path("free").asBoolean();
            JsonNode limit = p.path("limit");
            b.append("<tr><td>").append(esc(e.getKey())).append("</td>").append(num(p.path("value"), "%.10g"))
                    .append(free ? num(p.path("uncertainty"), "%.3g") : "<td class=\"num\">—</td>").append("<td>")
                    .append(free ? "none: uniform within the physical bounds" : "—").append("</td><td>")
                    .append(free ? "free" : "fixed").append(limit.isMissingNode() ? "" : esc(String.format(Locale.ROOT,
                            "; at a physical bound: 95%% %s limit %.4g", limit.path("side").asText(),
                            limit.path("value95").asDouble()))).append("</td></tr>\n");
        }
        b.append("</table>\n<h3>Derived quantities</h3>\n<table><tr><th>quantity</th><th>value</th>")
                .append("<th>uncertainty (1σ)</th></tr>\n");
        for (Iterator<Map.Entry<String, JsonNode>> it = f.path("derived").fields(); it.hasNext();) {
            Map.Entry<String, JsonNode> e = it.next();
            b.append("<tr><td>").append(esc(e.getKey())).append("</td>").append(num(e.getValue().path("value"),
                    "%.10g")).append(num(e.getValue().path("uncertainty"), "%.3g")).append("</tr>\n");
        }
        b.append("</table>\n");
    }

    private static void correlations(StringBuilder b, JsonNode c) {
        b.append("<h2 id=\"correlations\">Correlations</h2>\n");
        if (c.isMissingNode() || c.path("names").size() == 0) {
            b.append("<p>No fit.</p>\n");
            return;
        }
        b.append("<p>Correlation coefficients of the free parameters; |ρ| &gt; 0.9 in bold: their errors are not "
                + "independent.</p>\n<div class=\"wide\"><table><tr><th></th>");
        for (JsonNode n : c.path("names")) {
            b.append("<th>").append(esc(n.asText())).append("</th>");
        }
        b.append("</tr>\n");
        for (int i = 0; i < c.path("names").size(); i++) {
            b.append("<tr><th>").append(esc(c.path("names").get(i).asText())).append("</th>");
            for (JsonNode v : c.path("matrix").get(i)) {
                double r = v.asDouble();
                b.append("<td class=\"num").append(Math.abs(r) > 0.9 && Math.abs(r) < 0.999999 ? " strong" : "")
                        .append("\">").append(String.format(Locale.ROOT, "%.3f", r)).append("</td>");
            }
            b.append("</tr>\n");
        }
        b.append("</table></div>\n");
    }

    private static void diagnostics(StringBuilder b, JsonNode results) {
        b.append("<h2 id=\"diagnostics\">Diagnostics</h2>\n");
        JsonNode s = results.path("fit").path("statistics");
        if (!s.isMissingNode()) {
            b.append("<table><tr><th>points used</th><th>χ²</th><th>reduced χ²</th><th>rms (ppm)</th>")
                    .append("<th>BIC</th><th>points left out</th></tr>\n<tr><td class=\"num\">")
                    .append(s.path("n").asInt()).append("</td>").append(num(s.path("chi2"), "%.2f"))
                    .append(num(s.path("reducedChi2"), "%.4f")).append(num(s.path("rms"), 1e6, "%.1f"))
                    .append(num(s.path("bic"), "%.2f")).append("<td class=\"num\">")
                    .append(s.path("clipped").path("total").asInt()).append("</td></tr>\n</table>\n");
            JsonNode a = results.path("fit").path("adequacy");
            b.append("<p>Does the model describe the data? <strong>")
                    .append(a.path("describesData").asBoolean() ? "yes" : "no").append("</strong> (checks at a false-"
                            + "alarm rate of ").append(esc(a.path("falseAlarmPerCheck").asText())).append(" each)</p>\n")
                    .append("<pre>").append(esc(pretty(a))).append("</pre>\n");
        }
        StringBuilder betas = new StringBuilder();
        for (JsonNode m : results.path("minima")) {
            if (m.path("beta").isNumber()) {
                betas.append(betas.length() == 0 ? "" : ", ").append(String.format(Locale.ROOT, "%.2f",
                        m.path("beta").asDouble()));
            }
        }
        b.append("<p>Correlated-noise factor β of the light around each timed eclipse (Winn et al. 2008): ")
                .append(betas.length() == 0 ? "not measured" : esc(betas.toString()))
                .append(". Autocorrelation times: ").append(esc(AfterFitReport.autocorrelationText(results.path("fit"))))
                .append(".</p>\n");
    }

    private static void cautions(StringBuilder b, JsonNode results) {
        b.append("<h2 id=\"cautions\">Cautions</h2>\n<div class=\"caution\"><p>")
                .append(esc(FitFiles.CAUTION)).append("</p><p>").append(esc(EphemerisJson.CAUTION))
                .append("</p><p>The starting values and the choice among the starts are automatic: look at the fit "
                        + "close-ups and the residuals, and compare with another limb-darkening law, before using "
                        + "the numbers.</p><p>The uncertainties are the fit's covariance errors (a linear "
                        + "approximation), widened for correlated noise and, where the inclination is strongly "
                        + "correlated, from the profile of χ². In partial eclipses the radius ratio, the inclination, "
                        + "the limb darkening and e sin ω are strongly correlated: on simulated ground-based light "
                        + "curves (nights, weather, zero points, 4 mmag) the quoted errors of the radii and "
                        + "inclination matched their scatter (pull spreads 0.6–1.2 over 20 seeds), but one seed in "
                        + "20 had a radius 4σ off, moved by the fitted limb darkening (docs/analyse.md). Compare a "
                        + "fit with the limb darkening fixed at other values before publication.</p>");
        fitChoices(b, results.path("fit"));
        b.append("</div>\n");
        list(b, "Doubts", results.path("status").path("doubts"));
    }

    /** What the fit stage did to keep its errors honest: limb-darkening priors, the orbit's choice, the profile. */
    private static void fitChoices(StringBuilder b, JsonNode fit) {
        JsonNode ld = fit.path("limbDarkeningPriors");
        if (ld.size() > 0) {
            List<String> names = new java.util.ArrayList<>();
            ld.fieldNames().forEachRemaining(names::add);
            b.append("<p>").append(esc(String.format(Locale.ROOT, "The free limb-darkening coefficients (%s) were held "
                    + "near their start values by a normal prior of width %.2f: left free without one they wander "
                    + "along the valley of partial eclipses and bias the radii. Their results are not a measurement "
                    + "independent of that choice.", String.join(", ", names), ld.path(names.get(0)).path("sigma")
                    .asDouble()))).append("</p>");
        }
        JsonNode orbit = fit.path("orbit");
        if (orbit.has("chosen")) {
            b.append("<p>Orbit: ").append(esc(orbit.path("reason").asText())).append(orbit.path("chosen").asText()
                    .equals("circular") ? esc("; e and ω are then fixed, not measured.") : ".").append("</p>");
        }
        JsonNode p = fit.path("inclinationProfile");
        if (p.has("from")) {
            b.append("<p>").append(esc(String.format(Locale.ROOT, "The inclination is correlated with %s "
                    + "(ρ = %.3f), where a parabola misdescribes χ²: its error comes from the profile of χ² (i fixed "
                    + "at %d values, the other parameters refitted; 1σ where χ² rose by %.2f): %.3f° against the "
                    + "covariance error %.3f°. The errors of the parameters that move with i were widened to their "
                    + "shifts along that profile.", p.path("correlatedWith").asText(), p.path("correlation")
                    .asDouble(), p.path("points").size(), p.path("deltaChi2At1Sigma").asDouble(),
                    p.path("sigmaDeg").asDouble(), p.path("covarianceSigmaDeg").asDouble()))).append("</p>");
        }
    }

    private static void provenance(StringBuilder b, JsonNode p) {
        b.append("<h2 id=\"provenance\">Provenance</h2>\n<table>");
        row(b, "software", "twinlight " + p.path("version").asText());
        row(b, "run", p.path("started").asText() + " to " + p.path("finished").asText() + " UTC");
        row(b, "time scale", p.path("timeScale").asText());
        row(b, "random seed", p.path("seed").asText());
        row(b, "period and epoch from", p.path("ephemerisSource").asText(""));
        row(b, "fit", p.path("fitMethod").asText());
        for (JsonNode in : p.path("inputs")) {
            row(b, "input " + in.path("file").asText(), "SHA-256 " + in.path("sha256").asText());
        }
        b.append("</table>\n<h3>Settings used (settings-used.json)</h3>\n<pre>").append(esc(pretty(p.path("settings"))))
                .append("</pre>\n");
    }

    private static void row(StringBuilder b, String key, String value) {
        b.append("<tr><th>").append(esc(key)).append("</th><td>").append(esc(value)).append("</td></tr>\n");
    }

    static void list(StringBuilder b, String title, JsonNode items) {
        if (items == null || items.size() == 0) {
            return;
        }
        b.append("<h3>").append(esc(title)).append("</h3>\n<ul>\n");
        for (JsonNode n : items) {
            b.append("<li>").append(esc(n.asText())).append("</li>\n");
        }
        b.append("</ul>\n");
    }

    static void image(StringBuilder b, Map<String, byte[]> images, String name, String caption) {
        byte[] png = images.get(name);
        if (png == null) {
            return;
        }
        b.append("<figure><img alt=\"").append(esc(caption)).append("\" src=\"data:image/png;base64,")
                .append(Base64.getEncoder().encodeToString(png)).append("\"><figcaption class=\"muted\">")
                .append(esc(name)).append(": ").append(esc(caption)).append("</figcaption></figure>\n");
    }

    static String num(JsonNode v, String format) {
        return num(v, 1, format);
    }

    static String num(JsonNode v, double factor, String format) {
        if (v == null || !v.isNumber()) {
            return "<td class=\"num\">—</td>";
        }
        return "<td class=\"num\">" + esc(String.format(Locale.ROOT, format, v.asDouble() * factor)) + "</td>";
    }

    /** "value ± uncertainty" of a {"value", "uncertainty"} node, the value to the uncertainty's digits. */
    static String valueText(JsonNode v) {
        return withError(v.path("value").asDouble(Double.NaN), v.path("uncertainty").asDouble(Double.NaN));
    }

    /** An estimate as "value ± uncertainty" (two significant digits of the uncertainty). */
    static String withError(Estimate e) {
        return withError(e.value(), e.free() ? e.uncertainty() : Double.NaN);
    }

    static String withError(double value, double uncertainty) {
        if (!(uncertainty > 0) || !Double.isFinite(uncertainty)) {
            return String.format(Locale.ROOT, "%.8g", value);
        }
        int decimals = Math.max(0, 1 - (int) Math.floor(Math.log10(uncertainty)));
        return String.format(Locale.ROOT, "%." + decimals + "f ± %." + decimals + "f", value, uncertainty);
    }

    private static String pretty(JsonNode n) {
        try {
            return JSON.writeValueAsString(n);
        } catch (com.fasterxml.jackson.core.JsonProcessingException e) {
            return n.toString();
        }
    }

    /** Text made safe for HTML element content and attribute values. */
    static String esc(String s) {
        if (s == null) {
            return "";
        }
        StringBuilder b = new StringBuilder(s.length() + 16);
        for (int i = 0; i < s.length(); i++) {
            char c = s.charAt(i);
            switch (c) {
                case '<' -> b.append("&lt;");
                case '>' -> b.append("&gt;");
                case '&' -> b.append("&amp;");
                case '"' -> b.append("&quot;");
                case '\'' -> b.append("&#39;");
                default -> b.append(c);
            }
        }
        return b.toString();
    }
}
