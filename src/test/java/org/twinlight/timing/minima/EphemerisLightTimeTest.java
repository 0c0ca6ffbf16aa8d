package org.twinlight.timing.minima;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;

class EphemerisLightTimeTest {

    /**
     * Irwin (1952): for a circular orbit the delay is K·sin(M + ω), a sinusoid of semi-amplitude K;
     * for an eccentric one the semi-amplitude is K·√(1 − e²cos²ω), i.e. half of max − min.
     */
    @Test
    void delayHasTheStatedSemiAmplitude() {
        EphemerisLightTime circular = new EphemerisLightTime(400, 0.003, 0, 30, 0);
        assertThat(circular.delayDays(100)).isCloseTo(0.003 * Math.sin(Math.PI / 2 + Math.toRadians(30)),
                within(1e-15));
        EphemerisLightTime eccentric = new EphemerisLightTime(400, 0.003, 0.6, 40, 12);
        double max = Double.NEGATIVE_INFINITY;
        double min = Double.POSITIVE_INFINITY;
        for (int i = 0; i < 200000; i++) {
            double d = eccentric.delayDays(12 + 400.0 * i / 200000);
            max = Math.max(max, d);
            min = Math.min(min, d);
        }
        assertThat((max - min) / 2).isCloseTo(eccentric.semiAmplitudeDays(), within(1e-8));
    }
}
