package org.twinlight.dimensions;

import static org.twinlight.dimensions.AstronomicalConstants.CODATA_2018_GRAVITATIONAL_CONSTANT_M3_KG_S2;
import static org.twinlight.dimensions.AstronomicalConstants.CODATA_2018_STEFAN_BOLTZMANN_W_M2_K4;
import static org.twinlight.dimensions.AstronomicalConstants.IAU_2015_B2_ZERO_POINT_LUMINOSITY_W;
import static org.twinlight.dimensions.AstronomicalConstants.IAU_2015_NOMINAL_SOLAR_LUMINOSITY_W;
import static org.twinlight.dimensions.AstronomicalConstants.IAU_2015_NOMINAL_SOLAR_MASS_PARAMETER_M3_S2;
import static org.twinlight.dimensions.AstronomicalConstants.IAU_2015_NOMINAL_SOLAR_RADIUS_M;
import static org.twinlight.dimensions.AstronomicalConstants.SECONDS_PER_DAY;

import java.util.Arrays;

/**
 * The absolute dimensions of a double-lined eclipsing binary for one set of elements, every
 * quantity of {@link Quantity} (NaN where it needs temperatures that are not given).
 *
 * <p>Formulas (SI inside, nominal solar units out; e.g. Hilditch 2001, <i>An Introduction to
 * Close Binary Stars</i>, ch. 2 and 3; Torres, Andersen &amp; Giménez 2010, A&amp;ARv 18, 67, §3):
 * <ul>
 *   <li>a sin i = (K₁ + K₂) P √(1−e²) / (2π); a = a sin i / sin i</li>
 *   <li>Kepler's third law: M₁ + M₂ = 4π² a³ / (G M☉ᴺ P²) in nominal solar masses, with the
 *       exact nominal (GM)☉ᴺ so no value of G enters; M₁ = (M₁+M₂) K₂/(K₁+K₂),
 *       M₂ = (M₁+M₂) K₁/(K₁+K₂), q = M₂/M₁ = K₁/K₂</li>
 *   <li>R = r·a; g = G M / R²; mean density ρ = M / (4/3 π R³) (this one needs G to turn
 *       (GM)☉ᴺ into kilograms: CODATA 2018); synchronous rotation v = 2π R / P</li>
 *   <li>Teff₂ given, or Teff₂ = Teff₁ J^{1/4} from the central surface-brightness ratio J: an
 *       approximation that treats J as bolometric (for a band it is only indicative: in the
 *       Rayleigh–Jeans limit J ∝ T, so the fourth root understates the temperature
 *       difference)</li>
 *   <li>Stefan–Boltzmann: L = 4π R² σ Teff⁴; M_bol = −2.5 log₁₀(L / L₀) with the IAU 2015 B2
 *       zero point L₀ = 3.0128 × 10²⁸ W</li>
 * </ul>
 */
public final class AbsoluteDimensions {

    private final double[] values;

    private AbsoluteDimensions(double[] values) {
        this.values = values;
    }

    /** The value of {@code q} (NaN when it needs temperatures that were not given). */
    public double get(Quantity q) {
        return values[q.ordinal()];
    }

    /** All values in the order of {@link Quantity#values()} (a copy). */
    public double[] toArray() {
        return values.clone();
    }

    /**
     * Computes the dimensions.
     *
     * @throws IllegalArgumentException with {@link BinaryElements#problem()} when the elements
     *     cannot give dimensions
     */
    public static AbsoluteDimensions of(BinaryElements el) {
        String problem = el.problem();
        if (problem != null) {
            throw new IllegalArgumentException(problem);
        }
        double[] v = new double[Quantity.values().length];
        Arrays.fill(v, Double.NaN);
        fill(el, v);
        return new AbsoluteDimensions(v);
    }

