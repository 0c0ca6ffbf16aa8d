package org.twinlight.timing;

/**
 * The light-travel-time delay of an eclipsing pair on an orbit around a third body, after Irwin
 * (1952, ApJ 116, 211; formula from memory):
 * Δt = K·[(1 − e²)/(1 + e·cos ν)·sin(ν + ω) + e·sin ω], with K = a₁₂·sin i₃/c. The
 * semi-amplitude of the delay is K·√(1 − e²·cos²ω).
 *
 * @param periodDays P₃, orbital period of the pair around the system's centre of mass, days
 * @param amplitudeDays K = a₁₂ sin i₃ / c, days
 * @param eccentricity e₃, 0 ≤ e₃ &lt; 1
 * @param omegaDeg ω₃, argument of periastron of the pair's orbit, degrees
 * @param periastronDays time of periastron passage, days
 */
public record EphemerisLightTime(double periodDays, double amplitudeDays, double eccentricity, double omegaDeg,
        double periastronDays) {

    /** The delay Δt (days) at time {@code timeDays}. */
    public double delayDays(double timeDays) {
        double e = eccentricity;
        double meanAnomaly = 2 * Math.PI * (timeDays - periastronDays) / periodDays;
        double ecc = eccentricAnomaly(meanAnomaly, e);
        double nu = 2 * Math.atan2(Math.sqrt(1 + e) * Math.sin(ecc / 2), Math.sqrt(1 - e) * Math.cos(ecc / 2));
        double w = Math.toRadians(omegaDeg);
        return amplitudeDays * ((1 - e * e) / (1 + e * Math.cos(nu)) * Math.sin(nu + w) + e * Math.sin(w));
    }

    /** The semi-amplitude of the delay, K·√(1 − e²cos²ω), days. */
    public double semiAmplitudeDays() {
        double c = Math.cos(Math.toRadians(omegaDeg));
        return amplitudeDays * Math.sqrt(1 - eccentricity * eccentricity * c * c);
    }

    /**
     * Solves Kepler's equation E − e·sin E = M by Newton's method (Meeus, Astronomical
     * Algorithms, 2nd ed., ch. 30), started from E = M + e·sin M, or from π for e &gt; 0.8.
     */
    static double eccentricAnomaly(double meanAnomaly, double e) {
        double m = Math.IEEEremainder(meanAnomaly, 2 * Math.PI);
        double ecc = e > 0.8 ? Math.PI * Math.signum(m == 0 ? 1 : m) : m + e * Math.sin(m);
        for (int i = 0; i < 50; i++) {
            double delta = (ecc - e * Math.sin(ecc) - m) / (1 - e * Math.cos(ecc));
            ecc -= delta;
            if (Math.abs(delta) < 1e-13) {
                break;
            }
        }
        return ecc;
    }
}
