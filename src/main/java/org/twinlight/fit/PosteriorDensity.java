package org.twinlight.fit;

import org.twinlight.sampling.LogDensity;

/**
 * The log posterior in the sampled coordinates, evaluated on the fit's one objective
 * ({@link FitObjective}): its log prior (the model file's priors, the model's domain), plus
 * ln L = −χ² / (2 s) over every data set (light curves with their baselines solved inside, velocities) and s the least-squares fit's reduced χ² (the
 * fit's own error-scaling rule: the errors are scaled so that the best model has χ²ν = 1). With
 * jitter terms ({@link JitterTerms}, sampled as ln s after the coordinates of
 * {@link SampledCoordinates}) the errors are taken as stated, each jitter added in quadrature, and
 * ln L is the full Gaussian one with its normalisation; their priors are added. The default prior
 * is uniform in the sampled coordinates ({@link SampledCoordinates}). One instance per thread: it
 * keeps its own work arrays.
 */
final class PosteriorDensity implements LogDensity {
    private final FitObjective objective;
    private final SampledCoordinates coordinates;
    private final double chi2Scale;
    private final JitterTerms jitter;
    private final WeightedResiduals.Workspace work;
    private final double[] ext;

    PosteriorDensity(FitObjective objective, SampledCoordinates coordinates, double chi2Scale, JitterTerms jitter) {
        this.objective = objective;
        this.jitter = jitter;
        this.coordinates = coordinates;
        this.chi2Scale = chi2Scale;
        this.work = objective.lightCurves().workspace();
        this.ext = new double[objective.layout().externalSize()];
    }

    @Override
    public double at(double[] u) {
        if (coordinates.outside(u) != null) {
            return Double.NEGATIVE_INFINITY;
        }
        coordinates.toExternal(u, ext);
        double lp = objective.logPrior(ext);
        if (lp == Double.NEGATIVE_INFINITY) {
            return lp;
        }
        if (jitter.size() == 0) {
            return lp - 0.5 * objective.dataChi2(ext, work) / chi2Scale;
        }
        double lj = jitter.logPrior(u, coordinates.size());
        if (lj == Double.NEGATIVE_INFINITY) {
            return lj;
        }
        return lp + lj + jitter.logLikelihood(objective, ext, u, coordinates.size(), work);
    }
}
