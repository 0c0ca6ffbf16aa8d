package org.twinlight.bench;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Set;
import org.twinlight.dimensions.BinaryElements;
import org.twinlight.dimensions.DimensionsPropagation;
import org.twinlight.velocity.SyntheticVelocities;
import org.twinlight.velocity.VelocityData;
import org.twinlight.velocity.VelocityFitResult;
import org.twinlight.velocity.VelocityFitSettings;
import org.twinlight.velocity.VelocityFitter;
import org.twinlight.velocity.VelocityParameters;

/**
 * Times the propagation of errors into absolute dimensions (10,000 draws) and measures the pull
 * distributions of the velocity fit over many noise seeds: a circular orbit with two
 * instruments, an eccentric one with e and ω free, and one with errors understated fourfold and
 * the jitter fitted. Run with
 * {@code java -cp target/classes:target/test-classes:$(deps) org.twinlight.bench.DimensionsBench [seeds]}.
 */
public final class DimensionsBench {

    private DimensionsBench() {
    }

    public static void main(String[] args) {
        int seeds = args.length > 0 ? Integer.parseInt(args[0]) : 500;
        if (args.length > 1 && args[1].equals("eccentric")) {
            eccentricPulls(seeds);
            return;
        }
        if (args.length > 1 && args[1].equals("command")) {
            timeCommand();
            return;
        }
        timePropagation();
        timeCommand();
        eccentricPulls(seeds);
        VelocityParameters circular = new VelocityParameters(3.2145, 2460100.3812, 0.0, 90.0, 78.0, 96.5, -14.2,
                new double[] {0.0, 2.3}, 0.0, 0.0);
        pulls("circular, 2 instruments, 30 epochs", circular, Set.of(), false, 1.0, seeds);
        VelocityParameters eccentric = new VelocityParameters(5.71, 2460200.0, 0.25, 140.0, 55.0, 70.0, 3.0,
                new double[] {0.0}, 0.0, 0.0);
        pulls("e = 0.25, e and omega free, 40 epochs", eccentric, Set.of("eccentricity", "omega"), false, 1.0, seeds);
        pulls("errors stated 4x too small, jitter fitted", circular, Set.of(), true, 0.25, seeds);
        // small sets: errors never scaled down on a chance chi2/nu < 1 (expected spread 0.93-0.94 for
        // nu = 5-9 under max(1, chi2/nu), 3.5 % beyond 2 sigma)
        VelocityParameters single = new VelocityParameters(3.418276, 2460412.63415, 0.0, 90.0, 30.0, 40.0, -12.0,
                new double[] {0.0}, 0.0, 0.0);
        for (int epochs : new int[] {4, 6}) {
            pulls("small set, " + epochs + " epochs (" + 2 * epochs + " velocities), sigma 5 km/s", single, Set.of(),
                    false, 1.0, 5.0, epochs, 4 * seeds);
        }
    }

    /**
     * The eccentric system of {@code OrbitErrorsInDimensionsTest} over many seeds: dimensions'
     * pulls with K refitted per draw of (P, e, ω) and weighted by the velocities, and the former
     * way (K fitted once at the light curve's orbit, independent of the drawn orbit).
     */
    private static void eccentricPulls(int seeds) {
        for (boolean refit : new boolean[] {true, false}) {
            long t0 = System.nanoTime();
            double[][] pulls = org.twinlight.dimensions.EccentricSystemInjection.pulls(seeds, 30, 4000, refit);
            System.out.printf(Locale.ROOT, "eccentric system (e = 0.30 +- 0.04, omega = 140 +- 6 deg), %d seeds, %s "
                    + "(%.0f ms per seed, mean effective draws %.0f of 4000):%n", seeds,
                    refit ? "K refitted per draw, weighted by the velocities" : "K fixed at the light curve's orbit",
                    (System.nanoTime() - t0) / 1e6 / seeds,
                    refit ? org.twinlight.dimensions.EccentricSystemInjection.lastEffectiveDraws() : 4000.0);
            for (int q = 0; q < pulls.length; q++) {
                double[] p = pulls[q];
                double mean = java.util.Arrays.stream(p).average().orElseThrow();
                System.out.printf(Locale.ROOT, "  %-16s pull mean %+.3f, spread %.3f, within 1 sigma %.1f%%, within "
                        + "1.96 sigma %.1f%%%n", org.twinlight.dimensions.EccentricSystemInjection.CHECKED[q].name(),
                        mean, org.twinlight.dimensions.EccentricSystemInjection.spread(p),
                        100 * org.twinlight.dimensions.EccentricSystemInjection.within(p, 1),
                        100 * org.twinlight.dimensions.EccentricSystemInjection.within(p, 1.959964));
            }
        }
    }

