package org.twinlight.sky;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.List;
import org.apache.commons.math3.geometry.euclidean.threed.Vector3D;
import org.junit.jupiter.api.Test;
import org.twinlight.time.JulianDate;
import org.twinlight.time.SunAndMoon;
import org.twinlight.time.TimeReference;
import org.twinlight.time.TimeScale;
import org.twinlight.time.TimeStandard;

/**
 * The sky package against the worked examples of Meeus, <i>Astronomical Algorithms</i>, 2nd ed.
 * (Willmann-Bell 1998), as transcribed in /work/shared/REFERENCE-VALUES.md (sections 3 and 21).
 * Meeus counts longitudes west-positive and azimuths from the south; converted here.
 */
class SkyReferenceTest {

    private static final TimeScale JD_TT = new TimeScale(TimeReference.GEOCENTRIC, TimeStandard.TT, false);

    private static double dms(double d, double m, double s) {
        return Math.signum(d == 0 ? 1 : d) * (Math.abs(d) + m / 60 + s / 3600);
    }

    // Meeus 1998, Example 12.a (p. 88): 1987 April 10, 0h UT → mean sidereal time 197.693195°;
    // Example 12.b (p. 89): 19h21m00s UT → 128.7378734°.
    @Test
    void meanSiderealTimeMatchesExamples12aAnd12b() {
        assertThat(SiderealTime.greenwichMeanDeg(JulianDate.of(2446895.5, TimeScale.JD_UTC)))
                .isCloseTo(197.693195, within(2e-6));
        assertThat(SiderealTime.greenwichMeanDeg(JulianDate.of(2446896.30625, TimeScale.JD_UTC)))
                .isCloseTo(128.7378734, within(2e-6));
    }

    // Meeus 1998, Example 25.a (p. 165): the Sun on 1992 October 13.0 TD, apparent α = 198.38083°,
    // δ = −7.78507°, R = 0.99766 au. Meeus's stated accuracy of that method is 0.01°; ours is
    // geometric (no aberration, no nutation: here −20.5″ and +17.1″ in longitude), within it.
    @Test
    void sunMatchesExample25a() {
        SunPlace sun = SunPlace.at(JulianDate.of(2448908.5, JD_TT));
        assertThat(sun.direction().raDeg()).isCloseTo(198.38083, within(0.01));
        assertThat(sun.direction().decDeg()).isCloseTo(-7.78507, within(0.01));
        assertThat(sun.distanceAu()).isCloseTo(0.99766, within(1e-4));
    }

    // Meeus 1998, Example 47.a (p. 342): the Moon on 1992 April 12, 0h TD: geometric λ = 133.162655°,
    // β = −3.229126°, Δ = 368409.7 km; apparent α = 134.688469°, δ = +13.768367°. The low-precision
    // formulae used here are quoted to 0.3° in longitude, 0.2° in latitude and 0.003° in parallax
    // (The Astronomical Almanac, section D; from memory): 0.003° of a 0.95° parallax is 0.32 % of the
    // distance, 1200 km.
    @Test
    void moonMatchesExample47a() {
        double t = SunAndMoon.centuriesSinceJ2000(JulianDate.of(2448724.5, JD_TT));
        Vector3D moon = SunAndMoon.moonGeocentricEclipticOfDateKm(t);
        double lon = Math.toDegrees(Math.atan2(moon.getY(), moon.getX()));
        double lat = Math.toDegrees(Math.asin(moon.getZ() / moon.getNorm()));
        assertThat(lon).isCloseTo(133.162655, within(0.3));
        assertThat(lat).isCloseTo(-3.229126, within(0.2));
        assertThat(moon.getNorm()).isCloseTo(368409.7, within(1200.0));
        Equatorial eq = Equatorial.of(MoonPlace.eclipticToEquatorial(moon, Precession.meanObliquityDeg(t)));
        // nutation (+0.0046° here) and the method's 0.3°: a wrong obliquity or axis would be off by degrees
        assertThat(eq.raDeg()).isCloseTo(134.688469, within(0.35));
        assertThat(eq.decDeg()).isCloseTo(13.768367, within(0.25));
    }

    // Meeus 1998, Example 48.a (p. 347): Moon α = 134.6885°, δ = +13.7684°, Δ = 368410 km; Sun
    // α₀ = 20.6579°, δ₀ = +8.6964°, R = 149971520 km → k = 0.6786 (rounded to 4 decimals).
    @Test
    void illuminatedFractionMatchesExample48a() {
        Vector3D moon = new Equatorial(134.6885, 13.7684).unitVector().scalarMultiply(368410);
        Vector3D sun = new Equatorial(20.6579, 8.6964).unitVector().scalarMultiply(149971520);
        assertThat(MoonPlace.illuminatedFraction(moon, sun)).isCloseTo(0.6786, within(6e-5));
    }

