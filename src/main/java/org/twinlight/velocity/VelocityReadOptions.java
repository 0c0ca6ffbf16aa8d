package org.twinlight.velocity;

import org.twinlight.time.TimeScale;

/**
 * How to read a velocity file. Every field may be null ("detect" or "not given").
 *
 * @param timeColumn name or 1-based number of the time column
 * @param velocity1Column column of star 1's velocities
 * @param error1Column column of their errors
 * @param velocity2Column column of star 2's velocities
 * @param error2Column column of their errors
 * @param instrumentColumn column naming the instrument of each row
 * @param timeScale declared time scale; null: from the file or unknown
 * @param timeOffsetDays days added to every time
 * @param hdu FITS HDU (0 = primary); null: the first binary table
 */
public record VelocityReadOptions(String timeColumn, String velocity1Column, String error1Column,
        String velocity2Column, String error2Column, String instrumentColumn, TimeScale timeScale,
        Double timeOffsetDays, Integer hdu) {

    /** Everything detected, nothing declared. */
    public static VelocityReadOptions defaults() {
        return new VelocityReadOptions(null, null, null, null, null, null, null, null, null);
    }

    public VelocityReadOptions withTimeScale(TimeScale scale) {
        return new VelocityReadOptions(timeColumn, velocity1Column, error1Column, velocity2Column, error2Column,
                instrumentColumn, scale, timeOffsetDays, hdu);
    }
}
