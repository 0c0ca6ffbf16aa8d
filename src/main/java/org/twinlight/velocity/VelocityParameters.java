package org.twinlight.velocity;

import java.util.Arrays;

/**
 * The parameters of the double-lined velocity model (conventions of the interface contract).
 *
 * @param periodDays orbital period, days
 * @param epochDays time of primary conjunction (ν + ω = 90°), days
 * @param eccentricity 0 ≤ e &lt; 1
 * @param omegaDeg argument of periastron of star 1, degrees
 * @param k1Kms semi-amplitude of star 1, km/s
 * @param k2Kms semi-amplitude of star 2, km/s
 * @param gammaKms systemic velocity, km/s, on the scale of the first instrument
 * @param offsetsKms velocity offset of each instrument from the first (the first is 0), km/s,
 *     added to the model of that instrument's measurements
 * @param jitterKms extra scatter added in quadrature to every error, km/s (0 = none)
 */
public record VelocityParameters(double periodDays, double epochDays, double eccentricity, double omegaDeg,
        double k1Kms, double k2Kms, double gammaKms, double[] offsetsKms, double jitterKms) {

    public VelocityParameters {
        offsetsKms = offsetsKms.clone();
    }

    /** The orbit's velocity curve. */
    public org.twinlight.orbit.RadialVelocityCurve curve() {
        return new org.twinlight.orbit.RadialVelocityCurve(periodDays, epochDays, eccentricity, omegaDeg);
    }

    /** Offset of instrument {@code i}, km/s. */
    public double offsetKms(int i) {
        return offsetsKms[i];
    }

    public int instrumentCount() {
        return offsetsKms.length;
    }

    @Override
    public double[] offsetsKms() {
        return offsetsKms.clone();
    }

    public VelocityParameters withJitterKms(double jitter) {
        return new VelocityParameters(periodDays, epochDays, eccentricity, omegaDeg, k1Kms, k2Kms, gammaKms,
                offsetsKms, jitter);
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof VelocityParameters p && p.periodDays == periodDays && p.epochDays == epochDays
                && p.eccentricity == eccentricity && p.omegaDeg == omegaDeg && p.k1Kms == k1Kms && p.k2Kms == k2Kms
                && p.gammaKms == gammaKms && Arrays.equals(p.offsetsKms, offsetsKms) && p.jitterKms == jitterKms;
    }

    @Override
    public int hashCode() {
        return Double.hashCode(k1Kms) * 31 + Double.hashCode(k2Kms) + Arrays.hashCode(offsetsKms);
    }

    @Override
    public String toString() {
        return String.format(java.util.Locale.ROOT, "VelocityParameters[P=%s, T0=%s, e=%s, w=%s, K1=%s, K2=%s, "
                + "gamma=%s, offsets=%s, jitter=%s]", periodDays, epochDays, eccentricity, omegaDeg, k1Kms, k2Kms,
                gammaKms, Arrays.toString(offsetsKms), jitterKms);
    }
}
