package org.twinlight.sampling;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;
import java.util.concurrent.Callable;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.function.BooleanSupplier;
import java.util.function.Supplier;

/**
 * The affine-invariant ensemble sampler with the stretch move (Goodman &amp; Weare 2010, Comm. App.
 * Math. Comp. Sci. 5, 65, Sect. 3, eqs. 7–10): walker X_k moves to Y = X_j + z (X_k − X_j), X_j a
 * walker drawn from the complementary ensemble and z drawn from g(z) ∝ 1/√z on [1/a, a], accepted
 * with probability min(1, z^{d−1} p(Y)/p(X_k)).
 *
 * <p>Parallel updates use the split ensemble: the walkers are two halves and each half moves
 * against the other, held fixed meanwhile, so every move is a valid Metropolis–Hastings step on
 * the product density (Goodman &amp; Weare 2010, Sect. 3, last paragraph). Each walker draws from
 * its own random stream, split from the seed in walker order, so a run is the same whatever the
 * number of threads.
 *
 * <p>Sampling goes on in blocks until the convergence rule holds or the step limit is reached:
 * the first {@link SamplerSettings#burnInTau()} × τ_max steps are discarded, and the rest must be
 * at least {@link SamplerSettings#minLengthInTau()} × τ of every coordinate long, with τ changed
 * by less than {@link SamplerSettings#tauTolerance()} since the previous check.
 */
public final class EnsembleSampler {
    /** Steps before the first convergence check; later checks follow every 10 % of the run (at least this). */
    private static final int FIRST_CHECK = 200;

    private EnsembleSampler() {
    }

    /** A starting walker outside the density's support. */
    public static final class StartRejected extends IllegalArgumentException {
        private final int walker;

        StartRejected(int walker) {
            super("walker " + walker + " starts where the density is zero");
            this.walker = walker;
        }

        public int walker() {
            return walker;
        }
    }

    /** A finished run: the whole chain (burn-in included) and how it ended. */
    public record Result(Chain chain, Convergence convergence) {
    }

    /**
     * Samples.
     *
     * @param densities gives one density instance per worker thread
     * @param start start[w] the starting position of walker w (walkers × dimension)
     * @param stop polled every step; when true the run stops and is returned as cancelled
     * @throws StartRejected when a start lies where the density is zero
     */
    public static Result sample(Supplier<LogDensity> densities, double[][] start, SamplerSettings settings,
            SamplingProgress progress, BooleanSupplier stop) {
        int walkers = settings.walkers();
        if (start.length != walkers) {
            throw new IllegalArgumentException("expected " + walkers + " starting positions, got " + start.length);
        }
        int dim = start[0].length;
        LogDensity[] slots = new LogDensity[settings.threads()];
        for (int t = 0; t < slots.length; t++) {
            slots[t] = densities.get();
        }
        double[][] x = new double[walkers][];
        double[] logp = new double[walkers];
        SplittableRandom master = new SplittableRandom(settings.seed());
        SplittableRandom[] streams = new SplittableRandom[walkers];
        for (int w = 0; w < walkers; w++) {
            streams[w] = master.split();
            x[w] = start[w].clone();
            logp[w] = slots[0].at(x[w]);
            if (!(logp[w] > Double.NEGATIVE_INFINITY) || Double.isNaN(logp[w])) {
                throw new StartRejected(w);
            }
        }
        ExecutorService pool = settings.threads() > 1 ? Executors.newFixedThreadPool(settings.threads(), r -> {
            Thread th = new Thread(r, "sampler");
            th.setDaemon(true);
            return th;
        }) : null;
        try {
            return run(new Ensemble(x, logp, streams, slots, pool, settings.stretch()), settings, progress, stop);
        } finally {
            if (pool != null) {
                pool.shutdownNow();
            }
        }
    }

