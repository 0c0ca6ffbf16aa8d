package org.twinlight.time;

/**
 * The Sun's geocentric position by Meeus, Astronomical Algorithms, 2nd ed. (1998), ch. 25,
 * "low accuracy" method (accuracy 0.01°, Meeus's own claim): an independent check of the
 * ephemeris in the main code, kept with the tests.
 */
final class MeeusLowPrecisionSun {

    final double t;
    final double meanLongitudeDeg;
    final double meanAnomalyDeg;
    final double eccentricity;
    final double centreDeg;
    final double trueLongitudeDeg;
    final double radiusAu;
    final double omegaDeg;
    final double apparentLongitudeDeg;
    final double meanObliquityDeg;
    final double apparentRaDeg;
    final double apparentDecDeg;

    /** @param jde Julian ephemeris day (TT/TDB) */
    MeeusLowPrecisionSun(double jde) {
        t = (jde - 2451545.0) / 36525.0;
        meanLongitudeDeg = 280.46646 + 36000.76983 * t + 0.0003032 * t * t;            // eq. 25.2
        meanAnomalyDeg = 357.52911 + 35999.05029 * t - 0.0001537 * t * t;               // eq. 25.3
        eccentricity = 0.016708634 - 0.000042037 * t - 0.0000001267 * t * t;            // eq. 25.4
        double m = Math.toRadians(meanAnomalyDeg);
        centreDeg = (1.914602 - 0.004817 * t - 0.000014 * t * t) * Math.sin(m)
                + (0.019993 - 0.000101 * t) * Math.sin(2 * m) + 0.000289 * Math.sin(3 * m);
        trueLongitudeDeg = meanLongitudeDeg + centreDeg;
        double nu = Math.toRadians(meanAnomalyDeg + centreDeg);
        radiusAu = 1.000001018 * (1 - eccentricity * eccentricity) / (1 + eccentricity * Math.cos(nu)); // eq. 25.5
        omegaDeg = 125.04 - 1934.136 * t;
        double omega = Math.toRadians(omegaDeg);
        apparentLongitudeDeg = trueLongitudeDeg - 0.00569 - 0.00478 * Math.sin(omega);
        meanObliquityDeg = (84381.448 - 46.8150 * t - 0.00059 * t * t + 0.001813 * t * t * t) / 3600.0; // eq. 22.2
        double eps = Math.toRadians(meanObliquityDeg + 0.00256 * Math.cos(omega));      // eq. 25.8
        double lambda = Math.toRadians(apparentLongitudeDeg);
        apparentRaDeg = Math.toDegrees(Math.atan2(Math.cos(eps) * Math.sin(lambda), Math.cos(lambda)));
        apparentDecDeg = Math.toDegrees(Math.asin(Math.sin(eps) * Math.sin(lambda)));
    }

    /**
     * True geometric longitude referred to the mean equinox of J2000, degrees: Meeus 1998, ch. 25,
     * λ₂₀₀₀ = ☉ − 0.01397° × (year − 2000).
     */
    double trueLongitudeJ2000Deg() {
        return trueLongitudeDeg - 0.01397 * (t * 100.0);
    }
}
