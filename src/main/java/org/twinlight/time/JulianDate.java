package org.twinlight.time;

/**
 * An instant as a Julian date split into the Julian date of the preceding midnight (a
 * half-integer, exact) and the fraction of the day since then, with its time scale. The split
 * keeps about 1e-11 s of resolution, where a single double of a current Julian date resolves
 * only about 40 µs.
 *
 * <p>The scale is always a Julian-day numbering ({@link TimeScale#modified()} false); MJD values
 * are converted on the way in ({@link #of}) and out ({@link #valueIn}).
 *
 * <p>UTC dates follow the IAU SOFA/ERFA convention for days that end with a leap second: the
 * fraction of such a day counts 86401 SI seconds (so 23:59:60.5 has a fraction just below 1).
 *
 * @param dayStartJd Julian date of 0h of the day, a half-integer (… .5)
 * @param fractionOfDay fraction of the day since 0h, in [0, 1)
 * @param scale a known time scale numbered in Julian days
 */
public record JulianDate(double dayStartJd, double fractionOfDay, TimeScale scale) {

    /** Seconds in a day of the Julian-date count (IAU; ERFA {@code DAYSEC}). */
    public static final double SECONDS_PER_DAY = 86400.0;

    public JulianDate {
        if (scale == null || !scale.isKnown() || scale.modified()) {
            throw new IllegalArgumentException("a Julian date needs a known time scale numbered in JD, got " + scale);
        }
        if (!Double.isFinite(dayStartJd) || dayStartJd - 0.5 != Math.rint(dayStartJd - 0.5)) {
            throw new IllegalArgumentException("day start must be a half-integer Julian date, got " + dayStartJd);
        }
        if (!(fractionOfDay >= 0 && fractionOfDay < 1)) {
            throw new IllegalArgumentException("fraction of day must be in [0, 1), got " + fractionOfDay);
        }
    }

    /**
     * The instant whose number in {@code scale} is {@code value}: a Julian date for JD forms, a
     * modified Julian date (JD − 2400000.5) for MJD forms.
     */
    public static JulianDate of(double value, TimeScale scale) {
        if (scale == null || !scale.isKnown()) {
            throw new IllegalArgumentException("the time scale must be declared, got " + scale);
        }
        if (!Double.isFinite(value)) {
            throw new IllegalArgumentException("time must be finite, got " + value);
        }
        return split(scale.zeroPointJd(), value, scale.asJulianDays());
    }

    /**
     * The instant at a civil date and time of day in {@code scale}. For UTC a day that ends with a
     * leap second has 86401 s, so {@code second} may reach 60.999… on it (as in ERFA
     * {@code eraDtf2d}).
     */
    public static JulianDate ofDateTime(int year, int month, int day, int hour, int minute, double second,
            TimeScale scale) {
        TimeScale jdScale = scale.asJulianDays();
        double dayStart = new CalendarDate(year, month, day).dayStartJulianDay(
                new CalendarDate(year, month, day).isGregorian());
        double dayLength = SECONDS_PER_DAY;
        if (jdScale.isKnown() && jdScale.standard() == TimeStandard.UTC) {
            dayLength += LeapSeconds.leapSecondsAtEndOfDay(dayStart);
        }
        double seconds = 3600.0 * hour + 60.0 * minute + second;
        if (hour < 0 || minute < 0 || second < 0 || !(seconds < dayLength)) {
            throw new IllegalArgumentException(String.format(
                    "time of day %02d:%02d:%s is outside the day (%.0f s long)", hour, minute, second, dayLength));
        }
        return split(dayStart, seconds / dayLength, jdScale);
    }

    /**
     * Normalises {@code a + b} (days) into day start + fraction. Every step is exact except the
     * single addition of the two fractional parts.
     */
    static JulianDate split(double a, double b, TimeScale scale) {
        double a0 = a - 0.5;
        double wholeA = Math.floor(a0);
        double wholeB = Math.floor(b);
        double whole = wholeA + wholeB;
        double fraction = (a0 - wholeA) + (b - wholeB);
        if (fraction >= 1) {
            fraction -= 1;
            whole += 1;
        }
        return new JulianDate(whole + 0.5, fraction, scale);
    }

    /** Full Julian date as one double (about 40 µs resolution for current dates). */
    public double jd() {
        return dayStartJd + fractionOfDay;
    }

    /** Modified Julian date, JD − 2400000.5 (the day part is subtracted exactly). */
    public double mjd() {
        return (dayStartJd - TimeScale.MJD_ZERO_POINT_JD) + fractionOfDay;
    }

    /**
     * The number of this instant in {@code numbering}, which must have this date's reference and
     * standard: the MJD for MJD forms, else the JD.
     */
    public double valueIn(TimeScale numbering) {
        if (!numbering.asJulianDays().equals(scale)) {
            throw new IllegalArgumentException("a " + scale.label() + " date cannot be written as " + numbering.label());
        }
        return numbering.modified() ? mjd() : jd();
    }

    /** This date moved by {@code seconds} of the date's own day count (86400 s per day), same scale. */
    public JulianDate plusSeconds(double seconds) {
        return split(dayStartJd, fractionOfDay + seconds / SECONDS_PER_DAY, scale);
    }

    /** Seconds from {@code other} to this date, counting 86400 s per day and ignoring the scales. */
    public double secondsSince(JulianDate other) {
        // Day starts first: their difference is exact, so the fractions keep their full resolution.
        return ((dayStartJd - other.dayStartJd) + (fractionOfDay - other.fractionOfDay)) * SECONDS_PER_DAY;
    }

    /** The same numbers labelled with another scale (package use: conversions build on it). */
    JulianDate relabel(TimeScale newScale) {
        return new JulianDate(dayStartJd, fractionOfDay, newScale);
    }

    /** Julian centuries of 36525 days from J2000.0 (JD 2451545.0) in this date's own scale. */
    double centuriesSinceJ2000() {
        return ((dayStartJd - 2451545.0) + fractionOfDay) / 36525.0;
    }

    @Override
    public String toString() {
        return scale.label() + " " + dayStartJd + " + " + fractionOfDay + " d";
    }
}
