package org.twinlight.report;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.charset.StandardCharsets;
import java.time.Instant;
import java.time.LocalDate;
import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Deque;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;
import org.twinlight.planning.DateRange;
import org.twinlight.planning.EclipseExtent;
import org.twinlight.planning.ObservingLimits;
import org.twinlight.planning.Plan;
import org.twinlight.planning.Planner;
import org.twinlight.planning.PlanningTarget;
import org.twinlight.planning.PredictionEphemeris;
import org.twinlight.sky.Site;
import org.twinlight.time.SkyDirection;
import org.twinlight.time.TimeScale;

/**
 * predictions.ics checked against the grammar of RFC 5545 (Desruisseaux 2009, "Internet Calendaring
 * and Scheduling Core Object Specification"), written out in this test: §3.1 content lines
 * (CRLF, folding at 75 octets, {@code name *(";" param) ":" value}), §3.3.5 DATE-TIME in UTC,
 * §3.3.11 TEXT escaping, §3.4/§3.6 the VCALENDAR object, §3.6.1 the VEVENT's required properties.
 */
class PredictionsCalendarTest {

    // §3.1: name = iana-token / x-name; iana-token = 1*(ALPHA / DIGIT / "-")
    private static final Pattern NAME = Pattern.compile("[A-Za-z0-9-]+");
    // §3.1: param = param-name "=" param-value *("," param-value); param-value = paramtext / quoted-string
    private static final Pattern PARAM = Pattern.compile("[A-Za-z0-9-]+=(\"[^\"\\p{Cntrl}]*\"|[^\";:,\\p{Cntrl}]*)"
            + "(,(\"[^\"\\p{Cntrl}]*\"|[^\";:,\\p{Cntrl}]*))*");
    // §3.3.5 form 2: date-time in UTC
    private static final Pattern UTC_DATE_TIME = Pattern.compile("\\d{8}T\\d{6}Z");
    // §3.3.11: TEXT with ESCAPED-CHAR only for \\ \; \, \N \n; no bare ; or , and no controls
    private static final Pattern TEXT = Pattern.compile("([^\\\\;,\\p{Cntrl}]|\\\\[\\\\;,Nn])*");

    private static Plan plan(String name) {
        PredictionEphemeris eph = PredictionEphemeris.of(2461470.3172, 0.8341, 2e-4, 2e-6, TimeScale.BJD_TDB);
        PlanningTarget t = new PlanningTarget(name, new SkyDirection(120, 40), eph,
                EclipseExtent.ofDuration(0.15, "test"));
        return Planner.plan(List.of(t), new Site(50, 10, 300),
                DateRange.of(LocalDate.of(2027, 3, 1), LocalDate.of(2027, 3, 9), false), ObservingLimits.DEFAULT);
    }