    private static void timePropagation() {
        BinaryElements el = new BinaryElements(3.2145, 0.02, 87.5, 95.0, 118.0, 0.105, 0.071, 6400, Double.NaN, 0.62);
        double[] s = {1e-6, 0.004, 0.3, 0.5, 0.7, 0.001, 0.001, 100, 0, 0.01};
        double[][] cov = new double[10][10];
        for (int i = 0; i < 10; i++) {
            cov[i][i] = s[i] * s[i];
        }
        cov[2][6] = cov[6][2] = -0.8 * s[2] * s[6];
        for (int w = 0; w < 5; w++) {
            DimensionsPropagation.propagate(el, cov, 10_000, w);
        }
        int runs = 20;
        long t0 = System.nanoTime();
        for (int r = 0; r < runs; r++) {
            DimensionsPropagation.propagate(el, cov, 10_000, 100 + r);
        }
        double ms = (System.nanoTime() - t0) / 1e6 / runs;
        long c0 = System.nanoTime();
        DimensionsPropagation.propagate(el, cov, 10_000, 999);
        System.out.printf(Locale.ROOT, "propagation, 10,000 draws: %.1f ms warm (mean of %d), %.1f ms this run%n", ms,
                runs, (System.nanoTime() - c0) / 1e6);
    }

