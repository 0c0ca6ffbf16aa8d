package org.twinlight.eclipse;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;

/**
 * The proximity effects: each amplitude against its paper's formula for stated parameters, the
 * shapes and phases of the terms in the model, the light-travel time against its closed form, and
 * the eclipse of the extra light.
 */
class ProximityEffectsTest {
    private static final double PERIOD = 0.8;
    private static final double EPOCH = 2460000.3;

    /** A pair seen at i = 60°: no eclipse, so the out-of-eclipse terms are seen alone. */
    private static BinaryParameters uneclipsed(ProximityEffects x) {
        return new BinaryParameters(PERIOD, EPOCH, 0.2, 0.15, 60, 0, 90, 0.6, 0, LimbDarkening.of(
                LimbDarkeningLaw.LINEAR, 0.6), LimbDarkening.of(LimbDarkeningLaw.LINEAR, 0.5), 0, 1, x);
    }

    private static double extra(BinaryModel m, double phase) {
        double[] e = m.extraLight(EPOCH + phase * PERIOD);
        return e[0] + e[1];
    }

    @Test
    void ellipsoidalCoefficientsMatchTheWorkedExample() {
        // Morris & Naftilan 1993, ApJ 419, 344 (form as quoted by later work; equation numbers from memory);
        // values: twinlight REFERENCE-VALUES §10 worked example, checked there by a numerical integration
        // over a tidally distorted surface: u=0.6, τ=0.4, q=0.5, R/a=0.25, i=85°
        double[] a = ProximityFormulas.ellipsoidalCoefficients(0.5, 0.25, 85, 0.6, 0.4);
        assertThat(a[0]).isCloseTo(5.264421e-4, within(1e-9));
        assertThat(a[1]).isCloseTo(1.058306e-2, within(1e-8));
        assertThat(a[2]).isCloseTo(9.051155e-4, within(1e-9));
        // same source, table row u=0.4, τ=0.5, i=60°: cos 2φ over q(R/a)³ is −0.99952, cos φ over q(R/a)⁴ is +0.03903
        double[] b = ProximityFormulas.ellipsoidalCoefficients(1, 1, 60, 0.4, 0.5);
        assertThat(-b[1]).isCloseTo(-0.99952, within(1e-5));
        assertThat(-b[0]).isCloseTo(0.03903, within(1e-5));
        // u = 0, τ = 0: the pure tide, α₂ = 3/4 (Kallrath & Milone, Eclipsing Binary Stars, App. D.1)
        assertThat(ProximityFormulas.ellipsoidalCoefficients(1, 1, 90, 0, 0)[1]).isCloseTo(0.75, within(1e-15));
    }

    @Test
    void linearEquivalentOfALinearLawIsItsCoefficient() {
        // ∫(1 − u + uμ)μ dμ = 1/2 − u/6 (direct integration)
        assertThat(ProximityFormulas.linearEquivalent(LimbDarkening.of(LimbDarkeningLaw.LINEAR, 0.6)))
                .isCloseTo(0.6, within(1e-12));
        // quadratic a, b: ∫ = 1/2 − a/6 − b/12, so u = a + b/2
        assertThat(ProximityFormulas.linearEquivalent(LimbDarkening.quadratic(0.4, 0.2))).isCloseTo(0.5, within(1e-12));
    }

