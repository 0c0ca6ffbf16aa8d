package org.twinlight.dimensions;

/**
 * Physical and astronomical constants, each named by where it comes from. SI units.
 *
 * <p>Sources: IAU 2015 Resolution B3 (nominal solar values; Mamajek, Prša, Torres et al. 2015,
 * arXiv:1510.07674; Prša et al. 2016, AJ 152, 41); IAU 2015 Resolution B2 (bolometric magnitude
 * scale; Mamajek et al. 2015, arXiv:1510.06262); CODATA 2018 (exact SI values of h, k, c; G);
 * IAU 2012 Resolution B2 (astronomical unit).
 */
public final class AstronomicalConstants {

    /** Nominal solar radius R☉ᴺ, m (exact; IAU 2015 Resolution B3). */
    public static final double IAU_2015_NOMINAL_SOLAR_RADIUS_M = 6.957e8;
    /** Nominal solar luminosity L☉ᴺ, W (IAU 2015 Resolution B3). */
    public static final double IAU_2015_NOMINAL_SOLAR_LUMINOSITY_W = 3.828e26;
    /** Nominal solar effective temperature, K (IAU 2015 Resolution B3). */
    public static final double IAU_2015_NOMINAL_SOLAR_TEFF_K = 5772.0;
    /** Nominal solar mass parameter (GM)☉ᴺ, m³ s⁻² (exact; IAU 2015 Resolution B3). */
    public static final double IAU_2015_NOMINAL_SOLAR_MASS_PARAMETER_M3_S2 = 1.3271244e20;
    /** Zero point of absolute bolometric magnitude, L₀ for M_bol = 0, W (IAU 2015 Resolution B2). */
    public static final double IAU_2015_B2_ZERO_POINT_LUMINOSITY_W = 3.0128e28;
    /** Stefan–Boltzmann constant σ = 2π⁵k⁴/(15h³c²), W m⁻² K⁻⁴ (exact in the 2019 SI; CODATA 2018). */
    public static final double CODATA_2018_STEFAN_BOLTZMANN_W_M2_K4 = 5.670374419e-8;
    /** Newtonian constant of gravitation, m³ kg⁻¹ s⁻² (CODATA 2018; relative uncertainty 2.2e-5). */
    public static final double CODATA_2018_GRAVITATIONAL_CONSTANT_M3_KG_S2 = 6.67430e-11;
    /** Speed of light in vacuum, m/s (exact; defining constant of the SI, CODATA 2018). */
    public static final double SPEED_OF_LIGHT_M_S = 299792458.0;
    /** Astronomical unit, m (exact; IAU 2012 Resolution B2). */
    public static final double IAU_2012_ASTRONOMICAL_UNIT_M = 1.49597870700e11;
    /** The day of 86400 SI seconds, the unit of time of twinlight's periods. */
    public static final double SECONDS_PER_DAY = 86400.0;
    /** The Julian year, days (IAU). */
    public static final double JULIAN_YEAR_DAYS = 365.25;

    private AstronomicalConstants() {
    }
}
