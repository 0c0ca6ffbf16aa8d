package org.twinlight.dimensions;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;

class AbsoluteDimensionsTest {

    private static BinaryElements elements(double p, double e, double i, double k1, double k2) {
        return new BinaryElements(p, e, i, k1, k2, 0.05, 0.04, Double.NaN, Double.NaN, Double.NaN);
    }

    @Test
    void keplersThirdLawInSolarUnitsGivesOneForTheEarthAndSun() {
        // Kepler's third law M = a³/P² (a in au, P in years, M in solar masses); au from IAU 2012 B2,
        // (GM)☉ from IAU 2015 B3. The Julian year is 1.7e-5 shorter than the sidereal year, so the
        // Earth–Sun system gives 1 to within 4e-5, not exactly.
        assertThat(AbsoluteDimensions.keplerMassSolar(1.0, 1.0)).isCloseTo(1.0, within(1e-4));
        // the same law at another scale: a = 4 au, P = 8 yr gives 64/64 = 1
        assertThat(AbsoluteDimensions.keplerMassSolar(4.0, 8.0)).isCloseTo(1.0, within(1e-4));
        assertThat(AbsoluteDimensions.keplerMassSolar(2.0, 1.0)).isCloseTo(8.0, within(8e-4));
    }

    @Test
    void massesAndSemiMajorAxisFollowTheHandbookForms() {
        // Torres, Andersen & Giménez 2010, A&ARv 18, 67, §3 (REFERENCE-VALUES.md §2):
        // M₁ sin³i = C_M (1−e²)^{3/2} (K₁+K₂)² K₂ P, a sin i = C_a (1−e²)^{1/2} (K₁+K₂) P,
        // C_M = 1.036149e-7 and, with the IAU 2015 nominal solar radius, C_a = 1.976568e-2
        // (km/s, days, nominal solar units).
        double cm = 1.036149e-7;
        double ca = 1.976568e-2;
        double[][] cases = {{3.2145, 0.0, 88.2, 95.3, 121.7}, {12.7, 0.31, 85.0, 44.0, 61.2}, {1.1, 0.05, 80.0, 150, 210}};
        for (double[] c : cases) {
            AbsoluteDimensions d = AbsoluteDimensions.of(elements(c[0], c[1], c[2], c[3], c[4]));
            double oneMinusE2 = 1 - c[1] * c[1];
            double sum = c[3] + c[4];
            double m1sin3 = cm * Math.pow(oneMinusE2, 1.5) * sum * sum * c[4] * c[0];
            double m2sin3 = cm * Math.pow(oneMinusE2, 1.5) * sum * sum * c[3] * c[0];
            double asini = ca * Math.sqrt(oneMinusE2) * sum * c[0];
            assertThat(d.get(Quantity.MSIN3I1)).isCloseTo(m1sin3, within(2e-6 * m1sin3));
            assertThat(d.get(Quantity.MSIN3I2)).isCloseTo(m2sin3, within(2e-6 * m2sin3));
            assertThat(d.get(Quantity.A_SIN_I)).isCloseTo(asini, within(2e-6 * asini));
            double sin3 = Math.pow(Math.sin(Math.toRadians(c[2])), 3);
            assertThat(d.get(Quantity.MASS1)).isCloseTo(m1sin3 / sin3, within(2e-6 * m1sin3 / sin3));
            assertThat(d.get(Quantity.MASS_RATIO)).isCloseTo(c[3] / c[4], within(1e-12));
        }
    }

