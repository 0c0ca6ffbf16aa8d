package org.twinlight.eclipse;

import java.util.Arrays;
import java.util.Objects;

/**
 * A limb-darkening law with its coefficients: the normalised intensity profile I(μ) of a
 * stellar disc, I(1) = 1.
 *
 * <p>Every law of {@link LimbDarkeningLaw} is held internally as a constant plus a sum of powers
 * of μ plus a μ·ln μ term, I(μ) = w₀ + Σⱼ wⱼ μ^aⱼ + w_log μ ln μ, which gives closed forms for
 * the flux of any central part of the disc ({@link #centralFlux(double)}).
 */
public final class LimbDarkening {
    private final LimbDarkeningLaw law;
    private final double[] coefficients;
    // I(μ) = constant + Σ weights[j]·μ^powers[j] + logWeight·μ·ln μ
    private final double constant;
    private final double[] powers;
    private final double[] weights;
    private final double logWeight;
    private final double totalFlux;
    // how each power of μ is evaluated from s = √μ without Math.pow where possible
    private final int[] powerKinds;
    private static final int POWER_HALF = 1;
    private static final int POWER_ONE = 2;
    private static final int POWER_THREE_HALVES = 3;
    private static final int POWER_TWO = 4;
    private static final int POWER_OTHER = 0;

    private LimbDarkening(LimbDarkeningLaw law, double[] coefficients) {
        this.law = law;
        this.coefficients = coefficients;
        double[] c = coefficients;
        switch (law) {
            case UNIFORM -> {
                constant = 1;
                powers = new double[0];
                weights = new double[0];
                logWeight = 0;
            }
            case LINEAR -> {
                constant = 1 - c[0];
                powers = new double[] {1};
                weights = new double[] {c[0]};
                logWeight = 0;
            }
            case QUADRATIC -> {
                // 1 − a(1−μ) − b(1−μ)² = (1−a−b) + (a+2b)μ − bμ²
                constant = 1 - c[0] - c[1];
                powers = new double[] {1, 2};
                weights = new double[] {c[0] + 2 * c[1], -c[1]};
                logWeight = 0;
            }
            case SQUARE_ROOT -> {
                constant = 1 - c[0] - c[1];
                powers = new double[] {1, 0.5};
                weights = new double[] {c[0], c[1]};
                logWeight = 0;
            }
            case LOGARITHMIC -> {
                constant = 1 - c[0];
                powers = new double[] {1};
                weights = new double[] {c[0]};
                logWeight = -c[1];
            }
            case POWER_2 -> {
                constant = 1 - c[0];
                powers = new double[] {c[1]};
                weights = new double[] {c[0]};
                logWeight = 0;
            }
            case FOUR_PARAMETER -> {
                constant = 1 - c[0] - c[1] - c[2] - c[3];
                powers = new double[] {0.5, 1, 1.5, 2};
                weights = new double[] {c[0], c[1], c[2], c[3]};
                logWeight = 0;
            }
            default -> throw new IllegalStateException(law.name());
        }
        this.totalFlux = centralFlux(0.0);
        this.powerKinds = new int[powers.length];
        for (int j = 0; j < powers.length; j++) {
            double a = powers[j];
            powerKinds[j] = a == 0.5 ? POWER_HALF : a == 1 ? POWER_ONE : a == 1.5 ? POWER_THREE_HALVES
                    : a == 2 ? POWER_TWO : POWER_OTHER;
        }
    }

    /**
     * A law with its coefficients.
     *
     * @throws IllegalArgumentException when the number of coefficients is wrong, a coefficient is
     *     not finite, or the power-2 exponent is not positive
     */
    public static LimbDarkening of(LimbDarkeningLaw law, double... coefficients) {
        Objects.requireNonNull(law, "law");
        double[] c = coefficients == null ? new double[0] : coefficients.clone();
        if (c.length != law.coefficientCount()) {
            throw new IllegalArgumentException("the " + law.fileName() + " law takes " + law.coefficientCount()
                    + " coefficient(s) " + Arrays.toString(law.coefficientNames()) + ", got " + c.length);
        }
        for (double v : c) {
            if (!Double.isFinite(v)) {
                throw new IllegalArgumentException("limb-darkening coefficients must be finite numbers, got " + v);
            }
        }
        if (law == LimbDarkeningLaw.POWER_2 && !(c[1] > 0)) {
            throw new IllegalArgumentException("the power-2 exponent alpha must be positive, got " + c[1]);
        }
        return new LimbDarkening(law, c);
    }

