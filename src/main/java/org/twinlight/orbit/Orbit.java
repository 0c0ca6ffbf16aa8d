package org.twinlight.orbit;

/**
 * The relative orbit of an eclipsing pair, with the conventions of the interface contract:
 * {@code epoch} is the time of primary conjunction (true anomaly ν with ν + ω = 90°, star 1
 * behind star 2), ω is the argument of periastron of star 1 in the radial-velocity convention
 * v₁ = γ + K₁[cos(ν+ω) + e cos ω], positive receding.
 *
 * <p>Lengths are in units of the semi-major axis a of the relative orbit. The distance between
 * the stars is r = (1−e²)/(1 + e cos ν); the line-of-sight coordinate of star 1 (away from the
 * observer) is proportional to r sin(ν+ω) sin i, and the separation projected on the sky is
 * r·√(1 − sin²i sin²(ν+ω)) (e.g. Hilditch 2001, <i>An Introduction to Close Binary Stars</i>,
 * ch. 2).
 *
 * @param periodDays orbital period, days, &gt; 0
 * @param epochDays time of primary conjunction, days
 * @param eccentricity 0 ≤ e &lt; 1
 * @param omegaDeg argument of periastron of star 1, degrees
 * @param inclinationDeg orbital inclination, degrees, 0..180
 */
