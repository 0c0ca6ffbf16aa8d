package org.twinlight.eclipse;

import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.Map;
import org.twinlight.dimensions.AstronomicalConstants;
import org.twinlight.orbit.KeplerEquation;
import org.twinlight.orbit.Orbit;

/**
 * The normalised flux of two limb-darkened spheres in orbit, with third light and exposure
 * smearing:
 *
 * <pre>
 *   F = [(L₁ − ΔL₁) + (L₂ − ΔL₂)] / (L₁ + L₂) · (1 − ℓ₃) + ℓ₃
 * </pre>
 *
 * where ΔLⱼ is the light of star j hidden by the other star (at most one of them is non-zero at a
 * time), so that the out-of-eclipse flux is 1.
 *
 * <p>With proximity effects ({@link ProximityEffects}) each star's light gains a phase-dependent
 * part Eⱼ(φ) (units of the system's light: ellipsoidal variation, the light it reflects from its
 * companion, its beaming) and the star's whole light is dimmed by the fraction of it hidden:
 *
 * <pre>
 *   F = [(L₁ + E₁)(1 − h₁) + (L₂ + E₂)(1 − h₂)] / (L₁ + L₂) · (1 − ℓ₃) + ℓ₃,   hⱼ = ΔLⱼ/Lⱼ,
 * </pre>
 *
 * so a heated face behind its companion does not shine (to the accuracy of spreading the extra
 * light over the disc like the star's own). With the light-travel time across the orbit the
 * eclipse of star 2 comes {@link ProximityEffects#secondaryDelaySeconds} late.
 *
 * <p>Immutable and thread-safe.
 */
public final class BinaryModel {
    private final BinaryParameters parameters;
    private final Orbit.Positions positions;
    private final double r1;
    private final double r2;
    private final double inverseR1;
    private final double inverseR2;
    private final double contactDistance;
    private final double contactPhaseHalfWidth;
    private final double weight1;
    private final double weight2;
    private final double thirdLight;
    private final LimbDarkening ld1;
    private final LimbDarkening ld2;
    private final double[] subExposureOffsets;
    /** Delay of the eclipse of star 2 by the light-travel time, days (0 without it). */
    private final double secondaryDelayDays;
    /** The proximity terms, or null for two spheres. */
    private final Terms terms;

    public BinaryModel(BinaryParameters p) {
        this.parameters = p;
        this.positions = p.orbit().positions();
        this.r1 = p.radius1();
        this.r2 = p.radius2();
        this.inverseR1 = 1 / r1;
        this.inverseR2 = 1 / r2;
        this.contactDistance = r1 + r2;
        Double delay = p.proximity().secondaryDelaySeconds(p.periodDays(), p.inclinationDeg());
        this.secondaryDelayDays = delay == null ? 0.0 : delay / AstronomicalConstants.SECONDS_PER_DAY;
        // widened by the delay so that a shifted secondary eclipse is never skipped
        this.contactPhaseHalfWidth = Math.min(0.5, positions.conjunctionHalfWidth(contactDistance)
                + Math.abs(secondaryDelayDays) / p.periodDays());
        double lightRatio = p.lightRatio();
        this.weight1 = 1 / (1 + lightRatio);
        this.weight2 = lightRatio / (1 + lightRatio);
        this.thirdLight = p.thirdLight();
        this.ld1 = p.limbDarkening1();
        this.ld2 = p.limbDarkening2();
        int n = p.exposureTimeDays() > 0 ? p.supersample() : 1;
        this.subExposureOffsets = new double[n];
        for (int k = 0; k < n; k++) {
            subExposureOffsets[k] = n == 1 ? 0.0 : p.exposureTimeDays() * ((k + 0.5) / n - 0.5);
        }
        this.terms = p.proximity().changesLight() ? new Terms(p, weight1, weight2) : null;
    }

    public BinaryParameters parameters() {
        return parameters;
    }

    /** Normalised flux at one time, including exposure smearing. */
    public double flux(double timeDays) {
        if (subExposureOffsets.length == 1) {
            return instantaneousFlux(timeDays);
        }
        double sum = 0;
        for (double dt : subExposureOffsets) {
            sum += instantaneousFlux(timeDays + dt);
        }
        return sum / subExposureOffsets.length;
    }

