package org.twinlight.bench;

import java.util.LinkedHashSet;
import java.util.List;
import org.twinlight.eclipse.BinaryModel;
import org.twinlight.eclipse.BinaryParameters;
import org.twinlight.eclipse.LimbDarkening;
import org.twinlight.eclipse.ModelFile;
import org.twinlight.eclipse.SyntheticLightCurve;
import org.twinlight.fit.EclipseFitter;
import org.twinlight.fit.FitData;
import org.twinlight.fit.FitProblem;
import org.twinlight.fit.FitResult;
import org.twinlight.fit.FitSettings;
import org.twinlight.fit.GlobalSearch;
import org.twinlight.photometry.LightCurve;
import org.twinlight.time.TimeScale;

/**
 * Wall time of {@code fit --global} on the standard light curve: 20,000 points at 2-minute cadence,
 * 8 free parameters (period, epoch, both radii, inclination, surface-brightness ratio, third light,
 * a limb-darkening coefficient), then the ordinary fit from the best minimum. Target ≤ 3 s for the
 * search. Run with
 * {@code java -cp target/classes:target/test-classes:$(deps) org.twinlight.bench.GlobalSearchBench [RUNS]}.
 */
public final class GlobalSearchBench {

    private GlobalSearchBench() {
    }

    public static void main(String[] args) {
        int runs = args.length > 0 ? Integer.parseInt(args[0]) : 3;
        BinaryParameters truth = new BinaryParameters(3.8714, 2460600.2517, 0.071, 0.055, 88.6, 0, 90, 0.71, 0.04,
                LimbDarkening.quadratic(0.42, 0.21), LimbDarkening.quadratic(0.5, 0.2), 0, 1);
        double[] t = SyntheticLightCurve.regularTimes(2460600, 2460600 + 20_000 * 2.0 / 1440, 2, List.of(), null);
        LightCurve lc = SyntheticLightCurve.observe(new BinaryModel(truth), t, 500, 3, "V", "V", TimeScale.BJD_TDB);
        ModelFile start = ModelFile.of(truth.withRadii(0.075, 0.05).withInclinationDeg(87.5)
                .withSurfaceBrightnessRatio(0.6).withThirdLight(0.0));
        FitSettings settings = FitSettings.defaults().withFree(new LinkedHashSet<>(List.of("period", "epoch",
                "radius1", "radius2", "inclination", "surfaceBrightnessRatio", "thirdLight", "limbDarkening1.a")));
        FitProblem problem = FitProblem.of(start, List.of(new FitData(lc, "V")), settings);
        System.out.printf("%d points, %d free parameters, %d processors%n", lc.size(), settings.free().size(),
                Runtime.getRuntime().availableProcessors());
        for (int run = 0; run < runs; run++) {
            long t0 = System.nanoTime();
            GlobalSearch.Result r = GlobalSearch.run(problem);
            long t1 = System.nanoTime();
            FitResult fit = EclipseFitter.optimize(r.best());
            long t2 = System.nanoTime();
            System.out.printf("run %d: search %.2f s (%d starts, %d distinct minima, best chi2 %.1f, k %.4f, notes %d);"
                    + " fit from the best %.2f s (k = %.4f ± %.4f, truth %.4f)%n", run + 1, (t1 - t0) / 1e9, r.starts(),
                    r.minima().size(), r.minima().get(0).chi2(), r.minima().get(0).parameters().get("radiusRatio"),
                    r.notes().size(), (t2 - t1) / 1e9, fit.get("radiusRatio").value(),
                    fit.get("radiusRatio").uncertainty(), truth.radiusRatio());
        }
    }
}
