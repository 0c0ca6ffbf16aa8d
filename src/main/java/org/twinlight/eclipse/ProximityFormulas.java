package org.twinlight.eclipse;

import org.twinlight.dimensions.AstronomicalConstants;

/**
 * The published approximations behind the proximity effects, each as a pure function of its
 * parameters. Phase φ is 0 at primary conjunction (star 1 behind star 2).
 */
public final class ProximityFormulas {

    private ProximityFormulas() {
    }

    /**
     * The first three Fourier coefficients of a tidally distorted star's ellipsoidal variation,
     * ΔF/F = −A₁ cos φ − A₂ cos 2φ − A₃ cos 3φ with φ = 0 when the companion is in front of the
     * distorted star (Morris 1985, ApJ 295, 143; Morris &amp; Naftilan 1993, ApJ 419, 344, in the
     * form quoted by later work):
     * <pre>
     *   A₁ = α₁ q r⁴ sin i (5 sin²i − 4),  α₁ = 15u(2+τ) / [32(3−u)]
     *   A₂ = α₂ q r³ sin²i,                α₂ = 3(15+u)(1+τ) / [20(3−u)]
     *   A₃ = α₃ q r⁴ sin³i,                α₃ = 25u(2+τ) / [32(3−u)]
     * </pre>
     * First order in the tidal distortion: valid for r well inside the Roche lobe (common practice
     * puts the limit near r ≈ 0.25–0.3).
     *
     * @param q mass of the companion over the mass of the distorted star
     * @param r radius of the distorted star over the separation
     * @param inclinationDeg orbital inclination, degrees
     * @param u linear limb-darkening coefficient in the band
     * @param tau gravity-darkening coefficient in the band, δI/I = τ δg/g
     * @return {A₁, A₂, A₃}, fractions of the star's own light
     */
    public static double[] ellipsoidalCoefficients(double q, double r, double inclinationDeg, double u, double tau) {
        double s = Math.sin(Math.toRadians(inclinationDeg));
        double alpha1 = 15 * u * (2 + tau) / (32 * (3 - u));
        double alpha2 = 3 * (15 + u) * (1 + tau) / (20 * (3 - u));
        double alpha3 = 25 * u * (2 + tau) / (32 * (3 - u));
        double r3 = r * r * r;
        double r4 = r3 * r;
        return new double[] {alpha1 * q * r4 * s * (5 * s * s - 4), alpha2 * q * r3 * s * s, alpha3 * q * r4 * s * s * s};
    }

    /**
     * The linear limb-darkening coefficient u with the same disc-integrated flux as the law
     * given: ∫(1 − u + uμ)μ dμ = 1/2 − u/6 equals ∫I(μ)μ dμ, so u = 3 − 6∫I(μ)μ dμ (exact for the
     * linear law; for another law the ellipsoidal coefficients take this equivalent).
     */
    public static double linearEquivalent(LimbDarkening ld) {
        return 3 - 6 * ld.totalFlux();
    }

    /**
     * The Lambert-sphere phase function Φ(α) = [sin α + (π − α) cos α]/π, α the phase angle at the
     * irradiated star (0 when its heated face is seen full on): Eddington 1926, <i>The Internal
     * Constitution of the Stars</i>, §144 (written there as (sin ψ − ψ cos ψ)/π with ψ = π − α).
     */
    public static double lambertPhase(double alphaRad) {
        return (Math.sin(alphaRad) + (Math.PI - alphaRad) * Math.cos(alphaRad)) / Math.PI;
    }

    /** The geometric albedo of a Lambert sphere, A_g = (2/3) A_B (phase integral 3/2). */
    public static double geometricAlbedo(double bondAlbedo) {
        return 2.0 / 3.0 * bondAlbedo;
    }

    /**
     * Full-phase reflected light of an irradiated star as a fraction of its companion's light,
     * A_g (R/a)² for a circular orbit (Eddington 1926, §144, eq. 144-2 with A_B = 1).
     */
    public static double reflectionAmplitude(double bondAlbedo, double radius) {
        return geometricAlbedo(bondAlbedo) * radius * radius;
    }

    /**
     * Semi-amplitude of the Doppler beaming of one star as a fraction of its light,
     * 4 α K/c = (3 − d ln F_ν/d ln ν) K/c (Loeb &amp; Gaudi 2003, ApJ 588, L117; Zucker, Mazeh &amp;
     * Alexander 2007, ApJ 670, 1326), the star brightest when it approaches.
     *
     * @param factor beaming factor α in the band
     * @param kKmS radial-velocity semi-amplitude, km/s
     */
    public static double beamingAmplitude(double factor, double kKmS) {
        return 4 * factor * kKmS * 1e3 / AstronomicalConstants.SPEED_OF_LIGHT_M_S;
    }

    /**
     * The delay of the eclipse of star 2 after half a period past the eclipse of star 1, caused
     * by the light-travel time across a circular orbit: P(K₂ − K₁)/(πc) (Kaplan 2010, ApJ 717,
     * L108), seconds; positive when star 1 is the more massive.
     */
    public static double secondaryDelayFromVelocities(double periodDays, double k1KmS, double k2KmS) {
        return periodDays * AstronomicalConstants.SECONDS_PER_DAY * (k2KmS - k1KmS) * 1e3
                / (Math.PI * AstronomicalConstants.SPEED_OF_LIGHT_M_S);
    }

    /**
     * The same delay from the orbit: 2a sin i (m₁ − m₂)/[(m₁ + m₂)c] = 2a sin i (1 − q)/[(1 + q)c]
     * (Kaplan 2010, ApJ 717, L108), seconds.
     *
     * @param semiMajorAxisSolarRadii a in nominal solar radii (IAU 2015 B3)
     * @param massRatio q = m₂/m₁
     * @param inclinationDeg orbital inclination, degrees
     */
    public static double secondaryDelayFromOrbit(double semiMajorAxisSolarRadii, double massRatio,
            double inclinationDeg) {
        double aMetres = semiMajorAxisSolarRadii * AstronomicalConstants.IAU_2015_NOMINAL_SOLAR_RADIUS_M;
        return 2 * aMetres * Math.sin(Math.toRadians(inclinationDeg)) * (1 - massRatio) / (1 + massRatio)
                / AstronomicalConstants.SPEED_OF_LIGHT_M_S;
    }
}