    /**
     * Normalised flux at many times, into {@code out} (same length). When many points fall in an
     * eclipse of a star, its hidden fraction comes from an {@link OccultationTable} built for this
     * call over the separations needed (within 1e-8 of the exact value); otherwise, and in
     * {@link #flux(double)}, it is computed exactly.
     */
    public void flux(double[] timesDays, double[] out) {
        EclipseRanges ranges = new EclipseRanges();
        boolean instantaneous = subExposureOffsets.length == 1;
        // in a run of ascending times, those before the next conjunction window need no test
        double previous = Double.NEGATIVE_INFINITY;
        double skipUntil = Double.NEGATIVE_INFINITY;
        for (int i = 0; i < timesDays.length; i++) {
            if (instantaneous) {
                double t = timesDays[i];
                if (t >= previous && t < skipUntil) {
                    out[i] = Double.POSITIVE_INFINITY;
                } else {
                    double d = eclipseSeparation(t);
                    ranges.add(d);
                    out[i] = d; // kept for the second pass
                    if (d == Double.POSITIVE_INFINITY) {
                        skipUntil = positions.nextWindowStart(t, contactPhaseHalfWidth);
                    }
                }
                previous = t;
                continue;
            }
            for (double dt : subExposureOffsets) {
                ranges.add(eclipseSeparation(timesDays[i] + dt));
            }
        }
        OccultationTable table1 = ranges.table(ld1, r2 / r1, r1, ranges.count1, ranges.min1, ranges.max1);
        OccultationTable table2 = ranges.table(ld2, r1 / r2, r2, ranges.count2, ranges.min2, ranges.max2);
        for (int i = 0; i < timesDays.length; i++) {
            if (instantaneous) {
                out[i] = instantaneousFlux(timesDays[i], out[i], table1, table2);
                continue;
            }
            double sum = 0;
            for (double dt : subExposureOffsets) {
                double t = timesDays[i] + dt;
                sum += instantaneousFlux(t, eclipseSeparation(t), table1, table2);
            }
            out[i] = sum / subExposureOffsets.length;
        }
    }

    /**
     * {@link #flux(double[], double[])} for times in ascending order (the caller's promise, not
     * checked), the same numbers, faster: between the windows around the conjunctions no time is
     * visited (the end of a gap is found by a search), and the second pass touches only the times
     * in a window. Returns the index ranges of the times in a window, {a₀, b₀, a₁, b₁, ...} with
     * aₖ &lt; bₖ ascending, outside which every flux is exactly 1; null when it does not know such
     * ranges (exposure smearing or proximity effects: then it is {@link #flux(double[], double[])}).
     */
    public int[] fluxOfAscendingTimes(double[] timesDays, double[] out) {
        if (subExposureOffsets.length != 1 || terms != null) {
            flux(timesDays, out);
            return null;
        }
        EclipseRanges ranges = new EclipseRanges();
        int n = timesDays.length;
        int[] runs = new int[16];
        int runCount = 0;
        int i = 0;
        while (i < n) {
            double d = eclipseSeparation(timesDays[i]);
            if (d == Double.POSITIVE_INFINITY) {
                int j = firstAtOrAfter(timesDays, i + 1, positions.nextWindowStart(timesDays[i], contactPhaseHalfWidth));
                Arrays.fill(out, i, j, 1.0);
                i = j;
                continue;
            }
            int a = i;
            while (d != Double.POSITIVE_INFINITY) {
                ranges.add(d);
                out[i] = d; // kept for the second pass
                if (++i == n) {
                    break;
                }
                d = eclipseSeparation(timesDays[i]);
            }
            if (runCount + 2 > runs.length) {
                runs = Arrays.copyOf(runs, 2 * runs.length);
            }
            runs[runCount++] = a;
            runs[runCount++] = i;
        }
        OccultationTable table1 = ranges.table(ld1, r2 / r1, r1, ranges.count1, ranges.min1, ranges.max1);
        OccultationTable table2 = ranges.table(ld2, r1 / r2, r2, ranges.count2, ranges.min2, ranges.max2);
        for (int k = 0; k < runCount; k += 2) {
            for (int j = runs[k]; j < runs[k + 1]; j++) {
                out[j] = instantaneousFlux(timesDays[j], out[j], table1, table2);
            }
        }
        return Arrays.copyOf(runs, runCount);
    }

