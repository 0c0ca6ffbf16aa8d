package org.twinlight.cli;

import org.twinlight.BadInputException;
import org.twinlight.photometry.ReadOptions;
import org.twinlight.photometry.ValueKind;
import org.twinlight.time.TimeScale;
import picocli.CommandLine.Option;

/** The options every command that reads photometry shares (a picocli mixin). */
public final class PhotometryOptions {

    @Option(names = "--time-column", paramLabel = "NAME|N", description = "Time column, by header name or 1-based number (default: a column named time, bjd, hjd, jd, mjd, btjd or date; without a header row, column 1).")
    String timeColumn;

    @Option(names = "--value-column", paramLabel = "NAME|N", description = "Flux or magnitude column, by name or number (default: pdcsap_flux, flux, rel_flux, sap_flux, mag, magnitude or value; without a header row, column 2).")
    String valueColumn;

    @Option(names = "--error-column", paramLabel = "NAME|N", description = "1-sigma error column of the values, by name or number (default: the value column's _err twin, else err, error, sigma, ...; without a header row, column 3 when there is one).")
    String errorColumn;

    @Option(names = "--band-column", paramLabel = "NAME|N", description = "Column naming the band of each row, by name or number (default: a column named band or filter). A file with several bands is read band by band where the command allows it.")
    String bandColumn;

    @Option(names = "--quality-column", paramLabel = "NAME|N", description = "Quality-flag column, by name or number; rows with a non-zero flag are dropped and counted (default: a column named quality or flag).")
    String qualityColumn;

    @Option(names = "--values", paramLabel = "flux|magnitude", description = "What the value column holds (default: magnitude when its name contains 'mag', else flux). Magnitudes become relative flux 10^(-0.4 m).")
    String values;

    @Option(names = "--time-scale", paramLabel = "SCALE", description = "Time scale of the times, e.g. BJD_TDB, HJD_UTC, JD_UTC, MJD_UTC (default: FITS time keywords, or a text header such as BJD_TDB; else unknown).")
    String timeScale;

    @Option(names = "--time-offset", paramLabel = "DAYS", description = "Days added to every time (e.g. 2457000 for times given as BJD−2457000).")
    Double timeOffsetDays;

    @Option(names = "--hdu", paramLabel = "N", description = "FITS HDU holding the table (0 = primary; default: the first binary table).")
    Integer hdu;

    /** The options by their key in the analysis settings file (null where not given). */
    java.util.Map<String, Object> settingsEntries() {
        java.util.Map<String, Object> m = new java.util.LinkedHashMap<>();
        m.put("timeScale", timeScale);
        m.put("timeOffset", timeOffsetDays);
        m.put("timeColumn", timeColumn);
        m.put("valueColumn", valueColumn);
        m.put("errorColumn", errorColumn);
        m.put("bandColumn", bandColumn);
        m.put("qualityColumn", qualityColumn);
        m.put("values", values);
        m.put("hdu", hdu);
        return m;
    }

    /** The options as the library's {@link ReadOptions}; bad values are a {@link BadInputException}. */
    public ReadOptions toReadOptions() {
        ValueKind kind = null;
        if (values != null) {
            kind = switch (values.trim().toLowerCase(java.util.Locale.ROOT)) {
                case "flux" -> ValueKind.FLUX;
                case "magnitude", "magnitudes", "mag" -> ValueKind.MAGNITUDE;
                default -> throw new BadInputException("option --values: expected 'flux' or 'magnitude', got '" + values + "'");
            };
        }
        TimeScale scale = timeOptions(timeScale, timeOffsetDays, hdu);
        return new ReadOptions(timeColumn, valueColumn, errorColumn, bandColumn, qualityColumn, kind, scale,
                timeOffsetDays, hdu);
    }

    /**
     * Checks the options --time-scale, --time-offset and --hdu that every reader shares and
     * returns the time scale (null when not given).
     */
    static TimeScale timeOptions(String timeScale, Double timeOffsetDays, Integer hdu) {
        TimeScale scale = null;
        if (timeScale != null) {
            scale = TimeScale.parse(timeScale).orElseThrow(() -> new BadInputException(
                    "option --time-scale: unknown time scale '" + timeScale + "'; expected one of "
                            + TimeScale.acceptedLabels()));
        }
        if (timeOffsetDays != null && !Double.isFinite(timeOffsetDays)) {
            throw new BadInputException("option --time-offset: expected a finite number of days, got " + timeOffsetDays);
        }
        if (hdu != null && hdu < 0) {
            throw new BadInputException("option --hdu: expected an HDU index ≥ 0, got " + hdu);
        }
        return scale;
    }

    /** Reads one light curve with these options, printing the reader's remarks to {@code console}. */
    public org.twinlight.photometry.LightCurve read(java.nio.file.Path file, java.io.PrintWriter console) {
        org.twinlight.photometry.LightCurve lc = org.twinlight.photometry.LightCurveReader.read(file, toReadOptions());
        lc.notes().forEach(n -> console.println("note: " + file + ": " + n));
        return lc;
    }

    /** Reads every band of a file with these options, printing the reader's remarks once. */
    public java.util.Map<String, org.twinlight.photometry.LightCurve> readBands(java.nio.file.Path file,
            java.io.PrintWriter console) {
        java.util.Map<String, org.twinlight.photometry.LightCurve> bands =
                org.twinlight.photometry.LightCurveReader.readBands(file, toReadOptions());
        bands.values().stream().flatMap(lc -> lc.notes().stream()).distinct()
                .forEach(n -> console.println("note: " + file + ": " + n));
        return bands;
    }
}