    @Test
    void theHandbookConstantsFollowFromTheNominalSolarValues() {
        // REFERENCE-VALUES.md §2 (VC): with GM☉ᴺ and R☉ᴺ a calculator must give C_M = 1.0361491e-7
        // and C_a = 0.019765685 (Torres et al. 2010 print 1.976682e-2 for R☉ = 695 660 km).
        // M₁ sin³i / [(1−e²)^{3/2} (K₁+K₂)² K₂ P] and a sin i / [(1−e²)^{1/2} (K₁+K₂) P] are these.
        double p = 7.3;
        double e = 0.2;
        double k1 = 60;
        double k2 = 80;
        AbsoluteDimensions d = AbsoluteDimensions.of(elements(p, e, 83.0, k1, k2));
        double cm = d.get(Quantity.MSIN3I1) / (Math.pow(1 - e * e, 1.5) * (k1 + k2) * (k1 + k2) * k2 * p);
        double ca = d.get(Quantity.A_SIN_I) / (Math.sqrt(1 - e * e) * (k1 + k2) * p);
        assertThat(cm).isCloseTo(1.0361491e-7, within(1e-13));
        assertThat(ca).isCloseTo(0.019765685, within(1e-9));
    }

    @Test
    void theNominalSunsTemperatureAndIrradianceFollowFromItsLuminosity() {
        // REFERENCE-VALUES.md §1: a component with L = L☉ᴺ and R = R☉ᴺ must have Teff = 5772.0 ± 0.01 K
        // (B3's values are consistent to (L/(4πR²σ))^¼ = 5772.003 K); L is ∝ T⁴, so the temperature
        // that gives L☉ᴺ is 5772 (L☉ᴺ / L(5772))^¼
        double teff = 5772.0 * Math.pow(3.828e26 / AbsoluteDimensions.luminosityW(6.957e8, 5772.0), 0.25);
        assertThat(teff).isCloseTo(5772.0, within(0.01));
        // and L☉ᴺ/(4π au²) = 1361.17 W m⁻², the B3 nominal irradiance 1361 W m⁻² (§1, VC)
        double au = AstronomicalConstants.IAU_2012_ASTRONOMICAL_UNIT_M;
        assertThat(AstronomicalConstants.IAU_2015_NOMINAL_SOLAR_LUMINOSITY_W / (4 * Math.PI * au * au))
                .isCloseTo(1361.17, within(0.01));
    }

    @Test
    void publishedMassesOfDetachedBinaries() {
        // AI Phe: P, e, i, K from REFERENCE-VALUES.md §8 (V2, encyclopaedia infobox, checked there to
        // reproduce the published 1.1973 and 1.2473 M☉ exactly). The star with K = 49.11 km/s is the
        // heavier: the infobox attaches its K1 label to the lighter star, so both orders are tried.
        AbsoluteDimensions aiPhe = AbsoluteDimensions.of(elements(24.592483, 0.1821, 88.502, 51.16, 49.11));
        assertThat(aiPhe.get(Quantity.MASS1)).isCloseTo(1.1973, within(1e-4));
        assertThat(aiPhe.get(Quantity.MASS2)).isCloseTo(1.2473, within(1e-4));
        // 1 Per (V436 Per), same table: published 6.95 and 7.42 M☉; K rounded to 0.1 km/s, so 0.2 %.
        AbsoluteDimensions onePer = AbsoluteDimensions.of(elements(25.935951, 0.3768, 88.048, 97.4, 91.2));
        assertThat(onePer.get(Quantity.MASS1)).isCloseTo(6.95, within(0.002 * 6.95));
        assertThat(onePer.get(Quantity.MASS2)).isCloseTo(7.42, within(0.002 * 7.42));
    }

    @Test
    void theNominalSunThroughStefanBoltzmann() {
        // IAU 2015 Resolution B3: R☉ᴺ = 6.957e8 m, Teff☉ᴺ = 5772 K, L☉ᴺ = 3.828e26 W; CODATA 2018 σ.
        // B3 chose the values consistent to (L/(4πR²σ))^¼ = 5772.003 K (REFERENCE-VALUES.md §1, VC).
        double l = AbsoluteDimensions.luminosityW(6.957e8, 5772.0);
        assertThat(l / 3.828e26).isCloseTo(1.0, within(1e-4));
        // IAU 2015 Resolution B2: M_bol of the nominal Sun ≈ 4.74 (−2.5 log(3.828e26/3.0128e28) = 4.739996)
        assertThat(AbsoluteDimensions.bolometricMagnitude(3.828e26)).isCloseTo(4.74, within(1e-4));
        // L₀ itself has M_bol = 0 by definition (B2)
        assertThat(AbsoluteDimensions.bolometricMagnitude(3.0128e28)).isCloseTo(0.0, within(1e-12));
    }

