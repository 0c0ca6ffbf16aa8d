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
 * {@code JD = reference + (TIMEOFFS + value) × unit}.
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
 *   <li>Keywords are read from a typed list ({@link TimeKey}): the standard's names, and the
 *       older names {@code TIMEREF} (for {@code TREFPOS}) and {@code TIMEZERO} (for
 *       {@code TIMEOFFS}); an old and a new name that disagree are refused.</li>
 *   <li>Scale: {@code TIMESYS} (default UTC) gives the clock: UTC (GMT), TAI (IAT), TT (TDT, ET),
 *       TDB; {@code TREFPOS} or {@code TIMEREF} (default TOPOCENTER) gives where it sits: LOCAL,
 *       TOPOCENTER, GEOCENTER → JD; HELIOCENTER → HJD; SOLARSYSTEM, BARYCENTER → BJD. Another clock
 *       or place of the standard (TCB, GPS, EMBARYCENTER, ...) gives an unknown time scale, the
 *       times still turned into Julian dates; a value the standard does not know is refused.</li>
 *   <li>{@code DATEREF} is parsed strictly: an impossible date or time of day is refused, never
 *       rolled over.</li>
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
 * @param timeZero {@code TIMEOFFS} (or the older {@code TIMEZERO}), in the time unit
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

    /** What a time keyword holds. */
    enum KeyType {
        /** A character string from a fixed list. */
        CODE,
        /** A number. */
        NUMBER,
        /** An ISO-8601 calendar date, optionally with a time of day. */
        DATE
    }

    /**
     * The time keywords read, each with its type and the older name accepted for it. The standard's
     * names (Rots et al. 2015, A&amp;A 574, A36, sect. 4: TIMESYS, TREFPOS, MJDREF[I/F], JDREF[I/F],
     * DATEREF, TIMEUNIT, TIMEOFFS) come first; TIMEREF and TIMEZERO are the older names of the
     * high-energy missions' convention for TREFPOS and TIMEOFFS, and BJDREFI/BJDREFF the form of
     * the space photometry missions (the pairing of old and new names is from memory).
     */
    enum TimeKey {
        TIMESYS(KeyType.CODE, null),
        TREFPOS(KeyType.CODE, "TIMEREF"),
        MJDREFI(KeyType.NUMBER, null),
        MJDREFF(KeyType.NUMBER, null),
        MJDREF(KeyType.NUMBER, null),
        JDREFI(KeyType.NUMBER, null),
        JDREFF(KeyType.NUMBER, null),
        JDREF(KeyType.NUMBER, null),
        BJDREFI(KeyType.NUMBER, null),
        BJDREFF(KeyType.NUMBER, null),
        DATEREF(KeyType.DATE, null),
        TIMEUNIT(KeyType.CODE, null),
        TIMEOFFS(KeyType.NUMBER, "TIMEZERO");

        private final KeyType type;
        private final String olderName;

        TimeKey(KeyType type, String olderName) {
            this.type = type;
            this.olderName = olderName;
        }

        KeyType type() {
            return type;
        }

        /** The older name accepted for this keyword, or null. */
        String olderName() {
            return olderName;
        }

        /** Whether the keyword declares a clock, a place or a reference (unit and offset do not). */
        boolean declares() {
            return this != TIMEUNIT && this != TIMEOFFS;
        }
    }

    /** TIMESYS values of the standard, as clocks (null: a clock twinlight does not convert). */
    private static final java.util.Map<String, TimeStandard> CLOCKS = clocks();
    /** TREFPOS (and TIMEREF) values, as places (null: a place twinlight does not convert). */
    private static final java.util.Map<String, TimeReference> PLACES = places();

    private static java.util.Map<String, TimeStandard> clocks() {
        java.util.Map<String, TimeStandard> m = new java.util.HashMap<>();
        for (String k : List.of("UTC", "GMT")) {
            m.put(k, TimeStandard.UTC);
        }
        for (String k : List.of("TAI", "IAT")) {
            m.put(k, TimeStandard.TAI);
        }
        for (String k : List.of("TT", "TDT", "ET")) {
            m.put(k, TimeStandard.TT);
        }
        m.put("TDB", TimeStandard.TDB);
        for (String k : List.of("UT1", "GPS", "TCG", "TCB", "LOCAL")) {
            m.put(k, null);
        }
        return m;
    }

    private static java.util.Map<String, TimeReference> places() {
        java.util.Map<String, TimeReference> m = new java.util.HashMap<>();
        for (String k : List.of("LOCAL", "TOPOCENTER", "GEOCENTER", "GEOCENTRIC")) {
            m.put(k, TimeReference.GEOCENTRIC);
        }
        for (String k : List.of("HELIOCENTER", "HELIOCENTRIC")) {
            m.put(k, TimeReference.HELIOCENTRIC);
        }
        for (String k : List.of("BARYCENTER", "SOLARSYSTEM")) {
            m.put(k, TimeReference.BARYCENTRIC);
        }
        for (String k : List.of("RELOCATABLE", "CUSTOM", "GALACTIC", "EMBARYCENTER", "MERCURY", "VENUS", "MARS",
                "JUPITER", "SATURN", "URANUS", "NEPTUNE")) {
            m.put(k, null);
        }
        return m;
    }
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
        boolean declared = java.util.Arrays.stream(TimeKey.values()).filter(TimeKey::declares).anyMatch(k::has);
        if (!declared) {
            return new FitsTime(0, 0, 0, 1, TimeScale.UNKNOWN, false);
        }
        double whole;
        double fraction;
        if (k.has(TimeKey.MJDREFI) || k.has(TimeKey.MJDREFF)) {
            whole = MJD_ZERO_WHOLE + k.number(TimeKey.MJDREFI, 0);
            fraction = MJD_ZERO_FRACTION + k.number(TimeKey.MJDREFF, 0);
        } else if (k.has(TimeKey.MJDREF)) {
            whole = MJD_ZERO_WHOLE;
            fraction = MJD_ZERO_FRACTION + k.number(TimeKey.MJDREF, 0);
        } else if (k.has(TimeKey.JDREFI) || k.has(TimeKey.JDREFF)) {
            whole = k.number(TimeKey.JDREFI, 0);
            fraction = k.number(TimeKey.JDREFF, 0);
        } else if (k.has(TimeKey.JDREF)) {
            whole = k.number(TimeKey.JDREF, 0);
            fraction = 0;
        } else if (k.has(TimeKey.BJDREFI) || k.has(TimeKey.BJDREFF)) {
            whole = k.number(TimeKey.BJDREFI, 0);
            fraction = k.number(TimeKey.BJDREFF, 0);
        } else if (k.has(TimeKey.DATEREF)) {
            double[] jd = calendarToJulianDate(k.text(TimeKey.DATEREF), k);
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
            if (k.has(TimeKey.TIMEUNIT)) {
                unit = unitDays(k.text(TimeKey.TIMEUNIT));
                if (Double.isNaN(unit)) {
                    throw k.error(TimeKey.TIMEUNIT, "unknown time unit '" + k.text(TimeKey.TIMEUNIT)
                            + "'; expected s, min, h, d, a, yr or cy");
                }
            } else {
                unit = 1.0 / 86400.0;
            }
        }
        double zero = k.number(TimeKey.TIMEOFFS, 0);
        return new FitsTime(whole, fraction, zero, unit, scale(k), true);
    }

    private static TimeScale scale(Keys k) {
        String sys = k.has(TimeKey.TIMESYS) ? k.text(TimeKey.TIMESYS).trim().toUpperCase(Locale.ROOT) : "UTC";
        String ref = k.has(TimeKey.TREFPOS) ? k.text(TimeKey.TREFPOS).trim().toUpperCase(Locale.ROOT) : "TOPOCENTER";
        if (!CLOCKS.containsKey(sys)) {
            throw k.error(TimeKey.TIMESYS, "'" + k.text(TimeKey.TIMESYS) + "' is not a time scale of the FITS time "
                    + "standard; expected e.g. UTC, TAI, TT or TDB");
        }
        if (!PLACES.containsKey(ref)) {
            throw k.error(TimeKey.TREFPOS, "'" + k.text(TimeKey.TREFPOS) + "' is not a reference position of the "
                    + "FITS time standard; expected e.g. TOPOCENTER, GEOCENTER, HELIOCENTER or BARYCENTER");
        }
        TimeStandard standard = CLOCKS.get(sys);
        TimeReference reference = PLACES.get(ref);
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
            throw k.error(TimeKey.DATEREF, "expected an ISO-8601 date such as 2000-01-01T00:00:00, got '" + iso + "'");
        }
        int year = Integer.parseInt(m.group(1));
        int month = Integer.parseInt(m.group(2));
        int day = Integer.parseInt(m.group(3));
        try {
            // strict: 2023-02-29 or month 13 is an error, never rolled over into another date
            java.time.LocalDate.of(year, month, day);
        } catch (java.time.DateTimeException e) {
            throw k.error(TimeKey.DATEREF, "'" + iso + "' is not a calendar date (" + e.getMessage() + ")");
        }
        double dayStart = new CalendarDate(year, month, day).toJulianDay(true);
        double seconds = 0;
        if (m.group(4) != null) {
            int h = Integer.parseInt(m.group(4));
            int min = Integer.parseInt(m.group(5));
            double sec = Double.parseDouble(m.group(6));
            // 60.x s only in a leap second
            if (h > 23 || min > 59 || !(sec < 61)) {
                throw k.error(TimeKey.DATEREF, "'" + iso + "' is not a time of day; expected hh:mm:ss with hours "
                        + "0–23, minutes 0–59 and seconds below 60 (61 in a leap second)");
            }
            seconds = h * 3600.0 + min * 60.0 + sec;
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

        boolean has(TimeKey key) {
            return card(key) != null;
        }

        /** The card of {@code key}: by its name, else by its older name; both present must agree. */
        private HeaderCard card(TimeKey key) {
            HeaderCard c = find(key.name());
            if (key.olderName() != null) {
                HeaderCard older = find(key.olderName());
                if (c == null) {
                    return older;
                }
                if (older != null && !same(key, c, older)) {
                    throw error(key, "'" + c.getValue() + "' contradicts the older keyword " + key.olderName()
                            + " = '" + older.getValue() + "' in the same file; correct one of them");
                }
            }
            return c;
        }

        private boolean same(TimeKey key, HeaderCard a, HeaderCard b) {
            if (key.type() == KeyType.NUMBER) {
                return parse(a.getValue()) == parse(b.getValue());
            }
            String x = a.getValue() == null ? "" : a.getValue().trim().toUpperCase(Locale.ROOT);
            String y = b.getValue() == null ? "" : b.getValue().trim().toUpperCase(Locale.ROOT);
            return x.equals(y) || (key == TimeKey.TREFPOS && PLACES.containsKey(x) && PLACES.get(x) != null
                    && PLACES.get(x) == PLACES.get(y));
        }

        private HeaderCard find(String name) {
            HeaderCard c = table.findCard(name);
            if (c == null && primary != null) {
                c = primary.findCard(name);
            }
            return c;
        }

        String text(TimeKey key) {
            HeaderCard c = card(key);
            return c == null || c.getValue() == null ? "" : c.getValue();
        }

        double number(TimeKey key, double absent) {
            if (!has(key)) {
                return absent;
            }
            double v = parse(text(key));
            if (Double.isFinite(v)) {
                return v;
            }
            throw error(key, "expected a number, got '" + text(key) + "'");
        }

        private static double parse(String text) {
            String s = text == null ? "" : text.trim().toUpperCase(Locale.ROOT).replace('D', 'E');
            try {
                return Double.parseDouble(s);
            } catch (NumberFormatException e) {
                return Double.NaN;
            }
        }

        BadInputException error(TimeKey key, String problem) {
            HeaderCard own = find(key.name());
            String name = own == null && key.olderName() != null ? key.olderName() : key.name();
            return BadInputException.at(file, "HDU " + hdu + ", key '" + name + "'", null, problem);
        }

    }
}
