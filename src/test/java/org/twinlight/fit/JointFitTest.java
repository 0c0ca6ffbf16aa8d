package org.twinlight.fit;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.twinlight.BadInputException;
import org.twinlight.eclipse.BinaryModel;
import org.twinlight.eclipse.BinaryParameters;
import org.twinlight.eclipse.LimbDarkening;
import org.twinlight.eclipse.ModelFile;
import org.twinlight.eclipse.SyntheticLightCurve;
import org.twinlight.orbit.RadialVelocityCurve;
import org.twinlight.photometry.LightCurve;
import org.twinlight.time.TimeScale;
import org.twinlight.velocity.StarVelocities;
import org.twinlight.velocity.SyntheticVelocities;
import org.twinlight.velocity.VelocityData;
import org.twinlight.velocity.VelocityParameters;

/**
 * The joint light-curve + radial-velocity fit: one objective, shared period, epoch, e and ω.
 * Closed-loop checks against the truth of a synthetic eccentric system in units of the fit's own
 * uncertainties: for a correct fit with correct errors the pulls (fitted − true)/σ follow a unit
 * normal (Barlow 1989, <i>Statistics</i>, Wiley, §5.6; Press et al. 2007, <i>Numerical Recipes</i>
 * 3rd ed., §15.6). The light curve comes from the project's simulator (eclipse package), the
 * velocities from {@link RadialVelocityCurve} with Gaussian noise (velocity package tests).
 */
class JointFitTest {

    // Demo system (invented): a detached eccentric pair, partial eclipses.
    private static final double E = 0.12;
    private static final double OMEGA = 70;
    private static final BinaryParameters TRUTH = new BinaryParameters(2.8731, 2460000.4123, 0.118, 0.081, 87.6,
            E, OMEGA, 0.58, 0, LimbDarkening.quadratic(0.40, 0.22), LimbDarkening.quadratic(0.45, 0.20), 0, 1);
    private static final double K1 = 62.0;
    private static final double K2 = 85.0;
    private static final double GAMMA = -12.3;
    private static final double OFFSET = 0.8;
    private static final List<String> FREE = List.of("epoch", "radius1", "radius2", "inclination",
            "surfaceBrightnessRatio", "eccentricity", "omega");

    private static LightCurve lightCurve(long seed) {
        double[] t = SyntheticLightCurve.regularTimes(2460000.0, 2460011.5, 6.0, List.of(), null);
        return SyntheticLightCurve.observe(new BinaryModel(TRUTH), t, 3000, seed, "sim-" + seed, "V",
                TimeScale.BJD_TDB);
    }

    private static VelocityData velocities(long seed) {
        VelocityParameters truth = new VelocityParameters(TRUTH.periodDays(), TRUTH.epochDays(), E, OMEGA, K1, K2,
                GAMMA, new double[] {0, OFFSET}, 0, 0);
        return SyntheticVelocities.make(truth, 30, 1.5, 2.0, 2, 1.0, seed + 1000);
    }

    private static ModelFile start() {
        return ModelFile.of(TRUTH.withRadii(TRUTH.radius1() * 1.05, TRUTH.radius2() * 0.95)
                .withInclinationDeg(TRUTH.inclinationDeg() - 0.8).withEccentricityOmega(0.10, 62)
                .withSurfaceBrightnessRatio(0.62).withEpochDays(TRUTH.epochDays() + 0.002));
    }

    private static FitSettings settings() {
        return FitSettings.defaults().withFree(new LinkedHashSet<>(FREE));
    }

    private static FitResult joint(long seed) {
        List<VelocityData> v = List.of(velocities(seed));
        return EclipseFitter.optimize(FitProblem.of(start(), List.of(new FitData(lightCurve(seed), "V")), settings(),
                Priors.none(), JointVelocities.of(v, start().common())));
    }

