package org.twinlight.photometry;

import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import nom.tam.fits.Header;
import nom.tam.fits.HeaderCard;
import org.twinlight.BadInputException;
import org.twinlight.time.CalendarDate;
import org.twinlight.time.TimeReference;
import org.twinlight.time.TimeScale;
import org.twinlight.time.TimeStandard;

/**
 * The meaning of a FITS table's time column under the FITS time standard (Rots et al. 2015,
 * A&amp;A 574, A36, sections 4.1–4.3): an absolute Julian date is
 * {@code JD = reference + (TIMEZERO + value) × unit}.
 *
 * <ul>
 *   <li>Reference, first present wins: {@code MJDREFI}+{@code MJDREFF}, {@code MJDREF},
 *       {@code JDREFI}+{@code JDREFF}, {@code JDREF}, the mission form
 *       {@code BJDREFI}+{@code BJDREFF} (a JD), {@code DATEREF} (ISO-8601 calendar date,
 *       Gregorian). Split forms keep the whole day apart from the fraction so no precision is
 *       lost.</li>
 *   <li>Unit: the time column's {@code TUNITn} when it is a time unit, else {@code TIMEUNIT},
 *       else seconds (the standard's default). Accepted: s, min, h, d, a or yr (Julian year of
 *       365.25 d), cy (Julian century).</li>
 *   <li>Scale: {@code TIMESYS} (default UTC) gives the clock: UTC (GMT), TAI (IAT), TT (TDT, ET),
 *       TDB; {@code TIMEREF} (default TOPOCENTER) gives where it sits: LOCAL, TOPOCENTER,
 *       GEOCENTER → JD; HELIOCENTER → HJD; SOLARSYSTEM, BARYCENTER → BJD. Any other clock or
 *       place (TCB, GPS, EMBARYCENTER, ...) gives an unknown time scale; the times are still
 *       turned into Julian dates.</li>
 *   <li>A table with no clock ({@code TIMESYS}), place ({@code TIMEREF}) or reference keyword
 *       has times as given (in days, {@code TIMEUNIT} and {@code TIMEZERO} unused) and an unknown
 *       scale. One that
 *       names a clock or place but no reference takes the standard's default MJDREF = 0, unless
 *       its times are already full Julian dates (≥ 2,000,000 days), which such files commonly
 *       hold (common practice, no source).</li>
 * </ul>
 * Keywords are looked up in the table's header, then in the primary header. The defaults named
 * above (TIMESYS UTC, TIMEREF TOPOCENTER, unit seconds, MJDREF 0) are those of the standard as
 * recalled from memory.
 *
 * @param referenceWholeDays whole-day part of the reference JD
 * @param referenceFractionDays fractional part of the reference JD
 * @param timeZero {@code TIMEZERO}, in the time unit
 * @param unitDays length of the time unit in days
 * @param scale the time scale of the resulting Julian dates (never modified)
 * @param declared whether the file declares any time keyword
 */
