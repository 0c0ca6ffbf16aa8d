package org.twinlight.planning;

import java.time.Instant;
import java.time.ZoneOffset;
import java.time.LocalDateTime;
import org.twinlight.time.JulianDate;
import org.twinlight.time.TimeStandard;

/**
 * UTC instants as text. The Julian date is read as a count of 86400-s days from the Unix epoch;
 * within a day that ends with a leap second this is off by at most 1 s.
 */
public final class UtcText {

    /** Julian date of 1970-01-01T00:00:00Z. */
    private static final double UNIX_EPOCH_JD = 2440587.5;

    private UtcText() {
    }

    /** The instant, rounded to the nearest second. */
    public static Instant instant(JulianDate utc) {
        if (utc.scale().standard() != TimeStandard.UTC) {
            throw new IllegalArgumentException("expected a UTC date, got " + utc.scale());
        }
        double seconds = ((utc.dayStartJd() - UNIX_EPOCH_JD) + utc.fractionOfDay()) * JulianDate.SECONDS_PER_DAY;
        return Instant.ofEpochSecond(Math.round(seconds));
    }

    /** ISO 8601, e.g. {@code 2027-03-14T21:07:33Z}. */
    public static String iso(JulianDate utc) {
        LocalDateTime t = LocalDateTime.ofEpochSecond(instant(utc).getEpochSecond(), 0, ZoneOffset.UTC);
        StringBuilder sb = new StringBuilder(20);
        date(sb, t).append('T');
        two(sb, t.getHour()).append(':');
        two(sb, t.getMinute()).append(':');
        return two(sb, t.getSecond()).append('Z').toString();
    }

    /** {@code HH:mm}. */
    public static String hourMinute(JulianDate utc) {
        LocalDateTime t = LocalDateTime.ofEpochSecond(instant(utc).getEpochSecond(), 0, ZoneOffset.UTC);
        StringBuilder sb = new StringBuilder(5);
        two(sb, t.getHour()).append(':');
        return two(sb, t.getMinute()).toString();
    }

    /** {@code yyyy-MM-dd HH:mm}. */
    public static String dateHourMinute(JulianDate utc) {
        LocalDateTime t = LocalDateTime.ofEpochSecond(instant(utc).getEpochSecond(), 0, ZoneOffset.UTC);
        StringBuilder sb = new StringBuilder(16);
        date(sb, t).append(' ');
        two(sb, t.getHour()).append(':');
        return two(sb, t.getMinute()).toString();
    }

    /** RFC 5545 §3.3.5 UTC form, e.g. {@code 20270314T210733Z}. */
    public static String compact(Instant instant) {
        LocalDateTime t = LocalDateTime.ofEpochSecond(instant.getEpochSecond(), 0, ZoneOffset.UTC);
        StringBuilder sb = new StringBuilder(16);
        sb.append(t.getYear());
        two(sb, t.getMonthValue());
        two(sb, t.getDayOfMonth()).append('T');
        two(sb, t.getHour());
        two(sb, t.getMinute());
        return two(sb, t.getSecond()).append('Z').toString();
    }

    private static StringBuilder date(StringBuilder sb, LocalDateTime t) {
        sb.append(t.getYear()).append('-');
        two(sb, t.getMonthValue()).append('-');
        return two(sb, t.getDayOfMonth());
    }

    private static StringBuilder two(StringBuilder sb, int v) {
        return sb.append((char) ('0' + v / 10)).append((char) ('0' + v % 10));
    }
}