    @Test
    void lambertPhaseFunctionAndItsFourierContent() {
        // Eddington 1926, Internal Constitution of the Stars §144; values REFERENCE-VALUES §12
        assertThat(ProximityFormulas.lambertPhase(0)).isCloseTo(1, within(1e-15));
        assertThat(ProximityFormulas.lambertPhase(Math.PI / 2)).isCloseTo(0.3183099, within(1e-7));
        assertThat(ProximityFormulas.lambertPhase(Math.PI)).isCloseTo(0, within(1e-15));
        // A_B = 0.5, R/a = 0.1: full-phase ΔF/F₁ = 3.333333e-3
        assertThat(ProximityFormulas.reflectionAmplitude(0.5, 0.1)).isCloseTo(3.333333e-3, within(1e-9));
        // edge-on, star 2 reflecting: mean 4/π², cos φ coefficient −1/2 (of its full phase), cos 2φ 8/(9π²)
        ProximityEffects x = new ProximityEffects(null, null, null, null, null,
                new ProximityEffects.Reflection(0, 1), null);
        BinaryParameters p = BinaryParameters.circular(PERIOD, EPOCH, 0.1, 0.1, 90, 1).withProximity(x);
        BinaryModel m = new BinaryModel(p);
        double full = 0.5 * ProximityFormulas.reflectionAmplitude(1, 0.1); // star 1 gives half the light
        int n = 720;
        double mean = 0;
        double c1 = 0;
        double c2 = 0;
        for (int k = 0; k < n; k++) {
            double ph = (k + 0.5) / n;
            double v = m.extraLight(EPOCH + ph * PERIOD)[1] / full;
            mean += v / n;
            c1 += 2 * v * Math.cos(2 * Math.PI * ph) / n;
            c2 += 2 * v * Math.cos(4 * Math.PI * ph) / n;
        }
        assertThat(mean).isCloseTo(0.4052847, within(1e-6));
        assertThat(c1).isCloseTo(-0.5, within(1e-6));
        assertThat(c2).isCloseTo(0.0900633, within(1e-6));
    }

    @Test
    void reflectionOfEachStarPeaksWhenItsHeatedFaceIsSeen() {
        // star 2's heated face faces the observer at secondary conjunction (phase 0.5), star 1's at phase 0
        ProximityEffects x = new ProximityEffects(null, null, null, null, null,
                new ProximityEffects.Reflection(0.3, 0.8), null);
        BinaryModel m = new BinaryModel(uneclipsed(x));
        double best2 = Double.NEGATIVE_INFINITY;
        double at2 = -1;
        double best1 = Double.NEGATIVE_INFINITY;
        double at1 = -1;
        for (int k = 0; k < 1000; k++) {
            double ph = k / 1000.0;
            double[] e = m.extraLight(EPOCH + ph * PERIOD);
            if (e[1] > best2) {
                best2 = e[1];
                at2 = ph;
            }
            if (e[0] > best1) {
                best1 = e[0];
                at1 = ph;
            }
        }
        assertThat(at2).isCloseTo(0.5, within(1e-9));
        assertThat(at1).isCloseTo(0.0, within(1e-9));
        assertThat(m.extraLight(EPOCH + 0.25 * PERIOD)[1]).isLessThan(best2);
    }

    @Test
    void ellipsoidalVariationHasMinimaAtBothConjunctions() {
        ProximityEffects x = new ProximityEffects(0.7, null, null, null,
                ProximityEffects.Ellipsoidal.fromPhysics(0.32, 0.32), null, null);
        BinaryModel m = new BinaryModel(uneclipsed(x));
        // cos 2φ: maxima at quadratures, minima at both conjunctions, phase 0 the deeper (u > 0)
        assertThat(extra(m, 0.0)).isLessThan(extra(m, 0.1)).isLessThan(extra(m, 0.25));
        assertThat(extra(m, 0.5)).isLessThan(extra(m, 0.4)).isLessThan(extra(m, 0.25));
        assertThat(extra(m, 0.0)).isNotEqualTo(extra(m, 0.5));
        assertThat(extra(m, 0.25)).isCloseTo(extra(m, 0.75), within(1e-10));
        // the model against the paper's series written out here (star 2's angle is φ + π, its q is 1/q)
        BinaryParameters p = m.parameters();
        double w1 = 1 / (1 + p.lightRatio());
        double s = Math.sin(Math.toRadians(60));
        for (double ph : new double[] {0.0, 0.13, 0.37, 0.5, 0.81}) {
            double phi = 2 * Math.PI * ph;
            double expected = 0;
            double[][] stars = {{0.7, 0.2, 0.6, w1, 0}, {1 / 0.7, 0.15, 0.5, 1 - w1, Math.PI}};
            for (double[] st : stars) {
                double q = st[0];
                double r = st[1];
                double u = st[2];
                double a1 = 15 * u * (2.32) / (32 * (3 - u)) * q * Math.pow(r, 4) * s * (5 * s * s - 4);
                double a2 = 3 * (15 + u) * (1.32) / (20 * (3 - u)) * q * r * r * r * s * s;
                double a3 = 25 * u * (2.32) / (32 * (3 - u)) * q * Math.pow(r, 4) * s * s * s;
                double t = phi + st[4];
                expected -= st[3] * (a1 * Math.cos(t) + a2 * Math.cos(2 * t) + a3 * Math.cos(3 * t));
            }
            assertThat(extra(m, ph)).isCloseTo(expected, within(1e-10));
        }
    }

