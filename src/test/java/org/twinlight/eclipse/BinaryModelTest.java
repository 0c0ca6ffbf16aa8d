package org.twinlight.eclipse;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.apache.commons.math3.analysis.integration.IterativeLegendreGaussIntegrator;
import org.junit.jupiter.api.Test;

class BinaryModelTest {
    private static final LimbDarkening LD1 = LimbDarkening.quadratic(0.4, 0.25);
    private static final LimbDarkening LD2 = LimbDarkening.of(LimbDarkeningLaw.POWER_2, 0.6, 0.6);

    /**
     * L₂/L₁ written out independently: J k² ∫I₂μ dμ / ∫I₁μ dμ (the light of a disc of radius r is
     * 2π r² ∫ I μ dμ). Quadratic law: ∫(1 − a(1 − μ) − b(1 − μ)²) μ dμ = 1/2 − a/6 − b/12; power-2 law:
     * ∫(1 − c(1 − μ^α)) μ dμ = 1/2 − c/2 + c/(α + 2) (elementary integrals; for the quadratic law
     * Mandel &amp; Agol 2002, ApJ 580, L171: 4Ω = 1 − u₁/3 − u₂/6).
     */
    private static double lightRatio(double r1, double r2, double j, double flux1) {
        double flux2 = 0.5 - 0.6 / 2 + 0.6 / (0.6 + 2);
        return j * (r2 / r1) * (r2 / r1) * flux2 / flux1;
    }

    private static final double QUADRATIC_FLUX = 0.5 - 0.4 / 6 - 0.25 / 12;

    private static BinaryParameters edgeOn(double r1, double r2, double j, double l3) {
        return new BinaryParameters(2.0, 0.0, r1, r2, 90.0, 0, 90, j, l3, LD1, LD2, 0, 1);
    }

    @Test
    void totalOccultationRemovesExactlyTheLightOfTheSmallerStar() {
        // definition of a total eclipse: the whole of star 2 is hidden, F = L₁/(L₁+L₂)
        BinaryParameters p = edgeOn(0.12, 0.07, 0.7, 0);
        BinaryModel m = new BinaryModel(p);
        double lr = lightRatio(0.12, 0.07, 0.7, QUADRATIC_FLUX);
        assertThat(p.lightRatio()).isCloseTo(lr, within(1e-12));
        assertThat(m.flux(1.0)).isCloseTo(1 / (1 + lr), within(1e-12));
    }

    @Test
    void centralTransitOfUniformDiscRemovesTheAreaRatio() {
        // uniform source, z ≤ 1 − p: λᵉ = p² (Mandel & Agol 2002, ApJ 580, L171, sect. 2)
        BinaryParameters p = edgeOn(0.12, 0.05, 0.5, 0).withLimbDarkening(LimbDarkening.uniform(), LD2);
        BinaryModel m = new BinaryModel(p);
        double k = 0.05 / 0.12;
        double w1 = 1 / (1 + lightRatio(0.12, 0.05, 0.5, 0.5));
        assertThat(1 - m.flux(0.0)).isCloseTo(w1 * k * k, within(1e-12));
    }

    @Test
    void thirdLightDilutesEveryDepth() {
        // F = F₀(1 − ℓ₃) + ℓ₃ (contract definition of third light)
        BinaryModel plain = new BinaryModel(edgeOn(0.12, 0.08, 0.6, 0));
        BinaryModel diluted = new BinaryModel(edgeOn(0.12, 0.08, 0.6, 0.3));
        for (double t = -0.05; t < 0.05; t += 0.003) {
            assertThat(1 - diluted.flux(t)).isCloseTo((1 - plain.flux(t)) * 0.7, within(1e-14));
        }
    }

    @Test
    void circularEclipsesAreSymmetricAndFluxNeverExceedsOne() {
        BinaryModel m = new BinaryModel(new BinaryParameters(2.0, 0.0, 0.15, 0.11, 86.0, 0, 90, 0.8, 0.05, LD1, LD2, 0, 1));
        for (double dt = 0; dt < 1.0; dt += 0.0017) {
            assertThat(m.flux(dt)).isLessThanOrEqualTo(1.0);
            assertThat(m.flux(dt)).isCloseTo(m.flux(-dt), within(1e-13));
            assertThat(m.flux(1.0 + dt)).isCloseTo(m.flux(1.0 - dt), within(1e-13));
        }
    }

