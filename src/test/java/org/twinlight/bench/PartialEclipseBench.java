package org.twinlight.bench;

import org.twinlight.timing.minima.CorrelatedNoiseTest;
import org.twinlight.timing.minima.PartialEclipseTest;

/**
 * The large version of {@code PartialEclipseTest}: pulls of the model-based times of partly
 * covered eclipses of a 30-d binary seen in ten-hour ground nights. Run with
 * {@code java -cp target/classes:target/test-classes:$(deps) org.twinlight.bench.PartialEclipseBench [SEEDS]}.
 */
public final class PartialEclipseBench {

    private PartialEclipseBench() {
    }

    public static void main(String[] args) {
        int seeds = args.length > 0 ? Integer.parseInt(args[0]) : 20;
        long t0 = System.nanoTime();
        PartialEclipseTest.Outcome o = PartialEclipseTest.outcome(seeds, 600);
        double mean = o.pulls().stream().mapToDouble(Double::doubleValue).average().orElseThrow();
        System.out.printf("%d seeds: %d partly covered eclipses timed (%d well covered); pull spread %.2f, mean %+.2f;"
                + " %.1f s%n", seeds, o.partial(), o.whole(), CorrelatedNoiseTest.spread(o.pulls()), mean,
                (System.nanoTime() - t0) / 1e9);
    }
}