    @Test
    void calendarFollowsTheGrammarOfRfc5545() {
        // a name with the characters TEXT must escape, and multi-byte UTF-8 for the folding
        String text = PredictionsCalendar.text(plan("Demo; α-Fictus, \"B\" \\ ÅÅÅÅÅÅÅÅÅÅÅÅÅÅÅÅÅÅÅÅÅÅÅÅÅÅÅÅÅÅÅÅÅÅ"),
                Instant.parse("2026-12-02T12:00:00Z"), "1.0");
        assertThat(text).endsWith("\r\n");
        byte[] bytes = text.getBytes(StandardCharsets.UTF_8);
        // every line ends in CRLF: no bare CR or LF
        for (int i = 0; i < bytes.length; i++) {
            if (bytes[i] == '\n') {
                assertThat(i > 0 && bytes[i - 1] == '\r').as("LF at byte " + i + " without CR").isTrue();
            }
            if (bytes[i] == '\r') {
                assertThat(bytes[i + 1]).as("CR at byte " + i + " without LF").isEqualTo((byte) '\n');
            }
        }
        String[] physical = text.split("\r\n");
        for (String line : physical) {
            assertThat(line.getBytes(StandardCharsets.UTF_8).length).as(line).isLessThanOrEqualTo(75);
        }
        // §3.1 unfolding: CRLF followed by one space or tab is removed
        List<String> lines = List.of(text.replaceAll("\r\n[ \t]", "").split("\r\n"));
        Deque<String> open = new ArrayDeque<>();
        Map<String, Integer> calendarProps = new HashMap<>();
        Map<String, Integer> eventProps = new HashMap<>();
        Set<String> uids = new HashSet<>();
        int events = 0;
        for (String line : lines) {
            Matcher m = Pattern.compile("^([^;:]+)((?:;[^:]*)?):(.*)$").matcher(line);
            assertThat(m.matches()).as(line).isTrue();
            String name = m.group(1);
            assertThat(name).matches(NAME);
            if (!m.group(2).isEmpty()) {
                for (String p : m.group(2).substring(1).split(";")) {
                    assertThat(p).matches(PARAM);
                }
            }
            String value = m.group(3);
            switch (name) {
                case "BEGIN" -> {
                    open.push(value);
                    if (value.equals("VEVENT")) {
                        assertThat(open).containsExactly("VEVENT", "VCALENDAR");
                        eventProps.clear();
                    } else {
                        assertThat(value).isEqualTo("VCALENDAR");
                        assertThat(open).hasSize(1);
                    }
                }
                case "END" -> {
                    assertThat(open.pop()).isEqualTo(value);
                    if (value.equals("VEVENT")) {
                        events++;
                        // §3.6.1: DTSTAMP, UID and DTSTART exactly once
                        for (String req : List.of("UID", "DTSTAMP", "DTSTART")) {
                            assertThat(eventProps.getOrDefault(req, 0)).as(req).isEqualTo(1);
                        }
                        assertThat(eventProps.containsKey("DTEND") && eventProps.containsKey("DURATION")).isFalse();
                    }
                }
                default -> {
                    Map<String, Integer> props = open.peek().equals("VEVENT") ? eventProps : calendarProps;
                    props.merge(name, 1, Integer::sum);
                    if (List.of("DTSTAMP", "DTSTART", "DTEND").contains(name)) {
                        assertThat(value).matches(UTC_DATE_TIME);
                    }
                    if (List.of("SUMMARY", "DESCRIPTION", "CATEGORIES").contains(name)) {
                        assertThat(value).matches(TEXT);
                    }
                    if (name.equals("UID")) {
                        assertThat(uids.add(value)).as("unique UID " + value).isTrue();
                        assertThat(value).contains("@");
                    }
                }
            }
        }
        assertThat(open).isEmpty();
        assertThat(lines.get(0)).isEqualTo("BEGIN:VCALENDAR");
        assertThat(calendarProps).containsEntry("VERSION", 1).containsEntry("PRODID", 1);
        assertThat(lines).contains("VERSION:2.0");
        // observable minima only: the rest stay in predictions.csv
        assertThat(events).isEqualTo(plan("x").predictions().stream().filter(p -> p.verdict().observable()).count())
                .isGreaterThan(2);
        // the escaped name reads back to the original after §3.3.11 unescaping
        String summary = lines.stream().filter(l -> l.startsWith("SUMMARY:")).findFirst().orElseThrow();
        String unescaped = summary.substring(8).replace("\\;", ";").replace("\\,", ",").replace("\\\\", "\\");
        assertThat(unescaped).startsWith("Demo; α-Fictus, \"B\" \\ ÅÅÅÅ");
    }

    @Test
    void foldingNeverSplitsACharacterAndUnfoldsToTheOriginal() {
        String value = "DESCRIPTION:" + "€".repeat(60) + "x".repeat(100) + "α".repeat(50);
        StringBuilder sb = new StringBuilder();
        PredictionsCalendar.line(sb, value);
        String folded = sb.toString();
        for (String physical : folded.split("\r\n")) {
            assertThat(physical.getBytes(StandardCharsets.UTF_8).length).isLessThanOrEqualTo(75);
            assertThat(physical).doesNotContain("\uFFFD");
        }
        assertThat(folded.replaceAll("\r\n ", "")).isEqualTo(value + "\r\n");
        List<String> parts = new ArrayList<>(List.of(folded.split("\r\n")));
        assertThat(parts.size()).isGreaterThan(4);
    }
}