    /** The first index ≥ {@code from} whose time is ≥ {@code limit} (n if none), times ascending: a galloping search. */
    private static int firstAtOrAfter(double[] t, int from, double limit) {
        int n = t.length;
        if (from >= n || t[from] >= limit) {
            return Math.min(from, n);
        }
        // t[lo] < limit; widen the step until t[hi] ≥ limit or the end
        int lo = from;
        int step = 1;
        int hi = from + 1;
        while (hi < n && t[hi] < limit) {
            lo = hi;
            step <<= 1;
            hi = lo + step;
        }
        hi = Math.min(hi, n);
        // t[lo] < limit ≤ t[hi] (hi = n: past the end)
        while (hi - lo > 1) {
            int mid = (lo + hi) >>> 1;
            if (t[mid] < limit) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        return hi;
    }

    /** How many separations of one call fall in each eclipse, and their range. */
    private final class EclipseRanges {
        int count1;
        int count2;
        double min1 = Double.POSITIVE_INFINITY;
        double max1 = 0;
        double min2 = Double.POSITIVE_INFINITY;
        double max2 = 0;

        void add(double d) {
            double ad = Math.abs(d);
            if (!(ad < contactDistance)) {
                return;
            }
            if (d >= 0) {
                count1++;
                min1 = Math.min(min1, ad);
                max1 = Math.max(max1, ad);
            } else {
                count2++;
                min2 = Math.min(min2, ad);
                max2 = Math.max(max2, ad);
            }
        }

        /** A table for the star of radius {@code radius} when enough points fall in its eclipse, else null. */
        OccultationTable table(LimbDarkening ld, double p, double radius, int count, double min, double max) {
            if (count < OccultationTable.MIN_POINTS || !(p > 0) || !Double.isFinite(p)) {
                return null;
            }
            return new OccultationTable(ld, p, min / radius, max / radius);
        }
    }

    /** Normalised flux at many times. */
    public double[] flux(double[] timesDays) {
        double[] out = new double[timesDays.length];
        flux(timesDays, out);
        return out;
    }

    /** Normalised flux at an instant, no smearing. */
    public double instantaneousFlux(double timeDays) {
        return instantaneousFlux(timeDays, eclipseSeparation(timeDays), null, null);
    }

    /**
     * The flux at an instant whose eclipse separation is {@code d}, with the hidden fractions from
     * the tables where given (exact where null).
     */
    private double instantaneousFlux(double timeDays, double d, OccultationTable table1, OccultationTable table2) {
        double hidden1 = 0;
        double hidden2 = 0;
        double ad = Math.abs(d);
        if (ad < contactDistance) {
            if (d >= 0) {
                // star 2 in front of star 1: primary eclipse
                double z = ad / r1;
                hidden1 = table1 != null ? table1.hiddenFraction(z) : Occultation.hiddenFraction(ld1, r2 / r1, z);
            } else {
                double z = ad / r2;
                hidden2 = table2 != null ? table2.hiddenFraction(z) : Occultation.hiddenFraction(ld2, r1 / r2, z);
            }
        }
        if (terms == null) {
            if (hidden1 == 0 && hidden2 == 0) {
                return 1.0;
            }
            return 1.0 - (weight1 * hidden1 + weight2 * hidden2) * (1 - thirdLight);
        }
        double x = (timeDays - terms.epochDays) / terms.periodDays;
        x = (x - Math.floor(x)) * Terms.TABLE_SIZE;
        int i = (int) x;
        double u = x - i;
        double stars = (weight1 + Terms.interpolate(terms.table1, i, u)) * (1 - hidden1)
                + (weight2 + Terms.interpolate(terms.table2, i, u)) * (1 - hidden2);
        return stars * (1 - thirdLight) + thirdLight;
    }

    /** True when one star hides part of the other at this instant. */
    public boolean inEclipse(double timeDays) {
        return Math.abs(eclipseSeparation(timeDays)) < contactDistance;
    }

    /**
     * The signed projected separation that decides the eclipse (positive: star 2 in front), at the
     * time the light of the star behind left it; +∞ when the stars are surely apart.
     */
    private double eclipseSeparation(double timeDays) {
        double d = positions.separationNearConjunction(timeDays, contactPhaseHalfWidth);
        if (d < 0 && secondaryDelayDays != 0) {
            // star 1 in front: the light of star 2 left it a little earlier or later
            d = positions.signedSeparation(timeDays - secondaryDelayDays);
        }
        return d;
    }

    /**
     * The extra light of each star out of eclipse, units of the system's light (third light
     * excluded): {E₁, E₂} at this instant (see {@link ProximityEffects}); {0, 0} for two spheres.
     * Computed from the formulas directly; {@link #flux} interpolates them in a table over phase.
     */
    public double[] extraLight(double timeDays) {
        return terms == null ? new double[2] : terms.extraLight(timeDays);
    }

    /**
     * The sizes of the proximity terms this model holds, in units of the whole light (third light
     * included), at a separation of a: {@code ellipsoidalAmplitude} (the −cos 2φ semi-amplitude of
     * both stars), {@code reflectionAmplitude1}, {@code reflectionAmplitude2} (the light each star's
     * heated face adds when seen full), {@code beamingAmplitude} (the +sin φ semi-amplitude), each
     * only when its effect is on, and {@code lightTravelTimeSeconds} (the delay of the secondary
     * eclipse) when it is known. Empty for two spheres.
     */
    public Map<String, Double> proximityAmplitudes() {
        Map<String, Double> out = new LinkedHashMap<>();
        ProximityEffects x = parameters.proximity();
        double scale = 1 - thirdLight;
        if (x.ellipsoidal() != null) {
            out.put("ellipsoidalAmplitude", scale * (terms.ell1[1] + terms.ell2[1]));
        }
        if (x.reflection() != null) {
            out.put("reflectionAmplitude1", scale * terms.refl1);
            out.put("reflectionAmplitude2", scale * terms.refl2);
        }
        if (x.beaming() != null) {
            out.put("beamingAmplitude", scale * (terms.beam1 + terms.beam2));
        }
        Double delay = x.secondaryDelaySeconds(parameters.periodDays(), parameters.inclinationDeg());
        if (delay != null) {
            out.put("lightTravelTimeSeconds", delay);
        }
        return out;
    }

    /**
     * The proximity terms with their constants computed once. The phase angle θ = ν + ω − 90° is 0
     * at primary conjunction; in an eccentric orbit each term scales with the separation s (units
     * of a) as the tide (s⁻³ for cos 2θ, s⁻⁴ for cos θ and cos 3θ), the irradiation (s⁻²) and the
     * velocity do, to first order.
     */
    private static final class Terms {
        /** Nodes of the tables over one orbital period. */
        static final int TABLE_SIZE = 256;
        private final double periodDays;
        private final double epochDays;
        private final double e;
        private final double omegaRad;
        private final double meanAnomalyAtEpoch;
        private final double sinI;
        /** Ellipsoidal coefficients in system light, star j: −Σₖ cⱼₖ cos kθⱼ, θ₂ = θ + π. */
        private final double[] ell1 = new double[3];
        private final double[] ell2 = new double[3];
        /** Full-phase reflected light of each star, system light. */
        private final double refl1;
        private final double refl2;
        /** Beaming of each star, +bⱼ sin θ, system light. */
        private final double beam1;
        private final double beam2;
        /** E₁ and E₂ at the phases (k − 1)/N, k = 0..N+2. */
        final double[] table1;
        final double[] table2;

        Terms(BinaryParameters p, double w1, double w2) {
            periodDays = p.periodDays();
            epochDays = p.epochDays();
            e = p.eccentricity();
            omegaRad = Math.toRadians(p.omegaDeg());
            meanAnomalyAtEpoch = KeplerEquation.meanAnomalyOfTrueAnomaly(Math.PI / 2 - omegaRad, e);
            sinI = Math.sin(Math.toRadians(p.inclinationDeg()));
            ProximityEffects x = p.proximity();
            if (x.ellipsoidal() != null) {
                if (x.ellipsoidal().freeAmplitude()) {
                    // a free amplitude is shared as the tides' cos 2θ terms are: ∝ Lⱼ rⱼ³
                    double a1 = w1 * Math.pow(p.radius1(), 3);
                    double a2 = w2 * Math.pow(p.radius2(), 3);
                    double amplitude = x.ellipsoidal().amplitude();
                    ell1[1] = amplitude * a1 / (a1 + a2);
                    ell2[1] = amplitude * a2 / (a1 + a2);
                } else {
                    double q = x.massRatio();
                    double[] c1 = ProximityFormulas.ellipsoidalCoefficients(q, p.radius1(), p.inclinationDeg(),
                            ProximityFormulas.linearEquivalent(p.limbDarkening1()), x.ellipsoidal().gravityDarkening1());
                    double[] c2 = ProximityFormulas.ellipsoidalCoefficients(1 / q, p.radius2(), p.inclinationDeg(),
                            ProximityFormulas.linearEquivalent(p.limbDarkening2()), x.ellipsoidal().gravityDarkening2());
                    for (int k = 0; k < 3; k++) {
                        ell1[k] = w1 * c1[k];
                        ell2[k] = w2 * c2[k];
                    }
                }
            }
            if (x.reflection() != null) {
                refl1 = w2 * ProximityFormulas.reflectionAmplitude(x.reflection().albedo1(), p.radius1());
                refl2 = w1 * ProximityFormulas.reflectionAmplitude(x.reflection().albedo2(), p.radius2());
            } else {
                refl1 = 0;
                refl2 = 0;
            }
            if (x.beaming() == null) {
                beam1 = 0;
                beam2 = 0;
            } else if (x.beaming().freeAmplitude()) {
                beam1 = w1 * x.beaming().amplitude();
                beam2 = w2 * x.beaming().amplitude();
            } else {
                // v₁ = −K₁ sin θ, v₂ = +K₂ sin θ (receding positive); ΔF/F = −4α v/c
                beam1 = w1 * ProximityFormulas.beamingAmplitude(x.beaming().factor1(), x.k1KmS());
                beam2 = -w2 * ProximityFormulas.beamingAmplitude(x.beaming().factor2(), x.k2KmS());
            }
            double[][] t = tables();
            table1 = t[0];
            table2 = t[1];
        }

        /**
         * The terms at the table's phases (k − 1)/N, with one node of margin on each side for the
         * cubic interpolation: {E₁ nodes, E₂ nodes}.
         */
        private double[][] tables() {
            double[][] t = new double[2][TABLE_SIZE + 3];
            for (int k = 0; k < t[0].length; k++) {
                double[] v = atPhase((k - 1) / (double) TABLE_SIZE);
                t[0][k] = v[0];
                t[1][k] = v[1];
            }
            return t;
        }

        /**
         * The value at phase (i + u)/N, 0 ≤ u &lt; 1, by Catmull–Rom cubic interpolation between
         * the table's nodes (continuous with its first derivative; exact at the nodes). The terms
         * are smooth in phase (the Lambert phase function's third derivative jumps only at full
         * phase when i = 90°), so 256 nodes leave an error below 1e-7 of the system's light even
         * edge-on with albedos of 1 and r = 0.2 (checked by test), far below the noise of any
         * photometry.
         */
        static double interpolate(double[] table, int i, double u) {
            double p0 = table[i];
            double p1 = table[i + 1];
            double p2 = table[i + 2];
            double p3 = table[i + 3];
            return p1 + 0.5 * u * (p2 - p0 + u * (2 * p0 - 5 * p1 + 4 * p2 - p3 + u * (3 * (p1 - p2) + p3 - p0)));
        }

        double[] extraLight(double timeDays) {
            double phase = (timeDays - epochDays) / periodDays;
            return atPhase(phase - Math.floor(phase));
        }

        /** {E₁, E₂} at an orbital phase (fraction of the period after primary conjunction). */
        private double[] atPhase(double phase) {
            double cosT;
            double sinT;
            double inv;
            if (e == 0) {
                double theta = 2 * Math.PI * phase;
                cosT = Math.cos(theta);
                sinT = Math.sin(theta);
                inv = 1;
            } else {
                double mean = meanAnomalyAtEpoch + 2 * Math.PI * phase;
                double nu = KeplerEquation.trueAnomaly(KeplerEquation.eccentricAnomaly(mean, e), e);
                double arg = nu + omegaRad;
                cosT = Math.sin(arg);
                sinT = -Math.cos(arg);
                inv = (1 + e * Math.cos(nu)) / ((1 - e) * (1 + e));
            }
            double cos2 = 2 * cosT * cosT - 1;
            double cos3 = cosT * (2 * cos2 - 1);
            double inv2 = inv * inv;
            double inv3 = inv2 * inv;
            double inv4 = inv2 * inv2;
            // star 2's angle is θ + π: cos θ and cos 3θ change sign, cos 2θ does not
            double e1 = -(ell1[0] * cosT + ell1[2] * cos3) * inv4 - ell1[1] * cos2 * inv3;
            double e2 = (ell2[0] * cosT + ell2[2] * cos3) * inv4 - ell2[1] * cos2 * inv3;
            if (refl1 != 0 || refl2 != 0) {
                // phase angle at star 1: cos α₁ = sin i cos θ (heated face seen full at primary conjunction);
                // at star 2, α₂ = π − α₁
                double x = sinI * cosT;
                double alpha1 = Math.acos(Math.max(-1, Math.min(1, x)));
                double sinAlpha = Math.sqrt(Math.max(0, 1 - x * x));
                e1 += refl1 * (sinAlpha + (Math.PI - alpha1) * x) / Math.PI * inv2;
                e2 += refl2 * (sinAlpha - alpha1 * x) / Math.PI * inv2;
            }
            e1 += beam1 * sinT;
            e2 += beam2 * sinT;
            return new double[] {e1, e2};
        }
    }
}
