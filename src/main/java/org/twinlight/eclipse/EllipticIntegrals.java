package org.twinlight.eclipse;

/**
 * Complete elliptic integrals of the first, second and third kind.
 *
 * <p>All three are evaluated with Bulirsch's general complete integral
 * <pre>
 *   cel(kc, p, a, b) = ∫₀^{π/2} (a cos²φ + b sin²φ) / [(cos²φ + p sin²φ) √(cos²φ + kc² sin²φ)] dφ
 * </pre>
 * computed by his Landen/Gauss transformation (R. Bulirsch 1969, "Numerical calculation of
 * elliptic integrals and elliptic functions. III", Numerische Mathematik 13, 305–315, algorithm
 * {@code cel}). The complementary modulus kc = √(1−k²) is an argument in its own right: callers
 * that know 1−k² as a product of small factors pass kc directly and so avoid the cancellation of
 * forming 1 − k² near k = 1.
 *
 * <p>Conventions: K(k) = ∫ dφ/√(1−k² sin²φ), E(k) = ∫ √(1−k² sin²φ) dφ and
 * Π(n, k) = ∫ dφ / [(1 − n sin²φ) √(1−k² sin²φ)], all from 0 to π/2 (the characteristic n enters
 * with a minus sign, as in Mandel &amp; Agol 2002).
 */
final class EllipticIntegrals {
    /** Square root of the double-precision unit roundoff: the iteration stops when the arithmetic
     *  and geometric means agree to this relative level, which makes the result accurate to about
     *  its square (Bulirsch 1969, section 1). */
    private static final double TOLERANCE = 1.5e-8;
    private static final int MAX_ITERATIONS = 64;

    private EllipticIntegrals() {
    }

    /** K as a function of the complementary modulus kc = √(1−k²), kc ≠ 0. */
    static double completeFirstKind(double kc) {
        return cel(kc, 1.0, 1.0, 1.0);
    }

    /** E as a function of the complementary modulus kc = √(1−k²). */
    static double completeSecondKind(double kc) {
        return cel(kc, 1.0, 1.0, kc * kc);
    }

    /**
     * α K(k) + β E(k) in one evaluation: cel is linear in its last two arguments, and
     * K = cel(kc, 1, 1, 1), E = cel(kc, 1, 1, kc²), so the combination is
     * cel(kc, 1, α + β, α + β kc²) (Bulirsch 1969, section 1).
     */
    static double combinationOfFirstAndSecondKind(double kc, double alpha, double beta) {
        return cel(kc, 1.0, alpha + beta, alpha + beta * kc * kc);
    }

    /**
     * Π(n, k) as a function of 1 − n (which must be non-zero) and kc = √(1−k²). Passing 1 − n
     * rather than n keeps its digits when n is large and negative.
     */
    static double completeThirdKind(double oneMinusN, double kc) {
        return cel(kc, oneMinusN, 1.0, 1.0);
    }

    /**
     * Bulirsch's general complete elliptic integral cel(kc, p, a, b); see the class comment.
     * For p &lt; 0 the Cauchy principal value is returned.
     *
     * @throws IllegalArgumentException when kc = 0 (the integral diverges) or p = 0
     */
    static double cel(double kc, double p, double a, double b) {
        if (kc == 0 || p == 0 || !Double.isFinite(kc) || !Double.isFinite(p)) {
            throw new IllegalArgumentException("cel needs a finite non-zero kc and p, got kc=" + kc + ", p=" + p);
        }
        double qc = Math.abs(kc);
        double e = qc;
        double m = 1.0;
        double pp;
        if (p > 0) {
            pp = Math.sqrt(p);
            b /= pp;
        } else {
            // Bulirsch's transformation of a negative p to a positive one (principal value)
            double f = qc * qc;
            double q = 1.0 - f;
            double g = 1.0 - p;
            f -= p;
            q *= b - a * p;
            pp = Math.sqrt(f / g);
            a = (a - b) / g;
            b = -q / (g * g * pp) + a * pp;
        }
        for (int i = 0; i < MAX_ITERATIONS; i++) {
            double f = a;
            a += b / pp;
            double g = e / pp;
            b += f * g;
            b += b;
            pp += g;
            g = m;
            m += qc;
            if (Math.abs(g - qc) <= g * TOLERANCE) {
                break;
            }
            qc = 2 * Math.sqrt(e);
            e = qc * m;
        }
        return 0.5 * Math.PI * (b + a * m) / (m * (m + pp));
    }
}
