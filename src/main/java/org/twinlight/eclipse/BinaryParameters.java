package org.twinlight.eclipse;

import java.util.Objects;
import org.twinlight.orbit.Orbit;

/**
 * The parameters of the two-sphere eclipse model in one band, with the names and conventions of
 * the interface contract (see {@code docs/model.md}).
 *
 * @param periodDays orbital period, days
 * @param epochDays time of primary conjunction (ν + ω = 90°), days, in the data's time scale
 * @param radius1 radius of star 1 (eclipsed at primary eclipse) over the semi-major axis
 * @param radius2 radius of star 2 over the semi-major axis
 * @param inclinationDeg orbital inclination, degrees
 * @param eccentricity 0 ≤ e &lt; 1
 * @param omegaDeg argument of periastron of star 1, degrees (radial-velocity convention)
 * @param surfaceBrightnessRatio central surface-brightness ratio J = I₂(μ=1)/I₁(μ=1)
 * @param thirdLight fraction ℓ₃ of the total out-of-eclipse light, 0 ≤ ℓ₃ &lt; 1
 * @param limbDarkening1 intensity profile of star 1
 * @param limbDarkening2 intensity profile of star 2
 * @param exposureTimeDays exposure time for smearing, days (0 = instantaneous)
 * @param supersample number of sub-exposures averaged when exposureTimeDays &gt; 0
 * @param proximity ellipsoidal variation, reflection, beaming and light-travel time
 *     ({@link ProximityEffects#NONE}: two spheres)
 */
