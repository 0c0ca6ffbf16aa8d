package org.twinlight.timing.minima;

import org.twinlight.testsupport.BisectionKepler;

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
        double nu = BisectionKepler.trueAnomaly(m, e);
        double w = Math.toRadians(omegaDeg);
        return amplitude * ((1 - e * e) / (1 + e * Math.cos(nu)) * Math.sin(nu + w) + e * Math.sin(w));
    }
}
