package org.twinlight.time;

/** Where the clock that stamped a time sits: at the Earth, the Sun's centre, or the solar-system barycentre. */
public enum TimeReference {
    /** Times as received at the Earth (geocentre or observatory): plain JD. */
    GEOCENTRIC("JD"),
    /** Times referred to the centre of the Sun: HJD. */
    HELIOCENTRIC("HJD"),
    /** Times referred to the solar-system barycentre: BJD. */
    BARYCENTRIC("BJD");

    private final String prefix;

    TimeReference(String prefix) {
        this.prefix = prefix;
    }

    /** The customary prefix, e.g. {@code "HJD"}. */
    public String prefix() {
        return prefix;
    }
}
