package org.twinlight.planning;

import org.twinlight.sky.Horizontal;
import org.twinlight.time.JulianDate;

/**
 * The target and the Sun at one moment of an eclipse.
 *
 * @param utc the moment, UTC
 * @param target the target's topocentric horizontal position (geometric)
 * @param sunAltitudeDeg the Sun's geometric altitude, degrees
 */
public record SkyAtMoment(JulianDate utc, Horizontal target, double sunAltitudeDeg) {
}
