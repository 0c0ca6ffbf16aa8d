package org.twinlight.photometry;

import org.twinlight.time.TimeScale;

/**
 * How to read a photometry file. Every field may be null ("detect" or "not given").
 *
 * @param timeColumn name or 1-based number of the time column; null: detect from the header
 * @param valueColumn name or number of the flux/magnitude column; null: detect
 * @param errorColumn name or number of the error column; null: detect, absent is allowed
 * @param bandColumn name or number of a band column; null: none
 * @param qualityColumn name of a quality-flag column (non-zero = flagged); null: detect for FITS
 * @param valueKind flux or magnitude; null: detect from the header, else flux
 * @param timeScale declared time scale; null: from the file (FITS keywords) or unknown
 * @param timeOffsetDays days added to every time (0 when null)
 * @param hdu FITS HDU index (0 = primary); null: the first binary table
 */
public record ReadOptions(String timeColumn, String valueColumn, String errorColumn, String bandColumn,
        String qualityColumn, ValueKind valueKind, TimeScale timeScale, Double timeOffsetDays, Integer hdu) {

    /** Everything detected, nothing declared. */
    public static ReadOptions defaults() {
        return new ReadOptions(null, null, null, null, null, null, null, null, null);
    }

    public ReadOptions withTimeScale(TimeScale scale) {
        return new ReadOptions(timeColumn, valueColumn, errorColumn, bandColumn, qualityColumn, valueKind, scale,
                timeOffsetDays, hdu);
    }

    public ReadOptions withValueKind(ValueKind kind) {
        return new ReadOptions(timeColumn, valueColumn, errorColumn, bandColumn, qualityColumn, kind, timeScale,
                timeOffsetDays, hdu);
    }
}
