package org.twinlight.timing.period;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import java.util.TreeSet;
import org.twinlight.time.CalendarDate;

/**
 * The half-period resolution and the verdict, from the candidates compared on the same footing.
 *
 * <ol>
 * <li>Pₛ, the shortest coherent candidate: the data folded at a true period are coherent, and at every
 * multiple of it, so the orbital period is Pₛ or a multiple.</li>
 * <li>A coherent candidate that is not a multiple of Pₛ means the data do not cover the times where the
 * two disagree: ambiguous.</li>
 * <li>Coverage: when every eclipse the data cover falls on cycles of Pₛ that share a factor g &gt; 1, the
 * period g·Pₛ explains the data as well (phases with no data are unknown, never "agree"): ambiguous.</li>
 * <li>A second, distinct eclipse folded at Pₛ: Pₛ is the orbital period (2Pₛ would need four eclipses an
 * orbit).</li>
 * <li>Otherwise alternate eclipses are compared at 2Pₛ ({@link AlternateEclipses}): a significant
 * difference in depth, width or time means 2Pₛ. No difference: an eclipse with a clearly flat bottom
 * (fitted ingress under {@link #FLAT_BOTTOM_INGRESS} of the half width) is a smaller star fully in front
 * of a larger one, whose other conjunction would be an occultation of another shape, so Pₛ with the
 * secondary not seen; a V-shaped eclipse may be either, so the verdict is ambiguous between Pₛ and 2Pₛ.</li>
 * </ol>
 */
final class PeriodDecider {
    /**
     * Fitted trapezoid ingress, fraction of the half width, below which an eclipse has a flat bottom. Two
     * spheres of radius ratio k crossing centrally have ingress/half-width = 2k/(1 + k) (contacts at
     * r₁ ± r₂ from the centre; Winn 2010, in Exoplanets, ed. Seager, Eqs. 14–15 for T and τ): 1 for equal
     * stars, 0.7 for k = 0.54; a trapezoid fitted to equal limb-darkened stars gives about 0.8.
     */
    static final double FLAT_BOTTOM_INGRESS = 0.7;
    /** Depth S/N the primary needs before its shape is trusted (common practice, no source). */
    static final double SHAPE_SNR = 30;
    /** Most alternatives listed. */
    static final int MAX_ALTERNATIVES = 6;

    private PeriodDecider() {
    }

    /** The verdict and what it rests on. */
    record Outcome(PeriodDecision decision, PeriodCandidate shortest, OddEvenComparison oddEven,
            SecondaryEclipse secondaryAtShortest) {
    }

