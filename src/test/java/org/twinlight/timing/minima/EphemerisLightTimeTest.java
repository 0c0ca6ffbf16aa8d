package org.twinlight.timing.minima;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;

class EphemerisLightTimeTest {

    /**
     * Closed forms of Irwin (1952, ApJ 116, 211, eq. 1),
     * τ = K[(1 − e²)/(1 + e cos ν)·sin(ν + ω) + e sin ω]: at periastron (ν = 0) τ = K sin ω, at
     * apastron (ν = π) τ = −K sin ω. With ω = 60° a delay written with sin(ν − ω) gives −K sin ω
     * at periastron instead, so a sign error cannot pass.
     */
    @Test
    void delayAtPeriastronAndApastronFollowsIrwin1952() {
        double k = 0.003;
        double e = 0.4;
        double omega = 60;
        double tPeri = 2455123.4;
        double p3 = 800;
        EphemerisLightTime orbit = new EphemerisLightTime(p3, k, e, omega, tPeri);
        double sinW = Math.sin(Math.toRadians(omega));
        assertThat(orbit.delayDays(tPeri)).isCloseTo(k * sinW, within(1e-12));
        assertThat(orbit.delayDays(tPeri + p3)).isCloseTo(k * sinW, within(1e-12));
        assertThat(orbit.delayDays(tPeri + p3 / 2)).isCloseTo(-k * sinW, within(1e-12));
    }

    /**
     * The delay against Irwin's formula computed independently in the test ({@link IrwinDelay}:
     * Kepler's equation by bisection) at points of an eccentric orbit where sin(ν + ω) and
     * sin(ν − ω) differ by at least 0.2, for ω on both sides of 0.
     */
    @Test
    void delayMatchesAnIndependentComputationOfIrwin1952() {
        double k = 0.0042;
        double p3 = 1234.5;
        double tPeri = 2456000.25;
        int checked = 0;
        for (double e : new double[] {0.0, 0.35, 0.8}) {
            for (double omega : new double[] {40, -70, 200}) {
                EphemerisLightTime orbit = new EphemerisLightTime(p3, k, e, omega, tPeri);
                for (int i = 0; i < 40; i++) {
                    double t = tPeri + p3 * (i + 0.37) / 40;
                    double m = 2 * Math.PI * (t - tPeri) / p3;
                    // ν from an independent solution, to pick points where the sign of ω matters
                    double nu = trueAnomaly(m, e);
                    double w = Math.toRadians(omega);
                    if (Math.abs(Math.sin(nu + w) - Math.sin(nu - w)) < 0.2) {
                        continue;
                    }
                    assertThat(orbit.delayDays(t)).as("e=%s ω=%s t=%s", e, omega, t)
                            .isCloseTo(IrwinDelay.delay(t, p3, k, e, omega, tPeri), within(1e-10));
                    checked++;
                }
            }
        }
        assertThat(checked).isGreaterThan(150);
    }

    /**
     * The semi-amplitude K·√(1 − e²cos²ω) (Irwin 1952): half of max − min of the delay over one
     * orbit, found by scanning {@link IrwinDelay}.
     */
    @Test
    void semiAmplitudeIsHalfTheRangeOfTheDelay() {
        EphemerisLightTime eccentric = new EphemerisLightTime(400, 0.003, 0.6, 40, 12);
        double max = Double.NEGATIVE_INFINITY;
        double min = Double.POSITIVE_INFINITY;
        for (int i = 0; i < 20000; i++) {
            double d = IrwinDelay.delay(12 + 400.0 * i / 20000, 400, 0.003, 0.6, 40, 12);
            max = Math.max(max, d);
            min = Math.min(min, d);
        }
        assertThat(eccentric.semiAmplitudeDays()).isCloseTo((max - min) / 2, within(1e-8));
    }

    private static double trueAnomaly(double m, double e) {
        double bigE = m;
        for (int i = 0; i < 100; i++) {
            bigE = m + e * Math.sin(bigE);
        }
        return 2 * Math.atan2(Math.sqrt(1 + e) * Math.sin(bigE / 2), Math.sqrt(1 - e) * Math.cos(bigE / 2));
    }
}
