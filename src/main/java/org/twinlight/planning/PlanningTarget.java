package org.twinlight.planning;

import org.twinlight.BadInputException;
import org.twinlight.time.SkyDirection;

/**
 * One star to plan for.
 *
 * @param name label in tables and files
 * @param direction J2000 right ascension and declination
 * @param ephemeris when its minima fall, with errors and time scale
 * @param extent how long its eclipses last
 */
public record PlanningTarget(String name, SkyDirection direction, PredictionEphemeris ephemeris,
        EclipseExtent extent) {

    public PlanningTarget {
        if (name == null || name.isBlank()) {
            throw new BadInputException("a target needs a name");
        }
        if (direction == null || ephemeris == null || extent == null) {
            throw new BadInputException("target '" + name + "' needs a position, an ephemeris and an eclipse duration");
        }
    }
}