    static Outcome decide(SearchData data, SearchRange range, CandidateComparison.Comparison comparison,
            double[] durations) {
        List<PeriodCandidate> candidates = comparison.candidates();
        List<PeriodCandidate> coherent = candidates.stream().filter(PeriodCandidate::consistent)
                .sorted(Comparator.comparingDouble(PeriodCandidate::periodDays)).toList();
        if (coherent.isEmpty()) {
            coherent = List.of(candidates.stream().min(Comparator.comparingDouble(PeriodCandidate::pdmTheta))
                    .orElseThrow());
        }
        PeriodCandidate shortest = coherent.get(0);
        RefinedPeriod ps = shortest.refined();
        double p = ps.periodDays();
        double relTolerance = Math.max(ps.widthPhase() * p / data.baselineDays(), 5 * ps.periodErrorDays() / p);
        List<String> evidence = new ArrayList<>();
        List<String> notes = new ArrayList<>();
        for (PeriodCandidate c : candidates) {
            evidence.add(String.format(Locale.ROOT, "P = %.8g d (%s, SDE %.1f): %s — %s", c.periodDays(),
                    c.relation(), c.sde(), c.consistent() ? "coherent" : "EXCLUDED", c.assessment()));
        }
        List<Double> unrelated = new ArrayList<>();
        for (PeriodCandidate c : coherent) {
            if (shortest.divides(c.periodDays(), relTolerance)) {
                continue;
            }
            // Coherent at Pₛ and at X = (n/m)·Pₛ means periodic with Pₛ/m; if the data folded at Pₛ/m are not
            // coherent, X only looked coherent (its mixing was too little to show) and is no alternative.
            int m = denominator(c.periodDays() / p, relTolerance);
            if (m > 1) {
                CandidateComparison.Coherence.Judgement implied = comparison.coherence().judge(p / m);
                if (!implied.coherent()) {
                    evidence.add(String.format(Locale.ROOT, "P = %.8g d = %d/%d × %.8g d would make the data periodic"
                            + " with %.8g d, which they are not (%s): not an alternative", c.periodDays(),
                            Math.round(c.periodDays() / p * m), m, p, p / m, implied.text()));
                    continue;
                }
            }
            unrelated.add(c.periodDays());
        }
        int g = coveredCycleFactor(data, ps);
        SecondaryEclipse sec = SecondaryEclipse.find(data, p, ps.epochDays(), ps.widthPhase(), durations);
        double lastTime = data.timesDays()[data.size() - 1];

        if (g > 1 || !unrelated.isEmpty()) {
            List<Double> alternatives = new ArrayList<>();
            double value = p;
            if (g > 1) {
                value = g * p;
                evidence.add(String.format(Locale.ROOT, "every eclipse the data cover falls on cycles of P = %.8g d"
                        + " that are multiples of %d: P = %.8g d explains the data as well, and the cycles in"
                        + " between have no data (unknown, not \"no eclipse\")", p, g, g * p));
                for (int d = 1; d < g && alternatives.size() < MAX_ALTERNATIVES; d++) {
                    if (g % d == 0) {
                        alternatives.add(d * p);
                    }
                }
            }
            if (!unrelated.isEmpty()) {
                evidence.add(String.format(Locale.ROOT, "coherent candidates that are not multiples of P = %.8g d:"
                        + " %s; the data do not cover the times where they disagree", p, list(unrelated)));
                for (double u : unrelated) {
                    if (alternatives.size() < MAX_ALTERNATIVES && Math.abs(u - value) > relTolerance * value) {
                        alternatives.add(u);
                    }
                }
            }
            if (!sec.found() && alternatives.stream().noneMatch(a -> Math.abs(a - 2 * p) <= relTolerance * 2 * p)
                    && Math.abs(value - 2 * p) > relTolerance * 2 * p && alternatives.size() < MAX_ALTERNATIVES) {
                evidence.add(sec.describe(p) + ": P and 2P are not told apart either");
                alternatives.add(2 * p);
            }
            List<String> settle = new ArrayList<>();
            for (double alt : alternatives) {
                double shorter = Math.min(alt, value);
                double longer = Math.max(alt, value);
                settle.add(String.format(Locale.ROOT, "observe %s: P = %.8g d predicts an eclipse then and"
                        + " P = %.8g d does not", when(nextUnshared(ps.epochDays(), shorter, longer, lastTime,
                                ps.widthPhase() * p)), shorter, longer));
            }
            edgeNotes(range, value, alternatives, notes);
            return new Outcome(PeriodDecision.ambiguous(value, alternatives, evidence, settle, notes), shortest, null,
                    sec);
        }
        if (sec.found()) {
            SecondaryEclipse atHalf = thirdEclipse(data, ps, sec, durations);
            if (atHalf != null) {
                evidence.add(sec.describe(p));
                evidence.add(atHalf.describe(p / 2) + String.format(Locale.ROOT, ", that is at phases %.3f and %.3f"
                        + " of P = %.8g d, clear of both eclipses there: folded at P = %.8g d the data show more than"
                        + " two eclipses, which one orbit of two stars cannot make, so the orbit is P/2 = %.8g d with"
                        + " two different eclipses unless the coherence test excluding it is right", 0.5
                        * atHalf.secondaryPhase(), 0.5 * atHalf.secondaryPhase() + 0.5, p, p, p / 2));
                List<String> settle = List.of(String.format(Locale.ROOT, "observe more cycles (the eclipse at phase"
                        + " 0.5 of P = %.8g d is %s): if P/2 = %.8g d is right, the eclipses at phases 0 and 0.5 of P"
                        + " are the same eclipse, with the same depth, width and time; if not, they differ", p,
                        when(nextPhase(ps.epochDays(), p, 0.5, lastTime)), p / 2));
                edgeNotes(range, p / 2, List.of(p), notes);
                return new Outcome(PeriodDecision.ambiguous(p / 2, List.of(p), evidence, settle, notes), shortest,
                        null, sec);
            }
            evidence.add(sec.describe(p) + ", so P is the orbital period (2P would need four eclipses an orbit)");
            edgeNotes(range, p, List.of(), notes);
            return new Outcome(PeriodDecision.confident(p, evidence, notes), shortest, null, sec);
        }
        evidence.add(sec.describe(p));
        OddEvenComparison oe = AlternateEclipses.compare(data, ps);
        evidence.add(oe.describe());
        double halfTime = nextPhase(ps.epochDays(), 2 * p, 0.5, lastTime);
        if (!oe.covered()) {
            List<String> settle = List.of(String.format(Locale.ROOT, "observe phase 0.5 of P = %.8g d, %s, and"
                    + " compare the eclipse there with the one at phase 0", 2 * p, when(halfTime)));
            edgeNotes(range, 2 * p, List.of(p), notes);
            return new Outcome(PeriodDecision.ambiguous(2 * p, List.of(p), evidence, settle, notes), shortest, oe,
                    sec);
        }
        if (oe.differ()) {
            evidence.add(String.format(Locale.ROOT, "alternate eclipses differ, so P = %.8g d is the orbital period",
                    2 * p));
            edgeNotes(range, 2 * p, List.of(), notes);
            return new Outcome(PeriodDecision.confident(2 * p, evidence, notes), shortest, oe, sec);
        }
        boolean flat = ps.ingressFraction() < FLAT_BOTTOM_INGRESS && sec.primary().signalToNoise() >= SHAPE_SNR;
        if (flat) {
            evidence.add(String.format(Locale.ROOT, "the eclipse has a flat bottom (fitted ingress %.2f of the half"
                    + " width < %.2f): a smaller star fully in front of a larger one; two identical eclipses an orbit"
                    + " would need the other conjunction, an occultation, to look the same, so P = %.8g d",
                    ps.ingressFraction(), FLAT_BOTTOM_INGRESS, p));
            notes.add(String.format(Locale.ROOT, "the secondary eclipse is not seen: at phase 0.5 its depth is below"
                    + " %.2g (3σ), and it may lie elsewhere in an eccentric orbit", sec.halfPhaseDepthLimit()));
            edgeNotes(range, p, List.of(), notes);
            return new Outcome(PeriodDecision.confident(p, evidence, notes), shortest, oe, sec);
        }
        evidence.add(String.format(Locale.ROOT, "the eclipse is V-shaped (fitted ingress %.2f of the half width):"
                + " two equal eclipses an orbit at P = %.8g d (equal stars) cannot be told from one visible eclipse an"
                + " orbit at P = %.8g d by photometry alone", ps.ingressFraction(), 2 * p, p));
        List<String> settle = List.of(
                "radial velocities: two equal eclipses an orbit mean two equal stars, a double-lined spectrum with"
                        + " K1 ≈ K2",
                String.format(Locale.ROOT, "colours or deeper photometry at phase 0.5 of P = %.8g d (%s): a shallow"
                        + " secondary there means P = %.8g d", p, when(nextPhase(ps.epochDays(), p, 0.5, lastTime)),
                        p));
        edgeNotes(range, 2 * p, List.of(p), notes);
        return new Outcome(PeriodDecision.ambiguous(2 * p, List.of(p), evidence, settle, notes), shortest, oe, sec);
    }

