package org.twinlight.timing;

import java.util.List;
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
 * @param timeScale time scale of every time here
 */
public record MinimumSearchResult(List<MinimumTime> minima, List<MinimumSkip> skipped, double primaryWindowDays,
        double secondaryWindowDays, double primaryDurationDays, double secondaryDurationDays, TimeScale timeScale) {

    public MinimumSearchResult {
        minima = List.copyOf(minima);
        skipped = List.copyOf(skipped);
    }

    /** The minima measured with one method, in cycle order. */
    public List<MinimumTime> minima(MinimumMethod method) {
        return minima.stream().filter(m -> m.method() == method).toList();
    }
}
