package org.twinlight.bench;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.twinlight.eclipse.BinaryModel;
import org.twinlight.eclipse.BinaryParameters;
import org.twinlight.eclipse.ModelFile;
import org.twinlight.eclipse.SyntheticLightCurve;
import org.twinlight.fit.CalibrationRuns;
import org.twinlight.fit.EclipseFitter;
import org.twinlight.fit.FitData;
import org.twinlight.fit.FitProblem;
import org.twinlight.fit.FitResult;
import org.twinlight.fit.FitSettings;
import org.twinlight.fit.NoiseReport;
import org.twinlight.photometry.LightCurve;
import org.twinlight.time.TimeScale;
import org.twinlight.fit.CalibrationRuns.Geometry;
import org.twinlight.fit.CalibrationRuns.Noise;
import org.twinlight.fit.CalibrationRuns.Outcome;
import org.twinlight.fit.NoiseDiagnostics;

/**
 * The large version of {@code NoiseCalibrationTest}: over many noise seeds, for total and partial
 * eclipses with white and with correlated noise, how often the ±1σ and ±1.96σ intervals of the
 * covariance errors and of the quoted errors contain the truth, and the spread of the pulls per
 * parameter. The figures are kept in {@code docs/uncertainties.md}. Run with
 * {@code java -cp target/classes:target/test-classes:$(deps) org.twinlight.bench.CalibrationBench [SEEDS [SHIFTS]]}; with SEEDS 0 it times the fit and
 * its diagnostics on 20,000 points instead.
 */
public final class CalibrationBench {

    private CalibrationBench() {
    }

    /** Wall time of the fit and of its noise diagnostics on 20,000 points at a 2-minute cadence. */
    static void speed() {
        BinaryParameters truth = Geometry.PARTIAL.truth();
        double[] t = SyntheticLightCurve.regularTimes(2460000.0, 2460000.0 + 20000 * 2.0 / 1440 - 1e-6, 2.0, List.of(),
                null);
        LightCurve lc = SyntheticLightCurve.observe(new BinaryModel(truth), t, 1000, 7, "speed", "V",
                TimeScale.BJD_TDB);
        for (int round = 0; round < 4; round++) {
            long t0 = System.nanoTime();
            FitProblem problem = FitProblem.of(ModelFile.of(truth.withInclinationDeg(86.3)),
                    List.of(new FitData(lc, "V")), FitSettings.defaults());
            FitResult r = EclipseFitter.optimize(problem);
            long t1 = System.nanoTime();
            NoiseReport n = NoiseDiagnostics.of(problem, r);
            long t2 = System.nanoTime();
            System.out.printf(Locale.ROOT, "%d points: fit %.2f s, noise diagnostics (%d shifts) %.2f s, beta %.2f%n",
                    lc.size(), (t1 - t0) / 1e9, n.shifts(), (t2 - t1) / 1e9, n.beta());
        }
    }

    public static void main(String[] args) {
        int seeds = args.length > 0 ? Integer.parseInt(args[0]) : 100;
        int shifts = args.length > 1 ? Integer.parseInt(args[1]) : NoiseDiagnostics.MAX_SHIFTS;
        if (seeds == 0) {
            speed();
            return;
        }
        System.out.println("| eclipse | noise | errors | coverage 68 % | coverage 95 % | pull spread per parameter | median β |");
        System.out.println("|---|---|---|---|---|---|---|");
        for (Geometry g : Geometry.values()) {
            for (Noise noise : List.of(Noise.WHITE, Noise.RED)) {
                long t0 = System.nanoTime();
                List<Outcome> runs = new ArrayList<>();
                for (long seed = 1; seed <= seeds; seed++) {
                    runs.add(CalibrationRuns.run(g, noise, 1000 * g.ordinal() + seed, shifts));
                }
                double seconds = (System.nanoTime() - t0) / 1e9;
                double[] betas = runs.stream().mapToDouble(Outcome::beta).sorted().toArray();
                for (boolean quoted : new boolean[] {false, true}) {
                    Map<String, List<Double>> pulls = CalibrationRuns.byParameter(runs, quoted);
                    List<Double> all = pulls.values().stream().flatMap(List::stream).toList();
                    StringBuilder spreads = new StringBuilder();
                    pulls.forEach((k, v) -> spreads.append(String.format(Locale.ROOT, "%s %.2f; ", k,
                            CalibrationRuns.spread(v))));
                    System.out.printf(Locale.ROOT, "| %s | %s | %s | %.1f %% | %.1f %% | %s| %.2f |%n",
                            g.name().toLowerCase(Locale.ROOT), noise.redPpm() > 0 ? "red" : "white",
                            quoted ? "quoted" : "covariance", 100 * CalibrationRuns.coverage(all, 1.0),
                            100 * CalibrationRuns.coverage(all, 1.959964), spreads, betas[betas.length / 2]);
                }
                System.out.printf(Locale.ROOT, "(%d seeds, %.1f s, %.2f s per fit with its diagnostics)%n", seeds,
                        seconds, seconds / seeds);
            }
        }
    }
}
