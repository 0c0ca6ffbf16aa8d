package org.twinlight.timing.minima;

/**
 * The light-travel-time delay of an eclipsing pair on an orbit around a third body, written out
 * in the tests independently of the production code: Irwin (1952, ApJ 116, 211, eq. 1)
 * τ = (a₁₂ sin i / c)·[(1 − e²)/(1 + e cos ν)·sin(ν + ω) + e sin ω], with the true anomaly ν
 * from Kepler's equation M = E − e sin E solved by bisection (monotonic in E, so it cannot miss)
 * and tan(ν/2) = √((1 + e)/(1 − e))·tan(E/2) (e.g. Murray &amp; Dermott 1999, Solar System
 * Dynamics, eq. 2.46).
 */
final class IrwinDelay {

    private IrwinDelay() {
    }

    /**
     * @param t time, days
     * @param p3 outer period, days
     * @param amplitude a₁₂ sin i / c, days
     * @param e eccentricity
     * @param omegaDeg argument of periastron, degrees
     * @param tPeri time of periastron, days
     */
    static double delay(double t, double p3, double amplitude, double e, double omegaDeg, double tPeri) {
        double m = 2 * Math.PI * (t - tPeri) / p3;
        m -= 2 * Math.PI * Math.floor(m / (2 * Math.PI));
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
        double bigE = 0.5 * (lo + hi);
        double nu = 2 * Math.atan(Math.sqrt((1 + e) / (1 - e)) * Math.tan(bigE / 2));
        double w = Math.toRadians(omegaDeg);
        return amplitude * ((1 - e * e) / (1 + e * Math.cos(nu)) * Math.sin(nu + w) + e * Math.sin(w));
    }
}
