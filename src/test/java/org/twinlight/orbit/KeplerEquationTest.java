package org.twinlight.orbit;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.SplittableRandom;
import org.apache.commons.math3.analysis.solvers.BrentSolver;
import org.junit.jupiter.api.Test;

class KeplerEquationTest {

    @Test
    void meeusExample30a() {
        // Meeus 1998, Astronomical Algorithms 2nd ed., Ex. 30.a/30.b (p. 196/199): e = 0.1, M = 5° → E = 5.554589254°
        double e = KeplerEquation.eccentricAnomaly(Math.toRadians(5), 0.1);
        assertThat(Math.toDegrees(e)).isCloseTo(5.554589254, within(1e-9));
    }

    @Test
    void meeusHardCaseNearParabolic() {
        // Meeus 1998, ch. 30, p. 205: e = 0.99, M = 0.2 rad → E = 1.066997365282 rad
        double e = KeplerEquation.eccentricAnomaly(0.2, 0.99);
        assertThat(e).isCloseTo(1.066997365282, within(1e-12));
    }

    @Test
    void agreesWithABracketingRootFinderToMachinePrecision() {
        // independent solution with Commons Math's Brent solver on the same equation
        BrentSolver brent = new BrentSolver(1e-15, 1e-15);
        SplittableRandom rng = new SplittableRandom(11);
        for (int k = 0; k < 2000; k++) {
            double ecc = rng.nextDouble() * 0.99;
            double m = (rng.nextDouble() * 2 - 1) * Math.PI;
            double ref = brent.solve(200, x -> x - ecc * Math.sin(x) - m, -Math.PI - 1, Math.PI + 1);
            double got = KeplerEquation.eccentricAnomaly(m, ecc);
            assertThat(got).as("e=%s M=%s", ecc, m).isCloseTo(ref, within(1e-13));
            // residual of Kepler's equation at machine precision
            assertThat(got - ecc * Math.sin(got) - m).isCloseTo(0, within(4e-15));
        }
    }

    @Test
    void trueAndMeanAnomalyRoundTrip() {
        SplittableRandom rng = new SplittableRandom(5);
        for (int k = 0; k < 1000; k++) {
            double ecc = rng.nextDouble() * 0.95;
            double nu = (rng.nextDouble() * 2 - 1) * Math.PI * 0.999;
            double m = KeplerEquation.meanAnomalyOfTrueAnomaly(nu, ecc);
            double back = KeplerEquation.trueAnomaly(KeplerEquation.eccentricAnomaly(m, ecc), ecc);
            assertThat(back).isCloseTo(nu, within(1e-10));
        }
    }
}
