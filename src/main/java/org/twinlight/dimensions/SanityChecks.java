package org.twinlight.dimensions;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.twinlight.orbit.RocheLobe;

/**
 * Warnings about dimensions that cannot be right for two ordinary stars, or that make the
 * spherical model invalid. They do not change any value.
 */
public final class SanityChecks {

    /** Hydrogen-burning limit, M☉: below it a brown dwarf (about 8 % of M☉; Chabrier &amp; Baraffe 2000, ARA&amp;A 38, 337). */
    public static final double MIN_STELLAR_MASS = 0.08;
    /** About the most massive stars known, M☉ (Figer 2005, Nature 434, 192: "a firm limit of 150 M☉"). */
    public static final double MAX_STELLAR_MASS = 150.0;
    /**
     * Surface gravity above which no main-sequence star lies: the least massive M dwarfs reach
     * log g ≈ 5.3 (common practice, no source); above it only degenerate stars.
     */
    public static final double MAX_MAIN_SEQUENCE_LOGG = 5.5;
    /**
     * Below this log g a star cooler than {@link #COOL_TEFF_K} is a giant or subgiant, far from
     * the main sequence, where cool dwarfs have log g ≈ 4.3–5.0 (common practice, no source).
     */
    public static final double MIN_COOL_DWARF_LOGG = 3.5;
    /** Effective temperature below which {@link #MIN_COOL_DWARF_LOGG} applies, K. */
    public static final double COOL_TEFF_K = 6500.0;
    /**
     * Mean density above which a star is not on the main sequence, g cm⁻³: the late M dwarfs
     * near the hydrogen-burning limit have ≈ 50–100 (common practice, no source).
     */
    public static final double MAX_MAIN_SEQUENCE_DENSITY = 150.0;
    /**
     * Distance from the main-sequence mass–luminosity relation that is called far off, dex: a
     * design choice (the relation's own scatter is about 0.1–0.2 dex; not read in the paper).
     */
    public static final double MASS_LUMINOSITY_TOLERANCE_DEX = 0.5;

    private SanityChecks() {
    }

    /** Every warning for these dimensions of these elements; empty when none applies. */
    public static List<String> warnings(AbsoluteDimensions d, BinaryElements el) {
        List<String> out = new ArrayList<>();
        star(out, 1, d.get(Quantity.MASS1), d.get(Quantity.MASS2), el.radius1(), d.get(Quantity.LOGG1),
                d.get(Quantity.DENSITY1), d.get(Quantity.TEFF1), d.get(Quantity.LOG_LUMINOSITY1), el.eccentricity());
        star(out, 2, d.get(Quantity.MASS2), d.get(Quantity.MASS1), el.radius2(), d.get(Quantity.LOGG2),
                d.get(Quantity.DENSITY2), d.get(Quantity.TEFF2), d.get(Quantity.LOG_LUMINOSITY2), el.eccentricity());
        return out;
    }

    /**
     * A warning when these elements cannot give an eclipse, or null when they can: at a conjunction
     * the sky-projected separation in units of a is cos i · (1 − e²)/(1 ± e sin ω) (+ at primary
     * conjunction, ν + ω = 90°; − at secondary), and the stars overlap only when it is below
     * r1 + r2 (Winn 2010, "Transits and Occultations", in Exoplanets, ed. Seager, eqs. 7–8, with
     * ω of the eclipsed star as in the contract's convention). An eclipse fit cannot have come out
     * like this, so the inclination is not from an eclipse and the masses (∝ 1/sin³i) are not to
     * be trusted.
     *
     * @param omegaDeg argument of periastron of star 1, degrees (any value for a circular orbit)
     */
    public static String eclipseGeometry(BinaryElements el, double omegaDeg) {
        double cosI = Math.abs(Math.cos(Math.toRadians(el.inclinationDeg())));
        double e = el.eccentricity();
        double esinw = e * Math.sin(Math.toRadians(omegaDeg));
        double primary = cosI * (1 - e * e) / (1 + esinw);
        double secondary = cosI * (1 - e * e) / (1 - esinw);
        double sum = el.radius1() + el.radius2();
        if (Math.min(primary, secondary) < sum) {
            return null;
        }
        return String.format(Locale.ROOT, "the geometry gives no eclipse: at i = %.2f deg the stars' projected "
                + "separation at conjunction is %.4f a (primary) and %.4f a (secondary), more than r1 + r2 = %.4f, so "
                + "they never overlap. The inclination is then not from an eclipse (a wrong or hand-made fit.json?), "
                + "and the masses, which scale as 1/sin^3 i, are not to be trusted", el.inclinationDeg(), primary,
                secondary, sum);
    }

