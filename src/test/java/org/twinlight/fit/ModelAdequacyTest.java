package org.twinlight.fit;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.twinlight.eclipse.BinaryModel;
import org.twinlight.eclipse.BinaryParameters;
import org.twinlight.eclipse.LimbDarkening;
import org.twinlight.eclipse.ModelFile;
import org.twinlight.eclipse.SyntheticLightCurve;
import org.twinlight.photometry.LightCurve;
import org.twinlight.time.TimeScale;

/**
 * The model-adequacy note over noise seeds: raised when the data hold third light the model does
 * not have, or limb darkening other than the model's; not raised for a correct model. The large
 * version (100 seeds each) is {@code org.twinlight.bench.AdequacyInjection}.
 */
class ModelAdequacyTest {
    /** A detached pair seen at 2-minute cadence, the cases of the fit's known failures. */
    static final BinaryParameters TRUTH = new BinaryParameters(3.0712, 2460600.4417, 0.105, 0.072, 88.4, 0, 90,
            0.62, 0, LimbDarkening.quadratic(0.42, 0.21), LimbDarkening.quadratic(0.50, 0.19), 0, 1);

    static LightCurve observe(BinaryParameters p, double days, double ppm, long seed) {
        double[] t = SyntheticLightCurve.regularTimes(2460600.0, 2460600.0 + days, 2, List.of(), null);
        return SyntheticLightCurve.observe(new BinaryModel(p), t, ppm, seed, "T", "T", TimeScale.BJD_TDB);
    }

    /** Fits the data made from {@code truth} with the model {@code assumed} (default free parameters). */
    static FitResult fit(BinaryParameters truth, BinaryParameters assumed, double days, long seed) {
        LightCurve lc = observe(truth, days, 1000, seed);
        return EclipseFitter.fit(ModelFile.of(assumed.withRadii(0.11, 0.068).withInclinationDeg(87.8)),
                List.of(new FitData(lc, "T")), FitSettings.defaults());
    }

    @Test
    void unmodelledThirdLightWrongLimbDarkeningAndACorrectModel() {
        int seeds = 4;
        int thirdLight = 0;
        int limbDarkening = 0;
        int correct = 0;
        for (long seed = 1; seed <= seeds; seed++) {
            FitResult a = fit(TRUTH.withThirdLight(0.25), TRUTH, 14, seed);
            FitResult b = fit(TRUTH, TRUTH.withLimbDarkening(LimbDarkening.quadratic(0.52, 0.21),
                    LimbDarkening.quadratic(0.60, 0.19)), 14, seed);
            FitResult c = fit(TRUTH, TRUTH, 14, seed);
            thirdLight += a.adequacy().describesData() ? 0 : 1;
            limbDarkening += b.adequacy().describesData() ? 0 : 1;
            correct += c.adequacy().describesData() ? 0 : 1;
            if (!a.adequacy().describesData()) {
                assertThat(a.notes().get(0)).startsWith("the model does not describe the data")
                        .contains("third light").contains("limb-darkening");
            }
        }
        assertThat(thirdLight).isEqualTo(seeds);
        assertThat(limbDarkening).isEqualTo(seeds);
        assertThat(correct).isZero();
    }
}