    /**
     * A second eclipse of the data folded at P/2 that lies, in the fold at P, clear of both the primary and
     * the secondary found there; null when there is none. Two stars make at most two eclipses an orbit: a
     * third one at P means P is not the orbital period, and eclipses at phases 0, ¼, ½ and ¾ of P are the
     * two eclipses of P/2 seen twice. This happens when P/2 was excluded by the coherence test only because
     * of how the cadence falls on it (with two or three cycles covered, the points of the cycles land on
     * nearly the same phases at P and half a cadence apart at P/2, and the slope of a steep eclipse across
     * a phase bin counts as dispersion).
     */
    static SecondaryEclipse thirdEclipse(SearchData data, RefinedPeriod ps, SecondaryEclipse sec,
            double[] durations) {
        double p = ps.periodDays();
        if (p / 2 < data.resolutionDays() * 4) {
            return null;
        }
        SecondaryEclipse half = SecondaryEclipse.find(data, p / 2, ps.epochDays(),
                Math.min(0.5, 2 * ps.widthPhase()), durations);
        if (!half.found()) {
            return null;
        }
        double secPhase = sec.secondaryPhase();
        double halfWidthAtP = 0.5 * (sec.secondary().width() + 0.5 * half.secondary().width());
        double primaryWidthAtP = 0.5 * (sec.primary().width() + 0.5 * half.secondary().width());
        for (double phaseAtP : new double[] {0.5 * half.secondaryPhase(), 0.5 * half.secondaryPhase() + 0.5}) {
            if (FoldedEclipses.distance(phaseAtP, secPhase) < halfWidthAtP
                    || FoldedEclipses.distance(phaseAtP, 0) < primaryWidthAtP) {
                return null;
            }
        }
        return half;
    }

