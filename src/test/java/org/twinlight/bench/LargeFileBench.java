package org.twinlight.bench;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.lang.management.ManagementFactory;
import java.lang.management.MemoryPoolMXBean;
import java.lang.management.MemoryType;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import org.twinlight.cli.TwinlightCommand;
import picocli.CommandLine;

/**
 * Big files in little memory: a synthetic light curve of N rows (default 2,000,000; 1-minute
 * cadence, 1000 ppm noise) made by {@code simulate}, then {@code inspect} and a 5-parameter
 * {@code fit} of it, each timed once (wall clock) with the peak of the Java heap during the
 * command. Run with the heap the targets name:
 * {@code java -Xmx512m -cp $CP org.twinlight.bench.LargeFileBench [N]}.
 * Targets (2,000,000 rows, -Xmx512m): inspect ≤ 5 s, fit ≤ 30 s.
 */
public final class LargeFileBench {
    private static final String MODEL = """
            {"period": 2.61, "epoch": 2460300.25, "radius1": 0.13, "radius2": 0.09, "inclination": 88.0,
             "surfaceBrightnessRatio": 0.6,
             "limbDarkening1": {"law": "quadratic", "coefficients": [0.4, 0.2]},
             "limbDarkening2": {"law": "quadratic", "coefficients": [0.45, 0.2]}}
            """;
    private static final String START = MODEL.replace("0.13", "0.125").replace("88.0", "87.6")
            .replace("0.6,", "0.63,").replace("2460300.25", "2460300.252");

    private LargeFileBench() {
    }

    public static void main(String[] args) throws Exception {
        int n = args.length > 0 ? Integer.parseInt(args[0]) : 2_000_000;
        Path dir = Files.createTempDirectory("twinlight-large");
        Path model = Files.writeString(dir.resolve("model.json"), MODEL);
        Path start = Files.writeString(dir.resolve("start.json"), START);
        Path csv = dir.resolve("large.csv");
        double end = 2460300 + (n - 1) / 1440.0;
        run("simulate", "--model", model.toString(), "--start", "2460300", "--end", Double.toString(end),
                "--cadence", "1", "--noise-ppm", "1000", "--time-scale", "BJD_TDB", "--out", csv.toString());
        System.out.printf(Locale.ROOT, "%d rows, %.1f MB, max heap %d MB, %d cores%n", n, Files.size(csv) / 1e6,
                Runtime.getRuntime().maxMemory() >> 20, Runtime.getRuntime().availableProcessors());
        measure("inspect", "inspect", csv.toString());
        measure("fit (5 free)", "fit", csv.toString(), "--model", start.toString(), "--out",
                dir.resolve("fit").toString());
    }

    private static void measure(String label, String... args) {
        System.gc();
        ManagementFactory.getMemoryPoolMXBeans().forEach(MemoryPoolMXBean::resetPeakUsage);
        com.sun.management.OperatingSystemMXBean os =
                (com.sun.management.OperatingSystemMXBean) ManagementFactory.getOperatingSystemMXBean();
        long cpu0 = os.getProcessCpuTime();
        long t0 = System.nanoTime();
        String out;
        try {
            out = run(args);
        } catch (OutOfMemoryError e) {
            out = "";
            System.out.printf(Locale.ROOT, "%-14s out of memory after %.1f s (%s)%n", label,
                    (System.nanoTime() - t0) / 1e9, e.getStackTrace().length > 0 ? e.getStackTrace()[0] : "");
        }
        double seconds = (System.nanoTime() - t0) / 1e9;
        double cpuSeconds = (os.getProcessCpuTime() - cpu0) / 1e9;
        long peak = 0;
        for (MemoryPoolMXBean pool : ManagementFactory.getMemoryPoolMXBeans()) {
            if (pool.getType() == MemoryType.HEAP) {
                peak += pool.getPeakUsage().getUsed();
            }
        }
        System.out.printf(Locale.ROOT, "%-14s %6.2f s wall, %6.2f s CPU (all threads), peak heap %4d MB, "
                + "load average %.1f%n", label, seconds, cpuSeconds, peak >> 20, os.getSystemLoadAverage());
        String last = out.lines().filter(l -> l.startsWith("n = ") || l.contains("points")).findFirst().orElse("");
        System.out.println("    " + last);
    }

    private static String run(String... args) {
        CommandLine cl = TwinlightCommand.commandLine();
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        cl.setOut(new PrintWriter(out, true));
        cl.setErr(new PrintWriter(err, true));
        int code = cl.execute(args);
        if (code != 0) {
            throw new IllegalStateException(String.join(" ", args) + " failed (" + code + "): " + err);
        }
        return out.toString();
    }
}