    @Test
    void manyTimesAtOnceAgreeWithTheExactModelAtEachTime() {
        // flux over an array interpolates each eclipse's occultation table when many points are in it;
        // flux(t) evaluates the occultation exactly (Mandel & Agol 2002 for the quadratic star, the
        // quadrature checked against Commons Math for the power-2 one): they must agree to 1e-8
        BinaryParameters circular = new BinaryParameters(2.0, 0.0, 0.15, 0.11, 86.0, 0, 90, 0.8, 0, LD1, LD2, 0, 1);
        // with proximity effects and the light-travel delay of the secondary eclipse too
        BinaryParameters close = circular.withProximity(new ProximityEffects(0.8, null, 95.0, 118.75,
                ProximityEffects.Ellipsoidal.fromPhysics(0.32, 0.32), new ProximityEffects.Reflection(0.5, 0.5),
                ProximityEffects.Beaming.fromVelocities(1.0, 1.1)));
        BinaryParameters[] cases = {circular, circular.withEccentricityOmega(0.2, 70),
            circular.withExposure(0.02, 5), circular.withRadii(0.11, 0.15), close};
        double[] t = new double[4000];
        for (int i = 0; i < t.length; i++) {
            t[i] = -0.3 + 4.6 * i / t.length;
        }
        // times in reverse order too: the skip between conjunction windows applies only to ascending runs
        double[] reversed = new double[t.length];
        for (int i = 0; i < t.length; i++) {
            reversed[i] = t[t.length - 1 - i];
        }
        for (BinaryParameters p : cases) {
            BinaryModel m = new BinaryModel(p);
            double[] many = m.flux(t);
            double[] backwards = m.flux(reversed);
            for (int i = 0; i < t.length; i++) {
                assertThat(backwards[t.length - 1 - i]).isEqualTo(many[i]);
            }
            // the path for ascending times gives the same numbers, and exactly 1 outside the ranges it returns
            double[] fast = new double[t.length];
            int[] windows = m.fluxOfAscendingTimes(t, fast);
            assertThat(fast).containsExactly(many);
            if (windows != null) {
                boolean[] inside = new boolean[t.length];
                for (int k = 0; k < windows.length; k += 2) {
                    assertThat(windows[k]).isLessThan(windows[k + 1]);
                    java.util.Arrays.fill(inside, windows[k], windows[k + 1], true);
                }
                for (int i = 0; i < t.length; i++) {
                    if (!inside[i]) {
                        assertThat(fast[i]).as("t=%s", t[i]).isEqualTo(1.0);
                    }
                }
            }
            int primary = 0;
            int secondary = 0;
            for (int i = 0; i < t.length; i++) {
                assertThat(many[i]).as("%s t=%s", p, t[i]).isCloseTo(m.flux(t[i]), within(1e-8));
                if (m.inEclipse(t[i])) {
                    if (Math.abs(t[i] - Math.rint(t[i] / 2) * 2) < 0.5) {
                        primary++;
                    } else {
                        secondary++;
                    }
                }
            }
            assertThat(primary).isGreaterThan(2 * OccultationTable.MIN_POINTS);
            assertThat(secondary).isGreaterThan(2 * OccultationTable.MIN_POINTS);
        }
    }

    @Test
    void exposureSmearingApproachesTheTimeAverageOfTheFlux() {
        // independent: Commons Math quadrature of the instantaneous flux over the exposure
        BinaryParameters p = new BinaryParameters(2.0, 0.0, 0.15, 0.11, 88.0, 0, 90, 0.8, 0, LD1, LD2, 0.02, 200);
        BinaryModel smeared = new BinaryModel(p);
        BinaryModel sharp = new BinaryModel(p.withExposure(0, 1));
        IterativeLegendreGaussIntegrator gl = new IterativeLegendreGaussIntegrator(16, 1e-12, 1e-13);
        for (double t : new double[] {-0.06, -0.03, 0.0, 0.021, 0.05}) {
            double mean = gl.integrate(100000, sharp::flux, t - 0.01, t + 0.01) / 0.02;
            // midpoint rule with 200 sub-exposures: error ~ (T/N)² |F''|/24 (Press et al. 2007, §4.1)
            assertThat(smeared.flux(t)).as("t=%s", t).isCloseTo(mean, within(2e-6));
        }
    }

    @Test
    void spheresThatWouldTouchAreRefused() {
        // two detached spheres need r₁ + r₂ < separation at periastron, a(1 − e) (geometry)
        org.assertj.core.api.Assertions.assertThatThrownBy(() -> edgeOn(0.6, 0.45, 0.5, 0))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("overlap");
        org.assertj.core.api.Assertions.assertThatThrownBy(() -> edgeOn(0.2, 0.15, 0.5, 0).withEccentricityOmega(0.7, 30))
                .hasMessageContaining("periastron");
    }
}
