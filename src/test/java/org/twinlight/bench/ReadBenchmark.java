package org.twinlight.bench;

import java.io.BufferedWriter;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.Random;
import org.twinlight.photometry.FitsFixture;
import org.twinlight.photometry.LightCurve;
import org.twinlight.photometry.LightCurveReader;
import org.twinlight.photometry.LightCurveSummary;
import org.twinlight.photometry.ReadOptions;

/**
 * Reading speed for large light curves: a synthetic CSV and a synthetic FITS table of N rows
 * (default 1,000,000), each read five times after two warm-up reads, and the summary computed three times after one.
 * Run: {@code java -cp target/classes:target/test-classes:<deps> org.twinlight.bench.ReadBenchmark [N]}.
 */
public final class ReadBenchmark {

    private ReadBenchmark() {
    }

    public static void main(String[] args) throws IOException {
        int n = args.length > 0 ? Integer.parseInt(args[0]) : 1_000_000;
        Path dir = Files.createTempDirectory("twinlight-bench");
        Random random = new Random(1);
        double[] t = new double[n];
        double[] f = new double[n];
        float[] e = new float[n];
        int[] q = new int[n];
        Path csv = dir.resolve("bench.csv");
        try (BufferedWriter w = Files.newBufferedWriter(csv, StandardCharsets.UTF_8)) {
            w.write("time,flux,flux_err,quality\n");
            for (int i = 0; i < n; i++) {
                t[i] = 2000.0 + i * (2.0 / 1440);
                f[i] = 1 + 1e-3 * random.nextGaussian();
                e[i] = 1e-3f;
                q[i] = i % 1000 == 0 ? 1 : 0;
                w.write(String.format(Locale.ROOT, "%.8f,%.7f,0.001,%d%n", t[i], f[i], q[i]));
            }
        }
        Path fits = dir.resolve("bench.fits");
        new FitsFixture().table(new FitsFixture.Table().column("TIME", t).column("FLUX", f).column("FLUX_ERR", e)
                .column("QUALITY", q).key("TIMESYS", "TDB").key("TIMEREF", "SOLARSYSTEM").key("TIMEUNIT", "d")
                .key("BJDREFI", 2457000)).write(fits);
        for (Path p : new Path[] {csv, fits}) {
            for (int i = 0; i < 2; i++) {
                LightCurveReader.read(p, ReadOptions.defaults());
            }
            long start = System.nanoTime();
            LightCurve lc = null;
            for (int i = 0; i < 5; i++) {
                lc = LightCurveReader.read(p, ReadOptions.defaults());
            }
            double readMs = (System.nanoTime() - start) / 5e6;
            LightCurveSummary s = LightCurveSummary.of(lc, 0.5);
            start = System.nanoTime();
            for (int i = 0; i < 3; i++) {
                s = LightCurveSummary.of(lc, 0.5);
            }
            double summaryMs = (System.nanoTime() - start) / 3e6;
            System.out.printf(Locale.ROOT, "%s: %d rows, %d used: read %.0f ms, summary %.0f ms (%d outliers)%n",
                    p.getFileName(), n, lc.size(), readMs, summaryMs, s.outlierCount());
            Files.delete(p);
        }
        Files.delete(dir);
    }
}