    private static Result run(Ensemble ens, SamplerSettings settings, SamplingProgress progress, BooleanSupplier stop) {
        int walkers = settings.walkers();
        Chain chain = new Chain(walkers, ens.x[0].length);
        double[] previousTau = null;
        int nextCheck = Math.min(FIRST_CHECK, settings.maxSteps());
        double maxTau = Double.NaN;
        int needed = settings.maxSteps();
        Check last = null;
        while (chain.steps() < settings.maxSteps()) {
            if (stop.getAsBoolean()) {
                Check c = Check.at(chain, settings, previousTau);
                return new Result(chain, new Convergence(false, "sampling was interrupted after " + chain.steps()
                        + " steps", true, chain.steps(), c.burnIn, c.tau, chain.acceptanceFraction(c.burnIn),
                        ens.evaluations));
            }
            int accepted = ens.move(0, walkers / 2) + ens.move(walkers / 2, walkers);
            chain.add(ens.x, ens.logp, accepted);
            if (chain.steps() == nextCheck || chain.steps() == settings.maxSteps()) {
                last = Check.at(chain, settings, previousTau);
                if (last.converged) {
                    break;
                }
                previousTau = last.tau;
                maxTau = last.maxTau();
                // τ still growing means more than 55 τ: never promise less than the next check
                needed = Math.min(settings.maxSteps(), Math.max(last.stepsNeeded(settings),
                        chain.steps() + Math.max(FIRST_CHECK / 2, chain.steps() / 10)));
                nextCheck = Math.min(settings.maxSteps(), chain.steps() + Math.max(FIRST_CHECK / 2, chain.steps() / 10));
            }
            progress.update(chain.steps(), settings.maxSteps(), maxTau, needed);
        }
        Check c = last;
        String reason = c.converged ? c.reason : "the step limit of " + settings.maxSteps() + " was reached: " + c.reason;
        progress.update(chain.steps(), settings.maxSteps(), c.maxTau(), chain.steps());
        return new Result(chain, new Convergence(c.converged, reason, false, chain.steps(), c.burnIn, c.tau,
                chain.acceptanceFraction(c.burnIn), ens.evaluations));
    }

    /** The convergence rule applied to the chain so far. */
    private record Check(boolean converged, String reason, int burnIn, double[] tau) {
        static Check at(Chain chain, SamplerSettings s, double[] previous) {
            int n = chain.steps();
            int d = chain.dimension();
            if (n < 4) {
                double[] none = new double[d];
                java.util.Arrays.fill(none, Double.NaN);
                return new Check(false, "too few steps to estimate the autocorrelation time", 0, none);
            }
            // burn-in from the previous estimate of τ (half the chain before there is one)
            double full = previous == null ? Double.NaN : 0;
            if (previous != null) {
                for (double t : previous) {
                    full = Math.max(full, t);
                }
            }
            int burnIn = Double.isNaN(full) ? n / 2 : Math.min(n / 2, (int) Math.ceil(s.burnInTau() * full));
            double[] tau = new double[d];
            double max = 0;
            int worst = 0;
            for (int k = 0; k < d; k++) {
                tau[k] = AutocorrelationTime.of(chain.series(k, burnIn));
                if (Double.isNaN(tau[k])) {
                    return new Check(false, "coordinate " + k + " never moved", burnIn, tau);
                }
                if (tau[k] > max) {
                    max = tau[k];
                    worst = k;
                }
            }
            int kept = n - burnIn;
            if (kept < s.minLengthInTau() * max) {
                return new Check(false, String.format(Locale.ROOT, "the chain after burn-in is %.1f autocorrelation "
                        + "times long (coordinate %d, τ = %.1f steps), less than the %.0f required", kept / max, worst,
                        max, s.minLengthInTau()), burnIn, tau);
            }
            if (previous == null) {
                return new Check(false, "τ has been estimated only once", burnIn, tau);
            }
            for (int k = 0; k < d; k++) {
                double change = Math.abs(tau[k] - previous[k]) / tau[k];
                if (!(change < s.tauTolerance())) {
                    return new Check(false, String.format(Locale.ROOT, "τ of coordinate %d still changes by %.0f%% "
                            + "between checks (more than %.0f%%)", k, 100 * change, 100 * s.tauTolerance()), burnIn, tau);
                }
            }
            return new Check(true, String.format(Locale.ROOT, "the chain after burn-in is %.0f autocorrelation times "
                    + "long and τ changed by less than %.0f%% between checks", kept / max, 100 * s.tauTolerance()),
                    burnIn, tau);
        }

