package org.twinlight.bench;

import java.util.List;
import java.util.Locale;
import org.twinlight.fit.CalibrationRuns;
import org.twinlight.fit.CalibrationRuns.Geometry;
import org.twinlight.fit.CalibrationRuns.Noise;
import org.twinlight.fit.EclipseFitter;
import org.twinlight.fit.FitProblem;
import org.twinlight.fit.FitResult;
import org.twinlight.fit.NoiseDiagnostics;
import org.twinlight.fit.NoiseReport;
import org.twinlight.fit.Posterior;
import org.twinlight.fit.PosteriorSampler;
import org.twinlight.sampling.Marginal;
import org.twinlight.sampling.SamplerSettings;
import org.twinlight.sampling.SamplingProgress;

/**
 * Coverage of the posterior's 68 % and 95 % intervals over the synthetic curves of
 * {@link CalibrationRuns}, with the likelihood as the sampler has it and with the errors inflated
 * by max(1, β) ({@code --inflate-errors beta}). Figures in docs/uncertainties.md. Run with
 * {@code java -cp target/classes:target/test-classes:$(deps) org.twinlight.bench.PosteriorCalibrationBench [SEEDS [GEOMETRY [red|white]]]}.
 */
public final class PosteriorCalibrationBench {
    private PosteriorCalibrationBench() {
    }

    public static void main(String[] args) {
        int seeds = args.length > 0 ? Integer.parseInt(args[0]) : 20;
        Geometry g = args.length > 1 ? Geometry.valueOf(args[1].toUpperCase(Locale.ROOT)) : Geometry.PARTIAL;
        Noise noise = args.length > 2 && args[2].equals("white") ? Noise.WHITE : Noise.RED;
        int[] in68 = new int[2];
        int[] in95 = new int[2];
        int total = 0;
        int unconverged = 0;
        long t0 = System.nanoTime();
        for (long seed = 1; seed <= seeds; seed++) {
            FitProblem problem = CalibrationRuns.problem(g, noise, 7000 + seed);
            FitResult best = EclipseFitter.optimize(problem);
            NoiseReport report = NoiseDiagnostics.of(problem, best);
            for (int inflated = 0; inflated < 2; inflated++) {
                FitResult from = inflated == 1 ? NoiseDiagnostics.forInflatedSampling(best, report.inflation()) : best;
                Posterior p = PosteriorSampler.sample(problem, from, SamplerSettings.of(32, 20000, seed, 2),
                        SamplingProgress.NONE, () -> false);
                unconverged += p.convergence().converged() ? 0 : 1;
                for (String name : CalibrationRuns.FREE) {
                    Marginal m = p.marginals().get(p.column(name));
                    double truth = CalibrationRuns.truthValue(g.truth(), name);
                    in68[inflated] += truth >= m.lower68() && truth <= m.upper68() ? 1 : 0;
                    in95[inflated] += truth >= m.lower95() && truth <= m.upper95() ? 1 : 0;
                }
            }
            total += CalibrationRuns.FREE.size();
        }
        for (int inflated = 0; inflated < 2; inflated++) {
            System.out.printf(Locale.ROOT, "| %s | %s | %s | %.1f %% | %.1f %% |%n", g.name().toLowerCase(Locale.ROOT),
                    noise.redPpm() > 0 ? "red" : "white", inflated == 1 ? "posterior, errors x max(1, beta)"
                            : "posterior", 100.0 * in68[inflated] / total, 100.0 * in95[inflated] / total);
        }
        System.out.printf(Locale.ROOT, "(%d curves, %d chains not converged, %.0f s)%n", seeds, unconverged,
                (System.nanoTime() - t0) / 1e9);
    }
}
