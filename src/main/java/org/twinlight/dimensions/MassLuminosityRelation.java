package org.twinlight.dimensions;

/**
 * The main-sequence mass–luminosity relation of Eker et al. 2018 (MNRAS 479, 5491): six pieces
 * log(L/L☉) = α log(M/M☉) + b for 0.179 &lt; M/M☉ ≤ 31, calibrated on 509 main-sequence
 * components of detached double-lined eclipsing binaries. The coefficients are from memory (an
 * independent transcription; the paper's table was not read), so the relation is used only for
 * an advisory, never to change a result.
 */
public final class MassLuminosityRelation {

    /** Upper mass of each piece, M☉. */
    private static final double[] UPPER = {0.45, 0.72, 1.05, 2.40, 7.0, 31.0};
    private static final double[] SLOPE = {2.028, 4.572, 5.743, 4.329, 3.967, 2.865};
    private static final double[] INTERCEPT = {-0.976, -0.102, -0.007, 0.010, 0.093, 1.105};
    /** Lower end of the calibration, M☉. */
    public static final double MIN_MASS = 0.179;
    /** Upper end of the calibration, M☉. */
    public static final double MAX_MASS = 31.0;

    private MassLuminosityRelation() {
    }

    /** log₁₀(L/L☉) of a main-sequence star of {@code massSolar}, or NaN outside 0.179–31 M☉. */
    public static double logLuminosity(double massSolar) {
        if (!(massSolar > MIN_MASS && massSolar <= MAX_MASS)) {
            return Double.NaN;
        }
        for (int k = 0; k < UPPER.length; k++) {
            if (massSolar <= UPPER[k]) {
                return SLOPE[k] * Math.log10(massSolar) + INTERCEPT[k];
            }
        }
        return Double.NaN;
    }
}
