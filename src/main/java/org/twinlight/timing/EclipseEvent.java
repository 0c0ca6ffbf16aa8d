package org.twinlight.timing;

/**
 * One eclipse measured in light curve folded at a period: where it sits, how deep and how long.
 *
 * @param phase centre of the eclipse, fraction of the period after the primary eclipse (0 for the
 *     primary itself)
 * @param depth out-of-eclipse level minus the mean level inside the eclipse, relative flux
 * @param depthError 1σ error of the depth, from the point-to-point scatter
 * @param duration equivalent duration (the dip's area divided by its depth), fraction of the period;
 *     equal to the width for a flat-bottomed eclipse, about half the full width for a V-shaped one
 * @param durationError 1σ error of the duration
 * @param signalToNoise depth / depthError
 */
public record EclipseEvent(double phase, double depth, double depthError, double duration, double durationError,
        double signalToNoise) {
}
