package org.twinlight.orbit;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.apache.commons.math3.analysis.UnivariateFunction;
import org.apache.commons.math3.optim.MaxEval;
import org.apache.commons.math3.optim.nonlinear.scalar.GoalType;
import org.apache.commons.math3.optim.univariate.BrentOptimizer;
import org.apache.commons.math3.optim.univariate.SearchInterval;
import org.apache.commons.math3.optim.univariate.UnivariateObjectiveFunction;
import org.junit.jupiter.api.Test;

class OrbitTest {

    /** Time of least projected separation near {@code guess} (Commons Math Brent minimiser). */
    private static double minimumNear(Orbit.Positions pos, double guess, double halfWidth) {
        UnivariateFunction f = t -> Math.abs(pos.signedSeparation(t));
        return new BrentOptimizer(1e-13, 1e-14).optimize(new MaxEval(500), new UnivariateObjectiveFunction(f),
                GoalType.MINIMIZE, new SearchInterval(guess - halfWidth, guess + halfWidth)).getPoint();
    }

    @Test
    void circularEdgeOnOrbitHasConjunctionsAtPhaseZeroAndHalf() {
        Orbit o = new Orbit(2.5, 100.0, 0, 90, 90);
        Orbit.Positions p = o.positions();
        assertThat(p.signedSeparation(100.0)).isCloseTo(0, within(1e-12));
        assertThat(p.signedSeparation(101.25)).isCloseTo(0, within(1e-12));
        // star 2 in front just around primary conjunction, star 1 in front around secondary
        assertThat(p.signedSeparation(100.01)).isPositive();
        assertThat(p.signedSeparation(101.26)).isNegative();
        // quadrature: separation = a
        assertThat(Math.abs(p.signedSeparation(100.625))).isCloseTo(1, within(1e-12));
        assertThat(o.secondaryPhase()).isCloseTo(0.5, within(1e-15));
    }

    @Test
    void inclinedCircularOrbitMinimumSeparationIsCosI() {
        // geometry: at conjunction the projected separation is a·cos i (e.g. Hilditch 2001, ch. 2)
        Orbit.Positions p = new Orbit(3, 0, 0, 90, 84).positions();
        assertThat(p.signedSeparation(0)).isCloseTo(Math.cos(Math.toRadians(84)), within(1e-14));
    }

    @Test
    void epochIsPrimaryConjunctionForEccentricOrbits() {
        for (double omega : new double[] {0, 37, 90, 163, 250, 311}) {
            Orbit o = new Orbit(4.2, 1000.0, 0.3, omega, 90);
            Orbit.Positions p = o.positions();
            // edge-on: primary conjunction is where the projected separation vanishes with star 2 in front
            assertThat(p.signedSeparation(1000.0)).as("omega %s", omega).isCloseTo(0, within(1e-12));
            double t2 = 1000.0 + o.secondaryPhase() * 4.2;
            assertThat(p.signedSeparation(t2)).as("omega %s", omega).isCloseTo(0, within(1e-12));
            assertThat(p.signedSeparation(1000.0 + 1e-3)).isNotNegative();
        }
    }

    @Test
    void secondaryPhaseFollowsTheFirstOrderDisplacementFormula() {
        // displacement of the secondary minimum, to first order in e at i = 90°:
        // φ₂ − 0.5 ≈ (2/π) e cos ω  (Sterne 1939, PNAS 25, 36; from memory). Second-order terms are ~e².
        for (double omega : new double[] {0, 30, 60, 120, 200}) {
            double e = 0.005;
            Orbit o = new Orbit(5, 0, e, omega, 90);
            double expected = 0.5 + 2 / Math.PI * e * Math.cos(Math.toRadians(omega));
            assertThat(o.secondaryPhase()).as("omega %s", omega).isCloseTo(expected, within(3 * e * e));
        }
    }

    @Test
    void inclinedEccentricConjunctionIsCloseToTheSeparationMinimum() {
        // for i < 90° the separation minimum is displaced from conjunction by a small amount of order
        // e·cot²i (common practice, no source): here it must stay within ~1e-4 of the period
        Orbit o = new Orbit(3.0, 50.0, 0.1, 40, 86);
        double tMin = minimumNear(o.positions(), 50.0, 0.1);
        assertThat(tMin).isCloseTo(50.0, within(3e-4));
    }

    @Test
    void quickSeparationTestNeverClaimsApartWhenTheStarsAreCloser() {
        // the shortcut must be conservative: whenever it says "apart", the exact separation agrees
        double[][] orbits = {{0, 90}, {0.2, 70}, {0.5, 200}, {0.05, 10}};
        for (double[] eo : orbits) {
            for (double inc : new double[] {90, 85, 70}) {
                Orbit.Positions p = new Orbit(1.7, 3.0, eo[0], eo[1], inc).positions();
                for (double s : new double[] {0.05, 0.2, 0.45, 0.6, 0.99, 1.2}) {
                    double w = p.conjunctionHalfWidth(s);
                    int apart = 0;
                    for (int k = 0; k < 20000; k++) {
                        double t = 3.0 + k * 1.7 / 20000 - 0.3;
                        if (p.surelyApart(t, w)) {
                            apart++;
                            assertThat(Math.abs(p.signedSeparation(t))).as("e=%s s=%s", eo[0], s)
                                    .isGreaterThanOrEqualTo(s);
                        }
                    }
                    if (s < 0.3 * (1 - eo[0])) {
                        assertThat(apart).as("e=%s s=%s: the shortcut should apply", eo[0], s).isPositive();
                    }
                }
            }
        }
    }
}
