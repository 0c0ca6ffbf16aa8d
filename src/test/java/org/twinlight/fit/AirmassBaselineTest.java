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
import org.twinlight.time.TimeScale;

/**
 * Ground nights dimmed by extinction: with the airmass as a baseline term per night the eclipse
 * depth comes back unbent; with an offset per night only it is biased.
 */
class AirmassBaselineTest {
    // Demo system (invented)
    private static final BinaryParameters TRUTH = new BinaryParameters(0.8731542, 2460571.41238, 0.18, 0.14, 86,
            0, 90, 0.8, 0, LimbDarkening.quadratic(0.5, 0.2), LimbDarkening.quadratic(0.55, 0.2), 0, 1);
    /**
     * Differential extinction, mag per airmass: comparison stars of another colour leave a few
     * hundredths (common practice, no source).
     */
    private static final double EXTINCTION_MAG = 0.05;

    /**
     * Plane-parallel airmass sec z at latitude 45°, declination +20°, the star crossing the meridian
     * at 0.45 of the Julian day (cos z = sin φ sin δ + cos φ cos δ cos H: Smart 1977, Textbook on
     * Spherical Astronomy, §31).
     */
    private static double airmass(double t) {
        double frac = t - Math.floor(t);
        double h = 2 * Math.PI * (frac - 0.45) * 1.0027379;
        double lat = Math.toRadians(45);
        double dec = Math.toRadians(20);
        return 1 / (Math.sin(lat) * Math.sin(dec) + Math.cos(lat) * Math.cos(dec) * Math.cos(h));
    }

    private static LightCurve night(long seed) {
        double[] t = SyntheticLightCurve.regularTimes(2460570.3, 2460574.7, 2.0, List.of(), new double[] {0.30, 0.66});
        LightCurve clean = SyntheticLightCurve.observe(new BinaryModel(TRUTH), t, 2500, seed, "ground", "V",
                TimeScale.HJD_UTC);
        double[] f = clean.fluxes();
        double[] x = new double[t.length];
        for (int i = 0; i < t.length; i++) {
            x[i] = airmass(t[i]);
            f[i] *= Math.pow(10, -0.4 * EXTINCTION_MAG * x[i]);
        }
        return new LightCurve("ground", "V", TimeScale.HJD_UTC, clean.originalKind(), t, f, clean.fluxErrors(),
                java.util.Map.of()).withAirmass(x);
    }

    private static double depth(BinaryParameters p) {
        return 1 - new BinaryModel(p).flux(p.epochDays());
    }

    @Test
    void airmassTermKeepsTheEclipseDepthUnbent() {
        LinkedHashSet<String> free = new LinkedHashSet<>(FitSettings.DEFAULT_FREE);
        ModelFile start = ModelFile.of(TRUTH.withRadii(0.19, 0.13).withInclinationDeg(85));
        double trueDepth = depth(TRUTH);
        for (long seed = 1; seed <= 2; seed++) {
            LightCurve lc = night(seed);
            FitResult with = EclipseFitter.fit(start, List.of(new FitData(lc, "V")),
                    FitSettings.defaults().withFree(free));
            FitResult without = EclipseFitter.fit(start, List.of(new FitData(lc.withAirmass(null), "V")),
                    FitSettings.defaults().withFree(free));
            double depthWith = depth(with.model().common());
            double depthWithout = depth(without.model().common());
            // the sum of radii sets the eclipse widths: within 3σ with the airmass term
            double sigma = with.get("radius1").uncertainty();
            assertThat(Math.abs(with.get("radius1").value() - TRUTH.radius1()) / sigma).isLessThan(3);
            assertThat(Math.abs(with.get("radius2").value() - TRUTH.radius2())
                    / with.get("radius2").uncertainty()).isLessThan(3);
            assertThat(with.reducedChi2()).isLessThan(1.15);
            // depth: unbent within 0.3 % of the light with the airmass term, off by more without it
            assertThat(Math.abs(depthWith - trueDepth)).as("depth error with airmass").isLessThan(0.003);
            assertThat(Math.abs(depthWithout - trueDepth)).as("depth error without airmass")
                    .isGreaterThan(3 * Math.abs(depthWith - trueDepth)).isGreaterThan(0.003);
            assertThat(without.reducedChi2()).isGreaterThan(1.5);
        }
    }
}
