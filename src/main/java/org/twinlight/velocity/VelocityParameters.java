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
 * @param jitter1Kms extra scatter added in quadrature to every error of star 1, km/s (0 = none)
 * @param jitter2Kms the same for star 2 (the stars' lines differ, so their extra scatter may too)
 */
public record VelocityParameters(double periodDays, double epochDays, double eccentricity, double omegaDeg,
        double k1Kms, double k2Kms, double gammaKms, double[] offsetsKms, double jitter1Kms, double jitter2Kms) {

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

    /** The jitter of star {@code n} (1 or 2), km/s. */
    public double jitterKms(int n) {
        return n == 1 ? jitter1Kms : jitter2Kms;
    }

    public VelocityParameters withJitterKms(double jitter1, double jitter2) {
        return new VelocityParameters(periodDays, epochDays, eccentricity, omegaDeg, k1Kms, k2Kms, gammaKms,
                offsetsKms, jitter1, jitter2);
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof VelocityParameters p && p.periodDays == periodDays && p.epochDays == epochDays
                && p.eccentricity == eccentricity && p.omegaDeg == omegaDeg && p.k1Kms == k1Kms && p.k2Kms == k2Kms
                && p.gammaKms == gammaKms && Arrays.equals(p.offsetsKms, offsetsKms) && p.jitter1Kms == jitter1Kms
                && p.jitter2Kms == jitter2Kms;
    }

    @Override
    public int hashCode() {
        return Double.hashCode(k1Kms) * 31 + Double.hashCode(k2Kms) + Arrays.hashCode(offsetsKms);
    }

    @Override
    public String toString() {
        return String.format(java.util.Locale.ROOT, "VelocityParameters[P=%s, T0=%s, e=%s, w=%s, K1=%s, K2=%s, "
                + "gamma=%s, offsets=%s, jitter=%s/%s]", periodDays, epochDays, eccentricity, omegaDeg, k1Kms, k2Kms,
                gammaKms, Arrays.toString(offsetsKms), jitter1Kms, jitter2Kms);
    }
}
