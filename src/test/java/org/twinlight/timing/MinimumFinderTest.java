package org.twinlight.timing;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.twinlight.BadInputException;
import org.twinlight.photometry.LightCurve;

class MinimumFinderTest {

    private static double spread(List<Double> v) {
        double mean = v.stream().mapToDouble(Double::doubleValue).average().orElseThrow();
        double ss = v.stream().mapToDouble(d -> (d - mean) * (d - mean)).sum();
        return Math.sqrt(ss / (v.size() - 1));
    }

    /**
     * Honest errors: eclipses injected at known times (random O−C of a few minutes) over many
     * seeds; the spread of (measured − true)/error must be about 1. Statistical check over
     * ~300 pulls per method: the standard deviation of a unit-variance sample of that size is
     * within ±0.1 of 1 with high probability (common practice, no source).
     */
    @Test
    void errorsAreHonestOverManySeeds() {
        List<Double> template = new ArrayList<>();
        List<Double> kvw = new ArrayList<>();
        List<Double> classic = new ArrayList<>();
        for (long seed = 1; seed <= 40; seed++) {
            SyntheticEclipses sim = new SyntheticEclipses();
            java.util.Random jitter = new java.util.Random(1000 + seed);
            double[] oc = new double[40];
            for (int i = 0; i < oc.length; i++) {
                oc[i] = (jitter.nextDouble() - 0.5) * 6.0 / 1440;
            }
            sim.ocDays = e -> oc[(int) Math.floor(2 * e) + 4];
            LightCurve lc = sim.sample(sim.epochDays - 0.6, sim.epochDays + 9.5, seed);
            MinimumSearchResult r = MinimumFinder.find(lc,
                    new Ephemeris(sim.epochDays, sim.periodDays), MinimumSettings.defaults().withBootstrapSamples(100)
                            .withSeed(seed));
            assertThat(r.minima(MinimumMethod.TEMPLATE)).hasSize(8);
            for (MinimumTime m : r.minima()) {
                double pull = (m.timeDays() - sim.trueTime(m.cycle())) / m.errorDays();
                if (m.method() == MinimumMethod.TEMPLATE) {
                    template.add(pull);
                } else {
                    kvw.add(pull);
                    classic.add((m.timeDays() - sim.trueTime(m.cycle())) / m.classicErrorDays());
                }
            }
        }
        System.out.printf("pull spread: template %.3f, kvw replicas %.3f, kvw classic %.3f (n=%d)%n",
                spread(template), spread(kvw), spread(classic), template.size());
        assertThat(spread(template)).isBetween(0.85, 1.15);
        assertThat(spread(kvw)).isBetween(0.85, 1.15);
    }
}
