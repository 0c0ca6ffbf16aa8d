package org.twinlight.dimensions;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;

/**
 * The errors of an eccentric system's dimensions carry the uncertainty of the light curve's e, ω
 * and P through K1 and K2 (refitted per draw, each draw weighted by the velocities' likelihood of
 * its orbit): pulls over noise seeds have spread ≈ 1 and cover 68 % and 95 % within binomial
 * spread. The large version, beside the former fixed-orbit errors, is
 * {@code bench.DimensionsBench} (figures in docs/dimensions.md).
 */
class OrbitErrorsInDimensionsTest {

    private static final int SEEDS = 100;

    @Test
    void dimensionErrorsOfAnEccentricOrbitAreCalibrated() {
        double[][] pulls = EccentricSystemInjection.pulls(SEEDS, 30, 1000, true);
        for (int q = 0; q < pulls.length; q++) {
            String name = EccentricSystemInjection.CHECKED[q].name();
            double spread = EccentricSystemInjection.spread(pulls[q]);
            double in68 = EccentricSystemInjection.within(pulls[q], 1);
            double in95 = EccentricSystemInjection.within(pulls[q], 1.959964);
            // 100 pulls estimate a spread of 1 to ±0.07 (1/√(2N)): [0.8, 1.25] is about ±3σ;
            // coverage within 3 binomial σ: 68.3 ± 14 %, 95.4 ± 6.3 % (common practice, no source)
            assertThat(spread).as(name + " pull spread").isBetween(0.8, 1.25);
            assertThat(in68).as(name + " within 1 sigma").isBetween(0.683 - 3 * Math.sqrt(0.683 * 0.317 / SEEDS),
                    0.683 + 3 * Math.sqrt(0.683 * 0.317 / SEEDS));
            assertThat(in95).as(name + " within 1.96 sigma").isGreaterThan(0.95 - 3 * Math.sqrt(0.95 * 0.05 / SEEDS));
            assertThat(java.util.Arrays.stream(pulls[q]).average().orElseThrow()).as(name + " mean pull")
                    .isBetween(-0.35, 0.35);
            System.out.printf("%s spread %.3f in68 %.3f in95 %.3f%n", name, spread, in68, in95);
        }
        System.out.printf("effective draws %.0f%n", EccentricSystemInjection.lastEffectiveDraws());
    }
}
