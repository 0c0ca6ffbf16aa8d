package org.twinlight.sampling;

/**
 * The logarithm of an unnormalised probability density. An instance may keep work arrays and is
 * used by one thread at a time; the sampler asks for one instance per worker thread.
 */
@FunctionalInterface
public interface LogDensity {
    /**
     * ln p(x) up to a constant; {@link Double#NEGATIVE_INFINITY} outside the support. Must not
     * keep or change {@code x}.
     */
    double at(double[] x);
}
