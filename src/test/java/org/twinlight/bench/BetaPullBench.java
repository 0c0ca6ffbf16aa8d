package org.twinlight.bench;

import org.twinlight.timing.minima.CorrelatedNoiseTest;

/**
 * The large version of {@code CorrelatedNoiseTest}: pull spreads of times of minimum (template
 * fit and Kwee–van Woerden) with white noise alone and with white plus correlated noise (30 min),
 * the median β, and the spread the template timings would have without β. Run with
 * {@code java -cp target/classes:target/test-classes:$(deps) org.twinlight.bench.BetaPullBench [SEEDS]}.
 */
public final class BetaPullBench {

    private BetaPullBench() {
    }

    public static void main(String[] args) {
        int seeds = args.length > 0 ? Integer.parseInt(args[0]) : 40;
        for (double[] noise : new double[][] {{0.004, 0}, {0.003, 0.002}, {0.002, 0.003}}) {
            CorrelatedNoiseTest.Pulls p = CorrelatedNoiseTest.pulls(noise[0], noise[1], seeds, 300);
            System.out.printf("white %.4f + correlated %.4f: %d eclipses, median beta %.2f, pull spread template %.2f,"
                    + " reflection %.2f, template without beta %.2f%n", noise[0], noise[1], p.template().size(),
                    CorrelatedNoiseTest.median(p.betas()), CorrelatedNoiseTest.spread(p.template()),
                    CorrelatedNoiseTest.spread(p.kvw()), CorrelatedNoiseTest.spread(p.templateWithoutBeta()));
        }
    }
}
