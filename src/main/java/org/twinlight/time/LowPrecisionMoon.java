package org.twinlight.time;

import org.apache.commons.math3.geometry.euclidean.threed.Vector3D;

/**
 * The Moon's geocentric position from the low-precision formulae of The Astronomical Almanac
 * (section D, "Low-precision formulae for geocentric coordinates of the Moon"; coefficients from
 * memory), quoted as good to about 0.3° in longitude, 0.2° in latitude and 0.003° in parallax
 * over 1900–2100. Used to move from the Earth–Moon barycentre to the Earth, an offset of about
 * 4700 km (16 ms of light time), where 1 % accuracy is ample, and by {@link SunAndMoon} for the
 * Moon's place in the sky when planning observations, where 0.3° is ample too.
 */
final class LowPrecisionMoon {

    /** Earth's equatorial radius used with the parallax, km (IAU 1976; from memory). */
    private static final double EARTH_RADIUS_KM = 6378.14;

    /** General precession in longitude, degrees per Julian century (IAU 1976; Meeus 1998 eq. 21.6, from memory). */
    private static final double PRECESSION_DEG_PER_CENTURY = 1.396971;

    private LowPrecisionMoon() {
    }

    /**
     * Geocentric position of the Moon in km, mean ecliptic and equinox of J2000 (the ecliptic of
     * date rotated back by the general precession in longitude, enough at this accuracy).
     *
     * @param t Julian centuries of TDB from J2000.0
     */
    static Vector3D geocentricEclipticKm(double t) {
        return eclipticKm(t, PRECESSION_DEG_PER_CENTURY * t);
    }

    /**
     * Geocentric position of the Moon in km, mean ecliptic and equinox of date (the formulae's own
     * frame).
     *
     * @param t Julian centuries of TDB (or TT) from J2000.0
     */
    static Vector3D geocentricEclipticOfDateKm(double t) {
        return eclipticKm(t, 0);
    }

    private static Vector3D eclipticKm(double t, double longitudeShiftDeg) {
        double longitudeDeg = 218.32 + 481267.881 * t
                + 6.29 * sinDeg(135.0 + 477198.87 * t)
                - 1.27 * sinDeg(259.3 - 413335.36 * t)
                + 0.66 * sinDeg(235.7 + 890534.22 * t)
                + 0.21 * sinDeg(269.9 + 954397.74 * t)
                - 0.19 * sinDeg(357.5 + 35999.05 * t)
                - 0.11 * sinDeg(186.5 + 966404.03 * t)
                - longitudeShiftDeg;
        double latitudeDeg = 5.13 * sinDeg(93.3 + 483202.02 * t)
                + 0.28 * sinDeg(228.2 + 960400.89 * t)
                - 0.28 * sinDeg(318.3 + 6003.15 * t)
                - 0.17 * sinDeg(217.6 - 407332.21 * t);
        double parallaxDeg = 0.9508
                + 0.0518 * cosDeg(135.0 + 477198.87 * t)
                + 0.0095 * cosDeg(259.3 - 413335.36 * t)
                + 0.0078 * cosDeg(235.7 + 890534.22 * t)
                + 0.0028 * cosDeg(269.9 + 954397.74 * t);
        double distanceKm = EARTH_RADIUS_KM / Math.sin(Math.toRadians(parallaxDeg));
        double lon = Math.toRadians(longitudeDeg);
        double lat = Math.toRadians(latitudeDeg);
        return new Vector3D(distanceKm * Math.cos(lat) * Math.cos(lon),
                distanceKm * Math.cos(lat) * Math.sin(lon),
                distanceKm * Math.sin(lat));
    }

    private static double sinDeg(double deg) {
        return Math.sin(Math.toRadians(Math.IEEEremainder(deg, 360.0)));
    }

    private static double cosDeg(double deg) {
        return Math.cos(Math.toRadians(Math.IEEEremainder(deg, 360.0)));
    }
}
