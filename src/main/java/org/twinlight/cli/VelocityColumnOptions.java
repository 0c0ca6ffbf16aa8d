package org.twinlight.cli;

import org.twinlight.time.TimeScale;
import org.twinlight.velocity.VelocityReadOptions;
import picocli.CommandLine.Option;

/**
 * The column options of a velocity file (a picocli mixin): part of {@link VelocityFileOptions}, and
 * on their own in {@code fit --velocities}, where the time options belong to the light curves.
 */
public final class VelocityColumnOptions {

    @Option(names = "--v1-column", paramLabel = "NAME|N", description = "Velocities of star 1, km/s (default: v1, rv1, vr1, vel1, ...; without a header, column 2).")
    String v1Column;

    @Option(names = "--v1-error-column", paramLabel = "NAME|N", description = "Their 1-sigma errors, km/s (default: the v1 column's _err twin, e_v1, ...; without a header, column 3).")
    String v1ErrorColumn;

    @Option(names = "--v2-column", paramLabel = "NAME|N", description = "Velocities of star 2, km/s (default: v2, rv2, ...; without a header, column 4).")
    String v2Column;

    @Option(names = "--v2-error-column", paramLabel = "NAME|N", description = "Their errors, km/s (default: the v2 column's _err twin; without a header, column 5).")
    String v2ErrorColumn;

    @Option(names = "--instrument-column", paramLabel = "NAME|N", description = "Column naming the instrument of each row; each instrument after the first gets a fitted velocity offset (default: instrument, inst, spectrograph, telescope or site; without a header, column 6).")
    String instrumentColumn;

    /** The read options with these columns and the given time column, scale, offset and HDU. */
    VelocityReadOptions toReadOptions(String timeColumn, TimeScale scale, Double timeOffsetDays, Integer hdu) {
        return new VelocityReadOptions(timeColumn, v1Column, v1ErrorColumn, v2Column, v2ErrorColumn, instrumentColumn,
                scale, timeOffsetDays, hdu);
    }
}
