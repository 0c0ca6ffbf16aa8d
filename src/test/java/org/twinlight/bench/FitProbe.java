package org.twinlight.bench;

import java.util.LinkedHashSet;
import java.util.List;
import org.twinlight.eclipse.*;
import org.twinlight.fit.*;
import org.twinlight.photometry.LightCurve;
import org.twinlight.time.TimeScale;

public class FitProbe {
    public static void main(String[] a) {
        BinaryParameters truth = new BinaryParameters(2.8731, 2460000.4123, 0.118, 0.081, 87.6,
            0, 90, 0.58, 0, LimbDarkening.quadratic(0.40, 0.22), LimbDarkening.quadratic(0.45, 0.20), 0, 1);
        double[] t = SyntheticLightCurve.regularTimes(2460000.0, 2460011.5, 4.0, List.of(), null);
        LightCurve lc = SyntheticLightCurve.observe(new BinaryModel(truth), t, 0, 1, "x", "V", TimeScale.BJD_TDB);
        ModelFile start = ModelFile.of(truth.withRadii(truth.radius1() * 1.10, truth.radius2() * 0.90)
                .withSurfaceBrightnessRatio(truth.surfaceBrightnessRatio() * 1.10)
                .withInclinationDeg(truth.inclinationDeg() - 1.5).withEpochDays(truth.epochDays() + 0.003));
        for (int k = 0; k < 3; k++) {
            long t0 = System.nanoTime();
            FitResult r = EclipseFitter.fit(start, List.of(new FitData(lc, "V")), FitSettings.defaults().withBaseline(Baseline.NONE));
            System.out.printf("fit %.3f s iter %d eval %d chi2 %.3e i=%.8f r1=%.8f%n", (System.nanoTime() - t0) / 1e9, r.iterations(), r.evaluations(), r.chi2(), r.get("inclination").value(), r.get("radius1").value());
        }
        BinaryModel m = new BinaryModel(truth);
        double[] out = new double[t.length];
        for (int k = 0; k < 200; k++) m.flux(t, out);
        long t0 = System.nanoTime();
        for (int k = 0; k < 200; k++) m.flux(t, out);
        System.out.printf("model eval %.3f ms for %d points%n", (System.nanoTime() - t0) / 1e6 / 200, t.length);
    }
}
