package org.twinlight.planning;

import java.util.Locale;
import org.twinlight.BadInputException;

/**
 * When a moment counts as observable: the target at least {@code minAltitudeDeg} above the
 * horizon and the Sun at most {@code sunBelowDeg} (geometric altitudes).
 *
 * @param minAltitudeDeg lowest target altitude, degrees in [0, 90)
 * @param sunBelowDeg highest Sun altitude, degrees in [−90, 0]
 */
public record ObservingLimits(double minAltitudeDeg, double sunBelowDeg) {

    /** 30° target altitude (airmass 2) and the Sun below −12° (nautical twilight over): common practice, no source. */
    public static final ObservingLimits DEFAULT = new ObservingLimits(30, -12);

    /** @throws BadInputException for limits outside their ranges */
    public ObservingLimits {
        if (!(minAltitudeDeg >= 0 && minAltitudeDeg < 90)) {
            throw new BadInputException(String.format(Locale.ROOT,
                    "--min-altitude %s° is outside 0° to 90°", minAltitudeDeg));
        }
        if (!(sunBelowDeg >= -90 && sunBelowDeg <= 0)) {
            throw new BadInputException(String.format(Locale.ROOT,
                    "--sun-below %s° is outside −90° to 0° (e.g. −6 civil, −12 nautical, −18 astronomical)",
                    sunBelowDeg));
        }
    }

    public ObservingLimits withMinAltitudeDeg(double v) {
        return new ObservingLimits(v, sunBelowDeg);
    }

    public ObservingLimits withSunBelowDeg(double v) {
        return new ObservingLimits(minAltitudeDeg, v);
    }
}
