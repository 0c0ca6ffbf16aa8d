package org.twinlight.bench;

import java.lang.management.ManagementFactory;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import org.twinlight.batch.BatchRunner;
import org.twinlight.batch.BatchTarget;
import org.twinlight.analysis.AnalysisSettings;
import org.twinlight.batch.AnalysisUnit;
import org.twinlight.batch.SyntheticTargets;
import org.twinlight.batch.TargetDiscovery;

/**
 * Throughput of {@code batch}: N small synthetic targets (default 200; 10 days at a 10-minute
 * cadence, 1,441 points, 1500 ppm noise, periods 0.9 to 2.3 d) through the batch's unit of work (the
 * one-command analysis),
 * once on 1 thread and once on 2. Prints targets per core-hour (from the process's CPU time) and
 * the speed-up in wall time from 1 to 2 threads. Run with
 * {@code java -cp $CP org.twinlight.bench.BatchBench [N] [DAYS] [CADENCE_MINUTES]}.
 */
public final class BatchBench {
    private BatchBench() {
    }

    public static void main(String[] args) throws Exception {
        int n = args.length > 0 ? Integer.parseInt(args[0]) : 200;
        double days = args.length > 1 ? Double.parseDouble(args[1]) : 10;
        double cadence = args.length > 2 ? Double.parseDouble(args[2]) : 10;
        Path work = Files.createTempDirectory("batch-bench");
        Path in = Files.createDirectories(work.resolve("in"));
        for (int k = 0; k < n; k++) {
            SyntheticTargets.write(in, String.format("sys-%04d", k), k, days, cadence);
        }
        // warm-up of the code paths (not counted)
        run(in, work.resolve("warm"), 2, Math.min(n, 6));
        double[] one = run(in, work.resolve("one"), 1, n);
        double[] two = run(in, work.resolve("two"), 2, n);
        System.out.printf(Locale.ROOT, "%d targets of %.0f d at %.0f min; cores seen: %d%n", n, days, cadence,
                Runtime.getRuntime().availableProcessors());
        report("1 thread ", n, one);
        report("2 threads", n, two);
        System.out.printf(Locale.ROOT, "speed-up 1 -> 2 threads (wall): %.2f%n", one[0] / two[0]);
    }

    private static void report(String what, int n, double[] wallCpu) {
        System.out.printf(Locale.ROOT, "%s: wall %.1f s, CPU %.1f s, %.2f s CPU per target, %.0f targets per "
                + "core-hour, %d failed%n", what, wallCpu[0], wallCpu[1], wallCpu[1] / n, n / (wallCpu[1] / 3600),
                (long) wallCpu[2]);
    }

    /** Wall seconds, CPU seconds of the process, failed targets. */
    private static double[] run(Path in, Path out, int threads, int count) {
        List<BatchTarget> targets = TargetDiscovery.fromFolder(in, out).subList(0, count);
        var os = (com.sun.management.OperatingSystemMXBean) ManagementFactory.getOperatingSystemMXBean();
        long cpu0 = os.getProcessCpuTime();
        long t0 = System.nanoTime();
        BatchRunner.Outcome o = new BatchRunner(new AnalysisUnit(AnalysisSettings.defaults()), threads, false)
                .run(targets, out, BatchRunner.Progress.NONE);
        return new double[] {(System.nanoTime() - t0) * 1e-9, (os.getProcessCpuTime() - cpu0) * 1e-9, o.failed()};
    }
}
