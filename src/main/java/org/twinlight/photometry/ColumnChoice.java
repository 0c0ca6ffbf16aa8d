package org.twinlight.photometry;

import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import org.twinlight.BadInputException;

/**
 * Which columns of a table hold the time, value, error, band and quality flag: given by the
 * user (name or 1-based number) or found by the header names. Indices are 0-based, −1 = absent.
 *
 * <p>Names are compared case-insensitively after turning every run of characters other than
 * letters and digits into one underscore, so {@code "BJD-TDB"}, {@code "bjd tdb"} and
 * {@code "BJD_TDB"} are the same name. A candidate name matches a column that is called exactly
 * so or starts with it followed by a separator ({@code "bjd"} matches {@code "BJD_TDB"}).
 */
public record ColumnChoice(int time, int value, int error, int band, int quality) {

    /** Time column names, in order of preference. */
    static final List<String> TIME_NAMES = List.of("time", "bjd", "hjd", "jd", "mjd", "btjd", "bmjd", "hmjd",
            "date", "epoch");
    /**
     * Value column names, in order of preference: systematics-corrected flux before simple
     * aperture flux, then the usual names for relative flux and magnitudes.
     */
    static final List<String> VALUE_NAMES = List.of("pdcsap_flux", "flux", "rel_flux", "norm_flux",
            "normalized_flux", "sap_flux", "mag", "magnitude", "diff_mag", "dmag", "delta_mag", "value");
    /** Error column names tried after the ones built from the value column's name. */
    static final List<String> ERROR_NAMES = List.of("err", "error", "flux_err", "mag_err", "sigma", "e_mag",
            "e_flux", "magerr", "fluxerr", "uncertainty", "sig");
    static final List<String> BAND_NAMES = List.of("band", "filter", "filt", "passband");
    static final List<String> QUALITY_NAMES = List.of("quality", "sap_quality", "quality_flag", "qflag", "flag",
            "flags", "qual");

    /**
     * Chooses the columns.
     *
     * @param file the file, for messages
     * @param where where the table is ("header line 3", "HDU 1"), for messages
     * @param names column names, or null when the table has no header (then the columns are
     *     time, value and, when there are three or more, error)
     * @param width number of columns
     * @param options the user's choices
     * @param detectBandAndQuality whether band and quality columns are looked for by name
     */
    static ColumnChoice choose(Path file, String where, List<String> names, int width, ReadOptions options,
            boolean detectBandAndQuality) {
        int time = resolve(file, where, names, width, options.timeColumn(), "--time-column");
        int value = resolve(file, where, names, width, options.valueColumn(), "--value-column");
        int error = resolve(file, where, names, width, options.errorColumn(), "--error-column");
        int band = resolve(file, where, names, width, options.bandColumn(), "--band-column");
        int quality = resolve(file, where, names, width, options.qualityColumn(), "--quality-column");
        if (names == null) {
            // No header: time, value and (with three or more columns) error in the first columns.
            boolean defaults = time < 0 && value < 0;
            time = time >= 0 ? time : firstFree(value, error, band, quality);
            value = value >= 0 ? value : firstFree(time, error, band, quality);
            if (defaults && error < 0 && options.errorColumn() == null && width >= 3
                    && firstFree(time, value, band, quality) == 2) {
                error = 2;
            }
            return checked(file, where, names, new ColumnChoice(time, value, error, band, quality));
        }
        List<String> norm = names.stream().map(ColumnChoice::normalise).toList();
        if (time < 0) {
            time = find(norm, TIME_NAMES, -1);
            if (time < 0) {
                throw missing(file, where, names, "time", TIME_NAMES, "--time-column");
            }
        }
        if (value < 0) {
            value = find(norm, VALUE_NAMES, time);
            if (value < 0) {
                throw missing(file, where, names, "flux or magnitude", VALUE_NAMES, "--value-column");
            }
        }
        if (error < 0 && options.errorColumn() == null) {
            error = findError(norm, norm.get(value), norm.get(time));
        }
        if (detectBandAndQuality && band < 0 && options.bandColumn() == null) {
            band = find(norm, BAND_NAMES, -1);
        }
        if (detectBandAndQuality && quality < 0 && options.qualityColumn() == null) {
            quality = find(norm, QUALITY_NAMES, -1);
        }
        return checked(file, where, names, new ColumnChoice(time, value, error, band, quality));
    }

    /** The largest index in use, so rows shorter than this + 1 lack a field. */
    int widest() {
        return Math.max(Math.max(time, value), Math.max(Math.max(error, band), quality));
    }

    /** A column's name for messages: its header name, else {@code "column N"} (1-based). */
    static String label(List<String> names, int index) {
        if (index < 0) {
            return null;
        }
        if (names != null && index < names.size() && names.get(index) != null && !names.get(index).isBlank()) {
            return names.get(index).trim();
        }
        return String.valueOf(index + 1);
    }

    /**
     * Index of the column a header names as the time (time, bjd, hjd, jd, mjd, btjd, ... or a full
     * scale label such as BJD_TDB), or −1 when none does.
     */
    static int timeColumn(List<String> header) {
        List<String> norm = header.stream().map(ColumnChoice::normalise).toList();
        return find(norm, TIME_NAMES, -1);
    }

    /**
     * The index of the optional airmass column, found by its header name {@code airmass}
     * (case and separators ignored), or −1.
     */
    public static int airmassColumn(List<String> header) {
        if (header == null) {
            return -1;
        }
        for (int i = 0; i < header.size(); i++) {
            if (normalise(header.get(i)).equals("airmass")) {
                return i;
            }
        }
        return -1;
    }