    @Test
    void beamingIsAnOddSineTermOfThePaperSize() {
        // Loeb & Gaudi 2003, ApJ 588, L117: 4αK/c; K = 100 km/s, α = 1 → 1.334256e-3 (REFERENCE-VALUES §11)
        assertThat(ProximityFormulas.beamingAmplitude(1, 100)).isCloseTo(1.334256e-3, within(1e-9));
        ProximityEffects x = new ProximityEffects(null, null, 120.0, 160.0, null, null,
                ProximityEffects.Beaming.fromVelocities(1.0, 0.8));
        BinaryModel m = new BinaryModel(uneclipsed(x));
        for (double ph : new double[] {0.05, 0.17, 0.25, 0.33}) {
            assertThat(extra(m, ph)).isCloseTo(-extra(m, -ph), within(1e-10));
        }
        assertThat(extra(m, 0)).isCloseTo(0, within(1e-10));
        assertThat(extra(m, 0.5)).isCloseTo(0, within(1e-10));
        // star 1 approaches at phase 0.25 (v₁ = −K₁ sin φ) and is brightened; star 2 recedes and is dimmed
        double w1 = 1 / (1 + m.parameters().lightRatio());
        double expected = w1 * 4 * 1.0 * 120e3 / 299792458.0 - (1 - w1) * 4 * 0.8 * 160e3 / 299792458.0;
        assertThat(extra(m, 0.25)).isCloseTo(expected, within(1e-10));
    }

    @Test
    void lightTravelTimeMatchesTheExactSimulation() {
        // Kaplan 2010, ApJ 717, L108; exact retarded-time simulation in REFERENCE-VALUES §13:
        // m1 = 1.0, m2 = 0.5, P = 1 d, K1 = 81.240, K2 = 162.479 → the secondary comes 7.45266 s late
        assertThat(ProximityFormulas.secondaryDelayFromVelocities(1.0, 81.240, 162.479)).isCloseTo(7.45266,
                within(1e-4));
        // m1 = 0.15, m2 = 0.7, P = 0.235 d → 4.55895 s early
        assertThat(ProximityFormulas.secondaryDelayFromVelocities(0.235, 269.146, 57.674)).isCloseTo(-4.55895,
                within(1e-4));
        // from a: Kepler's third law a³ = GM☉(m1+m2)P²/4π² (IAU 2015 B3 nominal GM☉), computed here
        double pSec = 86400.0;
        double a = Math.cbrt(1.3271244e20 * 1.5 * pSec * pSec / (4 * Math.PI * Math.PI));
        assertThat(ProximityFormulas.secondaryDelayFromOrbit(a / 6.957e8, 0.5, 90)).isCloseTo(7.45266, within(1e-4));
    }

