package org.twinlight.eclipse;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;

/**
 * The number of quadrature nodes chosen by geometry gives the same hidden fraction as the finest
 * rule (64 nodes, itself within 1e-13 of the independent integration of OccultationAllLawsTest)
 * over a dense grid that crosses every boundary of the choice, for strongly darkened profiles.
 * A consistency check of the production code with itself; the outside check is the other test.
 */
class OccultationRuleChoiceTest {

    @ParameterizedTest
    @EnumSource(value = LimbDarkeningLaw.class, names = "UNIFORM", mode = EnumSource.Mode.EXCLUDE)
    void chosenRuleAgreesWithTheFinestRuleOverADenseGrid(LimbDarkeningLaw law) {
        LimbDarkening ld = OccultationAllLawsTest.strong(law);
        double[] radii = {0.01, 0.02, 0.021, 0.05, 0.1, 0.12, 0.121, 0.15, 0.2, 0.201, 0.3, 0.5, 0.7, 0.9, 1.0, 1.2, 2.0, 6.0, 30.0};
        for (double p : radii) {
            double zLow = Math.max(0, p - 1);
            int steps = 240;
            for (int i = 1; i < steps; i++) {
                double z = zLow + (1 + p - zLow) * i / steps;
                double lens = DiscOverlap.areaOverPi(p, z);
                double chosen = Occultation.byQuadrature(ld, p, z, lens);
                double finest = Occultation.byQuadrature(ld, p, z, lens, Occultation.FINEST_RULE);
                assertThat(chosen).as("%s p=%s z=%s", ld, p, z).isCloseTo(finest, within(2e-8));
            }
        }
    }
}
