package org.twinlight.time;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.data.Offset.offset;

import org.junit.jupiter.api.Test;

class SkyDirectionTest {

    @Test
    void rightAscensionInDegreesOrHours() {
        // Meeus 1998, Ex. 25.a: 13h13m31.4s = 198.38083°
        assertThat(SkyDirection.parseRaDeg("13:13:31.4")).isCloseTo(198.38083, offset(1e-4));
        assertThat(SkyDirection.parseRaDeg("13 13 31.4")).isCloseTo(198.38083, offset(1e-4));
        assertThat(SkyDirection.parseRaDeg("13h13m31.4s")).isCloseTo(198.38083, offset(1e-4));
        assertThat(SkyDirection.parseRaDeg("198.38083")).isEqualTo(198.38083);
        assertThat(SkyDirection.parseRaDeg("6h")).isEqualTo(90.0);
    }

    @Test
    void declinationSignAppliesToTheWholeValue() {
        // Meeus 1998, Ex. 25.a: −7°47′06″ = −7.78507°
        assertThat(SkyDirection.parseDecDeg("-07:47:06")).isCloseTo(-7.78507, offset(1e-4));
        assertThat(SkyDirection.parseDecDeg("−7 47 06")).isCloseTo(-7.78507, offset(1e-4));
        assertThat(SkyDirection.parseDecDeg("-00:30:00")).isEqualTo(-0.5);
        assertThat(SkyDirection.parseDecDeg("+45:00:00")).isEqualTo(45.0);
        assertThat(SkyDirection.parseDecDeg("-5.39")).isEqualTo(-5.39);
    }

    @Test
    void badTextNamesWhatWasExpected() {
        assertThatThrownBy(() -> SkyDirection.parseRaDeg("12:61:00")).hasMessageContaining("below 60");
        assertThatThrownBy(() -> SkyDirection.parseRaDeg("abc")).hasMessageContaining("hh:mm:ss.s");
        assertThatThrownBy(() -> SkyDirection.parseRaDeg("25:00:00")).hasMessageContaining("outside");
        assertThatThrownBy(() -> SkyDirection.parseRaDeg("400")).hasMessageContaining("outside");
        assertThatThrownBy(() -> SkyDirection.parseDecDeg("95")).hasMessageContaining("outside");
        assertThatThrownBy(() -> SkyDirection.parseDecDeg("")).hasMessageContaining("±dd:mm:ss");
        assertThatThrownBy(() -> new SkyDirection(360, 0)).hasMessageContaining("right ascension");
    }

    @Test
    void unitVectorPointsAtTheTarget() {
        assertThat(new SkyDirection(90, 0).unitVector().getY()).isCloseTo(1.0, offset(1e-15));
        assertThat(new SkyDirection(0, 90).unitVector().getZ()).isCloseTo(1.0, offset(1e-15));
    }
}
