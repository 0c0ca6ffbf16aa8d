package org.twinlight.timing.minima;

import org.twinlight.BadInputException;

/**
 * Settings of the search for times of minimum. Immutable; change with the {@code withX} copies.
 *
 * @param secondaryPhase phase of the secondary minimum after the primary, in (0, 1); 0.5 for a circular orbit
 * @param windowDays full width of the window cut around each eclipse, days; NaN: estimated from the
 *     folded light curve (1.4 × the eclipse duration)
 * @param minPoints fewest points an eclipse window must hold to be measured
 * @param bootstrapSamples number of synthetic replicas used for the Kwee–van Woerden error
 * @param minDepthSignificance smallest depth/σ(depth) for an eclipse to count as seen
 * @param seed seed of the random numbers of the error estimate (results are reproducible)
 */
public record MinimumSettings(double secondaryPhase, double windowDays, int minPoints, int bootstrapSamples,
        double minDepthSignificance, long seed) {

    /** Full window = this many eclipse durations when estimated (common practice, no source). */
    public static final double WINDOW_PER_DURATION = 1.4;

    public MinimumSettings {
        if (!(secondaryPhase > 0 && secondaryPhase < 1)) {
            throw new BadInputException("secondary phase " + secondaryPhase + " is not allowed; expected 0 < phase < 1");
        }
        if (!Double.isNaN(windowDays) && !(windowDays > 0 && Double.isFinite(windowDays))) {
            throw new BadInputException("window " + windowDays + " d is not allowed; expected a width > 0 days");
        }
        if (minPoints < 6) {
            throw new BadInputException("minimum points per eclipse " + minPoints + " is not allowed; expected ≥ 6");
        }
        if (bootstrapSamples < 20) {
            throw new BadInputException("bootstrap samples " + bootstrapSamples + " is not allowed; expected ≥ 20");
        }
    }

    /** Secondary at phase 0.5, window estimated, at least 12 points, 200 replicas, depth ≥ 5σ. */
    public static MinimumSettings defaults() {
        return new MinimumSettings(0.5, Double.NaN, 12, 200, 5.0, 1L);
    }

    public MinimumSettings withSecondaryPhase(double phase) {
        return new MinimumSettings(phase, windowDays, minPoints, bootstrapSamples, minDepthSignificance, seed);
    }

    public MinimumSettings withWindowDays(double days) {
        return new MinimumSettings(secondaryPhase, days, minPoints, bootstrapSamples, minDepthSignificance, seed);
    }

    public MinimumSettings withMinPoints(int n) {
        return new MinimumSettings(secondaryPhase, windowDays, n, bootstrapSamples, minDepthSignificance, seed);
    }

    public MinimumSettings withBootstrapSamples(int n) {
        return new MinimumSettings(secondaryPhase, windowDays, minPoints, n, minDepthSignificance, seed);
    }

    public MinimumSettings withSeed(long newSeed) {
        return new MinimumSettings(secondaryPhase, windowDays, minPoints, bootstrapSamples, minDepthSignificance, newSeed);
    }

    /** True when the window width is to be estimated from the data. */
    public boolean estimateWindow() {
        return Double.isNaN(windowDays);
    }
}
