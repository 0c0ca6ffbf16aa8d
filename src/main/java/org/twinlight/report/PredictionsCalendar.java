package org.twinlight.report;

import java.io.BufferedWriter;
import java.io.IOException;
import java.io.OutputStreamWriter;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.time.Instant;
import java.util.Locale;
import org.twinlight.planning.Plan;
import org.twinlight.planning.Prediction;
import org.twinlight.planning.UtcText;
import org.twinlight.sky.Darkness;

/**
 * Writes {@code predictions.ics}, an iCalendar file (RFC 5545) with one VEVENT per observable
 * minimum (whole or partial; predictions.csv lists them all) from first to last contact: CRLF line ends (§3.1), lines folded at 75 octets without splitting a
 * UTF-8 character (§3.1), TEXT values escaped (§3.3.11), times in UTC (§3.3.5 form 2), and a UID
 * (§3.8.4.7) and DTSTAMP (§3.8.7.2) on every event.
 */
public final class PredictionsCalendar {

    /** Longest content line in octets, without the CRLF (RFC 5545 §3.1). */
    static final int MAX_OCTETS = 75;

    private PredictionsCalendar() {
    }

    /**
     * Writes the calendar atomically.
     *
     * @param created the DTSTAMP of every event (when the file was made)
     */
    public static void write(Path target, Plan plan, Instant created, String softwareVersion) {
        AtomicFiles.write(target, out -> {
            Writer w = new BufferedWriter(new OutputStreamWriter(out, StandardCharsets.UTF_8), 1 << 16);
            StringBuilder sb = new StringBuilder(4096);
            write(plan, created, softwareVersion, sb, w);
            w.flush();
        });
    }

    /** The calendar's text. */
    public static String text(Plan plan, Instant created, String softwareVersion) {
        try {
            java.io.StringWriter w = new java.io.StringWriter();
            write(plan, created, softwareVersion, new StringBuilder(), w);
            return w.toString();
        } catch (IOException e) {
            throw new java.io.UncheckedIOException(e);
        }
    }

    /** Writes the calendar event by event: each is built in {@code sb}, then handed to {@code w}. */
    private static void write(Plan plan, Instant created, String softwareVersion, StringBuilder sb, Writer w)
            throws IOException {
        line(sb, "BEGIN:VCALENDAR");
        line(sb, "VERSION:2.0");
        line(sb, "PRODID:-//twinlight//predict " + softwareVersion + "//EN");
        line(sb, "CALSCALE:GREGORIAN");
        line(sb, "METHOD:PUBLISH");
        line(sb, "X-WR-CALNAME:" + escape("Eclipsing-binary minima"));
        line(sb, "X-WR-CALDESC:" + escape("Predicted minima (first to last contact) that can be observed from "
                + plan.site().latitudeDeg() + "°, " + plan.site().longitudeDeg() + "°. Times carry the ephemeris's"
                + " 1σ only; contacts from a fitted model depend on its assumptions (spherical stars, the chosen"
                + " limb-darkening law). predictions.csv lists every minimum."));
        String stamp = UtcText.compact(created);
        for (Prediction p : plan.predictions()) {
            if (!p.verdict().observable()) {
                continue;
            }
            line(sb, "BEGIN:VEVENT");
            line(sb, "UID:" + uid(p, plan));
            line(sb, "DTSTAMP:" + stamp);
            line(sb, "DTSTART:" + UtcText.compact(UtcText.instant(p.start().utc())));
            line(sb, "DTEND:" + UtcText.compact(UtcText.instant(p.end().utc())));
            line(sb, "SUMMARY:" + escape(p.target() + " " + p.type().label() + " minimum " + UtcText.hourMinute(
                    p.minimum().utc()) + " UTC (" + p.verdict().label() + ")"));
            line(sb, "DESCRIPTION:" + escape(description(p)));
            line(sb, "TRANSP:TRANSPARENT");
            line(sb, "CATEGORIES:" + escape(p.verdict().label()));
            line(sb, "END:VEVENT");
            w.append(sb);
            sb.setLength(0);
        }
        line(sb, "END:VCALENDAR");
        w.append(sb);
    }