    @Test
    void primaryEclipseFallsAtTheVelocityCurvesConjunction() {
        // Independent of both packages' epoch definitions: find mid-eclipse from the eclipse model's
        // flux (midpoint of the half-depth crossings) and check with a Kepler solution written here
        // that star 1 is then at true anomaly ν = 90° − ω, farthest from the observer along its
        // orbit's line of sight (conjunction with star 1 behind: Hilditch 2001, "An Introduction to
        // Close Binary Stars", CUP, §2.3 and eq. 2.45, v = γ + K[cos(ν+ω) + e cos ω]).
        BinaryParameters edgeOn = TRUTH.withInclinationDeg(90);
        BinaryModel model = new BinaryModel(edgeOn);
        double mid = midEclipse(model, TRUTH.epochDays(), TRUTH.periodDays());
        double nu = trueAnomaly(mid);
        double argLat = Math.toDegrees(nu) + OMEGA;
        double off = ((argLat - 90) % 360 + 540) % 360 - 180;
        // the eclipse's timing asymmetry at e = 0.12 is far below 0.05° (common practice, no source)
        assertThat(Math.abs(off)).as("ν + ω − 90° at primary mid-eclipse").isLessThan(0.05);
        // and the velocity package's curve there: star 1 at cos(ν+ω) = 0 and approaching after it
        RadialVelocityCurve rv = new RadialVelocityCurve(TRUTH.periodDays(), TRUTH.epochDays(), E, OMEGA);
        assertThat(rv.shape(mid)).isCloseTo(E * Math.cos(Math.toRadians(OMEGA)),
                org.assertj.core.data.Offset.offset(2e-3));
        assertThat(rv.shape(mid + 0.01) - rv.shape(mid - 0.01)).isNegative();
        double secondary = midEclipse(model, TRUTH.epochDays() + TRUTH.periodDays() * (0.5 + 2 * E
                * Math.cos(Math.toRadians(OMEGA)) / Math.PI), TRUTH.periodDays());
        double nu2 = Math.toDegrees(trueAnomaly(secondary)) + OMEGA;
        assertThat(Math.abs(((nu2 - 270) % 360 + 540) % 360 - 180)).as("ν + ω − 270° at secondary").isLessThan(0.05);
    }

    /** True anomaly by Newton's method on Kepler's equation M = E − e sin E (written here, not the orbit package's). */
    private static double trueAnomaly(double t) {
        double w = Math.toRadians(OMEGA);
        // epoch is primary conjunction, ν₀ = 90° − ω
        double nu0 = Math.PI / 2 - w;
        double e0 = 2 * Math.atan(Math.sqrt((1 - E) / (1 + E)) * Math.tan(nu0 / 2));
        double m0 = e0 - E * Math.sin(e0);
        double m = m0 + 2 * Math.PI * (t - TRUTH.epochDays()) / TRUTH.periodDays();
        double ea = m;
        for (int i = 0; i < 50; i++) {
            ea -= (ea - E * Math.sin(ea) - m) / (1 - E * Math.cos(ea));
        }
        return 2 * Math.atan2(Math.sqrt(1 + E) * Math.sin(ea / 2), Math.sqrt(1 - E) * Math.cos(ea / 2));
    }

    private static double midEclipse(BinaryModel model, double guess, double period) {
        int n = 20001;
        double half = 0.08 * period;
        double minF = Double.POSITIVE_INFINITY;
        double[] t = new double[n];
        double[] f = new double[n];
        for (int i = 0; i < n; i++) {
            t[i] = guess - half + 2 * half * i / (n - 1);
            f[i] = model.flux(t[i]);
            minF = Math.min(minF, f[i]);
        }
        double level = 0.5 * (1 + minF);
        double in = Double.NaN;
        double out = Double.NaN;
        for (int i = 1; i < n; i++) {
            if (f[i - 1] >= level && f[i] < level && Double.isNaN(in)) {
                in = t[i - 1] + (f[i - 1] - level) / (f[i - 1] - f[i]) * (t[i] - t[i - 1]);
            }
            if (f[i - 1] < level && f[i] >= level) {
                out = t[i - 1] + (level - f[i - 1]) / (f[i] - f[i - 1]) * (t[i] - t[i - 1]);
            }
        }
        return 0.5 * (in + out);
    }