        double maxTau() {
            double m = 0;
            for (double t : tau) {
                m = Math.max(m, t);
            }
            return m;
        }

        int stepsNeeded(SamplerSettings s) {
            double m = maxTau();
            return Double.isNaN(m) || m == 0 ? s.maxSteps() : (int) Math.ceil((s.minLengthInTau() + s.burnInTau()) * m);
        }
    }

    /** The walkers' state and the parallel half-ensemble moves. */
    private static final class Ensemble {
        final double[][] x;
        final double[] logp;
        final SplittableRandom[] streams;
        final LogDensity[] slots;
        final ExecutorService pool;
        final double a;
        final int dim;
        /** One trial-position array per thread. */
        final double[][] work;
        long evaluations;

        Ensemble(double[][] x, double[] logp, SplittableRandom[] streams, LogDensity[] slots, ExecutorService pool,
                double a) {
            this.x = x;
            this.logp = logp;
            this.streams = streams;
            this.slots = slots;
            this.pool = pool;
            this.a = a;
            this.dim = x[0].length;
            this.work = new double[slots.length][dim];
            this.evaluations = x.length;
        }

        /**
         * Moves walkers [from, to) against the others; returns the number accepted. With several
         * threads each takes the next walker not yet moved from a shared counter, so a thread that
         * meets cheap evaluations (a trial outside the prior, few points in eclipse) moves more
         * walkers; the result does not depend on which thread moves which walker, since every
         * walker draws from its own stream and writes only its own slot.
         */
        int move(int from, int to) {
            int otherFrom = from == 0 ? to : 0;
            int otherCount = x.length - (to - from);
            evaluations += to - from;
            if (pool == null) {
                int accepted = 0;
                for (int k = from; k < to; k++) {
                    accepted += moveWalker(slots[0], k, otherFrom, otherCount, work[0]);
                }
                return accepted;
            }
            AtomicInteger next = new AtomicInteger(from);
            List<Callable<Integer>> tasks = new ArrayList<>();
            for (int t = 0; t < slots.length; t++) {
                LogDensity density = slots[t];
                double[] y = work[t];
                tasks.add(() -> {
                    int accepted = 0;
                    for (int k = next.getAndIncrement(); k < to; k = next.getAndIncrement()) {
                        accepted += moveWalker(density, k, otherFrom, otherCount, y);
                    }
                    return accepted;
                });
            }
            int accepted = 0;
            try {
                for (Future<Integer> f : pool.invokeAll(tasks)) {
                    accepted += f.get();
                }
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
                throw new IllegalStateException("sampling interrupted", e);
            } catch (ExecutionException e) {
                Throwable cause = e.getCause();
                if (cause instanceof RuntimeException re) {
                    throw re;
                }
                throw new IllegalStateException(cause);
            }
            return accepted;
        }

        /** The stretch move of walker k, with the trial position built in {@code y}; 1 when accepted. */
        private int moveWalker(LogDensity density, int k, int otherFrom, int otherCount, double[] y) {
            SplittableRandom rng = streams[k];
            int j = otherFrom + rng.nextInt(otherCount);
            // z with density ∝ 1/√z on [1/a, a] by inversion (Goodman & Weare 2010, eq. 9)
            double u = rng.nextDouble();
            double z = Math.pow((a - 1) * u + 1, 2) / a;
            double[] xk = x[k];
            double[] xj = x[j];
            for (int i = 0; i < dim; i++) {
                y[i] = xj[i] + z * (xk[i] - xj[i]);
            }
            double ly = density.at(y);
            double logq = (dim - 1) * Math.log(z) + ly - logp[k];
            double r = rng.nextDouble();
            if (ly > Double.NEGATIVE_INFINITY && Math.log(r) < logq) {
                x[k] = y.clone();
                logp[k] = ly;
                return 1;
            }
            return 0;
        }
    }
}
