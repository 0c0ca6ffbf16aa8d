package org.twinlight.eclipse;

import java.util.Locale;

/**
 * The light of a close pair between and during the eclipses beyond two spheres: ellipsoidal
 * variation, reflection (irradiation) and Doppler beaming, each off unless given, and the
 * light-travel time across the orbit (the Rømer delay of the secondary eclipse). The formulas are
 * in {@link ProximityFormulas}; how they enter the flux is in {@link BinaryModel}.
 *
 * <p>Every value is common to all bands. A quantity not given is null.
 *
 * @param massRatio q = m₂/m₁ &gt; 0, or null; needed by the ellipsoidal variation from physics, and
 *     (with {@code semiMajorAxisSolarRadii}) by the light-travel time
 * @param semiMajorAxisSolarRadii a of the relative orbit in nominal solar radii, or null
 * @param k1KmS radial-velocity semi-amplitude of star 1, km/s, or null
 * @param k2KmS radial-velocity semi-amplitude of star 2, km/s, or null
 * @param ellipsoidal the ellipsoidal variation, or null (off)
 * @param reflection the reflection, or null (off)
 * @param beaming the Doppler beaming, or null (off)
 */
public record ProximityEffects(Double massRatio, Double semiMajorAxisSolarRadii, Double k1KmS, Double k2KmS,
        Ellipsoidal ellipsoidal, Reflection reflection, Beaming beaming) {

    /** Two spheres: no proximity effect and no light-travel time. */
    public static final ProximityEffects NONE = new ProximityEffects(null, null, null, null, null, null, null);

    /**
     * Ellipsoidal variation: either from physics (mass ratio, radii, inclination, limb darkening
     * and the gravity-darkening coefficients) or a free amplitude.
     *
     * @param gravityDarkening1 τ₁ of star 1 in the band (δI/I = τ δg/g), or null with a free amplitude
     * @param gravityDarkening2 τ₂ of star 2, or null with a free amplitude
     * @param amplitude semi-amplitude of the −cos 2φ term in units of the system's light, or null
     *     when it follows from physics
     */
    public record Ellipsoidal(Double gravityDarkening1, Double gravityDarkening2, Double amplitude) {
        public Ellipsoidal {
            requireOneForm("ellipsoidal", amplitude, "gravityDarkening", gravityDarkening1, gravityDarkening2,
                    "the gravity-darkening coefficient τ of star %d in the band (about 0.3–0.5 for a convective "
                            + "envelope, 1 bolometric for a radiative one)");
        }

        /** The variation from physics. */
        public static Ellipsoidal fromPhysics(double gravityDarkening1, double gravityDarkening2) {
            return new Ellipsoidal(gravityDarkening1, gravityDarkening2, null);
        }

        /** A free semi-amplitude of the −cos 2φ term, units of the system's light. */
        public static Ellipsoidal free(double amplitude) {
            return new Ellipsoidal(null, null, amplitude);
        }

        public boolean freeAmplitude() {
            return amplitude != null;
        }
    }

    /**
     * Reflection: each star's hemisphere facing the companion re-emits a fraction of the light it
     * receives, as a Lambert sphere.
     *
     * @param albedo1 Bond albedo of star 1, 0..1
     * @param albedo2 Bond albedo of star 2, 0..1
     */
    public record Reflection(double albedo1, double albedo2) {
        public Reflection {
            requireAlbedo(albedo1, "reflection.albedo1");
            requireAlbedo(albedo2, "reflection.albedo2");
        }

        private static void requireAlbedo(double a, String key) {
            if (!(a >= 0 && a <= 1)) {
                throw new IllegalArgumentException(key + " must be a Bond albedo in [0, 1], got " + a);
            }
        }
    }

    /**
     * Doppler beaming: either from the velocity semi-amplitudes k1, k2 and the beaming factors, or a
     * free amplitude.
     *
     * @param factor1 beaming factor α of star 1 in the band, (3 − d ln F_ν/d ln ν)/4, or null with a
     *     free amplitude
     * @param factor2 beaming factor α of star 2, or null with a free amplitude
     * @param amplitude semi-amplitude of the +sin φ term in units of the system's light, or null when
     *     it follows from k1, k2
     */
    public record Beaming(Double factor1, Double factor2, Double amplitude) {
        public Beaming {
            requireOneForm("beaming", amplitude, "factor", factor1, factor2, "the beaming factor of star %d in the "
                    + "band (about 1 for a Sun-like star in V; x eˣ/(4(eˣ−1)) for a black body, x = hc/λkT)");
        }

        /** The beaming from k1, k2 with these factors. */
        public static Beaming fromVelocities(double factor1, double factor2) {
            return new Beaming(factor1, factor2, null);
        }

        /** A free semi-amplitude of the +sin φ term, units of the system's light. */
        public static Beaming free(double amplitude) {
            return new Beaming(null, null, amplitude);
        }

        public boolean freeAmplitude() {
            return amplitude != null;
        }
    }

    public ProximityEffects {
        if (massRatio != null && !(massRatio > 0 && Double.isFinite(massRatio))) {
            throw new IllegalArgumentException("massRatio must be m2/m1 > 0, got " + massRatio);
        }
        if (semiMajorAxisSolarRadii != null && !(semiMajorAxisSolarRadii > 0 && Double.isFinite(semiMajorAxisSolarRadii))) {
            throw new IllegalArgumentException("semiMajorAxis must be a positive number of solar radii, got "
                    + semiMajorAxisSolarRadii);
        }
        if (k1KmS != null && !(k1KmS > 0 && Double.isFinite(k1KmS))) {
            throw new IllegalArgumentException("k1 must be a positive velocity in km/s, got " + k1KmS);
        }
        if (k2KmS != null && !(k2KmS > 0 && Double.isFinite(k2KmS))) {
            throw new IllegalArgumentException("k2 must be a positive velocity in km/s, got " + k2KmS);
        }
        if (ellipsoidal != null && !ellipsoidal.freeAmplitude() && massRatio == null) {
            throw new IllegalArgumentException("massRatio is missing; the ellipsoidal variation from physics needs "
                    + "the mass ratio m2/m1 (or give ellipsoidal.amplitude instead)");
        }
        if (beaming != null && !beaming.freeAmplitude() && (k1KmS == null || k2KmS == null)) {
            throw new IllegalArgumentException((k1KmS == null ? "k1" : "k2") + " is missing; the beaming from "
                    + "the velocities needs k1 and k2 in km/s (or give beaming.amplitude instead)");
        }
    }

    /**
     * An effect is given either by a free amplitude or by one value per star (KEY1, KEY2), never
     * both; each number finite.
     */
    private static void requireOneForm(String effect, Double amplitude, String key, Double star1, Double star2,
            String what) {
        if (amplitude != null) {
            requireFinite(amplitude, effect + ".amplitude");
            if (star1 != null || star2 != null) {
                throw new IllegalArgumentException(effect + ": give either 'amplitude' or '" + key + "1' and '" + key
                        + "2', not both");
            }
            return;
        }
        Double[] values = {star1, star2};
        for (int star = 1; star <= 2; star++) {
            String name = effect + "." + key + star;
            requirePresent(values[star - 1], name, String.format(what, star) + ", or 'amplitude' instead");
            requireFinite(values[star - 1], name);
        }
    }

    static void requirePresent(Double v, String key, String what) {
        if (v == null) {
            throw new IllegalArgumentException(key + " is missing; expected " + what);
        }
    }

    static void requireFinite(double v, String key) {
        if (!Double.isFinite(v)) {
            throw new IllegalArgumentException(key + " must be a finite number, got " + v);
        }
    }

    /** True when the flux differs from that of two spheres out of eclipse. */
    public boolean changesLight() {
        return ellipsoidal != null || reflection != null || beaming != null;
    }

    /**
     * The mass ratio m₂/m₁ the model uses: {@code massRatio} when given, else K₁/K₂ when both
     * velocities are given, else null.
     */
    public Double effectiveMassRatio() {
        if (massRatio != null) {
            return massRatio;
        }
        return k1KmS != null && k2KmS != null ? k1KmS / k2KmS : null;
    }

    /**
     * The delay of the secondary eclipse (star 2 eclipsed) after half a period past the primary one
     * caused by the light-travel time across the orbit, seconds (circular-orbit form, see
     * {@link ProximityFormulas#secondaryDelayFromVelocities}); null when neither k1 and k2 nor the
     * mass ratio and the semi-major axis are given. From k1, k2 when both are given.
     */
    public Double secondaryDelaySeconds(double periodDays, double inclinationDeg) {
        if (k1KmS != null && k2KmS != null) {
            return ProximityFormulas.secondaryDelayFromVelocities(periodDays, k1KmS, k2KmS);
        }
        if (massRatio != null && semiMajorAxisSolarRadii != null) {
            return ProximityFormulas.secondaryDelayFromOrbit(semiMajorAxisSolarRadii, massRatio, inclinationDeg);
        }
        return null;
    }

    /** These effects with another mass ratio. */
    public ProximityEffects withMassRatio(Double q) {
        return new ProximityEffects(q, semiMajorAxisSolarRadii, k1KmS, k2KmS, ellipsoidal, reflection, beaming);
    }

    /** These effects with other ellipsoidal, reflection and beaming terms. */
    public ProximityEffects withTerms(Ellipsoidal e, Reflection r, Beaming b) {
        return new ProximityEffects(massRatio, semiMajorAxisSolarRadii, k1KmS, k2KmS, e, r, b);
    }

    @Override
    public String toString() {
        return String.format(Locale.ROOT, "proximity[q=%s, a=%s, k1=%s, k2=%s, %s, %s, %s]", massRatio,
                semiMajorAxisSolarRadii, k1KmS, k2KmS, ellipsoidal, reflection, beaming);
    }
}