    /**
     * The whole dimensions command in this JVM (files read, 10,000 draws, JSON, table and two PNGs
     * written), warm, with given K and with a velocity file of an eccentric orbit (K refitted per
     * draw); then where its time goes, phase by phase.
     */
    private static void timeCommand() {
        try {
            java.nio.file.Path dir = java.nio.file.Files.createTempDirectory("dimensions-bench");
            java.nio.file.Path fit = java.nio.file.Files.writeString(dir.resolve("fit.json"), """
                    {"parameters": {
                      "period": {"value": 5.71, "uncertainty": 2e-5, "free": true},
                      "radius1": {"value": 0.090, "uncertainty": 0.0012, "free": true},
                      "radius2": {"value": 0.070, "uncertainty": 0.0012, "free": true},
                      "inclination": {"value": 86.5, "uncertainty": 0.3, "free": true},
                      "eccentricity": {"value": 0.31, "uncertainty": 0.04, "free": true},
                      "omega": {"value": 137.0, "uncertainty": 6.0, "free": true},
                      "surfaceBrightnessRatio": {"value": 0.62, "uncertainty": 0.01, "free": true}},
                     "correlation": {"names": ["radius1", "radius2", "inclination", "eccentricity", "omega"],
                       "matrix": [[1,0.4,-0.5,0,0],[0.4,1,-0.8,0.3,0],[-0.5,-0.8,1,0,0],[0,0.3,0,1,0.6],
                                  [0,0,0,0.6,1]]},
                     "model": {"period": 5.71, "epoch": 2460200.0, "radius1": 0.090, "radius2": 0.070,
                       "inclination": 86.5, "eccentricity": 0.31, "omega": 137.0, "surfaceBrightnessRatio": 0.62},
                     "timeScale": "BJD_TDB"}
                    """);
            VelocityParameters truth = new VelocityParameters(5.71, 2460200.0, 0.30, 140.0, 55.0, 70.0, 3.0,
                    new double[] {0.0}, 0.0, 0.0);
            VelocityData d = SyntheticVelocities.make(truth, 30, 1.5, 2.5, 1, 1.0, 3);
            StringBuilder csv = new StringBuilder("# time scale: BJD_TDB\ntime,v1,v1_err,v2,v2_err\n");
            for (int i = 0; i < d.star1().size(); i++) {
                csv.append(String.format(Locale.ROOT, "%.6f,%.4f,1.5,%.4f,2.5%n", d.star1().timesDays()[i],
                        d.star1().velocitiesKms()[i], d.star2().velocitiesKms()[i]));
            }
            java.nio.file.Path rv = java.nio.file.Files.writeString(dir.resolve("rv.csv"), csv);
            String[][] cases = {
                {"--k1", "55", "--k1-error", "0.4", "--k2", "70", "--k2-error", "0.6", "--teff1", "6400",
                    "--teff1-error", "100"},
                {"--velocities", rv.toString(), "--teff1", "6400", "--teff1-error", "100"}};
            for (String[] options : cases) {
                for (int run = 1; run <= 6; run++) {
                    java.util.List<String> args = new java.util.ArrayList<>(java.util.List.of("dimensions", "--fit",
                            fit.toString(), "--draws", "10000", "--out", dir.resolve("out").toString()));
                    args.addAll(java.util.List.of(options));
                    java.lang.management.ThreadMXBean threads = java.lang.management.ManagementFactory.getThreadMXBean();
                    long c0 = threads.getCurrentThreadCpuTime();
                    long t0 = System.nanoTime();
                    int code = org.twinlight.cli.TwinlightCommand.commandLine()
                            .setOut(new java.io.PrintWriter(java.io.Writer.nullWriter()))
                            .execute(args.toArray(new String[0]));
                    System.out.printf(Locale.ROOT, "dimensions command in-process (%s), run %d: %.0f ms wall, %.0f ms "
                            + "CPU of this thread (exit %d)%n", options[0].equals("--k1") ? "K given"
                            : "velocities, eccentric, K refitted per draw", run, (System.nanoTime() - t0) / 1e6,
                            (threads.getCurrentThreadCpuTime() - c0) / 1e6, code);
                }
            }
            phases(fit, dir);
        } catch (java.io.IOException e) {
            throw new java.io.UncheckedIOException(e);
        }
    }

    /** Where a warm command's time goes: reading, the draws, JSON, table, the two PNGs. */
    private static void phases(java.nio.file.Path fit, java.nio.file.Path dir) {
        BinaryElements el = new BinaryElements(5.71, 0.31, 86.5, 55, 70, 0.09, 0.07, 6400, Double.NaN, 0.62);
        double[][] cov = new double[11][11];
        double[] s = {2e-5, 0.04, 0.3, 0.4, 0.6, 0.0012, 0.0012, 100, 0, 0.01, 6};
        for (int i = 0; i < 11; i++) {
            cov[i][i] = s[i] * s[i];
        }
        for (int run = 0; run < 3; run++) {
            long t0 = System.nanoTime();
            org.twinlight.report.FitJsonInput.read(fit);
            long t1 = System.nanoTime();
            DimensionsPropagation.Result r = DimensionsPropagation.propagate(new DimensionsPropagation.Inputs(el, 137,
                    cov, null, null), 10_000, run);
            long t2 = System.nanoTime();
            org.twinlight.report.DimensionsFiles.table(r, List.of(), "bench");
            long t3 = System.nanoTime();
            org.twinlight.report.DimensionsPlots.massRadius(r, dir.resolve("mr.png"), "bench");
            long t4 = System.nanoTime();
            org.twinlight.report.DimensionsPlots.massLuminosity(r, dir.resolve("ml.png"), "bench");
            long t5 = System.nanoTime();
            System.out.printf(Locale.ROOT, "phases, run %d: read fit.json %.0f ms, 10,000 draws %.0f ms, table %.1f ms, "
                    + "mass-radius.png %.0f ms, mass-luminosity.png %.0f ms%n", run + 1, (t1 - t0) / 1e6,
                    (t2 - t1) / 1e6, (t3 - t2) / 1e6, (t4 - t3) / 1e6, (t5 - t4) / 1e6);
        }
    }

