package org.twinlight.timing.period;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * Injection tests of the period decision over noise seeds, at a size that runs in seconds; the large
 * versions are in {@code org.twinlight.bench.PeriodDecisionBench} with their figures in
 * docs/period-search.md. The rule under test is the first principle of the tool: a period is reported as
 * confident only when it is right (within 5σ of the period injected, common practice, no source); when the
 * data cannot decide, the verdict is ambiguous and the true period is among the candidates listed.
 */
class PeriodDecisionInjectionTest {

    private static PeriodSearchResult search(PeriodScenarios.Case c) {
        return PeriodSearch.search(c.lightCurve(), PeriodSearchSettings.defaults());
    }

    /** True when the period reported, or (for an ambiguity) one of the alternatives, is the truth. */
    static boolean truthListed(PeriodSearchResult r, double truth) {
        List<Double> all = new ArrayList<>(r.decision().alternativesDays());
        all.add(r.periodDays());
        return all.stream().anyMatch(p -> Math.abs(p - truth) <= Math.max(5 * r.periodUncertaintyDays() * p
                / r.periodDays(), 1e-3 * p));
    }

    /** Right within 5σ when confident; the truth among the candidates when ambiguous. */
    static boolean neverConfidentlyWrong(PeriodSearchResult r, double truth) {
        if (r.decision().confident()) {
            return Math.abs(r.periodDays() - truth) <= 5 * r.periodUncertaintyDays();
        }
        return truthListed(r, truth);
    }

    @Test
    void exactTwinsAreAmbiguousBetweenPAndTwiceP() {
        // Equal stars in a circular orbit: two identical eclipses per orbit look exactly like one eclipse per
        // orbit at half the period. The claim: ambiguous in ≥ 95 % of seeds (here all 12), never a
        // difference between alternate eclipses invented by the way the points fall.
        int ambiguous = 0;
        for (long seed = 1; seed <= 12; seed++) {
            PeriodScenarios.Case c = PeriodScenarios.twins(seed, 800, 10);
            PeriodSearchResult r = search(c);
            if (r.decision().status() == PeriodDecision.Status.AMBIGUOUS) {
                ambiguous++;
            }
            assertThat(truthListed(r, c.truePeriodDays())).as("seed %d: %s", seed, r.decision().headline()).isTrue();
            List<Double> listed = new ArrayList<>(r.decision().alternativesDays());
            listed.add(r.periodDays());
            assertThat(listed).as("seed %d", seed).anyMatch(p -> Math.abs(p - c.truePeriodDays() / 2) < 1e-3 * p);
        }
        assertThat(ambiguous).isEqualTo(12);
    }

    @Test
    void anEccentricOrbitIsRightOrAmbiguousInEverySeed() {
        // P = 4.6123 d, e = 0.32, ω = 35°: the secondary near phase 0.668 once made 2P/3 look "confirmed".
        for (long seed = 1; seed <= 6; seed++) {
            PeriodScenarios.Case c = PeriodScenarios.eccentric(seed, 10);
            PeriodSearchResult r = search(c);
            assertThat(neverConfidentlyWrong(r, c.truePeriodDays())).as("seed %d: %s ± %s", seed,
                    r.decision().headline(), r.periodUncertaintyDays()).isTrue();
        }
    }

    @Test
    void oneVisibleEclipsePerOrbitIsReportedAtPWithTheSecondaryNotSeen() {
        for (long seed = 1; seed <= 3; seed++) {
            PeriodScenarios.Case c = PeriodScenarios.oneEclipsePerOrbit(seed, 10);
            PeriodSearchResult r = search(c);
            assertThat(r.decision().confident()).as("seed %d: %s", seed, r.decision().evidence()).isTrue();
            assertThat(Math.abs(r.periodDays() - c.truePeriodDays())).isLessThanOrEqualTo(
                    5 * r.periodUncertaintyDays());
            assertThat(r.decision().notes()).anyMatch(n -> n.contains("secondary eclipse is not seen"));
        }
    }

    @Test
    void sparseSurveySamplingIsSearchedFromTheFloorAndRecovered() {
        // ~250 points a season, three seasons: the search starts at the default floor of 0.2 d whatever the
        // median spacing, and finds the 3.17-d binary.
        PeriodScenarios.Case c = PeriodScenarios.sparseSurvey(1, 250);
        PeriodSearchResult r = search(c);
        assertThat(r.search().minPeriodDays()).isEqualTo(PeriodSearch.DEFAULT_MIN_PERIOD_DAYS);
        assertThat(Math.abs(r.periodDays() - c.truePeriodDays())).as(r.decision().headline())
                .isLessThanOrEqualTo(5 * r.periodUncertaintyDays());
    }

    @Test
    void aLongPeriodWithPhaseHalfNeverObservedIsAmbiguousAndSaysWhereToLook() {
        PeriodScenarios.Case c = PeriodScenarios.longPeriodNoHalfPhase(1);
        PeriodSearchResult r = search(c);
        assertThat(r.decision().status()).isEqualTo(PeriodDecision.Status.AMBIGUOUS);
        assertThat(truthListed(r, c.truePeriodDays())).as(r.decision().headline()).isTrue();
        assertThat(r.decision().toSettle()).isNotEmpty().allMatch(s -> s.startsWith("observe"));
        assertThat(r.decision().evidence()).noneMatch(e -> e.contains("agree within 0.0σ"));
    }