    /** The smallest m ≤ 12 with ratio ≈ n/m for an integer n (relative tolerance), else 0. */
    static int denominator(double ratio, double relTolerance) {
        for (int m = 1; m <= 12; m++) {
            double n = Math.rint(ratio * m);
            if (n >= 1 && Math.abs(ratio * m - n) <= relTolerance * ratio * m) {
                return m;
            }
        }
        return 0;
    }

    private static void edgeNotes(SearchRange range, double value, List<Double> alternatives, List<String> notes) {
        TreeSet<Double> all = new TreeSet<>(alternatives);
        all.add(value);
        range.edgeNote(all.first()).ifPresent(notes::add);
        if (all.last() != all.first()) {
            range.edgeNote(all.last()).ifPresent(n -> {
                if (!notes.contains(n)) {
                    notes.add(n);
                }
            });
        }
    }

    /**
     * The largest g such that every cycle of {@code ps} whose eclipse core has data is a multiple of g from
     * the first; 1 when fewer than two cycles are covered.
     */
    static int coveredCycleFactor(SearchData data, RefinedPeriod ps) {
        TreeSet<Long> cycles = new TreeSet<>();
        double[] t = data.timesDays();
        for (double ti : t) {
            double e = (ti - ps.epochDays()) / ps.periodDays();
            long c = Math.round(e);
            if (Math.abs(e - c) < 0.25 * ps.widthPhase()) {
                cycles.add(c);
            }
        }
        if (cycles.size() < 2) {
            return 1;
        }
        long first = cycles.first();
        long g = 0;
        for (long c : cycles) {
            g = gcd(g, c - first);
        }
        return (int) Math.min(Integer.MAX_VALUE, Math.max(1, g));
    }

    private static long gcd(long a, long b) {
        return b == 0 ? Math.abs(a) : gcd(b, a % b);
    }

    /** First time after {@code after} at the given phase of the period. */
    static double nextPhase(double epoch, double period, double phase, double after) {
        double n = Math.ceil((after - epoch) / period - phase);
        return epoch + (n + phase) * period;
    }

    /** First eclipse of the shorter period after {@code after} that the longer one does not predict. */
    static double nextUnshared(double epoch, double shorter, double longer, double after, double durationDays) {
        double n = Math.ceil((after - epoch) / shorter);
        for (int k = 0; k < 100_000; k++) {
            double t = epoch + (n + k) * shorter;
            double e = (t - epoch) / longer;
            if (Math.abs(e - Math.round(e)) * longer > durationDays) {
                return t;
            }
        }
        return Double.NaN;
    }

    /** A time for people: the value in the data's time scale and, when it looks like a Julian date, the date. */
    static String when(double t) {
        if (!Double.isFinite(t)) {
            return "at a time not found within 100000 cycles";
        }
        if (t > 2_000_000 && t < 3_000_000) {
            CalendarDate d = CalendarDate.fromJulianDay(t);
            return String.format(Locale.ROOT, "next at %.4f (%04d-%02d-%02d)", t, d.year(), d.month(),
                    (int) Math.floor(d.day()));
        }
        return String.format(Locale.ROOT, "next at %.4f", t);
    }

    private static String list(List<Double> periods) {
        StringBuilder b = new StringBuilder();
        for (double v : periods) {
            b.append(b.length() == 0 ? "" : ", ").append(String.format(Locale.ROOT, "%.8g d", v));
        }
        return b.toString();
    }
}
