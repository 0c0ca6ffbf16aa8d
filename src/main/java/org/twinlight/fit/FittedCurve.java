package org.twinlight.fit;

/**
 * One fitted light curve after the fit, with the fitted baseline divided out.
 *
 * @param source file name of the light curve
 * @param band band whose parameters it used
 * @param timesDays times, days
 * @param flux observed flux divided by the fitted baseline
 * @param errors errors of {@code flux} (given or estimated), same scaling
 * @param model model flux at the times (out-of-eclipse level 1)
 * @param segments number of baseline segments
 * @param baselineCoefficients per segment, the polynomial coefficients of the baseline in
 *     τ = (t − t_mid)/half-span of the segment (empty when the baseline is none)
 * @param clipped per point, whether it was left out of the fit as an outlier against the model
 */
public record FittedCurve(String source, String band, double[] timesDays, double[] flux, double[] errors,
        double[] model, int segments, double[][] baselineCoefficients, boolean[] clipped) {

    /** Data minus model. */
    public double residual(int i) {
        return flux[i] - model[i];
    }

    public int size() {
        return timesDays.length;
    }

    /** Number of points left out as outliers. */
    public int clippedCount() {
        int n = 0;
        for (boolean c : clipped) {
            n += c ? 1 : 0;
        }
        return n;
    }
}
