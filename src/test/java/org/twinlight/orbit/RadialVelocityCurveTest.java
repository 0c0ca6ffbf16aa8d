package org.twinlight.orbit;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.twinlight.testsupport.BisectionKepler;

class RadialVelocityCurveTest {

    /** Mean anomaly of a true anomaly, written out separately (tan(E/2) = √((1−e)/(1+e)) tan(ν/2)). */
    private static double meanAnomalyOf(double nu, double e) {
        double ecc = 2 * Math.atan(Math.sqrt((1 - e) / (1 + e)) * Math.tan(nu / 2));
        return ecc - e * Math.sin(ecc);
    }

    /*
     * Source of the expected velocities: an independent Kepler solution (BisectionKepler: bisection on
     * M = E − e sin E, no shared code) and the textbook form v₁ = γ + K₁[cos(ν+ω) + e cos ω] (Hilditch
     * 2001, An Introduction to Close Binary Stars, eq. 2.45; convention of the interface contract).
     */
    @Test
    void velocitiesMatchAnIndependentKeplerSolutionFromThePeriastronTime() {
        double[][] cases = {{0.0, 90.0}, {0.3, 40.0}, {0.18, 251.0}, {0.6, 300.0}, {0.05, 179.0}};
        double period = 3.7;
        double epoch = 2460000.25;
        double k1 = 61.0;
        double k2 = 83.0;
        double gamma = -12.5;
        for (double[] c : cases) {
            double e = c[0];
            double w = Math.toRadians(c[1]);
            RadialVelocityCurve rv = new RadialVelocityCurve(period, epoch, e, c[1]);
            // periastron from the conjunction: ν_c = 90° − ω (interface contract), M_c from Kepler
            double tPeri = epoch - meanAnomalyOf(Math.PI / 2 - w, e) / (2 * Math.PI) * period;
            for (int k = 0; k < 40; k++) {
                double t = epoch - 5.3 * period + k * 0.37;
                double nu = BisectionKepler.trueAnomaly(2 * Math.PI * (t - tPeri) / period, e);
                double expected1 = gamma + k1 * (Math.cos(nu + w) + e * Math.cos(w));
                double expected2 = gamma - k2 * (Math.cos(nu + w) + e * Math.cos(w));
                // 1e-6 km/s: times near JD 2.46e6 keep ~1e-10 d, i.e. ~1e-8 km/s here
                assertThat(rv.velocity1(t, k1, gamma)).isCloseTo(expected1, within(1e-6));
                assertThat(rv.velocity2(t, k2, gamma)).isCloseTo(expected2, within(1e-6));
            }
        }
    }

    @Test
    void starOneRecedesFastestAfterPrimaryConjunctionInACircularOrbit() {
        // Circular orbit: at primary conjunction star 1 is behind, moving across the sky, so v₁ = γ;
        // a quarter period later ν + ω = 180°, cos = −1: star 1 approaches at −K₁ (interface contract:
        // positive receding; star 1 eclipsed at ν + ω = 90°).
        RadialVelocityCurve rv = new RadialVelocityCurve(2.0, 100.0, 0.0, 90.0);
        assertThat(rv.velocity1(100.0, 50, 7)).isCloseTo(7, within(1e-9));
        assertThat(rv.velocity1(100.5, 50, 7)).isCloseTo(7 - 50, within(1e-9));
        assertThat(rv.velocity2(100.5, 80, 7)).isCloseTo(7 + 80, within(1e-9));
        assertThat(rv.velocity1(101.5, 50, 7)).isCloseTo(7 + 50, within(1e-9));
    }

    @Test
    void periastronPassageFollowsFromTheConjunction() {
        // ω = 90°: primary conjunction is at periastron (ν = 0), so the two times coincide.
        RadialVelocityCurve rv = new RadialVelocityCurve(5.0, 10.0, 0.4, 90.0);
        assertThat(rv.periastronTimeDays()).isCloseTo(10.0, within(1e-12));
        // ω = 270°: conjunction at apastron (ν = 180°), half a period after periastron.
        RadialVelocityCurve apo = new RadialVelocityCurve(5.0, 10.0, 0.4, 270.0);
        assertThat(Math.abs(apo.periastronTimeDays() - 10.0)).isCloseTo(2.5, within(1e-9));
    }
}
