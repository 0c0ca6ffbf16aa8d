package org.twinlight.batch;

import java.io.IOException;
import java.io.StringWriter;
import java.io.UncheckedIOException;
import java.nio.file.Path;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Set;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVPrinter;
import org.twinlight.report.AtomicFiles;
import org.twinlight.report.FitFiles;

/**
 * The batch's overview, rebuilt from the journal: {@code summary.csv} (one row per finished
 * target) and {@code index.html} (a picture and the key numbers per target). Both are written
 * atomically; the page needs nothing but the target folders beside it (no network).
 */
public final class BatchIndex {
    /** The summary table's file name. */
    public static final String SUMMARY = "summary.csv";
    /** The overview page's file name. */
    public static final String INDEX = "index.html";

    /** Okabe &amp; Ito (2008), "Color Universal Design": blue and vermillion, told apart in every common colour-vision deficiency. */
    private static final String OK_COLOUR = "#0072B2";
    private static final String FAILED_COLOUR = "#D55E00";

    private BatchIndex() {
    }

    /**
     * Writes {@code summary.csv} and {@code index.html} into {@code batchDir} for the entries (in
     * the targets' order) of the targets given.
     */
    public static void write(Path batchDir, List<BatchTarget> targets, List<BatchJournal.Entry> entries) {
        List<Row> rows = rows(targets, entries);
        AtomicFiles.writeString(batchDir.resolve(SUMMARY), summaryCsv(rows));
        AtomicFiles.writeString(batchDir.resolve(INDEX), indexHtml(rows, targets.size()));
    }

    /** A finished target with its entry. */
    record Row(BatchTarget target, BatchJournal.Entry entry) {
        TargetResult result() {
            return entry.result();
        }
    }

    private static List<Row> rows(List<BatchTarget> targets, List<BatchJournal.Entry> entries) {
        java.util.Map<String, BatchJournal.Entry> byId = new java.util.HashMap<>();
        entries.forEach(e -> byId.put(e.id(), e));
        List<Row> rows = new ArrayList<>();
        for (BatchTarget t : targets) {
            BatchJournal.Entry e = byId.get(t.id());
            if (e != null) {
                rows.add(new Row(t, e));
            }
        }
        return rows;
    }

    /** The names of the key results of every row, in the order they first appear. */
    private static List<String> keyNames(List<Row> rows) {
        Set<String> names = new LinkedHashSet<>();
        rows.forEach(r -> names.addAll(r.result().keyResults().keySet()));
        return new ArrayList<>(names);
    }

