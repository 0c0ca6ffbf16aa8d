package org.twinlight.dimensions;

/**
 * What absolute dimensions are computed from: the orbit from the light curve and the
 * velocities, the fractional radii, and the effective temperatures when known.
 *
 * @param periodDays orbital period, days
 * @param eccentricity 0 ≤ e &lt; 1
 * @param inclinationDeg orbital inclination, degrees
 * @param k1Kms velocity semi-amplitude of star 1, km/s
 * @param k2Kms velocity semi-amplitude of star 2, km/s
 * @param radius1 R₁/a
 * @param radius2 R₂/a
 * @param teff1K effective temperature of star 1, K; NaN when not known
 * @param teff2K effective temperature of star 2, K; NaN to derive it from the surface-brightness
 *     ratio (when that is given) or to leave the luminosities out
 * @param surfaceBrightnessRatio central surface-brightness ratio J = I₂/I₁ of the light-curve
 *     fit; NaN when not known
 */
public record BinaryElements(double periodDays, double eccentricity, double inclinationDeg, double k1Kms,
        double k2Kms, double radius1, double radius2, double teff1K, double teff2K, double surfaceBrightnessRatio) {

    /** The order of the elements in vectors, covariance matrices and {@link #fromVector}. */
    public static final java.util.List<String> NAMES = java.util.List.of("period", "eccentricity", "inclination",
            "k1", "k2", "radius1", "radius2", "teff1", "teff2", "surfaceBrightnessRatio");

    /** The elements as a vector in the order of {@link #NAMES}. */
    public double[] toVector() {
        return new double[] {periodDays, eccentricity, inclinationDeg, k1Kms, k2Kms, radius1, radius2, teff1K,
            teff2K, surfaceBrightnessRatio};
    }

    /** Elements from a vector in the order of {@link #NAMES}. */
    public static BinaryElements fromVector(double[] v) {
        return new BinaryElements(v[0], v[1], v[2], v[3], v[4], v[5], v[6], v[7], v[8], v[9]);
    }

    /**
     * Why these elements cannot give dimensions, or null when they can: e outside [0, 1),
     * K or P or a radius ≤ 0, sin i = 0, a temperature ≤ 0.
     */
    public String problem() {
        if (!(periodDays > 0)) {
            return "period must be > 0 days, got " + periodDays;
        }
        if (!(eccentricity >= 0 && eccentricity < 1)) {
            return "eccentricity must be in [0, 1), got " + eccentricity;
        }
        if (!(Math.abs(Math.sin(Math.toRadians(inclinationDeg))) > 0)) {
            return "inclination must not be 0 or 180 degrees, got " + inclinationDeg;
        }
        if (!(k1Kms > 0)) {
            return "K1 must be > 0 km/s, got " + k1Kms;
        }
        if (!(k2Kms > 0)) {
            return "K2 must be > 0 km/s, got " + k2Kms;
        }
        if (!(radius1 > 0) || !(radius2 > 0)) {
            return "the fractional radii must be > 0, got " + radius1 + " and " + radius2;
        }
        if (!Double.isNaN(teff1K) && !(teff1K > 0)) {
            return "Teff1 must be > 0 K, got " + teff1K;
        }
        if (!Double.isNaN(teff2K) && !(teff2K > 0)) {
            return "Teff2 must be > 0 K, got " + teff2K;
        }
        if (Double.isNaN(teff2K) && !Double.isNaN(surfaceBrightnessRatio) && !(surfaceBrightnessRatio > 0)) {
            return "the surface-brightness ratio must be > 0 to give Teff2, got " + surfaceBrightnessRatio;
        }
        return null;
    }
}
