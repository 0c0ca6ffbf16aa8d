package org.twinlight.timing.period;

import java.util.Locale;
import java.util.OptionalDouble;

/**
 * A trial period refined from the data: the period and epoch of its deepest dip with their errors, the
 * dip's shape, and how well the eclipse timings follow the period.
 *
 * @param periodDays the refined period, days
 * @param periodErrorDays its 1σ error, days
 * @param epochDays time of the dip's centre (a primary minimum), days
 * @param epochErrorDays its 1σ error, days
 * @param widthPhase full width of the dip, fraction of the period
 * @param ingressFraction ingress over the half width of the fitted trapezoid (1 = V shape, small = flat
 *     bottom)
 * @param level out-of-eclipse level, relative flux
 * @param timings number of eclipse timings (groups of cycles) behind the period, 0 when none could be made
 * @param timingReducedChiSquare χ²ν of the timings about the straight line; empty with fewer than three
 *     timings
 * @param method how the error was obtained, in words
 */
public record RefinedPeriod(double periodDays, double periodErrorDays, double epochDays, double epochErrorDays,
        double widthPhase, double ingressFraction, double level, int timings, OptionalDouble timingReducedChiSquare,
        String method) {

    /** Refined from eclipse timings (a weighted straight line through them). */
    static RefinedPeriod fromTimings(PeriodRefinement.Ephemeris e, PeriodRefinement.Trapezoid shape) {
        boolean scaled = e.timings() > 2 && e.reducedChiSquare() > 1;
        String method = String.format(Locale.ROOT, "weighted linear fit of %d primary-eclipse timings (template"
                + " of two limb-darkened discs, Fisher-information errors%s)", e.timings(), scaled ? String.format(Locale.ROOT,
                        ", scaled by √χ²ν = %.2f", Math.sqrt(e.reducedChiSquare())) : "");
        return new RefinedPeriod(e.periodDays(), e.periodErrorDays(), e.epochDays(), e.epochErrorDays(), shape.width(),
                shape.ingress() / (0.5 * shape.width()), shape.level(), e.timings(),
                e.timings() > 2 ? OptionalDouble.of(e.reducedChiSquare()) : OptionalDouble.empty(), method);
    }

    /** Not timed: the error is the half-width of the periodogram peak. */
    static RefinedPeriod fromPeak(double periodDays, double epochDays, double widthPhase, double level,
            double baselineDays) {
        return new RefinedPeriod(periodDays, periodDays * periodDays * widthPhase / (2 * baselineDays), epochDays,
                widthPhase * periodDays / 2, widthPhase, 1, level, 0, OptionalDouble.empty(),
                "half-width of the periodogram peak, P²·q/(2T) (no timing possible)");
    }

    /** True when the timings scatter by more than {@code limit} in χ²ν about one period. */
    boolean timingsScatterBeyond(double limit) {
        return timingReducedChiSquare.isPresent() && timingReducedChiSquare.getAsDouble() > limit;
    }

    /** This refinement with its period error raised to at least {@code floorDays}, the reason added. */
    RefinedPeriod withPeriodErrorAtLeast(double floorDays, String why) {
        if (periodErrorDays >= floorDays) {
            return this;
        }
        return new RefinedPeriod(periodDays, floorDays, epochDays, epochErrorDays, widthPhase, ingressFraction, level,
                timings, timingReducedChiSquare, method + "; " + why);
    }

    /**
     * Refines a trial period: the best box of the periodogram at that period gives the dip; a trapezoid
     * fitted to the folded dip and a straight line through the eclipse timings give the period and its
     * error (two passes, see {@link PeriodRefinement}).
     */
    static RefinedPeriod at(SearchData data, BoxLeastSquares bls, FrequencyGrid grid, double scatter,
            double trialPeriodDays) {
        double f = 1 / trialPeriodDays;
        BoxLeastSquares.Box box = bls.bestBox(f, grid.effectiveShortestDuration(f));
        double ref = bls.referenceTimeDays();
        FoldedEclipses fold = new FoldedEclipses(data.timesDays(), data.flux(), trialPeriodDays, ref);
        FoldedEclipses.Dip dip = fold.refine(fold.measure(box.centrePhase(), box.durationFraction()));
        double epoch = ref + dip.centre() * trialPeriodDays;
        RefinedPeriod result = fromPeak(trialPeriodDays, epoch, dip.width(), dip.level(), data.baselineDays());
        PeriodRefinement pr = new PeriodRefinement(data.timesDays(), data.flux(), scatter, data.resolutionDays());
        double period = trialPeriodDays;
        for (int pass = 0; pass < 2; pass++) {
            PeriodRefinement.Trapezoid shape = pr.fitShape(period, epoch, dip.width(), dip.level());
            if (shape == null) {
                break;
            }
            PeriodRefinement.DiscShape disc = pr.fitDiscShape(period, epoch, shape);
            if (disc == null) {
                break;
            }
            PeriodRefinement.Ephemeris eph = pr.refine(period, epoch, disc);
            if (eph == null) {
                break;
            }
            period = eph.periodDays();
            epoch = eph.epochDays();
            result = fromTimings(eph, shape);
        }
        return result;
    }
}
