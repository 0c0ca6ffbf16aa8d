package org.twinlight.bench;

import java.lang.management.ManagementFactory;
import java.lang.management.OperatingSystemMXBean;
import java.lang.management.ThreadMXBean;
import java.util.ArrayList;
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
 * {@link CalibrationRuns} (partial eclipses unless a geometry is given), per case:
 * <ul>
 * <li>{@code white}: white noise, stated errors right;</li>
 * <li>{@code red}: 2 mmag correlated over 30 min on top, the likelihood as the sampler has it;</li>
 * <li>{@code red-beta}: the same curves, errors inflated by max(1, β) ({@code --inflate-errors beta});</li>
 * <li>{@code jitter}: white noise with the errors stated 2× too small, sampled with the errors as
 * stated (no χ²ν scaling) and with a jitter term ({@code --jitter});</li>
 * <li>{@code all}: every case in turn.</li>
 * </ul>
 * Each line gives the fraction of the truths (five per curve) inside the intervals and its binomial
 * standard error √(p(1 − p)/n) for the nominal p. Figures in docs/uncertainties.md. Run with
 * {@code java -cp target/classes:target/test-classes:$(deps) org.twinlight.bench.PosteriorCalibrationBench
 * [CURVES [CASE [GEOMETRY [FIRST_SEED]]]]}.
 */
public final class PosteriorCalibrationBench {
    private static final int WALKERS = 32;
    private static final int MAX_STEPS = 20_000;

    private PosteriorCalibrationBench() {
    }

    /** One way of sampling the same curve. */
    private record Variant(String label, boolean inflate, boolean statedErrors, boolean jitter) {
    }

    /** A case: its noise, how wrong the stated errors are, and the variants sampled. */
    private record Case(String name, Noise noise, double statedErrorFactor, List<Variant> variants) {
    }

    private static final List<Case> CASES = List.of(
            new Case("white", Noise.WHITE, 1, List.of(new Variant("posterior", false, false, false))),
            new Case("red", Noise.RED, 1, List.of(new Variant("posterior", false, false, false))),
            new Case("red-beta", Noise.RED, 1, List.of(new Variant("posterior, errors x max(1, beta)", true, false,
                    false))),
            new Case("jitter", Noise.WHITE, 0.5, List.of(
                    new Variant("errors 2x too small, as stated", false, true, false),
                    new Variant("errors 2x too small, --jitter", false, true, true))));

    public static void main(String[] args) {
        int curves = args.length > 0 ? Integer.parseInt(args[0]) : 20;
        String which = args.length > 1 ? args[1] : "all";
        Geometry g = args.length > 2 ? Geometry.valueOf(args[2].toUpperCase(Locale.ROOT)) : Geometry.PARTIAL;
        long firstSeed = args.length > 3 ? Long.parseLong(args[3]) : 1;
        List<Case> run = new ArrayList<>();
        for (Case c : CASES) {
            if (which.equals("all") || which.equals(c.name())) {
                run.add(c);
            }
        }
        if (run.isEmpty()) {
            throw new IllegalArgumentException("case: white, red, red-beta, jitter or all, got " + which);
        }
        OperatingSystemMXBean os = ManagementFactory.getOperatingSystemMXBean();
        System.out.printf(Locale.ROOT, "load average at start %.2f%n", os.getSystemLoadAverage());
        for (Case c : run) {
            runCase(c, g, curves, firstSeed);
        }
        System.out.printf(Locale.ROOT, "load average at end %.2f%n", os.getSystemLoadAverage());
    }

    private static void runCase(Case c, Geometry g, int curves, long firstSeed) {
        int variants = c.variants().size();
        int[] in68 = new int[variants];
        int[] in95 = new int[variants];
        int[] unconverged = new int[variants];
        int total = 0;
        ThreadMXBean threads = ManagementFactory.getThreadMXBean();
        long cpu0 = threads.getCurrentThreadCpuTime();
        long t0 = System.nanoTime();
        for (long seed = firstSeed; seed < firstSeed + curves; seed++) {
            FitProblem problem = CalibrationRuns.problem(g, c.noise(), 7000 + seed, c.statedErrorFactor());
            FitResult best = EclipseFitter.optimize(problem);
            // β alone sets the inflation: no residual permutation (0 shifts), and only when a variant needs it
            NoiseReport report = c.variants().stream().anyMatch(Variant::inflate)
                    ? NoiseDiagnostics.of(problem, best, 0) : null;
            for (int v = 0; v < variants; v++) {
                Variant variant = c.variants().get(v);
                FitResult from = variant.inflate() ? NoiseDiagnostics.forInflatedSampling(best, report.inflation())
                        : variant.statedErrors() ? NoiseDiagnostics.forInflatedSampling(best, 1 / Math.sqrt(best.reducedChi2()))
                        : best;
                // one thread: cases run side by side as separate processes
                Posterior p = PosteriorSampler.sample(problem, from, SamplerSettings.of(WALKERS, MAX_STEPS, seed, 1),
                        variant.jitter(), SamplingProgress.NONE, () -> false);
                unconverged[v] += p.convergence().converged() ? 0 : 1;
                for (String name : CalibrationRuns.FREE) {
                    Marginal m = p.marginals().get(p.column(name));
                    double truth = CalibrationRuns.truthValue(g.truth(), name);
                    in68[v] += truth >= m.lower68() && truth <= m.upper68() ? 1 : 0;
                    in95[v] += truth >= m.lower95() && truth <= m.upper95() ? 1 : 0;
                }
            }
            total += CalibrationRuns.FREE.size();
            // running tallies, so that a run stopped early still tells its coverage so far
            StringBuilder line = new StringBuilder();
            for (int v = 0; v < variants; v++) {
                line.append(String.format(Locale.ROOT, " [%d/%d, %d/%d of %d]", in68[v], total, in95[v], total, total));
            }
            System.out.printf(Locale.ROOT, "  %s curve %d:%s, %.0f s CPU%n", c.name(), seed, line,
                    (threads.getCurrentThreadCpuTime() - cpu0) / 1e9);
        }
        for (int v = 0; v < variants; v++) {
            System.out.printf(Locale.ROOT, "| %s | %s | %s | %s | %s |%n", g.name().toLowerCase(Locale.ROOT), c.name(),
                    c.variants().get(v).label(), percent(in68[v], total, 0.68), percent(in95[v], total, 0.95));
        }
        System.out.printf(Locale.ROOT, "(%s: %d curves, %d truths, chains not converged %s, %.0f s CPU, %.0f s wall)%n",
                c.name(), curves, total, java.util.Arrays.toString(unconverged),
                (threads.getCurrentThreadCpuTime() - cpu0) / 1e9, (System.nanoTime() - t0) / 1e9);
    }

    /** k/n in per cent with the binomial standard error at the nominal fraction. */
    private static String percent(int k, int n, double nominal) {
        return String.format(Locale.ROOT, "%.1f %% (± %.1f)", 100.0 * k / n,
                100 * Math.sqrt(nominal * (1 - nominal) / n));
    }
}
