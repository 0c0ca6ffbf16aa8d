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
import org.twinlight.fit.JointVelocities;
import org.twinlight.fit.Priors;
import org.twinlight.photometry.LightCurve;
import org.twinlight.time.TimeScale;
import org.twinlight.velocity.SyntheticVelocities;
import org.twinlight.velocity.VelocityData;
import org.twinlight.velocity.VelocityParameters;

/**
 * Wall time of the joint light-curve + radial-velocity least-squares fit ({@code fit --velocities}):
 * 20,000 light-curve points at 2-minute cadence and 60 velocities (30 epochs of both stars, two
 * instruments) of an eccentric pair, 7 light-curve parameters free (epoch, both radii,
 * inclination, J, e, ω) and K1, K2, γ, one offset. Target ≤ 1 s. Run with
 * {@code java -cp target/classes:target/test-classes:$(deps) org.twinlight.bench.JointFitBench [RUNS]}.
 */
public final class JointFitBench {

    private JointFitBench() {
    }

    public static void main(String[] args) {
        int runs = args.length > 0 ? Integer.parseInt(args[0]) : 5;
        // demo system (invented)
        BinaryParameters truth = new BinaryParameters(2.8731, 2460000.4123, 0.118, 0.081, 87.6, 0.12, 70, 0.58, 0,
                LimbDarkening.quadratic(0.40, 0.22), LimbDarkening.quadratic(0.45, 0.20), 0, 1);
        double[] t = SyntheticLightCurve.regularTimes(2460000, 2460000 + 20_000 * 2.0 / 1440, 2, List.of(), null);
        LightCurve lc = SyntheticLightCurve.observe(new BinaryModel(truth), t, 2000, 3, "V", "V", TimeScale.BJD_TDB);
        VelocityData rv = SyntheticVelocities.make(new VelocityParameters(truth.periodDays(), truth.epochDays(), 0.12,
                70, 62, 85, -12.3, new double[] {0, 0.8}, 0, 0), 30, 1.5, 2.0, 2, 1.0, 5);
        ModelFile start = ModelFile.of(truth.withRadii(0.124, 0.078).withInclinationDeg(87.0)
                .withEccentricityOmega(0.10, 62).withSurfaceBrightnessRatio(0.62));
        FitSettings settings = FitSettings.defaults().withFree(new LinkedHashSet<>(List.of("epoch", "radius1",
                "radius2", "inclination", "surfaceBrightnessRatio", "eccentricity", "omega")));
        System.out.printf("%d light-curve points, %d velocities, %d processors%n", lc.size(), rv.size(),
                Runtime.getRuntime().availableProcessors());
        for (int run = 0; run < runs; run++) {
            long t0 = System.nanoTime();
            FitProblem problem = FitProblem.of(start, List.of(new FitData(lc, "V")), settings, Priors.none(),
                    JointVelocities.of(List.of(rv), start.common()));
            FitResult r = EclipseFitter.optimize(problem);
            long t1 = System.nanoTime();
            FitResult alone = EclipseFitter.optimize(FitProblem.of(start, List.of(new FitData(lc, "V")), settings));
            long t2 = System.nanoTime();
            System.out.printf("run %d: light curve alone %.3f s (%d iterations, %d evaluations); joint %.3f s, %d iterations, %d evaluations, K1 = %.2f ± %.2f, K2 = %.2f ± %.2f km/s (truth 62, 85), "
                    + "e = %.4f ± %.4f (truth 0.12)%n", run + 1, (t2 - t1) / 1e9, alone.iterations(), alone.evaluations(), (t1 - t0) / 1e9,
                    r.iterations(), r.evaluations(), r.get("k1").value(),
                    r.get("k1").uncertainty(), r.get("k2").value(), r.get("k2").uncertainty(),
                    r.get("eccentricity").value(), r.get("eccentricity").uncertainty());
        }
    }
}
