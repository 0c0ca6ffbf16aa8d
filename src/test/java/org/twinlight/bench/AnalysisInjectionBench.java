package org.twinlight.bench;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import org.twinlight.analysis.AnalysedCurves;
import org.twinlight.analysis.AnalysisOutcome;
import org.twinlight.analysis.AnalysisRequest;
import org.twinlight.analysis.AnalysisSettings;
import org.twinlight.analysis.TargetAnalysis;
import org.twinlight.eclipse.BinaryParameters;

/**
 * The large version of {@code TargetAnalysisRecoveryTest}: {@code analyse} with no hints on the
 * unseen space-like and ground-like synthetic binaries over {@code args[0]} noise seeds (default 20);
 * per kind and parameter the mean and spread of the pulls (fit − truth)/σ — near 0 and 1 when the
 * errors are honest — and how many runs ended with exit 0. Run with
 * {@code java -cp target/classes:target/test-classes:$(deps) org.twinlight.bench.AnalysisInjectionBench 20
 * [space,ground] [threads] [firstSeed]} (second argument: the kinds, default both; third: threads per
 * analysis, default 0 = every core; fourth: the first seed, default 1000, so that a run can be split). Prints each run's pulls and wall time.
 */
public final class AnalysisInjectionBench {
    private static final String[] NAMES = {"period", "radius1", "radius2", "inclination"};

    private AnalysisInjectionBench() {
    }

    public static void main(String[] args) throws Exception {
        int seeds = args.length > 0 ? Integer.parseInt(args[0]) : 20;
        List<String> kinds = args.length > 1 ? List.of(args[1].split(",")) : List.of("space", "ground");
        int threads = args.length > 2 ? Integer.parseInt(args[2]) : 0;
        long firstSeed = args.length > 3 ? Long.parseLong(args[3]) : 1000;
        for (String kind : kinds) {
            BinaryParameters truth = kind.equals("space") ? AnalysedCurves.SPACE : AnalysedCurves.GROUND;
            double[] truths = {truth.periodDays(), truth.radius1(), truth.radius2(), truth.inclinationDeg()};
            double[][] pulls = new double[NAMES.length][seeds];
            int ok = 0;
            ObjectMapper json = new ObjectMapper();
            for (int s = 0; s < seeds; s++) {
                long seed = firstSeed + s;
                Path dir = AnalysedCurves.root().resolve("bench-" + kind + "-" + seed);
                Path f = kind.equals("space") ? AnalysedCurves.writeSpace(Path.of(dir + ".csv"), seed)
                        : AnalysedCurves.writeGround(Path.of(dir + ".csv"), seed);
                long wall0 = System.nanoTime();
                AnalysisOutcome o = TargetAnalysis.run(new AnalysisRequest(AnalysisSettings.defaults()
                        .withFiles(List.of(f.toString())), dir, threads));
                String cost = String.format(Locale.ROOT, "wall %.1f s", (System.nanoTime() - wall0) / 1e9);
                if (o.exitCode() != 0) {
                    System.out.printf(Locale.ROOT, "%s seed %d: exit %d: %s%n", kind, seed, o.exitCode(), o.message());
                    continue;
                }
                ok++;
                // the errors the analysis tells the user to quote (correlated noise allowed for)
                for (int k = 0; k < NAMES.length; k++) {
                    AnalysisOutcome.Value v = o.keyResults().get(NAMES[k]);
                    pulls[k][ok - 1] = (v.value() - truths[k]) / v.uncertainty();
                }
                System.out.printf(Locale.ROOT, "%s seed %d: pulls P %+.2f, r1 %+.2f, r2 %+.2f, i %+.2f (%s)%n", kind,
                        seed, pulls[0][ok - 1], pulls[1][ok - 1], pulls[2][ok - 1], pulls[3][ok - 1], cost);
            }
            System.out.printf(Locale.ROOT, "%s: %d of %d runs exit 0%n", kind, ok, seeds);
            for (int k = 0; k < NAMES.length; k++) {
                double mean = 0;
                for (int i = 0; i < ok; i++) {
                    mean += pulls[k][i] / ok;
                }
                double var = 0;
                for (int i = 0; i < ok; i++) {
                    var += (pulls[k][i] - mean) * (pulls[k][i] - mean) / Math.max(1, ok - 1);
                }
                System.out.printf(Locale.ROOT, "  %-12s pull mean %+.2f, spread %.2f%n", NAMES[k], mean, Math.sqrt(var));
            }
        }
    }
}