    /**
     * Fills {@code v} (indexed by {@link Quantity#ordinal()}) without checking the elements: the
     * sampler's inner loop, which checks them itself.
     */
    static void fill(BinaryElements el, double[] v) {
        double periodS = el.periodDays() * SECONDS_PER_DAY;
        double sinI = Math.abs(Math.sin(Math.toRadians(el.inclinationDeg())));
        double sumK = (el.k1Kms() + el.k2Kms()) * 1e3;
        double aSinIM = sumK * periodS * Math.sqrt(1 - el.eccentricity() * el.eccentricity()) / (2 * Math.PI);
        double aM = aSinIM / sinI;
        double totalMass = 4 * Math.PI * Math.PI * aM * aM * aM
                / (IAU_2015_NOMINAL_SOLAR_MASS_PARAMETER_M3_S2 * periodS * periodS);
        double m1 = totalMass * el.k2Kms() / (el.k1Kms() + el.k2Kms());
        double m2 = totalMass * el.k1Kms() / (el.k1Kms() + el.k2Kms());
        double sin3 = sinI * sinI * sinI;
        set(v, Quantity.SEMI_MAJOR_AXIS, aM / IAU_2015_NOMINAL_SOLAR_RADIUS_M);
        set(v, Quantity.A_SIN_I, aSinIM / IAU_2015_NOMINAL_SOLAR_RADIUS_M);
        set(v, Quantity.MASS_RATIO, el.k1Kms() / el.k2Kms());
        set(v, Quantity.TOTAL_MASS, totalMass);
        set(v, Quantity.MASS1, m1);
        set(v, Quantity.MASS2, m2);
        set(v, Quantity.MSIN3I1, m1 * sin3);
        set(v, Quantity.MSIN3I2, m2 * sin3);
        double r1M = el.radius1() * aM;
        double r2M = el.radius2() * aM;
        set(v, Quantity.RADIUS1, r1M / IAU_2015_NOMINAL_SOLAR_RADIUS_M);
        set(v, Quantity.RADIUS2, r2M / IAU_2015_NOMINAL_SOLAR_RADIUS_M);
        set(v, Quantity.LOGG1, logGravityCgs(m1, r1M));
        set(v, Quantity.LOGG2, logGravityCgs(m2, r2M));
        set(v, Quantity.DENSITY1, densityCgs(m1, r1M));
        set(v, Quantity.DENSITY2, densityCgs(m2, r2M));
        set(v, Quantity.SYNC_VELOCITY1, 2 * Math.PI * r1M / periodS / 1e3);
        set(v, Quantity.SYNC_VELOCITY2, 2 * Math.PI * r2M / periodS / 1e3);
        double t1 = el.teff1K();
        double t2 = !Double.isNaN(el.teff2K()) ? el.teff2K()
                : t1 * Math.pow(el.surfaceBrightnessRatio(), 0.25);
        if (!Double.isNaN(t1)) {
            setStar(v, Quantity.TEFF1, Quantity.LUMINOSITY1, Quantity.LOG_LUMINOSITY1, Quantity.MBOL1, r1M, t1);
        }
        if (!Double.isNaN(t2)) {
            setStar(v, Quantity.TEFF2, Quantity.LUMINOSITY2, Quantity.LOG_LUMINOSITY2, Quantity.MBOL2, r2M, t2);
        }
    }

    private static void setStar(double[] v, Quantity teff, Quantity lum, Quantity logLum, Quantity mbol, double radiusM,
            double teffK) {
        double watts = luminosityW(radiusM, teffK);
        set(v, teff, teffK);
        set(v, lum, watts / IAU_2015_NOMINAL_SOLAR_LUMINOSITY_W);
        set(v, logLum, Math.log10(watts / IAU_2015_NOMINAL_SOLAR_LUMINOSITY_W));
        set(v, mbol, bolometricMagnitude(watts));
    }

    private static void set(double[] v, Quantity q, double value) {
        v[q.ordinal()] = value;
    }

    /** Stefan–Boltzmann: L = 4π R² σ T⁴, W, for R in m and T in K. */
    public static double luminosityW(double radiusM, double teffK) {
        double t2 = teffK * teffK;
        return 4 * Math.PI * radiusM * radiusM * CODATA_2018_STEFAN_BOLTZMANN_W_M2_K4 * t2 * t2;
    }

    /** Absolute bolometric magnitude on the IAU 2015 B2 scale, M_bol = −2.5 log₁₀(L/L₀), L in W. */
    public static double bolometricMagnitude(double luminosityW) {
        return -2.5 * Math.log10(luminosityW / IAU_2015_B2_ZERO_POINT_LUMINOSITY_W);
    }

    /** log₁₀ of the surface gravity G M / R² in cm s⁻², M in nominal solar masses, R in m. */
    static double logGravityCgs(double massSolar, double radiusM) {
        return Math.log10(IAU_2015_NOMINAL_SOLAR_MASS_PARAMETER_M3_S2 * massSolar / (radiusM * radiusM) * 100.0);
    }

    /** Mean density in g cm⁻³, M in nominal solar masses, R in m. */
    static double densityCgs(double massSolar, double radiusM) {
        double kg = massSolar * IAU_2015_NOMINAL_SOLAR_MASS_PARAMETER_M3_S2 / CODATA_2018_GRAVITATIONAL_CONSTANT_M3_KG_S2;
        return kg / (4.0 / 3.0 * Math.PI * radiusM * radiusM * radiusM) / 1000.0;
    }

    /**
     * Kepler's third law in solar units: the total mass in nominal solar masses of an orbit with
     * semi-major axis {@code aAu} (astronomical units) and period {@code periodYears} (Julian
     * years): M = 4π² a³ / (G M☉ᴺ P²) ≈ a³/P².
     */
    public static double keplerMassSolar(double aAu, double periodYears) {
        double aM = aAu * AstronomicalConstants.IAU_2012_ASTRONOMICAL_UNIT_M;
        double pS = periodYears * AstronomicalConstants.JULIAN_YEAR_DAYS * SECONDS_PER_DAY;
        return 4 * Math.PI * Math.PI * aM * aM * aM / (IAU_2015_NOMINAL_SOLAR_MASS_PARAMETER_M3_S2 * pS * pS);
    }
}