    @Test
    void jointFitRecoversVelocityAndOrbitParametersWithinErrors() {
        FitResult r = joint(7);
        Map<String, Double> truth = Map.of("k1", K1, "k2", K2, "gamma", GAMMA, "eccentricity", E, "omega", OMEGA,
                "offset.spec1", OFFSET);
        for (Map.Entry<String, Double> t : truth.entrySet()) {
            Estimate e = r.get(t.getKey());
            assertThat(e.free()).as(t.getKey()).isTrue();
            assertThat(e.uncertainty()).as(t.getKey()).isPositive();
            // within 3σ: a correct fit fails this for one seed in 370 per parameter (unit normal)
            assertThat(Math.abs(e.value() - t.getValue()) / e.uncertainty()).as("pull of " + t.getKey())
                    .isLessThan(3.0);
        }
        // K from 30 epochs with 1.5 and 2 km/s errors: about 0.4 km/s (σ_K ≈ σ √(2/n), e.g.
        // Lucy &amp; Sweeney 1971, AJ 76, 544, for circular orbits); well under 1 km/s
        assertThat(r.get("k1").uncertainty()).isBetween(0.15, 1.0);
        assertThat(r.get("k2").uncertainty()).isBetween(0.2, 1.2);
    }

    @Test
    void pullsOverSeedsHaveUnitSpread() {
        int seeds = 12;
        List<String> names = List.of("k1", "k2", "radius1", "inclination");
        Map<String, Double> truth = Map.of("k1", K1, "k2", K2, "radius1", TRUTH.radius1(), "inclination",
                TRUTH.inclinationDeg());
        Map<String, List<Double>> pulls = new LinkedHashMap<>();
        for (long seed = 1; seed <= seeds; seed++) {
            FitResult r = joint(seed);
            for (String name : names) {
                Estimate e = r.get(name);
                pulls.computeIfAbsent(name, k -> new ArrayList<>()).add((e.value() - truth.get(name)) / e.uncertainty());
            }
        }
        for (Map.Entry<String, List<Double>> e : pulls.entrySet()) {
            List<Double> p = e.getValue();
            double mean = p.stream().mapToDouble(Double::doubleValue).average().orElseThrow();
            double sd = Math.sqrt(p.stream().mapToDouble(v -> (v - mean) * (v - mean)).sum() / (p.size() - 1));
            long beyond2 = p.stream().filter(v -> Math.abs(v) > 2).count();
            System.out.printf("%s pull mean %.3f sd %.3f beyond 2σ %d%n", e.getKey(), mean, sd, beyond2);
            // 11 s²/σ² follows χ² with 11 degrees of freedom; its 0.1% and 99.9% points are 3.05 and
            // 31.26 (Abramowitz & Stegun 1964, table 26.8), so sd lies in [0.53, 1.69] for a correct fit
            // but for one time in 500
            assertThat(sd).as("spread of pulls of " + e.getKey()).isBetween(0.53, 1.69);
            // P(|z| > 2) = 0.0455 for a unit normal; of 12 pulls, 4 or more beyond 2 has binomial
            // probability 0.0015
            assertThat(beyond2).as("pulls of " + e.getKey() + " beyond 2σ").isLessThanOrEqualTo(3);
            // the mean of 12 unit-normal pulls has standard error 0.29; 3.3 of those is 1 in 1000
            assertThat(Math.abs(mean)).as("mean pull of " + e.getKey()).isLessThan(0.95);
        }
    }

