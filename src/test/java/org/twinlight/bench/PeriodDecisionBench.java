package org.twinlight.bench;

import java.util.Locale;
import java.util.function.LongFunction;
import org.twinlight.timing.period.PeriodDecision;
import org.twinlight.timing.period.PeriodScenarios;
import org.twinlight.timing.period.PeriodSearch;
import org.twinlight.timing.period.PeriodSearchResult;
import org.twinlight.timing.period.PeriodSearchSettings;

/**
 * The large version of {@code PeriodDecisionInjectionTest}: each hard case over many noise seeds, counting
 * confident-and-right, ambiguous with the truth listed, ambiguous without it, and confident-and-wrong
 * verdicts (the last must stay at zero). The figures go to docs/period-search.md. Run with
 * {@code java -cp target/classes:target/test-classes:DEPS org.twinlight.bench.PeriodDecisionBench [seeds]}.
 */
public final class PeriodDecisionBench {
    private PeriodDecisionBench() {
    }

    public static void main(String[] args) {
        int seeds = args.length > 0 ? Integer.parseInt(args[0]) : 50;
        System.out.printf(Locale.ROOT, "| case | seeds | confident, right | ambiguous, truth listed | ambiguous,"
                + " truth not listed | confident, WRONG | not significant |%n|---|---|---|---|---|---|---|%n");
        run("eccentric, e = 0.32, 27 d at 2 min, 800 ppm", seeds, s -> PeriodScenarios.eccentric(s, 2));
        run("exact twins, 27 d at 2 min, 800 ppm", seeds, s -> PeriodScenarios.twins(s, 800, 2));
        run("exact twins, 27 d at 2 min, 100 ppm", seeds, s -> PeriodScenarios.twins(s, 100, 2));
        run("one visible eclipse per orbit, 27 d at 2 min", seeds, s -> PeriodScenarios.oneEclipsePerOrbit(s, 2));
        run("near-equal grazing, ~45 ground nights, zero points", seeds, PeriodScenarios::groundGrazing);
        run("sparse survey, 3 × 250 points, P = 3.17 d", Math.max(1, seeds / 5),
                s -> PeriodScenarios.sparseSurvey(s, 250));
        run("30-d binary, 16 nights, phase 0.5 never observed", Math.max(1, seeds / 5),
                PeriodScenarios::longPeriodNoHalfPhase);
        run("P = 0.1234 d, below the default floor", Math.max(1, seeds / 5), PeriodScenarios::nearFloor);
        run("noise only, 27 d at 10 min", seeds, PeriodScenarios::noiseOnly);
    }

    private static void run(String name, int seeds, LongFunction<PeriodScenarios.Case> make) {
        int right = 0;
        int listed = 0;
        int unlisted = 0;
        int wrong = 0;
        int none = 0;
        long t0 = System.nanoTime();
        for (long seed = 1; seed <= seeds; seed++) {
            PeriodScenarios.Case c = make.apply(seed);
            PeriodSearchResult r = PeriodSearch.search(c.lightCurve(), PeriodSearchSettings.defaults());
            double truth = c.truePeriodDays();
            PeriodDecision d = r.decision();
            if (d.status() == PeriodDecision.Status.NOT_SIGNIFICANT) {
                none++;
            } else if (Double.isNaN(truth)) {
                wrong += d.confident() ? 1 : 0;
                unlisted += d.confident() ? 0 : 1;
            } else if (d.confident()) {
                if (Math.abs(r.periodDays() - truth) <= 5 * r.periodUncertaintyDays()) {
                    right++;
                } else {
                    wrong++;
                    System.err.printf(Locale.ROOT, "%s seed %d: confident %.8f ± %.2g, truth %.8f%n", name, seed,
                            r.periodDays(), r.periodUncertaintyDays(), truth);
                }
            } else {
                boolean found = Math.abs(r.periodDays() - truth) <= Math.max(5 * r.periodUncertaintyDays(), 1e-3 * truth)
                        || d.alternativesDays().stream().anyMatch(p -> Math.abs(p - truth) < 1e-3 * p);
                listed += found ? 1 : 0;
                unlisted += found ? 0 : 1;
            }
        }
        System.out.printf(Locale.ROOT, "| %s | %d | %d | %d | %d | %d | %d |   (%.1f s)%n", name, seeds, right, listed,
                unlisted, wrong, none, (System.nanoTime() - t0) / 1e9);
    }
}
