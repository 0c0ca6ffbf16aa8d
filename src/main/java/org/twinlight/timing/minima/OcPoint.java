package org.twinlight.timing.minima;

import org.twinlight.timing.MinimumType;

import java.util.Objects;

/**
 * One point of an O−C diagram.
 *
 * @param cycle cycle number E (integer primary, n + 0.5 secondary)
 * @param type primary or secondary
 * @param timeDays observed time of minimum, days
 * @param errorDays its 1σ uncertainty, days
 * @param ocDays observed minus calculated time, days, against the reference ephemeris
 * @param partial true when the timing came from a partly covered eclipse (see {@link MinimumTime#partial()})
 */
public record OcPoint(double cycle, MinimumType type, double timeDays, double errorDays, double ocDays,
        boolean partial) {
    public OcPoint {
        Objects.requireNonNull(type, "type");
    }
}
