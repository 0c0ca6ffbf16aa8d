package org.twinlight.sky;

import org.apache.commons.math3.geometry.euclidean.threed.Vector3D;
import org.twinlight.time.JulianDate;
import org.twinlight.time.SunAndMoon;

/**
 * The Sun's geocentric place, mean equator and equinox of date, and its distance. The geocentric
 * place serves for the altitude too: the solar parallax (8.8″) is immaterial to darkness.
 *
 * @param direction right ascension and declination, mean equator of date
 * @param distanceAu Earth–Sun distance, au
 */
public record SunPlace(Equatorial direction, double distanceAu) {

    /** One astronomical unit, km (IAU 2012 Resolution B2, exact). */
    public static final double AU_KM = 149597870.700;

    /**
     * The Sun at an instant: the time package's heliocentric Earth (Standish's mean elements,
     * arcsecond-level), negated and precessed to the equator of date (Meeus 1998, ch. 21).
     *
     * @param utc the instant (any geocentric scale), 1800–2050
     */
    public static SunPlace at(JulianDate utc) {
        Vector3D sun = SunAndMoon.sunGeocentricAu(utc);
        double t = SunAndMoon.centuriesSinceJ2000(utc);
        return new SunPlace(Precession.fromJ2000(Equatorial.of(sun), t), sun.getNorm());
    }

    /** The Sun from its geocentric position vector (km, equator of date), e.g. interpolated in a table. */
    public static SunPlace ofVectorKm(Vector3D km) {
        return new SunPlace(Equatorial.of(km), km.getNorm() / AU_KM);
    }

    /** Geocentric position vector, km, equator of date. */
    public Vector3D vectorKm() {
        return direction.unitVector().scalarMultiply(distanceAu * AU_KM);
    }
}
