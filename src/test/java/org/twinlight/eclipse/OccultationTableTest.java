package org.twinlight.eclipse;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;

/**
 * The interpolated occultation against the exact one ({@link Occultation#hiddenFraction}: the
 * closed form of Mandel &amp; Agol 2002, ApJ 580, L171, Table 1, for the linear and quadratic laws,
 * the quadrature checked in OccultationAllLawsTest for the others), over random radius ratios and
 * separations, whole and partial ranges, for every law with typical and strongly darkened
 * coefficients.
 */
class OccultationTableTest {
    /**
     * The accuracy claimed for the table, in hidden fraction: a hundred times below 1 ppm of the
     * flux and below the 1e-7 claimed for the exact method itself. Largest differences found:
     * 2.6e-9 for the closed-form laws (at the coarse end of a piece, near the middle of the partial
     * phase), 6e-9 for the laws done by quadrature, whose exact values step by about that much
     * where the quadrature changes its rule.
     */
    private static final double TOLERANCE = 1e-8;

    @ParameterizedTest
    @EnumSource(LimbDarkeningLaw.class)
    void matchesTheExactOccultationForEveryLaw(LimbDarkeningLaw law) {
        for (LimbDarkening ld : new LimbDarkening[] {OccultationAllLawsTest.typical(law),
            OccultationAllLawsTest.strong(law)}) {
            SplittableRandom rng = new SplittableRandom(law.ordinal());
            double worst = 0;
            for (int trial = 0; trial < 40; trial++) {
                // p log-uniform in 0.05 … 20; half the tables over the whole eclipse, half over a random part of it
                double p = 0.05 * Math.pow(400, rng.nextDouble());
                double zLow = Math.max(0, p - 1);
                double zHigh = 1 + p;
                if (trial % 2 == 1) {
                    double a = zLow + (zHigh - zLow) * rng.nextDouble();
                    double b = zLow + (zHigh - zLow) * rng.nextDouble();
                    zLow = Math.min(a, b);
                    zHigh = Math.max(a, b);
                }
                OccultationTable table = new OccultationTable(ld, p, zLow, zHigh);
                for (int k = 0; k < 200; k++) {
                    double z = zLow + (zHigh - zLow) * rng.nextDouble();
                    worst = Math.max(worst, Math.abs(table.hiddenFraction(z) - Occultation.hiddenFraction(ld, p, z)));
                }
                // the ends of the range and the contacts, where the pieces meet
                for (double z : new double[] {zLow, zHigh, Math.abs(1 - p), 1 + p, p < 1 ? 1 : p, 0}) {
                    if (z >= zLow && z <= zHigh) {
                        worst = Math.max(worst, Math.abs(table.hiddenFraction(z)
                                - Occultation.hiddenFraction(ld, p, z)));
                    }
                }
            }
            assertThat(worst).as("%s: largest difference from the exact occultation", ld).isLessThan(TOLERANCE);
        }
    }

    @Test
    void isExactUnderFullCoverAndOutsideTheEclipse() {
        LimbDarkening ld = LimbDarkening.quadratic(0.4, 0.26);
        OccultationTable big = new OccultationTable(ld, 2.5, 0, 3.5);
        assertThat(big.hiddenFraction(1.0)).isEqualTo(1.0);
        assertThat(big.hiddenFraction(3.5)).isEqualTo(0.0);
        // a separation outside the range tabulated is computed exactly
        OccultationTable part = new OccultationTable(ld, 0.3, 0.9, 1.1);
        assertThat(part.hiddenFraction(0.2)).isEqualTo(Occultation.hiddenFraction(ld, 0.3, 0.2));
    }
}