    @Test
    void velocitiesNeverWidenTheEccentricityVector() {
        for (long seed = 21; seed <= 22; seed++) {
            LightCurve lc = lightCurve(seed);
            FitResult alone = EclipseFitter.optimize(FitProblem.of(start(), List.of(new FitData(lc, "V")), settings(),
                    Priors.none()));
            FitResult both = EclipseFitter.optimize(FitProblem.of(start(), List.of(new FitData(lc, "V")), settings(),
                    Priors.none(), JointVelocities.of(List.of(velocities(seed)), start().common())));
            for (String name : List.of("eCosOmega", "eSinOmega")) {
                // more data on the same parameters cannot enlarge the covariance (JᵀJ only gains a
                // positive semi-definite term; e.g. Press et al. 2007, §15.6) beyond the variance
                // scale's change; allow 5% for that
                assertThat(both.get(name).uncertainty()).as(name).isLessThanOrEqualTo(
                        1.05 * alone.get(name).uncertainty());
            }
            System.out.printf("seed %d: sigma(e cos w) %.2e -> %.2e, sigma(e sin w) %.2e -> %.2e%n", seed,
                    alone.get("eCosOmega").uncertainty(), both.get("eCosOmega").uncertainty(),
                    alone.get("eSinOmega").uncertainty(), both.get("eSinOmega").uncertainty());
        }
    }

    @Test
    void singleLinedVelocitiesHoldK2WithANote() {
        VelocityData full = velocities(3);
        VelocityData single = new VelocityData(full.source(), full.timeScale(), full.star1(),
                StarVelocities.empty(true), full.instruments(), Map.of(), List.of());
        JointVelocities jv = JointVelocities.of(List.of(single), start().common());
        assertThat(jv.doubleLined()).isFalse();
        assertThat(jv.notes()).anyMatch(n -> n.contains("K2 is held fixed"));
        FitResult r = EclipseFitter.optimize(FitProblem.of(start(), List.of(new FitData(lightCurve(3), "V")),
                settings(), Priors.none(), jv));
        assertThat(r.get("k2").free()).isFalse();
        assertThat(r.freeNames()).doesNotContain("k2");
        assertThat(Math.abs(r.get("k1").value() - K1) / r.get("k1").uncertainty()).isLessThan(3.5);
    }

    @Test
    void badVelocityInputIsRefusedWithTheFileNamed() {
        VelocityData full = velocities(4);
        VelocityData noStar1 = new VelocityData("rv-night.csv", full.timeScale(), StarVelocities.empty(true),
                full.star2(), full.instruments(), Map.of(), List.of());
        assertThatThrownBy(() -> JointVelocities.of(List.of(noStar1), start().common()))
                .isInstanceOf(BadInputException.class).hasMessageContaining("rv-night.csv")
                .hasMessageContaining("'v1'");
        VelocityData swapped = new VelocityData("rv-swapped.csv", full.timeScale(), full.star2(), full.star1(),
                full.instruments(), Map.of(), List.of());
        assertThatThrownBy(() -> JointVelocities.of(List.of(swapped), start().common()))
                .isInstanceOf(BadInputException.class).hasMessageContaining("rv-swapped.csv")
                .hasMessageContaining("swapped");
        StarVelocities s = full.star1();
        StarVelocities few = new StarVelocities(java.util.Arrays.copyOf(s.timesDays(), 2),
                java.util.Arrays.copyOf(s.velocitiesKms(), 2), java.util.Arrays.copyOf(s.errorsKms(), 2),
                new int[2], new int[] {1, 2});
        VelocityData tooFew = new VelocityData("rv-few.csv", full.timeScale(), few, StarVelocities.empty(true),
                List.of(""), Map.of(), List.of());
        assertThatThrownBy(() -> JointVelocities.of(List.of(tooFew), start().common()))
                .isInstanceOf(BadInputException.class).hasMessageContaining("rv-few.csv")
                .hasMessageContaining("2 velocities");
    }
}
