package org.twinlight.sky;

import org.apache.commons.math3.geometry.euclidean.threed.Vector3D;

/**
 * A direction in equatorial coordinates (of whatever equator and equinox the caller says: J2000
 * for catalogue positions, the mean equator of date after {@link Precession}).
 *
 * @param raDeg right ascension, degrees in [0, 360)
 * @param decDeg declination, degrees in [−90, 90]
 */
public record Equatorial(double raDeg, double decDeg) {

    /** The direction of a (non-zero) vector. */
    public static Equatorial of(Vector3D v) {
        double ra = Math.toDegrees(Math.atan2(v.getY(), v.getX()));
        double dec = Math.toDegrees(Math.asin(Math.max(-1, Math.min(1, v.getZ() / v.getNorm()))));
        return new Equatorial(ra < 0 ? ra + 360 : ra, dec);
    }

    /** Unit vector of this direction. */
    public Vector3D unitVector() {
        double ra = Math.toRadians(raDeg);
        double dec = Math.toRadians(decDeg);
        return new Vector3D(Math.cos(dec) * Math.cos(ra), Math.cos(dec) * Math.sin(ra), Math.sin(dec));
    }

    /** Angular distance to another direction of the same equator, degrees (atan2 form, exact near 0° and 180°). */
    public double separationDeg(Equatorial other) {
        Vector3D a = unitVector();
        Vector3D b = other.unitVector();
        return Math.toDegrees(Math.atan2(a.crossProduct(b).getNorm(), a.dotProduct(b)));
    }
}
