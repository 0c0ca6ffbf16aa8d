package org.twinlight.fit;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.data.Offset.offset;

import java.util.ArrayList;
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
import org.twinlight.photometry.ValueKind;
import org.twinlight.sampling.Marginal;
import org.twinlight.sampling.SamplerSettings;
import org.twinlight.sampling.SamplingProgress;
import org.twinlight.time.TimeScale;

/**
 * The jitter term of the posterior: its likelihood against a general-purpose library, the recovery
 * of an extra scatter the stated errors leave out, the coverage it restores, and its bad input.
 */
class JitterTest {
    /** An invented detached system with deep, partial eclipses. */
    private static final BinaryParameters TRUTH = new BinaryParameters(1.7, 2460100.2, 0.19, 0.14, 84.0, 0, 90,
            0.72, 0, LimbDarkening.quadratic(0.45, 0.20), LimbDarkening.quadratic(0.50, 0.18), 0, 1);
    /** The true white noise, ppm; the errors are stated half of it. */
    private static final double NOISE_PPM = 2000;

    /** 3.5 d at 10 min (504 points, two of each eclipse), errors stated {@code factor} × the true σ. */
    private static LightCurve curve(long seed, double factor) {
        double[] t = SyntheticLightCurve.regularTimes(2460100.0, 2460103.5, 10, List.of(), null);
        LightCurve lc = SyntheticLightCurve.observe(new BinaryModel(TRUTH), t, NOISE_PPM, seed, "J", "V",
                TimeScale.BJD_TDB);
        double[] e = lc.fluxErrors();
        for (int i = 0; i < e.length; i++) {
            e[i] *= factor;
        }
        return new LightCurve("jitter-" + seed, "V", TimeScale.BJD_TDB, ValueKind.FLUX, t, lc.fluxes(), e, Map.of());
    }

    private static FitProblem problem(LightCurve lc, Baseline baseline, Priors priors, String... free) {
        ModelFile start = ModelFile.of(TRUTH.withRadii(TRUTH.radius1(), TRUTH.radius2() * 1.01));
        return FitProblem.of(start, List.of(new FitData(lc, "V")), FitSettings.defaults()
                .withFree(new LinkedHashSet<>(List.of(free))).withBaseline(baseline), priors);
    }

    @Test
    void likelihoodWithJitterIsTheGaussianWithTheAddedVariance() {
        // without a baseline the model is the flux itself: ln L = Σ ln N(yᵢ; mᵢ, σᵢ² + s²), summed here with
        // Commons Math's normal density (the Gaussian likelihood with an added variance: Gregory 2005,
        // ApJ 631, 1198, §2)
        LightCurve lc = curve(3, 0.5);
        FitProblem p = problem(lc, Baseline.NONE, Priors.none(), "radius2");
        FitObjective objective = p.objective();
        double[] ext = objective.startExternal();
        double[] model = new BinaryModel(objective.layout().parameters(ext, 0)).flux(lc.timesDays());
        double s = 0.0017;
        double expected = 0;
        for (int i = 0; i < lc.size(); i++) {
            double sd = Math.sqrt(lc.fluxError(i) * lc.fluxError(i) + s * s);
            expected += new NormalDistribution(model[i], sd).logDensity(lc.flux(i));
        }
        double got = objective.lightCurves().logLikelihood(ext, objective.lightCurves().workspace(), new double[] {s});
        assertThat(got).isCloseTo(expected, offset(1e-6 * Math.abs(expected)));
        // s = 0 is the likelihood the objective already has, −½χ² − Σ ln σ − ½ n ln 2π
        double none = objective.lightCurves().logLikelihood(ext, objective.lightCurves().workspace(), new double[] {0});
        assertThat(none).isCloseTo(objective.logLikelihood(ext), offset(1e-9 * Math.abs(none)));
    }

