package org.twinlight.timing.minima;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;

class MinimumKweeVanWoerdenTest {

    /**
     * A symmetric eclipse is symmetric about its minimum, so S(T) of Kwee &amp; van Woerden (1956,
     * BAN 12, 327) vanishes there: the method returns the true time for noise-free data, whatever
     * the sampling phase.
     */
    @Test
    void noiseFreeSymmetricEclipseGivesTheTrueTime() {
        double cadence = 2.0 / 1440;
        for (double trueTime : new double[] {0.0, 0.00031, -0.0047, 0.0093}) {
            int n = 181;
            double[] x = new double[n];
            double[] f = new double[n];
            for (int i = 0; i < n; i++) {
                x[i] = (i - 90) * cadence + 0.000123;
                f[i] = 1 - 0.3 * SyntheticEclipses.dip(x[i] - trueTime, 0.08);
            }
            MinimumKweeVanWoerden.Result r = MinimumKweeVanWoerden.measure(x, f, 0.0, 0.02, 0.1, 0.02);
            assertThat(r.ok()).as(r.failure()).isTrue();
            // 1e-5 d ≈ 1 s against a 2-min cadence: the residual is the linear interpolation only.
            assertThat(r.timeDays()).isCloseTo(trueTime, within(1e-5));
        }
    }

    @Test
    void eclipseWithDataOnOneSideOnlyIsRefused() {
        double cadence = 2.0 / 1440;
        int n = 80;
        double[] x = new double[n];
        double[] f = new double[n];
        for (int i = 0; i < n; i++) {
            x[i] = -0.1 + i * cadence;
            f[i] = 1 - 0.3 * SyntheticEclipses.dip(x[i], 0.08);
        }
        MinimumKweeVanWoerden.Result r = MinimumKweeVanWoerden.measure(x, f, 0.0, 0.02, 0.1, 0.02);
        assertThat(r.ok()).isFalse();
        assertThat(r.failure()).contains("one-sided");
    }
}