    @Test
    void nearEqualGrazingEclipsesFromGroundNightsAreNeverConfidentlyWrong() {
        for (long seed = 1; seed <= 2; seed++) {
            PeriodScenarios.Case c = PeriodScenarios.groundGrazing(seed);
            PeriodSearchResult r = search(c);
            assertThat(neverConfidentlyWrong(r, c.truePeriodDays())).as("seed %d: %s", seed,
                    r.decision().headline()).isTrue();
        }
    }

    @Test
    void clearlyUnequalEclipsesOverTwoToFiveCyclesAreNeverConfidentAtTwiceThePeriod() {
        // Two cycles covered and a cadence that is nearly a whole fraction of 2P once excluded the true P
        // (the slope of a steep eclipse across a phase bin counted as dispersion) and called 2P, with four
        // eclipses folded on it, confident. Short space-like and ground-like runs, 10–30 min cadence.
        double[][] runs = {{1.174, 5, 20, 0}, {1.174, 5, 10, 0}, {0.85, 3, 30, 0}, {1.55, 6, 20, 0},
            {1.174, 6, 10, 1}, {1.32, 6, 20, 1}};
        for (double[] run : runs) {
            for (long seed = 3; seed <= 4; seed++) {
                PeriodScenarios.Case c = PeriodScenarios.shortUnequal(seed, run[0], run[1], run[2], run[3] > 0);
                PeriodSearchResult r = search(c);
                // The claim here is the cycle count: a confident period is the true one, not a multiple or a
                // fraction (within 0.1 %); its error bar over so few cycles is a separate claim (see
                // docs/period-search.md, short runs).
                boolean rightCycle = r.decision().confident()
                        ? Math.abs(r.periodDays() - c.truePeriodDays()) <= 1e-3 * c.truePeriodDays()
                        : truthListed(r, c.truePeriodDays());
                assertThat(rightCycle).as("%s P %.3f, %.0f d at %.0f min, seed %d:"
                        + " %s ± %s", c.name(), run[0], run[1], run[2], seed, r.decision().headline(),
                        r.periodUncertaintyDays()).isTrue();
            }
        }
    }

    @Test
    void overTwoToFiveCyclesTheErrorBarHoldsAndFewTimingsCarryACaution() {
        // P = 1.174 d over 5, 3 and 2.5 days at 10 minutes: 4, 3 and 2 primary eclipses timed. A trapezoid
        // template once put 28 of 48 confident periods of the 5-day run beyond 5σ (its shape mismatch made
        // each timing depend on where the points fell, and the sampling drifts by a fraction of a cadence
        // each cycle); the claim is now that every confident period lies within 5σ of the truth (common
        // practice, no source), and that a period from at most three timings carries a caution naming the
        // next minimum to observe.
        double[][] runs = {{5, 1}, {5, 2}, {5, 3}, {3, 1}, {3, 2}, {2.5, 1}};
        for (double[] run : runs) {
            PeriodScenarios.Case c = PeriodScenarios.shortUnequal((long) run[1], 1.174, run[0], 10, false);
            PeriodSearchResult r = search(c);
            String what = String.format(java.util.Locale.ROOT, "%.1f d, seed %.0f: %s ± %s (%s)", run[0], run[1],
                    r.decision().headline(), r.periodUncertaintyDays(), r.uncertaintyMethod());
            assertThat(r.decision().confident()).as(what).isTrue();
            assertThat(Math.abs(r.periodDays() - c.truePeriodDays())).as(what)
                    .isLessThanOrEqualTo(5 * r.periodUncertaintyDays());
            int timings = r.candidates().stream().map(PeriodCandidate::refined)
                    .filter(p -> p.periodDays() == r.periodDays()).mapToInt(RefinedPeriod::timings).findFirst()
                    .orElseThrow();
            assertThat(timings).as(what).isEqualTo(run[0] == 5 ? 4 : run[0] == 3 ? 3 : 2);
            if (timings <= RefinedPeriod.FEW_TIMINGS) {
                assertThat(r.periodCaution()).as(what).hasValueSatisfying(n -> assertThat(n)
                        .startsWith("only " + timings + " eclipses timed").contains("observe the next primary minimum"));
            } else {
                assertThat(r.periodCaution()).as(what).isEmpty();
            }
        }
    }

    @Test
    void noiseAloneIsRarelyCalledAConfidentPeriod() {
        // The false-alarm claim: at most 5 % of noise-only light curves give a confident period (here at
        // most 1 of 20).
        int confident = 0;
        for (long seed = 1; seed <= 20; seed++) {
            PeriodSearchResult r = search(PeriodScenarios.noiseOnly(seed));
            confident += r.decision().confident() ? 1 : 0;
        }
        assertThat(confident).isLessThanOrEqualTo(1);
    }
}
