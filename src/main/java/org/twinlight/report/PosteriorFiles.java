package org.twinlight.report;

import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.BufferedWriter;
import java.io.OutputStreamWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.zip.GZIPOutputStream;
import org.twinlight.fit.Posterior;
import org.twinlight.sampling.Convergence;
import org.twinlight.sampling.Marginal;

/** Writes a sampled posterior: the {@code posterior} and {@code convergence} blocks of fit.json and the chain. */
public final class PosteriorFiles {
    /** Name of the chain file in the fit's output directory. */
    public static final String CHAIN_FILE = "chain.csv.gz";

    private PosteriorFiles() {
    }

    /**
     * Adds {@code "posterior": {NAME: {median, lower68, upper68, lower95, upper95,
     * autocorrelationTime[, limit]}}} and {@code "convergence": {...}} to a fit.json document.
     */
    public static void addTo(ObjectNode doc, Posterior p) {
        ObjectNode post = doc.putObject("posterior");
        for (int c = 0; c < p.names().size(); c++) {
            Marginal m = p.marginals().get(c);
            ObjectNode o = post.putObject(p.names().get(c));
            o.put("median", m.median());
            o.put("lower68", m.lower68());
            o.put("upper68", m.upper68());
            o.put("lower95", m.lower95());
            o.put("upper95", m.upper95());
            VelocityFiles.putNumber(o, "autocorrelationTime", m.autocorrelationTime());
            if (m.limit() != null) {
                ObjectNode limit = o.putObject("limit");
                limit.put("side", m.limit().side());
                limit.put("value68", m.limit().value68());
                limit.put("value95", m.limit().value95());
            }
        }
        Convergence cv = p.convergence();
        ObjectNode conv = doc.putObject("convergence");
        conv.put("converged", cv.converged());
        conv.put("reason", cv.reason());
        conv.put("walkers", p.walkers());
        conv.put("steps", cv.steps());
        conv.put("burnIn", cv.burnIn());
        VelocityFiles.putNumber(conv, "acceptanceFraction", cv.acceptanceFraction());
        VelocityFiles.putNumber(conv, "maxAutocorrelationTime", cv.maxAutocorrelationTime());
        VelocityFiles.putNumber(conv, "chainLengthInTau", cv.chainLengthInTau());
        conv.put("chainFile", CHAIN_FILE);
        conv.put("seed", p.seed());
        conv.put("evaluations", cv.evaluations());
        conv.put("method", "affine-invariant ensemble sampler, stretch move a = 2 (Goodman & Weare 2010); "
                + "integrated autocorrelation time with Sokal's window c = 5; converged when the chain after "
                + "burn-in (5 tau) is at least 50 tau long and tau changed by less than 5% between checks");
        var notes = conv.putArray("notes");
        p.notes().forEach(notes::add);
    }

    /** A plain-text table of the marginals, for the terminal. */
    public static String summary(Posterior p) {
        StringBuilder sb = new StringBuilder();
        sb.append(String.format(java.util.Locale.ROOT, "%n%-28s %14s %12s %12s   %s%n", "posterior", "median", "-68%",
                "+68%", "95% interval"));
        for (int c = 0; c < p.names().size(); c++) {
            Marginal m = p.marginals().get(c);
            String interval = m.limit() != null ? String.format(java.util.Locale.ROOT, "%s %s (95%%, one-sided)",
                    m.limit().side().equals("upper") ? "<" : ">", format(m.limit().value95()))
                    : "[" + format(m.lower95()) + ", " + format(m.upper95()) + "]";
            sb.append(String.format(java.util.Locale.ROOT, "%-28s %16s %12.4g %12.4g   %s%n", p.names().get(c),
                    format(m.median()), m.median() - m.lower68(), m.upper68() - m.median(), interval));
        }
        Convergence cv = p.convergence();
        sb.append(String.format(java.util.Locale.ROOT, "%d walkers × %d steps (burn-in %d), acceptance %.2f, "
                + "max tau %.1f steps, chain %.0f tau long: %s%n", p.walkers(), cv.steps(), cv.burnIn(),
                cv.acceptanceFraction(), cv.maxAutocorrelationTime(), cv.chainLengthInTau(),
                cv.converged() ? "converged" : "NOT converged (" + cv.reason() + ")"));
        for (String n : p.notes()) {
            sb.append("note: ").append(n).append('\n');
        }
        return sb.toString();
    }

    private static String format(double v) {
        return Math.abs(v) >= 1e5 ? String.format(java.util.Locale.ROOT, "%.6f", v)
                : String.format(java.util.Locale.ROOT, "%.7g", v);
    }

    /**
     * The chain, {@code trace.png} and {@code corner.png}, each to {@code target.apply(name)}.
     *
     * @param title title of the plots
     */
    public static void writeAll(java.util.function.Function<String, Path> target, Posterior p, String title) {
        writeChain(target.apply(CHAIN_FILE), p);
        PosteriorPlots.writeTrace(target.apply("trace.png"), p, title);
        PosteriorPlots.writeCorner(target.apply("corner.png"), p, title);
    }

    /**
     * {@code chain.csv.gz}: header {@code step,walker,logPosterior,NAME,...}, one row per walker and
     * step after burn-in (steps counted from the start of the run).
     */
    public static void writeChain(Path target, Posterior p) {
        AtomicFiles.write(target, out -> {
            GZIPOutputStream gz = new GZIPOutputStream(out, 1 << 16);
            BufferedWriter w = new BufferedWriter(new OutputStreamWriter(gz, StandardCharsets.UTF_8), 1 << 16);
            w.write("step,walker,logPosterior");
            for (String n : p.names()) {
                w.write(',');
                w.write(n);
            }
            w.write('\n');
            StringBuilder sb = new StringBuilder();
            for (int t = p.burnIn(); t < p.steps(); t++) {
                for (int k = 0; k < p.walkers(); k++) {
                    sb.setLength(0);
                    sb.append(t).append(',').append(k).append(',').append(p.logPosterior()[t * p.walkers() + k]);
                    for (double v : p.values()[t * p.walkers() + k]) {
                        sb.append(',').append(v);
                    }
                    sb.append('\n');
                    w.write(sb.toString());
                }
            }
            w.flush();
            gz.finish();
        });
    }
}
