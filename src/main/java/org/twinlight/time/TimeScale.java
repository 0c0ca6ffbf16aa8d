package org.twinlight.time;

import java.util.Locale;
import java.util.Optional;

/**
 * The time scale of a column of times: where the clock sits ({@link TimeReference}), which clock
 * it is ({@link TimeStandard}) and whether the numbers are Julian days or modified Julian days
 * (JD − 2400000.5). Written as {@code JD_UTC}, {@code HJD_UTC}, {@code BJD_TDB}, {@code MJD_UTC},
 * {@code BMJD_TDB}, ...
 *
 * <p>A light curve whose file declares nothing has {@link #UNKNOWN}: its times are used as given
 * and every output says "time scale unknown".
 *
 * @param reference where the clock sits; null only for {@link #UNKNOWN}
 * @param standard which clock; null only for {@link #UNKNOWN}
 * @param modified true when the numbers are MJD (JD − 2400000.5)
 */
public record TimeScale(TimeReference reference, TimeStandard standard, boolean modified) {

    /** Offset between JD and MJD numbering, days (IAU; ERFA {@code DJM0}). */
    public static final double MJD_ZERO_POINT_JD = 2400000.5;

    /** No declared scale. */
    public static final TimeScale UNKNOWN = new TimeScale(null, null, false);

    public static final TimeScale JD_UTC = new TimeScale(TimeReference.GEOCENTRIC, TimeStandard.UTC, false);
    public static final TimeScale HJD_UTC = new TimeScale(TimeReference.HELIOCENTRIC, TimeStandard.UTC, false);
    public static final TimeScale BJD_TDB = new TimeScale(TimeReference.BARYCENTRIC, TimeStandard.TDB, false);

    public TimeScale {
        if ((reference == null) != (standard == null)) {
            throw new IllegalArgumentException("time reference and standard must both be given or both be absent");
        }
        if (reference == null && modified) {
            throw new IllegalArgumentException("an unknown time scale cannot be modified");
        }
    }

    /** True when the scale is declared. */
    public boolean isKnown() {
        return reference != null;
    }

    /** Julian date of the number 0 in this scale: 0 for JD forms, 2400000.5 for MJD forms. */
    public double zeroPointJd() {
        return modified ? MJD_ZERO_POINT_JD : 0.0;
    }

    /** The same reference and standard, numbered as full Julian days. */
    public TimeScale asJulianDays() {
        return isKnown() ? new TimeScale(reference, standard, false) : this;
    }

    /** The label used in files and messages, e.g. {@code BJD_TDB}, or {@code unknown}. */
    public String label() {
        if (!isKnown()) {
            return "unknown";
        }
        String p = reference.prefix();
        if (modified) {
            p = p.equals("JD") ? "MJD" : p.charAt(0) + "MJD";
        }
        return p + "_" + standard.name();
    }

    @Override
    public String toString() {
        return label();
    }

    /**
     * Reads a label such as {@code BJD_TDB}, {@code hjd-utc} or {@code MJD_UTC} (case and the
     * separator {@code _}/{@code -} do not matter). {@code unknown} gives {@link #UNKNOWN}.
     *
     * @return the scale, or empty when the label is not recognised
     */
    public static Optional<TimeScale> parse(String label) {
        if (label == null) {
            return Optional.empty();
        }
        String s = label.trim().toUpperCase(Locale.ROOT).replace('-', '_');
        if (s.equals("UNKNOWN")) {
            return Optional.of(UNKNOWN);
        }
        int sep = s.indexOf('_');
        if (sep <= 0) {
            return Optional.empty();
        }
        String prefix = s.substring(0, sep);
        TimeStandard standard;
        try {
            standard = TimeStandard.valueOf(s.substring(sep + 1));
        } catch (IllegalArgumentException e) {
            return Optional.empty();
        }
        return switch (prefix) {
            case "JD" -> Optional.of(new TimeScale(TimeReference.GEOCENTRIC, standard, false));
            case "MJD" -> Optional.of(new TimeScale(TimeReference.GEOCENTRIC, standard, true));
            case "HJD" -> Optional.of(new TimeScale(TimeReference.HELIOCENTRIC, standard, false));
            case "HMJD" -> Optional.of(new TimeScale(TimeReference.HELIOCENTRIC, standard, true));
            case "BJD" -> Optional.of(new TimeScale(TimeReference.BARYCENTRIC, standard, false));
            case "BMJD" -> Optional.of(new TimeScale(TimeReference.BARYCENTRIC, standard, true));
            default -> Optional.empty();
        };
    }

    /** The labels {@link #parse} accepts, for help texts and error messages. */
    public static String acceptedLabels() {
        return "JD_UTC, JD_TT, JD_TDB, HJD_UTC, HJD_TT, HJD_TDB, BJD_TDB, MJD_UTC, MJD_TDB, HMJD_UTC, BMJD_TDB, unknown";
    }
}
