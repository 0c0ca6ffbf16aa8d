package org.twinlight.orbit;

/**
 * Kepler's equation M = E − e sin E, solved for the eccentric anomaly E.
 *
 * <p>Newton–Raphson from the starting value E₀ = M + 0.85 e·sign(sin M) (Danby 1988,
 * <i>Fundamentals of Celestial Mechanics</i>, 2nd ed., §6.6), which converges for every e &lt; 1,
 * with the mean anomaly first reduced to (−π, π]. Iterates to machine precision: the last
 * correction is below 4 ulp of π.
 */
public final class KeplerEquation {
    private static final double TWO_PI = 2 * Math.PI;
    private static final int MAX_ITERATIONS = 60;

    private KeplerEquation() {
    }

    /**
     * Eccentric anomaly for a mean anomaly, radians.
     *
     * @param meanAnomalyRad mean anomaly M, any value
     * @param eccentricity 0 ≤ e &lt; 1
     * @return E in (−π, π], the same branch as the reduced M
     */
    public static double eccentricAnomaly(double meanAnomalyRad, double eccentricity) {
        if (!(eccentricity >= 0 && eccentricity < 1)) {
            throw new IllegalArgumentException("eccentricity must be in [0, 1), got " + eccentricity);
        }
        double m = reduce(meanAnomalyRad);
        if (eccentricity == 0 || m == 0 || m == Math.PI) {
            return m;
        }
        double e = eccentricity;
        double ecc = m + 0.85 * e * Math.signum(Math.sin(m));
        for (int i = 0; i < MAX_ITERATIONS; i++) {
            double s = Math.sin(ecc);
            double f = ecc - e * s - m;
            double fp = 1 - e * Math.cos(ecc);
            double step = f / fp;
            ecc -= step;
            if (Math.abs(step) <= 4 * Math.ulp(Math.PI)) {
                break;
            }
        }
        return ecc;
    }

    /** True anomaly ν for eccentric anomaly E (radians), in (−π, π]. */
    public static double trueAnomaly(double eccentricAnomalyRad, double eccentricity) {
        double e = eccentricity;
        // tan(ν/2) = √((1+e)/(1−e)) tan(E/2), written with atan2 to keep the quadrant
        double half = eccentricAnomalyRad / 2;
        return 2 * Math.atan2(Math.sqrt(1 + e) * Math.sin(half), Math.sqrt(1 - e) * Math.cos(half));
    }

    /** Mean anomaly M for true anomaly ν (radians), in (−π, π]. */
    public static double meanAnomalyOfTrueAnomaly(double trueAnomalyRad, double eccentricity) {
        double e = eccentricity;
        double half = trueAnomalyRad / 2;
        double ecc = 2 * Math.atan2(Math.sqrt(1 - e) * Math.sin(half), Math.sqrt(1 + e) * Math.cos(half));
        return reduce(ecc - e * Math.sin(ecc));
    }

    /** An angle reduced to (−π, π]. */
    static double reduce(double angleRad) {
        double a = Math.IEEEremainder(angleRad, TWO_PI);
        return a == -Math.PI ? Math.PI : a;
    }
}
