package org.twinlight.time;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.data.Offset.offset;

import org.junit.jupiter.api.Test;

class JulianDateTest {

    private static final TimeScale MJD_UTC = TimeScale.parse("MJD_UTC").orElseThrow();

    @Test
    void splitKeepsDayStartAtMidnightAndTheFraction() {
        JulianDate d = JulianDate.of(2451545.0, TimeScale.JD_UTC);
        assertThat(d.dayStartJd()).isEqualTo(2451544.5);
        assertThat(d.fractionOfDay()).isEqualTo(0.5);
        assertThat(d.mjd()).isEqualTo(51544.5);
        assertThat(d.scale()).isEqualTo(TimeScale.JD_UTC);
    }

    @Test
    void mjdFormsAreNumberedFrom2400000point5() {
        // MJD = JD − 2400000.5 (IAU; ERFA DJM0).
        JulianDate d = JulianDate.of(60000.25, MJD_UTC);
        assertThat(d.scale()).isEqualTo(TimeScale.JD_UTC);
        assertThat(d.jd()).isEqualTo(2460000.75);
        assertThat(d.valueIn(MJD_UTC)).isEqualTo(60000.25);
        assertThat(d.valueIn(TimeScale.JD_UTC)).isEqualTo(2460000.75);
        assertThatThrownBy(() -> d.valueIn(TimeScale.BJD_TDB)).hasMessageContaining("BJD_TDB");
    }

    @Test
    void secondsAreResolvedFarBelowAMicrosecond() {
        JulianDate d = JulianDate.of(2459000.5, TimeScale.JD_UTC);
        JulianDate later = d.plusSeconds(1e-7);
        assertThat(later.secondsSince(d)).isCloseTo(1e-7, offset(1e-11));
        assertThat(d.plusSeconds(-86400.25).secondsSince(d)).isCloseTo(-86400.25, offset(1e-9));
    }

    @Test
    void leapSecondDayCountsEightySixThousandFourHundredAndOneSeconds() {
        // ERFA eraDtf2d("UTC", 1994, 6, 30, 23, 59, 60.13599) = 2449533.5 + 0.99999 (t_erfa_c.c;
        // pyerfa 2.0.0.1 gives the fraction 0.9999899999999999).
        JulianDate d = JulianDate.ofDateTime(1994, 6, 30, 23, 59, 60.13599, TimeScale.JD_UTC);
        assertThat(d.dayStartJd()).isEqualTo(2449533.5);
        assertThat(d.fractionOfDay()).isCloseTo(0.9999899999999999, offset(1e-15));
        assertThatThrownBy(() -> JulianDate.ofDateTime(1994, 7, 1, 23, 59, 60.5, TimeScale.JD_UTC))
                .hasMessageContaining("outside the day");
        assertThat(JulianDate.ofDateTime(1994, 7, 1, 12, 0, 0, TimeScale.parse("JD_TT").orElseThrow()).fractionOfDay()).isEqualTo(0.5);
    }

    @Test
    void unknownOrNonFiniteInputIsRefused() {
        assertThatThrownBy(() -> JulianDate.of(2450000, TimeScale.UNKNOWN)).hasMessageContaining("declared");
        assertThatThrownBy(() -> JulianDate.of(Double.NaN, TimeScale.JD_UTC)).hasMessageContaining("finite");
    }
}