    /** Lower-case, separators folded into single underscores, no leading or trailing ones. */
    public static String normalise(String name) {
        if (name == null) {
            return "";
        }
        String s = name.trim().toLowerCase(Locale.ROOT).replaceAll("[^a-z0-9]+", "_");
        return s.replaceAll("^_+|_+$", "");
    }

    /** Whether a normalised name looks like an uncertainty column. */
    public static boolean isErrorName(String n) {
        return n.equals("err") || n.equals("error") || n.equals("errors") || n.equals("sigma") || n.equals("sig")
                || n.equals("uncertainty") || n.equals("unc") || n.startsWith("e_") || n.startsWith("err_")
                || n.startsWith("sigma_") || n.endsWith("err") || n.endsWith("_error") || n.endsWith("_sigma")
                || n.endsWith("_unc") || n.contains("_err_") || n.contains("_error_");
    }

    private static boolean matches(String normalisedName, String candidate) {
        return normalisedName.equals(candidate) || normalisedName.startsWith(candidate + "_");
    }

    private static int find(List<String> norm, List<String> candidates, int exclude) {
        for (String c : candidates) {
            for (int i = 0; i < norm.size(); i++) {
                if (i != exclude && matches(norm.get(i), c) && !isErrorName(norm.get(i))) {
                    return i;
                }
            }
        }
        return -1;
    }

    private static int findError(List<String> norm, String valueName, String timeName) {
        List<String> paired = List.of(valueName + "_err", valueName + "_error", "e_" + valueName, valueName + "err",
                "err_" + valueName, valueName + "_sigma");
        for (String c : paired) {
            int i = norm.indexOf(c);
            if (i >= 0) {
                return i;
            }
        }
        for (String c : ERROR_NAMES) {
            int i = norm.indexOf(c);
            if (i >= 0 && !belongsToOther(norm, c, valueName)) {
                return i;
            }
        }
        for (int i = 0; i < norm.size(); i++) {
            String n = norm.get(i);
            if (isErrorName(n) && !n.startsWith(timeName) && !n.contains("time") && !belongsToOther(norm, n, valueName)) {
                return i;
            }
        }
        return -1;
    }

    /** Whether an error column is the twin of a column other than the value column ("flux_err" of "flux"). */
    private static boolean belongsToOther(List<String> norm, String errorName, String valueName) {
        String base = errorName.replaceAll("(_err|_error|_sigma|err)$", "").replaceAll("^(e_|err_)", "");
        return !base.equals(errorName) && !base.equals(valueName) && norm.contains(base);
    }

    private static int firstFree(int... used) {
        for (int i = 0;; i++) {
            boolean free = true;
            for (int u : used) {
                free &= u != i;
            }
            if (free) {
                return i;
            }
        }
    }

    /**
     * The 0-based index of the column an option names (by header name or 1-based number), or −1
     * when the option is not given.
     */
    public static int resolve(Path file, String where, List<String> names, int width, String spec, String option) {
        if (spec == null || spec.isBlank()) {
            return -1;
        }
        String s = spec.trim();
        if (s.matches("\\d+")) {
            int n = Integer.parseInt(s);
            if (n < 1 || n > width) {
                throw BadInputException.at(file, where, s, "option " + option + ": column " + n
                        + " does not exist; the table has " + width + " columns (1.." + width + ")"
                        + listing(names));
            }
            return n - 1;
        }
        if (names == null) {
            throw BadInputException.at(file, where, s, "option " + option + ": the table has no header row, so "
                    + "columns can only be chosen by number (1.." + width + ")");
        }
        for (int i = 0; i < names.size(); i++) {
            if (names.get(i) != null && names.get(i).trim().equalsIgnoreCase(s)) {
                return i;
            }
        }
        String n = normalise(s);
        for (int i = 0; i < names.size(); i++) {
            if (normalise(names.get(i)).equals(n)) {
                return i;
            }
        }
        throw BadInputException.at(file, where, s, "option " + option + ": no such column" + listing(names));
    }

    private static ColumnChoice checked(Path file, String where, List<String> names, ColumnChoice c) {
        checkDistinct(file, where, names, new int[] {c.time, c.value, c.error, c.band, c.quality},
                new String[] {"time", "value", "error", "band", "quality"});
        return c;
    }

    /**
     * Refuses one column chosen for two roles.
     *
     * @param idx the chosen columns, 0-based, −1 for none
     * @param roles the role of each, for the message
     */
    public static void checkDistinct(Path file, String where, List<String> names, int[] idx, String[] roles) {
        for (int i = 0; i < idx.length; i++) {
            for (int j = i + 1; j < idx.length; j++) {
                if (idx[i] >= 0 && idx[i] == idx[j]) {
                    throw BadInputException.at(file, where, label(names, idx[i]), "the same column is chosen as "
                            + roles[i] + " and as " + roles[j] + " column; choose different columns");
                }
            }
        }
    }

    private static BadInputException missing(Path file, String where, List<String> names, String what,
            List<String> looked, String option) {
        return BadInputException.at(file, where, null, "no " + what + " column found (looked for names such as "
                + String.join(", ", looked) + ")" + listing(names) + "; choose one with " + option + " NAME|N");
    }

    /** {@code "; the columns are: 1 'time', 2 'flux'"} for messages, or "" without names. */
    public static String listing(List<String> names) {
        if (names == null) {
            return "";
        }
        StringBuilder sb = new StringBuilder("; the columns are: ");
        for (int i = 0; i < names.size(); i++) {
            sb.append(i == 0 ? "" : ", ").append(i + 1).append(" '").append(label(names, i)).append('\'');
        }
        return sb.toString();
    }
}
