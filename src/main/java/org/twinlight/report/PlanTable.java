package org.twinlight.report;

import java.util.List;
import java.util.Locale;
import org.twinlight.planning.Plan;
import org.twinlight.planning.Prediction;
import org.twinlight.planning.UtcText;

/** The short plan printed on the terminal: one line per minimum, the observable ones first when many. */
public final class PlanTable {

    private PlanTable() {
    }

    /**
     * The table, at most {@code maxRows} rows (observable minima are preferred when there are more).
     */
    public static String format(Plan plan, int maxRows) {
        List<Prediction> rows = plan.predictions();
        String cut = "";
        if (rows.size() > maxRows) {
            List<Prediction> observable = rows.stream().filter(p -> p.verdict().observable()).toList();
            rows = (observable.isEmpty() ? rows : observable).stream().limit(maxRows).toList();
            cut = String.format(Locale.ROOT, "(%d of %d minima shown%s; all are in predictions.csv)%n", rows.size(),
                    plan.predictions().size(), observable.isEmpty() ? "" : ", observable ones first");
        }
        StringBuilder sb = new StringBuilder();
        sb.append(String.format(Locale.ROOT, "%-16s %-12s %-9s %7s %-11s %-13s %5s %5s %-15s %s%n", "minimum UTC",
                "target", "type", "±1σ min", "contacts", "alt s/m/e °", "Sun°", "Moon%", "verdict", "note"));
        for (Prediction p : rows) {
            String alt = String.format(Locale.ROOT, "%.0f/%.0f/%.0f", p.start().target().altitudeDeg(),
                    p.minimum().target().altitudeDeg(), p.end().target().altitudeDeg());
            String note = p.clashes().isEmpty() ? "" : "clash: " + String.join("; ", p.clashes());
            if (p.errorExceedsTenthOfEclipse()) {
                note = (note.isEmpty() ? "" : note + "; ") + "large timing error";
            }
            sb.append(String.format(Locale.ROOT, "%-16s %-12s %-9s %7.1f %-11s %-13s %+5.0f %5.0f %-15s %s%n",
                    UtcText.dateHourMinute(p.minimum().utc()), shorten(p.target(), 12), p.type().label(),
                    p.errorDays() * 1440, UtcText.hourMinute(p.start().utc()) + "-" + UtcText.hourMinute(p.end().utc()),
                    alt, p.minimum().sunAltitudeDeg(), 100 * p.moon().illuminatedFraction(), p.verdict().label(), note)
                    .stripTrailing()).append('\n');
        }
        sb.append(cut);
        return sb.toString();
    }

    private static String shorten(String s, int n) {
        return s.length() <= n ? s : s.substring(0, n - 1) + "…";
    }
}
