package org.twinlight.time;

import org.twinlight.BadInputException;

/**
 * TAI − UTC since 1972: the whole-second offsets in force from 0h UTC of each date in the table.
 *
 * <p>Source: IERS Bulletin C (the announcements), as tabulated in the IAU SOFA/ERFA routine
 * {@code dat} (ERFA {@code src/dat.c}, array {@code _changes[]}). The last entry is 2017 January 1,
 * TAI − UTC = 37 s; no leap second was announced after it up to the revision of this table
 * (IERS Bulletin C up to 2025, from memory). Times after the last entry are treated as 37 s.
 * <b>When the IERS announces a new leap second, add a row to {@link #TABLE}</b>: until then,
 * UTC times after that leap second will be converted 1 s wrong.
 *
 * <p>UTC before 1972 January 1 (when UTC ran with fractional steps and a frequency offset from
 * TAI) is refused, not approximated: give such times in TT or TDB.
 */
final class LeapSeconds {

    /** Year, month (the change takes effect at 0h UTC on the 1st), TAI − UTC in seconds from then. */
    private static final int[][] TABLE = {
        {1972, 1, 10}, {1972, 7, 11}, {1973, 1, 12}, {1974, 1, 13}, {1975, 1, 14}, {1976, 1, 15},
        {1977, 1, 16}, {1978, 1, 17}, {1979, 1, 18}, {1980, 1, 19}, {1981, 7, 20}, {1982, 7, 21},
        {1983, 7, 22}, {1985, 7, 23}, {1988, 1, 24}, {1990, 1, 25}, {1991, 1, 26}, {1992, 7, 27},
        {1993, 7, 28}, {1994, 7, 29}, {1996, 1, 30}, {1997, 7, 31}, {1999, 1, 32}, {2006, 1, 33},
        {2009, 1, 34}, {2012, 7, 35}, {2015, 7, 36}, {2017, 1, 37},
    };

    /** Julian date of 0h UTC of each change, computed once from {@link #TABLE}. */
    private static final double[] CHANGE_JD = new double[TABLE.length];

    static {
        for (int i = 0; i < TABLE.length; i++) {
            CHANGE_JD[i] = new CalendarDate(TABLE[i][0], TABLE[i][1], 1).dayStartJulianDay(true);
        }
    }

    private LeapSeconds() {
    }

    /** The date of the last entry, for documentation and messages. */
    static String lastEntry() {
        int[] last = TABLE[TABLE.length - 1];
        return String.format("%d-%02d-01 (TAI−UTC = %d s)", last[0], last[1], last[2]);
    }

    /**
     * TAI − UTC in seconds on the UTC day starting at {@code dayStartJd} (0h UTC).
     *
     * @throws BadInputException for days before 1972 January 1
     */
    static int taiMinusUtc(double dayStartJd) {
        if (dayStartJd < CHANGE_JD[0]) {
            CalendarDate d = CalendarDate.fromJulianDay(dayStartJd);
            throw new BadInputException(String.format(
                    "UTC date %d-%02d-%02d is before 1972 January 1: UTC then had fractional steps and is not"
                            + " supported; give such times in TT or TDB (e.g. JD_TT)",
                    d.year(), d.month(), (int) d.day()));
        }
        int i = CHANGE_JD.length - 1;
        while (CHANGE_JD[i] > dayStartJd) {
            i--;
        }
        return TABLE[i][2];
    }

    /** TAI − UTC in seconds on a calendar date (Gregorian), as ERFA {@code eraDat} at 0h. */
    static int taiMinusUtc(int year, int month, int day) {
        return taiMinusUtc(new CalendarDate(year, month, day).dayStartJulianDay(true));
    }

    /** Leap seconds inserted at the end of the UTC day starting at {@code dayStartJd}: 0 or 1. */
    static int leapSecondsAtEndOfDay(double dayStartJd) {
        return taiMinusUtc(dayStartJd + 1) - taiMinusUtc(dayStartJd);
    }
}
