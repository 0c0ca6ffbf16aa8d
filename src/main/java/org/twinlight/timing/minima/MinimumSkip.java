package org.twinlight.timing.minima;

import org.twinlight.timing.MinimumType;

import java.util.Objects;

/**
 * An eclipse that lies in the data but was not measured, with the reason.
 *
 * @param cycle cycle number of the eclipse (integer primary, n + 0.5 secondary)
 * @param type primary or secondary
 * @param predictedTimeDays time predicted by the ephemeris, days
 * @param nPoints data points inside its window
 * @param reason why it was skipped, for people
 */
public record MinimumSkip(double cycle, MinimumType type, double predictedTimeDays, int nPoints, String reason) {
    public MinimumSkip {
        Objects.requireNonNull(type, "type");
        Objects.requireNonNull(reason, "reason");
    }
}
