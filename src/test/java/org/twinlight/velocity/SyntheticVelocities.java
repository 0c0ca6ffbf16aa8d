package org.twinlight.velocity;

import java.util.List;
import java.util.Map;
import java.util.Random;
import org.twinlight.orbit.RadialVelocityCurve;
import org.twinlight.time.TimeScale;

/**
 * Synthetic double-lined velocities for tests, made with an independent evaluation of the
 * Keplerian velocity through {@link RadialVelocityCurve} (itself checked against a bisection
 * Kepler solution) with Gaussian noise: sparse, irregular epochs over many cycles, as
 * spectroscopic campaigns are; instrument j of {@code instruments} observes every j-th epoch.
 */
public final class SyntheticVelocities {

    private SyntheticVelocities() {
    }

    static VelocityData make(VelocityParameters truth, int epochs, double sigma1, double sigma2, int instruments,
            long seed) {
        return make(truth, epochs, sigma1, sigma2, instruments, 1.0, seed);
    }

    /**
     * The same with the errors in the data stated as {@code statedFraction} of the true noise
     * (e.g. 0.25 for errors understated fourfold).
     */
    public static VelocityData make(VelocityParameters truth, int epochs, double sigma1, double sigma2,
            int instruments, double statedFraction, long seed) {
        Random rng = new Random(seed);
        RadialVelocityCurve curve = truth.curve();
        double[] t = new double[epochs];
        double[] v1 = new double[epochs];
        double[] v2 = new double[epochs];
        double[] e1 = new double[epochs];
        double[] e2 = new double[epochs];
        int[] inst = new int[epochs];
        int[] rows = new int[epochs];
        for (int i = 0; i < epochs; i++) {
            t[i] = truth.epochDays() + 40 * truth.periodDays() * rng.nextDouble();
            inst[i] = i % instruments;
            double base = truth.gammaKms() + truth.offsetKms(inst[i]);
            double shape = curve.shape(t[i]);
            v1[i] = base + truth.k1Kms() * shape + sigma1 * rng.nextGaussian();
            v2[i] = base - truth.k2Kms() * shape + sigma2 * rng.nextGaussian();
            e1[i] = sigma1 * statedFraction;
            e2[i] = sigma2 * statedFraction;
            rows[i] = i + 1;
        }
        List<String> names = java.util.stream.IntStream.range(0, instruments).mapToObj(j -> "spec" + j).toList();
        return new VelocityData("synthetic.csv", TimeScale.BJD_TDB, new StarVelocities(t, v1, e1, inst, rows),
                new StarVelocities(t.clone(), v2, e2, inst.clone(), rows.clone()), names, Map.of(), List.of());
    }
}
