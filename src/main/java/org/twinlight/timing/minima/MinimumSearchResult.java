package org.twinlight.timing.minima;

import java.util.List;
import java.util.function.DoubleUnaryOperator;
import org.twinlight.time.TimeScale;

/**
 * Outcome of the search for times of minimum in one light curve.
 *
 * @param minima every measured minimum, once per method, in cycle order
 * @param skipped eclipses in the data that were not measured, with the reason
 * @param primaryWindowDays full width of the window cut around primary eclipses, days
 * @param secondaryWindowDays the same for secondary eclipses
 * @param primaryDurationDays eclipse duration used for the coverage checks, days
 * @param secondaryDurationDays the same for secondary eclipses
 * @param primaryDepth fractional depth of the primary eclipse in the folded light curve, NaN when not seen
 * @param secondaryDepth the same for the secondary eclipse
 * @param timeScale time scale of every time here
 * @param secondaryOffsetDays displacement of the secondary eclipses from phase 0.5 seen in the
 *     folded light curve, days (secondary minus primary centre, minus half a period); NaN when
 *     either eclipse is not seen
 * @param secondaryOffsetErrorDays its 1σ resolution, days: each folded centre is found to within one
 *     phase bin, so the two bin widths in quadrature (conservative); NaN with the offset
 * @param secondaryPhase phase at which the secondaries were measured: the one asked for, or the
 *     one where a secondary was found when none was seen there
 * @param notes remarks for people (e.g. a secondary found away from the expected phase)
 */
public record MinimumSearchResult(List<MinimumTime> minima, List<MinimumSkip> skipped, double primaryWindowDays,
        double secondaryWindowDays, double primaryDurationDays, double secondaryDurationDays, double primaryDepth,
        double secondaryDepth, TimeScale timeScale, double secondaryOffsetDays, double secondaryOffsetErrorDays,
        double secondaryPhase, List<String> notes) {

    public MinimumSearchResult {
        minima = List.copyOf(minima);
        skipped = List.copyOf(skipped);
        notes = List.copyOf(notes);
    }

    /**
     * The same result with every time (minima and predicted times of skipped eclipses) mapped by
     * {@code convert} into {@code scale}; errors, windows and durations are unchanged (a change of
     * time scale alters intervals by less than 1 part in 10⁴).
     */
    public MinimumSearchResult inTimeScale(DoubleUnaryOperator convert, TimeScale scale) {
        List<MinimumTime> m = minima.stream().map(t -> new MinimumTime(t.cycle(), t.type(),
                convert.applyAsDouble(t.timeDays()), t.errorDays(), t.method(), t.nPoints(), t.classicErrorDays(),
                t.beta(), t.partial())).toList();
        List<MinimumSkip> s = skipped.stream().map(k -> new MinimumSkip(k.cycle(), k.type(),
                convert.applyAsDouble(k.predictedTimeDays()), k.nPoints(), k.reason())).toList();
        return new MinimumSearchResult(m, s, primaryWindowDays, secondaryWindowDays, primaryDurationDays,
                secondaryDurationDays, primaryDepth, secondaryDepth, scale, secondaryOffsetDays, secondaryOffsetErrorDays,
                secondaryPhase, notes);
    }

    /** True when the eclipses at the secondary phase are clearly deeper than those at phase 0. */
    public boolean secondaryDeeperThanPrimary() {
        return secondaryDepth > 1.1 * primaryDepth || (Double.isNaN(primaryDepth) && !Double.isNaN(secondaryDepth));
    }

    /** The minima measured with one method, in cycle order. */
    public List<MinimumTime> minima(MinimumMethod method) {
        return minima.stream().filter(m -> m.method() == method).toList();
    }
}
