package org.twinlight.fit;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.LinkedHashSet;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.twinlight.eclipse.BinaryModel;
import org.twinlight.eclipse.BinaryParameters;
import org.twinlight.eclipse.LimbDarkening;
import org.twinlight.eclipse.ModelFile;
import org.twinlight.eclipse.SyntheticLightCurve;
import org.twinlight.photometry.LightCurve;

/**
 * The global search on injected light curves. In a partial eclipse of stars of similar surface
 * brightness the radii can be swapped with little change of the light curve: for uniform discs of
 * equal brightness the eclipsed area and the total light are symmetric in r₁ and r₂, so k and 1/k
 * fit exactly equally (the overlap area of two circles is symmetric in their radii; Kopal 1959,
 * Close Binary Systems, ch. 6, from memory). With J = 0.99 the valley between k and 1/k is
 * nearly flat, and the search must say that k on the other side of 1 is not excluded.
 */
class GlobalSearchTest {
    private static final FitSettings FREE = FitSettings.defaults().withFree(new LinkedHashSet<>(
            List.of("epoch", "radius1", "radius2", "inclination", "surfaceBrightnessRatio")));

    private static LightCurve observe(BinaryParameters p, double ppm, long seed) {
        double[] t = SyntheticLightCurve.regularTimes(2460400, 2460410, 4, List.of(), null);
        return SyntheticLightCurve.observe(new BinaryModel(p), t, ppm, seed, "V", "V",
                org.twinlight.time.TimeScale.BJD_TDB);
    }

    @Test
    void aPartialEclipseOfNearTwinsCannotTellKFromOneOverK() {
        BinaryParameters truth = new BinaryParameters(2.1187, 2460400.4113, 0.125, 0.104, 84.0, 0, 90, 0.99, 0,
                LimbDarkening.uniform(), LimbDarkening.uniform(), 0, 1);
        LightCurve lc = observe(truth, 3000, 5);
        ModelFile start = ModelFile.of(truth.withRadii(0.115, 0.115).withInclinationDeg(85).withSurfaceBrightnessRatio(1));
        GlobalSearch.Result r = GlobalSearch.run(FitProblem.of(start, List.of(new FitData(lc, "V")), FREE));
        List<Double> ks = r.minima().stream().filter(m -> m.chi2() - r.minima().get(0).chi2() < 9)
                .map(m -> m.parameters().get("radiusRatio")).toList();
        // the truth side and the other side of k = 1 both fit within Δχ² < 9
        assertThat(ks).anyMatch(k -> k < 1 && Math.abs(k - 0.832) < 0.1).anyMatch(k -> k >= 0.999);
        assertThat(r.notes()).anyMatch(n -> n.contains("the primary may be the smaller star"));
        // deterministic for a seed
        GlobalSearch.Result again = GlobalSearch.run(FitProblem.of(start, List.of(new FitData(lc, "V")), FREE));
        assertThat(again.minima().get(0).chi2()).isEqualTo(r.minima().get(0).chi2());
        assertThat(again.minima()).hasSameSizeAs(r.minima());
    }

    @Test
    void aTotalEclipseHasOneMinimumAndNoNote() {
        BinaryParameters truth = new BinaryParameters(2.1187, 2460400.4113, 0.14, 0.08, 89.3, 0, 90, 0.55, 0,
                LimbDarkening.quadratic(0.4, 0.2), LimbDarkening.quadratic(0.5, 0.2), 0, 1);
        LightCurve lc = observe(truth, 1000, 6);
        ModelFile start = ModelFile.of(truth.withRadii(0.13, 0.09).withInclinationDeg(88));
        GlobalSearch.Result r = GlobalSearch.run(FitProblem.of(start, List.of(new FitData(lc, "V")), FREE));
        assertThat(r.notes()).isEmpty();
        assertThat(r.minima().get(0).parameters().get("radiusRatio")).isCloseTo(0.08 / 0.14,
                org.assertj.core.api.Assertions.within(0.02));
        FitResult fit = EclipseFitter.optimize(r.best());
        assertThat(fit.get("radiusRatio").value()).isCloseTo(0.08 / 0.14,
                org.assertj.core.api.Assertions.within(4 * fit.get("radiusRatio").uncertainty()));
    }
}