    private static void star(List<String> out, int n, double mass, double companion, double fractionalRadius,
            double logg, double density, double teff, double logL, double e) {
        String s = "star " + n + ": ";
        if (mass < MIN_STELLAR_MASS) {
            out.add(String.format(Locale.ROOT, "%smass %.4f M_sun is below the hydrogen-burning limit (about %.2f "
                    + "M_sun): a brown dwarf or a planet, not a star; check K%d and the inclination", s, mass,
                    MIN_STELLAR_MASS, n == 1 ? 2 : 1));
        }
        if (mass > MAX_STELLAR_MASS) {
            out.add(String.format(Locale.ROOT, "%smass %.1f M_sun is above the most massive stars known (about %.0f "
                    + "M_sun); check K1, K2 and the period", s, mass, MAX_STELLAR_MASS));
        }
        if (logg > MAX_MAIN_SEQUENCE_LOGG) {
            out.add(String.format(Locale.ROOT, "%slog g = %.2f is higher than any main-sequence star's (<= about "
                    + "%.1f): only a white dwarf is that compact; check the fractional radius", s, logg,
                    MAX_MAIN_SEQUENCE_LOGG));
        } else if (density > MAX_MAIN_SEQUENCE_DENSITY) {
            out.add(String.format(Locale.ROOT, "%smean density %.0f g/cm^3 is higher than any main-sequence star's; "
                    + "check the fractional radius", s, density));
        }
        if (!Double.isNaN(teff) && teff < COOL_TEFF_K && logg < MIN_COOL_DWARF_LOGG) {
            out.add(String.format(Locale.ROOT, "%slog g = %.2f at Teff = %.0f K is a giant or subgiant, not a star "
                    + "near the main sequence (cool dwarfs have log g about 4.3-5.0); fine if it is evolved, "
                    + "otherwise check the radius", s, logg, teff));
        }
        double lobe = RocheLobe.eggletonRadius(mass / companion);
        // at periastron the separation is a(1 − e): the lobe shrinks with it
        double lobeAtPeriastron = lobe * (1 - e);
        if (fractionalRadius > lobeAtPeriastron) {
            out.add(String.format(Locale.ROOT, "%sR/a = %.4f exceeds its Roche-lobe radius %.4f (Eggleton 1983, "
                    + "ApJ 268, 368%s): the star overfills its lobe, so the model of two spheres is invalid", s,
                    fractionalRadius, lobeAtPeriastron, e > 0 ? ", at periastron" : ""));
        } else if (fractionalRadius > 0.9 * lobeAtPeriastron) {
            out.add(String.format(Locale.ROOT, "%sR/a = %.4f fills %.0f%% of its Roche-lobe radius (Eggleton 1983): "
                    + "the star is strongly distorted and spheres are a poor approximation", s, fractionalRadius,
                    100 * fractionalRadius / lobeAtPeriastron));
        }
        double expected = MassLuminosityRelation.logLuminosity(mass);
        if (!Double.isNaN(logL) && !Double.isNaN(expected)
                && Math.abs(logL - expected) > MASS_LUMINOSITY_TOLERANCE_DEX) {
            out.add(String.format(Locale.ROOT, "%sadvisory: log L = %.2f is %.2f dex %s the main-sequence "
                    + "mass-luminosity relation (Eker et al. 2018, MNRAS 479, 5491: %.2f at %.3f M_sun); normal for "
                    + "an evolved star, otherwise check Teff and the radius", s, logL, Math.abs(logL - expected),
                    logL > expected ? "above" : "below", expected, mass));
        }
    }
}
