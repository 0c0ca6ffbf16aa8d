package org.twinlight.timing.period;

import java.util.List;
import java.util.Locale;
import java.util.Optional;
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
 * @param caution a warning that goes with the period, in words (so few eclipses timed that the next minimum
 *     should be observed to confirm it); empty when there is none
 */
public record RefinedPeriod(double periodDays, double periodErrorDays, double epochDays, double epochErrorDays,
        double widthPhase, double ingressFraction, double level, int timings, OptionalDouble timingReducedChiSquare,
        String method, Optional<String> caution) {

    /**
     * Most timings for which the period carries a caution and its error is at least the difference between
     * the periods timed with the best and the next-best template: with two or three timings the line has at most one degree of
     * freedom, and the χ²ν that would reveal optimistic errors means nothing (common practice, no source).
     */
    static final int FEW_TIMINGS = 3;

    /**
     * Refined from eclipse timings (a weighted straight line through them) with the template that fits the
     * fold best; {@code other}, the ephemeris timed with the next-best template {@code otherName} (null when
     * there is none), sets a floor on the errors when the timings are few.
     */
    static RefinedPeriod fromTimings(PeriodRefinement.Ephemeris e, PeriodRefinement.Trapezoid shape,
            String templateName, String otherName, PeriodRefinement.Ephemeris other, double lastTimeDays) {
        boolean scaled = e.timings() > 2 && e.reducedChiSquare() > 1;
        String method = String.format(Locale.ROOT, "weighted linear fit of %d primary-eclipse timings (template: %s;"
                + " Fisher-information errors%s)", e.timings(), templateName, scaled ? String.format(Locale.ROOT,
                        ", scaled by √χ²ν = %.2f and Student's t for %d degree%s of freedom",
                        Math.sqrt(e.reducedChiSquare()), e.timings() - 2, e.timings() == 3 ? "" : "s") : "");
        double periodError = e.periodErrorDays();
        double epochError = e.epochErrorDays();
        Optional<String> caution = Optional.empty();
        if (e.timings() <= FEW_TIMINGS) {
            if (other != null) {
                double dp = Math.abs(other.periodDays() - e.periodDays());
                double de = other.epochDays() - e.epochDays();
                de = Math.abs(de - Math.rint(de / e.periodDays()) * e.periodDays());
                if (dp > periodError || de > epochError) {
                    method += String.format(Locale.ROOT, "; at least the difference from the timings with the"
                            + " next-best template, %s (%.2g d in the period)", otherName, dp);
                }
                periodError = Math.max(periodError, dp);
                epochError = Math.max(epochError, de);
            }
            caution = Optional.of(fewTimingsCaution(e.timings(), e.periodDays(), periodError, e.epochDays(),
                    epochError, lastTimeDays));
        }
        return new RefinedPeriod(e.periodDays(), periodError, e.epochDays(), epochError, shape.width(),
                shape.ingress() / (0.5 * shape.width()), shape.level(), e.timings(),
                e.timings() > 2 ? OptionalDouble.of(e.reducedChiSquare()) : OptionalDouble.empty(), method, caution);
    }

    /** "only N eclipses timed: observe the next primary minimum, predicted at T ± σ, to confirm the period". */
    static String fewTimingsCaution(int timings, double periodDays, double periodErrorDays, double epochDays,
            double epochErrorDays, double lastTimeDays) {
        double cycles = Math.max(1, Math.ceil((lastTimeDays - epochDays) / periodDays));
        double next = epochDays + cycles * periodDays;
        double error = Math.hypot(epochErrorDays, cycles * periodErrorDays);
        return String.format(Locale.ROOT, "only %d eclipses timed: observe the next primary minimum, predicted %s ± %.1f"
                + " min, to confirm the period", timings, PeriodDecider.when(next), error * 1440);
    }

    /** Not timed: the error is the half-width of the periodogram peak. */
    static RefinedPeriod fromPeak(double periodDays, double epochDays, double widthPhase, double level,
            double baselineDays) {
        return new RefinedPeriod(periodDays, periodDays * periodDays * widthPhase / (2 * baselineDays), epochDays,
                widthPhase * periodDays / 2, widthPhase, 1, level, 0, OptionalDouble.empty(),
                "half-width of the periodogram peak, P²·q/(2T) (no timing possible)", Optional.empty());
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
                timings, timingReducedChiSquare, method + "; " + why, caution);
    }

    /**
     * Refines a trial period: the best box of the periodogram at that period gives the dip; a trapezoid
     * and a template of two limb-darkened discs fitted to the folded dip, and a straight line through the
     * eclipse timings made with the better of the two give the period and its error (two passes, see
     * {@link PeriodRefinement}); with at most {@link #FEW_TIMINGS} timings, discs without limb darkening are
     * fitted too, the errors are at least the difference the next-best template makes, and a caution asks for
     * the next minimum.
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
        double lastTime = data.timesDays()[data.size() - 1];
        double period = trialPeriodDays;
        for (int pass = 0; pass < 2; pass++) {
            PeriodRefinement.Trapezoid shape = pr.fitShape(period, epoch, dip.width(), dip.level());
            if (shape == null) {
                break;
            }
            // The first pass times with the trapezoid to bring the period close; the second fits the discs too.
            List<PeriodRefinement.TimingTemplate> templates = pr.fitTemplates(period, epoch, shape,
                    pass == 0 ? PeriodRefinement.TRAPEZOID_ONLY : PeriodRefinement.WITH_DISCS);
            if (templates.isEmpty()) {
                break;
            }
            PeriodRefinement.Ephemeris eph = pr.refine(period, epoch, templates.get(0));
            if (eph == null) {
                break;
            }
            PeriodRefinement.Ephemeris other = null;
            if (pass > 0 && eph.timings() <= FEW_TIMINGS) {
                // Few timings: the next-best of three templates (the uniform discs added) gives the floor.
                templates = pr.fitTemplates(period, epoch, shape, PeriodRefinement.WITH_UNIFORM_DISCS);
                PeriodRefinement.Ephemeris best = pr.refine(period, epoch, templates.get(0));
                other = templates.size() > 1 ? pr.refine(period, epoch, templates.get(1)) : null;
                eph = best != null ? best : eph;
            }
            period = eph.periodDays();
            epoch = eph.epochDays();
            result = fromTimings(eph, shape, templates.get(0).name(), templates.size() > 1 ? templates.get(1).name()
                    : null, other, lastTime);
        }
        return result;
    }
}
