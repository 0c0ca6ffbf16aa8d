package org.twinlight.bench;

import java.lang.management.ManagementFactory;
import java.lang.management.ThreadInfo;
import java.lang.management.ThreadMXBean;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Locale;
import org.twinlight.eclipse.BinaryModel;
import org.twinlight.eclipse.BinaryParameters;
import org.twinlight.eclipse.LimbDarkening;
import org.twinlight.eclipse.ModelFile;
import org.twinlight.eclipse.SyntheticLightCurve;
import org.twinlight.fit.EclipseFitter;
import org.twinlight.fit.FitData;
import org.twinlight.fit.FitProblem;
import org.twinlight.fit.FitResult;
import org.twinlight.fit.FitSettings;
import org.twinlight.fit.Posterior;
import org.twinlight.fit.PosteriorSampler;
import org.twinlight.fit.Priors;
import org.twinlight.photometry.LightCurve;
import org.twinlight.sampling.Marginal;
import org.twinlight.sampling.SamplerSettings;
import org.twinlight.sampling.SamplingProgress;
import org.twinlight.time.TimeScale;

/**
 * The posterior benchmark of docs/performance.md: 20,000 points at 2-min cadence of a partially
 * eclipsing pair (r₂ and i strongly correlated), 8 free parameters (period, epoch, both radii,
 * inclination, surface-brightness ratio, the primary's quadratic limb darkening), 32 walkers;
 * the time to a converged chain with 1 and with 2 threads, and whether each truth lies inside its
 * 95 % interval. Run with
 * {@code java -cp target/classes:target/test-classes:$(deps) org.twinlight.bench.PosteriorBench [THREADS,..] [SEED] [MAX_STEPS]}.
 */
public final class PosteriorBench {
    static final BinaryParameters TRUTH = new BinaryParameters(2.3456789, 2460000.3, 0.19, 0.14, 81.0, 0, 90, 0.72, 0,
            LimbDarkening.quadratic(0.45, 0.20), LimbDarkening.quadratic(0.50, 0.18), 0, 1);

    private PosteriorBench() {
    }

    /**
     * The CPU time of the sampler's worker threads (named "sampler"), read while they live: the
     * progress callback, called by the sampling thread after every step, looks every 20 steps.
     */
    static final class WorkerClock implements SamplingProgress {
        private final ThreadMXBean mx;
        private final Map<Long, Long> cpuNanos = new HashMap<>();

        WorkerClock(ThreadMXBean mx) {
            this.mx = mx;
        }

        @Override
        public void update(int steps, int maxSteps, double maxTau, int stepsNeeded) {
            if (steps % 20 != 0 && steps != stepsNeeded) {
                return;
            }
            for (ThreadInfo info : mx.getThreadInfo(mx.getAllThreadIds())) {
                if (info != null && info.getThreadName().equals("sampler")) {
                    long cpu = mx.getThreadCpuTime(info.getThreadId());
                    if (cpu > 0) {
                        cpuNanos.put(info.getThreadId(), cpu);
                    }
                }
            }
        }

        double total() {
            return cpuNanos.values().stream().mapToLong(Long::longValue).sum() / 1e9;
        }

        double busiest() {
            return cpuNanos.values().stream().mapToLong(Long::longValue).max().orElse(0) / 1e9;
        }
    }

    /** The benchmark's data (noise from seed 100 + {@code seed}) and its 8-parameter fit problem. */
    record Case(LightCurve lightCurve, FitProblem problem) {
        static Case of(long seed) {
            double[] t = SyntheticLightCurve.regularTimes(2460000.0, 2460000.0 + 20_000 * 2 / 1440.0 - 1e-9, 2,
                    List.of(), null);
            LightCurve lc = SyntheticLightCurve.observe(new BinaryModel(TRUTH), t, 1000, 100 + seed, "T", "T",
                    TimeScale.BJD_TDB);
            FitSettings settings = FitSettings.defaults().withFree(new java.util.LinkedHashSet<>(List.of("period",
                    "epoch", "radius1", "radius2", "inclination", "surfaceBrightnessRatio", "limbDarkening1")));
            return new Case(lc, FitProblem.of(ModelFile.of(TRUTH.withRadii(0.2, 0.13).withInclinationDeg(80.5)),
                    List.of(new FitData(lc, "T")), settings));
        }
    }

