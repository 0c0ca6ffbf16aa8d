package org.twinlight.photometry;

/**
 * Why a row of a photometry file was read but not used. The {@link #label()} is the key under
 * which {@link LightCurve#rejectedRows()} counts such rows.
 */
public enum RowRejection {
    /** A needed field (time, value, error, band or quality) is empty or the row is too short. */
    MISSING_FIELD("missing field"),
    /** A needed field is text that is not a number. */
    NOT_A_NUMBER("not a number"),
    /** Time, value or error is NaN or infinite (FITS tables mark gaps this way). */
    NOT_FINITE("NaN or infinite"),
    /** The error is zero or negative: such a point would get infinite or undefined weight. */
    ERROR_NOT_POSITIVE("error not positive"),
    /** The quality column holds a non-zero flag. */
    QUALITY_FLAGGED("quality flag set"),
    /**
     * A magnitude at or beyond ±{@value #MAGNITUDE_LIMIT}: sentinels such as 99.0 or −99.9 that
     * photometry tables use for "no measurement" (common practice, no source).
     */
    MAGNITUDE_OUT_OF_RANGE("magnitude out of range");

    /** Magnitudes with |m| at or above this are rejected as "no measurement" sentinels. */
    public static final double MAGNITUDE_LIMIT = 50.0;

    private final String label;

    RowRejection(String label) {
        this.label = label;
    }

    /** The reason as people read it, e.g. {@code "quality flag set"}. */
    public String label() {
        return label;
    }
}