    private static String uid(Prediction p, Plan plan) {
        // the same minimum seen from the same site keeps its UID, so a re-import updates it
        String key = String.format(Locale.ROOT, "%s|%s|%s|%.4f|%.4f", p.target(), p.type().label(),
                PredictionsCsv.cycle(p.cycle()), plan.site().latitudeDeg(), plan.site().longitudeDeg());
        String id = java.util.UUID.nameUUIDFromBytes(key.getBytes(StandardCharsets.UTF_8)).toString();
        return id + "@twinlight.predict";
    }

    private static String description(Prediction p) {
        StringBuilder d = new StringBuilder(400);
        d.append("Minimum ").append(UtcText.iso(p.minimum().utc())).append(" (JD_UTC ")
                .append(PredictionsCsv.f(p.minimum().utc().jd(), 5)).append("; ").append(p.ownScale().label())
                .append(' ').append(PredictionsCsv.f(p.minimumOwnScale(), 6)).append(") ± ")
                .append(PredictionsCsv.f(p.errorDays() * 1440, 1)).append(" min (1σ), cycle ")
                .append(PredictionsCsv.cycle(p.cycle())).append(".\n");
        d.append("Contacts ").append(UtcText.hourMinute(p.start().utc())).append(" to ")
                .append(UtcText.hourMinute(p.end().utc())).append(" UTC.\n");
        d.append("Altitude/azimuth: start ").append(angle(p.start().target())).append(", minimum ")
                .append(angle(p.minimum().target())).append(", end ").append(angle(p.end().target())).append(".\n");
        d.append("Sun ").append(PredictionsCsv.f(p.minimum().sunAltitudeDeg(), 0)).append("° at minimum (")
                .append(Darkness.of(p.minimum().sunAltitudeDeg()).label()).append("). Moon ")
                .append(PredictionsCsv.f(p.moon().altitudeDeg(), 0)).append("°, ")
                .append(PredictionsCsv.f(100 * p.moon().illuminatedFraction(), 0)).append("% lit, ")
                .append(PredictionsCsv.f(p.moon().separationDeg(), 0)).append("° away.\n");
        d.append(p.verdict().label()).append(": ").append(p.reason());
        if (!p.clashes().isEmpty()) {
            d.append("\nClashes with: ").append(String.join("; ", p.clashes()));
        }
        return d.toString();
    }

    private static String angle(org.twinlight.sky.Horizontal h) {
        return PredictionsCsv.f(h.altitudeDeg(), 0) + "°/" + PredictionsCsv.f(h.azimuthDeg(), 0) + "°";
    }

    /** RFC 5545 §3.3.11: backslash, semicolon and comma escaped, newlines as \n. */
    static String escape(String text) {
        return text.replace("\\", "\\\\").replace(";", "\\;").replace(",", "\\,").replace("\r\n", "\\n")
                .replace("\n", "\\n");
    }

    /** Appends a content line folded at 75 octets (continuations start with one space), CRLF-terminated. */
    static void line(StringBuilder sb, String content) {
        int octets = 0;
        int limit = MAX_OCTETS;
        for (int i = 0; i < content.length();) {
            int cp = content.codePointAt(i);
            int n = cp < 0x80 ? 1 : cp < 0x800 ? 2 : cp < 0x10000 ? 3 : 4; // UTF-8 octets (RFC 3629)
            if (octets + n > limit) {
                sb.append("\r\n ");
                octets = 0;
                limit = MAX_OCTETS - 1; // the leading space counts
            }
            sb.appendCodePoint(cp);
            octets += n;
            i += Character.charCount(cp);
        }
        sb.append("\r\n");
    }
}