    static String summaryCsv(List<Row> rows) {
        List<String> keys = keyNames(rows);
        List<String> header = new ArrayList<>(List.of("target", "status", "exit_code", "message", "output"));
        for (String k : keys) {
            header.add(k);
            header.add(k + "_uncertainty");
        }
        StringWriter w = new StringWriter();
        w.write("# batch summary: one row per finished target; output is the target's folder beside this file; "
                + "values in the units of fit.json, period.json and ephemeris.json (days, degrees, fractions of a) and, "
                + "for mass1, mass2, radius1Rsun, radius2Rsun, logg1, logg2, logLuminosity1, logLuminosity2, of "
                + "dimensions.json (nominal solar units, IAU 2015 B3; log10 cgs); empty where there is no value\n");
        w.write("# caution: " + FitFiles.CAUTION + "\n");
        try (CSVPrinter csv = new CSVPrinter(w, CSVFormat.DEFAULT.builder().setRecordSeparator("\n").get())) {
            csv.printRecord(header);
            for (Row r : rows) {
                TargetResult res = r.result();
                List<String> cells = new ArrayList<>(List.of(r.target().label(), res.ok() ? "ok" : "failed",
                        Integer.toString(res.exitCode()), res.message(), r.target().id()));
                for (String k : keys) {
                    TargetResult.KeyValue v = res.keyResults().get(k);
                    cells.add(v == null ? "" : number(v.value()));
                    cells.add(v == null ? "" : number(v.uncertainty()));
                }
                csv.printRecord(cells);
            }
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        return w.toString();
    }

    private static String number(double v) {
        return Double.isFinite(v) ? Double.toString(v) : "";
    }

    static String indexHtml(List<Row> rows, int total) {
        long ok = rows.stream().filter(r -> r.result().ok()).count();
        long failed = rows.size() - ok;
        StringBuilder h = new StringBuilder(4096 + 1024 * rows.size());
        h.append("<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n")
                .append("<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\">\n")
                .append("<title>Batch: ").append(rows.size()).append(" of ").append(total)
                .append(" targets</title>\n<style>\n")
                .append("body{font-family:system-ui,sans-serif;margin:1.5em;color:#222;background:#fff}\n")
                .append("table{border-collapse:collapse;width:100%}\n")
                .append("th,td{border-bottom:1px solid #ccc;padding:.4em .6em;text-align:left;vertical-align:top}\n")
                .append("th{background:#f0f0f0;position:sticky;top:0}\n")
                .append("img{width:").append(BatchRunner.THUMBNAIL_WIDTH).append("px;max-width:40vw;height:auto;"
                        + "border:1px solid #ddd}\n")
                .append(".status{font-weight:bold;white-space:nowrap}\n")
                .append(".ok{color:").append(OK_COLOUR).append("}\n.failed{color:").append(FAILED_COLOUR).append("}\n")
                .append("dl{display:grid;grid-template-columns:max-content auto;gap:.1em .8em;margin:0}\n")
                .append("dt{font-weight:600}dd{margin:0;font-variant-numeric:tabular-nums;white-space:nowrap}\n")
                .append(".message{max-width:40em}\n.caution{max-width:60em;font-size:.9em;color:#444}\n")
                .append("@media print{th{position:static}img{max-width:30vw}}\n")
                .append("</style>\n</head>\n<body>\n");
        h.append("<h1>Batch of ").append(total).append(" target").append(total == 1 ? "" : "s").append("</h1>\n");
        h.append("<p><span class=\"status ok\">&#10003; ").append(ok).append(" ok</span> &middot; ")
                .append("<span class=\"status failed\">&#10007; ").append(failed).append(" failed</span>");
        if (rows.size() < total) {
            h.append(" &middot; ").append(total - rows.size()).append(" not finished (run the batch again to resume)");
        }
        h.append(" &middot; written ").append(Instant.now().truncatedTo(ChronoUnit.SECONDS)).append(" (UTC)</p>\n");
        h.append("<p class=\"caution\">Caution: ").append(escape(FitFiles.CAUTION)).append("</p>\n");
        h.append("<table>\n<thead><tr><th>Target</th><th>Picture</th><th>Status</th><th>Key results</th>"
                + "<th>Message</th></tr></thead>\n<tbody>\n");
        for (Row r : rows) {
            row(h, r);
        }
        h.append("</tbody>\n</table>\n</body>\n</html>\n");
        return h.toString();
    }

    private static void row(StringBuilder h, Row r) {
        TargetResult res = r.result();
        String folder = escape(r.target().id()) + "/";
        h.append("<tr id=\"").append(escape(r.target().id())).append("\">");
        h.append("<td><a href=\"").append(folder).append("\">").append(escape(r.target().label())).append("</a></td>");
        h.append("<td>");
        if (res.thumbnail() != null) {
            h.append("<a href=\"").append(folder).append(escape(pictureLink(res))).append("\"><img loading=\"lazy\" src=\"").append(folder)
                    .append(escape(res.thumbnail())).append("\" alt=\"picture of ").append(escape(r.target().label()))
                    .append("\"></a>");
        }
        h.append("</td>");
        h.append("<td class=\"status ").append(res.ok() ? "ok\">&#10003; ok" : "failed\">&#10007; failed (exit "
                + res.exitCode() + ")").append("</td>");
        h.append("<td>");
        if (!res.keyResults().isEmpty()) {
            h.append("<dl>");
            res.keyResults().forEach((name, v) -> h.append("<dt>").append(escape(name)).append("</dt><dd>")
                    .append(escape(valueWithUncertainty(v))).append("</dd>"));
            h.append("</dl>");
        }
        h.append("</td>");
        h.append("<td class=\"message\">").append(escape(res.message())).append("</td></tr>\n");
    }

    /** The full-size picture the reduced one was made from: the first PNG among the files. */
    private static String pictureLink(TargetResult res) {
        return res.files().stream().filter(f -> f.toLowerCase(Locale.ROOT).endsWith(".png")).findFirst()
                .orElse(res.thumbnail());
    }

    /**
     * A value with its uncertainty to two significant digits and the value to the same decimal
     * place ("0.10512 ± 0.00031"); the value alone with seven significant digits when it has no
     * uncertainty.
     */
    static String valueWithUncertainty(TargetResult.KeyValue v) {
        if (!Double.isFinite(v.value())) {
            return "—";
        }
        double s = v.uncertainty();
        if (!(s > 0) || !Double.isFinite(s)) {
            return String.format(Locale.ROOT, "%.7g", v.value());
        }
        int decimals = Math.max(0, 1 - (int) Math.floor(Math.log10(s)));
        if (decimals > 15) {
            return String.format(Locale.ROOT, "%.7g ± %.2g", v.value(), s);
        }
        return String.format(Locale.ROOT, "%." + decimals + "f ± %." + decimals + "f", v.value(), s);
    }

    /** Text for HTML: the five characters with a meaning in markup become entities. */
    static String escape(String text) {
        StringBuilder sb = new StringBuilder(text.length() + 16);
        for (int i = 0; i < text.length(); i++) {
            char c = text.charAt(i);
            switch (c) {
                case '&' -> sb.append("&amp;");
                case '<' -> sb.append("&lt;");
                case '>' -> sb.append("&gt;");
                case '"' -> sb.append("&quot;");
                case '\'' -> sb.append("&#39;");
                default -> sb.append(c);
            }
        }
        return sb.toString();
    }
}
