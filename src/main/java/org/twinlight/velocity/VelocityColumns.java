package org.twinlight.velocity;

import java.nio.file.Path;
import java.util.List;
import org.twinlight.BadInputException;
import org.twinlight.photometry.ColumnChoice;
import org.twinlight.photometry.LightCurveReader;

/**
 * Which columns of a velocity table hold time, v1, v1_err, v2, v2_err and instrument (0-based,
 * −1 = absent): chosen by option (name or 1-based number) or found by header name. Names are
 * compared after folding case and separators as the photometry readers do.
 * Without a header the columns are, in order, time, v1, v1_err, v2, v2_err[, instrument].
 */
record VelocityColumns(int time, int v1, int e1, int v2, int e2, int instrument) {

    static final List<String> V1_NAMES = List.of("v1", "rv1", "vr1", "vrad1", "vel1", "velocity1", "v_primary",
            "rv_primary", "primary");
    static final List<String> V2_NAMES = List.of("v2", "rv2", "vr2", "vrad2", "vel2", "velocity2", "v_secondary",
            "rv_secondary", "secondary");
    static final List<String> INSTRUMENT_NAMES = List.of("instrument", "inst", "spectrograph", "telescope", "site");

    static VelocityColumns choose(Path file, String where, List<String> names, int width, VelocityReadOptions o) {
        int time = ColumnChoice.resolve(file, where, names, width, o.timeColumn(), "--time-column");
        int v1 = ColumnChoice.resolve(file, where, names, width, o.velocity1Column(), "--v1-column");
        int e1 = ColumnChoice.resolve(file, where, names, width, o.error1Column(), "--v1-error-column");
        int v2 = ColumnChoice.resolve(file, where, names, width, o.velocity2Column(), "--v2-column");
        int e2 = ColumnChoice.resolve(file, where, names, width, o.error2Column(), "--v2-error-column");
        int inst = ColumnChoice.resolve(file, where, names, width, o.instrumentColumn(), "--instrument-column");
        if (names == null) {
            if (width < 5 && (time < 0 || v1 < 0)) {
                throw BadInputException.at(file, where, null, "the table has no header row and " + width
                        + " columns; expected time, v1, v1_err, v2, v2_err[, instrument] (5 or 6 columns), "
                        + "or a header row naming the columns, or choose them with --time-column, --v1-column, ...");
            }
            time = time >= 0 ? time : 0;
            v1 = v1 >= 0 ? v1 : 1;
            e1 = e1 >= 0 || o.error1Column() != null ? e1 : width >= 5 ? 2 : -1;
            v2 = v2 >= 0 || o.velocity2Column() != null ? v2 : width >= 5 ? 3 : -1;
            e2 = e2 >= 0 || o.error2Column() != null ? e2 : width >= 5 ? 4 : -1;
            inst = inst >= 0 || o.instrumentColumn() != null ? inst : width >= 6 ? 5 : -1;
            return checked(file, where, names, new VelocityColumns(time, v1, e1, v2, e2, inst));
        }
        List<String> norm = names.stream().map(ColumnChoice::normalise).toList();
        if (time < 0) {
            time = LightCurveReader.timeColumnIndex(names);
            if (time < 0) {
                throw missing(file, where, names, "time", List.of("time", "bjd", "hjd", "jd", "mjd", "date"),
                        "--time-column");
            }
        }
        if (v1 < 0) {
            v1 = find(norm, V1_NAMES);
        }
        if (v2 < 0 && o.velocity2Column() == null) {
            v2 = find(norm, V2_NAMES);
        }
        if (v1 < 0 && v2 < 0) {
            throw missing(file, where, names, "velocity", List.of("v1", "rv1", "v2", "rv2"), "--v1-column");
        }
        if (e1 < 0 && o.error1Column() == null && v1 >= 0) {
            e1 = findError(norm, norm.get(v1), "1");
        }
        if (e2 < 0 && o.error2Column() == null && v2 >= 0) {
            e2 = findError(norm, norm.get(v2), "2");
        }
        if (inst < 0 && o.instrumentColumn() == null) {
            inst = find(norm, INSTRUMENT_NAMES);
        }
        return checked(file, where, names, new VelocityColumns(time, v1, e1, v2, e2, inst));
    }

    /** The largest index in use. */
    int widest() {
        return Math.max(Math.max(Math.max(time, v1), Math.max(e1, v2)), Math.max(e2, instrument));
    }

    static String label(List<String> names, int index) {
        if (index < 0) {
            return null;
        }
        return names != null && index < names.size() ? names.get(index) : "column " + (index + 1);
    }

    private static int find(List<String> norm, List<String> candidates) {
        for (String c : candidates) {
            int i = norm.indexOf(c);
            if (i >= 0) {
                return i;
            }
        }
        return -1;
    }

    private static int findError(List<String> norm, String value, String star) {
        List<String> paired = List.of(value + "_err", value + "_error", "e_" + value, value + "err", "err_" + value,
                "sigma_" + value, value + "_sigma", "e" + value, "err" + star, "e" + star, "sigma" + star,
                "error" + star);
        return find(norm, paired);
    }

    private static VelocityColumns checked(Path file, String where, List<String> names, VelocityColumns c) {
        ColumnChoice.checkDistinct(file, where, names, new int[] {c.time, c.v1, c.e1, c.v2, c.e2, c.instrument},
                new String[] {"time", "v1", "v1_err", "v2", "v2_err", "instrument"});
        return c;
    }

    private static BadInputException missing(Path file, String where, List<String> names, String what,
            List<String> looked, String option) {
        return BadInputException.at(file, where, null, "no " + what + " column found (looked for names such as "
                + String.join(", ", looked) + ")" + ColumnChoice.listing(names) + "; choose one with " + option + " NAME|N");
    }
}
