package org.twinlight.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import org.twinlight.BadInputException;
import org.twinlight.time.TimeScale;
import org.twinlight.velocity.VelocityData;
import org.twinlight.velocity.VelocityReadOptions;
import org.twinlight.velocity.VelocityReader;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;

/** The options of every command that reads a velocity file (a picocli mixin). */
public final class VelocityFileOptions {

    @Option(names = "--time-column", paramLabel = "NAME|N", description = "Time column of the velocity file, by header name or 1-based number (default: a column named time, bjd, hjd, jd, mjd or date; without a header row, column 1).")
    String timeColumn;

    @Mixin
    VelocityColumnOptions columns = new VelocityColumnOptions();

    @Option(names = "--time-scale", paramLabel = "SCALE", description = "Time scale of the velocity times, e.g. BJD_TDB, HJD_UTC (default: FITS time keywords, a '# time scale:' comment or a header such as BJD_TDB; else unknown).")
    String timeScale;

    @Option(names = "--time-offset", paramLabel = "DAYS", description = "Days added to every time of the velocity file.")
    Double timeOffsetDays;

    @Option(names = "--hdu", paramLabel = "N", description = "FITS HDU of the velocity table (default: the first binary table).")
    Integer hdu;

    /** The options as the library's {@link VelocityReadOptions}. */
    public VelocityReadOptions toReadOptions() {
        TimeScale scale = PhotometryOptions.timeOptions(timeScale, timeOffsetDays, hdu);
        return columns.toReadOptions(timeColumn, scale, timeOffsetDays, hdu);
    }

    /** Reads the file, printing the reader's remarks and the rows not used. */
    public VelocityData read(Path file, PrintWriter console) {
        return read(file, toReadOptions(), console);
    }

    /** Reads a velocity file with the given options, printing the reader's remarks and the rows not used. */
    static VelocityData read(Path file, VelocityReadOptions options, PrintWriter console) {
        VelocityData d = VelocityReader.read(file, options);
        d.notes().forEach(n -> console.println("note: " + file + ": " + n));
        if (d.rejectedCount() > 0) {
            console.println(file + ": " + d.rejectedCount() + " row(s) or velocities not used: " + d.rejected());
        }
        return d;
    }

    /**
     * Refuses velocities on another time scale than the model's; notes when either is unknown.
     *
     * @param modelScale the scale of the model's epoch, or UNKNOWN
     * @param modelFile where the model came from
     */
    static void checkTimeScale(VelocityData d, Path velocityFile, TimeScale modelScale, Path modelFile,
            PrintWriter console) {
        checkTimeScale(d, velocityFile, modelScale, modelFile + " (key 'timeScale')", modelFile, console);
    }

    /**
     * Refuses velocities on another time scale than {@code otherScale}, the scale of
     * {@code otherFile} (described as {@code otherDescription} in the message); notes when either is
     * unknown.
     */
    static void checkTimeScale(VelocityData d, Path velocityFile, TimeScale otherScale, String otherDescription,
            Path otherFile, PrintWriter console) {
        if (d.timeScale().isKnown() && otherScale.isKnown() && !d.timeScale().equals(otherScale)) {
            throw new BadInputException(velocityFile + ": its times are " + d.timeScale().label() + " but "
                    + otherDescription + " has " + otherScale.label() + "; convert the velocity times "
                    + "to " + otherScale.label() + " first (the time command), or, if the file is mislabelled, "
                    + "correct its '# time scale:' line (or give the velocities command --time-scale)");
        }
        if (!d.timeScale().isKnown() || !otherScale.isKnown()) {
            console.println("note: the time scale of " + (!d.timeScale().isKnown() ? velocityFile : otherFile)
                    + " is unknown, so it cannot be checked against the other; a mismatch (e.g. HJD_UTC against "
                    + "BJD_TDB) shifts the phases by up to a minute");
        }
    }
}
