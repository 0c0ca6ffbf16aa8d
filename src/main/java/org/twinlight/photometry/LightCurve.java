package org.twinlight.photometry;

import java.util.Arrays;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Objects;
import org.twinlight.time.TimeScale;

/**
 * One light curve: times (days, in {@link #timeScale()}), relative flux and optional flux errors,
 * strictly increasing in time, with a record of the rows that were read but could not be used.
 *
 * <p>Immutable: the arrays are copied in and out. Indexed accessors avoid copies in loops.
 */
public final class LightCurve {
    private final String source;
    private final String band;
    private final TimeScale timeScale;
    private final ValueKind originalKind;
    private final double[] timesDays;
    private final double[] flux;
    private final double[] fluxErrors;
    private final Map<String, Integer> rejectedRows;
    private final java.util.List<String> notes;
    /** Airmass of each point, or null when the data carry none. */
    private final double[] airmass;

    /**
     * @param source where the data came from (file name), for messages and reports
     * @param band photometric band or instrument label, may be null
     * @param timeScale time scale of the times
     * @param originalKind what the file held (flux or magnitude)
     * @param timesDays strictly increasing times, days
     * @param flux relative flux, same length
     * @param fluxErrors 1σ flux errors, same length, or null when the data carry none
     * @param rejectedRows count of unusable rows by reason (e.g. "not a number" → 3)
     */
    public LightCurve(String source, String band, TimeScale timeScale, ValueKind originalKind,
            double[] timesDays, double[] flux, double[] fluxErrors, Map<String, Integer> rejectedRows) {
        this(source, band, timeScale, originalKind, timesDays, flux, fluxErrors, rejectedRows, java.util.List.of());
    }

    /**
     * As above, with remarks of the reader for the user (e.g. a declared time scale overridden by an
     * option).
     */
    public LightCurve(String source, String band, TimeScale timeScale, ValueKind originalKind,
            double[] timesDays, double[] flux, double[] fluxErrors, Map<String, Integer> rejectedRows,
            java.util.List<String> notes) {
        this(source, band, timeScale, originalKind, timesDays, flux, fluxErrors, rejectedRows, notes, null);
    }

    private LightCurve(String source, String band, TimeScale timeScale, ValueKind originalKind,
            double[] timesDays, double[] flux, double[] fluxErrors, Map<String, Integer> rejectedRows,
            java.util.List<String> notes, double[] airmass) {
        this.source = Objects.requireNonNull(source, "source");
        this.band = band;
        this.timeScale = Objects.requireNonNull(timeScale, "timeScale");
        this.originalKind = Objects.requireNonNull(originalKind, "originalKind");
        Objects.requireNonNull(timesDays, "timesDays");
        Objects.requireNonNull(flux, "flux");
        if (flux.length != timesDays.length || (fluxErrors != null && fluxErrors.length != timesDays.length)) {
            throw new IllegalArgumentException("times, flux and errors must have the same length");
        }
        for (int i = 1; i < timesDays.length; i++) {
            if (!(timesDays[i] > timesDays[i - 1])) {
                throw new IllegalArgumentException("times must be strictly increasing (index " + i + ")");
            }
        }
        this.timesDays = timesDays.clone();
        this.flux = flux.clone();
        this.fluxErrors = fluxErrors == null ? null : fluxErrors.clone();
        this.rejectedRows = Collections.unmodifiableMap(new LinkedHashMap<>(
                rejectedRows == null ? Map.of() : rejectedRows));
        this.notes = java.util.List.copyOf(notes == null ? java.util.List.of() : notes);
        if (airmass != null && airmass.length != timesDays.length) {
            throw new IllegalArgumentException("times and airmass must have the same length");
        }
        this.airmass = airmass == null ? null : airmass.clone();
    }

    /** A copy of the airmass of each point, or null when the data carry none. */
    public double[] airmass() {
        return airmass == null ? null : airmass.clone();
    }

    public boolean hasAirmass() {
        return airmass != null;
    }

    /**
     * The same light curve with this airmass at each point (null: none); the fit takes it as one
     * more baseline term per segment.
     */
    public LightCurve withAirmass(double[] x) {
        return new LightCurve(source, band, timeScale, originalKind, timesDays, flux, fluxErrors, rejectedRows, notes,
                x);
    }

    public String source() {
        return source;
    }

    /** Band or instrument label, or null. */
    public String band() {
        return band;
    }

    public TimeScale timeScale() {
        return timeScale;
    }

    public ValueKind originalKind() {
        return originalKind;
    }

    public int size() {
        return timesDays.length;
    }

    public double time(int i) {
        return timesDays[i];
    }

    public double flux(int i) {
        return flux[i];
    }

    /** The 1σ error of point i, or NaN when the light curve has no errors. */
    public double fluxError(int i) {
        return fluxErrors == null ? Double.NaN : fluxErrors[i];
    }

    public boolean hasErrors() {
        return fluxErrors != null;
    }

    public double[] timesDays() {
        return timesDays.clone();
    }

    public double[] fluxes() {
        return flux.clone();
    }

    /** A copy of the errors, or null when there are none. */
    public double[] fluxErrors() {
        return fluxErrors == null ? null : fluxErrors.clone();
    }

    /** Unusable rows by reason; the reason texts are for people. */
    public Map<String, Integer> rejectedRows() {
        return rejectedRows;
    }

    /** Remarks of the reader for the user; empty when there are none. */
    public java.util.List<String> notes() {
        return notes;
    }

    /** The same light curve with these remarks added. */
    public LightCurve withNotes(java.util.List<String> more) {
        java.util.List<String> all = new java.util.ArrayList<>(notes);
        all.addAll(more);
        return new LightCurve(source, band, timeScale, originalKind, timesDays, flux, fluxErrors, rejectedRows, all,
                airmass);
    }

    /** Total number of rows read but not used. */
    public int rejectedCount() {
        return rejectedRows.values().stream().mapToInt(Integer::intValue).sum();
    }

    /** Time of the first point, days. */
    public double startDays() {
        return timesDays[0];
    }

    /** Time of the last point, days. */
    public double endDays() {
        return timesDays[timesDays.length - 1];
    }

    /** The same light curve with another band label. */
    public LightCurve withBand(String newBand) {
        return new LightCurve(source, newBand, timeScale, originalKind, timesDays, flux, fluxErrors, rejectedRows,
                notes, airmass);
    }

    /** The points whose index is in [from, to). */
    public LightCurve slice(int from, int to) {
        return new LightCurve(source, band, timeScale, originalKind,
                Arrays.copyOfRange(timesDays, from, to), Arrays.copyOfRange(flux, from, to),
                fluxErrors == null ? null : Arrays.copyOfRange(fluxErrors, from, to), rejectedRows, notes,
                airmass == null ? null : Arrays.copyOfRange(airmass, from, to));
    }

    @Override
    public String toString() {
        return "LightCurve[" + source + ", " + size() + " points, " + timeScale.label() + "]";
    }
}
