package org.twinlight.time;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.data.Offset.offset;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/** Calendar ↔ Julian day, checked against Meeus, Astronomical Algorithms, 2nd ed. (1998), ch. 7. */
class CalendarDateTest {

    @Test
    void sputnikLaunchIsExample7a() {
        // Meeus 1998, Ex. 7.a, p. 61: 1957 Oct 4.81 → JD 2436116.31.
        assertThat(new CalendarDate(1957, 10, 4.81).toJulianDay()).isCloseTo(2436116.31, offset(1e-9));
    }

    @Test
    void julianCalendarDateIsExample7b() {
        // Meeus 1998, Ex. 7.b, p. 61: 333 Jan 27.5 (Julian calendar) → JD 1842713.0.
        assertThat(new CalendarDate(333, 1, 27.5).toJulianDay()).isEqualTo(1842713.0);
        assertThat(new CalendarDate(333, 1, 27.5).toJulianDay(false)).isEqualTo(1842713.0);
    }

    @ParameterizedTest(name = "{0}-{1}-{2} → JD {3}")
    @CsvSource({
        // Meeus 1998, table p. 62 (Gregorian from 1582 Oct 15, Julian calendar before).
        "2000, 1, 1.5, 2451545.0", "1999, 1, 1.0, 2451179.5", "1987, 1, 27.0, 2446822.5",
        "1987, 6, 19.5, 2446966.0", "1988, 1, 27.0, 2447187.5", "1988, 6, 19.5, 2447332.0",
        "1900, 1, 1.0, 2415020.5", "1600, 1, 1.0, 2305447.5", "1600, 12, 31.0, 2305812.5",
        "837, 4, 10.3, 2026871.8", "-123, 12, 31.0, 1676496.5", "-122, 1, 1.0, 1676497.5",
        "-1000, 7, 12.5, 1356001.0", "-1000, 2, 29.0, 1355866.5", "-1001, 8, 17.9, 1355671.4",
        "-4712, 1, 1.5, 0.0",
    })
    void meeusTableOfJulianDays(int year, int month, double day, double jd) {
        CalendarDate date = new CalendarDate(year, month, day);
        assertThat(date.toJulianDay()).isCloseTo(jd, offset(1e-9));
        CalendarDate back = CalendarDate.fromJulianDay(jd);
        assertThat(back.year()).isEqualTo(year);
        assertThat(back.month()).isEqualTo(month);
        assertThat(back.day()).isCloseTo(day, offset(1e-6));
    }

    @ParameterizedTest(name = "JD {0} → {1}-{2}-{3}")
    @CsvSource({
        // Meeus 1998, Ex. 7.c and p. 64.
        "2436116.31, 1957, 10, 4.81", "1842713.0, 333, 1, 27.5", "1507900.13, -584, 5, 28.63",
        // ERFA eraJd2cal regression (t_erfa_c.c): 2400000.5 + 50123.9999 → 1996 Feb 10, fd 0.9999.
        "2450124.4999, 1996, 2, 10.9999",
    })
    void julianDayToCalendar(double jd, int year, int month, double day) {
        CalendarDate date = CalendarDate.fromJulianDay(jd);
        assertThat(date.year()).isEqualTo(year);
        assertThat(date.month()).isEqualTo(month);
        assertThat(date.day()).isCloseTo(day, offset(1e-6));
    }

    @Test
    void intervalBetweenHalleyPerihelionsIsExample7c() {
        // Meeus 1998, Ex. 7.c: 1910 Apr 20.0 → 1986 Feb 9.0 is 27 689 days.
        assertThat(new CalendarDate(1986, 2, 9.0).toJulianDay() - new CalendarDate(1910, 4, 20.0).toJulianDay())
                .isEqualTo(27689.0);
    }

    @Test
    void erfaCalendarRegression() {
        // ERFA eraCal2jd(2003, 6, 1) → 2400000.5 + 52791.0 (t_erfa_c.c).
        assertThat(new CalendarDate(2003, 6, 1).toJulianDay()).isEqualTo(2400000.5 + 52791.0);
    }

    @Test
    void gregorianReformSkipsTenDays() {
        // Meeus 1998, ch. 7: 1582 Oct 4 (Julian) is followed by 1582 Oct 15 (Gregorian).
        assertThat(new CalendarDate(1582, 10, 15).toJulianDay() - new CalendarDate(1582, 10, 4).toJulianDay())
                .isEqualTo(1.0);
    }

    @Test
    void badFieldsAreRefused() {
        assertThatThrownBy(() -> new CalendarDate(2000, 13, 1)).hasMessageContaining("month");
        assertThatThrownBy(() -> new CalendarDate(2000, 1, 0.5)).hasMessageContaining("day");
        assertThatThrownBy(() -> CalendarDate.fromJulianDay(-1)).hasMessageContaining("≥ 0");
    }
}
