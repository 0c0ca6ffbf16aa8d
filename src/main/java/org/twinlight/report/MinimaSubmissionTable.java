package org.twinlight.report;

import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import org.twinlight.time.SkyDirection;
import org.twinlight.time.TimeScale;
import org.twinlight.timing.Ephemeris;
import org.twinlight.timing.minima.MinimumMethod;
import org.twinlight.timing.minima.MinimumTime;
import org.twinlight.timing.MinimumType;

/**
 * Writes {@code minima-submission.txt}: one line per time of minimum, white-space separated fixed
 * columns after a {@code #} header that names the object and its position, states the time scale
 * (and the scale it was converted from) and explains every column, ready
 * to send to a timing database or a colleague. The observer, when given, is the last column so
 * that it may contain spaces.
 */
public final class MinimaSubmissionTable {

    /**
     * What goes into the table.
     *
     * @param minima the minima (one method)
     * @param timeScale time scale of the times
     * @param convertedFrom the data's time scale when the times were converted to {@code timeScale}, else null
     * @param source the photometry file
     * @param ephemeris ephemeris of the cycle numbers and O−C
     * @param object name of the star, or null
     * @param position its J2000 position, or null
     * @param observer observer name, or null
     * @param filter filter or band name, or null
     * @param softwareVersion twinlight's version
     */
    public record Content(List<MinimumTime> minima, TimeScale timeScale, TimeScale convertedFrom, String source,
            Ephemeris ephemeris, String object, SkyDirection position, String observer, String filter,
            String softwareVersion) {
    }

    private MinimaSubmissionTable() {
    }

    /** The text as comment lines of at most about 100 characters, broken between words. */
    private static String wrappedComment(String text) {
        StringBuilder out = new StringBuilder();
        StringBuilder line = new StringBuilder("#");
        for (String word : text.split(" ")) {
            if (line.length() + 1 + word.length() > 100 && line.length() > 1) {
                out.append(line).append('\n');
                line = new StringBuilder("#");
            }
            line.append(' ').append(word);
        }
        return out.append(line).append('\n').toString();
    }

    public static void write(Path target, Content c) {
        boolean withFilter = c.filter() != null && !c.filter().isBlank();
        boolean withObserver = c.observer() != null && !c.observer().isBlank();
        StringBuilder sb = new StringBuilder();
        sb.append("# Times of minimum of an eclipsing binary, measured with twinlight ").append(c.softwareVersion())
                .append('\n');
        sb.append("# Object: ").append(c.object() == null || c.object().isBlank() ? "not given" : c.object().trim())
                .append('\n');
        if (c.position() != null) {
            sb.append(String.format(Locale.ROOT, "# Position (J2000): RA %s = %.6f deg, Dec %s = %+.6f deg%n",
                    sexagesimal(c.position().raDeg() / 15, false, 2), c.position().raDeg(),
                    sexagesimal(c.position().decDeg(), true, 1), c.position().decDeg()));
        } else {
            sb.append("# Position (J2000): not given\n");
        }
        sb.append("# Source photometry: ").append(c.source()).append('\n');
        sb.append("# Time scale: ").append(c.timeScale().label()).append(describe(c.timeScale()));
        if (c.convertedFrom() != null) {
            sb.append("; converted from ").append(c.convertedFrom().label()).append(" by twinlight");
        }
        sb.append('\n');
        sb.append(String.format(Locale.ROOT, "# Ephemeris of CYCLE and O-C: Min I = %.8f + %.10f * E%n",
                c.ephemeris().epochDays(), c.ephemeris().periodDays()));
        sb.append(wrappedComment("Caution: " + EphemerisJson.CAUTION));
        sb.append("#\n# Columns (separated by spaces; lines starting with # are comments):\n");
        sb.append("#   TIME      time of minimum, days, in the time scale above\n");
        sb.append("#   ERROR     1-sigma uncertainty of TIME, days\n");
        sb.append("#   TYPE      P = primary minimum, S = secondary minimum\n");
        sb.append("#   CYCLE     cycle number E (integer for P, integer + 0.5 for S)\n");
        sb.append("#   O-C       observed minus calculated time, days, against the ephemeris above\n");
        sb.append("#   METHOD    KVW = Kwee & van Woerden (1956), error from re-measured synthetic replicas;\n");
        sb.append("#             TPL = least-squares fit of a symmetric template, error from the covariance\n");
        sb.append("#             scaled by the reduced chi-square\n");
        sb.append("#   NPTS      number of data points used\n");
        sb.append("#   COVER     full = the eclipse was covered; part = partly covered, TIME from the template\n");
        sb.append("#             with its shape and depth fixed by the well-covered eclipses\n");
        if (withFilter) {
            sb.append("#   FILTER    filter or photometric band\n");
        }
        if (withObserver) {
            sb.append("#   OBSERVER  observer (to the end of the line)\n");
        }
        sb.append("#\n");
        sb.append(String.format(Locale.ROOT, "%-17s %-10s %-4s %-9s %-10s %-6s %-5s %-5s", "#TIME", "ERROR", "TYPE",
                "CYCLE", "O-C", "METHOD", "NPTS", "COVER"));
        if (withFilter) {
            sb.append(String.format(Locale.ROOT, " %-8s", "FILTER"));
        }
        if (withObserver) {
            sb.append(" OBSERVER");
        }
        sb.append('\n');
        for (MinimumTime m : c.minima()) {
            double oc = m.timeDays() - c.ephemeris().timeOf(m.cycle());
            sb.append(String.format(Locale.ROOT, "%-17.8f %-10.8f %-4s %-9s %+-10.6f %-6s %-5d %-5s", m.timeDays(),
                    m.errorDays(), m.type() == MinimumType.PRIMARY ? "P" : "S", MinimaCsv.cycleText(m.cycle()), oc,
                    m.method() == MinimumMethod.KVW ? "KVW" : "TPL", m.nPoints(), m.partial() ? "part" : "full"));
            if (withFilter) {
                sb.append(String.format(Locale.ROOT, " %-8s", c.filter().trim().replace(' ', '_')));
            }
            if (withObserver) {
                sb.append(' ').append(c.observer().trim());
            }
            sb.append('\n');
        }
        AtomicFiles.writeString(target, sb.toString());
    }

    /** hh:mm:ss.ss or ±dd:mm:ss.s, with {@code decimals} decimals of the seconds. */
    static String sexagesimal(double value, boolean signed, int decimals) {
        double scale = Math.pow(10, decimals);
        long total = Math.round(Math.abs(value) * 3600 * scale);
        long units = total / (3600 * (long) scale);
        long minutes = total / (60 * (long) scale) % 60;
        double seconds = (total % (60 * (long) scale)) / scale;
        String text = String.format(Locale.ROOT, "%02d:%02d:%0" + (3 + decimals) + "." + decimals + "f", units,
                minutes, seconds);
        return signed ? (value < 0 ? "-" : "+") + text : text;
    }

    private static String describe(TimeScale scale) {
        if (!scale.isKnown()) {
            return " (not declared: give --time-scale when reading the photometry)";
        }
        String where = switch (scale.reference()) {
            case GEOCENTRIC -> "geocentric";
            case HELIOCENTRIC -> "heliocentric";
            case BARYCENTRIC -> "barycentric";
            default -> scale.reference().name().toLowerCase(Locale.ROOT);
        };
        return " (" + where + (scale.modified() ? " modified Julian date, JD - 2400000.5" : " Julian date") + ", "
                + scale.standard().name() + ")";
    }
}
