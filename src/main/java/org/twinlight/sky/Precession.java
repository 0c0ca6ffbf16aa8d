package org.twinlight.sky;

/**
 * Precession of equatorial coordinates from J2000.0 to the mean equator and equinox of date, by
 * the rigorous method of Meeus 1998, <i>Astronomical Algorithms</i>, eqs. 21.3 and 21.4 (the IAU
 * 1976 angles ζ, z, θ). Nutation (≤ 17″) and aberration (≤ 21″) are not applied.
 */
public final class Precession {

    private Precession() {
    }

    /**
     * A J2000 direction referred to the mean equator and equinox of date.
     *
     * @param j2000 the direction, J2000
     * @param centuriesTt Julian centuries of TT from J2000.0 to the date
     */
    public static Equatorial fromJ2000(Equatorial j2000, double centuriesTt) {
        double t = centuriesTt;
        double zeta = Math.toRadians((2306.2181 * t + 0.30188 * t * t + 0.017998 * t * t * t) / 3600.0);
        double z = Math.toRadians((2306.2181 * t + 1.09468 * t * t + 0.018203 * t * t * t) / 3600.0);
        double theta = Math.toRadians((2004.3109 * t - 0.42665 * t * t - 0.041833 * t * t * t) / 3600.0);
        double ra0 = Math.toRadians(j2000.raDeg());
        double dec0 = Math.toRadians(j2000.decDeg());
        double a = Math.cos(dec0) * Math.sin(ra0 + zeta);
        double b = Math.cos(theta) * Math.cos(dec0) * Math.cos(ra0 + zeta) - Math.sin(theta) * Math.sin(dec0);
        double c = Math.sin(theta) * Math.cos(dec0) * Math.cos(ra0 + zeta) + Math.cos(theta) * Math.sin(dec0);
        double ra = Math.toDegrees(Math.atan2(a, b) + z);
        // atan2 of the components rather than asin(c): exact near the poles
        double dec = Math.toDegrees(Math.atan2(c, Math.hypot(a, b)));
        return new Equatorial(SiderealTime.normalise(ra), dec);
    }

    /**
     * Mean obliquity of the ecliptic of date, degrees (Meeus 1998, eq. 22.2, IAU 1976).
     *
     * @param centuriesTt Julian centuries of TT from J2000.0
     */
    public static double meanObliquityDeg(double centuriesTt) {
        double t = centuriesTt;
        return 23.0 + 26.0 / 60.0 + (21.448 - 46.8150 * t - 0.00059 * t * t + 0.001813 * t * t * t) / 3600.0;
    }
}
