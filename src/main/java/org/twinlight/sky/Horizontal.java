package org.twinlight.sky;

/**
 * Horizontal coordinates: geometric altitude (no refraction) and azimuth measured from the north
 * through the east, degrees.
 *
 * @param altitudeDeg altitude above the horizon, degrees in [−90, 90]
 * @param azimuthDeg azimuth from north through east, degrees in [0, 360)
 */
public record Horizontal(double altitudeDeg, double azimuthDeg) {

    /**
     * Equatorial to horizontal coordinates (Meeus 1998, <i>Astronomical Algorithms</i>, eqs. 13.5
     * and 13.6, whose azimuth counts from the south; 180° is added here).
     *
     * @param direction the body, equator of date
     * @param latitudeDeg the site's latitude
     * @param localSiderealDeg local sidereal time, degrees
     */
    public static Horizontal of(Equatorial direction, double latitudeDeg, double localSiderealDeg) {
        double h = Math.toRadians(localSiderealDeg - direction.raDeg());
        double phi = Math.toRadians(latitudeDeg);
        double dec = Math.toRadians(direction.decDeg());
        double sinAlt = Math.sin(phi) * Math.sin(dec) + Math.cos(phi) * Math.cos(dec) * Math.cos(h);
        // Meeus's tan A = sin H / (cos H sin φ − tan δ cos φ), multiplied through by cos δ so that
        // it stays finite at the poles
        double azimuthFromSouth = Math.atan2(Math.sin(h) * Math.cos(dec),
                Math.cos(h) * Math.sin(phi) * Math.cos(dec) - Math.sin(dec) * Math.cos(phi));
        double az = SiderealTime.normalise(Math.toDegrees(azimuthFromSouth) + 180.0);
        return new Horizontal(Math.toDegrees(Math.asin(Math.max(-1, Math.min(1, sinAlt)))), az);
    }

    /** Altitude only (cheaper: one sine formula), degrees. */
    public static double altitudeDeg(Equatorial direction, double latitudeDeg, double localSiderealDeg) {
        double h = Math.toRadians(localSiderealDeg - direction.raDeg());
        double phi = Math.toRadians(latitudeDeg);
        double dec = Math.toRadians(direction.decDeg());
        double sinAlt = Math.sin(phi) * Math.sin(dec) + Math.cos(phi) * Math.cos(dec) * Math.cos(h);
        return Math.toDegrees(Math.asin(Math.max(-1, Math.min(1, sinAlt))));
    }
}