    /** Uniform disc. */
    public static LimbDarkening uniform() {
        return of(LimbDarkeningLaw.UNIFORM);
    }

    /** Quadratic law 1 − a(1−μ) − b(1−μ)². */
    public static LimbDarkening quadratic(double a, double b) {
        return of(LimbDarkeningLaw.QUADRATIC, a, b);
    }

    public LimbDarkeningLaw law() {
        return law;
    }

    public double[] coefficients() {
        return coefficients.clone();
    }

    /** Number of coefficients. */
    public int coefficientCount() {
        return coefficients.length;
    }

    /** Coefficient k. */
    public double coefficient(int k) {
        return coefficients[k];
    }

    /** The same law with other coefficients. */
    public LimbDarkening withCoefficients(double... newCoefficients) {
        return of(law, newCoefficients);
    }

    /** Normalised intensity I(μ) for 0 ≤ μ ≤ 1. */
    public double intensity(double mu) {
        double v = constant;
        for (int j = 0; j < powers.length; j++) {
            double a = powers[j];
            v += weights[j] * (a == 1 ? mu : a == 2 ? mu * mu : a == 0.5 ? Math.sqrt(mu) : Math.pow(mu, a));
        }
        if (logWeight != 0 && mu > 0) {
            v += logWeight * mu * Math.log(mu);
        }
        return v;
    }

    /**
     * I(μ) − 1 evaluated from s = √μ (0 ≤ s ≤ 1): the deficit of intensity below the disc
     * centre. Half-integer powers of μ are products of s, so only the power-2 law with a general
     * exponent and the logarithmic law call a transcendental function.
     */
    double intensityDeficitAtRootMu(double s) {
        double mu = s * s;
        double v = constant - 1.0;
        for (int j = 0; j < powerKinds.length; j++) {
            double term = switch (powerKinds[j]) {
                case POWER_HALF -> s;
                case POWER_ONE -> mu;
                case POWER_THREE_HALVES -> mu * s;
                case POWER_TWO -> mu * mu;
                default -> Math.pow(mu, powers[j]);
            };
            v += weights[j] * term;
        }
        if (logWeight != 0 && s > 0) {
            // μ ln μ = 2 s² ln s
            v += logWeight * 2 * mu * Math.log(s);
        }
        return v;
    }

    /**
     * ∫ from μ₀ to 1 of I(μ) μ dμ: the flux of the central part of the disc whose edge has μ = μ₀
     * (projected radius √(1−μ₀²)), divided by 2π, in units where the disc has radius 1.
     */
    public double centralFlux(double mu0) {
        double m = Math.max(0.0, Math.min(1.0, mu0));
        double m2 = m * m;
        double v = constant * (1 - m2) / 2;
        for (int j = 0; j < powers.length; j++) {
            double e = powers[j] + 2;
            v += weights[j] * (1 - Math.pow(m, e)) / e;
        }
        if (logWeight != 0) {
            // ∫ μ² ln μ dμ = μ³ ln μ / 3 − μ³ / 9
            double at0 = m > 0 ? m2 * m * Math.log(m) / 3 - m2 * m / 9 : 0.0;
            v += logWeight * (-1.0 / 9 - at0);
        }
        return v;
    }

    /**
     * The μ (on a grid of step 0.01 from the limb to the centre) where the intensity is lowest; a
     * physical profile has {@code intensity(lowestIntensityMu()) ≥ 0}.
     */
    public double lowestIntensityMu() {
        double best = 0;
        for (int k = 1; k <= 100; k++) {
            if (intensity(k / 100.0) < intensity(best)) {
                best = k / 100.0;
            }
        }
        return best;
    }

    /** True when the intensity is nowhere negative on the disc (checked on a grid of step 0.01 in μ). */
    public boolean isNonNegative() {
        return intensity(lowestIntensityMu()) >= 0;
    }

    /** ∫₀¹ I(μ) μ dμ: the flux of the whole disc divided by 2π (disc radius 1). */
    public double totalFlux() {
        return totalFlux;
    }

    /** A description such as {@code quadratic [0.38, 0.24]}. */
    @Override
    public String toString() {
        return law.fileName() + " " + Arrays.toString(coefficients);
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof LimbDarkening other && other.law == law && Arrays.equals(other.coefficients, coefficients);
    }

    @Override
    public int hashCode() {
        return 31 * law.hashCode() + Arrays.hashCode(coefficients);
    }
}
