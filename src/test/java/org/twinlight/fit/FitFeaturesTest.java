package org.twinlight.fit;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.twinlight.BadInputException;
import org.twinlight.eclipse.BandValues;
import org.twinlight.eclipse.BinaryModel;
import org.twinlight.eclipse.BinaryParameters;
import org.twinlight.eclipse.LimbDarkening;
import org.twinlight.eclipse.ModelFile;
import org.twinlight.eclipse.SyntheticLightCurve;
import org.twinlight.photometry.LightCurve;
import org.twinlight.time.TimeScale;

/**
 * Fits with several bands, baselines, eccentric orbits and third light. Each recovery is judged
 * in units of the fit's own uncertainty (common practice, no source: within 4σ for single cases).
 */
class FitFeaturesTest {
    private static final BinaryParameters BASE = new BinaryParameters(1.9327, 2460500.2711, 0.142, 0.097, 86.9,
            0, 90, 0.62, 0, LimbDarkening.quadratic(0.42, 0.2), LimbDarkening.quadratic(0.5, 0.2), 0, 1);

    private static LightCurve observe(BinaryParameters p, double start, double end, double cadenceMin, double ppm,
            long seed, String band) {
        double[] t = SyntheticLightCurve.regularTimes(start, end, cadenceMin, List.of(), null);
        return SyntheticLightCurve.observe(new BinaryModel(p), t, ppm, seed, band, band, TimeScale.BJD_TDB);
    }

    private static LightCurve scaled(LightCurve lc, double scale, double slopePerDay) {
        double[] f = lc.fluxes();
        double[] e = lc.fluxErrors();
        double mid = 0.5 * (lc.startDays() + lc.endDays());
        for (int i = 0; i < f.length; i++) {
            double factor = scale * (1 + slopePerDay * (lc.time(i) - mid));
            f[i] *= factor;
            e[i] *= factor;
        }
        return new LightCurve(lc.source(), lc.band(), lc.timeScale(), lc.originalKind(), lc.timesDays(), f, e, Map.of());
    }

    private static void assertWithin(Estimate e, double truth, double sigmas) {
        assertThat(Math.abs(e.value() - truth)).as("%s%s = %s ± %s, truth %s", e.name(),
                e.band() == null ? "" : "@" + e.band(), e.value(), e.uncertainty(), truth)
                .isLessThanOrEqualTo(sigmas * e.uncertainty());
    }

    @Test
    void twoBandsShareTheGeometryAndKeepTheirOwnSurfaceBrightnessRatios() {
        BinaryParameters blue = BASE.withSurfaceBrightnessRatio(0.48);
        BinaryParameters red = BASE.withSurfaceBrightnessRatio(0.66)
                .withLimbDarkening(LimbDarkening.quadratic(0.3, 0.22), LimbDarkening.quadratic(0.36, 0.22));
        LightCurve b = observe(blue, 2460500, 2460506, 3, 1500, 1, "B");
        LightCurve r = observe(red, 2460500.01, 2460506, 3, 1500, 2, "R");
        ModelFile start = new ModelFile(BASE.withRadii(0.15, 0.09).withInclinationDeg(86), Map.of(
                "B", new BandValues(0.55, null, null, null),
                "R", new BandValues(0.6, null, LimbDarkening.quadratic(0.3, 0.22), LimbDarkening.quadratic(0.36, 0.22))));
        FitResult fit = EclipseFitter.fit(start, List.of(new FitData(b, "B"), new FitData(r, "R")),
                FitSettings.defaults().withFree(new LinkedHashSet<>(List.of("epoch", "radius1", "radius2", "inclination",
                        "surfaceBrightnessRatio"))));
        assertWithin(fit.get("radius1"), BASE.radius1(), 4);
        assertWithin(fit.get("inclination"), BASE.inclinationDeg(), 4);
        assertWithin(fit.get("surfaceBrightnessRatio", "B"), 0.48, 4);
        assertWithin(fit.get("surfaceBrightnessRatio", "R"), 0.66, 4);
        assertThat(fit.model().bands()).containsKeys("B", "R");
        assertThat(fit.model().forBand("R").limbDarkening1().coefficient(0)).isEqualTo(0.3);
    }

