package org.twinlight.timing.period;

/**
 * One eclipse measured in light curve folded at a period: where it sits, how deep and how long.
 *
 * @param phase centre of the eclipse, fraction of the period after the primary eclipse (0 for the
 *     primary itself)
 * @param depth depth at minimum: out-of-eclipse level (the other eclipse left out) minus the mean level in
 *     the inner half of the eclipse box, relative flux
 * @param depthError 1σ error of the depth, from the point-to-point scatter (1.4826 × MAD)
 * @param duration equivalent duration (the dip's area over twice its box width, divided by the depth at
 *     minimum), fraction of the period; the full width minus the ingress for a trapezoid, about half
 *     the full width for a V-shaped eclipse
 * @param durationError 1σ error of the duration
 * @param signalToNoise depth / depthError
 */
public record EclipseEvent(double phase, double depth, double depthError, double duration, double durationError,
        double signalToNoise) {
}
