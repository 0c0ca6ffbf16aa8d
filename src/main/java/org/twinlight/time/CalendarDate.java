package org.twinlight.time;

/**
 * A date in the Gregorian or Julian calendar with the day of the month carrying the fraction of
 * the day ({@code day = 4.81} is the 4th at 19:26:24). Years are astronomical: year 0 is 1 BC,
 * year −1 is 2 BC.
 *
 * <p>Conversions follow Meeus, <i>Astronomical Algorithms</i>, 2nd ed. (1998), chapter 7: the
 * Gregorian calendar from 1582 October 15 on, the Julian calendar before, unless a calendar is
 * chosen explicitly. Valid for Julian days ≥ 0 (from −4712 January 1.5).
 *
 * @param year astronomical year
 * @param month 1–12
 * @param day day of the month with fraction, [1, 32)
 */
public record CalendarDate(int year, int month, double day) {

    /** First Julian day of the Gregorian calendar, 1582 October 15.0 (Meeus 1998, ch. 7). */
    static final double GREGORIAN_START_JD = 2299160.5;

    public CalendarDate {
        if (month < 1 || month > 12) {
            throw new IllegalArgumentException("month must be 1–12, got " + month);
        }
        if (!(day >= 1 && day < 32)) {
            throw new IllegalArgumentException("day of the month must be in [1, 32), got " + day);
        }
    }

    /** True when this date falls on or after 1582 October 15, the start of the Gregorian calendar. */
    public boolean isGregorian() {
        return year > 1582 || (year == 1582 && (month > 10 || (month == 10 && day >= 15)));
    }

    /** Julian day (Meeus 1998, eq. 7.1), in the Gregorian calendar from 1582 Oct 15, else the Julian calendar. */
    public double toJulianDay() {
        return toJulianDay(isGregorian());
    }

    /**
     * Julian day of this date read in the given calendar (Meeus 1998, eq. 7.1).
     *
     * @param gregorian true for the Gregorian calendar, false for the Julian calendar
     */
    public double toJulianDay(boolean gregorian) {
        return dayStartJulianDay(gregorian) + (day - Math.floor(day));
    }

    /** Julian day of 0h on this date (the whole day part only): always a half-integer, exact. */
    double dayStartJulianDay(boolean gregorian) {
        int y = year;
        int m = month;
        if (m <= 2) {
            y -= 1;
            m += 12;
        }
        double b = 0;
        if (gregorian) {
            double a = Math.floor(y / 100.0);
            b = 2 - a + Math.floor(a / 4);
        }
        return Math.floor(365.25 * (y + 4716)) + Math.floor(30.6001 * (m + 1)) + Math.floor(day) + b - 1524.5;
    }

    /**
     * The calendar date of a Julian day (Meeus 1998, ch. 7, "Calculation of the calendar date
     * from the JD"): Julian calendar before JD 2299160.5, Gregorian after.
     *
     * @param julianDay Julian day ≥ 0
     */
    public static CalendarDate fromJulianDay(double julianDay) {
        if (!(julianDay >= 0)) {
            throw new IllegalArgumentException("Julian day must be ≥ 0, got " + julianDay);
        }
        double shifted = julianDay + 0.5;
        double z = Math.floor(shifted);
        double f = shifted - z;
        double a = z;
        if (z >= 2299161) {
            double alpha = Math.floor((z - 1867216.25) / 36524.25);
            a = z + 1 + alpha - Math.floor(alpha / 4);
        }
        double b = a + 1524;
        double c = Math.floor((b - 122.1) / 365.25);
        double d = Math.floor(365.25 * c);
        double e = Math.floor((b - d) / 30.6001);
        double dayOfMonth = b - d - Math.floor(30.6001 * e) + f;
        int month = (int) (e < 14 ? e - 1 : e - 13);
        int year = (int) (month > 2 ? c - 4716 : c - 4715);
        return new CalendarDate(year, month, dayOfMonth);
    }
}
