package org.twinlight.bench;

import java.util.Arrays;
import java.util.Locale;
import java.util.Random;
import org.twinlight.eclipse.LimbDarkening;
import org.twinlight.eclipse.LimbDarkeningLaw;
import org.twinlight.eclipse.Occultation;

/**
 * Benchmark (not a unit test): nanoseconds per {@link Occultation#hiddenFraction} call for each
 * limb-darkening law, over separations drawn uniformly across the eclipse (|p−1| … 1+p, plus the
 * total or annular part) for three ranges of radius ratio. Run with
 * {@code java -cp target/classes:target/test-classes:<commons-math jar> org.twinlight.bench.OccultationBench}.
 * Each figure is the median of several timed rounds after warm-up rounds; the sum of the results
 * is printed so that the JIT cannot drop the calls.
 */
public final class OccultationBench {
    private static final int SAMPLES = 4096;
    private static final int CALLS_PER_ROUND = 400_000;
    private static final int WARM_UP_ROUNDS = 6;
    private static final int TIMED_ROUNDS = 9;

    private OccultationBench() {
    }

    public static void main(String[] args) {
        LimbDarkening[] laws = {
            LimbDarkening.uniform(),
            LimbDarkening.of(LimbDarkeningLaw.LINEAR, 0.6),
            LimbDarkening.of(LimbDarkeningLaw.QUADRATIC, 0.4, 0.26),
            LimbDarkening.of(LimbDarkeningLaw.SQUARE_ROOT, -0.1, 0.8),
            LimbDarkening.of(LimbDarkeningLaw.LOGARITHMIC, 0.6, 0.2),
            LimbDarkening.of(LimbDarkeningLaw.POWER_2, 0.65, 0.55),
            LimbDarkening.of(LimbDarkeningLaw.FOUR_PARAMETER, 0.5, -0.2, 0.6, -0.25),
        };
        double[][] radiusRanges = {{0.01, 0.12}, {0.12, 1.0}, {1.0, 5.0}};
        System.out.printf(Locale.ROOT, "%-16s %14s %14s %14s%n", "law", "p 0.01-0.12", "p 0.12-1", "p 1-5");
        double sink = 0;
        for (LimbDarkening ld : laws) {
            StringBuilder line = new StringBuilder(String.format(Locale.ROOT, "%-16s", ld.law().fileName()));
            for (double[] range : radiusRanges) {
                double[][] pz = samples(range[0], range[1], 17);
                double[] result = time(ld, pz);
                sink += result[1];
                line.append(String.format(Locale.ROOT, " %11.0f ns", result[0]));
            }
            System.out.println(line);
        }
        System.out.printf(Locale.ROOT, "(checksum %.6f)%n", sink);
    }

    /** (p, z) pairs: p log-uniform in [pLow, pHigh], z uniform over the eclipse. */
    private static double[][] samples(double pLow, double pHigh, long seed) {
        Random random = new Random(seed);
        double[][] pz = new double[SAMPLES][2];
        for (int i = 0; i < SAMPLES; i++) {
            double p = pLow * Math.pow(pHigh / pLow, random.nextDouble());
            double zLow = Math.max(0, p - 1);
            pz[i][0] = p;
            pz[i][1] = zLow + (1 + p - zLow) * random.nextDouble();
        }
        return pz;
    }

    /** {median ns per call, checksum}. */
    private static double[] time(LimbDarkening ld, double[][] pz) {
        double sink = 0;
        double[] ns = new double[TIMED_ROUNDS];
        for (int round = 0; round < WARM_UP_ROUNDS + TIMED_ROUNDS; round++) {
            long start = System.nanoTime();
            for (int i = 0; i < CALLS_PER_ROUND; i++) {
                double[] x = pz[i & (SAMPLES - 1)];
                sink += Occultation.hiddenFraction(ld, x[0], x[1]);
            }
            long elapsed = System.nanoTime() - start;
            if (round >= WARM_UP_ROUNDS) {
                ns[round - WARM_UP_ROUNDS] = (double) elapsed / CALLS_PER_ROUND;
            }
        }
        Arrays.sort(ns);
        return new double[] {ns[TIMED_ROUNDS / 2], sink};
    }
}
