package org.twinlight.fit;

import java.util.Locale;

/**
 * One model parameter as the fit sees it, in the contract's units.
 *
 * @param name contract name, e.g. {@code radius1}, {@code limbDarkening1.a}
 * @param band band of a band-dependent parameter, else null
 * @param value starting (or fixed) value
 * @param scale about the uncertainty expected from good data, same unit as the value; the solver's
 *     coordinates and finite-difference steps are derived from it
 * @param lower lower bound of the physical range
 * @param upper upper bound of the physical range
 * @param edge the bound that is an ordinary, reachable value (i = 90°, e = 0, ℓ₃ = 0) at which a
 *     one-sided limit is reported when the best value sits there
 * @param free whether the fit adjusts it
 */
public record FitParameter(String name, String band, double value, double scale, double lower, double upper,
        Edge edge, boolean free) {

    /** Which bound, if any, is a reachable value of the parameter. */
    public enum Edge {
        /** Neither bound can be reached (or the parameter is unbounded). */
        NONE,
        /** The lower bound is a physical value (e = 0, ℓ₃ = 0): an upper limit is reported there. */
        LOWER,
        /** The upper bound is a physical value (i = 90°): a lower limit is reported there. */
        UPPER
    }

    public FitParameter {
        if (!(scale > 0) || !Double.isFinite(scale)) {
            throw new IllegalArgumentException(name + ": the scale must be positive, got " + scale);
        }
        if (!(lower < upper)) {
            throw new IllegalArgumentException(name + ": bounds must satisfy lower < upper, got " + lower + ", "
                    + upper);
        }
    }

    /** The value of the bound named by {@link #edge()} (NaN when there is none). */
    public double edgeValue() {
        return switch (edge) {
            case LOWER -> lower;
            case UPPER -> upper;
            case NONE -> Double.NaN;
        };
    }

    /** Name with its band, as used in messages and correlation tables ({@code thirdLight@R}). */
    public String label(boolean multiBand) {
        return band == null || !multiBand ? name : name + "@" + band;
    }

    public FitParameter withValue(double v) {
        return new FitParameter(name, band, v, scale, lower, upper, edge, free);
    }

    public FitParameter withFree(boolean f) {
        return new FitParameter(name, band, value, scale, lower, upper, edge, f);
    }

    @Override
    public String toString() {
        return String.format(Locale.ROOT, "%s%s = %s (scale %s, %s)", name, band == null ? "" : "@" + band, value,
                scale, free ? "free" : "fixed");
    }
}
