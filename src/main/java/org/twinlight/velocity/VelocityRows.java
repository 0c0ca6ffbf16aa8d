package org.twinlight.velocity;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.twinlight.BadInputException;
import org.twinlight.photometry.RowRejection;
import org.twinlight.time.TimeScale;

/**
 * Collects the rows of a velocity table and checks each one, with the photometry readers'
 * rejection reasons. A row whose time is unusable, or whose instrument is empty, is rejected
 * whole; otherwise each star's velocity is used or not on its own: an empty or NaN velocity
 * means the star was not measured on that row (not an error, and not counted), a velocity
 * without a usable error (when the file has an error column) or an infinite value is dropped and
 * counted as {@code "star N: reason"}. A row with neither star measured is counted as a missing
 * field. Times need not be sorted.
 */
final class VelocityRows {

    private final Path file;
    private final boolean[] hasErrors = new boolean[3];
    private final Map<String, Integer> rejected = new LinkedHashMap<>();
    private final List<String> instruments = new ArrayList<>();
    private final Star[] stars = {null, new Star(), new Star()};

    VelocityRows(Path file, boolean errors1, boolean errors2) {
        this.file = file;
        hasErrors[1] = errors1;
        hasErrors[2] = errors2;
    }

    void reject(RowRejection reason) {
        rejected.merge(reason.label(), 1, Integer::sum);
    }

    /** Counts a row dropped whole because of one column ({@code time}, {@code v1}, ...): "column: reason". */
    void reject(String column, RowRejection reason) {
        rejected.merge(column + ": " + reason.label(), 1, Integer::sum);
    }

    /**
     * Adds a row whose time parsed.
     *
     * @param row 1-based row, for messages
     * @param time time as in the file (after the caller's conversion to days)
     * @param v velocities of star 1 and 2 at [1] and [2], NaN when not measured
     * @param e their errors, NaN when absent
     * @param instrument instrument name, "" without an instrument column
     */
    void add(int row, double time, double[] v, double[] e, String instrument) {
        if (!Double.isFinite(time)) {
            reject("time", RowRejection.NOT_FINITE);
            return;
        }
        boolean any = false;
        int inst = instrumentIndex(instrument);
        for (int s = 1; s <= 2; s++) {
            if (Double.isNaN(v[s])) {
                continue;
            }
            any = true;
            RowRejection reason = !Double.isFinite(v[s]) ? RowRejection.NOT_FINITE
                    : hasErrors[s] && Double.isNaN(e[s]) ? RowRejection.MISSING_FIELD
                    : hasErrors[s] && !Double.isFinite(e[s]) ? RowRejection.NOT_FINITE
                    : hasErrors[s] && !(e[s] > 0) ? RowRejection.ERROR_NOT_POSITIVE : null;
            if (reason != null) {
                rejected.merge("star " + s + ": " + reason.label(), 1, Integer::sum);
                continue;
            }
            stars[s].add(row, time, v[s], e[s], inst);
        }
        if (!any) {
            reject(RowRejection.MISSING_FIELD);
        }
    }

    private int instrumentIndex(String name) {
        int i = instruments.indexOf(name);
        if (i < 0) {
            instruments.add(name);
            i = instruments.size() - 1;
        }
        return i;
    }

    /**
     * The data read.
     *
     * @throws BadInputException when no velocity of either star is usable
     */
    VelocityData build(String source, TimeScale scale, double offsetDays, List<String> notes) {
        if (stars[1].size == 0 && stars[2].size == 0) {
            int total = rejected.values().stream().mapToInt(Integer::intValue).sum();
            throw BadInputException.at(file, null, null, total == 0
                    ? "no data rows found; expected rows of time, v1, v1_err, v2, v2_err[, instrument] in km/s"
                    : "no usable velocity: all " + total + " rows or measurements were rejected (" + rejected + ")");
        }
        // instruments of rows that were all rejected must not appear as instruments without data
        List<String> used = new ArrayList<>();
        int[] map = new int[instruments.size()];
        Arrays.fill(map, -1);
        for (int s = 1; s <= 2; s++) {
            for (int k = 0; k < stars[s].size; k++) {
                int i = stars[s].inst[k];
                if (map[i] < 0) {
                    used.add(instruments.get(i));
                    map[i] = used.size() - 1;
                }
            }
        }
        return new VelocityData(source, scale, stars[1].build(hasErrors[1], offsetDays, map),
                stars[2].build(hasErrors[2], offsetDays, map), used.isEmpty() ? List.of("") : used, rejected, notes);
    }

    private static final class Star {
        int size;
        int[] rows = new int[32];
        double[] t = new double[32];
        double[] v = new double[32];
        double[] e = new double[32];
        int[] inst = new int[32];

        void add(int row, double time, double velocity, double error, int instrument) {
            if (size == t.length) {
                int n = 2 * size;
                rows = Arrays.copyOf(rows, n);
                t = Arrays.copyOf(t, n);
                v = Arrays.copyOf(v, n);
                e = Arrays.copyOf(e, n);
                inst = Arrays.copyOf(inst, n);
            }
            rows[size] = row;
            t[size] = time;
            v[size] = velocity;
            e[size] = error;
            inst[size] = instrument;
            size++;
        }

        StarVelocities build(boolean withErrors, double offsetDays, int[] map) {
            double[] times = new double[size];
            int[] instruments = new int[size];
            for (int k = 0; k < size; k++) {
                times[k] = t[k] + offsetDays;
                instruments[k] = map[inst[k]];
            }
            return new StarVelocities(times, Arrays.copyOf(v, size), withErrors ? Arrays.copyOf(e, size) : null,
                    instruments, Arrays.copyOf(rows, size));
        }
    }
}