public record FitsTime(double referenceWholeDays, double referenceFractionDays, double timeZero, double unitDays,
        TimeScale scale, boolean declared) {

    /** Whole part of the JD of MJD 0 (2400000.5 split as 2400000 + 0.5). */
    private static final double MJD_ZERO_WHOLE = 2400000.0;
    private static final double MJD_ZERO_FRACTION = 0.5;
    /** Times at or above this are taken as full Julian dates when no reference is given. */
    static final double FULL_JD_THRESHOLD = 2_000_000.0;

    /** Keywords that declare a clock, a place or a reference: without any of them times are taken as given. */
    private static final List<String> KEYWORDS = List.of("TIMESYS", "TIMEREF", "MJDREFI", "MJDREFF", "MJDREF",
            "JDREFI", "JDREFF", "JDREF", "BJDREFI", "BJDREFF", "DATEREF");
    private static final Pattern ISO_DATE = Pattern.compile(
            "(-?\\d{4})-(\\d{2})-(\\d{2})(?:T(\\d{2}):(\\d{2}):(\\d{2}(?:\\.\\d*)?))?");

    /** The time in days (a Julian date when the file declares its times) of a value as in the table. */
    public double toDays(double value) {
        // Reference whole day last: the small terms are summed first so their digits survive.
        return referenceWholeDays + (referenceFractionDays + (timeZero + value) * unitDays);
    }

    /**
     * Reads the time keywords.
     *
     * @param file the file, for messages
     * @param hdu index of the table's HDU, for messages
     * @param table the table's header
     * @param primary the primary header (may be the same)
     * @param columnUnit {@code TUNITn} of the time column, or null
     * @param typicalTime a time value from the table (for the no-reference rule), NaN if none
     */
    public static FitsTime of(Path file, int hdu, Header table, Header primary, String columnUnit, double typicalTime) {
        Keys k = new Keys(file, hdu, table, primary);
        boolean declared = KEYWORDS.stream().anyMatch(k::has);
        if (!declared) {
            return new FitsTime(0, 0, 0, 1, TimeScale.UNKNOWN, false);
        }
        double whole;
        double fraction;
        if (k.has("MJDREFI") || k.has("MJDREFF")) {
            whole = MJD_ZERO_WHOLE + k.number("MJDREFI", 0);
            fraction = MJD_ZERO_FRACTION + k.number("MJDREFF", 0);
        } else if (k.has("MJDREF")) {
            whole = MJD_ZERO_WHOLE;
            fraction = MJD_ZERO_FRACTION + k.number("MJDREF", 0);
        } else if (k.has("JDREFI") || k.has("JDREFF")) {
            whole = k.number("JDREFI", 0);
            fraction = k.number("JDREFF", 0);
        } else if (k.has("JDREF")) {
            whole = k.number("JDREF", 0);
            fraction = 0;
        } else if (k.has("BJDREFI") || k.has("BJDREFF")) {
            whole = k.number("BJDREFI", 0);
            fraction = k.number("BJDREFF", 0);
        } else if (k.has("DATEREF")) {
            double[] jd = calendarToJulianDate(k.text("DATEREF"), k);
            whole = jd[0];
            fraction = jd[1];
        } else if (typicalTime >= FULL_JD_THRESHOLD) {
            whole = 0;
            fraction = 0;
        } else {
            whole = MJD_ZERO_WHOLE;
            fraction = MJD_ZERO_FRACTION;
        }
        double unit = unitDays(columnUnit);
        if (Double.isNaN(unit)) {
            if (k.has("TIMEUNIT")) {
                unit = unitDays(k.text("TIMEUNIT"));
                if (Double.isNaN(unit)) {
                    throw k.error("TIMEUNIT", "unknown time unit '" + k.text("TIMEUNIT")
                            + "'; expected s, min, h, d, a, yr or cy");
                }
            } else {
                unit = 1.0 / 86400.0;
            }
        }
        double zero = k.number("TIMEZERO", 0);
        return new FitsTime(whole, fraction, zero, unit, scale(k), true);
    }

    private static TimeScale scale(Keys k) {
        String sys = k.has("TIMESYS") ? k.text("TIMESYS").trim().toUpperCase(Locale.ROOT) : "UTC";
        String ref = k.has("TIMEREF") ? k.text("TIMEREF").trim().toUpperCase(Locale.ROOT) : "TOPOCENTER";
        TimeStandard standard = switch (sys) {
            case "UTC", "GMT" -> TimeStandard.UTC;
            case "TAI", "IAT" -> TimeStandard.TAI;
            case "TT", "TDT", "ET" -> TimeStandard.TT;
            case "TDB" -> TimeStandard.TDB;
            default -> null;
        };
        TimeReference reference = switch (ref) {
            case "LOCAL", "TOPOCENTER", "GEOCENTER" -> TimeReference.GEOCENTRIC;
            case "HELIOCENTER" -> TimeReference.HELIOCENTRIC;
            case "SOLARSYSTEM", "BARYCENTER" -> TimeReference.BARYCENTRIC;
            default -> null;
        };
        return standard == null || reference == null ? TimeScale.UNKNOWN : new TimeScale(reference, standard, false);
    }

    /** Days per unit, or NaN when {@code unit} is not a time unit. */
    static double unitDays(String unit) {
        if (unit == null) {
            return Double.NaN;
        }
        return switch (unit.trim().toLowerCase(Locale.ROOT)) {
            case "s", "sec", "second", "seconds" -> 1.0 / 86400.0;
            case "min", "minute", "minutes" -> 1.0 / 1440.0;
            case "h", "hr", "hour", "hours" -> 1.0 / 24.0;
            case "d", "day", "days" -> 1.0;
            case "a", "yr", "year", "years" -> 365.25;
            case "cy" -> 36525.0;
            default -> Double.NaN;
        };
    }

    /**
     * Julian date of a Gregorian calendar date-time, as the Julian date of 0 h and the fraction of
     * the day (Meeus 1998, <i>Astronomical Algorithms</i>, ch. 7, via {@link CalendarDate}).
     */
    static double[] calendarToJulianDate(String iso, Keys k) {
        Matcher m = ISO_DATE.matcher(iso.trim());
        if (!m.matches()) {
            throw k.error("DATEREF", "expected an ISO-8601 date such as 2000-01-01T00:00:00, got '" + iso + "'");
        }
        double dayStart;
        try {
            dayStart = new CalendarDate(Integer.parseInt(m.group(1)), Integer.parseInt(m.group(2)),
                    Integer.parseInt(m.group(3))).toJulianDay(true);
        } catch (IllegalArgumentException e) {
            throw k.error("DATEREF", "not a calendar date: '" + iso + "' (" + e.getMessage() + ")");
        }
        double seconds = 0;
        if (m.group(4) != null) {
            seconds = Integer.parseInt(m.group(4)) * 3600.0 + Integer.parseInt(m.group(5)) * 60.0
                    + Double.parseDouble(m.group(6));
        }
        return new double[] {dayStart, seconds / 86400.0};
    }

    /** Keyword lookup in the table header, then the primary header. */
    static final class Keys {
        private final Path file;
        private final int hdu;
        private final Header table;
        private final Header primary;

        Keys(Path file, int hdu, Header table, Header primary) {
            this.file = file;
            this.hdu = hdu;
            this.table = table;
            this.primary = primary;
        }

        boolean has(String key) {
            return card(key) != null;
        }

        private HeaderCard card(String key) {
            HeaderCard c = table.findCard(key);
            if (c == null && primary != null) {
                c = primary.findCard(key);
            }
            return c;
        }

        String text(String key) {
            HeaderCard c = card(key);
            return c == null || c.getValue() == null ? "" : c.getValue();
        }

        double number(String key, double absent) {
            if (!has(key)) {
                return absent;
            }
            String s = text(key).trim().toUpperCase(Locale.ROOT).replace('D', 'E');
            try {
                double v = Double.parseDouble(s);
                if (Double.isFinite(v)) {
                    return v;
                }
            } catch (NumberFormatException e) {
                // reported below
            }
            throw error(key, "expected a number, got '" + text(key) + "'");
        }

        BadInputException error(String key, String problem) {
            return BadInputException.at(file, "HDU " + hdu + ", key '" + key + "'", null, problem);
        }
    }
}
