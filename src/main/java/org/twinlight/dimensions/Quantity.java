package org.twinlight.dimensions;

/**
 * One derived quantity of {@link AbsoluteDimensions}: its name in {@code dimensions.json}, the
 * star it belongs to (1, 2, or 0 for the system), its unit and a printable label.
 */
public enum Quantity {
    SEMI_MAJOR_AXIS(0, "semiMajorAxis", "nominal solar radii", "a"),
    A_SIN_I(0, "aSinI", "nominal solar radii", "a sin i"),
    MASS_RATIO(0, "massRatio", "M2/M1", "q"),
    TOTAL_MASS(0, "totalMass", "nominal solar masses", "M1 + M2"),
    MASS1(1, "mass", "nominal solar masses", "M"),
    MASS2(2, "mass", "nominal solar masses", "M"),
    MSIN3I1(1, "massSin3i", "nominal solar masses", "M sin^3 i"),
    MSIN3I2(2, "massSin3i", "nominal solar masses", "M sin^3 i"),
    RADIUS1(1, "radius", "nominal solar radii", "R"),
    RADIUS2(2, "radius", "nominal solar radii", "R"),
    LOGG1(1, "logg", "log10(g / cm s^-2)", "log g"),
    LOGG2(2, "logg", "log10(g / cm s^-2)", "log g"),
    DENSITY1(1, "density", "g cm^-3", "mean density"),
    DENSITY2(2, "density", "g cm^-3", "mean density"),
    SYNC_VELOCITY1(1, "synchronousRotationVelocity", "km/s", "v_sync"),
    SYNC_VELOCITY2(2, "synchronousRotationVelocity", "km/s", "v_sync"),
    TEFF1(1, "teff", "K", "Teff"),
    TEFF2(2, "teff", "K", "Teff"),
    LUMINOSITY1(1, "luminosity", "nominal solar luminosities", "L"),
    LUMINOSITY2(2, "luminosity", "nominal solar luminosities", "L"),
    LOG_LUMINOSITY1(1, "logLuminosity", "log10(L / nominal solar luminosity)", "log L"),
    LOG_LUMINOSITY2(2, "logLuminosity", "log10(L / nominal solar luminosity)", "log L"),
    MBOL1(1, "bolometricMagnitude", "mag (IAU 2015 B2 scale)", "M_bol"),
    MBOL2(2, "bolometricMagnitude", "mag (IAU 2015 B2 scale)", "M_bol");

    private final int star;
    private final String key;
    private final String unit;
    private final String label;

    Quantity(int star, String key, String unit, String label) {
        this.star = star;
        this.key = key;
        this.unit = unit;
        this.label = label;
    }

    /** 1 or 2 for a star's quantity, 0 for the system's. */
    public int star() {
        return star;
    }

    /** The name in {@code dimensions.json} (within its star or the system). */
    public String key() {
        return key;
    }

    public String unit() {
        return unit;
    }

    /** A short label for tables, e.g. {@code "log g"}. */
    public String label() {
        return label;
    }

    /** Whether the quantity needs effective temperatures. */
    public boolean needsTemperature() {
        return switch (this) {
            case TEFF1, TEFF2, LUMINOSITY1, LUMINOSITY2, LOG_LUMINOSITY1, LOG_LUMINOSITY2, MBOL1, MBOL2 -> true;
            default -> false;
        };
    }
}