    @Test
    void linearBaselineAbsorbsATrendAndAnArbitraryFluxScale() {
        LightCurve clean = observe(BASE, 2460500, 2460504.2, 2, 1000, 3, "V");
        LightCurve trended = scaled(clean, 3.2e-5, 0.004); // like flux from magnitudes, with a slow drift
        ModelFile start = ModelFile.of(BASE.withRadii(0.135, 0.1).withInclinationDeg(86.2));
        FitSettings settings = FitSettings.defaults().withBaseline(Baseline.LINEAR).withSegmentGapDays(10);
        FitResult fit = EclipseFitter.fit(start, List.of(new FitData(trended, "V")), settings);
        assertWithin(fit.get("radius1"), BASE.radius1(), 4);
        assertWithin(fit.get("radius2"), BASE.radius2(), 4);
        assertThat(fit.reducedChi2()).isBetween(0.9, 1.1);
        double[] c = fit.curves().get(0).baselineCoefficients()[0];
        assertThat(c[0]).isCloseTo(3.2e-5, org.assertj.core.data.Percentage.withPercentage(0.1));

        FitResult offsetOnly = EclipseFitter.fit(start, List.of(new FitData(trended, "V")),
                settings.withBaseline(Baseline.OFFSET));
        assertThat(offsetOnly.reducedChi2()).isGreaterThan(2);
    }

    @Test
    void eccentricityAndOmegaAreRecoveredFromBothEclipses() {
        BinaryParameters truth = BASE.withEccentricityOmega(0.06, 118);
        LightCurve lc = observe(truth, 2460500, 2460508, 3, 800, 5, "V");
        ModelFile start = ModelFile.of(truth.withEccentricityOmega(0.03, 100).withRadii(0.15, 0.09));
        FitResult fit = EclipseFitter.fit(start, List.of(new FitData(lc, "V")), FitSettings.defaults()
                .withFree(new LinkedHashSet<>(List.of("epoch", "radius1", "radius2", "inclination", "surfaceBrightnessRatio",
                        "eccentricity", "omega"))));
        // e cos ω is fixed by the secondary's timing, e sin ω by the ratio of the eclipse durations
        assertWithin(fit.get("eCosOmega"), 0.06 * Math.cos(Math.toRadians(118)), 4);
        assertWithin(fit.get("eSinOmega"), 0.06 * Math.sin(Math.toRadians(118)), 4);
        assertWithin(fit.get("eccentricity"), 0.06, 4);
    }

    @Test
    void thirdLightStartingOnItsBoundMovesOffIt() {
        BinaryParameters truth = BASE.withThirdLight(0.15);
        LightCurve lc = observe(truth, 2460500, 2460506, 2, 300, 9, "V");
        ModelFile start = ModelFile.of(BASE);
        FitResult fit = EclipseFitter.fit(start, List.of(new FitData(lc, "V")), FitSettings.defaults()
                .withFree(new LinkedHashSet<>(List.of("epoch", "radius1", "radius2", "inclination", "surfaceBrightnessRatio",
                        "thirdLight"))));
        assertWithin(fit.get("thirdLight"), 0.15, 4);
        assertThat(fit.get("thirdLight").isLimit()).isFalse();
    }

    @Test
    void oneLimbDarkeningCoefficientCanBeFreedByName() {
        LightCurve lc = observe(BASE, 2460500, 2460506, 2, 300, 12, "V");
        ModelFile start = ModelFile.of(BASE.withLimbDarkening(LimbDarkening.quadratic(0.3, 0.2), BASE.limbDarkening2()));
        FitResult fit = EclipseFitter.fit(start, List.of(new FitData(lc, "V")), FitSettings.defaults()
                .withFree(new LinkedHashSet<>(List.of("epoch", "radius1", "radius2", "inclination", "surfaceBrightnessRatio",
                        "limbDarkening1.a"))));
        assertWithin(fit.get("limbDarkening1.a"), 0.42, 4);
        assertThat(fit.get("limbDarkening1.b").free()).isFalse();
        assertThatThrownBy(() -> EclipseFitter.fit(start, List.of(new FitData(lc, "V")), FitSettings.defaults()
                .withFree(new LinkedHashSet<>(List.of("limbDarkening1.alpha")))))
                .isInstanceOf(BadInputException.class).hasMessageContaining("limbDarkening1.a");
    }

    @Test
    void dataWithoutEclipsesDoNotGiveASuccessfulFit() {
        // regression: a face-on system (no eclipses) once "fitted" with radii of 0.98 ± 0.68
        LightCurve lc = observe(BASE.withInclinationDeg(0), 2460500, 2460504, 3, 2000, 21, "V");
        assertThatThrownBy(() -> EclipseFitter.fit(ModelFile.of(BASE), List.of(new FitData(lc, "V")),
                FitSettings.defaults())).isInstanceOf(org.twinlight.WorkFailedException.class);
    }
}
