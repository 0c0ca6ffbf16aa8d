package org.twinlight.velocity;

/**
 * One reported value of a velocity fit.
 *
 * @param name name as in {@code velocities.json} ({@code k1}, {@code gamma},
 *     {@code offset.NAME}, ...)
 * @param value the value
 * @param uncertainty its 1σ uncertainty (0 when fixed, NaN when not estimated)
 * @param free whether it was fitted
 * @param unit its unit
 */
public record VelocityEstimate(String name, double value, double uncertainty, boolean free, String unit) {
}
