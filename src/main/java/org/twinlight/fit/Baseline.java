package org.twinlight.fit;

import java.util.Locale;
import java.util.Optional;

/**
 * The flux normalisation fitted with the model, per segment of data: the model is multiplied by
 * a polynomial in time of the given degree (none: fixed at 1).
 */
public enum Baseline {
    /** Data already normalised: no factor. */
    NONE(-1),
    /** One scale factor per segment. */
    OFFSET(0),
    /** Scale factor linear in time per segment. */
    LINEAR(1),
    /** Scale factor quadratic in time per segment. */
    QUADRATIC(2);

    private final int degree;

    Baseline(int degree) {
        this.degree = degree;
    }

    /** Polynomial degree, −1 for none. */
    public int degree() {
        return degree;
    }

    /** Name as used on the command line and in files. */
    public String label() {
        return name().toLowerCase(Locale.ROOT);
    }

    /** Parses none|offset|linear|quadratic. */
    public static Optional<Baseline> parse(String s) {
        if (s == null) {
            return Optional.empty();
        }
        for (Baseline b : values()) {
            if (b.label().equals(s.trim().toLowerCase(Locale.ROOT))) {
                return Optional.of(b);
            }
        }
        return Optional.empty();
    }
}
