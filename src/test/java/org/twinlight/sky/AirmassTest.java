package org.twinlight.sky;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;

/** The airmass formula against plane-parallel geometry and the published horizon value. */
class AirmassTest {

    @Test
    void highInTheSkyItIsTheSecantOfTheZenithDistance() {
        // plane-parallel atmosphere: X = sec z, good to a few tenths of a per cent above 30° altitude
        // (e.g. Smart 1977, Textbook on Spherical Astronomy; common practice for the tolerance)
        for (double h : new double[] {90, 70, 50, 30}) {
            double sec = 1 / Math.sin(Math.toRadians(h));
            assertThat(Airmass.ofAltitudeDeg(h)).as("altitude " + h).isCloseTo(sec, within(0.004 * sec));
        }
    }

    @Test
    void atTheHorizonItStaysFinite() {
        // Kasten & Young 1989, Appl. Opt. 28, 4735: about 38 at the horizon (37.92, from memory)
        assertThat(Airmass.ofAltitudeDeg(0)).isCloseTo(37.92, within(0.05));
        assertThatThrownBy(() -> Airmass.ofAltitudeDeg(-1)).hasMessageContaining("below the horizon");
    }
}
