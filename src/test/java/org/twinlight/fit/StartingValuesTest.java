package org.twinlight.fit;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.twinlight.eclipse.BinaryModel;
import org.twinlight.eclipse.BinaryParameters;
import org.twinlight.eclipse.LimbDarkening;
import org.twinlight.eclipse.SyntheticLightCurve;
import org.twinlight.photometry.LightCurve;
import org.twinlight.time.TimeScale;

/**
 * Starting values from folded data against the truth of synthetic curves. The relations are first
 * order in e and ignore limb darkening, so the tolerances are those of a starting guess (common
 * practice, no source), with the expected values computed independently here from the truth.
 */
class StartingValuesTest {
    private static final BinaryParameters BASE = new BinaryParameters(3.1416, 2460400.3, 0.10, 0.07, 89.5, 0, 90,
            0.55, 0, LimbDarkening.quadratic(0.4, 0.2), LimbDarkening.quadratic(0.45, 0.2), 0, 1);

    private static LightCurve observe(BinaryParameters p, long seed) {
        double[] t = SyntheticLightCurve.regularTimes(2460400, 2460425, 4, List.of(), null);
        return SyntheticLightCurve.observe(new BinaryModel(p), t, 800, seed, "V", "V", TimeScale.BJD_TDB);
    }

    @Test
    void eccentricityComponentsComeFromTheSecondarysPhaseAndTheWidths() {
        for (double omega : new double[] {30, 120, 250, 320}) {
            BinaryParameters p = BASE.withEccentricityOmega(0.1, omega);
            StartingValues s = StartingValues.estimate(observe(p, 3), p.withEccentricityOmega(0, 90));
            double w = Math.toRadians(omega);
            // the secondary's phase is exact from the project's orbit; the first-order relation is
            // good to about e²: 0.01, plus the binning (1/400 of a period ≈ 0.004 in e cos ω)
            assertThat(s.eCosOmega()).as("e cos ω at ω = %s", omega).isCloseTo(0.1 * Math.cos(w), within(0.015));
            assertThat(s.eSinOmega()).as("e sin ω at ω = %s", omega).isCloseTo(0.1 * Math.sin(w), within(0.04));
        }
    }

    @Test
    void sizesAndBrightnessOfACircularTotalAreCloseEnoughToStartFrom() {
        StartingValues s = StartingValues.estimate(observe(BASE, 5), BASE);
        assertThat(s.secondarySeen()).isTrue();
        assertThat(s.secondaryPhase()).isCloseTo(0.5, within(0.003));
        assertThat(s.sumOfRadii()).isCloseTo(0.17, within(0.17 * 0.1));
        assertThat(s.radiusRatio()).isCloseTo(0.7, within(0.7 * 0.2));
        assertThat(s.surfaceBrightnessRatio()).isCloseTo(0.55, within(0.55 * 0.25));
        assertThat(s.flatBottomed()).isTrue();
        assertThat(s.inclinationDeg()).isGreaterThan(88.0);
    }
}
