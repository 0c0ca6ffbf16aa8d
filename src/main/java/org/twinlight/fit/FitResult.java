package org.twinlight.fit;

import java.util.List;
import java.util.Map;
import org.twinlight.eclipse.ModelFile;

/**
 * The outcome of a least-squares fit.
 *
 * @param model the best-fitting model (same layout as a model file)
 * @param parameters every model parameter, free or fixed, with its 1σ uncertainty (covariance
 *     scaled by {@link org.twinlight.statistics.FitStatistics#varianceScale}), or a one-sided
 *     limit at a physical bound
 * @param derived quantities computed from the parameters, with propagated uncertainties
 * @param freeNames names of the free external parameters, the order of {@code correlation}
 * @param correlation correlation matrix of the free parameters
 * @param n number of data points used (clipped outliers excluded)
 * @param freeCount number of fitted quantities (model parameters plus baseline coefficients)
 * @param chi2 χ² of the data with the given (or estimated) errors (normal priors not included)
 * @param reducedChi2 χ² / (n − freeCount)
 * @param rms root-mean-square residual of the used points, in normalised flux
 * @param bic Bayesian information criterion χ² + k ln n (Schwarz 1978, Ann. Stat. 6, 461)
 * @param iterations solver iterations (all passes)
 * @param evaluations model evaluations, including those for derivatives and profiles
 * @param errorsEstimated true when some data had no errors and they were estimated from the
 *     point-to-point scatter
 * @param adequacy the checks of whether the model describes the data
 * @param clipped points left out as outliers against the model, by reason
 * @param notes remarks for the user, made from the result
 * @param curves the fitted light curves (clipped points flagged)
 */
public record FitResult(ModelFile model, List<Estimate> parameters, List<Estimate> derived, List<String> freeNames,
        double[][] correlation, int n, int freeCount, double chi2, double reducedChi2, double rms, double bic,
        int iterations, int evaluations, boolean errorsEstimated, ModelAdequacy.Result adequacy,
        Map<String, Integer> clipped, List<String> notes, List<FittedCurve> curves) {

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

    /** Total number of points left out as outliers. */
    public int clippedCount() {
        return clipped.values().stream().mapToInt(Integer::intValue).sum();
    }
}
