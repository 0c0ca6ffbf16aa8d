package org.twinlight.batch;

import java.nio.file.Path;
import java.util.List;
import org.twinlight.eclipse.BinaryModel;
import org.twinlight.eclipse.BinaryParameters;
import org.twinlight.eclipse.LimbDarkening;
import org.twinlight.eclipse.SyntheticLightCurve;
import org.twinlight.photometry.LightCurve;
import org.twinlight.report.LightCurveFiles;
import org.twinlight.time.TimeScale;

/**
 * Small synthetic detached binaries made by the project's simulator, for batch tests and the
 * batch benchmark: each target a few hundred points with two clear eclipses per orbit.
 */
public final class SyntheticTargets {
    private SyntheticTargets() {
    }

    /** The model of target {@code k}: periods 0.9 to 2.3 d, radii 0.13 and 0.10, i = 88.5°. */
    public static BinaryParameters model(int k) {
        double period = 0.9 + 0.137 * (k % 11);
        LimbDarkening ld = LimbDarkening.of(org.twinlight.eclipse.LimbDarkeningLaw.LINEAR, 0.6);
        return new BinaryParameters(period, 2460100.2 + 0.01 * k, 0.13, 0.10, 88.5, 0, 90, 0.6, 0, ld, ld, 0, 1);
    }

    /**
     * Writes target {@code k} to {@code folder/NAME.csv}: {@code days} of data at a cadence of
     * {@code cadenceMinutes}, 1500 ppm of noise (seed k), BJD_TDB.
     */
    public static Path write(Path folder, String name, int k, double days, double cadenceMinutes) {
        double[] t = SyntheticLightCurve.regularTimes(2460100, 2460100 + days, cadenceMinutes, List.of(), null);
        LightCurve lc = SyntheticLightCurve.observe(new BinaryModel(model(k)), t, 1500, k + 1, name + ".csv", null,
                TimeScale.parse("BJD_TDB").orElseThrow());
        Path f = folder.resolve(name + ".csv");
        LightCurveFiles.writeCsv(lc, f, null, "synthetic target " + k + " for batch tests");
        return f;
    }
}
