package org.twinlight.time;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.data.Offset.offset;

import org.apache.commons.math3.geometry.euclidean.threed.Vector3D;
import org.junit.jupiter.api.Test;

/** The compact ephemeris against Meeus's low-precision Sun and against known magnitudes. */
class EphemerisTest {

    private static final TimeScale JD_TDB = TimeScale.parse("JD_TDB").orElseThrow();

    @Test
    void meeusExample25aIsReproduced() {
        // Meeus 1998, Ex. 25.a: 1992 Oct 13.0 TD = JDE 2448908.5 (the book rounds
        // intermediates, hence 2e-5° tolerances on the recomputed full-precision values).
        MeeusLowPrecisionSun sun = new MeeusLowPrecisionSun(2448908.5);
        assertThat(sun.t).isCloseTo(-0.072183436, offset(1e-9));
        assertThat(angleDiffDeg(sun.meanLongitudeDeg, 201.80720)).isCloseTo(0, offset(2e-5));
        assertThat(angleDiffDeg(sun.meanAnomalyDeg, 278.99397)).isCloseTo(0, offset(2e-5));
        assertThat(sun.eccentricity).isCloseTo(0.016711668, offset(1e-9));
        assertThat(sun.centreDeg).isCloseTo(-1.89732, offset(2e-5));
        assertThat(angleDiffDeg(sun.trueLongitudeDeg, 199.90987)).isCloseTo(0, offset(2e-5));
        assertThat(sun.radiusAu).isCloseTo(0.99766, offset(1e-5));
        assertThat(angleDiffDeg(sun.apparentLongitudeDeg, 199.90895)).isCloseTo(0, offset(2e-5));
        assertThat(sun.meanObliquityDeg).isCloseTo(23.44023, offset(2e-5));
        assertThat(angleDiffDeg(sun.apparentRaDeg, 198.38083)).isCloseTo(0, offset(2e-5));
        assertThat(sun.apparentDecDeg).isCloseTo(-7.78507, offset(2e-5));
    }

    @Test
    void earthAgreesWithMeeusSunWithinItsStatedAccuracy() {
        // Meeus 1998, ch. 25: the low-precision Sun is good to 0.01° (1.7e-4 rad, 0.09 light-seconds).
        // The Earth's heliocentric position is minus the Sun's geocentric one.
        double worstAngleDeg = 0;
        double worstRadiusAu = 0;
        for (double jd = 2447892.5; jd < 2464329.5; jd += 3.7) {
            MeeusLowPrecisionSun sun = new MeeusLowPrecisionSun(jd);
            double lon = Math.toRadians(sun.trueLongitudeJ2000Deg());
            Vector3D meeus = SolarSystemEphemeris.toEquatorial(
                    new Vector3D(-Math.cos(lon), -Math.sin(lon), 0).scalarMultiply(sun.radiusAu));
            Vector3D ours = SolarSystemEphemeris.earthHeliocentric(JulianDate.of(jd, JD_TDB));
            worstAngleDeg = Math.max(worstAngleDeg, Math.toDegrees(Vector3D.angle(meeus, ours)));
            worstRadiusAu = Math.max(worstRadiusAu, Math.abs(meeus.getNorm() - ours.getNorm()));
        }
        assertThat(worstAngleDeg).isLessThan(0.01);
        assertThat(worstRadiusAu).isLessThan(1e-4);
    }

    @Test
    void sunStaysWithinAFewSolarRadiiOfTheBarycentre() {
        // The Sun's barycentric distance is dominated by Jupiter, m_J/M☉ × 5.2 au ≈ 0.005 au, and stays
        // below about 2.2 R☉ = 0.0102 au (common practice, no source; R☉ = 0.00465 au, IAU 2015 B3).
        double max = 0;
        double min = 1;
        for (double jd = 2447892.5; jd < 2464329.5; jd += 10) {
            double r = SolarSystemEphemeris.sunBarycentric(JulianDate.of(jd, JD_TDB)).getNorm();
            max = Math.max(max, r);
            min = Math.min(min, r);
        }
        assertThat(max).isBetween(0.006, 0.0102);
        assertThat(min).isLessThan(0.003);
    }

    @Test
    void keplerSolutionSatisfiesTheEquation() {
        // Meeus 1998, Ex. 30.a/30.b: e = 0.1, M = 5° gives E = 5.554589254°
        assertThat(Math.toDegrees(PlanetElements.solveKepler(Math.toRadians(5), 0.1)))
                .isCloseTo(5.554589254, offset(1e-9));
    }

    private static double angleDiffDeg(double a, double b) {
        return Math.IEEEremainder(a - b, 360.0);
    }
}
