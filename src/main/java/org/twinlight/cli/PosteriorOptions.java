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
    /** Seed when --seed is not given: the same as the global search's own default. */
    static final long DEFAULT_SEED = org.twinlight.fit.GlobalSearch.DEFAULT_SEED;

    @Option(names = "--posterior", description = "After the least-squares fit, sample the posterior with the "
            + "affine-invariant ensemble sampler: medians, 68%% and 95%% intervals in fit.json, chain.csv.gz, "
            + "trace.png and corner.png. Priors come from the model file's \"priors\".")
    boolean posterior;

    @Option(names = "--jitter", description = "With --posterior: sample an extra scatter added in quadrature to "
            + "the stated errors, one per band (jitter, jitter@BAND) and one per velocity file (jitterVelocity), "
            + "instead of scaling the errors to reduced chi-square 1. Default prior: log-uniform from 0.001 to 100 "
            + "times the median stated error; a prior on jitter in the model file replaces it.")
    boolean jitter;

    @Option(names = "--seed", paramLabel = "S",
            description = "Seed of the random numbers: of the sampler (--posterior) and of the global search "
                    + "(--global); the same seed gives the same result with any --threads (default: 1).")
    Long seed;

    @Option(names = "--max-steps", paramLabel = "N",
            description = "Steps per walker at most; a chain not converged by then is reported as such "
                    + "(default: 20000).")
    Integer maxSteps;

    @Option(names = "--walkers", paramLabel = "N",
            description = "Number of walkers, even (default: max(32, 4 × the number of free parameters)).")
    Integer walkers;

    @Option(names = "--threads", paramLabel = "N",
            description = "Threads evaluating the model (default: the number of processors).")
    Integer threads;

    /**
     * Checks the option values given without --posterior (--seed is also the global search's) or with
     * impossible values.
     *
     * @param freeCount the number of sampled coordinates (free parameters and jitter terms)
     * @param global whether the fit runs a global search (--global)
     * @param inflate whether the errors are inflated by beta (--inflate-errors beta)
     */
    void check(int freeCount, boolean global, boolean inflate) {
        if (!posterior) {
            if (maxSteps != null || walkers != null || threads != null || jitter) {
                throw new BadInputException("options --jitter, --max-steps, --walkers and --threads set the sampler; "
                        + "add --posterior to sample, or leave them out");
            }
            if (seed != null && !global) {
                throw new BadInputException("option --seed seeds the sampler (--posterior) and the global search "
                        + "(--global); add one of them, or leave it out");
            }
            return;
        }
        if (jitter && inflate) {
            throw new BadInputException("options --jitter and --inflate-errors beta: --jitter takes the errors as "
                    + "stated and samples an extra white scatter, --inflate-errors beta scales them for correlated "
                    + "noise; choose one");
        }
        if (maxSteps != null && maxSteps < 1) {
            throw new BadInputException("option --max-steps: expected a positive integer, got " + maxSteps);
        }
        if (walkers != null && (walkers < 2 * freeCount + 2 || walkers % 2 != 0)) {
            throw new BadInputException("option --walkers: expected an even number of at least " + (2 * freeCount + 2)
                    + " (twice the " + freeCount + (jitter ? " free parameters and jitter terms" : " free parameters")
                    + ", plus 2), got " + walkers);
        }
        if (threads != null && threads < 1) {
            throw new BadInputException("option --threads: expected a positive integer, got " + threads);
        }
    }

    /**
     * Refuses a prior on a jitter without --posterior --jitter.
     *
     * @throws BadInputException naming the prior
     */
    void checkPriors(Priors priors) {
        PosteriorSampler.checkPriors(priors, posterior && jitter);
    }

    SamplerSettings settings(int freeCount) {
        int w = walkers != null ? walkers : SamplerSettings.defaultWalkers(freeCount);
        int t = threads != null ? threads : Runtime.getRuntime().availableProcessors();
        return SamplerSettings.of(w, maxSteps != null ? maxSteps : 20_000, seed(), t);
    }

    /** The seed given, or the default 1. */
    long seed() {
        return seed != null ? seed : DEFAULT_SEED;
    }

    /**
     * Samples; Ctrl-C stops the sampler and ends the work with nothing written.
     *
     * @throws WorkFailedException when sampling was interrupted
     */
    Posterior sample(FitProblem problem, FitResult best, int freeCount, PrintWriter err) {
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
            p = PosteriorSampler.sample(problem, best, settings(freeCount), jitter,
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
