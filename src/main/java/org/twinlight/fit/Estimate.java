package org.twinlight.fit;

/**
 * A fitted or derived quantity with its 1σ uncertainty.
 *
 * @param name contract name, e.g. {@code radius1}, {@code limbDarkening1.a}, {@code lightRatio}
 * @param band band name for band-dependent quantities, else null
 * @param value best value
 * @param uncertainty 1σ uncertainty (0 for a fixed parameter)
 * @param free whether the quantity was free in the fit (derived quantities: whether it depends
 *     on a free parameter)
 */
public record Estimate(String name, String band, double value, double uncertainty, boolean free) {
}
