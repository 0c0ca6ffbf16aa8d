package org.twinlight.report;

import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.time.Instant;
import java.time.ZoneOffset;
import java.time.format.DateTimeFormatter;
import java.util.Locale;
import org.twinlight.planning.Plan;
import org.twinlight.planning.Prediction;
import org.twinlight.planning.UtcText;
import org.twinlight.sky.Darkness;

/**
 * Writes {@code predictions.ics}, an iCalendar file (RFC 5545) with one VEVENT per minimum from
 * first to last contact: CRLF line ends (§3.1), lines folded at 75 octets without splitting a
 * UTF-8 character (§3.1), TEXT values escaped (§3.3.11), times in UTC (§3.3.5 form 2), and a UID
 * (§3.8.4.7) and DTSTAMP (§3.8.7.2) on every event.
 */
public final class PredictionsCalendar {

    private static final DateTimeFormatter STAMP = DateTimeFormatter.ofPattern("yyyyMMdd'T'HHmmss'Z'")
            .withZone(ZoneOffset.UTC);

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
        AtomicFiles.writeString(target, text(plan, created, softwareVersion));
    }

    /** The calendar's text. */
    public static String text(Plan plan, Instant created, String softwareVersion) {
        StringBuilder sb = new StringBuilder();
        line(sb, "BEGIN:VCALENDAR");
        line(sb, "VERSION:2.0");
        line(sb, "PRODID:-//twinlight//predict " + softwareVersion + "//EN");
        line(sb, "CALSCALE:GREGORIAN");
        line(sb, "METHOD:PUBLISH");
        line(sb, "X-WR-CALNAME:" + escape("Eclipsing-binary minima"));
        String stamp = STAMP.format(created);
        for (Prediction p : plan.predictions()) {
            line(sb, "BEGIN:VEVENT");
            line(sb, "UID:" + uid(p, plan));
            line(sb, "DTSTAMP:" + stamp);
            line(sb, "DTSTART:" + STAMP.format(UtcText.instant(p.start().utc())));
            line(sb, "DTEND:" + STAMP.format(UtcText.instant(p.end().utc())));
            line(sb, "SUMMARY:" + escape(p.target() + " " + p.type().label() + " minimum " + UtcText.hourMinute(
                    p.minimum().utc()) + " UTC (" + p.verdict().label() + ")"));
            line(sb, "DESCRIPTION:" + escape(description(p)));
            line(sb, "TRANSP:TRANSPARENT");
            line(sb, "CATEGORIES:" + escape(p.verdict().label()));
            line(sb, "END:VEVENT");
        }
        line(sb, "END:VCALENDAR");
        return sb.toString();
    }

    private static String uid(Prediction p, Plan plan) {
        // the same minimum seen from the same site keeps its UID, so a re-import updates it
        String key = String.format(Locale.ROOT, "%s|%s|%s|%.4f|%.4f", p.target(), p.type().label(),
                PredictionsCsv.cycle(p.cycle()), plan.site().latitudeDeg(), plan.site().longitudeDeg());
        String id = java.util.UUID.nameUUIDFromBytes(key.getBytes(StandardCharsets.UTF_8)).toString();
        return id + "@twinlight.predict";
    }

    private static String description(Prediction p) {
        StringBuilder d = new StringBuilder();
        d.append(String.format(Locale.ROOT, "Minimum %s (JD_UTC %.5f; %s %.6f) ± %.1f min (1σ), cycle %s.%n",
                UtcText.iso(p.minimum().utc()), p.minimum().utc().jd(), p.ownScale().label(), p.minimumOwnScale(),
                p.errorDays() * 1440, PredictionsCsv.cycle(p.cycle())));
        d.append(String.format(Locale.ROOT, "Contacts %s to %s UTC.%n", UtcText.hourMinute(p.start().utc()),
                UtcText.hourMinute(p.end().utc())));
        d.append(String.format(Locale.ROOT, "Altitude/azimuth: start %.0f°/%.0f°, minimum %.0f°/%.0f°, end %.0f°/%.0f°.%n",
                p.start().target().altitudeDeg(), p.start().target().azimuthDeg(), p.minimum().target().altitudeDeg(),
                p.minimum().target().azimuthDeg(), p.end().target().altitudeDeg(), p.end().target().azimuthDeg()));
        d.append(String.format(Locale.ROOT, "Sun %+.0f° at minimum (%s). Moon %+.0f°, %.0f%% lit, %.0f° away.%n",
                p.minimum().sunAltitudeDeg(), Darkness.of(p.minimum().sunAltitudeDeg()).label(),
                p.moon().altitudeDeg(), 100 * p.moon().illuminatedFraction(), p.moon().separationDeg()));
        d.append(p.verdict().label()).append(": ").append(p.reason());
        if (!p.clashes().isEmpty()) {
            d.append("\nClashes with: ").append(String.join("; ", p.clashes()));
        }
        return d.toString();
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
            int n = new String(Character.toChars(cp)).getBytes(StandardCharsets.UTF_8).length;
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
