package org.twinlight.fit;

import java.util.List;
import org.twinlight.eclipse.ModelFile;

/**
 * The outcome of a least-squares fit.
 *
 * @param model the best-fitting model (same layout as a model file)
 * @param parameters every model parameter, free or fixed, with its 1σ uncertainty (covariance
 *     scaled by the reduced χ²)
 * @param derived quantities computed from the parameters, with propagated uncertainties
 * @param freeNames names of the free external parameters, the order of {@code correlation}
 * @param correlation correlation matrix of the free parameters
 * @param n number of data points
 * @param freeCount number of fitted quantities (model parameters plus baseline coefficients)
 * @param chi2 χ² with the given (or estimated) errors
 * @param reducedChi2 χ² / (n − freeCount)
 * @param rms root-mean-square residual, in normalised flux
 * @param bic Bayesian information criterion χ² + k ln n (Schwarz 1978, Ann. Stat. 6, 461)
 * @param iterations solver iterations
 * @param evaluations model evaluations, including those for derivatives
 * @param errorsEstimated true when some data had no errors and they were estimated from the
 *     point-to-point scatter
 * @param notes remarks for the user (starting values moved off bounds, weak constraints, ...)
 * @param curves the fitted light curves
 */
public record FitResult(ModelFile model, List<Estimate> parameters, List<Estimate> derived, List<String> freeNames,
        double[][] correlation, int n, int freeCount, double chi2, double reducedChi2, double rms, double bic,
        int iterations, int evaluations, boolean errorsEstimated, List<String> notes, List<FittedCurve> curves) {

    /** The estimate of a common (band-independent) parameter or derived quantity by name. */
    public Estimate get(String name) {
        return get(name, null);
    }

    /** The estimate of a quantity by name and band (null band: common, or the only band). */
    public Estimate get(String name, String band) {
        for (List<Estimate> list : List.of(parameters, derived)) {
            for (Estimate e : list) {
                if (e.name().equals(name) && (band == null || band.equals(e.band()))) {
                    return e;
                }
            }
        }
        throw new IllegalArgumentException("no fitted quantity named " + name + (band == null ? "" : " in band " + band));
    }
}
