package org.twinlight.time;

import org.apache.commons.math3.geometry.euclidean.threed.Vector3D;

/**
 * A compact ephemeris of the Earth relative to the Sun and to the solar-system barycentre, in au,
 * in the ICRS (J2000 mean equator and equinox; the ecliptic elements are rotated by the J2000
 * obliquity).
 *
 * <ul>
 *   <li>Planets and the Earth–Moon barycentre: Standish's mean elements ({@link PlanetElements}).
 *   <li>Earth from the Earth–Moon barycentre: minus the Moon's geocentric vector ({@link
 *       LowPrecisionMoon}) times m☾/(m⊕ + m☾), with m⊕/m☾ = 81.30056 (IAU 2009 system, from memory).
 *   <li>Sun from the barycentre: −Σ mᵢrᵢ/(M☉ + Σ mᵢ) over the eight planets.
 * </ul>
 *
 * <p>Valid 1800–2050 (the range of Standish's Table 1). Measured against ERFA {@code eraEpv00}
 * (the IAU SOFA Earth ephemeris) over 1990–2035 in the tests: see docs/time-scales.md.
 */
final class SolarSystemEphemeris {

    /** Earth/Moon mass ratio (IAU 2009 system of astronomical constants; from memory). */
    static final double EARTH_MOON_MASS_RATIO = 81.30056;

    /**
     * Obliquity of the ecliptic at J2000, 84381.406″ (IAU 2006 precession, Capitaine, Wallace &amp;
     * Chapront 2003, A&amp;A 412, 567; from memory). The IAU 1976 value 84381.448″ differs by
     * 0.042″, 1e-7 of the light time: immaterial here.
     */
    static final double OBLIQUITY_J2000_RAD = Math.toRadians(84381.406 / 3600.0);

    /** One astronomical unit in km (IAU 2012 Resolution B2, exact). */
    static final double AU_KM = 149597870.700;

    /** First and last Julian date (TDB) of the range where the elements apply: 1800 Jan 1 to 2050 Dec 31. */
    static final double FIRST_JD = 2378496.5;
    static final double LAST_JD = 2470171.5;

    private SolarSystemEphemeris() {
    }

    /** Earth's position relative to the Sun's centre, au, ICRS axes. */
    static Vector3D earthHeliocentric(JulianDate tdb) {
        return toEquatorial(earthHeliocentricEcliptic(centuries(tdb)));
    }

    /** Earth's position relative to the solar-system barycentre, au, ICRS axes. */
    static Vector3D earthBarycentric(JulianDate tdb) {
        double t = centuries(tdb);
        return toEquatorial(earthHeliocentricEcliptic(t).add(sunBarycentricEcliptic(t)));
    }

    /** The Sun's centre relative to the solar-system barycentre, au, ICRS axes. */
    static Vector3D sunBarycentric(JulianDate tdb) {
        return toEquatorial(sunBarycentricEcliptic(centuries(tdb)));
    }

    private static double centuries(JulianDate tdb) {
        if (tdb.scale().standard() != TimeStandard.TDB) {
            throw new IllegalArgumentException("the ephemeris takes TDB, got " + tdb.scale());
        }
        double jd = tdb.jd();
        if (jd < FIRST_JD || jd > LAST_JD) {
            throw new org.twinlight.BadInputException(String.format(
                    "Julian date %.5f is outside 1800–2050, the range of the solar-system ephemeris used for"
                            + " heliocentric and barycentric corrections (is it an offset date such as"
                            + " BJD − 2457000? give the full Julian date)", jd));
        }
        return tdb.centuriesSinceJ2000();
    }

    private static Vector3D earthHeliocentricEcliptic(double t) {
        Vector3D emb = PlanetElements.EARTH_MOON_BARYCENTRE.heliocentricEcliptic(t);
        Vector3D moon = LowPrecisionMoon.geocentricEclipticKm(t).scalarMultiply(1.0 / AU_KM);
        return emb.subtract(1.0 / (1.0 + EARTH_MOON_MASS_RATIO), moon);
    }

    private static Vector3D sunBarycentricEcliptic(double t) {
        Vector3D weighted = Vector3D.ZERO;
        double totalMass = 1.0;
        for (PlanetElements p : PlanetElements.values()) {
            double mass = 1.0 / p.sunMassRatio;
            weighted = weighted.add(mass, p.heliocentricEcliptic(t));
            totalMass += mass;
        }
        return weighted.scalarMultiply(-1.0 / totalMass);
    }

    /** Rotation from the J2000 ecliptic to the J2000 equator about the x axis (the equinox). */
    static Vector3D toEquatorial(Vector3D ecliptic) {
        double c = Math.cos(OBLIQUITY_J2000_RAD);
        double s = Math.sin(OBLIQUITY_J2000_RAD);
        return new Vector3D(ecliptic.getX(),
                c * ecliptic.getY() - s * ecliptic.getZ(),
                s * ecliptic.getY() + c * ecliptic.getZ());
    }
}
