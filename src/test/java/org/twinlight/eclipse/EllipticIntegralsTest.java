package org.twinlight.eclipse;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.util.function.DoubleUnaryOperator;
import org.apache.commons.math3.analysis.integration.IterativeLegendreGaussIntegrator;
import org.junit.jupiter.api.Test;

class EllipticIntegralsTest {
    private static final double[] MODULI = {0.0, 0.1, 0.3, 0.5, 0.7, 0.9, 0.99, 0.999, 0.9999};
    private static final double[] CHARACTERISTICS = {-1e4, -100, -5, -0.5, 0.0, 0.3, 0.9, 0.99};

    /**
     * ∫₀^{π/2} f(φ) dφ with Commons Math's adaptive Gauss–Legendre integrator (Apache Commons Math
     * 3.6.1). The integrands below are smooth on the closed interval for k &lt; 1 and n &lt; 1.
     */
    private static double quadrature(DoubleUnaryOperator f) {
        return new IterativeLegendreGaussIntegrator(16, 1e-14, 1e-15, 2, 500)
                .integrate(10_000_000, f::applyAsDouble, 0.0, 0.5 * Math.PI);
    }

    private static double kc(double k) {
        return Math.sqrt((1 - k) * (1 + k));
    }

    @Test
    void firstAndSecondKindMatchTheirDefiningIntegrals() {
        // definitions K(k) = ∫ dφ/√(1−k² sin²φ), E(k) = ∫ √(1−k² sin²φ) dφ over [0, π/2]:
        // Abramowitz & Stegun 1964, Handbook of Mathematical Functions, 17.3.1 and 17.3.3 (equation
        // numbers from memory)
        for (double k : MODULI) {
            double k2 = k * k;
            double bigK = quadrature(phi -> 1 / Math.sqrt(1 - k2 * Math.sin(phi) * Math.sin(phi)));
            double bigE = quadrature(phi -> Math.sqrt(1 - k2 * Math.sin(phi) * Math.sin(phi)));
            assertThat(EllipticIntegrals.completeFirstKind(kc(k))).as("K(%s)", k).isCloseTo(bigK, within(1e-13 * bigK));
            assertThat(EllipticIntegrals.completeSecondKind(kc(k))).as("E(%s)", k).isCloseTo(bigE, within(1e-13));
        }
    }

    @Test
    void combinationOfFirstAndSecondKindIsTheSumOfItsParts() {
        // linearity of cel in its last two arguments (Bulirsch 1969, Numer. Math. 13, 305, section 1)
        for (double k : MODULI) {
            double kc = kc(k);
            double bigK = EllipticIntegrals.completeFirstKind(kc);
            double bigE = EllipticIntegrals.completeSecondKind(kc);
            for (double[] ab : new double[][] {{1, 0}, {0, 1}, {2.5, -1.5}, {-3, 7}}) {
                assertThat(EllipticIntegrals.combinationOfFirstAndSecondKind(kc, ab[0], ab[1])).as("k=%s", k)
                        .isCloseTo(ab[0] * bigK + ab[1] * bigE, within(1e-13 * (Math.abs(ab[0]) * bigK + Math.abs(ab[1]) * bigE)));
            }
        }
    }

    @Test
    void thirdKindMatchesItsDefiningIntegral() {
        // Π(n, k) = ∫ dφ / [(1 − n sin²φ) √(1−k² sin²φ)] over [0, π/2]: Abramowitz & Stegun 1964,
        // 17.7.2 (from memory; written there with the characteristic as −n; the sign used here is that of
        // Mandel & Agol 2002, ApJ 580, L171, section 3)
        for (double k : MODULI) {
            for (double n : CHARACTERISTICS) {
                double k2 = k * k;
                double bigPi = quadrature(phi -> {
                    double s2 = Math.sin(phi) * Math.sin(phi);
                    return 1 / ((1 - n * s2) * Math.sqrt(1 - k2 * s2));
                });
                assertThat(EllipticIntegrals.completeThirdKind(1 - n, kc(k))).as("Pi(%s, %s)", n, k)
                        .isCloseTo(bigPi, within(1e-13 * bigPi));
            }
        }
    }

    @Test
    void specialValuesAndLegendreRelation() {
        // K(0) = E(0) = π/2 and Π(n, 0) = π / (2√(1−n)): Abramowitz & Stegun 1964, 17.3.11 and
        // 17.7.3 ff. (from memory); E(1) = 1: A&S 17.3.12
        assertThat(EllipticIntegrals.completeFirstKind(1.0)).isCloseTo(0.5 * Math.PI, within(1e-15));
        assertThat(EllipticIntegrals.completeSecondKind(1.0)).isCloseTo(0.5 * Math.PI, within(1e-15));
        assertThat(EllipticIntegrals.completeThirdKind(4.0, 1.0)).isCloseTo(0.25 * Math.PI, within(1e-15));
        assertThat(EllipticIntegrals.completeSecondKind(1e-300)).isCloseTo(1.0, within(1e-15));
        // Legendre's relation E K' + E' K − K K' = π/2: Abramowitz & Stegun 1964, 17.3.13 (from memory)
        for (double k : new double[] {0.01, 0.2, 0.5, 0.8, 0.99, 0.999999}) {
            double kc = kc(k);
            double bigK = EllipticIntegrals.completeFirstKind(kc);
            double bigE = EllipticIntegrals.completeSecondKind(kc);
            double bigKp = EllipticIntegrals.completeFirstKind(k);
            double bigEp = EllipticIntegrals.completeSecondKind(k);
            assertThat(bigE * bigKp + bigEp * bigK - bigK * bigKp).as("k=%s", k).isCloseTo(0.5 * Math.PI, within(1e-13));
        }
    }

    @Test
    void firstKindGrowsLogarithmicallyAtUnitModulus() {
        // K(k) → ln(4/kc) as kc → 0: Abramowitz & Stegun 1964, 17.3.26 (from memory)
        double kc = 1e-9;
        assertThat(EllipticIntegrals.completeFirstKind(kc)).isCloseTo(Math.log(4 / kc), within(1e-15));
    }

    @Test
    void divergentArgumentsAreRejected() {
        assertThatThrownBy(() -> EllipticIntegrals.cel(0.0, 1.0, 1.0, 1.0)).isInstanceOf(IllegalArgumentException.class);
        assertThatThrownBy(() -> EllipticIntegrals.cel(0.5, 0.0, 1.0, 1.0)).isInstanceOf(IllegalArgumentException.class);
    }
}
