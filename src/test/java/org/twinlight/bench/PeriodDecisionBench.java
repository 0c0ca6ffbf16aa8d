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
        if (args.length > 1 && args[1].equals("short")) {
            shortRuns(seeds);
            return;
        }
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

    /**
     * Unequal eclipses over short runs (2–5 cycles): P = 1.174 d over 5 d at 10, 20 and 30 min, and a few
     * other periods, space-like and ground nights; the table gives the wrong-cycle confident verdicts
     * separately from the right cycle with too small an error bar.
     */
    private static void shortRuns(int seeds) {
        System.out.printf(Locale.ROOT, "| case | seeds | confident, right (5σ) | confident, right cycle, outside 5σ |"
                + " ambiguous, truth listed | ambiguous, truth not listed | confident, WRONG CYCLE |"
                + " not significant | period with a caution | largest pull |%n|---|---|---|---|---|---|---|---|---|---|%n");
        double[][] runs = {{1.174, 5, 10, 0}, {1.174, 5, 20, 0}, {1.174, 5, 30, 0}, {0.85, 3, 20, 0},
            {1.55, 6, 20, 0}, {1.174, 3, 10, 0}, {1.174, 2.5, 10, 0}, {1.174, 6, 10, 1}, {1.32, 6, 20, 1},
            {1.05, 4, 30, 1}};
        for (double[] run : runs) {
            String name = String.format(Locale.ROOT, "%s P = %.3f d, %s d at %.0f min",
                    run[3] > 0 ? "ground nights" : "continuous", run[0], run[1] % 1 == 0 ? String.format(Locale.ROOT, "%.0f", run[1]) : String.valueOf(run[1]), run[2]);
            Tally t = Tally.over(name, seeds, s -> PeriodScenarios.shortUnequal(s, run[0], run[1], run[2], run[3] > 0));
            System.out.printf(Locale.ROOT, "| %s | %d | %d | %d | %d | %d | %d | %d | %d | %.1f |   (%.1f s)%n", name,
                    seeds, t.right, t.rightCycleOutside, t.listed, t.unlisted, t.wrongCycle, t.none, t.cautioned,
                    t.largestPull, t.seconds);
        }
    }

    private static void run(String name, int seeds, LongFunction<PeriodScenarios.Case> make) {
        Tally t = Tally.over(name, seeds, make);
        System.out.printf(Locale.ROOT, "| %s | %d | %d | %d | %d | %d | %d |   (%.1f s)%n", name, seeds, t.right,
                t.listed, t.unlisted, t.wrongCycle + t.rightCycleOutside, t.none, t.seconds);
    }

    /** Verdicts over seeds by kind; a confident period within 0.1 % of the truth but outside 5σ is counted apart. */
    private static final class Tally {
        int right;
        int rightCycleOutside;
        int listed;
        int unlisted;
        int wrongCycle;
        int none;
        int cautioned;
        /** Largest |found − true|/σ among the confident periods of the right cycle. */
        double largestPull;
        double seconds;

        static Tally over(String name, int seeds, LongFunction<PeriodScenarios.Case> make) {
            Tally t = new Tally();
            long t0 = System.nanoTime();
            for (long seed = 1; seed <= seeds; seed++) {
                PeriodScenarios.Case c = make.apply(seed);
                t.add(name, seed, c.truePeriodDays(), PeriodSearch.search(c.lightCurve(),
                        PeriodSearchSettings.defaults()));
            }
            t.seconds = (System.nanoTime() - t0) / 1e9;
            return t;
        }

        private void add(String name, long seed, double truth, PeriodSearchResult r) {
            PeriodDecision d = r.decision();
            cautioned += r.periodCaution().isPresent() ? 1 : 0;
            if (d.confident() && Math.abs(r.periodDays() - truth) <= 1e-3 * truth) {
                largestPull = Math.max(largestPull, Math.abs(r.periodDays() - truth) / r.periodUncertaintyDays());
            }
            if (d.status() == PeriodDecision.Status.NOT_SIGNIFICANT) {
                none++;
            } else if (Double.isNaN(truth)) {
                wrongCycle += d.confident() ? 1 : 0;
                unlisted += d.confident() ? 0 : 1;
            } else if (d.confident()) {
                double off = Math.abs(r.periodDays() - truth);
                if (off <= 5 * r.periodUncertaintyDays()) {
                    right++;
                    return;
                }
                System.err.printf(Locale.ROOT, "%s seed %d: confident %.8f ± %.2g, truth %.8f%n", name, seed,
                        r.periodDays(), r.periodUncertaintyDays(), truth);
                if (off <= 1e-3 * truth) {
                    rightCycleOutside++;
                } else {
                    wrongCycle++;
                }
            } else {
                boolean found = Math.abs(r.periodDays() - truth) <= Math.max(5 * r.periodUncertaintyDays(), 1e-3 * truth)
                        || d.alternativesDays().stream().anyMatch(p -> Math.abs(p - truth) < 1e-3 * p);
                listed += found ? 1 : 0;
                unlisted += found ? 0 : 1;
            }
        }
    }
}
