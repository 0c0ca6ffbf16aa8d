package org.twinlight.sky;

/**
 * How dark the sky is, by the Sun's geometric altitude: the usual twilight limits of 0°, −6°, −12°
 * and −18° (civil, nautical and astronomical twilight; e.g. The Astronomical Almanac, glossary,
 * from memory).
 */
public enum Darkness {
    DAY("day"),
    CIVIL_TWILIGHT("civil twilight"),
    NAUTICAL_TWILIGHT("nautical twilight"),
    ASTRONOMICAL_TWILIGHT("astronomical twilight"),
    NIGHT("night");

    private final String label;

    Darkness(String label) {
        this.label = label;
    }

    /** Words for tables and messages. */
    public String label() {
        return label;
    }

    /** The darkness for a Sun altitude in degrees. */
    public static Darkness of(double sunAltitudeDeg) {
        if (sunAltitudeDeg >= 0) {
            return DAY;
        }
        if (sunAltitudeDeg >= -6) {
            return CIVIL_TWILIGHT;
        }
        if (sunAltitudeDeg >= -12) {
            return NAUTICAL_TWILIGHT;
        }
        if (sunAltitudeDeg >= -18) {
            return ASTRONOMICAL_TWILIGHT;
        }
        return NIGHT;
    }
}
