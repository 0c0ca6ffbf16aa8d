package org.twinlight.cli;

import java.nio.file.Files;
import java.nio.file.Path;
import org.twinlight.report.PlanningInputs;
import org.twinlight.sky.Site;

import org.twinlight.BadInputException;
import org.twinlight.time.SkyDirection;

/**
 * Reads a target's J2000 position given as {@code --ra} and {@code --dec} (decimal degrees, or
 * {@code hh:mm:ss.s} and {@code ±dd:mm:ss}), the same way for every command.
 */
final class SkyPositionOptions {

    private SkyPositionOptions() {
    }

    /**
     * @param why what the position is needed for, for the message when one of them is missing
     * @return the direction
     * @throws BadInputException naming the option that is missing or cannot be read
     */
    static SkyDirection parse(String ra, String dec, String why) {
        if (ra == null && dec == null) {
            throw new BadInputException(why + " needs the target's position: give --ra and --dec (J2000; degrees, "
                    + "or hh:mm:ss.s and ±dd:mm:ss)");
        }
        if (ra == null || dec == null) {
            String given = ra == null ? "--dec" : "--ra";
            String missing = ra == null ? "--ra" : "--dec";
            throw new BadInputException("option " + missing + " is missing: " + why + " needs the target's position, "
                    + "and only " + given + " was given; give " + missing + " too (J2000; degrees, or "
                    + (ra == null ? "hh:mm:ss.s" : "±dd:mm:ss") + ")");
        }
        double raDeg;
        double decDeg;
        try {
            raDeg = SkyDirection.parseRaDeg(ra);
        } catch (IllegalArgumentException e) {
            throw new BadInputException("option --ra: " + e.getMessage());
        }
        try {
            decDeg = SkyDirection.parseDecDeg(dec);
        } catch (IllegalArgumentException e) {
            throw new BadInputException("option --dec: " + e.getMessage());
        }
        return new SkyDirection(raDeg, decDeg);
    }

    /**
     * A site from {@code --site}: {@code LAT,LON[,HEIGHT_M]} (degrees, east positive; metres) or a
     * site file.
     */
    static Site site(String text) {
        Path p = Path.of(text);
        if (!text.contains(",") && Files.isRegularFile(p)) {
            return PlanningInputs.readSiteFile(p);
        }
        if (!text.contains(",")) {
            throw new BadInputException("option --site: '" + text + "' is neither LAT,LON[,HEIGHT_M] nor an existing"
                    + " site file");
        }
        return Site.parse(text, "option --site");
    }
}
