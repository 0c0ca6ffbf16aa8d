package org.twinlight.time;

import org.apache.commons.math3.geometry.euclidean.threed.Vector3D;

/**
 * Geocentric positions of the Sun and the Moon from the ephemerides this package already uses for
 * light-time corrections, for planning observations: the Sun from the Earth's heliocentric
 * position ({@link SolarSystemEphemeris}, Standish's mean elements, 1800–2050) and the Moon from
 * the low-precision formulae ({@link LowPrecisionMoon}, about 0.3°). Positions are geometric (no
 * light time, aberration or nutation: each below 21″).
 */
public final class SunAndMoon {

    /** Julian date of J2000.0 (TT), days. */
    private static final double J2000_JD = 2451545.0;

    /** Days in a Julian century. */
    private static final double DAYS_PER_CENTURY = 36525.0;

    private SunAndMoon() {
    }

    /**
     * Julian centuries of TT from J2000.0 at a geocentric instant (TT and TDB differ by less than
     * 2 ms, immaterial here).
     *
     * @param date a geocentric instant (JD scale of any standard)
     */
    public static double centuriesSinceJ2000(JulianDate date) {
        JulianDate tt = TimeStandards.convert(date, TimeStandard.TT);
        return ((tt.dayStartJd() - J2000_JD) + tt.fractionOfDay()) / DAYS_PER_CENTURY;
    }

    /**
     * The Sun's geocentric position in au, ICRS axes (J2000 mean equator and equinox).
     *
     * @param date a geocentric instant in 1800–2050
     */
    public static Vector3D sunGeocentricAu(JulianDate date) {
        JulianDate tdb = TimeStandards.convert(date, TimeStandard.TDB);
        return SolarSystemEphemeris.earthHeliocentric(tdb).negate();
    }

    /**
     * The Moon's geocentric position in km, mean ecliptic and equinox of date.
     *
     * @param centuriesTt Julian centuries of TT from J2000.0 ({@link #centuriesSinceJ2000})
     */
    public static Vector3D moonGeocentricEclipticOfDateKm(double centuriesTt) {
        return LowPrecisionMoon.geocentricEclipticOfDateKm(centuriesTt);
    }
}