    private static void pulls(String label, VelocityParameters truth, Set<String> free, boolean jitter,
            double statedFraction, int seeds) {
        pulls(label, truth, free, jitter, statedFraction, Double.NaN, free.isEmpty() ? 30 : 40, seeds);
    }

    /** Pulls over seeds; {@code sigma} NaN for the 1.5 and 2.5 km/s of the large sets. */
    private static void pulls(String label, VelocityParameters truth, Set<String> free, boolean jitter,
            double statedFraction, double sigma, int epochs, int seeds) {
        String[] names = free.isEmpty() ? new String[] {"k1", "k2", "gamma"}
                : new String[] {"k1", "k2", "gamma", "eccentricity", "omega"};
        double[] truths = {truth.k1Kms(), truth.k2Kms(), truth.gammaKms(), truth.eccentricity(), truth.omegaDeg()};
        List<List<Double>> pulls = new ArrayList<>();
        for (int k = 0; k < names.length; k++) {
            pulls.add(new ArrayList<>());
        }
        List<String> refused = new ArrayList<>();
        long t0 = System.nanoTime();
        for (int seed = 1; seed <= seeds; seed++) {
            VelocityData d = SyntheticVelocities.make(truth, epochs, Double.isNaN(sigma) ? 1.5 : sigma,
                    Double.isNaN(sigma) ? 2.5 : sigma, truth.instrumentCount(), statedFraction, seed);
            VelocityParameters start = new VelocityParameters(truth.periodDays(), truth.epochDays(),
                    truth.eccentricity() * 0.5, truth.omegaDeg() + 20, truth.k1Kms() * 0.8, truth.k2Kms() * 1.2,
                    truth.gammaKms() + 5, new double[truth.instrumentCount()], 0.0, 0.0);
            VelocityFitResult r;
            try {
                r = VelocityFitter.fit(d, start, new VelocityFitSettings(free, 0, jitter, 200));
            } catch (org.twinlight.BadInputException | org.twinlight.WorkFailedException e) {
                refused.add(e.getClass().getSimpleName() + ": " + e.getMessage());
                continue;
            }
            for (int k = 0; k < names.length; k++) {
                pulls.get(k).add((r.estimate(names[k]).value() - truths[k]) / r.estimate(names[k]).uncertainty());
            }
        }
        System.out.printf(Locale.ROOT, "%s, %d seeds (%.1f ms per fit), %d refused:%n", label, seeds,
                (System.nanoTime() - t0) / 1e6 / seeds, refused.size());
        refused.stream().limit(3).forEach(m -> System.out.println("  refused: " + m));
        System.out.println("  refused as bad input: " + refused.stream().filter(m -> m.startsWith("Bad")).count());
        for (int k = 0; k < names.length; k++) {
            double[] p = pulls.get(k).stream().mapToDouble(Double::doubleValue).toArray();
            double mean = java.util.Arrays.stream(p).average().orElseThrow();
            double sd = Math.sqrt(java.util.Arrays.stream(p).map(v -> (v - mean) * (v - mean)).sum() / (p.length - 1));
            long inside = java.util.Arrays.stream(p).filter(v -> Math.abs(v) <= 1).count();
            long beyond2 = java.util.Arrays.stream(p).filter(v -> Math.abs(v) > 2).count();
            System.out.printf(Locale.ROOT, "  %-13s pull mean %+.3f, spread %.3f, |pull| <= 1 in %.1f%%, > 2 in %.1f%%%n",
                    names[k], mean, sd, 100.0 * inside / p.length, 100.0 * beyond2 / p.length);
        }
    }
}
