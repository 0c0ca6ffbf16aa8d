package org.twinlight.fit;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.data.Offset.offset;

import java.util.LinkedHashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.twinlight.BadInputException;
import org.twinlight.eclipse.BinaryModel;
import org.twinlight.eclipse.BinaryParameters;
import org.twinlight.eclipse.LimbDarkening;
import org.twinlight.eclipse.ModelFile;
import org.twinlight.eclipse.SyntheticLightCurve;
import org.twinlight.photometry.LightCurve;
import org.twinlight.sampling.Marginal;
import org.twinlight.sampling.SamplerSettings;
import org.twinlight.sampling.SamplingProgress;
import org.twinlight.time.TimeScale;

/** The posterior of the light-curve fit: coordinates, priors, and a closed loop on a partial eclipse. */
class PosteriorSamplerTest {
    /** A partial eclipse (b ≈ 0.8), where r₂ and i correlate strongly. */
    private static final BinaryParameters PARTIAL = new BinaryParameters(1.7, 2460100.2, 0.19, 0.14, 81.0, 0.1, 60,
            0.72, 0, LimbDarkening.quadratic(0.45, 0.20), LimbDarkening.quadratic(0.50, 0.18), 0, 1);

    private static FitProblem problem(BinaryParameters truth, List<String> free, long seed) {
        // 3.5 d at 6 min: two of each eclipse, 840 points
        double[] t = SyntheticLightCurve.regularTimes(2460100.0, 2460103.5, 6, List.of(), null);
        LightCurve lc = SyntheticLightCurve.observe(new BinaryModel(truth), t, 1500, seed, "T", "T", TimeScale.BJD_TDB);
        return FitProblem.of(ModelFile.of(truth.withRadii(0.195, 0.135).withInclinationDeg(80.6)),
                List.of(new FitData(lc, "T")), FitSettings.defaults().withFree(new LinkedHashSet<>(free)));
    }

    @Test
    void kippingAndEccentricityCoordinatesMapAsPublished() {
        FitProblem p = problem(PARTIAL, List.of("radius1", "eccentricity", "omega", "limbDarkening1"), 1);
        ParameterLayout layout = p.objective().layout();
        double[] ext = layout.startExternal();
        SampledCoordinates c = new SampledCoordinates(layout, ext);
        double[] u = c.toSampled(ext);
        // first block (√e cos ω, √e sin ω): e = 0.1, ω = 60° → √0.1 (cos 60°, sin 60°)
        assertThat(u[0]).isCloseTo(Math.sqrt(0.1) * 0.5, offset(1e-12));
        assertThat(u[1]).isCloseTo(Math.sqrt(0.1) * Math.sqrt(3) / 2, offset(1e-12));
        // Kipping 2013, eqs. 17–18: q1 = (0.45 + 0.20)² = 0.4225, q2 = 0.45 / 1.3
        assertThat(u[2]).isCloseTo(0.4225, offset(1e-12));
        assertThat(u[3]).isCloseTo(0.45 / 1.3, offset(1e-12));
        // and back, eqs. 15–16: q1 = 0.36, q2 = 0.25 → u1 = 2·0.6·0.25 = 0.3, u2 = 0.6·0.5 = 0.3
        u[2] = 0.36;
        u[3] = 0.25;
        double[] back = c.toExternal(u);
        assertThat(back[layout.indexOf("limbDarkening1.a", null)]).isCloseTo(0.3, offset(1e-12));
        assertThat(back[layout.indexOf("limbDarkening1.b", null)]).isCloseTo(0.3, offset(1e-12));
        assertThat(back[ParameterLayout.ECCENTRICITY]).isCloseTo(0.1, offset(1e-12));
        assertThat(back[ParameterLayout.OMEGA]).isCloseTo(60, offset(1e-9));
        u[2] = 1.2;
        assertThat(c.outside(u)).contains("limbDarkening1.a").contains("Kipping");
    }

    @Test
    void leanChiSquareEqualsTheResidualsForEveryBaseline() {
        for (Baseline b : new Baseline[] {Baseline.NONE, Baseline.OFFSET, Baseline.LINEAR}) {
            FitProblem p = problem(PARTIAL, List.of("radius1", "radius2", "inclination"), 2);
            FitSettings s = p.settings().withBaseline(b);
            ParameterLayout layout = p.objective().layout();
            WeightedResiduals w = new WeightedResiduals(layout, p.data(), s);
            boolean[] left = new boolean[p.data().get(0).lightCurve().size()];
            left[3] = true;
            left[400] = true;
            w = w.withLeftOut(List.of(left));
            double[] internal = layout.startInternal();
            double direct = 0;
            double[] all = new double[w.size()];
            w.residuals(layout.toExternal(internal), all, 0);
            for (double r : all) {
                direct += r * r;
            }
            double lean = w.chi2External(layout.toExternal(internal), w.workspace());
            assertThat(lean).as(b.label()).isCloseTo(direct, offset(1e-9 * direct));
        }
    }

