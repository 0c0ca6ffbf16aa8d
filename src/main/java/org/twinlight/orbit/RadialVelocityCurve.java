package org.twinlight.orbit;

/**
 * The line-of-sight velocities of the two stars of a double-lined Keplerian orbit, with the
 * conventions of the interface contract (positive receding, ω of star 1, epoch = primary
 * conjunction where ν + ω = 90°):
 *
 * <pre>
 *   v₁ = γ + K₁ [cos(ν+ω) + e cos ω]
 *   v₂ = γ − K₂ [cos(ν+ω) + e cos ω]
 * </pre>
 *
 * (e.g. Hilditch 2001, <i>An Introduction to Close Binary Stars</i>, eq. 2.45). The true anomaly
 * comes from Kepler's equation with the mean anomaly counted from periastron; the time of
 * periastron follows from the epoch of primary conjunction, whose true anomaly is 90° − ω.
 *
 * @param periodDays orbital period, days, &gt; 0
 * @param epochDays time of primary conjunction, days
 * @param eccentricity 0 ≤ e &lt; 1
 * @param omegaDeg argument of periastron of star 1, degrees
 */
public record RadialVelocityCurve(double periodDays, double epochDays, double eccentricity, double omegaDeg) {

    public RadialVelocityCurve {
        Orbit.checkElements(periodDays, epochDays, eccentricity, omegaDeg);
    }

    /** Mean anomaly at the epoch of primary conjunction (ν = 90° − ω), radians in (−π, π]. */
    public double meanAnomalyAtEpochRad() {
        return KeplerEquation.meanAnomalyOfTrueAnomaly(Math.toRadians(90.0 - omegaDeg), eccentricity);
    }

    /** The time of periastron passage in the cycle of the epoch, days. */
    public double periastronTimeDays() {
        return epochDays - meanAnomalyAtEpochRad() / (2 * Math.PI) * periodDays;
    }

    /**
     * The dimensionless shape cos(ν+ω) + e cos ω at {@code timeDays}: v₁ = γ + K₁·shape,
     * v₂ = γ − K₂·shape. Bounded by ±(1 + e cos ω).
     */
    public double shape(double timeDays) {
        double w = Math.toRadians(omegaDeg);
        double phase = (timeDays - epochDays) / periodDays;
        // the phase is reduced before it becomes an angle, so large cycle counts keep their digits
        phase -= Math.floor(phase);
        double meanAnomaly = meanAnomalyAtEpochRad() + 2 * Math.PI * phase;
        double ecc = KeplerEquation.eccentricAnomaly(meanAnomaly, eccentricity);
        double nu = KeplerEquation.trueAnomaly(ecc, eccentricity);
        return Math.cos(nu + w) + eccentricity * Math.cos(w);
    }

    /** Velocity of star 1, in the unit of {@code k1} and {@code gamma} (km/s in twinlight). */
    public double velocity1(double timeDays, double k1, double gamma) {
        return gamma + k1 * shape(timeDays);
    }

    /** Velocity of star 2, in the unit of {@code k2} and {@code gamma}. */
    public double velocity2(double timeDays, double k2, double gamma) {
        return gamma - k2 * shape(timeDays);
    }
}
