package org.twinlight.eclipse;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.ArrayList;
import java.util.List;
import org.apache.commons.math3.analysis.integration.IterativeLegendreGaussIntegrator;
import org.apache.commons.math3.analysis.integration.UnivariateIntegrator;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;

/**
 * Every limb-darkening law against an independent high-precision integration of the occulted
 * intensity made with Commons Math ({@link ReferenceOccultation}), over partial, total, annular and
 * grazing geometries, radius ratios 0.05 to 20 (and a few up to 1000), with z on and around the
 * special lines z = 0, p, |1−p|, 1−p, p−1 and 1+p.
 */
class OccultationAllLawsTest {
    /** The accuracy claimed for {@link Occultation#hiddenFraction}, in hidden fraction. */
    private static final double TOLERANCE = 1e-7;

    /** Typical coefficients of each law (invented for the test, in the range of published tables). */
    static LimbDarkening typical(LimbDarkeningLaw law) {
        return switch (law) {
            case UNIFORM -> LimbDarkening.uniform();
            case LINEAR -> LimbDarkening.of(law, 0.6);
            case QUADRATIC -> LimbDarkening.of(law, 0.4, 0.26);
            case SQUARE_ROOT -> LimbDarkening.of(law, -0.1, 0.8);
            case LOGARITHMIC -> LimbDarkening.of(law, 0.6, 0.2);
            case POWER_2 -> LimbDarkening.of(law, 0.65, 0.55);
            case FOUR_PARAMETER -> LimbDarkening.of(law, 0.5, -0.2, 0.6, -0.25);
        };
    }

    /** Strongly darkened variants, to make sure the quadrature is not tuned to mild profiles. */
    static LimbDarkening strong(LimbDarkeningLaw law) {
        return switch (law) {
            case UNIFORM -> LimbDarkening.uniform();
            case LINEAR -> LimbDarkening.of(law, 1.0);
            case QUADRATIC -> LimbDarkening.of(law, 0.9, 0.1);
            case SQUARE_ROOT -> LimbDarkening.of(law, -0.3, 1.25);
            case LOGARITHMIC -> LimbDarkening.of(law, 0.95, 0.35);
            case POWER_2 -> LimbDarkening.of(law, 0.9, 0.2);
            case FOUR_PARAMETER -> LimbDarkening.of(law, 1.0, -1.0, 1.5, -0.6);
        };
    }

    /** Separations covering every regime for radius ratio p, including the special lines exactly. */
    static List<Double> separations(double p) {
        double[] lines = {0.0, p, Math.abs(1 - p), 1 - p, p - 1, 1 + p};
        double[] offsets = {0.0, 1e-12, -1e-12, 1e-9, -1e-9, 1e-6, -1e-6, 1e-3, -1e-3, 3e-2, -3e-2};
        List<Double> zs = new ArrayList<>();
        for (double line : lines) {
            for (double offset : offsets) {
                double z = line + offset * Math.max(1, p);
                if (z >= 0 && z <= 1 + p) {
                    zs.add(z);
                }
            }
        }
        double zLow = Math.max(0, p - 1.2);
        for (int i = 0; i <= 12; i++) {
            zs.add(zLow + (1 + p - zLow) * i / 12.0);
        }
        return zs;
    }

    private static void checkGrid(LimbDarkening ld, double[] radii) {
        for (double p : radii) {
            for (double z : separations(p)) {
                double expected = ReferenceOccultation.hiddenFraction(ld, p, z);
                assertThat(Occultation.hiddenFraction(ld, p, z)).as("%s p=%s z=%s", ld, p, z)
                        .isCloseTo(expected, within(TOLERANCE));
            }
        }
    }

    @ParameterizedTest
    @EnumSource(LimbDarkeningLaw.class)
    void everyLawMatchesAnIndependentIntegrationOverAllGeometries(LimbDarkeningLaw law) {
        checkGrid(typical(law), new double[] {0.05, 0.1, 0.2, 0.5, 0.9, 1.0, 1.1, 2.0, 5.0, 20.0});
    }

    @ParameterizedTest
    @EnumSource(LimbDarkeningLaw.class)
    void stronglyDarkenedProfilesMatchToo(LimbDarkeningLaw law) {
        checkGrid(strong(law), new double[] {0.07, 0.3, 0.7, 1.0, 1.6, 8.0});
    }

    @ParameterizedTest
    @EnumSource(LimbDarkeningLaw.class)
    void veryLargeOccultersMatchToo(LimbDarkeningLaw law) {
        LimbDarkening ld = typical(law);
        for (double p : new double[] {100.0, 1000.0}) {
            for (double offset : new double[] {-0.999, -0.9, -0.5, -1e-6, 0.0, 1e-6, 0.3, 0.8, 0.999}) {
                double z = p + offset;
                double expected = ReferenceOccultation.hiddenFraction(ld, p, z);
                assertThat(Occultation.hiddenFraction(ld, p, z)).as("%s p=%s z=%s", ld, p, z)
                        .isCloseTo(expected, within(TOLERANCE));
            }
        }
    }

    @Test
    void referenceAgreesWithATwoDimensionalCartesianIntegration() {
        // the reference itself against an integral of I over the overlap in Cartesian coordinates
        // (x along the line of centres, y across), with nested Commons Math integrators and no
        // arc-length formula: the y-limit is min(√(p²−(x−z)²), √(1−x²)), split at the abscissa of
        // the intersection of the circles
        for (LimbDarkeningLaw law : new LimbDarkeningLaw[] {LimbDarkeningLaw.SQUARE_ROOT, LimbDarkeningLaw.LOGARITHMIC}) {
            LimbDarkening ld = typical(law);
            for (double[] pz : new double[][] {{0.3, 0.5}, {0.3, 1.1}, {2.0, 1.8}}) {
                double p = pz[0];
                double z = pz[1];
                double cartesian = cartesianHidden(ld, p, z);
                assertThat(ReferenceOccultation.hiddenFraction(ld, p, z)).as("%s p=%s z=%s", ld, p, z)
                        .isCloseTo(cartesian, within(1e-8));
                assertThat(Occultation.hiddenFraction(ld, p, z)).isCloseTo(cartesian, within(TOLERANCE));
            }
        }
    }

    private static double cartesianHidden(LimbDarkening ld, double p, double z) {
        double xLow = Math.max(-1, z - p);
        double xHigh = Math.min(1, z + p);
        double xCross = (1 + z * z - p * p) / (2 * z);
        double hidden = 0.0;
        double[] cuts = xCross > xLow && xCross < xHigh ? new double[] {xLow, xCross, xHigh} : new double[] {xLow, xHigh};
        for (int i = 0; i + 1 < cuts.length; i++) {
            hidden += ReferenceOccultation.integrate(x -> {
                double yMax = Math.sqrt(Math.max(0, Math.min(p * p - (x - z) * (x - z), (1 - x) * (1 + x))));
                // 2∫₀^yMax I dy, in the variable y with the cosine substitution of the reference
                return 2 * ReferenceOccultation.integrate(y -> {
                    double rho2 = x * x + y * y;
                    return ld.intensity(Math.sqrt(Math.max(0, 1 - rho2)));
                }, 0, yMax, 1e-11, 1e-13);
            }, cuts[i], cuts[i + 1], 1e-10, 1e-12);
        }
        UnivariateIntegrator radial = new IterativeLegendreGaussIntegrator(8, 1e-13, 1e-15, 2, 200);
        double total = 2 * Math.PI * radial.integrate(1_000_000, mu -> ld.intensity(mu) * mu, 0, 1);
        return hidden / total;
    }
}