    @Test
    void chiSquareFromSegmentSumsEqualsThePlainPassOverEveryPoint() {
        // five segments (gaps of a day), points left out in and out of eclipse, errors that differ
        // from point to point: the χ² that visits only the points near an eclipse must equal
        // Σ((y − c m)/σ)² over every point (the residuals' own pass) to 1e-9
        List<SyntheticLightCurve.Gap> gaps = List.of(new SyntheticLightCurve.Gap(2460100.9, 2460101.9),
                new SyntheticLightCurve.Gap(2460102.6, 2460103.6), new SyntheticLightCurve.Gap(2460104.2, 2460105.2),
                new SyntheticLightCurve.Gap(2460106.0, 2460107.0));
        double[] t = SyntheticLightCurve.regularTimes(2460100.0, 2460108.5, 4, gaps, null);
        LightCurve clean = SyntheticLightCurve.observe(new BinaryModel(PARTIAL), t, 1500, 9, "T", "T", TimeScale.BJD_TDB);
        double[] err = new double[t.length];
        for (int i = 0; i < err.length; i++) {
            err[i] = 0.0015 * (1 + 0.5 * Math.sin(0.37 * i));
        }
        LightCurve lc = new LightCurve("T", "T", TimeScale.BJD_TDB, clean.originalKind(), t, clean.fluxes(), err,
                Map.of());
        for (Baseline b : new Baseline[] {Baseline.NONE, Baseline.OFFSET}) {
            FitProblem p = FitProblem.of(ModelFile.of(PARTIAL.withRadii(0.195, 0.135).withInclinationDeg(80.6)),
                    List.of(new FitData(lc, "T")), FitSettings.defaults().withBaseline(b)
                            .withFree(new LinkedHashSet<>(List.of("radius1", "radius2", "inclination"))));
            ParameterLayout layout = p.objective().layout();
            WeightedResiduals w = new WeightedResiduals(layout, p.data(), p.settings());
            boolean[] left = new boolean[t.length];
            BinaryModel start = new BinaryModel(layout.parameters(layout.startExternal(), 0));
            int leftInEclipse = 0;
            for (int i = 0; i < t.length; i += 37) {
                left[i] = true;
                leftInEclipse += start.inEclipse(t[i]) ? 1 : 0;
            }
            assertThat(leftInEclipse).isPositive();
            w = w.withLeftOut(List.of(left));
            for (double di : new double[] {0, -0.4, 0.7}) {
                double[] ext = layout.startExternal();
                ext[layout.indexOf("inclination", null)] += di;
                double[] all = new double[w.size()];
                w.residuals(ext, all, 0);
                double direct = 0;
                for (double r : all) {
                    direct += r * r;
                }
                double lean = w.chi2External(ext, w.workspace());
                assertThat(lean).as("%s Δi=%s", b.label(), di).isCloseTo(direct, offset(1e-9 * direct));
            }
        }
    }

    @Test
    void partialEclipsePosteriorHoldsTheTruthsInItsIntervals() {
        FitProblem p = problem(PARTIAL.withEccentricityOmega(0, 90), List.of("radius1", "radius2", "inclination"), 3);
        FitResult best = EclipseFitter.optimize(p);
        Posterior post = PosteriorSampler.sample(p, best, SamplerSettings.of(32, 20_000, 5, 2),
                SamplingProgress.NONE, () -> false);
        assertThat(post.convergence().converged()).as(post.convergence().reason()).isTrue();
        assertThat(post.convergence().chainLengthInTau()).isGreaterThanOrEqualTo(50);
        assertThat(post.names()).startsWith("radius1", "radius2", "inclination").contains("radiusRatio",
                "sumOfRadii", "lightRatio", "impactParameterPrimary");
        double[] truth = {0.19, 0.14, 81.0};
        for (int k = 0; k < 3; k++) {
            Marginal m = post.marginals().get(k);
            assertThat(truth[k]).as(post.names().get(k)).isBetween(m.lower95(), m.upper95());
            // the 68 % half-width agrees with the covariance error within a factor 2 on this near-Gaussian case
            double half = 0.5 * (m.upper68() - m.lower68());
            assertThat(half / best.parameters().get(ParameterLayout.RADIUS1 + k).uncertainty()).isBetween(0.5, 2.0);
        }
        // the r₂–i correlation of a partial eclipse shows in the chain
        double[] r2 = post.retained(1);
        double[] inc = post.retained(2);
        assertThat(correlation(r2, inc)).isLessThan(-0.9);
    }

    private static double correlation(double[] a, double[] b) {
        double ma = java.util.Arrays.stream(a).average().orElseThrow();
        double mb = java.util.Arrays.stream(b).average().orElseThrow();
        double sab = 0;
        double saa = 0;
        double sbb = 0;
        for (int i = 0; i < a.length; i++) {
            sab += (a[i] - ma) * (b[i] - mb);
            saa += (a[i] - ma) * (a[i] - ma);
            sbb += (b[i] - mb) * (b[i] - mb);
        }
        return sab / Math.sqrt(saa * sbb);
    }

    @Test
    void priorsThatExcludeTheStartOrNameAFixedParameterAreRefusedByName() {
        BinaryParameters truth = PARTIAL.withEccentricityOmega(0, 90);
        FitProblem p = problem(truth, List.of("radius1", "radius2", "inclination"), 4);
        ModelFile start = p.start();
        Map<String, String> cases = new LinkedHashMap<>();
        cases.put("radius2", "outside the uniform prior");
        cases.put("thirdLight", "fixed");
        cases.put("radius3", "unknown");
        Map<String, Prior> given = Map.of("radius2", new Prior.Uniform(0.2, 0.3), "thirdLight", new Prior.Normal(0, 0.1),
                "radius3", new Prior.Normal(0, 0.1));
        for (var c : cases.entrySet()) {
            Priors priors = new Priors(Map.of(c.getKey(), given.get(c.getKey())), "start.json");
            assertThatThrownBy(() -> FitProblem.of(start, p.data(), p.settings(), priors))
                    .isInstanceOf(BadInputException.class).hasMessageContaining("start.json")
                    .hasMessageContaining("priors." + c.getKey()).hasMessageContaining(c.getValue());
        }
    }
}
