package org.twinlight.analysis;

import com.fasterxml.jackson.databind.JsonNode;
import java.util.Iterator;
import java.util.LinkedHashSet;
import java.util.Locale;
import java.util.Map;
import java.util.Set;

/**
 * The sections of report.html for the stages after the fit: the posterior (medians, intervals,
 * autocorrelation times, trace and corner plots) and the absolute dimensions. Rendered from
 * results.json like the rest of the page.
 */
final class AfterFitReport {

    private AfterFitReport() {
    }

    /** The posterior section, when fit.json holds one. */
    static void posterior(StringBuilder b, JsonNode fit, Map<String, byte[]> images) {
        JsonNode post = fit.path("posterior");
        if (post.isMissingNode()) {
            return;
        }
        JsonNode c = fit.path("convergence");
        boolean converged = c.path("converged").asBoolean();
        b.append("<h2 id=\"posterior\">Posterior</h2>\n<p>").append(converged ? "" : "<strong>Not converged: do not "
                + "quote these intervals.</strong> ").append(AnalysisReport.esc(String.format(Locale.ROOT,
                "%d walkers × %d steps (burn-in %d), acceptance fraction %.2f, longest autocorrelation time τ %.1f "
                + "steps, chain %.0f τ long: %s. %s", c.path("walkers").asInt(), c.path("steps").asInt(),
                c.path("burnIn").asInt(), c.path("acceptanceFraction").asDouble(Double.NaN),
                c.path("maxAutocorrelationTime").asDouble(Double.NaN), c.path("chainLengthInTau").asDouble(Double.NaN),
                converged ? "converged" : "not converged (" + c.path("reason").asText() + ")",
                c.path("method").asText()))).append("</p>\n");
        b.append("<table><tr><th>parameter</th><th>median</th><th>68% interval</th><th>95% interval</th>")
                .append("<th>τ (steps)</th></tr>\n");
        for (Iterator<Map.Entry<String, JsonNode>> it = post.fields(); it.hasNext();) {
            Map.Entry<String, JsonNode> e = it.next();
            JsonNode m = e.getValue();
            JsonNode limit = m.path("limit");
            String interval95 = limit.isMissingNode() ? interval(m.path("lower95"), m.path("upper95"))
                    : String.format(Locale.ROOT, "%s %.6g (one-sided)", limit.path("side").asText().equals("upper")
                            ? "<" : ">", limit.path("value95").asDouble());
            b.append("<tr><td>").append(AnalysisReport.esc(e.getKey())).append("</td>")
                    .append(AnalysisReport.num(m.path("median"), "%.10g")).append("<td class=\"num\">")
                    .append(AnalysisReport.esc(interval(m.path("lower68"), m.path("upper68")))).append("</td>")
                    .append("<td class=\"num\">").append(AnalysisReport.esc(interval95)).append("</td>")
                    .append(AnalysisReport.num(m.path("autocorrelationTime"), "%.1f")).append("</tr>\n");
        }
        b.append("</table>\n");
        AnalysisReport.image(b, images, "trace.png", "Trace of each parameter against step (every walker); the "
                + "burn-in is left of the line.");
        AnalysisReport.image(b, images, "corner.png", "Pairwise distributions and marginals of the retained samples.");
        AnalysisReport.list(b, "Notes of the sampler", c.path("notes"));
    }

    private static String interval(JsonNode lo, JsonNode hi) {
        return String.format(Locale.ROOT, "[%.8g, %.8g]", lo.asDouble(Double.NaN), hi.asDouble(Double.NaN));
    }

    /** The autocorrelation times in a sentence for the diagnostics. */
    static String autocorrelationText(JsonNode fit) {
        JsonNode c = fit.path("convergence");
        if (c.isMissingNode()) {
            return "not sampled (no posterior in this run)";
        }
        return String.format(Locale.ROOT, "longest τ %.1f steps, chain %.0f τ long (%s; per parameter under "
                + "Posterior)", c.path("maxAutocorrelationTime").asDouble(Double.NaN),
                c.path("chainLengthInTau").asDouble(Double.NaN), c.path("converged").asBoolean() ? "converged"
                        : "not converged");
    }

    /** The dimensions section, from dimensions.json's content. */
    static void dimensions(StringBuilder b, JsonNode d, Map<String, byte[]> images) {
        if (d.isMissingNode()) {
            return;
        }
        b.append("<h2 id=\"dimensions\">Absolute dimensions</h2>\n<p>Nominal solar units (IAU 2015 Resolution B3); "
                + "errors: ").append(AnalysisReport.esc(d.path("method").path("uncertainties").asText()))
                .append(". K1 and K2: ").append(AnalysisReport.esc(d.path("input").path("velocities").asText()))
                .append(".</p>\n<table><tr><th>quantity</th><th>unit</th><th>star 1</th><th>star 2</th></tr>\n");
        Set<String> keys = new LinkedHashSet<>();
        d.path("star1").fieldNames().forEachRemaining(keys::add);
        d.path("star2").fieldNames().forEachRemaining(keys::add);
        for (String k : keys) {
            b.append("<tr><td>").append(AnalysisReport.esc(k)).append("</td><td>")
                    .append(AnalysisReport.esc(d.path("units").path(k).asText())).append("</td><td class=\"num\">")
                    .append(AnalysisReport.esc(valueOrDash(d.path("star1").path(k)))).append("</td><td class=\"num\">")
                    .append(AnalysisReport.esc(valueOrDash(d.path("star2").path(k)))).append("</td></tr>\n");
        }
        b.append("</table>\n<table><tr><th>system</th><th>unit</th><th>value</th></tr>\n");
        for (Iterator<Map.Entry<String, JsonNode>> it = d.path("system").fields(); it.hasNext();) {
            Map.Entry<String, JsonNode> e = it.next();
            b.append("<tr><td>").append(AnalysisReport.esc(e.getKey())).append("</td><td>")
                    .append(AnalysisReport.esc(d.path("units").path(e.getKey()).asText()))
                    .append("</td><td class=\"num\">").append(AnalysisReport.esc(valueOrDash(e.getValue())))
                    .append("</td></tr>\n");
        }
        b.append("</table>\n");
        AnalysisReport.image(b, images, "mass-radius.png", "Mass–radius diagram of the two stars with their 1σ "
                + "errors.");
        AnalysisReport.image(b, images, "mass-luminosity.png", "Mass–luminosity diagram of the two stars with their "
                + "1σ errors.");
        AnalysisReport.list(b, "Warnings of the dimensions", d.path("warnings"));
        AnalysisReport.list(b, "Notes of the dimensions", d.path("notes"));
        b.append("<p class=\"muted\">").append(AnalysisReport.esc(d.path("caution").asText())).append("</p>\n");
    }

    private static String valueOrDash(JsonNode v) {
        return v.isMissingNode() ? "—" : AnalysisReport.valueText(v);
    }
}