public record BinaryParameters(double periodDays, double epochDays, double radius1, double radius2,
        double inclinationDeg, double eccentricity, double omegaDeg, double surfaceBrightnessRatio,
        double thirdLight, LimbDarkening limbDarkening1, LimbDarkening limbDarkening2,
        double exposureTimeDays, int supersample, ProximityEffects proximity) {

    /**
     * Shortest period accepted, days (86.4 s: below the shortest orbital periods of detached stars
     * by far; common practice, no source).
     */
    public static final double MIN_PERIOD_DAYS = 1e-3;
    /** Longest period accepted, days (about 270 years: beyond any eclipse a light curve can hold). */
    public static final double MAX_PERIOD_DAYS = 1e5;
    /**
     * Most sub-exposures per exposure: 200 resolve a 30-minute exposure into 9-second steps, far
     * finer than any eclipse contact needs; more only costs time.
     */
    public static final int MAX_SUPERSAMPLE = 200;

    public BinaryParameters {
        Objects.requireNonNull(proximity, "proximity");
        Objects.requireNonNull(limbDarkening1, "limbDarkening1");
        Objects.requireNonNull(limbDarkening2, "limbDarkening2");
        require(periodDays >= MIN_PERIOD_DAYS && periodDays <= MAX_PERIOD_DAYS, "period", periodDays,
                "a number of days from " + MIN_PERIOD_DAYS + " to " + MAX_PERIOD_DAYS);
        require(Double.isFinite(epochDays), "epoch", epochDays, "a finite time");
        require(radius1 > 0 && radius1 < 1, "radius1", radius1, "a fractional radius R/a in (0, 1)");
        require(radius2 > 0 && radius2 < 1, "radius2", radius2, "a fractional radius R/a in (0, 1)");
        require(inclinationDeg >= 0 && inclinationDeg <= 180, "inclination", inclinationDeg, "degrees in [0, 180]");
        require(eccentricity >= 0 && eccentricity < 1, "eccentricity", eccentricity, "a value in [0, 1)");
        require(Double.isFinite(omegaDeg), "omega", omegaDeg, "a finite angle in degrees");
        require(surfaceBrightnessRatio >= 0 && Double.isFinite(surfaceBrightnessRatio), "surfaceBrightnessRatio",
                surfaceBrightnessRatio, "a ratio ≥ 0");
        require(thirdLight >= 0 && thirdLight < 1, "thirdLight", thirdLight, "a fraction in [0, 1)");
        require(exposureTimeDays >= 0 && Double.isFinite(exposureTimeDays), "exposureTime", exposureTimeDays,
                "days ≥ 0");
        require(supersample >= 1 && supersample <= MAX_SUPERSAMPLE, "supersample", supersample,
                "an integer from 1 to " + MAX_SUPERSAMPLE);
        if (radius1 + radius2 >= 1 - eccentricity) {
            throw new IllegalArgumentException(String.format(java.util.Locale.ROOT, "radius1 + radius2 = %.4g must be "
                    + "less than 1 − eccentricity = %.4g: the two spheres would touch or overlap%s", radius1 + radius2,
                    1 - eccentricity, eccentricity > 0 ? " at periastron" : ""));
        }
    }

    /** Two spheres without proximity effects. */
    public BinaryParameters(double periodDays, double epochDays, double radius1, double radius2,
            double inclinationDeg, double eccentricity, double omegaDeg, double surfaceBrightnessRatio,
            double thirdLight, LimbDarkening limbDarkening1, LimbDarkening limbDarkening2, double exposureTimeDays,
            int supersample) {
        this(periodDays, epochDays, radius1, radius2, inclinationDeg, eccentricity, omegaDeg, surfaceBrightnessRatio,
                thirdLight, limbDarkening1, limbDarkening2, exposureTimeDays, supersample, ProximityEffects.NONE);
    }

    private static void require(boolean ok, String name, double value, String expected) {
        if (!ok) {
            throw new IllegalArgumentException(name + " must be " + expected + ", got " + value);
        }
    }

    /** A circular orbit with uniform discs, no third light and no smearing. */
    public static BinaryParameters circular(double periodDays, double epochDays, double radius1, double radius2,
            double inclinationDeg, double surfaceBrightnessRatio) {
        return new BinaryParameters(periodDays, epochDays, radius1, radius2, inclinationDeg, 0, 90,
                surfaceBrightnessRatio, 0, LimbDarkening.uniform(), LimbDarkening.uniform(), 0, 1);
    }

    /** The orbit these parameters describe. */
    public Orbit orbit() {
        return new Orbit(periodDays, epochDays, eccentricity, omegaDeg, inclinationDeg);
    }

    /** r₁ + r₂. */
    public double sumOfRadii() {
        return radius1 + radius2;
    }

    /** k = r₂ / r₁. */
    public double radiusRatio() {
        return radius2 / radius1;
    }

    /** L₂/L₁ in this band: J·k²·(∫I₂ μ dμ)/(∫I₁ μ dμ). */
    public double lightRatio() {
        double k = radiusRatio();
        return surfaceBrightnessRatio * k * k * limbDarkening2.totalFlux() / limbDarkening1.totalFlux();
    }

    /** Impact parameter of the primary eclipse, b = cos i/r₁ · (1−e²)/(1+e sin ω), units of R₁. */
    public double impactParameterPrimary() {
        double w = Math.toRadians(omegaDeg);
        return Math.cos(Math.toRadians(inclinationDeg)) / radius1
                * (1 - eccentricity * eccentricity) / (1 + eccentricity * Math.sin(w));
    }

    /** Impact parameter of the secondary eclipse, units of R₂ (ν + ω = 270°). */
    public double impactParameterSecondary() {
        double w = Math.toRadians(omegaDeg);
        return Math.cos(Math.toRadians(inclinationDeg)) / radius2
                * (1 - eccentricity * eccentricity) / (1 - eccentricity * Math.sin(w));
    }

    public BinaryParameters withEpochDays(double v) {
        return new BinaryParameters(periodDays, v, radius1, radius2, inclinationDeg, eccentricity, omegaDeg,
                surfaceBrightnessRatio, thirdLight, limbDarkening1, limbDarkening2, exposureTimeDays, supersample, proximity);
    }

    public BinaryParameters withPeriodDays(double v) {
        return new BinaryParameters(v, epochDays, radius1, radius2, inclinationDeg, eccentricity, omegaDeg,
                surfaceBrightnessRatio, thirdLight, limbDarkening1, limbDarkening2, exposureTimeDays, supersample, proximity);
    }

    public BinaryParameters withRadii(double r1, double r2) {
        return new BinaryParameters(periodDays, epochDays, r1, r2, inclinationDeg, eccentricity, omegaDeg,
                surfaceBrightnessRatio, thirdLight, limbDarkening1, limbDarkening2, exposureTimeDays, supersample, proximity);
    }

    public BinaryParameters withInclinationDeg(double v) {
        return new BinaryParameters(periodDays, epochDays, radius1, radius2, v, eccentricity, omegaDeg,
                surfaceBrightnessRatio, thirdLight, limbDarkening1, limbDarkening2, exposureTimeDays, supersample, proximity);
    }

    public BinaryParameters withEccentricityOmega(double e, double wDeg) {
        return new BinaryParameters(periodDays, epochDays, radius1, radius2, inclinationDeg, e, wDeg,
                surfaceBrightnessRatio, thirdLight, limbDarkening1, limbDarkening2, exposureTimeDays, supersample, proximity);
    }

    public BinaryParameters withSurfaceBrightnessRatio(double v) {
        return new BinaryParameters(periodDays, epochDays, radius1, radius2, inclinationDeg, eccentricity, omegaDeg,
                v, thirdLight, limbDarkening1, limbDarkening2, exposureTimeDays, supersample, proximity);
    }

    public BinaryParameters withThirdLight(double v) {
        return new BinaryParameters(periodDays, epochDays, radius1, radius2, inclinationDeg, eccentricity, omegaDeg,
                surfaceBrightnessRatio, v, limbDarkening1, limbDarkening2, exposureTimeDays, supersample, proximity);
    }

    public BinaryParameters withLimbDarkening(LimbDarkening ld1, LimbDarkening ld2) {
        return new BinaryParameters(periodDays, epochDays, radius1, radius2, inclinationDeg, eccentricity, omegaDeg,
                surfaceBrightnessRatio, thirdLight, ld1, ld2, exposureTimeDays, supersample, proximity);
    }

    public BinaryParameters withExposure(double exposureDays, int subExposures) {
        return new BinaryParameters(periodDays, epochDays, radius1, radius2, inclinationDeg, eccentricity, omegaDeg,
                surfaceBrightnessRatio, thirdLight, limbDarkening1, limbDarkening2, exposureDays, subExposures, proximity);
    }

    public BinaryParameters withProximity(ProximityEffects v) {
        return new BinaryParameters(periodDays, epochDays, radius1, radius2, inclinationDeg, eccentricity, omegaDeg,
                surfaceBrightnessRatio, thirdLight, limbDarkening1, limbDarkening2, exposureTimeDays, supersample, v);
    }
}