    @Test
    void aSunLikeComponentHasTheSunsGravityAndLuminosity() {
        // Build elements so that star 1 has M = 1 and R = 1 in nominal units: with K1 = K2 both stars
        // weigh the same; choose P and K so that M1 = 1, then r1 = R☉ᴺ/a. Expected log g of the
        // nominal Sun: log10(GM☉ᴺ/R☉ᴺ² · 100) = 4.43812 (computed from B3's exact values here).
        double p = 10.0;
        double k = 1.0;
        double m1 = AbsoluteDimensions.of(elements(p, 0, 90, k, k)).get(Quantity.MASS1);
        double kSun = k * Math.cbrt(1.0 / m1); // masses scale as K³ at fixed P
        AbsoluteDimensions probe = AbsoluteDimensions.of(elements(p, 0, 90, kSun, kSun));
        double a = probe.get(Quantity.SEMI_MAJOR_AXIS);
        AbsoluteDimensions sun = AbsoluteDimensions.of(new BinaryElements(p, 0, 90, kSun, kSun, 1.0 / a, 0.5 / a,
                5772.0, Double.NaN, 1.0));
        assertThat(sun.get(Quantity.MASS1)).isCloseTo(1.0, within(1e-12));
        assertThat(sun.get(Quantity.RADIUS1)).isCloseTo(1.0, within(1e-12));
        assertThat(sun.get(Quantity.LOGG1)).isCloseTo(Math.log10(1.3271244e20 / (6.957e8 * 6.957e8) * 100), within(1e-12));
        assertThat(sun.get(Quantity.LOGG1)).isCloseTo(4.438, within(1e-3));
        assertThat(sun.get(Quantity.LUMINOSITY1)).isCloseTo(1.0, within(1e-4));
        assertThat(sun.get(Quantity.MBOL1)).isCloseTo(4.74, within(1e-3));
        // mean solar density ≈ 1.41 g cm⁻³ (from memory; 3 M☉/(4π R☉³) with M☉ = 1.9884e30 kg gives 1.4097)
        assertThat(sun.get(Quantity.DENSITY1)).isCloseTo(1.41, within(0.005));
        // J = 1 and no Teff2: Teff2 = Teff1 (fourth-root approximation), star 2 half the radius: L/4
        assertThat(sun.get(Quantity.TEFF2)).isCloseTo(5772.0, within(1e-9));
        assertThat(sun.get(Quantity.LUMINOSITY2)).isCloseTo(0.25, within(1e-4));
        // synchronous rotation 2πR/P: the nominal radius over 10 days = 5.0592 km/s (computed here)
        assertThat(sun.get(Quantity.SYNC_VELOCITY1)).isCloseTo(2 * Math.PI * 695700.0 / 864000.0, within(1e-9));
    }

    @Test
    void badElementsAreRefusedByName() {
        assertThatThrownBy(() -> AbsoluteDimensions.of(elements(3, 1.0, 88, 50, 60))).hasMessageContaining("eccentricity");
        assertThatThrownBy(() -> AbsoluteDimensions.of(elements(3, 0, 88, 0, 60))).hasMessageContaining("K1");
        assertThatThrownBy(() -> AbsoluteDimensions.of(elements(3, 0, 88, 50, -1))).hasMessageContaining("K2");
        assertThatThrownBy(() -> AbsoluteDimensions.of(new BinaryElements(3, 0, 88, 50, 60, 0.1, 0.1, -5, Double.NaN,
                Double.NaN))).hasMessageContaining("Teff1");
    }
}
