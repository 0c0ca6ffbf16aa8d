package org.twinlight.bench;

import java.lang.management.ManagementFactory;
import java.lang.management.ThreadMXBean;
import java.util.Locale;
import org.twinlight.eclipse.BinaryModel;
import org.twinlight.fit.EclipseFitter;
import org.twinlight.fit.FitProblem;
import org.twinlight.fit.FitResult;
import org.twinlight.fit.Posterior;
import org.twinlight.fit.PosteriorSampler;
import org.twinlight.sampling.SamplerSettings;
import org.twinlight.sampling.SamplingProgress;

/**
 * The cost of one posterior evaluation in {@link PosteriorBench}'s case, in thread CPU time (so
 * that a loaded machine inflates it little): the model alone ({@link BinaryModel#fluxOfAscendingTimes(double[],
 * double[])} on the 20,000 times, a new model per call as in the sampler) and the whole log
 * posterior (a short one-thread sampler run, model plus χ² with its baseline, divided by its
 * evaluations). Run with
 * {@code java -cp target/classes:target/test-classes:$(deps) org.twinlight.bench.PosteriorCostBench [STEPS]}.
 */
public final class PosteriorCostBench {
    private PosteriorCostBench() {
    }

    public static void main(String[] args) {
        int steps = args.length > 0 ? Integer.parseInt(args[0]) : 300;
        ThreadMXBean mx = ManagementFactory.getThreadMXBean();
        PosteriorBench.Case c = PosteriorBench.Case.of(1);
        double[] t = c.lightCurve().timesDays();
        double[] out = new double[t.length];
        double sink = 0;
        for (int round = 0; round < 3; round++) {
            int calls = 2000;
            long c0 = mx.getCurrentThreadCpuTime();
            for (int k = 0; k < calls; k++) {
                // a slightly different model each call, as in a sampler
                new BinaryModel(PosteriorBench.TRUTH.withInclinationDeg(81.0 + 1e-6 * k)).fluxOfAscendingTimes(t, out);
                sink += out[k % out.length];
            }
            System.out.printf(Locale.ROOT, "model: %.3f ms CPU per evaluation (%d points)%n",
                    (mx.getCurrentThreadCpuTime() - c0) / 1e6 / calls, t.length);
        }
        FitProblem problem = c.problem();
        FitResult best = EclipseFitter.optimize(problem);
        for (int round = 0; round < 2; round++) {
            long c0 = mx.getCurrentThreadCpuTime();
            Posterior p = PosteriorSampler.sample(problem, best, SamplerSettings.of(32, steps, 1, 1),
                    SamplingProgress.NONE, () -> false);
            System.out.printf(Locale.ROOT, "posterior: %.3f ms CPU per evaluation (%d evaluations, 1 thread)%n",
                    (mx.getCurrentThreadCpuTime() - c0) / 1e6 / p.convergence().evaluations(),
                    p.convergence().evaluations());
        }
        System.out.printf(Locale.ROOT, "(sum %.3f)  load average %.2f%n", sink,
                ManagementFactory.getOperatingSystemMXBean().getSystemLoadAverage());
    }
}
