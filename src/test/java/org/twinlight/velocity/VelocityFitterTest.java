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

    /** The orbit of the small-set tests: K1 = 30, K2 = 40 km/s, one instrument. */
    private static final VelocityParameters SMALL_SET = new VelocityParameters(3.418276, 2460412.63415, 0.0, 90.0,
            30.0, 40.0, -12.0, new double[] {0.0}, 0.0, 0.0);

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

    @Test
    void smallSetsGiveKPullsOfUnitSpreadOverSeeds() {
        // 300 noise seeds of 4 to 6 epochs (8 to 12 velocities, K1, K2, γ free: ν = 5 to 9), the
        // errors stated as the true noise. Scaling by χ²/ν both ways made the pulls of K1, K2 spread
        // 1.19 with 9 % beyond 2σ here; with max(1, χ²/ν) the errors are those of the stated noise
        // unless the scatter exceeds it, so the spread must be near 1, a little below (scaling up on
        // chance χ²/ν > 1 only widens). 600 pulls: standard error of the spread 0.03, so [0.85, 1.08]
        // keeps ±2.5σ around the 0.94 expected (independent Monte Carlo of √E[z²/max(1, χ²_ν/ν)] for
        // ν = 5..9, z normal and χ²_ν independent as in linear least squares: 0.934-0.943; scaling
        // both ways gives 1.13-1.29) and fails on the old rule. Beyond 2σ the same Monte Carlo gives
        // 3.5 % (binomial σ 0.75 % over 600), the old rule 7.7-10 %: the bound is 6 %.
        VelocityParameters truth = SMALL_SET;
        List<Double> pulls = new ArrayList<>();
        for (long seed = 1; seed <= 300; seed++) {
            int epochs = 4 + (int) (seed % 3);
            VelocityData d = SyntheticVelocities.make(truth, epochs, 5.0, 5.0, 1, 1.0, 1000 + seed);
            VelocityFitResult r = VelocityFitter.fit(d, wrongStart(truth), VelocityFitSettings.defaults());
            pulls.add((r.estimate("k1").value() - truth.k1Kms()) / r.estimate("k1").uncertainty());
            pulls.add((r.estimate("k2").value() - truth.k2Kms()) / r.estimate("k2").uncertainty());
        }
        double beyond2 = pulls.stream().filter(p -> Math.abs(p) > 2).count() / (double) pulls.size();
        assertThat(spread(pulls)).isBetween(0.85, 1.08);
        assertThat(beyond2).isLessThan(0.06);
    }

    @Test
    void overstatedErrorsAreNotScaledDown() {
        // errors stated twice the true noise on 5 epochs: χ²/ν near 0.25. The K errors must be the
        // unscaled ones of weighted linear least squares (K1, K2, γ are linear once the orbit is
        // fixed: v1 = γ + K1 s, v2 = γ − K2 s with s = cos(ν+ω) = −sin(2π(t − T0)/P) for a circular
        // orbit with the epoch at primary conjunction, ν + ω = 90°; Hilditch 2001, An Introduction to
        // Close Binary Stars, eq. 2.45 and §3.1), computed here with Commons Math.
        VelocityData d = SyntheticVelocities.make(SMALL_SET, 5, 5.0, 5.0, 1, 2.0, 77);
        VelocityFitResult r = VelocityFitter.fit(d, wrongStart(SMALL_SET), VelocityFitSettings.defaults());
        assertThat(r.reducedChi2()).isLessThan(0.6);
        double[][] cov = linearCovariance(d, SMALL_SET);
        assertErrorIs(r, "k1", cov[0][0]);
        assertErrorIs(r, "k2", cov[1][1]);
        assertThat(r.notes()).anyMatch(n -> n.contains("not scaled down"));
        assertThat(r.notes()).anyMatch(n -> n.contains("degrees of freedom"));
        // with the jitter fitted it stays 0 and the note says so
        VelocityFitResult j = VelocityFitter.fit(d, wrongStart(SMALL_SET), new VelocityFitSettings(Set.of(), 0, true,
                200));
        assertThat(j.best().jitter1Kms()).isZero();
        assertErrorIs(j, "k1", cov[0][0]);
        assertThat(j.notes()).anyMatch(n -> n.contains("jitter fitted as 0"));
    }

    @Test
    void underestimatedErrorsAreScaledUp() {
        // errors stated at a quarter of the noise: the K errors must be the linear ones times √(χ²/ν)
        VelocityData d = SyntheticVelocities.make(SMALL_SET, 12, 2.0, 2.0, 1, 0.25, 78);
        VelocityFitResult r = VelocityFitter.fit(d, wrongStart(SMALL_SET), VelocityFitSettings.defaults());
        assertThat(r.reducedChi2()).isGreaterThan(4);
        assertErrorIs(r, "k1", linearCovariance(d, SMALL_SET)[0][0] * r.reducedChi2());
    }

    @Test
    void swappedStarsOrEpochHalfAPeriodOffAreBadInputSayingWhatToTry() {
        VelocityData d = SyntheticVelocities.make(CIRCULAR, 30, 1.5, 2.5, 2, 5);
        VelocityData swapped = new VelocityData("rv.csv", d.timeScale(), d.star2(), d.star1(), d.instruments(),
                d.rejected(), d.notes());
        assertThatThrownBy(() -> VelocityFitter.fit(swapped, wrongStart(CIRCULAR), VelocityFitSettings.defaults()))
                .isInstanceOf(BadInputException.class).hasMessageContaining("rv.csv")
                .hasMessageContaining("swapped").hasMessageContaining("half a period")
                .hasMessageContaining("--v1-column");
        VelocityParameters halfOff = new VelocityParameters(CIRCULAR.periodDays(),
                CIRCULAR.epochDays() + 0.5 * CIRCULAR.periodDays(), 0.0, 90.0, 70, 90, -10, new double[2], 0, 0);
        assertThatThrownBy(() -> VelocityFitter.fit(d, halfOff, VelocityFitSettings.defaults()))
                .isInstanceOf(BadInputException.class).hasMessageContaining("negative semi-amplitudes");
        // star 2's velocities given as star 1's too: the same star twice
        VelocityData twice = new VelocityData("rv.csv", d.timeScale(), d.star1(), d.star1(), d.instruments(),
                d.rejected(), d.notes());
        assertThatThrownBy(() -> VelocityFitter.fit(twice, CIRCULAR, VelocityFitSettings.defaults()))
                .isInstanceOf(BadInputException.class).hasMessageContaining("moves with the other");
    }

    @Test
    void aNegativeKConsistentWithZeroIsUndeterminedNotSwapped() {
        // 4 epochs with σ = K1/6: now and then the phases fall near conjunction and a K comes out
        // negative but within 3σ of 0. That must stop the work as undetermined (exit 1), never be
        // called swapped columns (exit 2), and every fit that is accepted has positive K.
        VelocityParameters truth = SMALL_SET;
        int undetermined = 0;
        for (long seed = 1; seed <= 2000; seed++) {
            VelocityData d = SyntheticVelocities.make(truth, 4, 5.0, 5.0, 1, 1.0, seed);
            VelocityParameters start = new VelocityParameters(truth.periodDays(), truth.epochDays(), 0.0, 90.0, 24.0,
                    48.0, -7.0, new double[1], 0.0, 0.0);
            try {
                VelocityFitResult r = VelocityFitter.fit(d, start, VelocityFitSettings.defaults());
                assertThat(r.best().k1Kms()).isPositive();
                assertThat(r.best().k2Kms()).isPositive();
            } catch (org.twinlight.WorkFailedException e) {
                assertThat(e.getMessage()).contains("do not determine").contains("within 3 sigma of 0");
                undetermined++;
            }
        }
        assertThat(undetermined).isBetween(1, 40);
    }

    /** The fit's error of {@code name} is √variance to 0.5 %. */
    private static void assertErrorIs(VelocityFitResult r, String name, double variance) {
        assertThat(r.estimate(name).uncertainty()).isCloseTo(Math.sqrt(variance), within(0.005 * Math.sqrt(variance)));
    }

    /** (AᵀWA)⁻¹ of the linear model in K1, K2, γ for a circular orbit with ω = 90°. */
    private static double[][] linearCovariance(VelocityData d, VelocityParameters orbit) {
        int n1 = d.star1().size();
        int n2 = d.star2().size();
        double[][] a = new double[n1 + n2][3];
        for (int n = 1; n <= 2; n++) {
            StarVelocities s = d.star(n);
            for (int i = 0; i < s.size(); i++) {
                double shape = -Math.sin(2 * Math.PI * (s.timesDays()[i] - orbit.epochDays()) / orbit.periodDays());
                double w = 1 / s.errorsKms()[i];
                double[] row = a[(n == 1 ? 0 : n1) + i];
                row[n - 1] = (n == 1 ? shape : -shape) * w;
                row[2] = w;
            }
        }
        org.apache.commons.math3.linear.RealMatrix m = new org.apache.commons.math3.linear.Array2DRowRealMatrix(a);
        return new org.apache.commons.math3.linear.LUDecomposition(m.transpose().multiply(m)).getSolver()
                .getInverse().getData();
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
