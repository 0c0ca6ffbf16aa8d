package org.twinlight.fit;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.twinlight.eclipse.BinaryModel;
import org.twinlight.eclipse.BinaryParameters;
import org.twinlight.eclipse.LimbDarkening;
import org.twinlight.eclipse.ModelFile;
import org.twinlight.eclipse.SyntheticLightCurve;
import org.twinlight.photometry.LightCurve;
import org.twinlight.time.TimeScale;

/**
 * Closed-loop checks of the least-squares fit: simulate a noisy light curve from known
 * parameters, start the fit from wrong values, and compare what comes back with the truth in
 * units of the fit's own uncertainties. For a correct fit with correct errors the pulls
 * (fitted − true)/σ follow a unit normal distribution (e.g. Barlow 1989, <i>Statistics</i>,
 * Wiley, §5.6; Press et al. 2007, <i>Numerical Recipes</i> 3rd ed., §15.6).
 */
class EclipseFitterRecoveryTest {

    // Demo system (invented): a detached pair with a total/annular eclipse configuration.
    private static final BinaryParameters TRUTH = new BinaryParameters(2.8731, 2460000.4123, 0.118, 0.081, 87.6,
            0, 90, 0.58, 0, LimbDarkening.quadratic(0.40, 0.22), LimbDarkening.quadratic(0.45, 0.20), 0, 1);
    private static final List<String> FREE = List.of("epoch", "radius1", "radius2", "inclination",
            "surfaceBrightnessRatio");

    private static LightCurve simulate(BinaryParameters p, long seed, double noisePpm) {
        double[] t = SyntheticLightCurve.regularTimes(2460000.0, 2460011.5, 4.0, List.of(), null);
        return SyntheticLightCurve.observe(new BinaryModel(p), t, noisePpm, seed, "sim-" + seed, "V", TimeScale.BJD_TDB);
    }

    private static ModelFile offStart(BinaryParameters truth) {
        // 10 % off in the radii and J, 1.5° off in inclination, 0.003 d off in epoch (the recovery claim)
        return ModelFile.of(truth.withRadii(truth.radius1() * 1.10, truth.radius2() * 0.90)
                .withSurfaceBrightnessRatio(truth.surfaceBrightnessRatio() * 1.10)
                .withInclinationDeg(truth.inclinationDeg() - 1.5)
                .withEpochDays(truth.epochDays() + 0.003));
    }

    private static double truthValue(String name) {
        return switch (name) {
            case "epoch" -> TRUTH.epochDays();
            case "radius1" -> TRUTH.radius1();
            case "radius2" -> TRUTH.radius2();
            case "inclination" -> TRUTH.inclinationDeg();
            case "surfaceBrightnessRatio" -> TRUTH.surfaceBrightnessRatio();
            default -> throw new IllegalArgumentException(name);
        };
    }

    @Test
    void noiseFreeDataAreRecoveredExactly() {
        LightCurve lc = simulate(TRUTH, 1, 0);
        FitResult r = EclipseFitter.fit(offStart(TRUTH), List.of(new FitData(lc, "V")),
                FitSettings.defaults().withFree(new LinkedHashSet<>(FREE)).withBaseline(Baseline.NONE));
        for (String name : FREE) {
            // a noise-free fit must return the truth far inside any realistic error (common practice,
            // no source: 1e-7 d ≈ 0.01 s, 1e-6 in R/a and J, 1e-5 degree)
            double tol = switch (name) {
                case "epoch" -> 1e-7;
                case "inclination" -> 1e-5;
                default -> 1e-6;
            };
            assertThat(r.get(name).value()).as(name).isCloseTo(truthValue(name), org.assertj.core.data.Offset.offset(tol));
        }
        assertThat(r.rms()).isLessThan(1e-7);
    }

    @Test
    void pullsOverManySeedsFollowAUnitNormal() {
        int seeds = 30;
        Map<String, List<Double>> pulls = new java.util.LinkedHashMap<>();
        for (long seed = 1; seed <= seeds; seed++) {
            LightCurve lc = simulate(TRUTH, seed, 2000);
            FitResult r = EclipseFitter.fit(offStart(TRUTH), List.of(new FitData(lc, "V")),
                    FitSettings.defaults().withFree(new LinkedHashSet<>(FREE)));
            for (String name : FREE) {
                Estimate e = r.get(name);
                pulls.computeIfAbsent(name, k -> new ArrayList<>()).add((e.value() - truthValue(name)) / e.uncertainty());
            }
            assertThat(r.reducedChi2()).isBetween(0.9, 1.1);
        }
        int outside3 = 0;
        for (Map.Entry<String, List<Double>> e : pulls.entrySet()) {
            double mean = e.getValue().stream().mapToDouble(Double::doubleValue).average().orElseThrow();
            double sd = Math.sqrt(e.getValue().stream().mapToDouble(v -> (v - mean) * (v - mean)).sum()
                    / (e.getValue().size() - 1));
            System.out.printf("%s pull mean %.3f sd %.3f%n", e.getKey(), mean, sd);
            // sample sd of 30 unit-normal pulls has a standard error of about 1/sqrt(60) = 0.13
            assertThat(sd).as("spread of pulls of " + e.getKey()).isBetween(0.65, 1.4);
            assertThat(Math.abs(mean)).as("mean pull of " + e.getKey()).isLessThan(0.6);
            for (double v : e.getValue()) {
                if (Math.abs(v) > 3) {
                    outside3++;
                }
                assertThat(Math.abs(v)).as("pull of " + e.getKey()).isLessThan(4.5);
            }
        }
        // 150 pulls: about 0.4 expected beyond 3σ for a unit normal
        assertThat(outside3).isLessThanOrEqualTo(2);
    }
}
