package org.twinlight.eclipse;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;

class DiscOverlapTest {

    @Test
    void uniformDiscMatchesTheTabulatedLensAreas() {
        // λᵉ of Mandel & Agol 2002, ApJ 580, L171, eq. 1, evaluated in the project's reference
        // table (Mandel & Agol 2002, ApJ 580, L171, sect. 2; formula from memory)
        double[][] table = {
            {0.1, 0.5, 0.0100000},
            {0.1, 1.0, 0.00489387},
            {0.1, 1.05, 0.00188856},
            {0.3, 0.9, 0.0611355},
            {0.5, 1.0, 0.1116525},
        };
        for (double[] row : table) {
            double p = row[0];
            double z = row[1];
            // the table gives 6–7 significant digits
            assertThat(DiscOverlap.areaOverPi(p, z)).as("p=%s z=%s", p, z).isCloseTo(row[2], within(6e-9 + 1e-6 * row[2]));
            assertThat(Occultation.hiddenFraction(LimbDarkening.uniform(), p, z)).isCloseTo(row[2], within(6e-9 + 1e-6 * row[2]));
        }
    }

    /**
     * Area of the lens of two circles of radii R and r at distance d, as the sum of two circular
     * segments: r² arccos(d₁/r) − d₁√(r²−d₁²) + R² arccos(d₂/R) − d₂√(R²−d₂²), with
     * d₁ = (d² + r² − R²)/(2d) and d₂ = d − d₁ the distances of the centres from the common chord
     * (E. W. Weisstein, MathWorld "Circle-Circle Intersection", eq. 14; from memory).
     */
    private static double segmentsArea(double r, double bigR, double d) {
        double d1 = (d * d + r * r - bigR * bigR) / (2 * d);
        double d2 = d - d1;
        return r * r * Math.acos(d1 / r) - d1 * Math.sqrt(r * r - d1 * d1)
                + bigR * bigR * Math.acos(d2 / bigR) - d2 * Math.sqrt(bigR * bigR - d2 * d2);
    }

    @Test
    void partialOverlapMatchesTheSumOfTwoCircularSegments() {
        double[] radii = {0.05, 0.1, 0.3, 0.5, 0.9, 1.0, 1.3, 2.0, 5.0, 20.0};
        for (double p : radii) {
            double zMin = Math.abs(1 - p);
            for (int i = 1; i < 50; i++) {
                double z = zMin + (1 + p - zMin) * i / 50.0;
                double expected = segmentsArea(p, 1.0, z) / Math.PI;
                // the arccos form loses about √ε near tangency; 1e-12 is far inside what matters
                assertThat(DiscOverlap.areaOverPi(p, z)).as("p=%s z=%s", p, z).isCloseTo(expected, within(1e-12));
            }
        }
    }

    @Test
    void containedAndSeparateDiscsGiveTheSmallerDiscOrNothing() {
        assertThat(DiscOverlap.areaOverPi(0.2, 0.5)).isCloseTo(0.04, within(1e-16));
        assertThat(DiscOverlap.areaOverPi(0.2, 0.8)).isCloseTo(0.04, within(1e-16));
        assertThat(DiscOverlap.areaOverPi(3.0, 1.5)).isEqualTo(1.0);
        assertThat(DiscOverlap.areaOverPi(0.2, 1.2)).isZero();
        assertThat(DiscOverlap.areaOverPi(0.2, 5.0)).isZero();
    }

    @Test
    void areaIsContinuousAtTheContactsAndVanishesLikeThreeHalvesAtGrazing() {
        // continuity at internal contact (z = 1−p and z = p−1): the lens becomes the small disc
        assertThat(DiscOverlap.areaOverPi(0.3, 0.7 + 1e-12)).isCloseTo(0.09, within(1e-9));
        assertThat(DiscOverlap.areaOverPi(2.0, 1.0 + 1e-12)).isCloseTo(1.0, within(1e-9));
        // near external contact z = 1+p−ε, the lens area is (4√2/3)·√(p/(1+p))·ε^{3/2} to leading
        // order (two thin segments of a chord of half-length √(2ε·p/(1+p)); elementary geometry,
        // no source)
        double p = 0.4;
        double eps = 1e-6;
        double expected = 4 * Math.sqrt(2) / 3 * Math.sqrt(p / (1 + p)) * Math.pow(eps, 1.5) / Math.PI;
        assertThat(DiscOverlap.areaOverPi(p, 1 + p - eps)).isCloseTo(expected, within(1e-5 * expected));
    }
}
