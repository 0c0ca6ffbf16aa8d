package org.twinlight.timing.minima;

import org.twinlight.timing.MinimumType;

import java.util.Objects;

/**
 * One measured time of minimum.
 *
 * @param cycle cycle number E: an integer for a primary minimum, n + 0.5 for a secondary one
 * @param type primary or secondary
 * @param timeDays time of minimum, days, in the time scale of the data
 * @param errorDays 1σ uncertainty of the time, days (the method's honest estimate)
 * @param method how it was measured
 * @param nPoints number of data points used
 * @param classicErrorDays for {@link MinimumMethod#KVW}: the error from the original
 *     Kwee–van Woerden formula, days, kept for comparison; NaN otherwise
 * @param beta the correlated-noise factor β of the eclipse's residuals (Winn et al. 2008, see
 *     {@link CorrelatedNoise}); {@code errorDays} already includes the factor max(1, β); NaN when
 *     it could not be estimated (too few points) or the timing came from elsewhere
 * @param partial true when the eclipse was only partly covered and its time comes from the
 *     template (whose shape is fixed by the well-covered eclipses) alone
 */
public record MinimumTime(double cycle, MinimumType type, double timeDays, double errorDays,
        MinimumMethod method, int nPoints, double classicErrorDays, double beta, boolean partial) {

    public MinimumTime {
        Objects.requireNonNull(type, "type");
        Objects.requireNonNull(method, "method");
    }

    /** A timing from elsewhere (e.g. a list of published minima): no point count, no classic error. */
    public static MinimumTime of(double cycle, MinimumType type, double timeDays, double errorDays, MinimumMethod method) {
        return new MinimumTime(cycle, type, timeDays, errorDays, method, 0, Double.NaN, Double.NaN, false);
    }
}
