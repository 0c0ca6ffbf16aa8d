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
        // φ₂ − 0.5 ≈ (2/π) e cos ω (Kallrath & Milone 2009, Eclipsing Binary Stars, 2nd ed., eq. 3.1.24,
        // the i ≈ 90° form e cos ω = (π/2P)(t_II − t_I − P/2)). Second-order terms are ~e².
        for (double omega : new double[] {0, 30, 60, 120, 200}) {
            double e = 0.005;
            Orbit o = new Orbit(5, 0, e, omega, 90);
            double expected = 0.5 + 2 / Math.PI * e * Math.cos(Math.toRadians(omega));
            assertThat(o.secondaryPhase()).as("omega %s", omega).isCloseTo(expected, within(3 * e * e));
        }
    }

    @Test
    void projectedSeparationInAnEccentricOrbitFollowsTheKeplerEllipse() {
        // independent computation: Kepler's equation M = E − e sin E solved here by Newton's method,
        // r/a = 1 − e cos E, tan(ν/2) = √((1+e)/(1−e)) tan(E/2), and the sky-projected separation
        // δ/a = (r/a) √(1 − sin²i sin²(ν + ω)) (e.g. Kallrath & Milone 2009, §3.1; from memory), with
        // the epoch at primary conjunction, ν + ω = 90°.
        double period = 3.7;
        double epoch = 50.0;
        for (double[] c : new double[][] {{0.3, 40, 80}, {0.6, 250, 87}, {0.15, 135, 60}}) {
            double e = c[0];
            double w = Math.toRadians(c[1]);
            double incl = Math.toRadians(c[2]);
            Orbit.Positions pos = new Orbit(period, epoch, e, c[1], c[2]).positions();
            double nuConj = Math.PI / 2 - w;
            double eConj = 2 * Math.atan(Math.sqrt((1 - e) / (1 + e)) * Math.tan(nuConj / 2));
            double mConj = eConj - e * Math.sin(eConj);
            for (double t = epoch; t < epoch + period; t += period / 37) {
                double m = mConj + 2 * Math.PI * (t - epoch) / period;
                double big = m;
                for (int k = 0; k < 50; k++) {
                    big -= (big - e * Math.sin(big) - m) / (1 - e * Math.cos(big));
                }
                double r = 1 - e * Math.cos(big);
                double nu = 2 * Math.atan(Math.sqrt((1 + e) / (1 - e)) * Math.tan(big / 2));
                double s = Math.sin(incl) * Math.sin(nu + w);
                double expected = r * Math.sqrt(1 - s * s);
                assertThat(Math.abs(pos.signedSeparation(t))).as("e=%s ω=%s i=%s t=%s", c[0], c[1], c[2], t)
                        .isCloseTo(expected, within(1e-10));
            }
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
    void nextWindowStartLeavesOnlyTimesOutsideTheWindowsAndReachesTheNextOne() {
        // definition of the windows of surelyApart: every time skipped is outside them, and the
        // skip ends at most 1e-7 of the period (its margin) before the next window begins
        double[][] orbits = {{0, 90}, {0.2, 70}, {0.5, 200}};
        for (double[] eo : orbits) {
            Orbit.Positions p = new Orbit(1.7, 3.0, eo[0], eo[1], 85).positions();
            for (double w : new double[] {0.01, 0.08, 0.2}) {
                int skips = 0;
                for (int k = 0; k < 400; k++) {
                    double t = 3.0 + k * 1.7 / 400 - 0.3;
                    double next = p.nextWindowStart(t, w);
                    assertThat(next).isGreaterThanOrEqualTo(t);
                    if (!p.surelyApart(t, w)) {
                        assertThat(next).isEqualTo(t);
                        continue;
                    }
                    skips++;
                    for (int j = 0; j < 50; j++) {
                        double inside = t + (next - t) * j / 50.0;
                        assertThat(p.surelyApart(inside, w)).as("e=%s w=%s t=%s", eo[0], w, inside).isTrue();
                    }
                    assertThat(p.surelyApart(next + 2e-7 * 1.7, w)).as("e=%s w=%s t=%s", eo[0], w, t).isFalse();
                }
                assertThat(skips).isPositive();
            }
        }
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

    @Test
    void sineOfAReducedAngleMatchesTheLibrarySine() {
        // against java.lang.StrictMath.sin (fdlibm, correctly rounded to within 1 ulp): within 3 ulp of
        // the result over [−π/2, π/2], the polynomial's range |x| ≤ 0.6 and the library's beyond
        for (int k = -200_000; k <= 200_000; k++) {
            double x = Math.PI / 2 * k / 200_000.0;
            double expected = StrictMath.sin(x);
            assertThat(Orbit.Positions.sinOfReducedAngle(x)).as("x=%s", x)
                    .isCloseTo(expected, within(3 * Math.ulp(expected) + Double.MIN_VALUE));
        }
        assertThat(Orbit.Positions.sinOfReducedAngle(0.0)).isEqualTo(0.0);
        assertThat(Orbit.Positions.sinOfReducedAngle(1e-300)).isEqualTo(1e-300);
    }
}
