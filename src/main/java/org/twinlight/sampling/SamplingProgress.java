package org.twinlight.sampling;

/** Receives the sampler's progress after every step (from the sampling thread). */
@FunctionalInterface
public interface SamplingProgress {
    /** No progress shown. */
    SamplingProgress NONE = (step, maxSteps, maxTau, stepsNeeded) -> { };

    /**
     * @param step steps done
     * @param maxSteps the step limit
     * @param maxTau the latest estimate of the largest τ (NaN before the first)
     * @param stepsNeeded the latest estimate of the steps convergence needs (at most maxSteps)
     */
    void update(int step, int maxSteps, double maxTau, int stepsNeeded);
}
