package org.twinlight.cli;

import java.io.PrintWriter;
import java.math.BigDecimal;
import java.nio.file.Path;
import java.util.Locale;
import java.util.concurrent.Callable;
import org.twinlight.BadInputException;
import org.twinlight.photometry.LightCurveReader;
import org.twinlight.photometry.TextColumn;
import org.twinlight.report.AtomicFiles;
import org.twinlight.time.SkyDirection;
import org.twinlight.time.TimeConverter;
import org.twinlight.time.TimeScale;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/**
 * {@code time FILE --from S --to S [--ra R --dec D] [--out F.csv] [--column NAME|N]}: converts a
 * column of times between time scales and writes CSV {@code time_in,time_out}.
 */
@Command(name = "time",
        mixinStandardHelpOptions = true,
        description = {
            "Converts a column of times between time scales: JD, HJD or BJD on the UTC, TAI, TT or TDB clock,"
                    + " as Julian days or modified Julian days (e.g. JD_UTC → BJD_TDB).",
            "Writes CSV time_in,time_out (full double precision) after a comment line naming both scales.",
            "HJD and BJD need the target's J2000 right ascension and declination. UTC before 1972 is refused;"
                    + " heliocentric and barycentric corrections cover 1800–2050. See docs/time-scales.md."
        })
public final class TimeCommand implements Callable<Integer> {

    @Parameters(index = "0", paramLabel = "FILE",
            description = "Text file with a column of times (comma, tab, semicolon or white space separated;"
                    + " # comments; optional header row).")
    Path file;

    @Option(names = "--from", paramLabel = "SCALE",
            description = "Time scale of the input times: JD, HJD, BJD, MJD, HMJD or BMJD, then _UTC, _TAI, _TT"
                    + " or _TDB (e.g. JD_UTC, HJD_UTC, BJD_TDB, MJD_UTC)."
                    + " Required: times with no declared scale are refused.")
    String from;

    @Option(names = "--to", paramLabel = "SCALE", description = "Time scale to convert to (same forms as --from).")
    String to;

    @Option(names = "--ra", paramLabel = "RA",
            description = "Target right ascension, J2000: decimal degrees or hh:mm:ss.s. Needed when HJD or BJD is involved.")
    String ra;

    @Option(names = "--dec", paramLabel = "DEC",
            description = "Target declination, J2000: decimal degrees or ±dd:mm:ss.s. Needed when HJD or BJD is involved.")
    String dec;

    @Option(names = "--out", paramLabel = "F.csv",
            description = "Write the CSV to this file (written atomically); default: standard output.")
    Path out;

    @Option(names = "--column", paramLabel = "NAME|N",
            description = "Column holding the times, by header name or 1-based number (default: the column the header names as the time, e.g. time, hjd, bjd_tdb; else the first numeric column).")
    String column;

    /** Largest |time| accepted, days: JD 10⁷ is in the year 22,666, far past any time scale's tables. */
    static final double LARGEST_TIME_DAYS = 1e7;

    @Spec
    CommandSpec spec;

    @Override
    public Integer call() {
        TimeScale fromScale = scaleOption("--from", from, "the input times have no declared time scale");
        TimeScale toScale = scaleOption("--to", to, "no time scale to convert to was given");
        SkyDirection direction = direction(fromScale, toScale);
        if (out != null) {
            OutputTargets.checkFile(out, java.util.List.of(file));
        }
        TextColumn times = LightCurveReader.readColumn(file, column);

        StringBuilder csv = new StringBuilder();
        csv.append("# time_in: ").append(fromScale.label()).append("; time_out: ").append(toScale.label());
        if (direction != null) {
            csv.append(String.format(Locale.ROOT, "; target RA %.6f deg, Dec %+.6f deg (J2000)",
                    direction.raDeg(), direction.decDeg()));
        }
        csv.append("; input ").append(file.getFileName()).append(", ").append(times.name()).append('\n');
        csv.append("time_in,time_out\n");
        for (int i = 0; i < times.size(); i++) {
            if (!(Math.abs(times.value(i)) <= LARGEST_TIME_DAYS)) {
                throw BadInputException.at(file, "line " + times.lineNumber(i), times.name(), Messages.shorten(
                        times.text(i)) + " is not a (modified) Julian date; expected a number of days within ±"
                        + Messages.number(LARGEST_TIME_DAYS));
            }
            double converted;
            try {
                converted = TimeConverter.convert(times.value(i), fromScale, toScale, direction);
            } catch (BadInputException e) {
                throw BadInputException.at(file, "line " + times.lineNumber(i), times.name(), e.getMessage());
            } catch (IllegalArgumentException e) {
                throw BadInputException.at(file, "line " + times.lineNumber(i), times.name(), "cannot convert "
                        + times.text(i) + " from " + fromScale.label() + ": " + e.getMessage());
            }
            csv.append(asWritten(times.text(i), times.value(i))).append(',').append(plain(converted)).append('\n');
        }

        if (out == null) {
            PrintWriter w = spec.commandLine().getOut();
            w.print(csv);
            w.flush();
        } else {
            AtomicFiles.writeString(out, csv.toString());
            spec.commandLine().getOut().printf("%d times converted from %s to %s: %s%n",
                    times.size(), fromScale.label(), toScale.label(), out);
        }
        return 0;
    }

    private static TimeScale scaleOption(String option, String text, String missing) {
        if (text == null) {
            throw new BadInputException(missing + ": give " + option + " SCALE, one of "
                    + TimeScale.acceptedLabels().replace(", unknown", ""));
        }
        TimeScale scale = TimeScale.parse(text).orElseThrow(() -> new BadInputException(
                "option " + option + ": unknown time scale '" + text + "'; expected one of "
                        + TimeScale.acceptedLabels().replace(", unknown", "")));
        if (!scale.isKnown()) {
            throw new BadInputException("option " + option + ": times with an unknown time scale cannot be"
                    + " converted; declare the scale, e.g. JD_UTC, HJD_UTC or BJD_TDB");
        }
        return scale;
    }

    private SkyDirection direction(TimeScale fromScale, TimeScale toScale) {
        if (!TimeConverter.needsDirection(fromScale, toScale)) {
            return null;
        }
        return SkyPositionOptions.parse(ra, dec, "converting " + fromScale.label() + " to " + toScale.label());
    }

    /**
     * The input time as written when it is a plain decimal number (so its digits are kept), else
     * the value read (a decimal comma, an exponent or a Fortran exponent would not read back from
     * the CSV).
     */
    private static String asWritten(String text, double value) {
        return PLAIN_DECIMAL.matcher(text).matches() ? text : plain(value);
    }

    private static final java.util.regex.Pattern PLAIN_DECIMAL = java.util.regex.Pattern.compile("[+-]?\\d+(\\.\\d*)?");

    /** Shortest text that reads back to the same double, never in exponent form. */
    private static String plain(double value) {
        String s = Double.toString(value);
        return s.indexOf('E') < 0 ? s : new BigDecimal(s).toPlainString();
    }
}
