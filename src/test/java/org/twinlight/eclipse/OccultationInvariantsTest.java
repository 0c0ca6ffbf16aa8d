package org.twinlight.eclipse;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;

/**
 * Properties every occultation must have whatever the law (geometry of two discs and a positive
 * intensity profile; no source needed beyond the definitions): the hidden fraction lies in
 * [0, 1], is 1 when the star is covered and 0 when the discs separate, shrinks as the occulting
 * disc of radius p ≤ 1 moves outwards, and is continuous where the method changes.
 */
class OccultationInvariantsTest {
    private static final double[] RADII = {0.01, 0.05, 0.1, 0.3, 0.5, 0.8, 1.0, 1.2, 3.0, 20.0, 300.0};

    @ParameterizedTest
    @EnumSource(LimbDarkeningLaw.class)
    void hiddenFractionStaysInTheUnitIntervalAndMeetsItsLimits(LimbDarkeningLaw law) {
        for (LimbDarkening ld : new LimbDarkening[] {OccultationAllLawsTest.typical(law), OccultationAllLawsTest.strong(law)}) {
            for (double p : RADII) {
                for (double z : OccultationAllLawsTest.separations(p)) {
                    assertThat(Occultation.hiddenFraction(ld, p, z)).as("%s p=%s z=%s", ld, p, z).isBetween(0.0, 1.0);
                }
                // wholly covered star
                if (p > 1) {
                    assertThat(Occultation.hiddenFraction(ld, p, p - 1)).isEqualTo(1.0);
                    assertThat(Occultation.hiddenFraction(ld, p, 0.5 * (p - 1))).isEqualTo(1.0);
                    assertThat(Occultation.hiddenFraction(ld, p, (p - 1) * (1 + 1e-9) + 1e-9)).isCloseTo(1.0, within(1e-7));
                }
                // external contact: nothing hidden at z = 1+p, and the hidden light vanishes like
                // the lens area, (4√2/3π)√(p/(1+p)) ε^{3/2} ≤ 0.61 ε^{3/2} of the disc, as
                // z = 1+p−ε → 1+p (the limb is never brighter than the mean of the disc here)
                assertThat(Occultation.hiddenFraction(ld, p, 1 + p)).isZero();
                assertThat(Occultation.hiddenFraction(ld, p, 1 + p + 0.5)).isZero();
                double eps = (1 + p) * 1e-8;
                assertThat(Occultation.hiddenFraction(ld, p, 1 + p - eps)).isLessThan(0.61 * Math.pow(eps, 1.5));
            }
        }
    }

    @ParameterizedTest
    @EnumSource(LimbDarkeningLaw.class)
    void hiddenFractionNeverGrowsAsTheSmallerDiscMovesOut(LimbDarkeningLaw law) {
        // for p ≤ 1 moving the occulting disc outwards replaces hidden light near the centre by
        // hidden light nearer the limb or by sky, so for a profile decreasing outwards the hidden
        // fraction does not grow; a 1e-12 allowance covers rounding
        LimbDarkening ld = OccultationAllLawsTest.typical(law);
        for (double p : new double[] {0.01, 0.1, 0.3, 0.5, 0.8, 1.0}) {
            double previous = Occultation.hiddenFraction(ld, p, 0.0);
            int steps = 600;
            for (int i = 1; i <= steps; i++) {
                double z = (1 + p) * i / steps;
                double h = Occultation.hiddenFraction(ld, p, z);
                assertThat(h).as("%s p=%s z=%s", ld, p, z).isLessThanOrEqualTo(previous + 1e-12);
                previous = h;
            }
        }
    }

    @ParameterizedTest
    @EnumSource(value = LimbDarkeningLaw.class, names = {"LINEAR", "QUADRATIC"})
    void closedFormAndQuadratureJoinWithoutAStep(LimbDarkeningLaw law) {
        // across the edges of the bands where the closed form hands over to the quadrature
        LimbDarkening ld = OccultationAllLawsTest.typical(law);
        for (double p : new double[] {0.1, 0.5, 0.9, 1.0, 1.5, 20.0}) {
            for (double line : new double[] {p, 1 - p, p - 1, 0.0}) {
                double edge = line == 0.0 ? MandelAgol.NEAR_CENTRE : MandelAgol.NEAR_LINE * Math.max(1, p);
                for (int sign = -1; sign <= 1; sign += 2) {
                    double inside = line + sign * 0.5 * edge;
                    double outside = line + sign * 2 * edge;
                    if (Math.min(inside, outside) <= Math.max(0, p - 1) || Math.max(inside, outside) >= 1 + p) {
                        continue;
                    }
                    // |dh/dz| is at most the intensity integrated across the occulting limb inside the
                    // star (a chord no longer than 2, intensity at most 1) over the total flux 2π∫Iμdμ
                    // (above 2 for these laws): below 1
                    double slope = Math.abs(outside - inside);
                    assertThat(Occultation.hiddenFraction(ld, p, inside)).as("%s p=%s line=%s", ld, p, line)
                            .isCloseTo(Occultation.hiddenFraction(ld, p, outside), within(1e-10 + slope));
                }
            }
        }
    }

    @Test
    void arccosOfTheQuadratureMatchesTheJavaLibrary() {
        // against java.lang.StrictMath.acos (fdlibm), over [−1, 1] and near both ends
        for (int i = 0; i <= 200_000; i++) {
            double c = -1 + 2.0 * i / 200_000;
            assertThat(Occultation.arccos(c)).as("c=%s", c).isCloseTo(StrictMath.acos(c), within(2e-15));
        }
        for (double d = 1e-16; d < 0.1; d *= 3) {
            assertThat(Occultation.arccos(1 - d)).isCloseTo(StrictMath.acos(1 - d), within(1e-15 * StrictMath.acos(1 - d)));
            assertThat(Occultation.arccos(-1 + d)).isCloseTo(StrictMath.acos(-1 + d), within(1e-15));
        }
        assertThat(Occultation.arccos(1.0000001)).isZero();
        assertThat(Occultation.arccos(-1.0000001)).isEqualTo(Math.PI);
    }

    @Test
    void negativeDistanceIsRejectedUndefinedInputGivesNaNAndANullDiscHidesNothing() {
        LimbDarkening ld = LimbDarkening.quadratic(0.4, 0.26);
        assertThat(Occultation.hiddenFraction(ld, 0.0, 0.2)).isZero();
        assertThat(Occultation.hiddenFraction(ld, -0.1, 0.2)).isZero();
        assertThatThrownBy(() -> Occultation.hiddenFraction(ld, 0.1, -0.2)).isInstanceOf(IllegalArgumentException.class)
                .hasMessageContaining("z");
        assertThat(Occultation.hiddenFraction(ld, Double.NaN, 0.2)).isNaN();
        assertThat(Occultation.hiddenFraction(ld, 0.1, Double.NaN)).isNaN();
    }
}