public record Orbit(double periodDays, double epochDays, double eccentricity, double omegaDeg,
        double inclinationDeg) {

    public Orbit {
        checkElements(periodDays, epochDays, eccentricity, omegaDeg);
        if (!(inclinationDeg >= 0 && inclinationDeg <= 180)) {
            throw new IllegalArgumentException("inclination must be in [0, 180] degrees, got " + inclinationDeg);
        }
    }

    /** Refuses a period ≤ 0, a non-finite epoch or ω, and e outside [0, 1). */
    static void checkElements(double periodDays, double epochDays, double eccentricity, double omegaDeg) {
        if (!(periodDays > 0) || !Double.isFinite(periodDays)) {
            throw new IllegalArgumentException("period must be a positive number of days, got " + periodDays);
        }
        if (!Double.isFinite(epochDays)) {
            throw new IllegalArgumentException("epoch must be a finite time, got " + epochDays);
        }
        if (!(eccentricity >= 0 && eccentricity < 1)) {
            throw new IllegalArgumentException("eccentricity must be in [0, 1), got " + eccentricity);
        }
        if (!Double.isFinite(omegaDeg)) {
            throw new IllegalArgumentException("omega must be finite, got " + omegaDeg);
        }
    }

    /**
     * A calculator for this orbit, with the trigonometry done once. Not thread-safe in the sense
     * that it is immutable and may be shared; it holds no mutable state.
     */
    public Positions positions() {
        return new Positions(this);
    }

    /** Sky positions of the pair at given times, with the per-orbit constants computed once. */
    public static final class Positions {
        private final double periodDays;
        private final double inversePeriod;
        private final double epochDays;
        private final double e;
        private final double sinOmega;
        private final double cosOmega;
        private final double cos2i;
        private final double sin2i;
        private final double meanAnomalyAtEpoch;
        private final double sqrtOnePlusE;
        private final double sqrtOneMinusE;
        private final double oneMinusE2;
        private final double secondaryPhase;

        private Positions(Orbit o) {
            periodDays = o.periodDays;
            inversePeriod = 1 / o.periodDays;
            epochDays = o.epochDays;
            e = o.eccentricity;
            double w = Math.toRadians(o.omegaDeg);
            sinOmega = Math.sin(w);
            cosOmega = Math.cos(w);
            double inc = Math.toRadians(o.inclinationDeg);
            double ci = Math.cos(inc);
            cos2i = ci * ci;
            double si = Math.sin(inc);
            sin2i = si * si;
            meanAnomalyAtEpoch = KeplerEquation.meanAnomalyOfTrueAnomaly(Math.PI / 2 - w, e);
            sqrtOnePlusE = Math.sqrt(1 + e);
            sqrtOneMinusE = Math.sqrt(1 - e);
            oneMinusE2 = (1 - e) * (1 + e);
            secondaryPhase = o.secondaryPhase();
        }

        /**
         * Signed projected separation of the centres, units of a: positive when star 2 is in
         * front (star 1 may be eclipsed: the primary side of the orbit), negative when star 1 is
         * in front.
         */
        public double signedSeparation(double timeDays) {
            return separationAtCycles(cycles(timeDays));
        }

        /**
         * {@link #signedSeparation(double)} when the time lies within {@code phaseHalfWidth} of a
         * conjunction, +∞ where {@link #surelyApart(double, double)} is true: the phase is formed
         * once for both (the same numbers as calling the two).
         */
        public double separationNearConjunction(double timeDays, double phaseHalfWidth) {
            double cycles = cycles(timeDays);
            double f = cycles - Math.floor(cycles);
            if (circularDistance(f, 0) > phaseHalfWidth && circularDistance(f, secondaryPhase) > phaseHalfWidth) {
                return Double.POSITIVE_INFINITY;
            }
            return separationAtCycles(cycles);
        }

        /**
         * For a time outside the windows of {@link #surelyApart(double, double)} (half-width
         * {@code phaseHalfWidth} around each conjunction): a time before which every later time is
         * outside them too (the start of the next window, less 1e-7 of the period); the time itself
         * when it lies in a window. Lets a caller walking through sorted times skip to the next
         * window.
         */
        public double nextWindowStart(double timeDays, double phaseHalfWidth) {
            double cycles = cycles(timeDays);
            double n = Math.floor(cycles);
            double f = cycles - n;
            double start;
            if (f > phaseHalfWidth && f < secondaryPhase - phaseHalfWidth) {
                start = secondaryPhase - phaseHalfWidth;
            } else if (f > secondaryPhase + phaseHalfWidth && f < 1 - phaseHalfWidth) {
                start = 1 - phaseHalfWidth;
            } else {
                return timeDays;
            }
            return Math.max(timeDays, epochDays + periodDays * (n + start - 1e-7));
        }

        /** (t − epoch) / period, by a product with the inverse period (the windows and separations all use it). */
        private double cycles(double timeDays) {
            return (timeDays - epochDays) * inversePeriod;
        }

        /** The signed separation at {@code cycles} = (t − epoch) / period. */
        private double separationAtCycles(double cycles) {
            if (e == 0) {
                // ν + ω = 90° + φ, φ = 2π cycles: d² = sin²φ + cos²i cos²φ = cos²i + sin²i sin²φ (a sum of
                // positive terms); with cycles = N/2 + g, |g| ≤ ¼, sin φ = ±sin 2πg and cos φ has the sign
                // (−1)^N, so one sine of a reduced angle suffices
                double halfTurns = Math.rint(2 * cycles);
                double s = sinOfReducedAngle(2 * Math.PI * (cycles - 0.5 * halfTurns));
                double d = Math.sqrt(cos2i + sin2i * s * s);
                return (((long) halfTurns) & 1) == 0 ? d : -d;
            }
            double phaseRad = 2 * Math.PI * cycles;
            double ecc = KeplerEquation.eccentricAnomaly(meanAnomalyAtEpoch + phaseRad, e);
            double half = 0.5 * ecc;
            double sh = Math.sin(half);
            double ch = Math.cos(half);
            // cos ν and sin ν from the half-angle form, no second atan
            double y = sqrtOnePlusE * sh;
            double x = sqrtOneMinusE * ch;
            double n2 = x * x + y * y;
            double cosNu = (x * x - y * y) / n2;
            double sinNu = 2 * x * y / n2;
            double r = oneMinusE2 / (1 + e * cosNu);
            double sinArg = sinNu * cosOmega + cosNu * sinOmega; // sin(ν+ω)
            double cosArg = cosNu * cosOmega - sinNu * sinOmega; // cos(ν+ω)
            // √(cos² + cos²i sin²) rather than √(1 − sin²i sin²): no cancellation near conjunction
            double d = r * Math.sqrt(cosArg * cosArg + cos2i * sinArg * sinArg);
            return sinArg >= 0 ? d : -d;
        }

        /**
         * A quick test, without trigonometry, that the projected separation at this time is at
         * least the separation s that {@code phaseHalfWidth} was made for, by
         * {@link #conjunctionHalfWidth(double)}: true when the phase lies farther than that from
         * both conjunctions. Conservative: it may say false for stars that are apart, never true
         * for stars that are closer.
         */
        public boolean surelyApart(double timeDays, double phaseHalfWidth) {
            double f = cycles(timeDays);
            f -= Math.floor(f);
            return circularDistance(f, 0) > phaseHalfWidth && circularDistance(f, secondaryPhase) > phaseHalfWidth;
        }

        /**
         * Half-width in phase, around each conjunction, outside which the projected separation is
         * at least s (units of a); 0.5 (no shortcut) when no such window exists.
         *
         * <p>d = r√(cos²(ν+ω) + cos²i sin²(ν+ω)) ≥ r|sin(ν − ν_c)| ≥ (1−e) sin Δν beyond Δν of the true
         * anomaly ν_c of a conjunction, so Δν = arcsin(s/(1−e)) suffices; and since dM/dν =
         * (1−e²)^{3/2}/(1+e cos ν)² ≤ (1+e)^{3/2}/(1−e)^{1/2}, a mean-anomaly distance of Δν times
         * that bound guarantees it. A circular orbit has d² = cos²i + sin²i sin²φ exactly, φ the phase
         * angle from conjunction, so the window is arcsin √((s² − cos²i)/sin²i), none when s ≤ cos i.
         */
        public double conjunctionHalfWidth(double separation) {
            if (e == 0) {
                // circular: d² = cos²i + sin²i sin²φ (φ the phase angle from conjunction), so d < s only where
                // sin²φ < (s² − cos²i) / sin²i
                double sin2Phase = (separation * separation - cos2i) / sin2i;
                if (sin2Phase >= 1) {
                    return 0.5;
                }
                double dPhase = sin2Phase > 0 ? Math.asin(Math.sqrt(sin2Phase)) : 0.0;
                return Math.min(0.5, dPhase / (2 * Math.PI) * (1 + 1e-9) + 1e-12);
            }
            double sinDnu = separation / (1 - e);
            if (sinDnu >= 1) {
                return 0.5;
            }
            double dMean = Math.asin(sinDnu) * Math.pow(1 + e, 1.5) / Math.sqrt(1 - e);
            return Math.min(0.5, dMean / (2 * Math.PI) * (1 + 1e-9) + 1e-12);
        }

        /**
         * sin x for |x| ≤ π/2: the Taylor series through x¹⁵ when |x| ≤ 0.6 (the angles near a
         * conjunction; the first term left out, x¹⁷/17!, is below 5e-19 there, far below an ulp of
         * sin x), {@link Math#sin} beyond.
         */
        static double sinOfReducedAngle(double x) {
            if (!(Math.abs(x) <= 0.6)) {
                return Math.sin(x);
            }
            double x2 = x * x;
            double p = -1.0 / 1307674368000.0;
            p = p * x2 + 1.0 / 6227020800.0;
            p = p * x2 - 1.0 / 39916800.0;
            p = p * x2 + 1.0 / 362880.0;
            p = p * x2 - 1.0 / 5040.0;
            p = p * x2 + 1.0 / 120.0;
            p = p * x2 - 1.0 / 6.0;
            return x + x * x2 * p;
        }

        private static double circularDistance(double a, double b) {
            double d = Math.abs(a - b);
            return d > 0.5 ? 1 - d : d;
        }

        /** Orbital phase of a time, 0 at primary conjunction, in [0, 1). */
        public double phase(double timeDays) {
            double ph = (timeDays - epochDays) / periodDays;
            return ph - Math.floor(ph);
        }
    }

    /**
     * Phase of the secondary conjunction (ν + ω = 270°) after the primary one, in (0, 1);
     * 0.5 for a circular orbit.
     */
    public double secondaryPhase() {
        double w = Math.toRadians(omegaDeg);
        double m1 = KeplerEquation.meanAnomalyOfTrueAnomaly(Math.PI / 2 - w, eccentricity);
        double m2 = KeplerEquation.meanAnomalyOfTrueAnomaly(3 * Math.PI / 2 - w, eccentricity);
        double ph = (m2 - m1) / (2 * Math.PI);
        return ph - Math.floor(ph);
    }
}
