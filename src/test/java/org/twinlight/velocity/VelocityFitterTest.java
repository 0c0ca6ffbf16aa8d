package org.twinlight.velocity;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.junit.jupiter.api.Test;
import org.twinlight.BadInputException;
import org.twinlight.time.TimeScale;

class VelocityFitterTest {

    private static final VelocityParameters CIRCULAR = new VelocityParameters(3.2145, 2460100.3812, 0.0, 90.0, 78.0,
            96.5, -14.2, new double[] {0.0, 2.3}, 0.0, 0.0);

    private static VelocityParameters wrongStart(VelocityParameters truth) {
        return new VelocityParameters(truth.periodDays(), truth.epochDays(), truth.eccentricity() * 0.5,
                truth.omegaDeg() + 20, truth.k1Kms() * 0.8, truth.k2Kms() * 1.2, truth.gammaKms() + 5,
                new double[truth.instrumentCount()], 0.0, 0.0);
    }

    private static double spread(List<Double> pulls) {
        double mean = pulls.stream().mapToDouble(Double::doubleValue).average().orElseThrow();
        double ss = pulls.stream().mapToDouble(p -> (p - mean) * (p - mean)).sum();
        return Math.sqrt(ss / (pulls.size() - 1));
    }

    @Test
    void recoversK1K2GammaWithPullsOfUnitSpreadOverSeeds() {
        // Closed loop over 40 noise seeds, 30 epochs each, two instruments with an offset: the pulls
        // (fit − truth)/σ of K1, K2, γ and the offset pooled (160 values) must have a spread near 1;
        // the standard error of a spread of 160 normal values is 0.056, so [0.8, 1.2] is a ±3.5σ band.
        List<Double> pulls = new ArrayList<>();
        for (long seed = 1; seed <= 40; seed++) {
            VelocityData d = SyntheticVelocities.make(CIRCULAR, 30, 1.5, 2.5, 2, seed);
            VelocityFitResult r = VelocityFitter.fit(d, wrongStart(CIRCULAR),
                    VelocityFitSettings.defaults());
            pulls.add((r.estimate("k1").value() - CIRCULAR.k1Kms()) / r.estimate("k1").uncertainty());
            pulls.add((r.estimate("k2").value() - CIRCULAR.k2Kms()) / r.estimate("k2").uncertainty());
            pulls.add((r.estimate("gamma").value() - CIRCULAR.gammaKms()) / r.estimate("gamma").uncertainty());
            pulls.add((r.estimate("offset.spec1").value() - 2.3) / r.estimate("offset.spec1").uncertainty());
            assertThat(r.iterations()).isLessThan(50);
        }
        assertThat(spread(pulls)).isBetween(0.8, 1.2);
        assertThat(pulls.stream().mapToDouble(Double::doubleValue).average().orElseThrow()).isCloseTo(0, within(0.3));
    }

    @Test
    void eccentricOrbitWithFreeEAndOmegaOverSeeds() {
        // e = 0.25, ω = 140°: fitted as e cos ω, e sin ω from a start at half e and ω + 20°; 20 seeds,
        // pulls of K1, K2, e and ω pooled (80 values, standard error of the spread 0.08: band ±3σ).
        VelocityParameters truth = new VelocityParameters(5.71, 2460200.0, 0.25, 140.0, 55.0, 70.0, 3.0,
                new double[] {0.0}, 0.0, 0.0);
        List<Double> pulls = new ArrayList<>();
        for (long seed = 100; seed < 120; seed++) {
            VelocityData d = SyntheticVelocities.make(truth, 40, 1.0, 1.5, 1, seed);
            VelocityFitResult r = VelocityFitter.fit(d, wrongStart(truth),
                    new VelocityFitSettings(Set.of("eccentricity", "omega"), 0, false, 200));
            pulls.add((r.estimate("k1").value() - 55.0) / r.estimate("k1").uncertainty());
            pulls.add((r.estimate("k2").value() - 70.0) / r.estimate("k2").uncertainty());
            pulls.add((r.estimate("eccentricity").value() - 0.25) / r.estimate("eccentricity").uncertainty());
            pulls.add((r.estimate("omega").value() - 140.0) / r.estimate("omega").uncertainty());
        }
        assertThat(spread(pulls)).isBetween(0.75, 1.25);
    }

    @Test
    void eachStarGetsItsOwnJitter() {
        // errors of 0.5 km/s stated for both, true scatter 1 and 3 km/s: the jitters must come out near
        // √(1² − 0.5²) = 0.87 and √(3² − 0.5²) = 2.96 (the added variance), each to about s/√(2N)
        VelocityData noisy = SyntheticVelocities.make(CIRCULAR, 80, 1.0, 3.0, 2, 9);
        VelocityData stated = withErrors(noisy, 0.5);
        VelocityFitResult r = VelocityFitter.fit(stated, CIRCULAR, new VelocityFitSettings(Set.of(), 0, true, 200));
        assertThat(r.reducedChi2()).isCloseTo(1.0, within(0.01));
        assertThat(r.best().jitter1Kms()).isCloseTo(Math.sqrt(1 - 0.25), within(0.3));
        assertThat(r.best().jitter2Kms()).isCloseTo(Math.sqrt(9 - 0.25), within(0.8));
    }

    @Test
    void noSecondStarIsBadInputNamingTheColumn() {
        VelocityData d = SyntheticVelocities.make(CIRCULAR, 20, 1, 1, 2, 3);
        VelocityData single = new VelocityData("rv.csv", TimeScale.UNKNOWN, d.star1(), StarVelocities.empty(true),
                d.instruments(), Map.of(), List.of());
        assertThatThrownBy(() -> VelocityFitter.fit(single, CIRCULAR, VelocityFitSettings.defaults()))
                .isInstanceOf(BadInputException.class).hasMessageContaining("rv.csv").hasMessageContaining("v2");
    }

    private static VelocityData withErrors(VelocityData d, double sigma) {
        StarVelocities[] s = new StarVelocities[2];
        for (int n = 1; n <= 2; n++) {
            StarVelocities x = d.star(n);
            double[] e = new double[x.size()];
            java.util.Arrays.fill(e, sigma);
            s[n - 1] = new StarVelocities(x.timesDays(), x.velocitiesKms(), e, x.instruments(), x.rowNumbers());
        }
        return new VelocityData(d.source(), d.timeScale(), s[0], s[1], d.instruments(), d.rejected(), d.notes());
    }
}
