package org.twinlight.fit;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.twinlight.BadInputException;
import org.twinlight.sampling.LogDensity;

/**
 * The log posterior in the sampled coordinates: ln L = −χ² / (2 s) with the baselines solved
 * inside ({@link WeightedResiduals}) and s the least-squares fit's reduced χ² (the fit's own
 * error-scaling rule: the errors are scaled so that the best model has χ²ν = 1), plus the log
 * priors. The default prior is uniform in the sampled coordinates ({@link SampledCoordinates})
 * inside the model's domain; priors from the model file multiply it. One instance per thread: it
 * keeps its own work arrays.
 */
final class PosteriorDensity implements LogDensity {
    private final WeightedResiduals objective;
    private final SampledCoordinates coordinates;
    private final Terms terms;
    private final double chi2Scale;
    private final WeightedResiduals.Workspace work;
    private final double[] ext;

    PosteriorDensity(WeightedResiduals objective, SampledCoordinates coordinates, Terms terms, double chi2Scale) {
        this.objective = objective;
        this.coordinates = coordinates;
        this.terms = terms;
        this.chi2Scale = chi2Scale;
        this.work = objective.workspace();
        this.ext = new double[objective.layout().externalSize()];
    }

    @Override
    public double at(double[] u) {
        if (coordinates.outside(u) != null) {
            return Double.NEGATIVE_INFINITY;
        }
        coordinates.toExternal(u, ext);
        if (!objective.layout().inDomain(ext)) {
            return Double.NEGATIVE_INFINITY;
        }
        double lp = terms.logDensity(ext);
        if (lp == Double.NEGATIVE_INFINITY) {
            return lp;
        }
        return lp - 0.5 * objective.chi2External(ext, work) / chi2Scale;
    }

    /**
     * The priors of the model file resolved against the fit's parameters: each on a free external
     * parameter (by index) or on a derived quantity (by its position among the reported values).
     */
    static final class Terms {
        private final ParameterLayout layout;
        private final long midCycle;
        private final List<int[]> onParameters = new ArrayList<>();
        private final List<Prior> parameterPriors = new ArrayList<>();
        private final List<Integer> onDerived = new ArrayList<>();
        private final List<Prior> derivedPriors = new ArrayList<>();
        private final List<String> parameterLabels = new ArrayList<>();
        private final List<String> derivedLabels = new ArrayList<>();

        /**
         * @throws BadInputException for a prior on an unknown or fixed parameter
         */
        Terms(ParameterLayout layout, Priors priors, double[] best, long midCycle) {
            this.layout = layout;
            this.midCycle = midCycle;
            EclipseFitter.Reported reported = EclipseFitter.Reported.at(layout, best, 0, midCycle);
            boolean multiBand = layout.bands().size() > 1;
            for (var e : priors.byName().entrySet()) {
                String base = Priors.baseName(e.getKey());
                String band = Priors.bandOf(e.getKey());
                if (band != null && !layout.bands().contains(band)) {
                    throw bad(priors, e.getKey(), "band '" + band + "' is not fitted (bands: "
                            + String.join(", ", layout.bands()) + ")");
                }
                if (Priors.DERIVED_NAMES.contains(base)) {
                    boolean found = false;
                    for (int j = 0; j < reported.names().size(); j++) {
                        String jb = reported.bands().get(j);
                        if (reported.names().get(j).equals(base) && (band == null || jb == null || band.equals(jb))) {
                            onDerived.add(layout.externalSize() + j);
                            derivedPriors.add(e.getValue());
                            derivedLabels.add(base + (jb == null ? "" : "@" + jb));
                            found = true;
                        }
                    }
                    if (!found) {
                        throw bad(priors, e.getKey(), "no such derived quantity in this fit");
                    }
                    continue;
                }
                boolean found = false;
                for (int i = 0; i < layout.externalSize(); i++) {
                    FitParameter p = layout.parameter(i);
                    if (p.name().equals(base) && (band == null || p.band() == null || band.equals(p.band()))) {
                        found = true;
                        if (!p.free()) {
                            throw bad(priors, e.getKey(), "the parameter is fixed in this fit; free it with --free "
                                    + base + " or remove the prior");
                        }
                        onParameters.add(new int[] {i});
                        parameterPriors.add(e.getValue());
                        parameterLabels.add(p.label(multiBand));
                    }
                }
                if (!found) {
                    throw bad(priors, e.getKey(), "unknown name; expected a parameter name (radius1, inclination, "
                            + "thirdLight@BAND, limbDarkening1.a, ...) or a derived quantity ("
                            + String.join(", ", Priors.DERIVED_NAMES) + ")");
                }
            }
        }

        private static BadInputException bad(Priors priors, String name, String problem) {
            return new BadInputException((priors.source().isEmpty() ? "" : priors.source() + ": ") + "key 'priors."
                    + name + "': " + problem);
        }

        double logDensity(double[] ext) {
            double s = 0;
            for (int k = 0; k < onParameters.size(); k++) {
                s += parameterPriors.get(k).logDensity(ext[onParameters.get(k)[0]]);
            }
            if (!onDerived.isEmpty() && s > Double.NEGATIVE_INFINITY) {
                double[] v = EclipseFitter.Reported.at(layout, ext, 0, midCycle).values();
                for (int k = 0; k < onDerived.size(); k++) {
                    s += derivedPriors.get(k).logDensity(v[onDerived.get(k)]);
                }
            }
            return s;
        }

        /**
         * Checks that the priors allow a point.
         *
         * @throws BadInputException naming the first prior that excludes it, with the value
         */
        void checkAllows(double[] ext, Priors priors) {
            double[] v = EclipseFitter.Reported.at(layout, ext, 0, midCycle).values();
            for (int k = 0; k < onParameters.size(); k++) {
                check(parameterPriors.get(k), ext[onParameters.get(k)[0]], parameterLabels.get(k), priors);
            }
            for (int k = 0; k < onDerived.size(); k++) {
                check(derivedPriors.get(k), v[onDerived.get(k)], derivedLabels.get(k), priors);
            }
        }

        private static void check(Prior prior, double value, String label, Priors priors) {
            if (!prior.allows(value)) {
                throw new BadInputException((priors.source().isEmpty() ? "" : priors.source() + ": ") + "key 'priors."
                        + label + "': the prior " + prior + " excludes the least-squares value " + String.format(
                        Locale.ROOT, "%.6g", value) + " where the sampler starts; widen the prior, or start the fit "
                        + "(--model) inside it");
            }
        }
    }
}
