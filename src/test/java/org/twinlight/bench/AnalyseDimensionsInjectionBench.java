package org.twinlight.bench;

import java.lang.management.ManagementFactory;
import java.lang.management.ThreadMXBean;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.Random;
import org.twinlight.analysis.AnalysedCurves;
import org.twinlight.analysis.AnalysisOutcome;
import org.twinlight.analysis.AnalysisRequest;
import org.twinlight.analysis.AnalysisSettings;
import org.twinlight.analysis.TargetAnalysis;
import org.twinlight.eclipse.BinaryParameters;
import org.twinlight.orbit.RadialVelocityCurve;

/**
 * The masses {@code analyse} gives with its stages after the fit, over {@code args[0]} noise seeds
 * (default 20): the space-like synthetic binary of the analysis tests ({@link AnalysedCurves#SPACE},
 * period given) with 30 velocities of each star (K1 = 62, K2 = 85 km/s, errors 1.5 and 2.0 km/s),
 * (a) fitted jointly ({@code velocities}) and (b) with K1, K2 given as the truth plus a normal error
 * of the stated 0.5 km/s ({@code k1}, {@code k2}). Per mode the mean and spread of the pulls
 * (M − truth)/σ of both masses — near 0 and 1 when the errors are honest — with the truth from
 * Kepler's third law, M1 sin³i = (1 − e²)^{3/2} (K1 + K2)² K2 P / (2π G) (Hilditch 2001, An
 * Introduction to Close Binary Stars, §2.5, from memory) in nominal solar masses (GM = 1.3271244e20
 * m³ s⁻², IAU 2015 Resolution B3). Run with
 * {@code java -cp target/classes:target/test-classes:$(cat cp.txt) org.twinlight.bench.AnalyseDimensionsInjectionBench 20}.
 */
public final class AnalyseDimensionsInjectionBench {
    private static final double K1 = 62.0;
    private static final double K2 = 85.0;
    private static final double K_ERROR = 0.5;

    private AnalyseDimensionsInjectionBench() {
    }

    public static void main(String[] args) throws Exception {
        int seeds = args.length > 0 ? Integer.parseInt(args[0]) : 20;
        BinaryParameters truth = AnalysedCurves.SPACE;
        double[] trueMass = new double[3];
        for (int star = 1; star <= 2; star++) {
            double k1 = K1 * 1e3;
            double k2 = K2 * 1e3;
            double e = truth.eccentricity();
            trueMass[star] = Math.pow(1 - e * e, 1.5) * (k1 + k2) * (k1 + k2) * (star == 1 ? k2 : k1)
                    * truth.periodDays() * 86400 / (2 * Math.PI * 1.3271244e20)
                    / Math.pow(Math.sin(Math.toRadians(truth.inclinationDeg())), 3);
        }
        ThreadMXBean cpu = ManagementFactory.getThreadMXBean();
        long t0 = cpu.getCurrentThreadCpuTime();
        for (String mode : List.of("velocities", "given")) {
            double[][] pulls = new double[3][seeds];
            int ok = 0;
            for (int s = 0; s < seeds; s++) {
                long seed = 2000 + s;
                Path dir = AnalysedCurves.root().resolve("bench-dimensions-" + mode + "-" + seed);
                Path lc = AnalysedCurves.writeSpace(Path.of(dir + ".csv"), seed);
                AnalysisSettings st = AnalysisSettings.defaults().withFiles(List.of(lc.toString()))
                        .withEphemeris(truth.periodDays(), null).with("starts", 2).with("draws", 2000);
                // scrambled: the first draws of java.util.Random from consecutive seeds are correlated
                Random rng = new Random(new java.util.SplittableRandom(seed).nextLong());
                if (mode.equals("velocities")) {
                    st = st.with("velocities", List.of(velocities(Path.of(dir + "-rv.csv"), truth, rng).toString()));
                } else {
                    st = st.with("k1", K1 + K_ERROR * rng.nextGaussian()).with("k1Error", K_ERROR)
                            .with("k2", K2 + K_ERROR * rng.nextGaussian()).with("k2Error", K_ERROR);
                }
                AnalysisOutcome o = TargetAnalysis.run(new AnalysisRequest(st, dir));
                if (o.exitCode() != 0 || !o.keyResults().containsKey("mass1")) {
                    System.out.printf(Locale.ROOT, "%s seed %d: exit %d: %s%n", mode, seed, o.exitCode(), o.message());
                    continue;
                }
                for (int star = 1; star <= 2; star++) {
                    AnalysisOutcome.Value v = o.keyResults().get("mass" + star);
                    pulls[star][ok] = (v.value() - trueMass[star]) / v.uncertainty();
                }
                ok++;
            }
            System.out.printf(Locale.ROOT, "%s: %d of %d runs exit 0 with masses%n", mode, ok, seeds);
            for (int star = 1; star <= 2; star++) {
                double mean = 0;
                for (int i = 0; i < ok; i++) {
                    mean += pulls[star][i] / ok;
                }
                double var = 0;
                int beyond2 = 0;
                for (int i = 0; i < ok; i++) {
                    var += (pulls[star][i] - mean) * (pulls[star][i] - mean) / Math.max(1, ok - 1);
                    beyond2 += Math.abs(pulls[star][i]) > 2 ? 1 : 0;
                }
                System.out.printf(Locale.ROOT, "  mass%d: pull mean %+.2f, spread %.2f, |pull| > 2 in %d of %d%n",
                        star, mean, Math.sqrt(var), beyond2, ok);
            }
        }
        System.out.printf(Locale.ROOT, "main thread CPU %.1f s; load average %.2f%n",
                (cpu.getCurrentThreadCpuTime() - t0) / 1e9,
                ManagementFactory.getOperatingSystemMXBean().getSystemLoadAverage());
    }

    /** 30 velocities of each star over 40 orbits with Gaussian errors 1.5 and 2.0 km/s. */
    private static Path velocities(Path f, BinaryParameters truth, Random rng) throws Exception {
        RadialVelocityCurve c = new RadialVelocityCurve(truth.periodDays(), truth.epochDays(), truth.eccentricity(),
                truth.omegaDeg());
        StringBuilder sb = new StringBuilder("# time scale: BJD_TDB\ntime,v1,v1_err,v2,v2_err\n");
        for (int i = 0; i < 30; i++) {
            double t = 2460000 + 40 * truth.periodDays() * rng.nextDouble();
            double s = c.shape(t);
            sb.append(String.format(Locale.ROOT, "%.5f,%.3f,1.5,%.3f,2.0%n", t, -5.1 + K1 * s + 1.5 * rng.nextGaussian(),
                    -5.1 - K2 * s + 2.0 * rng.nextGaussian()));
        }
        return Files.writeString(f, sb.toString());
    }
}
