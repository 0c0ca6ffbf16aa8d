package org.twinlight.cli;

import java.io.PrintWriter;
import java.util.Locale;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicBoolean;
import org.twinlight.BadInputException;
import org.twinlight.WorkFailedException;
import org.twinlight.fit.FitProblem;
import org.twinlight.fit.FitResult;
import org.twinlight.fit.Posterior;
import org.twinlight.fit.PosteriorSampler;
import org.twinlight.fit.Priors;
import org.twinlight.sampling.SamplerSettings;
import org.twinlight.sampling.SamplingProgress;
import picocli.CommandLine.Option;

/**
 * The options of {@code fit --posterior} and the run of the sampler: a progress bar on a terminal,
 * and Ctrl-C that stops the sampler before anything is written.
 */
final class PosteriorOptions {
    /** How long a Ctrl-C waits for the sampler to stop before the process ends anyway. */
    private static final long STOP_WAIT_SECONDS = 5;

    @Option(names = "--posterior", description = "After the least-squares fit, sample the posterior with the "
            + "affine-invariant ensemble sampler: medians, 68% and 95% intervals in fit.json, chain.csv.gz, "
            + "trace.png and corner.png. Priors come from the model file's \"priors\".")
    boolean posterior;

    @Option(names = "--seed", paramLabel = "S", defaultValue = "1",
            description = "Seed of the sampler; the same seed gives the same chain with any --threads "
                    + "(default: ${DEFAULT-VALUE}).")
    long seed;

    @Option(names = "--max-steps", paramLabel = "N", defaultValue = "20000",
            description = "Steps per walker at most; a chain not converged by then is reported as such "
                    + "(default: ${DEFAULT-VALUE}).")
    int maxSteps;

    @Option(names = "--walkers", paramLabel = "N",
            description = "Number of walkers, even (default: max(32, 4 × the number of free parameters)).")
    Integer walkers;

    @Option(names = "--threads", paramLabel = "N",
            description = "Threads evaluating the model (default: the number of processors).")
    Integer threads;

    /** Checks the option values given without --posterior or with impossible values. */
    void check(int freeCount) {
        if (!posterior) {
            return;
        }
        if (maxSteps < 1) {
            throw new BadInputException("option --max-steps: expected a positive integer, got " + maxSteps);
        }
        if (walkers != null && (walkers < 2 * freeCount + 2 || walkers % 2 != 0)) {
            throw new BadInputException("option --walkers: expected an even number of at least " + (2 * freeCount + 2)
                    + " (twice the " + freeCount + " free parameters, plus 2), got " + walkers);
        }
        if (threads != null && threads < 1) {
            throw new BadInputException("option --threads: expected a positive integer, got " + threads);
        }
    }

    SamplerSettings settings(int freeCount) {
        int w = walkers != null ? walkers : SamplerSettings.defaultWalkers(freeCount);
        int t = threads != null ? threads : Runtime.getRuntime().availableProcessors();
        return SamplerSettings.of(w, maxSteps, seed, t);
    }

    /**
     * Samples; Ctrl-C stops the sampler and ends the work with nothing written.
     *
     * @throws WorkFailedException when sampling was interrupted
     */
    Posterior sample(FitProblem problem, FitResult best, Priors priors, int freeCount, PrintWriter err) {
        AtomicBoolean stop = new AtomicBoolean();
        CountDownLatch finished = new CountDownLatch(1);
        Thread hook = new Thread(() -> {
            stop.set(true);
            try {
                // let the sampler notice and return, so no thread is cut off mid-step
                finished.await(STOP_WAIT_SECONDS, TimeUnit.SECONDS);
                err.println();
                err.println("interrupted: sampling stopped; no result file was written");
                err.flush();
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
            }
        }, "stop-sampler");
        Runtime.getRuntime().addShutdownHook(hook);
        Posterior p;
        ProgressBar bar = System.console() != null ? new ProgressBar(err) : null;
        try {
            p = PosteriorSampler.sample(problem, best, priors, settings(freeCount),
                    bar == null ? SamplingProgress.NONE : bar, stop::get);
        } finally {
            if (bar != null) {
                bar.end();
            }
            finished.countDown();
            try {
                Runtime.getRuntime().removeShutdownHook(hook);
            } catch (IllegalStateException e) {
                // the process is shutting down (Ctrl-C): the hook is running
            }
        }
        if (p.convergence().cancelled()) {
            throw new WorkFailedException("sampling was interrupted after " + p.steps() + " steps; nothing was written");
        }
        return p;
    }

    /** One line on standard error, redrawn at most four times a second: steps, τ, time left. */
    private static final class ProgressBar implements SamplingProgress {
        private static final int WIDTH = 30;
        private final PrintWriter err;
        private final long startNanos = System.nanoTime();
        private long lastDraw;
        private boolean drawn;

        ProgressBar(PrintWriter err) {
            this.err = err;
        }

        @Override
        public void update(int step, int maxSteps, double maxTau, int stepsNeeded) {
            long now = System.nanoTime();
            if (now - lastDraw < 250_000_000L && step < maxSteps) {
                return;
            }
            lastDraw = now;
            int target = Math.max(step, stepsNeeded);
            int filled = (int) Math.round(WIDTH * Math.min(1.0, step / (double) target));
            double perStep = (now - startNanos) / 1e9 / Math.max(1, step);
            String tau = Double.isNaN(maxTau) ? "τ not yet estimated" : String.format(Locale.ROOT, "τ ≈ %.0f steps", maxTau);
            err.printf(Locale.ROOT, "\rsampling [%s%s] %d/%d steps, %s, about %s left   ", "#".repeat(filled),
                    ".".repeat(WIDTH - filled), step, target, tau, duration(perStep * (target - step)));
            err.flush();
            drawn = true;
        }

        private static String duration(double seconds) {
            long s = Math.round(seconds);
            return s < 60 ? s + " s" : String.format(Locale.ROOT, "%d min %02d s", s / 60, s % 60);
        }

        void end() {
            if (drawn) {
                err.println();
                err.flush();
            }
        }
    }
}
