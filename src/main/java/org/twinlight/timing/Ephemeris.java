package org.twinlight.timing;

import org.twinlight.BadInputException;

/**
 * A linear ephemeris: primary minima at {@code epochDays + periodDays·E} for integer cycle E.
 *
 * @param epochDays time of the primary minimum of cycle 0, days, in the time scale of the data
 * @param periodDays orbital period, days, &gt; 0
 */
public record Ephemeris(double epochDays, double periodDays) {

    /** @throws BadInputException when the period is not a positive finite number or the epoch is not finite */
    public Ephemeris {
        if (!(periodDays > 0) || !Double.isFinite(periodDays)) {
            throw new BadInputException("ephemeris: period " + periodDays + " d is not allowed; expected a period > 0 days");
        }
        if (!Double.isFinite(epochDays)) {
            throw new BadInputException("ephemeris: epoch " + epochDays + " is not a finite time in days");
        }
    }

    /** The calculated time (days) of cycle number {@code cycle} (integer for primary, n + 0.5 for secondary). */
    public double timeOf(double cycle) {
        return epochDays + periodDays * cycle;
    }

    /** The (fractional) number of periods from the epoch to time {@code timeDays}. */
    public double cyclesSinceEpoch(double timeDays) {
        return (timeDays - epochDays) / periodDays;
    }
}
