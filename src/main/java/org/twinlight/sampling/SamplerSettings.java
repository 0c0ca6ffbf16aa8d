package org.twinlight.sampling;

/**
 * Settings of the ensemble sampler and its convergence rule.
 *
 * @param walkers number of walkers (even, at least 2 × dimension + 2)
 * @param maxSteps the most steps per walker before sampling stops unconverged
 * @param seed seed of the random streams (one per walker, derived from it)
 * @param threads worker threads evaluating the density
 * @param stretch the stretch-move scale a (Goodman &amp; Weare 2010 use a = 2)
 * @param minLengthInTau the retained chain must be at least this many autocorrelation times long
 * @param tauTolerance the largest relative change of τ between two checks for convergence
 * @param burnInTau steps discarded at the start, in units of the largest autocorrelation time
 */
public record SamplerSettings(int walkers, int maxSteps, long seed, int threads, double stretch,
        double minLengthInTau, double tauTolerance, double burnInTau) {
    /** Stretch scale of Goodman &amp; Weare (2010), Sect. 3. */
    public static final double GOODMAN_WEARE_STRETCH = 2.0;
    /**
     * At least 50 τ of retained chain and τ steady to 5 % between checks: common practice, no
     * source beyond Sokal (1997), who asks for a run much longer than τ.
     */
    public static final double DEFAULT_MIN_LENGTH_IN_TAU = 50;
    /** Relative change of τ allowed between checks (common practice, no source). */
    public static final double DEFAULT_TAU_TOLERANCE = 0.05;
    /** Burn-in: five autocorrelation times (common practice, no source). */
    public static final double DEFAULT_BURN_IN_TAU = 5;

    public SamplerSettings {
        if (walkers < 4 || walkers % 2 != 0) {
            throw new IllegalArgumentException("walkers must be an even number of at least 4, got " + walkers);
        }
        if (maxSteps < 1 || threads < 1) {
            throw new IllegalArgumentException("maxSteps and threads must be positive");
        }
        if (!(stretch > 1)) {
            throw new IllegalArgumentException("the stretch scale must exceed 1, got " + stretch);
        }
    }

    /** The defaults: a = 2, 50 τ, 5 %, burn-in 5 τ. */
    public static SamplerSettings of(int walkers, int maxSteps, long seed, int threads) {
        return new SamplerSettings(walkers, maxSteps, seed, threads, GOODMAN_WEARE_STRETCH, DEFAULT_MIN_LENGTH_IN_TAU,
                DEFAULT_TAU_TOLERANCE, DEFAULT_BURN_IN_TAU);
    }

    /** The default number of walkers for a dimension: max(32, 4 d), made even. */
    public static int defaultWalkers(int dimension) {
        int w = Math.max(32, 4 * dimension);
        return w + (w % 2);
    }

    public SamplerSettings withThreads(int t) {
        return new SamplerSettings(walkers, maxSteps, seed, t, stretch, minLengthInTau, tauTolerance, burnInTau);
    }

    public SamplerSettings withMaxSteps(int n) {
        return new SamplerSettings(walkers, n, seed, threads, stretch, minLengthInTau, tauTolerance, burnInTau);
    }

    public SamplerSettings withSeed(long s) {
        return new SamplerSettings(walkers, maxSteps, s, threads, stretch, minLengthInTau, tauTolerance, burnInTau);
    }

    public SamplerSettings withMinLengthInTau(double m) {
        return new SamplerSettings(walkers, maxSteps, seed, threads, stretch, m, tauTolerance, burnInTau);
    }
}