    // Meeus 1998, Example 13.b (p. 95): Venus at the U.S. Naval Observatory, 1987 April 10,
    // 19h21m00s UT; α = 23h09m16.641s, δ = −6°43′11.61″; φ = +38°55′17″, L = 77°03′56″ west;
    // apparent θ₀ = 8h34m56.853s → A = 68.0337° from the south (248.0337° from the north),
    // h = 15.1249°. The book's rounding: 1e-3°.
    @Test
    void horizontalMatchesExample13b() {
        Equatorial venus = new Equatorial(15 * dms(23, 9, 16.641), -dms(6, 43, 11.61));
        double lst = 15 * dms(8, 34, 56.853) - dms(77, 3, 56);
        Horizontal hor = Horizontal.of(venus, dms(38, 55, 17), lst);
        assertThat(hor.azimuthDeg()).isCloseTo(248.0337, within(1e-3));
        assertThat(hor.altitudeDeg()).isCloseTo(15.1249, within(1e-3));
        assertThat(Horizontal.altitudeDeg(venus, dms(38, 55, 17), lst)).isCloseTo(hor.altitudeDeg(), within(1e-12));
    }

    // Meeus 1998, Example 15.a (p. 103): Venus at Boston (φ = +42°20′, L = 71°05′ west), 1988 March 20,
    // h₀ = −0.5667°, Θ₀ = 11h50m58.10s at 0h UT, ΔT = 56 s, α/δ at 0h TD on March 19, 20, 21.
    // Final values: rise m₁ = 0.51766 d (12h25m26s UT), set m₂ = 0.12130 d (02h54m40s UT). The
    // book gives the times to the whole minute: tolerance 1 min. The altitude track here uses
    // Meeus's interpolation formula 3.3 for α and δ, written in the test.
    @Test
    void risingAndSettingMatchExample15a() {
        double[] ra = {15 * dms(2, 42, 43.25), 15 * dms(2, 46, 55.51), 15 * dms(2, 51, 7.69)};
        double[] dec = {dms(18, 2, 51.4), dms(18, 26, 27.3), dms(18, 49, 38.7)};
        double lat = dms(42, 20, 0);
        double westLon = dms(71, 5, 0);
        double theta0 = 15 * dms(11, 50, 58.10);
        double deltaT = 56.0 / 86400.0;
        List<AltitudeCrossings.Crossing> crossings = AltitudeCrossings.find(m -> {
            double n = m + deltaT;
            Equatorial venus = new Equatorial(interpolate(ra, n), interpolate(dec, n));
            return Horizontal.altitudeDeg(venus, lat, theta0 + 360.985647 * m - westLon);
        }, 0, 1, -0.5667, 1.0 / 24);
        assertThat(crossings).hasSize(2);
        double oneMinute = 1.0 / 1440;
        assertThat(crossings.get(0).rising()).isFalse();
        assertThat(crossings.get(0).jd()).isCloseTo(0.12130, within(oneMinute));
        assertThat(crossings.get(1).rising()).isTrue();
        assertThat(crossings.get(1).jd()).isCloseTo(0.51766, within(oneMinute));
    }

    /** Meeus 1998, eq. 3.3: y = y₂ + n/2 (a + b + n c) for tabular values y₁, y₂, y₃ one day apart. */
    private static double interpolate(double[] y, double n) {
        double a = y[1] - y[0];
        double b = y[2] - y[1];
        double c = b - a;
        return y[1] + n / 2 * (a + b + n * c);
    }

    // Meeus 1998, Example 21.b (p. 135): θ Persei, J2000 α₀ = 41.054063°, δ₀ = +49.227750° (already
    // moved by its proper motion) to 2028 November 13.19 TD (JDE 2462088.69): α = 41.547214°,
    // δ = +49.348483° (from memory; the rigorous method reproduces them to 1e-6°).
    @Test
    void precessionMatchesExample21b() {
        double t = (2462088.69 - 2451545.0) / 36525.0;
        Equatorial p = Precession.fromJ2000(new Equatorial(41.054063, 49.227750), t);
        assertThat(p.raDeg()).isCloseTo(41.547214, within(1e-5));
        assertThat(p.decDeg()).isCloseTo(49.348483, within(1e-5));
    }

    // Meeus 1998, Example 22.a: ε₀ = 23°26′27.407″ on 1987 April 10, 0h TD (T = −0.127296372348).
    @Test
    void meanObliquityMatchesExample22a() {
        assertThat(Precession.meanObliquityDeg(-0.127296372348)).isCloseTo(dms(23, 26, 27.407), within(1e-6));
    }
}
