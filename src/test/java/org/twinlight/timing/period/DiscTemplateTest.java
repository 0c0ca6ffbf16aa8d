package org.twinlight.timing.period;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;

class DiscTemplateTest {

    /**
     * Area of the overlap of two circles of radii r and R whose centres are d apart (Weisstein, "Circle-Circle
     * Intersection", MathWorld, eq. 14), for |R − r| &lt; d &lt; R + r.
     */
    private static double lensArea(double r, double bigR, double d) {
        return r * r * Math.acos((d * d + r * r - bigR * bigR) / (2 * d * r))
                + bigR * bigR * Math.acos((d * d + bigR * bigR - r * r) / (2 * d * bigR))
                - 0.5 * Math.sqrt((-d + r + bigR) * (d + r - bigR) * (d - r + bigR) * (d + r + bigR));
    }

    @Test
    void uniformDiscsFollowTheAreaOfOverlapOfTwoCircles() {
        // Radius ratio 0.5, central crossing, half width 1 (first to last contact): the centres are 1.5·d apart at
        // distance d from mid-eclipse, so the small disc is wholly inside until d = 1/3 and the hidden share is
        // the lens area over the small disc's area π·0.25 after that.
        DiscTemplate t = new DiscTemplate(1, 0.5, 0, DiscTemplate.NO_LIMB_DARKENING);
        assertThat(t.profile(0)).isCloseTo(1, within(1e-12));
        assertThat(t.profile(0.3)).isCloseTo(1, within(1e-12));
        for (double d : new double[] {0.4, 0.5, 0.6, 0.75, 0.9}) {
            double expected = lensArea(0.5, 1, 1.5 * d) / (Math.PI * 0.25);
            // Linear interpolation between 96 samples: within 1e-3 of the exact share (tolerance: common
            // practice, no source).
            assertThat(t.profile(d)).as("d = %s", d).isCloseTo(expected, within(1e-3));
            assertThat(t.profile(-d)).isEqualTo(t.profile(d));
        }
        assertThat(t.profile(1.0)).isZero();
        assertThat(t.profile(1.3)).isZero();
    }

    @Test
    void theSlopeFollowsTheDerivativeOfTheExactProfile() {
        // The tabulated slope against a central difference of the hidden fraction itself (radius ratio 0.8,
        // impact 0.4 of the sum of the radii: the centres are √(b² + (c·d/w)²) apart, c the chord 1.8·√(1 − 0.16)),
        // within the 3 % a 96-sample table allows on the steep part of the ingress (tolerance: common practice, no
        // source; the slope is checked against the derivative of the exact occultation integral of
        // Mandel & Agol 2002, ApJ 580, L171, as computed by eclipse.Occultation).
        double w = 0.03;
        DiscTemplate t = new DiscTemplate(w, 0.8, 0.4, DiscTemplate.TYPICAL_LIMB_DARKENING);
        double b = 0.4 * 1.8;
        double chord = Math.sqrt(1.8 * 1.8 - b * b);
        java.util.function.DoubleUnaryOperator exact = d -> org.twinlight.eclipse.Occultation.hiddenFraction(
                DiscTemplate.TYPICAL_LIMB_DARKENING, 0.8, Math.hypot(b, chord * d / w))
                / org.twinlight.eclipse.Occultation.hiddenFraction(DiscTemplate.TYPICAL_LIMB_DARKENING, 0.8, b);
        for (double d : new double[] {-0.0251, -0.0163, 0.0163, 0.0251}) {
            double h = 1e-7;
            double numeric = (exact.applyAsDouble(Math.abs(d) + h) - exact.applyAsDouble(Math.abs(d) - h)) / (2 * h)
                    * Math.signum(d);
            assertThat(t.slope(d)).as("d = %s", d).isCloseTo(numeric, within(0.03 * Math.abs(numeric)));
            assertThat(t.profile(d)).isCloseTo(exact.applyAsDouble(d), within(1e-3));
        }
        assertThat(t.slope(0.01)).isNegative();
        assertThat(t.slope(-0.01)).isPositive();
    }
}
