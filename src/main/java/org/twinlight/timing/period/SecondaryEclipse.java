package org.twinlight.timing.period;

import java.util.Locale;

/**
 * Looks for a second eclipse in the data folded at a period, primary at phase 0: the best dip anywhere
 * clear of the primary (needs S/N ≥ {@link PeriodSearch#SECONDARY_SNR}: many trial phases), or a dip at
 * phase 0.5 where a circular orbit puts it (S/N ≥ {@link PeriodSearch#TARGETED_SECONDARY_SNR}: one trial).
 *
 * @param primary the primary dip (phase 0 at the epoch)
 * @param secondary the second eclipse, or null when none is seen
 * @param bestOtherSnr S/N of the best other dip (0 when there is none clear of the primary)
 * @param halfPhasePoints points in a primary-wide box at phase 0.5
 * @param halfPhaseDepthLimit 3σ upper limit on a dip at phase 0.5, relative flux (NaN without data there)
 * @param redNoiseFactor β on the time scale of an eclipse ({@link SearchData#redNoiseFactor}); the S/N
 *     values are white-noise S/N divided by β
 */
record SecondaryEclipse(FoldedEclipses.Dip primary, FoldedEclipses.Dip secondary, double bestOtherSnr,
        int halfPhasePoints, double halfPhaseDepthLimit, double redNoiseFactor) {

    static SecondaryEclipse find(SearchData data, double periodDays, double epochDays, double widthPhase,
            double[] durations) {
        FoldedEclipses fold = new FoldedEclipses(data.timesDays(), data.flux(), periodDays, epochDays);
        FoldedEclipses.Dip prim = fold.refine(fold.measure(0, widthPhase));
        // Correlated noise (nightly zero points) makes dips of white-noise S/N 3–5 out of nothing: the S/N
        // of a second dip is divided by the red-noise factor on the time scale of an eclipse.
        double beta = data.redNoiseFactor(residualsFromFold(data, periodDays, epochDays, prim.width()),
                prim.width() * periodDays);
        FoldedEclipses.Dip other = fold.search(durations, prim);
        double otherSnr = other == null ? 0 : other.signalToNoise() / beta;
        // One targeted trial at phase 0.5 (where a circular orbit puts the secondary) needs less evidence
        // than the best of all phases, which carries the look-elsewhere effect.
        FoldedEclipses.Dip half = fold.measure(FoldedEclipses.wrap(prim.centre() + 0.5), prim.width(), prim);
        double halfSnr = half.signalToNoise() / beta;
        if (halfSnr >= PeriodSearch.TARGETED_SECONDARY_SNR
                && (other == null || otherSnr < PeriodSearch.SECONDARY_SNR)) {
            other = fold.refine(half, prim);
            otherSnr = Math.max(half.signalToNoise(), other.signalToNoise()) / beta;
        }
        // A second dip must lie clear of the first: a refined box that slid into the wing of a wide
        // primary is the same eclipse.
        boolean clear = other != null && FoldedEclipses.distance(other.centre(), prim.centre())
                >= 0.5 * (prim.width() + other.width());
        boolean found = clear && (otherSnr >= PeriodSearch.SECONDARY_SNR
                || halfSnr >= PeriodSearch.TARGETED_SECONDARY_SNR);
        double limit = Double.isFinite(half.depthError()) ? Math.max(0, half.depth()) + 3 * beta * half.depthError()
                : Double.NaN;
        if (!found) {
            return new SecondaryEclipse(prim, null, clear ? otherSnr : 0, half.pointsIn(), limit, beta);
        }
        // Each eclipse's out-of-eclipse level leaves the other out; the deeper one is the primary.
        FoldedEclipses.Dip first = fold.refine(fold.measure(prim.centre(), prim.width(), other), other);
        FoldedEclipses.Dip second = fold.measure(other.centre(), other.width(), first);
        return new SecondaryEclipse(first, second, otherSnr, half.pointsIn(), limit, beta);
    }

    /**
     * The data minus the mean of their phase bin (bins of a tenth of the eclipse width): what is left when
     * everything periodic at this period (both eclipses, out-of-eclipse variation) is taken out.
     */
    private static double[] residualsFromFold(SearchData data, double periodDays, double epochDays,
            double widthPhase) {
        double[] t = data.timesDays();
        double[] x = data.flux();
        int bins = (int) Math.max(20, Math.min(10 / widthPhase, x.length / 5.0));
        double[] sum = new double[bins];
        int[] count = new int[bins];
        int[] bin = new int[x.length];
        for (int i = 0; i < x.length; i++) {
            bin[i] = Math.min(bins - 1, (int) (FoldedEclipses.wrap((t[i] - epochDays) / periodDays) * bins));
            sum[bin[i]] += x[i];
            count[bin[i]]++;
        }
        double[] r = new double[x.length];
        for (int i = 0; i < x.length; i++) {
            r[i] = x[i] - sum[bin[i]] / count[bin[i]];
        }
        return r;
    }

    boolean found() {
        return secondary != null;
    }

    /** Phase of the secondary after the primary. */
    double secondaryPhase() {
        return FoldedEclipses.wrap(secondary.centre() - primary.centre());
    }

    /** What was seen besides the primary, in words. */
    String describe(double periodDays) {
        if (found()) {
            return String.format(Locale.ROOT, "a second eclipse (depth S/N %.1f after the red-noise factor β = %.2f;"
                    + " needed %.1f anywhere or %.1f at phase 0.5) shows at phase %.4f when folded at P = %.8g d",
                    bestOtherSnr, redNoiseFactor, PeriodSearch.SECONDARY_SNR, PeriodSearch.TARGETED_SECONDARY_SNR,
                    secondaryPhase(), periodDays);
        }
        if (halfPhasePoints < BoxLeastSquares.MIN_POINTS_IN_BOX) {
            return String.format(Locale.ROOT, "no second eclipse folded at P = %.8g d, but phase 0.5 has no data"
                    + " (%d points): a secondary there is unknown", periodDays, halfPhasePoints);
        }
        return String.format(Locale.ROOT, "no second eclipse folded at P = %.8g d (best other dip S/N %.1f < %.1f"
                + " after the red-noise factor β = %.2f; at phase 0.5 depth < %.2g, 3σ)", periodDays, bestOtherSnr,
                PeriodSearch.SECONDARY_SNR, redNoiseFactor, halfPhaseDepthLimit);
    }
}
