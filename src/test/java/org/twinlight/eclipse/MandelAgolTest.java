package org.twinlight.eclipse;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;

class MandelAgolTest {
    private static final double[][] COEFFICIENTS = {{0.6, 0.0}, {1.0, 0.0}, {0.4, 0.26}, {0.1, 0.6}, {0.9, -0.3}};

    /**
     * Hidden fraction of a central eclipse (z = 0) of a quadratic-law star, exactly:
     * δ₀ = 2[G(1) − G(√(1−p²))] / (1 − u₁/3 − u₂/6), with
     * G(μ) = (1−u₁−u₂)μ²/2 + (u₁+2u₂)μ³/3 − u₂μ⁴/4 (exact: from the
     * integral of I(μ)μ dμ over the hidden disc r &lt; p).
     */
    private static double centralDepth(double u1, double u2, double p) {
        double mu = Math.sqrt(1 - p * p);
        return 2 * (g(u1, u2, 1) - g(u1, u2, mu)) / (1 - u1 / 3 - u2 / 6);
    }

    private static double g(double u1, double u2, double mu) {
        return (1 - u1 - u2) * mu * mu / 2 + (u1 + 2 * u2) * mu * mu * mu / 3 - u2 * mu * mu * mu * mu / 4;
    }

    @Test
    void centralEclipseMatchesTheClosedFormDepthsComputedOutsideTheProject() {
        // depths computed from the exact closed form above, outside the project (integration of the
        // quadratic law over the central disc, checked against numerical quadrature to 1e-16); they are
        // not published values: REFERENCE-VALUES.md §6, "self-computed check numbers"
        assertThat(Occultation.hiddenFraction(LimbDarkening.quadratic(0.4, 0.26), 0.1, 0.0))
                .isCloseTo(0.0121335565, within(1e-10));
        assertThat(Occultation.hiddenFraction(LimbDarkening.quadratic(0.0, 0.0), 0.1, 0.0))
                .isCloseTo(0.0100000, within(1e-10));
        assertThat(Occultation.hiddenFraction(LimbDarkening.quadratic(0.6, 0.0), 0.2, 0.0))
                .isCloseTo(0.0496979694, within(1e-10));
        assertThat(Occultation.hiddenFraction(LimbDarkening.of(LimbDarkeningLaw.LINEAR, 0.6), 0.2, 0.0))
                .isCloseTo(0.0496979694, within(1e-10));
    }

    @Test
    void centralEclipseMatchesTheExactFormulaForManyRadii() {
        for (double[] u : COEFFICIENTS) {
            LimbDarkening ld = LimbDarkening.quadratic(u[0], u[1]);
            for (double p : new double[] {0.01, 0.05, 0.1, 0.3, 0.5, 0.8, 0.99, 1.0}) {
                double exact = centralDepth(u[0], u[1], p);
                assertThat(Occultation.hiddenFraction(ld, p, 0.0)).as("u=%s p=%s", u, p).isCloseTo(exact, within(1e-13));
                // just off centre the closed form (λ₂ of MA02) takes over; the depth is flat there to O(z²)
                if (p < 1) {
                    assertThat(MandelAgol.hiddenFraction(u[0], u[1], p, 2e-4)).isCloseTo(exact, within(1e-6));
                }
            }
        }
    }

    @Test
    void closedFormAgreesWithTheGeneralQuadratureOverADenseGrid() {
        // MA02 Table 1 (λᵉ, λ₁, λ₂, η₁, η₂) against the general method of Occultation with its finest
        // rule, which a separate test checks against an independent Commons Math integration
        double[] radii = {0.003, 0.02, 0.05, 0.1, 0.2, 0.35, 0.5, 0.65, 0.8, 0.95, 1.0, 1.05, 1.3, 2.0, 4.0, 10.0, 20.0, 80.0};
        for (double[] u : COEFFICIENTS) {
            LimbDarkening ld = u[1] == 0 ? LimbDarkening.of(LimbDarkeningLaw.LINEAR, u[0]) : LimbDarkening.quadratic(u[0], u[1]);
            for (double p : radii) {
                double zLow = Math.max(0, p - 1);
                for (int i = 1; i < 120; i++) {
                    double z = zLow + (1 + p - zLow) * i / 120.0;
                    double closed = MandelAgol.hiddenFraction(u[0], u[1], p, z);
                    if (Double.isNaN(closed)) {
                        continue;
                    }
                    double quadrature = Occultation.byQuadrature(ld, p, z, DiscOverlap.areaOverPi(p, z), Occultation.FINEST_RULE);
                    // the terms of λ₁ grow like p³ and cancel (see MandelAgol.LARGE_P)
                    assertThat(closed).as("%s p=%s z=%s", ld, p, z).isCloseTo(quadrature, within(1e-11 + 2e-15 * p * p * p));
                }
            }
        }
    }

    @Test
    void closedFormKeepsItsDigitsCloseToTheSpecialLines() {
        // distances 1e-2 .. 1e-8 from z = p, z = 1−p and z = p−1 (MA02 Table 1, cases 4, 5, 7, 8):
        // thanks to the factored differences the general expressions stay good to ~1e-12 there
        double u1 = 0.4;
        double u2 = 0.26;
        LimbDarkening ld = LimbDarkening.quadratic(u1, u2);
        for (double p : new double[] {0.01, 0.1, 0.3, 0.5, 0.7, 0.999, 1.001, 1.5, 5.0, 20.0}) {
            for (double line : new double[] {p, 1 - p, p - 1}) {
                for (int k = 2; k <= 8; k++) {
                    for (int sign = -1; sign <= 1; sign += 2) {
                        double z = line + sign * Math.pow(10, -k) * Math.max(1, p);
                        if (z <= Math.max(0, p - 1) || z >= 1 + p) {
                            continue;
                        }
                        double closed = MandelAgol.hiddenFraction(u1, u2, p, z);
                        if (Double.isNaN(closed)) {
                            continue;
                        }
                        double quadrature = Occultation.byQuadrature(ld, p, z, DiscOverlap.areaOverPi(p, z), Occultation.FINEST_RULE);
                        assertThat(closed).as("p=%s z=%s", p, z).isCloseTo(quadrature, within(1e-11));
                    }
                }
            }
        }
    }

    @Test
    void closedFormDeclinesOnTheSpecialLines() {
        assertThat(MandelAgol.hiddenFraction(0.4, 0.26, 0.3, 0.3)).isNaN();
        assertThat(MandelAgol.hiddenFraction(0.4, 0.26, 0.3, 0.7)).isNaN();
        assertThat(MandelAgol.hiddenFraction(0.4, 0.26, 0.5, 0.5)).isNaN();
        assertThat(MandelAgol.hiddenFraction(0.4, 0.26, 1.0, 5e-5)).isNaN();
        assertThat(MandelAgol.hiddenFraction(0.4, 0.26, 300.0, 300.5)).isNaN();
        assertThat(MandelAgol.hiddenFraction(0.4, 0.26, 1e-4, 0.5)).isNaN();
        assertThat(MandelAgol.hiddenFraction(0.4, 0.26, 0.3, 0.5)).isBetween(0.0, 1.0);
    }
}
