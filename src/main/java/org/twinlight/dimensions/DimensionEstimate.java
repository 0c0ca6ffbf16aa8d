package org.twinlight.dimensions;

/**
 * One propagated quantity.
 *
 * @param quantity which
 * @param value at the central elements
 * @param uncertainty standard deviation of the sampled values
 * @param lower68 16th percentile of the sampled values
 * @param upper68 84th percentile of the sampled values
 * @param firstOrderUncertainty linear (first-order) propagation √(J C Jᵀ) of the elements'
 *     covariance
 */
public record DimensionEstimate(Quantity quantity, double value, double uncertainty, double lower68, double upper68,
        double firstOrderUncertainty) {

    /** Relative difference beyond which the first-order error is reported beside the sampled one. */
    public static final double FIRST_ORDER_REPORT_THRESHOLD = 0.10;

    /** Whether the first-order error differs from the sampled one by more than 10 %. */
    public boolean firstOrderDiffers() {
        if (!(uncertainty > 0) || !Double.isFinite(firstOrderUncertainty)) {
            return false;
        }
        return Math.abs(firstOrderUncertainty - uncertainty) > FIRST_ORDER_REPORT_THRESHOLD * uncertainty;
    }
}
