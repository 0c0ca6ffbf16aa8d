package org.twinlight.timing;

import java.util.Locale;

/** Which eclipse a time of minimum belongs to: primary (deeper, cycle E integer) or secondary (E + 0.5). */
public enum MinimumType {
    PRIMARY,
    SECONDARY;

    /** The label used in files: {@code primary} or {@code secondary}. */
    public String label() {
        return name().toLowerCase(Locale.ROOT);
    }

    /** The cycle-number offset of this type: 0 for primary, 0.5 for secondary. */
    public double cycleOffset() {
        return this == PRIMARY ? 0.0 : 0.5;
    }
}
