package org.twinlight.photometry;

import java.nio.file.Path;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.function.DoubleUnaryOperator;
import org.twinlight.BadInputException;
import org.twinlight.time.TimeScale;

/**
 * Collects the rows a reader found, checks each one, turns magnitudes into relative flux and
 * builds one {@link LightCurve} per band. Every row that cannot be used is counted under a
 * {@link RowRejection}; none is dropped silently. Times must already be strictly increasing
 * within each band: unsorted or repeated times are an error naming the rows, never re-ordered.
 *
 * <p>Rows are checked in this order, the first failing check naming the reason: quality flag
 * (non-zero), NaN or infinite time, value or error, error ≤ 0, magnitude |m| ≥
 * {@value RowRejection#MAGNITUDE_LIMIT}. A band of a several-band file with no usable row is an
 * error naming the band. Zero and negative fluxes are kept: detrended or
 * background-subtracted flux can legitimately be ≤ 0 for faint targets, and the model is fitted
 * to flux linearly.
 */
final class RowCollector {

    private final Path file;
    private final RowPlace place;
    private final String timeColumn;
    private final String bandColumn;
    private final ValueKind kind;
    private final boolean hasErrors;
    /** Name of the airmass column, or null when there is none. */
    private final String airmassColumn;
    private final Map<String, BandRows> bands = new LinkedHashMap<>();
    private final Map<String, Integer> bandless = new LinkedHashMap<>();

    /**
     * @param file the input, for messages
     * @param place how rows are named in messages
     * @param timeColumn name of the time column, for messages
     * @param bandColumn name of the band column, or null when there is none
     * @param kind what the values are
     * @param hasErrors whether rows carry an error
     */
    RowCollector(Path file, RowPlace place, String timeColumn, String bandColumn, ValueKind kind, boolean hasErrors) {
        this(file, place, timeColumn, bandColumn, kind, hasErrors, null);
    }

    /** As above, with an airmass column of this name (null: none). */
    RowCollector(Path file, RowPlace place, String timeColumn, String bandColumn, ValueKind kind, boolean hasErrors,
            String airmassColumn) {
        this.airmassColumn = airmassColumn;
        this.file = file;
        this.place = place;
        this.timeColumn = timeColumn;
        this.bandColumn = bandColumn;
        this.kind = kind;
        this.hasErrors = hasErrors;
    }

    /** Counts a row that could not be read; {@code band} null when its band is not known. */
    void reject(String band, RowRejection reason) {
        Map<String, Integer> target = band == null ? bandless : rows(band).rejected;
        target.merge(reason.label(), 1, Integer::sum);
    }

    /**
     * Adds a row whose fields parsed as numbers.
     *
     * @param rowNumber 1-based line or row number, for messages
     * @param band the row's band, or null without a band column
     * @param time time as in the file, days
     * @param value flux or magnitude
     * @param error error of the value, ignored without an error column
     * @param quality quality flag, 0 (or NaN) when good
     */
    void add(int rowNumber, String band, double time, double value, double error, double quality) {
        add(rowNumber, band, time, value, error, quality, Double.NaN);
    }

    /**
     * As above, with the row's airmass (ignored without an airmass column): a row whose airmass is
     * not finite is rejected like one with a non-finite value; an airmass below 1 is an error.
     */
    void add(int rowNumber, String band, double time, double value, double error, double quality, double airmass) {
        BandRows r = rows(band == null ? "" : band);
        RowRejection reason = check(time, value, error, quality);
        if (reason == null && airmassColumn != null && !Double.isFinite(airmass)) {
            reason = RowRejection.NOT_FINITE;
        }
        if (reason != null) {
            r.rejected.merge(reason.label(), 1, Integer::sum);
            return;
        }
        if (airmassColumn != null && airmass < 1) {
            throw BadInputException.at(file, place.one(rowNumber), airmassColumn, "expected an airmass ≥ 1 (sec z "
                    + "of the zenith distance), got " + airmass);
        }
        r.airmass(airmass);
        double flux = value;
        double fluxError = error;
        if (kind == ValueKind.MAGNITUDE) {
            flux = Magnitudes.toRelativeFlux(value);
            fluxError = Magnitudes.toFluxError(flux, error);
        }
        r.add(rowNumber, time, flux, fluxError);
    }

    private RowRejection check(double time, double value, double error, double quality) {
        if (quality != 0 && !Double.isNaN(quality)) {
            return RowRejection.QUALITY_FLAGGED;
        }
        if (!Double.isFinite(time) || !Double.isFinite(value) || (hasErrors && !Double.isFinite(error))) {
            return RowRejection.NOT_FINITE;
        }
        if (hasErrors && !(error > 0)) {
            return RowRejection.ERROR_NOT_POSITIVE;
        }
        if (kind == ValueKind.MAGNITUDE && Math.abs(value) >= RowRejection.MAGNITUDE_LIMIT) {
            return RowRejection.MAGNITUDE_OUT_OF_RANGE;
        }
        return null;
    }

    private BandRows rows(String band) {
        return bands.computeIfAbsent(band, b -> new BandRows());
    }

