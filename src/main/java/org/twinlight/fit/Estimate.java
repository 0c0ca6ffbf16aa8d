package org.twinlight.fit;

/**
 * A fitted or derived quantity with its 1σ uncertainty.
 *
 * @param name contract name, e.g. {@code radius1}, {@code limbDarkening1.a}, {@code lightRatio}
 * @param band band name for band-dependent quantities, else null
 * @param value best value
 * @param uncertainty 1σ uncertainty (0 for a fixed parameter); for a value at a physical bound,
 *     the one-sided distance to where the profile of χ² has risen by 1
 * @param free whether the quantity was free in the fit (derived quantities: whether it depends
 *     on a free parameter)
 * @param limit the one-sided limit when the best value sits at a physical bound, else null
 */
public record Estimate(String name, String band, double value, double uncertainty, boolean free, Limit limit) {

    /** An estimate without a limit. */
    public Estimate(String name, String band, double value, double uncertainty, boolean free) {
        this(name, band, value, uncertainty, free, null);
    }

    /**
     * A one-sided limit for a value at a physical bound (i = 90°, e = 0, ℓ₃ = 0).
     *
     * @param side {@code lower} when the data bound the value from below (i ≥ x), {@code upper}
     *     when from above (e ≤ x)
     * @param value95 the 95% one-sided limit
     */
    public record Limit(String side, double value95) {
    }

    /** Whether a one-sided limit replaces the two-sided uncertainty. */
    public boolean isLimit() {
        return limit != null;
    }
}
