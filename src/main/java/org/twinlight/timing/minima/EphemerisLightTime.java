package org.twinlight.timing.minima;

import org.twinlight.orbit.KeplerEquation;

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
        double nu = KeplerEquation.trueAnomaly(KeplerEquation.eccentricAnomaly(meanAnomaly, e), e);
        double w = Math.toRadians(omegaDeg);
        return amplitudeDays * ((1 - e * e) / (1 + e * Math.cos(nu)) * Math.sin(nu + w) + e * Math.sin(w));
    }

    /** The semi-amplitude of the delay, K·√(1 − e²cos²ω), days. */
    public double semiAmplitudeDays() {
        double c = Math.cos(Math.toRadians(omegaDeg));
        return amplitudeDays * Math.sqrt(1 - eccentricity * eccentricity * c * c);
    }
}
