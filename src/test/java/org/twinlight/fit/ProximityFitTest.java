package org.twinlight.fit;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.LinkedHashSet;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.twinlight.eclipse.BinaryModel;
import org.twinlight.eclipse.BinaryParameters;
import org.twinlight.eclipse.LimbDarkening;
import org.twinlight.eclipse.ModelFile;
import org.twinlight.eclipse.ProximityEffects;
import org.twinlight.eclipse.SyntheticLightCurve;
import org.twinlight.photometry.LightCurve;
import org.twinlight.time.TimeScale;

/**
 * Fits of close pairs: with the proximity terms the radii come back within 3σ of the truth where
 * the two-sphere model is biased by more than 3σ; the amplitudes are reported; and the notes say
 * when a star is too large for spheres.
 */
class ProximityFitTest {
    // Demo system (invented): a 0.9-day pair with a visible tide and heated faces.
    private static final ProximityEffects EFFECTS = new ProximityEffects(0.75, null, null, null,
            ProximityEffects.Ellipsoidal.fromPhysics(0.32, 0.32), new ProximityEffects.Reflection(0.6, 0.6), null);
    private static final BinaryParameters TRUTH = new BinaryParameters(0.9, 2460000.3, 0.22, 0.16, 82, 0, 90, 0.7,
            0, LimbDarkening.quadratic(0.45, 0.2), LimbDarkening.quadratic(0.5, 0.2), 0, 1, EFFECTS);
    private static final List<String> GEOMETRY = List.of("epoch", "radius1", "radius2", "inclination",
            "surfaceBrightnessRatio");

    private static LightCurve simulate(long seed) {
        // four nights' worth of continuous 3-minute data, 500 ppm
        double[] t = SyntheticLightCurve.regularTimes(2460000.0, 2460004.0, 3.0, List.of(), null);
        return SyntheticLightCurve.observe(new BinaryModel(TRUTH), t, 500, seed, "close-" + seed, "V",
                TimeScale.BJD_TDB);
    }

    private static BinaryParameters offStart(BinaryParameters p) {
        return p.withRadii(p.radius1() * 1.05, p.radius2() * 0.95).withInclinationDeg(p.inclinationDeg() - 1)
                .withSurfaceBrightnessRatio(p.surfaceBrightnessRatio() * 1.05);
    }

    private static double pull(FitResult r, String name, double truth) {
        return (r.get(name).value() - truth) / r.get(name).uncertainty();
    }

    @Test
    void proximityTermsRemoveTheBiasOfTheSphericalFit() {
        for (long seed = 1; seed <= 3; seed++) {
            List<FitData> data = List.of(new FitData(simulate(seed), "V"));
            FitResult spheres = EclipseFitter.fit(ModelFile.of(offStart(TRUTH.withProximity(ProximityEffects.NONE))),
                    data, FitSettings.defaults().withFree(new LinkedHashSet<>(GEOMETRY)));
            LinkedHashSet<String> free = new LinkedHashSet<>(GEOMETRY);
            free.addAll(List.of("massRatio", "reflection.albedo1", "reflection.albedo2"));
            BinaryParameters start = offStart(TRUTH).withProximity(EFFECTS.withMassRatio(0.6)
                    .withTerms(EFFECTS.ellipsoidal(), new ProximityEffects.Reflection(0.4, 0.4), null));
            FitResult close = EclipseFitter.fit(ModelFile.of(start), data, FitSettings.defaults().withFree(free));
            for (String radius : List.of("radius1", "radius2")) {
                double truth = radius.equals("radius1") ? TRUTH.radius1() : TRUTH.radius2();
                double sigma = close.get(radius).uncertainty();
                // the two-sphere error bars are inflated by the misfit (χ²ν ≫ 1), so its bias is measured in
                // the σ the data support, that of the adequate model
                assertThat(Math.abs(spheres.get(radius).value() - truth) / sigma).as("two-sphere bias of " + radius
                        + " in σ, seed " + seed).isGreaterThan(3);
                assertThat(Math.abs(pull(close, radius, truth))).as(radius + " pull, seed " + seed).isLessThan(3);
            }
            assertThat(spheres.reducedChi2()).isGreaterThan(2);
            assertThat(Math.abs(pull(close, "massRatio", 0.75))).as("massRatio pull").isLessThan(3);
            assertThat(close.reducedChi2()).isLessThan(1.2);
            // every amplitude is reported, with an uncertainty
            for (String name : List.of("ellipsoidalAmplitude", "reflectionAmplitude1", "reflectionAmplitude2")) {
                Estimate e = close.derived().stream().filter(d -> d.name().equals(name)).findFirst().orElseThrow();
                assertThat(e.uncertainty()).as(name).isPositive();
            }
        }
    }

