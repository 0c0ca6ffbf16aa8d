package org.twinlight.cli;

import org.twinlight.BadInputException;
import org.twinlight.photometry.ReadOptions;
import org.twinlight.photometry.ValueKind;
import org.twinlight.time.TimeScale;
import picocli.CommandLine.Option;

/** The options every command that reads photometry shares (a picocli mixin). */
public final class PhotometryOptions {

    @Option(names = "--time-column", paramLabel = "NAME|N", description = "Time column, by header name or 1-based number.")
    String timeColumn;

    @Option(names = "--value-column", paramLabel = "NAME|N", description = "Flux or magnitude column.")
    String valueColumn;

    @Option(names = "--error-column", paramLabel = "NAME|N", description = "Error column of the values.")
    String errorColumn;

    @Option(names = "--band-column", paramLabel = "NAME|N", description = "Column naming the band of each row.")
    String bandColumn;

    @Option(names = "--quality-column", paramLabel = "NAME", description = "Quality-flag column; rows with a non-zero flag are dropped and counted.")
    String qualityColumn;

    @Option(names = "--values", paramLabel = "flux|magnitude", description = "What the value column holds (default: from the header, else flux).")
    String values;

    @Option(names = "--time-scale", paramLabel = "SCALE", description = "Time scale of the times, e.g. BJD_TDB, HJD_UTC, JD_UTC, MJD_UTC (default: from the file, else unknown).")
    String timeScale;

    @Option(names = "--time-offset", paramLabel = "DAYS", description = "Days added to every time (e.g. 2457000 for times given as BJD−2457000).")
    Double timeOffsetDays;

    @Option(names = "--hdu", paramLabel = "N", description = "FITS HDU holding the table (0 = primary; default: the first binary table).")
    Integer hdu;

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
        return new ReadOptions(timeColumn, valueColumn, errorColumn, bandColumn, qualityColumn, kind, scale,
                timeOffsetDays, hdu);
    }
}