    public static void main(String[] args) {
        String threadList = args.length > 0 ? args[0] : "1,2";
        long seed = args.length > 1 ? Long.parseLong(args[1]) : 1;
        int maxSteps = args.length > 2 ? Integer.parseInt(args[2]) : 20_000;
        Case c = Case.of(seed);
        LightCurve lc = c.lightCurve();
        FitProblem problem = c.problem();
        long f0 = System.nanoTime();
        FitResult best = EclipseFitter.optimize(problem);
        System.out.printf(Locale.ROOT, "%d points, least squares %.1f s%n", lc.size(), (System.nanoTime() - f0) / 1e9);
        double firstWall = Double.NaN;
        double firstProjected = Double.NaN;
        ThreadMXBean mx = ManagementFactory.getThreadMXBean();
        for (String ts : threadList.split(",")) {
            int threads = Integer.parseInt(ts.trim());
            WorkerClock workers = new WorkerClock(mx);
            long t0 = System.nanoTime();
            long c0 = mx.getCurrentThreadCpuTime();
            Posterior p = PosteriorSampler.sample(problem, best, SamplerSettings.of(32, maxSteps, seed, threads),
                    workers, () -> false);
            double callerCpu = (mx.getCurrentThreadCpuTime() - c0) / 1e9;
            double secs = (System.nanoTime() - t0) / 1e9;
            // on two free cores the run would take the caller's own work plus the busiest worker's
            double projected = callerCpu + workers.busiest();
            double cpu = callerCpu + workers.total();
            firstWall = Double.isNaN(firstWall) ? secs : firstWall;
            firstProjected = Double.isNaN(firstProjected) ? projected : firstProjected;
            System.out.printf(Locale.ROOT, "threads %d: %s, %d steps (burn-in %d), max tau %.1f, %.0f tau, acceptance "
                    + "%.2f%n  wall %.1f s (load average %.1f), CPU %.1f s = %.3f ms per evaluation, projected wall on "
                    + "%d free cores %.1f s; speed-up against the first run: wall %.2f, projected %.2f%n", threads,
                    p.convergence().converged() ? "converged" : "NOT converged", p.steps(), p.burnIn(),
                    p.convergence().maxAutocorrelationTime(), p.convergence().chainLengthInTau(),
                    p.convergence().acceptanceFraction(), secs,
                    ManagementFactory.getOperatingSystemMXBean().getSystemLoadAverage(), cpu,
                    1e3 * cpu / p.convergence().evaluations(), threads, projected, firstWall / secs,
                    firstProjected / projected);
            double[] tau = p.convergence().autocorrelationTimes();
            StringBuilder line = new StringBuilder("  tau per coordinate:");
            for (double v : tau) {
                line.append(String.format(Locale.ROOT, " %.1f", v));
            }
            System.out.println(line);
            double[] truth = {TRUTH.periodDays(), TRUTH.epochDays(), 0.19, 0.14, 81.0, 0.72, 0.45, 0.20};
            String[] names = {"period", "epoch", "radius1", "radius2", "inclination", "surfaceBrightnessRatio",
                "limbDarkening1.a", "limbDarkening1.b"};
            for (int k = 0; k < names.length; k++) {
                Marginal m = p.marginals().get(p.column(names[k]));
                boolean inside = truth[k] >= m.lower95() && truth[k] <= m.upper95();
                System.out.printf(Locale.ROOT, "  %-24s truth %.8g  median %.8g  95%% [%.8g, %.8g] %s%n", names[k],
                        truth[k], m.median(), m.lower95(), m.upper95(), inside ? "inside" : "OUTSIDE");
            }
        }
    }
}
