package org.twinlight.bench;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import org.twinlight.analysis.AnalysisOutcome;
import org.twinlight.analysis.AnalysisRequest;
import org.twinlight.analysis.AnalysisSettings;
import org.twinlight.analysis.TargetAnalysis;

/**
 * Times {@code analyse} on the bundled 27-day 2-minute sample (sample-curves/brindle-pair-space.fits,
 * 18,576 points) with no hints: reading, period search, times of minimum, starting values, the fit
 * from several starts with covariance errors, and the writing of the report; each stage's wall-clock
 * time as recorded in results.json. Runs {@code args[0]} times (default 3) in one JVM, so the first
 * run shows the cold start and the later ones the warm figure. Run with
 * {@code java -cp target/classes:target/test-classes:$(deps) org.twinlight.bench.AnalyseBench 3}.
 */
public final class AnalyseBench {

    private AnalyseBench() {
    }

    public static void main(String[] args) throws Exception {
        int runs = args.length > 0 ? Integer.parseInt(args[0]) : 3;
        Path sample = Path.of("sample-curves", "brindle-pair-space.fits").toAbsolutePath();
        ObjectMapper json = new ObjectMapper();
        for (int r = 1; r <= runs; r++) {
            Path out = Path.of("target", "bench-analyse", "run-" + r);
            long t0 = System.nanoTime();
            AnalysisOutcome o = TargetAnalysis.run(new AnalysisRequest(AnalysisSettings.defaults()
                    .withFiles(List.of(sample.toString())), out));
            double total = (System.nanoTime() - t0) / 1e9;
            JsonNode stages = json.readTree(out.resolve("results.json").toFile()).at("/provenance/stageSeconds");
            double upToFit = 0;
            StringBuilder b = new StringBuilder();
            for (var it = stages.fields(); it.hasNext();) {
                var e = it.next();
                upToFit += e.getValue().asDouble();
                b.append(String.format(Locale.ROOT, " %s %.2f s;", e.getKey(), e.getValue().asDouble()));
            }
            System.out.printf(Locale.ROOT, "run %d: exit %d; stages:%s up to the fit %.2f s; with reading and "
                    + "report %.2f s%n", r, o.exitCode(), b, upToFit, total);
        }
    }
}
