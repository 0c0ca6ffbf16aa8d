package org.twinlight.fit;

/**
 * One kind of data in a {@link FitObjective}: it turns the external parameter vector into weighted
 * residuals (data − model)/σ, solving inside any coefficients that enter linearly (light-curve
 * baselines). Light curves are one data set; radial velocities plug in as another, sharing the
 * orbit's parameters.
 */
interface FitDataSet {

    /** Rows of residuals, used or not (an unused row is 0). */
    int size();

    /** Rows that take part in the fit. */
    int usedCount();

    /** Coefficients solved inside for every trial model (they count as fitted quantities). */
    int nuisanceCount();

    /** Fills {@code out[off .. off + size())} with the weighted residuals for an external vector. */
    void residuals(double[] ext, double[] out, int off);

    /**
     * The part of the Gaussian log-likelihood that does not depend on the model:
     * −Σ ln σᵢ − ½ n ln 2π over the used rows.
     */
    double logNormalisation();
}
