package org.twinlight.testsupport;

/**
 * Kepler's equation M = E − e sin E solved by bisection, for tests that need positions on an orbit
 * computed independently of the production solver: the function is monotonic in E, so bisection
 * cannot miss, and it shares no code with {@code orbit.KeplerEquation}. The true anomaly follows from
 * tan(ν/2) = √((1 + e)/(1 − e))·tan(E/2) (e.g. Murray &amp; Dermott 1999, Solar System Dynamics,
 * eq. 2.46).
 */
public final class BisectionKepler {

    private BisectionKepler() {
    }

    /** Eccentric anomaly in [0, 2π) for mean anomaly {@code meanAnomaly} (radians, any value) and eccentricity e. */
    public static double eccentricAnomaly(double meanAnomaly, double e) {
        double m = meanAnomaly - 2 * Math.PI * Math.floor(meanAnomaly / (2 * Math.PI));
        double lo = 0;
        double hi = 2 * Math.PI;
        for (int i = 0; i < 200; i++) {
            double mid = 0.5 * (lo + hi);
            if (mid - e * Math.sin(mid) < m) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        return 0.5 * (lo + hi);
    }

    /** True anomaly in (−π, π] for mean anomaly {@code meanAnomaly} (radians) and eccentricity e. */
    public static double trueAnomaly(double meanAnomaly, double e) {
        double bigE = eccentricAnomaly(meanAnomaly, e);
        return 2 * Math.atan(Math.sqrt((1 + e) / (1 - e)) * Math.tan(bigE / 2));
    }
}
