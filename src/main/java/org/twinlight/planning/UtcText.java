package org.twinlight.planning;

import java.time.Instant;
import java.time.ZoneOffset;
import java.time.format.DateTimeFormatter;
import org.twinlight.time.JulianDate;
import org.twinlight.time.TimeStandard;

/**
 * UTC instants as text. The Julian date is read as a count of 86400-s days from the Unix epoch;
 * within a day that ends with a leap second this is off by at most 1 s.
 */
public final class UtcText {

    /** Julian date of 1970-01-01T00:00:00Z. */
    private static final double UNIX_EPOCH_JD = 2440587.5;

    private static final DateTimeFormatter ISO = DateTimeFormatter.ofPattern("yyyy-MM-dd'T'HH:mm:ss'Z'")
            .withZone(ZoneOffset.UTC);
    private static final DateTimeFormatter HOUR_MINUTE = DateTimeFormatter.ofPattern("HH:mm").withZone(ZoneOffset.UTC);
    private static final DateTimeFormatter DATE_HOUR_MINUTE = DateTimeFormatter.ofPattern("yyyy-MM-dd HH:mm")
            .withZone(ZoneOffset.UTC);

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
        return ISO.format(instant(utc));
    }

    /** {@code HH:mm}. */
    public static String hourMinute(JulianDate utc) {
        return HOUR_MINUTE.format(instant(utc));
    }

    /** {@code yyyy-MM-dd HH:mm}. */
    public static String dateHourMinute(JulianDate utc) {
        return DATE_HOUR_MINUTE.format(instant(utc));
    }
}