    @Test
    void jitterRecoversTheMissingScatterAndRestoresCoverage() {
        // errors stated 2× too small: the scatter left out is √(σ_true² − σ_stated²) = √3/2 σ_true
        double missing = Math.sqrt(3) / 2 * NOISE_PPM * 1e-6;
        int curves = 12;
        int jitterIn95 = 0;
        List<Double> jitterMedians = new ArrayList<>();
        int[] in68 = new int[2];
        int[] in95 = new int[2];
        for (long seed = 1; seed <= curves; seed++) {
            FitProblem p = problem(curve(100 + seed, 0.5), Baseline.OFFSET, Priors.none(), "radius2");
            FitResult best = EclipseFitter.optimize(p);
            // as stated: no χ²ν scaling, no jitter; then with the jitter
            FitResult asStated = NoiseDiagnostics.forInflatedSampling(best, 1 / Math.sqrt(best.reducedChi2()));
            for (int j = 0; j < 2; j++) {
                Posterior post = PosteriorSampler.sample(p, asStated, SamplerSettings.of(12, 4000, seed, 1), j == 1,
                        SamplingProgress.NONE, () -> false);
                assertThat(post.convergence().converged()).as(post.convergence().reason()).isTrue();
                Marginal r2 = post.marginals().get(post.column("radius2"));
                in68[j] += TRUTH.radius2() >= r2.lower68() && TRUTH.radius2() <= r2.upper68() ? 1 : 0;
                in95[j] += TRUTH.radius2() >= r2.lower95() && TRUTH.radius2() <= r2.upper95() ? 1 : 0;
                if (j == 1) {
                    assertThat(post.names()).startsWith("radius2", "jitter", "sumOfRadii");
                    assertThat(post.parameterCount()).isEqualTo(2);
                    Marginal s = post.marginals().get(post.column("jitter"));
                    jitterIn95 += missing >= s.lower95() && missing <= s.upper95() ? 1 : 0;
                    jitterMedians.add(s.median());
                }
            }
        }
        // the jitter's 95 % interval holds the truth: 12 curves, P(≤ 9 of 12 | p = 0.95) ≈ 2 % (binomial)
        assertThat(jitterIn95).isGreaterThanOrEqualTo(10);
        // 504 points: the scatter is known to about 1/√(2n) ≈ 3 %, its σ² part to a few per cent more
        double mean = jitterMedians.stream().mapToDouble(Double::doubleValue).average().orElseThrow();
        assertThat(mean / missing).isCloseTo(1.0, offset(0.08));
        // as stated the 95 % interval is half as wide as it should be (±0.98 σ: 67 % expected); with the
        // jitter the coverage returns to nominal: binomial, 12 draws, P(≤ 9 | 0.95) ≈ 2 %, and at 68 %
        // P(≤ 4 | 0.68) ≈ 1 %
        assertThat(in95[1]).isGreaterThanOrEqualTo(10);
        assertThat(in68[1]).isGreaterThanOrEqualTo(5);
        assertThat(in95[1]).isGreaterThan(in95[0]);
    }

    @Test
    void aJitterPriorNeedsTheJitterTermAndAPositiveRange() {
        LightCurve lc = curve(5, 0.5);
        Priors onJitter = new Priors(Map.of("jitter", new Prior.Uniform(0, 0.01)), "m.json");
        FitProblem p = problem(lc, Baseline.OFFSET, onJitter, "radius2");
        FitResult best = EclipseFitter.optimize(p);
        assertThatThrownBy(() -> PosteriorSampler.sample(p, best, SamplerSettings.of(12, 10, 1, 1), false,
                SamplingProgress.NONE, () -> false)).isInstanceOf(BadInputException.class)
                .hasMessageContaining("m.json").hasMessageContaining("priors.jitter").hasMessageContaining("--jitter");
        Priors negative = new Priors(Map.of("jitter", new Prior.Uniform(-0.01, -0.001)), "m.json");
        FitProblem q = problem(lc, Baseline.OFFSET, negative, "radius2");
        assertThatThrownBy(() -> PosteriorSampler.dimension(q, true)).isInstanceOf(BadInputException.class)
                .hasMessageContaining("priors.jitter").hasMessageContaining("positive");
        Priors unknownBand = new Priors(Map.of("jitter@R", new Prior.Uniform(0, 0.01)), "m.json");
        FitProblem u = problem(lc, Baseline.OFFSET, unknownBand, "radius2");
        assertThatThrownBy(() -> PosteriorSampler.dimension(u, true)).isInstanceOf(BadInputException.class)
                .hasMessageContaining("priors.jitter@R").hasMessageContaining("no band 'R'");
        // a prior on the jitter replaces the default: the prior [0, 0.0005] holds the jitter below the
        // missing 0.0017, and the sample stays inside it
        FitProblem held = problem(lc, Baseline.OFFSET, new Priors(Map.of("jitter", new Prior.Uniform(0, 0.0005)),
                "m.json"), "radius2");
        Posterior post = PosteriorSampler.sample(held, EclipseFitter.optimize(held), SamplerSettings.of(12, 300, 1, 1),
                true, SamplingProgress.NONE, () -> false);
        for (double s : post.retained(post.column("jitter"))) {
            assertThat(s).isBetween(0.0, 0.0005);
        }
        assertThat(PosteriorSampler.dimension(held, true)).isEqualTo(2);
    }
}
