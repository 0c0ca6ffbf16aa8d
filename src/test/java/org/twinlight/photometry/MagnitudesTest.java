package org.twinlight.photometry;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.apache.commons.math3.analysis.differentiation.DerivativeStructure;
import org.apache.commons.math3.analysis.differentiation.FiniteDifferencesDifferentiator;
import org.apache.commons.math3.analysis.differentiation.UnivariateDifferentiableFunction;
import org.junit.jupiter.api.Test;

/**
 * Magnitudes and flux. Sources: the magnitude scale of Pogson (1856), MNRAS 17, 12; error
 * propagation to first order (Bevington &amp; Robinson 2003, Data Reduction and Error Analysis,
 * eq. 3.14), checked against Commons Math's numerical derivative.
 */
class MagnitudesTest {

    @Test
    void fiveMagnitudesAreAFactorOfOneHundred() {
        // Pogson (1856, MNRAS 17, 12) defines 5 magnitudes as a flux ratio of exactly 100.
        assertThat(Magnitudes.toRelativeFlux(0)).isEqualTo(1.0);
        assertThat(Magnitudes.toRelativeFlux(5)).isCloseTo(0.01, within(1e-17));
        assertThat(Magnitudes.toRelativeFlux(-2.5)).isCloseTo(10.0, within(1e-14));
    }

    @Test
    void magnitudeToFluxToMagnitudeRoundTrip() {
        for (double m = -30; m <= 30; m += 0.37) {
            double f = Magnitudes.toRelativeFlux(m);
            assertThat(Magnitudes.fromRelativeFlux(f)).isCloseTo(m, within(1e-12));
            for (double sm : new double[] {1e-4, 0.003, 0.05}) {
                double sf = Magnitudes.toFluxError(f, sm);
                assertThat(Magnitudes.toMagnitudeError(f, sf)).isCloseTo(sm, within(1e-15 + 1e-12 * sm));
            }
        }
    }

    @Test
    void errorPropagationMatchesTheNumericalDerivative() {
        // First-order propagation sigma_F = |dF/dm| sigma_m (Bevington & Robinson 2003, eq. 3.14); the
        // derivative is checked against Commons Math's finite-difference differentiator.
        UnivariateDifferentiableFunction flux = new FiniteDifferencesDifferentiator(5, 1e-4)
                .differentiate(Magnitudes::toRelativeFlux);
        for (double m = -5; m <= 15; m += 1.3) {
            double derivative = flux.value(new DerivativeStructure(1, 1, 0, m)).getPartialDerivative(1);
            double f = Magnitudes.toRelativeFlux(m);
            assertThat(Magnitudes.toFluxError(f, 0.01)).isCloseTo(Math.abs(derivative) * 0.01,
                    within(1e-7 * f));
        }
    }

    @Test
    void aOnePercentMagnitudeErrorIsAboutNinePointTwoPerMilleInFlux() {
        // 0.4 ln 10 = 0.921034...: 0.01 mag is 0.921 % of the flux (a commonly quoted figure; 0.4 ln 10 by hand).
        assertThat(Magnitudes.toFluxError(1.0, 0.01)).isCloseTo(0.00921034, within(1e-8));
    }
}
