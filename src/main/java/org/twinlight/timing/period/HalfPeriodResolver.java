package org.twinlight.timing.period;

import java.util.Locale;

/**
 * Chooses between the periodogram's period P and 2P (see {@link HalfPeriodVerdict}) and identifies the
 * primary and secondary eclipses at the chosen period.
 */
final class HalfPeriodResolver {

    /** The chosen period with its primary dip (phases from the data's reference time) and the secondary's place. */
    record Resolution(double periodDays, FoldedEclipses.Dip primary, Double secondaryPhase, double secondaryWidth,
            HalfPeriodCheck check) {
    }

    private HalfPeriodResolver() {
    }

    static Resolution noDetection(double blsPeriod, FoldedEclipses.Dip primary) {
        HalfPeriodCheck check = new HalfPeriodCheck(HalfPeriodVerdict.NO_DETECTION, blsPeriod, 2 * blsPeriod, 0,
                PeriodSearch.SECONDARY_SNR, null, null, Double.NaN, Double.NaN, Double.NaN, Double.NaN,
                PeriodSearch.ODD_EVEN_SIGMA, "no significant eclipse signal, so P and 2P were not compared");
        return new Resolution(blsPeriod, primary, null, Double.NaN, check);
    }

    /**
     * @param fold the data folded at P, phase 0 at {@code ref}
     * @param prim the dip of the periodogram's best box, refined, folded at P
     */
    static Resolution resolve(double[] t, double[] x, FoldedEclipses fold, FoldedEclipses.Dip prim, double ref,
            double[] durations) {
        double p = fold.periodDays();
        FoldedEclipses.Dip other = fold.search(durations, prim);
        double otherSnr = other == null ? 0 : other.signalToNoise();
        // One targeted trial at phase 0.5 (where a circular orbit puts the secondary) needs less evidence
        // than the best of all phases, which carries the look-elsewhere effect.
        FoldedEclipses.Dip half = fold.measure(FoldedEclipses.wrap(prim.centre() + 0.5), prim.width(), prim);
        if (half.signalToNoise() >= PeriodSearch.TARGETED_SECONDARY_SNR
                && (other == null || otherSnr < PeriodSearch.SECONDARY_SNR)) {
            other = fold.refine(half, prim);
            otherSnr = Math.max(half.signalToNoise(), other.signalToNoise());
        }
        // A second dip must lie clear of the first: a refined box that slid into the wing of a wide
        // primary (a close pair folded at half its period) is the same eclipse.
        boolean clear = other != null && FoldedEclipses.distance(other.centre(), prim.centre())
                >= 0.5 * (prim.width() + other.width());
        boolean found = clear && (otherSnr >= PeriodSearch.SECONDARY_SNR
                || half.signalToNoise() >= PeriodSearch.TARGETED_SECONDARY_SNR);
        if (!clear) {
            otherSnr = 0; // nothing clear of the first eclipse
        }
        if (found) {
            // The periodogram's dip measured again with the other eclipse left out of its level.
            FoldedEclipses.Dip first = fold.measure(prim.centre(), prim.width(), other);
            FoldedEclipses.Dip primary = first.coreDepth() >= other.coreDepth() ? first : other;
            FoldedEclipses.Dip secondary = primary == first ? other : first;
            double phase = FoldedEclipses.wrap(secondary.centre() - primary.centre());
            String why = String.format(Locale.ROOT,
                    "a second eclipse (depth S/N %.1f; needed %.1f anywhere or %.1f at phase 0.5) shows at phase %.4f"
                            + " when folded at P = %.8g d, so P is the orbital period", otherSnr,
                    PeriodSearch.SECONDARY_SNR, PeriodSearch.TARGETED_SECONDARY_SNR, phase, p);
            HalfPeriodCheck check = new HalfPeriodCheck(HalfPeriodVerdict.SECONDARY_AT_BLS_PERIOD, p, 2 * p, otherSnr,
                    PeriodSearch.SECONDARY_SNR, null, null, Double.NaN, Double.NaN, Double.NaN, Double.NaN,
                    PeriodSearch.ODD_EVEN_SIGMA, why);
            return new Resolution(p, primary, phase, secondary.width(), check);
        }

        FoldedEclipses fold2 = new FoldedEclipses(t, x, 2 * p, ref);
        FoldedEclipses.Dip odd0 = fold2.measure(prim.centre() / 2, prim.width() / 2);
        FoldedEclipses.Dip even0 = fold2.measure(FoldedEclipses.wrap(prim.centre() / 2 + 0.5), prim.width() / 2);
        FoldedEclipses.Dip odd = fold2.refine(fold2.measure(odd0.centre(), odd0.width(), even0), even0);
        FoldedEclipses.Dip even = fold2.refine(fold2.measure(even0.centre(), even0.width(), odd), odd);
        // Compare like with like: both boxes get the same width, each at its own centre (refining the
        // widths separately would let noise pick different widths and so different box depths).
        double common = 0.5 * (odd.width() + even.width());
        FoldedEclipses.Dip oddFinal = fold2.measure(odd.centre(), common, even);
        even = fold2.measure(even.centre(), common, oddFinal);
        odd = fold2.measure(odd.centre(), common, even);
        // Depths are compared at minimum (inner half of each box), where the level is flat and does not
        // depend on small errors of the centre or width.
        double depthSigma = Math.abs(odd.coreDepth() - even.coreDepth())
                / Math.hypot(odd.coreDepthError(), even.coreDepthError());
        double durationSigma = Math.abs(odd.duration() - even.duration())
                / Math.hypot(odd.durationError(), even.durationError());
        if (!Double.isFinite(durationSigma)) {
            durationSigma = 0;
        }
        // Centres: a box edge moved by δ changes the depth by about 2δ·depth/width, so the centre's error is
        // about width/(2·S/N); the refinement's own step (width/40) sets a floor, so an offset must also
        // exceed a tenth of the width.
        double offset = Math.abs(FoldedEclipses.wrap(even.centre() - odd.centre()) - 0.5);
        double offsetError = Math.hypot(common / (2 * Math.max(odd.signalToNoise(), 1e-9)),
                common / (2 * Math.max(even.signalToNoise(), 1e-9)));
        double offsetSigma = offset / offsetError;
        boolean shifted = offsetSigma >= PeriodSearch.ODD_EVEN_SIGMA && offset >= 0.1 * common;
        FoldedEclipses.Dip primary = odd.coreDepth() >= even.coreDepth() ? odd : even;
        FoldedEclipses.Dip secondary = primary == odd ? even : odd;
        double phase = FoldedEclipses.wrap(secondary.centre() - primary.centre());
        EclipseEvent oddEvent = odd.toEvent(odd.centre());
        EclipseEvent evenEvent = even.toEvent(odd.centre());
        boolean differ = depthSigma >= PeriodSearch.ODD_EVEN_SIGMA || durationSigma >= PeriodSearch.ODD_EVEN_SIGMA
                || shifted;
        HalfPeriodVerdict verdict;
        String why;
        if (differ) {
            verdict = HalfPeriodVerdict.ODD_EVEN_DIFFER;
            why = String.format(Locale.ROOT,
                    "no second eclipse folded at P = %.8g d (best other dip S/N %.1f < %.1f); folded at 2P = %.8g d"
                            + " alternate eclipses differ by %.1fσ in depth and %.1fσ in duration, and the second"
                            + " lies %.4f from phase 0.5 (%.1fσ) (threshold %.1fσ), so 2P is the orbital period", p,
                    otherSnr, PeriodSearch.SECONDARY_SNR, 2 * p, depthSigma, durationSigma, offset, offsetSigma,
                    PeriodSearch.ODD_EVEN_SIGMA);
        } else {
            verdict = HalfPeriodVerdict.EQUAL_ECLIPSES_AMBIGUOUS;
            why = String.format(Locale.ROOT,
                    "AMBIGUOUS: folded at 2P = %.8g d alternate eclipses agree within %.1fσ in depth and %.1fσ in"
                            + " duration, and the second lies at phase %.4f; no other eclipse shows folded at"
                            + " P = %.8g d. Two equal eclipses per orbit at 2P cannot be told from one visible eclipse"
                            + " per orbit at P by photometry alone (a detached binary of two equal stars in a circular"
                            + " orbit looks exactly like this). 2P is reported because an eclipsing binary shows two"
                            + " eclipses per orbit; radial velocities or colour changes between eclipses can decide",
                    2 * p, depthSigma, durationSigma, phase, p);
        }
        HalfPeriodCheck check = new HalfPeriodCheck(verdict, p, 2 * p, otherSnr, PeriodSearch.SECONDARY_SNR,
                oddEvent, evenEvent, depthSigma, durationSigma, offset, offsetSigma, PeriodSearch.ODD_EVEN_SIGMA, why);
        return new Resolution(2 * p, primary, phase, secondary.width(), check);
    }
}
