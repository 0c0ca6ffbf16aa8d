package org.twinlight.timing.minima;

import java.util.Locale;
import java.util.Optional;

/** How a time of minimum was measured. */
public enum MinimumMethod {
    /**
     * Kwee &amp; van Woerden (1956, Bull. Astron. Inst. Netherlands 12, 327): reflection of the
     * eclipse about trial times, quadratic fit of the sum of squared differences.
     */
    KVW("kvw"),
    /**
     * Least-squares fit of a symmetric template (made by folding all eclipses of the same type) to
     * one eclipse, with the time, depth and baseline free.
     */
    TEMPLATE("template");

    private final String label;

    MinimumMethod(String label) {
        this.label = label;
    }

    /** The label used in files and on the command line. */
    public String label() {
        return label;
    }

    /** The method with this label (case does not matter), or empty. */
    public static Optional<MinimumMethod> parse(String text) {
        if (text == null) {
            return Optional.empty();
        }
        String s = text.trim().toLowerCase(Locale.ROOT);
        for (MinimumMethod m : values()) {
            if (m.label.equals(s)) {
                return Optional.of(m);
            }
        }
        return Optional.empty();
    }
}