    /**
     * Builds the light curves, one per band in order of first appearance. Rows rejected before
     * their band was known are counted in every band.
     *
     * @param source name of the source for the light curves
     * @param fixedBand band of a table without a band column (e.g. from a FITS keyword), or null
     * @param scale time scale of the times after the offset
     * @param toDays turns a time as in the file into days of {@code scale} (e.g. adds a FITS
     *     reference epoch); must be increasing. Messages quote the times as in the file.
     * @param offsetDays days added to every time after {@code toDays}
     * @throws BadInputException when no row is usable or times are not strictly increasing
     */
    Map<String, LightCurve> build(String source, String fixedBand, TimeScale scale, DoubleUnaryOperator toDays,
            double offsetDays) {
        Map<String, LightCurve> out = new LinkedHashMap<>();
        Map<String, Integer> allRejected = new LinkedHashMap<>(bandless);
        for (Map.Entry<String, BandRows> e : bands.entrySet()) {
            e.getValue().rejected.forEach((k, v) -> allRejected.merge(k, v, Integer::sum));
        }
        for (Map.Entry<String, BandRows> e : bands.entrySet()) {
            BandRows r = e.getValue();
            String band = e.getKey().isEmpty() ? fixedBand : e.getKey();
            if (r.size == 0 && bandColumn != null && bands.size() > 1) {
                throw BadInputException.at(file, null, bandColumn, "band '" + band + "' has no usable rows ("
                        + reasons(r.rejected) + "); remove its rows or fix them: a band cannot be read empty");
            }
            if (r.size == 0) {
                continue;
            }
            checkOrder(r, band);
            double[] t = new double[r.size];
            for (int i = 0; i < r.size; i++) {
                t[i] = toDays.applyAsDouble(r.times[i]) + offsetDays;
            }
            checkOrderAfterConversion(r, t, band);
            Map<String, Integer> rejected = new LinkedHashMap<>(bandless);
            r.rejected.forEach((k, v) -> rejected.merge(k, v, Integer::sum));
            LightCurve lc = new LightCurve(source, band, scale, kind, t,
                    Arrays.copyOf(r.flux, r.size), hasErrors ? Arrays.copyOf(r.errors, r.size) : null, rejected);
            out.put(band == null ? "" : band, airmassColumn == null ? lc : lc.withAirmass(Arrays.copyOf(r.airmass,
                    r.size)));
        }
        if (out.isEmpty()) {
            int total = allRejected.values().stream().mapToInt(Integer::intValue).sum();
            throw BadInputException.at(file, null, null, total == 0
                    ? "no data rows found; expected rows of numbers (time, flux or magnitude, optional error)"
                    : "no usable rows: all " + total + " data rows were rejected (" + reasons(allRejected) + ")");
        }
        return out;
    }

    /** Rejection counts as people read them: {@code "not a number: 2, quality flag set: 5"}. */
    static String reasons(Map<String, Integer> rejected) {
        StringBuilder sb = new StringBuilder();
        rejected.forEach((k, v) -> sb.append(sb.length() == 0 ? "" : ", ").append(k).append(": ").append(v));
        return sb.toString();
    }

    private void checkOrder(BandRows r, String band) {
        int first = -1;
        int count = 0;
        for (int i = 1; i < r.size; i++) {
            if (!(r.times[i] > r.times[i - 1])) {
                count++;
                if (first < 0) {
                    first = i;
                }
            }
        }
        if (first >= 0) {
            throw orderError(r, band, first, count, r.times[first - 1], r.times[first], "");
        }
    }

    private void checkOrderAfterConversion(BandRows r, double[] t, String band) {
        for (int i = 1; i < t.length; i++) {
            if (!(t[i] > t[i - 1])) {
                // Distinct times in the file that round to one double once the reference epoch is added.
                throw orderError(r, band, i, 1, r.times[i - 1], r.times[i],
                        " once converted to days (" + t[i] + "); the times are closer than double precision allows");
            }
        }
    }

    private BadInputException orderError(BandRows r, String band, int i, int count, double before, double after,
            String note) {
        String what = after == before
                ? "duplicate time " + after + note
                : "times are not strictly increasing: " + after + " follows " + before + note;
        String more = count > 1 ? " (" + count + " places in all)" : "";
        String inBand = band == null || bandColumn == null ? "" : " in band '" + band + "'";
        return BadInputException.at(file, place.pair(r.rowNumbers[i - 1], r.rowNumbers[i]), timeColumn,
                what + inBand + more + "; expected times sorted in increasing order with no repeats. "
                        + "Sort the file by time and remove or average repeated points: the reader does not "
                        + "re-order or merge data");
    }

    /** Growable columns of one band. */
    private static final class BandRows {
        int size;
        int[] rowNumbers = new int[64];
        double[] times = new double[64];
        double[] flux = new double[64];
        double[] errors = new double[64];
        double[] airmass = new double[64];
        final Map<String, Integer> rejected = new LinkedHashMap<>();

        /** Sets the airmass of the row about to be added. */
        void airmass(double x) {
            if (size == airmass.length) {
                airmass = Arrays.copyOf(airmass, size * 2);
            }
            airmass[size] = x;
        }

        void add(int rowNumber, double time, double f, double e) {
            if (size == times.length) {
                int n = size * 2;
                rowNumbers = Arrays.copyOf(rowNumbers, n);
                times = Arrays.copyOf(times, n);
                flux = Arrays.copyOf(flux, n);
                errors = Arrays.copyOf(errors, n);
            }
            rowNumbers[size] = rowNumber;
            times[size] = time;
            flux[size] = f;
            errors[size] = e;
            size++;
        }
    }
}