    @Test
    void freeAmplitudesAreRecovered() {
        // an ellipsoidal variation and a beaming given as free amplitudes (demo values), fitted from other starts
        BinaryParameters truth = TRUTH.withProximity(new ProximityEffects(null, null, null, null,
                ProximityEffects.Ellipsoidal.free(0.008), null, ProximityEffects.Beaming.free(6e-4)));
        LinkedHashSet<String> free = new LinkedHashSet<>(GEOMETRY);
        free.addAll(List.of("ellipsoidal.amplitude", "beaming.amplitude"));
        for (long seed = 11; seed <= 12; seed++) {
            double[] t = SyntheticLightCurve.regularTimes(2460000.0, 2460004.0, 3.0, List.of(), null);
            LightCurve lc = SyntheticLightCurve.observe(new BinaryModel(truth), t, 500, seed, "free-" + seed, "V",
                    TimeScale.BJD_TDB);
            BinaryParameters start = offStart(truth).withProximity(new ProximityEffects(null, null, null, null,
                    ProximityEffects.Ellipsoidal.free(0.004), null, ProximityEffects.Beaming.free(0)));
            FitResult r = EclipseFitter.fit(ModelFile.of(start), List.of(new FitData(lc, "V")),
                    FitSettings.defaults().withFree(free));
            assertThat(Math.abs(pull(r, "ellipsoidal.amplitude", 0.008))).as("ellipsoidal, seed " + seed).isLessThan(3);
            assertThat(Math.abs(pull(r, "beaming.amplitude", 6e-4))).as("beaming, seed " + seed).isLessThan(3);
            assertThat(Math.abs(pull(r, "radius1", TRUTH.radius1()))).as("radius1, seed " + seed).isLessThan(3);
        }
    }

    @Test
    void starsTooLargeForSpheresAreNamed() {
        // Roche lobes from Eggleton 1983, ApJ 268, 368 eq. 2 (REFERENCE-VALUES §14: q = 2 → 0.440004,
        // q = 0.5 → 0.320788); the r ≈ 0.25 limit is common practice, no source
        BinaryParameters p = BinaryParameters.circular(0.5, 0, 0.28, 0.33, 80, 0.5)
                .withProximity(new ProximityEffects(0.5, null, null, null, null, null, null));
        List<String> notes = FitNotes.distortion(p);
        assertThat(notes).hasSize(2);
        assertThat(notes.get(0)).contains("star 1 is too distorted").contains("64%").contains("0.440");
        assertThat(notes.get(1)).contains("star 2 is too distorted").contains("reaches its Roche lobe")
                .contains("0.321");
        // without a mass ratio: compared with the equal-mass lobe, 0.379 (REFERENCE-VALUES §14, q = 1)
        assertThat(FitNotes.distortion(BinaryParameters.circular(0.5, 0, 0.27, 0.1, 80, 0.5)))
                .singleElement().asString().contains("0.379");
        assertThat(FitNotes.distortion(BinaryParameters.circular(0.5, 0, 0.2, 0.1, 80, 0.5))).isEmpty();
        assertThat(FitNotes.MAX_SPHERICAL_RADIUS).isCloseTo(0.25, within(0.0));
    }
}
