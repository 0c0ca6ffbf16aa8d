package org.twinlight.dimensions;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.twinlight.orbit.RocheLobe;

class SanityChecksTest {

    @Test
    void eggletonRocheLobeRadii() {
        // Eggleton 1983, ApJ 268, 368, eq. 2; values recomputed in REFERENCE-VALUES.md §14 (VC)
        assertThat(RocheLobe.eggletonRadius(0.1)).isCloseTo(0.206773, within(2e-6));
        assertThat(RocheLobe.eggletonRadius(0.5)).isCloseTo(0.320788, within(2e-6));
        assertThat(RocheLobe.eggletonRadius(1.0)).isCloseTo(0.3789205, within(2e-7));
        assertThat(RocheLobe.eggletonRadius(2.0)).isCloseTo(0.440004, within(2e-6));
        assertThat(RocheLobe.eggletonRadius(10.0)).isCloseTo(0.578169, within(2e-6));
    }

    @Test
    void massLuminosityRelationWorkedValues() {
        // Eker et al. 2018 coefficients (REFERENCE-VALUES.md §20, from memory there); worked values VC
        assertThat(MassLuminosityRelation.logLuminosity(1.0)).isCloseTo(-0.00700, within(1e-5));
        assertThat(MassLuminosityRelation.logLuminosity(2.0)).isCloseTo(1.31316, within(1e-5));
        assertThat(MassLuminosityRelation.logLuminosity(10.0)).isCloseTo(3.97000, within(1e-5));
        assertThat(MassLuminosityRelation.logLuminosity(0.1)).isNaN();
    }

    @Test
    void geometryThatCannotEclipseIsNamed() {
        // i = 30°, r1 + r2 = 0.17: cos i = 0.866 ≫ 0.17, no eclipse at any phase
        BinaryElements tilted = new BinaryElements(3.0, 0, 30, 90, 110, 0.10, 0.07, Double.NaN, Double.NaN, Double.NaN);
        assertThat(SanityChecks.eclipseGeometry(tilted, 90)).contains("no eclipse").contains("0.8660")
                .contains("not from an eclipse");
        // circular, edge-on enough: cos i < r1 + r2 ⇔ i > acos(0.17) = 80.21°
        assertThat(SanityChecks.eclipseGeometry(new BinaryElements(3.0, 0, 80.3, 90, 110, 0.10, 0.07, Double.NaN,
                Double.NaN, Double.NaN), 0)).isNull();
        assertThat(SanityChecks.eclipseGeometry(new BinaryElements(3.0, 0, 80.1, 90, 110, 0.10, 0.07, Double.NaN,
                Double.NaN, Double.NaN), 0)).isNotNull();
        // e = 0.5, ω = 90°: the primary conjunction is at r = a(1 − e²)/(1 + e sin ω) = 0.5 a (the orbit's
        // polar equation, r = a(1 − e²)/(1 + e cos ν) with ν = 90° − ω; Murray & Dermott 1999, eq. 2.20),
        // the secondary at 1.5 a; at i = 75° only the primary eclipses (0.5 cos i = 0.129 < 0.17), which is
        // enough; at i = 70° (0.171) neither does
        BinaryElements ecc75 = new BinaryElements(3.0, 0.5, 75, 90, 110, 0.10, 0.07, Double.NaN, Double.NaN, Double.NaN);
        assertThat(SanityChecks.eclipseGeometry(ecc75, 90)).isNull();
        BinaryElements ecc70 = new BinaryElements(3.0, 0.5, 70, 90, 110, 0.10, 0.07, Double.NaN, Double.NaN, Double.NaN);
        assertThat(SanityChecks.eclipseGeometry(ecc70, 90)).isNotNull();
        // ω = 270° puts the near conjunction at the secondary instead: still an eclipse at 75°
        assertThat(SanityChecks.eclipseGeometry(ecc75, 270)).isNull();
    }

    @Test
    void aSunLikePairRaisesNoWarning() {
        AbsoluteDimensions d = AbsoluteDimensions.of(sunLike(0.09, 0.08, 5772, 5500));
        assertThat(SanityChecks.warnings(d, sunLike(0.09, 0.08, 5772, 5500))).isEmpty();
    }

    @Test
    void overfilledLobesAndImpossibleStarsAreNamed() {
        BinaryElements big = sunLike(0.45, 0.08, 5772, 5500);
        List<String> w = SanityChecks.warnings(AbsoluteDimensions.of(big), big);
        assertThat(w).anyMatch(s -> s.startsWith("star 1") && s.contains("Roche"));
        // tiny K: a brown-dwarf companion
        BinaryElements light = new BinaryElements(3.0, 0, 89, 2.0, 120.0, 0.09, 0.02, 5772, 3000, Double.NaN);
        List<String> w2 = SanityChecks.warnings(AbsoluteDimensions.of(light), light);
        assertThat(w2).anyMatch(s -> s.startsWith("star 2") && s.contains("hydrogen-burning"));
        // a cool star with a huge fractional radius and low gravity is flagged as far from the main sequence
        BinaryElements giant = new BinaryElements(300.0, 0, 89, 20, 20, 0.2, 0.01, 4500, 5000, Double.NaN);
        List<String> w3 = SanityChecks.warnings(AbsoluteDimensions.of(giant), giant);
        assertThat(w3).anyMatch(s -> s.startsWith("star 1") && s.contains("giant"));
        assertThat(w3).anyMatch(s -> s.startsWith("star 1") && s.contains("mass-luminosity"));
    }

    /** Two stars of about a solar mass in a 3-day orbit (a ≈ 10.6 R☉). */
    private static BinaryElements sunLike(double r1, double r2, double t1, double t2) {
        return new BinaryElements(3.0, 0.0, 88.0, 88.0, 92.0, r1, r2, t1, t2, Double.NaN);
    }
}
