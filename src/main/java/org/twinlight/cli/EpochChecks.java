package org.twinlight.cli;

import java.util.Locale;
import org.twinlight.BadInputException;

/**
 * Checks that an epoch (a time of primary minimum) can be used with the times of a light curve:
 * an epoch in an offset form (JD − 2457000, MJD, ...) against full Julian dates, or the other way
 * round, or a number typed wrongly, is refused with the likely offset instead of ending in "no
 * eclipse".
 */
final class EpochChecks {
    /**
     * An epoch farther than this from the data, days (about 270 years), is not a full Julian date of
     * the same kind as the times: catalogue epochs of eclipsing binaries go back to the late 19th
     * century, about 50 000 d before present data (common practice, no source).
     */
    static final double MAX_DISTANCE_DAYS = 1e5;
    /**
     * Most cycles between the epoch and the data: a period given to 9 significant digits is good to
     * about 1e-9 of a period per cycle, so 1e6 cycles already carry 1e-3 of a period of its error,
     * and more cannot place an eclipse (common practice, no source).
     */
    static final double MAX_CYCLES = 1e6;
    /** Widest gap between an offset-corrected epoch and the data that still counts as "near", days. */
    private static final double NEAR_DAYS = 1000;
    /** Zero points of the usual offset forms, with their names. */
    private static final double[] ZERO_POINTS = {2400000, 2400000.5, 2450000, 2457000};
    private static final String[] ZERO_POINT_NAMES = {"JD − 2400000", "MJD = JD − 2400000.5", "JD − 2450000",
        "BJD − 2457000"};

    private EpochChecks() {
    }

    /**
     * @param epochDays the epoch as given
     * @param periodDays the period, days (NaN to leave out the cycle count)
     * @param times the times of the light curve, days
     * @param dataFile the light curve
     * @param what where the epoch comes from: "option --epoch" or "model.json: key 'epoch'"
     * @throws BadInputException when the epoch lies too far from the data
     */
    static void near(double epochDays, double periodDays, double[] times, String dataFile, String what) {
        if (times.length == 0) {
            return;
        }
        double first = Double.POSITIVE_INFINITY;
        double last = Double.NEGATIVE_INFINITY;
        for (double t : times) {
            first = Math.min(first, t);
            last = Math.max(last, t);
        }
        double distance = distance(epochDays, first, last);
        double cycles = distance / periodDays;
        if (!(distance > MAX_DISTANCE_DAYS) && !(cycles > MAX_CYCLES)) {
            return;
        }
        StringBuilder sb = new StringBuilder(String.format(Locale.ROOT, "%s: %s lies %s d", what,
                plain(epochDays), plain(Math.rint(distance))));
        if (Double.isFinite(cycles)) {
            sb.append(String.format(Locale.ROOT, " (%.3g cycles of %s d)", cycles, plain(periodDays)));
        }
        sb.append(String.format(Locale.ROOT, " %s the data of %s (times %s to %s)",
                epochDays < first ? "before" : "after", dataFile, plain(first), plain(last)));
        sb.append(hint(epochDays, first, last));
        throw new BadInputException(sb.toString());
    }

    private static String hint(double epochDays, double first, double last) {
        int best = -1;
        double bestDistance = NEAR_DAYS;
        double sign = 0;
        for (int k = 0; k < ZERO_POINTS.length; k++) {
            for (double s : new double[] {1, -1}) {
                double d = distance(epochDays + s * ZERO_POINTS[k], first, last);
                if (d <= bestDistance) {
                    best = k;
                    bestDistance = d;
                    sign = s;
                }
            }
        }
        if (best < 0) {
            return "; give the epoch as the same kind of date as the times (full Julian date, or the same offset "
                    + "form), e.g. a primary minimum near the data (the period command measures one)";
        }
        String name = ZERO_POINT_NAMES[best];
        String zero = plain(ZERO_POINTS[best]);
        if (sign > 0) {
            return String.format(Locale.ROOT, "; it looks like the offset form %s: give the full date %s (the epoch "
                    + "+ %s)", name, plain(epochDays + ZERO_POINTS[best]), zero);
        }
        return String.format(Locale.ROOT, "; the times look like the offset form %s while the epoch is a full date: "
                + "read them with --time-offset %s, or give the epoch as %s", name, zero,
                plain(epochDays - ZERO_POINTS[best]));
    }

    private static double distance(double x, double first, double last) {
        return x < first ? first - x : x > last ? x - last : 0;
    }

    /** A time written with enough digits for a Julian date, without a trailing ".0" for whole numbers. */
    private static String plain(double value) {
        if (Math.abs(value) >= 1e9 || value != value) {
            return String.format(Locale.ROOT, "%.4g", value);
        }
        return String.format(Locale.ROOT, "%.6f", value).replaceAll("\\.?0+$", "");
    }
}