    @Test
    void theSecondaryEclipseComesLateByTheDelay() {
        BinaryParameters base = BinaryParameters.circular(1.0, EPOCH, 0.12, 0.1, 89, 0.5);
        ProximityEffects x = new ProximityEffects(null, null, 81.240, 162.479, null, null, null);
        BinaryModel plain = new BinaryModel(base);
        BinaryModel delayed = new BinaryModel(base.withProximity(x));
        double delayDays = 7.45266 / 86400; // REFERENCE-VALUES §13, row 1
        for (double dx : new double[] {-0.02, -0.01, -0.004, 0, 0.003, 0.011, 0.019}) {
            double t = EPOCH + 0.5 + dx;
            assertThat(delayed.flux(t + delayDays)).isCloseTo(plain.flux(t), within(2e-6));
            // the primary eclipse stays at the epoch
            assertThat(delayed.flux(EPOCH + dx)).isEqualTo(plain.flux(EPOCH + dx));
        }
        assertThat(delayed.proximityAmplitudes().get("lightTravelTimeSeconds")).isCloseTo(7.45266, within(1e-4));
    }

    @Test
    void aHiddenHeatedFaceDoesNotShine() {
        // total secondary eclipse (star 2 wholly behind star 1): star 2's reflected light is gone, and star 1's
        // heated face is turned away, so the flux is star 1's own light fraction L₁/(L₁+L₂) exactly
        ProximityEffects x = new ProximityEffects(null, null, null, null, null,
                new ProximityEffects.Reflection(0.9, 0.9), null);
        BinaryParameters p = BinaryParameters.circular(PERIOD, EPOCH, 0.2, 0.08, 90, 0.4).withProximity(x);
        BinaryModel m = new BinaryModel(p);
        double l2OverL1 = 0.4 * Math.pow(0.08 / 0.2, 2); // uniform discs
        assertThat(m.flux(EPOCH + 0.5 * PERIOD)).isCloseTo(1 / (1 + l2OverL1), within(1e-12));
        // just outside that eclipse the heated face of star 2 adds light
        assertThat(m.flux(EPOCH + 0.33 * PERIOD)).isGreaterThan(1.0);
    }

    @Test
    void theTabulatedTermsFollowTheFormulas() {
        // the model interpolates the terms over phase; edge-on (the reflection's least smooth case) and eccentric,
        // out of eclipse the flux must equal 1 + E₁ + E₂ from the formulas to far below any photometric noise
        ProximityEffects x = new ProximityEffects(0.6, null, 100.0, 160.0, ProximityEffects.Ellipsoidal.fromPhysics(0.3,
                0.4), new ProximityEffects.Reflection(1, 1), ProximityEffects.Beaming.fromVelocities(1, 1));
        for (BinaryParameters p : new BinaryParameters[] {
            BinaryParameters.circular(PERIOD, EPOCH, 0.2, 0.15, 90, 0.5).withProximity(x),
            uneclipsed(x).withEccentricityOmega(0.15, 40)}) {
            BinaryModel m = new BinaryModel(p);
            for (int k = 0; k < 2000; k++) {
                double t = EPOCH + (k + 0.37) / 2000 * PERIOD;
                if (!m.inEclipse(t)) {
                    // common practice, no source: 1e-7 of the light is below the noise of any photometry
                    assertThat(m.flux(t)).isCloseTo(1 + extra(m, (t - EPOCH) / PERIOD), within(1e-7));
                }
            }
        }
    }

    @Test
    void badValuesNameTheirKey() {
        assertThatThrownBy(() -> new ProximityEffects.Reflection(1.2, 0.5)).hasMessageContaining("reflection.albedo1");
        assertThatThrownBy(() -> new ProximityEffects.Reflection(0.5, -0.1)).hasMessageContaining("reflection.albedo2");
        assertThatThrownBy(() -> new ProximityEffects(0.0, null, null, null, null, null, null))
                .hasMessageContaining("massRatio");
        assertThatThrownBy(() -> new ProximityEffects(null, null, null, null,
                ProximityEffects.Ellipsoidal.fromPhysics(0.3, 0.3), null, null)).hasMessageContaining("massRatio");
        assertThatThrownBy(() -> new ProximityEffects.Ellipsoidal(0.3, null, null))
                .hasMessageContaining("ellipsoidal.gravityDarkening2");
        assertThatThrownBy(() -> new ProximityEffects(null, null, 100.0, null, null, null,
                ProximityEffects.Beaming.fromVelocities(1, 1))).hasMessageContaining("k2");
    }
}
