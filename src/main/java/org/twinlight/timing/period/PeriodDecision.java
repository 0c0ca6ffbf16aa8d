package org.twinlight.timing.period;

import java.util.List;

/**
 * The period decision: a confident period, an ambiguity with the candidates that the data cannot tell
 * apart, or no significant signal; with the evidence in words and what observation would settle it.
 *
 * @param status the verdict
 * @param periodDays the period reported, days (for an ambiguity, the candidate listed first and why)
 * @param alternativesDays the other periods the data allow (empty when confident)
 * @param evidence the evidence weighed, one statement each
 * @param toSettle what observation would settle an ambiguity (empty when confident)
 * @param notes remarks that do not change the verdict (the secondary not seen, the search floor or ceiling)
 */
public record PeriodDecision(Status status, double periodDays, List<Double> alternativesDays, List<String> evidence,
        List<String> toSettle, List<String> notes) {

    /** The kind of verdict. */
    public enum Status {
        /** One period is supported by all the evidence. */
        CONFIDENT,
        /** Several periods fit the data equally well. */
        AMBIGUOUS,
        /** No significant eclipse signal. */
        NOT_SIGNIFICANT;

        /** The word used in files and on screen. */
        public String label() {
            return name().toLowerCase(java.util.Locale.ROOT).replace('_', '-');
        }
    }

    public PeriodDecision {
        alternativesDays = List.copyOf(alternativesDays);
        evidence = List.copyOf(evidence);
        toSettle = List.copyOf(toSettle);
        notes = List.copyOf(notes);
    }

    static PeriodDecision confident(double periodDays, List<String> evidence, List<String> notes) {
        return new PeriodDecision(Status.CONFIDENT, periodDays, List.of(), evidence, List.of(), notes);
    }

    static PeriodDecision ambiguous(double periodDays, List<Double> alternativesDays, List<String> evidence,
            List<String> toSettle, List<String> notes) {
        return new PeriodDecision(Status.AMBIGUOUS, periodDays, alternativesDays, evidence, toSettle, notes);
    }

    static PeriodDecision notSignificant(double periodDays, String why) {
        return new PeriodDecision(Status.NOT_SIGNIFICANT, periodDays, List.of(), List.of(why),
                List.of("more or better data: the best peak is probably noise"), List.of());
    }

    /** The same decision reported at a refined value of its period. */
    PeriodDecision withPeriodDays(double refinedDays) {
        return new PeriodDecision(status, refinedDays, alternativesDays, evidence, toSettle, notes);
    }

    /** True when the period is confidently decided. */
    public boolean confident() {
        return status == Status.CONFIDENT;
    }

    /** A one-line summary: the status, the period and the alternatives. */
    public String headline() {
        StringBuilder b = new StringBuilder(status.label());
        b.append(String.format(java.util.Locale.ROOT, ": P = %.8g d", periodDays));
        if (!alternativesDays.isEmpty()) {
            b.append(", or ");
            for (int i = 0; i < alternativesDays.size(); i++) {
                b.append(i == 0 ? "" : ", ").append(String.format(java.util.Locale.ROOT, "%.8g", alternativesDays.get(i)));
            }
            b.append(" d");
        }
        return b.toString();
    }
}
