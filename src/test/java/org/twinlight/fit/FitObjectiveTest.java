package org.twinlight.fit;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import org.apache.commons.math3.distribution.NormalDistribution;
import org.junit.jupiter.api.Test;
import org.twinlight.BadInputException;
import org.twinlight.eclipse.BinaryModel;
import org.twinlight.eclipse.BinaryParameters;
import org.twinlight.eclipse.LimbDarkening;
import org.twinlight.eclipse.ModelFile;
import org.twinlight.eclipse.SyntheticLightCurve;
import org.twinlight.photometry.LightCurve;
import org.twinlight.time.TimeScale;

/** The one objective of a fit: its likelihood, its priors, and the priors' checks. */
class FitObjectiveTest {
    private static final BinaryParameters TRUTH = new BinaryParameters(2.4173, 2460300.3312, 0.131, 0.094, 87.4,
            0, 90, 0.58, 0, LimbDarkening.quadratic(0.4, 0.22), LimbDarkening.quadratic(0.48, 0.2), 0, 1);
    private static final LightCurve DATA = SyntheticLightCurve.observe(new BinaryModel(TRUTH),
            SyntheticLightCurve.regularTimes(2460300, 2460306, 3, List.of(), null), 1500, 11, "V", "V",
            TimeScale.BJD_TDB);
    private static final FitSettings FREE = FitSettings.defaults().withFree(new LinkedHashSet<>(
            List.of("epoch", "radius1", "radius2", "inclination", "surfaceBrightnessRatio")));

    private static FitProblem problem(FitSettings settings, Priors priors) {
        return problem(TRUTH, settings, priors);
    }

    private static FitProblem problem(BinaryParameters start, FitSettings settings, Priors priors) {
        return FitProblem.of(ModelFile.of(start), List.of(new FitData(DATA, "V")), settings, priors);
    }

    private static Priors priors(Map<String, Prior> m) {
        return new Priors(m, "start.json");
    }

    @Test
    void logLikelihoodIsTheGaussianDensityOfTheData() {
        // Independent: Commons Math's normal density of every point about the model, with no baseline.
        FitObjective o = problem(FREE.withBaseline(Baseline.NONE), Priors.none()).objective();
        double[] ext = o.startExternal();
        ext[ParameterLayout.INCLINATION] = 87.0;
        ext[ParameterLayout.RADIUS2] = 0.097;
        BinaryParameters p = TRUTH.withInclinationDeg(87.0).withRadii(0.131, 0.097);
        double[] model = new BinaryModel(p).flux(DATA.timesDays());
        double expected = 0;
        for (int i = 0; i < DATA.size(); i++) {
            expected += new NormalDistribution(model[i], DATA.fluxErrors()[i]).logDensity(DATA.fluxes()[i]);
        }
        assertThat(o.logLikelihood(ext)).isCloseTo(expected, within(1e-6 * Math.abs(expected)));
        assertThat(o.logPrior(ext)).isEqualTo(0.0);
        ext[ParameterLayout.RADIUS1] = -0.01;
        assertThat(o.logPrior(ext)).isEqualTo(Double.NEGATIVE_INFINITY);
        assertThat(o.logPosterior(ext)).isEqualTo(Double.NEGATIVE_INFINITY);
    }

    @Test
    void aNormalPriorCombinesWithTheDataAsIndependentGaussianInformation() {
        // For Gaussian likelihood and prior the posterior of one parameter has precision
        // 1/σ² = 1/σ_data² + 1/σ_prior² and mean weighted by the precisions (Gelman et al. 2013,
        // Bayesian Data Analysis, 3rd ed., eqs. 2.11–2.12, from memory); a prior on one coordinate
        // of a multivariate Gaussian updates its marginal the same way.
        FitResult alone = EclipseFitter.optimize(problem(FREE.withClipSigma(Double.NaN), Priors.none()));
        Estimate d = alone.get("inclination");
        double mu = d.value() - 1.5 * d.uncertainty();
        double sp = d.uncertainty();
        FitResult both = EclipseFitter.optimize(problem(FREE.withClipSigma(Double.NaN),
                priors(Map.of("inclination", new Prior.Normal(mu, sp)))));
        double wd = 1 / (d.uncertainty() * d.uncertainty());
        double wp = 1 / (sp * sp);
        double mean = (wd * d.value() + wp * mu) / (wd + wp);
        double sigma = 1 / Math.sqrt(wd + wp);
        Estimate e = both.get("inclination");
        assertThat(e.value()).isCloseTo(mean, within(0.1 * sigma));
        assertThat(e.uncertainty()).isCloseTo(sigma, within(0.1 * sigma));
        // the reported χ² is the data's alone
        assertThat(both.chi2()).isGreaterThan(alone.chi2());
        assertThat(both.n()).isEqualTo(alone.n());
    }

    @Test
    void aUniformPriorIsAHardBound() {
        FitResult free = EclipseFitter.optimize(problem(FREE, Priors.none()));
        double best = free.get("inclination").value();
        double cap = best - 0.4;
        FitResult bounded = EclipseFitter.optimize(problem(TRUTH.withInclinationDeg(cap - 0.5), FREE, priors(Map.of("inclination",
                new Prior.Uniform(80, cap)))));
        assertThat(bounded.get("inclination").value()).isLessThanOrEqualTo(cap).isCloseTo(cap, within(0.02));
        // on a derived quantity too
        double k = free.get("radiusRatio").value();
        FitResult onK = EclipseFitter.optimize(problem(TRUTH.withRadii(0.131, 0.131 * (k + 0.04)), FREE, priors(Map.of("radiusRatio",
                new Prior.Uniform(k + 0.02, 1.0)))));
        assertThat(onK.get("radiusRatio").value()).isGreaterThanOrEqualTo(k + 0.02).isCloseTo(k + 0.02, within(1e-3));
    }

    @Test
    void priorsThatCannotApplyAreRefusedNamingTheKey() {
        Object[][] cases = {
            {"radius3", new Prior.Normal(0.1, 0.01), "unknown name 'radius3'"},
            {"thirdLight", new Prior.Normal(0.1, 0.01), "fixed"},
            {"radius1@V", new Prior.Normal(0.1, 0.01), "common to every band"},
            {"thirdLight@R", new Prior.Normal(0.1, 0.01), "no band 'R'"},
            {"inclination", new Prior.Uniform(80, 85), "outside the uniform prior"},
            {"lightRatio", new Prior.Uniform(0.9, 1.5), "outside the uniform prior"},
        };
        for (Object[] c : cases) {
            assertThatThrownBy(() -> problem(FREE, priors(Map.of((String) c[0], (Prior) c[1])))).as((String) c[0])
                    .isInstanceOf(BadInputException.class).hasMessageContaining("start.json")
                    .hasMessageContaining("priors." + c[0]).hasMessageContaining((String) c[2]);
        }
        FitSettings geometryOnly = FREE.withFree(new LinkedHashSet<>(List.of("epoch", "inclination")));
        assertThatThrownBy(() -> problem(geometryOnly, priors(Map.of("radiusRatio", new Prior.Normal(0.7, 0.1)))))
                .isInstanceOf(BadInputException.class).hasMessageContaining("depends on no free parameter");
    }
}
