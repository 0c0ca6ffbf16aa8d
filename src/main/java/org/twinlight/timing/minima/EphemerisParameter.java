package org.twinlight.timing.minima;

/**
 * One fitted or derived quantity of an ephemeris model.
 *
 * @param name name used in files (e.g. {@code period}, {@code dPdE})
 * @param value value in {@code unit}
 * @param uncertainty 1σ, same unit; NaN when it could not be estimated
 * @param unit unit, e.g. {@code d}, {@code d/cycle}, {@code deg}, {@code 1}
 */
public record EphemerisParameter(String name, double value, double uncertainty, String unit) {
}
