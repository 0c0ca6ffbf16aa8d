package org.twinlight.eclipse;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import org.apache.commons.math3.analysis.integration.IterativeLegendreGaussIntegrator;
import org.junit.jupiter.api.Test;

class LimbDarkeningTest {
    private static final LimbDarkening[] LAWS = {
        LimbDarkening.uniform(),
        LimbDarkening.of(LimbDarkeningLaw.LINEAR, 0.6),
        LimbDarkening.quadratic(0.4, 0.26),
        LimbDarkening.of(LimbDarkeningLaw.SQUARE_ROOT, 0.1, 0.55),
        LimbDarkening.of(LimbDarkeningLaw.LOGARITHMIC, 0.7, 0.25),
        LimbDarkening.of(LimbDarkeningLaw.POWER_2, 0.65, 0.55),
        LimbDarkening.of(LimbDarkeningLaw.FOUR_PARAMETER, 0.5, -0.2, 0.6, -0.25),
    };

    @Test
    void intensityMatchesThePublishedFormsAndIsOneAtDiscCentre() {
        // each law as published, written out here independently of the production code (all from memory):
        // linear: Milne 1921, MNRAS 81, 361; quadratic: Kopal 1950, Harvard Coll. Obs. Circ. 454, 1;
        // square-root: Díaz-Cordovés & Giménez 1992, A&A 259, 227; logarithmic: Klinglesmith &
        // Sobieski 1970, AJ 75, 175; power-2: Hestroffer 1997, A&A 327, 199; four-parameter:
        // Claret 2000, A&A 363, 1081, eq. 5. The μ ln μ term of the logarithmic law enters with a
        // minus sign: I = 1 − e(1 − μ) − f μ ln μ, which brightens the limb-ward disc for f > 0.
        double mu = 0.37;
        assertThat(LAWS[1].intensity(mu)).isCloseTo(1 - 0.6 * (1 - mu), within(1e-15));
        assertThat(LAWS[2].intensity(mu)).isCloseTo(1 - 0.4 * (1 - mu) - 0.26 * (1 - mu) * (1 - mu), within(1e-15));
        assertThat(LAWS[3].intensity(mu)).isCloseTo(1 - 0.1 * (1 - mu) - 0.55 * (1 - Math.sqrt(mu)), within(1e-15));
        assertThat(LAWS[4].intensity(mu)).isCloseTo(1 - 0.7 * (1 - mu) - 0.25 * mu * Math.log(mu), within(1e-15));
        assertThat(LAWS[5].intensity(mu)).isCloseTo(1 - 0.65 * (1 - Math.pow(mu, 0.55)), within(1e-15));
        double four = 1;
        double[] a = {0.5, -0.2, 0.6, -0.25};
        for (int k = 1; k <= 4; k++) {
            four -= a[k - 1] * (1 - Math.pow(mu, k / 2.0));
        }
        assertThat(LAWS[6].intensity(mu)).isCloseTo(four, within(1e-15));
        for (LimbDarkening ld : LAWS) {
            assertThat(ld.intensity(1)).as(ld.toString()).isCloseTo(1, within(1e-15));
        }
    }

    @Test
    void centralFluxClosedFormsAgreeWithNumericalQuadrature() {
        // independent check: Commons Math Gauss–Legendre quadrature of ∫ I(μ) μ dμ
        IterativeLegendreGaussIntegrator gl = new IterativeLegendreGaussIntegrator(32, 1e-14, 1e-15);
        for (LimbDarkening ld : LAWS) {
            for (double mu0 : new double[] {0, 0.05, 0.3, 0.77, 0.999}) {
                // the substitution μ = s² removes the √μ and μ ln μ behaviour at μ = 0
                double ref = gl.integrate(100000, s -> ld.intensity(s * s) * s * s * 2 * s, Math.sqrt(mu0), 1);
                assertThat(ld.centralFlux(mu0)).as("%s from μ0=%s", ld, mu0).isCloseTo(ref, within(1e-13));
            }
        }
    }

    @Test
    void quadraticTotalFluxIsTheKnownNormalisation() {
        // ∫₀¹ I μ dμ = (1 − u₁/3 − u₂/6)/2 for the quadratic law (Mandel & Agol 2002, ApJ 580, L171:
        // 4Ω = 1 − u₁/3 − u₂/6 with Ω = c₀/4 + c₂/6 + c₄/8)
        LimbDarkening ld = LimbDarkening.quadratic(0.4, 0.26);
        assertThat(ld.totalFlux()).isCloseTo((1 - 0.4 / 3 - 0.26 / 6) / 2, within(1e-15));
    }

    @Test
    void negativeIntensityIsFoundWhereItOccurs() {
        // quadratic law at the limb: I(0) = 1 − a − b (the contract's form)
        LimbDarkening bad = LimbDarkening.quadratic(1.5, 0.5);
        assertThat(bad.isNonNegative()).isFalse();
        assertThat(bad.lowestIntensityMu()).isEqualTo(0.0);
        for (LimbDarkening ld : LAWS) {
            assertThat(ld.isNonNegative()).as(ld.toString()).isTrue();
        }
    }

    @Test
    void wrongCoefficientCountIsRefusedWithTheLawsNames() {
        assertThatThrownBy(() -> LimbDarkening.of(LimbDarkeningLaw.QUADRATIC, 0.3))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("quadratic").hasMessageContaining("2");
        assertThatThrownBy(() -> LimbDarkening.of(LimbDarkeningLaw.POWER_2, 0.3, -1))
                .hasMessageContaining("alpha");
    }
}
