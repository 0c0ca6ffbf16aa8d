package org.twinlight.sky;

import org.apache.commons.math3.geometry.euclidean.threed.Rotation;
import org.apache.commons.math3.geometry.euclidean.threed.RotationConvention;
import org.apache.commons.math3.geometry.euclidean.threed.Vector3D;
import org.twinlight.time.JulianDate;
import org.twinlight.time.SunAndMoon;

/**
 * The Moon seen from a site: its topocentric place (mean equator of date), distance and the
 * illuminated fraction of its disc.
 *
 * @param direction topocentric right ascension and declination, mean equator of date
 * @param distanceKm distance from the site, km
 * @param illuminatedFraction illuminated fraction of the disc, 0–1
 */
public record MoonPlace(Equatorial direction, double distanceKm, double illuminatedFraction) {

    /** Earth's equatorial radius, km (IAU 1976; Meeus 1998, ch. 11). */
    static final double EARTH_EQUATORIAL_RADIUS_KM = 6378.14;

    /** Polar/equatorial axis ratio b/a = 1 − f with f = 1/298.257 (IAU 1976; Meeus 1998, ch. 11). */
    static final double EARTH_AXIS_RATIO = 0.99664719;

    /**
     * The Moon from a site at an instant: the time package's low-precision geocentric Moon (about
     * 0.3°), ecliptic of date rotated to the equator of date by the mean obliquity (Meeus eq. 22.2),
     * less the site's geocentric position (Meeus ch. 11) for the topocentric place (the parallax
     * reaches 1°); the illuminated fraction from the geocentric Sun and Moon (Meeus ch. 48).
     *
     * @param utc the instant (UTC), 1800–2050
     * @param site the site
     * @param sun the Sun at the same instant
     */
    public static MoonPlace at(JulianDate utc, Site site, SunPlace sun) {
        return seenFrom(geocentricKm(utc), site, SiderealTime.localMeanDeg(utc, site), sun);
    }

    /**
     * The Moon's geocentric position, km, mean equator and equinox of date: the low-precision
     * ecliptic position rotated by the mean obliquity of date (Meeus 1998, eq. 22.2).
     *
     * @param utc the instant, 1800–2050
     */
    public static Vector3D geocentricKm(JulianDate utc) {
        double t = SunAndMoon.centuriesSinceJ2000(utc);
        return eclipticToEquatorial(SunAndMoon.moonGeocentricEclipticOfDateKm(t), Precession.meanObliquityDeg(t));
    }

    /**
     * The Moon seen from a site, from its geocentric position (e.g. interpolated in a table).
     *
     * @param geocentricKm geocentric Moon, km, equator of date
     * @param site the site
     * @param localSiderealDeg local sidereal time at the instant, degrees
     * @param sun the Sun at the instant
     */
    public static MoonPlace seenFrom(Vector3D geocentricKm, Site site, double localSiderealDeg, SunPlace sun) {
        Vector3D topocentric = geocentricKm.subtract(siteVectorKm(site, localSiderealDeg));
        double k = illuminatedFraction(geocentricKm, sun.vectorKm());
        return new MoonPlace(Equatorial.of(topocentric), topocentric.getNorm(), k);
    }

    /** Rotation about the equinox direction by the obliquity: ecliptic to equatorial axes. */
    static Vector3D eclipticToEquatorial(Vector3D ecliptic, double obliquityDeg) {
        Rotation r = new Rotation(Vector3D.PLUS_I, Math.toRadians(obliquityDeg), RotationConvention.VECTOR_OPERATOR);
        return r.applyTo(ecliptic);
    }

    /**
     * The site's geocentric position, km, equator of date: ρ sin φ′ and ρ cos φ′ from the geodetic
     * latitude and height (Meeus 1998, ch. 11), at the local sidereal time as right ascension.
     */
    static Vector3D siteVectorKm(Site site, double localSiderealDeg) {
        double phi = Math.toRadians(site.latitudeDeg());
        double u = Math.atan(EARTH_AXIS_RATIO * Math.tan(phi));
        double h = site.heightM() / (EARTH_EQUATORIAL_RADIUS_KM * 1000.0);
        double rhoSin = EARTH_AXIS_RATIO * Math.sin(u) + h * Math.sin(phi);
        double rhoCos = Math.cos(u) + h * Math.cos(phi);
        double lst = Math.toRadians(localSiderealDeg);
        return new Vector3D(rhoCos * Math.cos(lst), rhoCos * Math.sin(lst), rhoSin)
                .scalarMultiply(EARTH_EQUATORIAL_RADIUS_KM);
    }

    /**
     * Illuminated fraction k = (1 + cos i)/2 of the Moon, with the phase angle i the angle at the
     * Moon between the Sun and the Earth (Meeus 1998, eqs. 48.1–48.3, here from vectors).
     *
     * @param moonKm geocentric Moon, km
     * @param sunKm geocentric Sun, km, same axes
     */
    public static double illuminatedFraction(Vector3D moonKm, Vector3D sunKm) {
        Vector3D toSun = sunKm.subtract(moonKm);
        Vector3D toEarth = moonKm.negate();
        double cosI = Math.cos(Math.atan2(toSun.crossProduct(toEarth).getNorm(), toSun.dotProduct(toEarth)));
        return (1 + cosI) / 2;
    }
}
