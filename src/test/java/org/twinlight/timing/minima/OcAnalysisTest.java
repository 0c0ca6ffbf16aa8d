package org.twinlight.timing.minima;

import org.twinlight.timing.Ephemeris;
import org.twinlight.timing.MinimumType;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import java.util.function.DoubleUnaryOperator;
import org.junit.jupiter.api.Test;
import org.twinlight.BadInputException;

class OcAnalysisTest {

    private static final Ephemeris REFERENCE = new Ephemeris(2455000.1234, 3.2145678);

    /** T₀ + P·E of the reference, written out here rather than taken from the code under test. */
    private static double calculated(double cycle) {
        return 2455000.1234 + 3.2145678 * cycle;
    }

    /** Primary timings at cycles 0, step, 2·step, … with O−C = model(E) + noise, made in the test. */
    private static List<MinimumTime> timings(int n, int step, double sigmaDays, DoubleUnaryOperator model,
            Random random) {
        List<MinimumTime> list = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            double e = i * step;
            double t = calculated(e) + model.applyAsDouble(e)
                    + (random == null ? 0 : sigmaDays * random.nextGaussian());
            list.add(MinimumTime.of(e, MinimumType.PRIMARY, t, sigmaDays, MinimumMethod.TEMPLATE));
        }
        return list;
    }

    private static double spread(List<Double> v) {
        double mean = v.stream().mapToDouble(Double::doubleValue).average().orElseThrow();
        return Math.sqrt(v.stream().mapToDouble(d -> (d - mean) * (d - mean)).sum() / (v.size() - 1));
    }

    /**
     * Deeg 2015 (arXiv:1503.05368, abstract): for N equally spaced timings of error σ_T the
     * period error is σ_T·(12/(N³ − N))^½. Their example, recomputed:
     * σ_T = 30 s, N = 100 gives σ_P = 0.10393 s.
     */
    @Test
    void linearPeriodErrorFollowsDeeg2015() {
        double sigmaT = 30.0 / 86400;
        OcResult r = OcAnalysis.analyse(timings(100, 1, sigmaT, e -> 0, null), REFERENCE, false);
        EphemerisParameter period = r.linear().parameter("period").orElseThrow();
        assertThat(period.value()).isCloseTo(REFERENCE.periodDays(), within(1e-12));
        assertThat(period.uncertainty() * 86400).isCloseTo(0.10393, within(0.00001));
        for (int n : new int[] {5, 17, 40}) {
            OcResult rn = OcAnalysis.analyse(timings(n, 1, sigmaT, e -> 0, null), REFERENCE, false);
            double expected = sigmaT * Math.sqrt(12.0 / ((double) n * n * n - n));
            assertThat(rn.linear().parameter("period").orElseThrow().uncertainty())
                    .isCloseTo(expected, within(1e-9 * expected));
        }
    }

    /**
     * The epoch–period covariance of a straight-line fit with equal errors σ at cycles E_i:
     * cov(T₀, P) = −σ² ΣE / (n ΣE² − (ΣE)²) (Press et al. 2007, Numerical Recipes 3rd ed., §15.2,
     * eq. 15.2.9 and the covariance below it). Predictions many cycles ahead need it.
     */
    @Test
    void epochPeriodCovarianceFollowsTheStraightLineClosedForm() {
        double sigmaT = 30.0 / 86400;
        int n = 25;
        int step = 3;
        OcResult r = OcAnalysis.analyse(timings(n, step, sigmaT, e -> 0, null), REFERENCE, false);
        double sumE = 0;
        double sumE2 = 0;
        for (int i = 0; i < n; i++) {
            sumE += i * step;
            sumE2 += (double) i * step * i * step;
        }
        double expected = -sigmaT * sigmaT * sumE / (n * sumE2 - sumE * sumE);
        assertThat(r.linear().epochPeriodCovarianceDays2()).isCloseTo(expected, within(1e-9 * Math.abs(expected)));
    }

    /** The period error is honest: pulls of the fitted period over many seeds have unit spread. */
    @Test
    void linearPeriodPullsHaveUnitSpread() {
        List<Double> pulls = new ArrayList<>();
        for (long seed = 0; seed < 300; seed++) {
            OcResult r = OcAnalysis.analyse(timings(30, 3, 0.0004, e -> 0, new Random(seed)), REFERENCE, false);
            EphemerisParameter p = r.linear().parameter("period").orElseThrow();
            // The reported error is widened when χ²/ν > 1, so use the formal one for the pull.
            pulls.add((p.value() - REFERENCE.periodDays()) / (p.uncertainty() / r.linear().errorScale()));
        }
        assertThat(spread(pulls)).isBetween(0.85, 1.15);
    }

    /** A quadratic ephemeris T = T₀ + P·E + Q·E² has dP/dE = 2Q; an injected Q is recovered. */
    @Test
    void quadraticEphemerisRecoversInjectedPeriodChange() {
        double q = 2.0e-9;
        List<Double> pulls = new ArrayList<>();
        for (long seed = 0; seed < 100; seed++) {
            OcResult r = OcAnalysis.analyse(timings(60, 20, 0.0003, e -> q * e * e, new Random(seed)), REFERENCE,
                    false);
            EphemerisParameter dPdE = r.quadratic().parameter("dPdE").orElseThrow();
            pulls.add((dPdE.value() - 2 * q) / dPdE.uncertainty());
            if (seed == 0) {
                assertThat(r.preferred()).isEqualTo(EphemerisModel.QUADRATIC);
                assertThat(r.quadratic().parameter("dPdt").orElseThrow().value())
                        .isCloseTo(2 * q / REFERENCE.periodDays(), within(4 * dPdE.uncertainty() / REFERENCE.periodDays()));
            }
        }
        double mean = pulls.stream().mapToDouble(Double::doubleValue).average().orElseThrow();
        assertThat(mean).isCloseTo(0, within(0.3));
        assertThat(spread(pulls)).isBetween(0.8, 1.2);
    }

    /**
     * A light-time orbit (Irwin 1952, eq. 1, computed in the test by {@link IrwinDelay}) injected
     * into the timings is recovered within 4σ in all four elements, and preferred; without it, it
     * is not.
     */
    @Test
    void lightTimeOrbitIsRecoveredAndPreferredOnlyWhenPresent() {
        double tPeri = calculated(150);
        double sigma = 0.0006;
        for (long seed = 0; seed < 2; seed++) {
            List<MinimumTime> with = timings(120, 6, sigma,
                    e -> IrwinDelay.delay(calculated(e), 700.0, 0.004, 0.35, 60.0, tPeri), new Random(seed));
            OcResult r = OcAnalysis.analyse(with, REFERENCE, true);
            assertThat(r.preferred()).isEqualTo(EphemerisModel.LIGHT_TIME);
            EphemerisFit fit = r.lightTime();
            EphemerisParameter p3 = fit.parameter("lightTimePeriod").orElseThrow();
            EphemerisParameter k = fit.parameter("lightTimeAmplitude").orElseThrow();
            EphemerisParameter e = fit.parameter("eccentricity").orElseThrow();
            EphemerisParameter w = fit.parameter("omega").orElseThrow();
            assertThat(p3.value()).isCloseTo(700.0, within(4 * p3.uncertainty()));
            assertThat(k.value()).isCloseTo(0.004, within(4 * k.uncertainty()));
            assertThat(e.value()).isCloseTo(0.35, within(4 * e.uncertainty()));
            assertThat(w.value()).isCloseTo(60.0, within(4 * w.uncertainty()));
            assertThat(r.fits()).hasSize(3);

            List<MinimumTime> without = timings(120, 6, sigma, x -> 0, new Random(100 + seed));
            OcResult r0 = OcAnalysis.analyse(without, REFERENCE, true);
            assertThat(r0.preferred()).isNotEqualTo(EphemerisModel.LIGHT_TIME);
            assertThat(r0.lightTime().bic()).isGreaterThan(r0.linear().bic());
        }
    }

    /**
     * Apsidal motion moves primary and secondary minima in opposite directions; the series
     * difference recovers an injected trend, and the secondary offset is fitted in the ephemerides.
     */
    @Test
    void opposedPrimaryAndSecondaryDriftsShowInTheSeriesDifference() {
        Random random = new Random(7);
        double trend = 2e-6;
        List<MinimumTime> list = new ArrayList<>();
        for (int i = 0; i < 40; i++) {
            double e = 10 * i;
            double drift = trend * (e - 195) / 2;
            list.add(MinimumTime.of(e, MinimumType.PRIMARY, calculated(e) + drift + 2e-4 * random.nextGaussian(),
                    2e-4, MinimumMethod.TEMPLATE));
            list.add(MinimumTime.of(e + 0.5, MinimumType.SECONDARY,
                    calculated(e + 0.5) + 0.003 - drift + 2e-4 * random.nextGaussian(), 2e-4, MinimumMethod.TEMPLATE));
        }
        OcResult r = OcAnalysis.analyse(list, REFERENCE, false);
        OcSeriesDifference d = r.primaryMinusSecondary();
        assertThat(d.trendDaysPerCycle()).isCloseTo(trend, within(4 * d.trendErrorDaysPerCycle()));
        assertThat(d.meanDifferenceDays()).isCloseTo(-0.003, within(4 * d.meanDifferenceErrorDays()));
        EphemerisParameter offset = r.linear().parameter("secondaryOffset").orElseThrow();
        assertThat(offset.value()).isCloseTo(0.003, within(4 * offset.uncertainty()));
    }

    /**
     * Primaries from one season (cycles 0–39) and secondaries from another (cycles 300–339), the
     * secondaries 0.003 d late: fitting the offset would leave the period to the primaries alone,
     * so it is fixed at the measured 0.003 d with a note, and the period, now fixed by the whole
     * span, is recovered within 4σ with an error near the pooled-fit value σ_T·√(1/Σ(E − Ē)²)
     * (weighted least squares, e.g. Press et al., Numerical Recipes 3rd ed., eq. 15.2.9),
     * computed here.
     */
    @Test
    void secondaryOffsetIsFixedWhenSeasonsDoNotOverlap() {
        Random random = new Random(11);
        double sigma = 2e-4;
        List<MinimumTime> list = new ArrayList<>();
        double[] cycles = new double[80];
        for (int i = 0; i < 40; i++) {
            cycles[i] = i;
            cycles[40 + i] = 300.5 + i;
            list.add(MinimumTime.of(i, MinimumType.PRIMARY, calculated(i) + sigma * random.nextGaussian(), sigma,
                    MinimumMethod.TEMPLATE));
            list.add(MinimumTime.of(300.5 + i, MinimumType.SECONDARY,
                    calculated(300.5 + i) + 0.003 + sigma * random.nextGaussian(), sigma, MinimumMethod.TEMPLATE));
        }
        double mean = java.util.Arrays.stream(cycles).average().orElseThrow();
        double sxx = java.util.Arrays.stream(cycles).map(c -> (c - mean) * (c - mean)).sum();
        double pooledSigma = sigma / Math.sqrt(sxx);
        OcResult r = OcAnalysis.analyse(list, REFERENCE, false, 0.003, Double.NaN);
        EphemerisParameter period = r.linear().parameter("period").orElseThrow();
        assertThat(period.value()).isCloseTo(3.2145678, within(4 * period.uncertainty()));
        assertThat(period.uncertainty()).isCloseTo(pooledSigma, within(0.3 * pooledSigma));
        assertThat(r.linear().parameter("secondaryOffset").orElseThrow().value()).isEqualTo(0.003);
        assertThat(r.linear().parameter("secondaryOffset").orElseThrow().uncertainty()).isNaN();
        assertThat(r.modelNotes()).anyMatch(n -> n.contains("cannot be separated") && n.contains("4.32 min"));

        // Interleaved primaries and secondaries fit the offset themselves.
        List<MinimumTime> interleaved = new ArrayList<>();
        for (int i = 0; i < 20; i++) {
            interleaved.add(MinimumTime.of(i, MinimumType.PRIMARY, calculated(i) + sigma * random.nextGaussian(),
                    sigma, MinimumMethod.TEMPLATE));
            interleaved.add(MinimumTime.of(i + 0.5, MinimumType.SECONDARY,
                    calculated(i + 0.5) + 0.003 + sigma * random.nextGaussian(), sigma, MinimumMethod.TEMPLATE));
        }
        OcResult free = OcAnalysis.analyse(interleaved, REFERENCE, false, 0.0, Double.NaN);
        assertThat(free.modelNotes()).noneMatch(n -> n.contains("cannot be separated"));
        EphemerisParameter fitted = free.linear().parameter("secondaryOffset").orElseThrow();
        assertThat(fitted.value()).isCloseTo(0.003, within(4 * fitted.uncertainty()));
    }

    /**
     * Regression: a short ground run, primaries on the first nights and secondaries on the last, with
     * the folded-curve offset off by its resolution (−3.4 min where the truth is 0). Taken as exact it
     * made the period 5σ wrong. Now the offset's resolution reaches the period's error, and when the
     * folded curve places the secondary no better than the timings do, the offset is fitted instead
     * of fixed. The expected shift of the period, offset error / cycle separation, is written out here.
     */
    @Test
    void uncertainFixedOffsetNeverMakesAConfidentWrongPeriod() {
        double sigma = 15.0 / 86400;
        List<MinimumTime> list = new ArrayList<>();
        for (double c : new double[] {0, 1, 2}) {
            list.add(MinimumTime.of(c, MinimumType.PRIMARY, calculated(c), sigma, MinimumMethod.TEMPLATE));
        }
        for (double c : new double[] {6.5, 7.5}) {
            list.add(MinimumTime.of(c, MinimumType.SECONDARY, calculated(c), sigma, MinimumMethod.TEMPLATE));
        }
        // A coarse measurement (3.4 min): fixing it would be worse than fitting the offset, so it is fitted.
        double coarse = 3.4 / 1440;
        OcResult r = OcAnalysis.analyse(list, REFERENCE, false, -coarse, coarse);
        EphemerisParameter period = r.linear().parameter("period").orElseThrow();
        assertThat(r.modelNotes()).noneMatch(n -> n.contains("cannot be separated"));
        assertThat(period.value()).isCloseTo(3.2145678, within(1e-9));
        // A fine one (0.05 min, off by that much): fixed, and its resolution widens the period's error.
        double fine = 0.05 / 1440;
        OcResult f = OcAnalysis.analyse(list, REFERENCE, false, -fine, fine);
        EphemerisParameter fp = f.linear().parameter("period").orElseThrow();
        assertThat(f.modelNotes()).anyMatch(n -> n.contains("carried into the epoch and period errors"));
        // mean secondary cycle 7 − mean primary cycle 1 = 6 cycles
        double shift = fine / 6;
        assertThat(Math.abs(fp.value() - 3.2145678)).isCloseTo(shift, within(0.3 * shift));
        assertThat(Math.abs(fp.value() - 3.2145678)).isLessThan(2 * fp.uncertainty());
        assertThat(f.linear().parameter("secondaryOffset").orElseThrow().uncertainty()).isEqualTo(fine);
    }

    @Test
    void collidingCyclesAreRefusedNamingTheCycle() {
        double t1 = REFERENCE.timeOf(12) + 0.01;
        double t2 = REFERENCE.timeOf(12) - 0.02;
        List<MinimumTime> list = new ArrayList<>(timings(5, 1, 1e-4, e -> 0, null));
        for (double t : new double[] {t1, t2}) {
            double cycle = OcAnalysis.cycleOf(t, MinimumType.PRIMARY, REFERENCE, 0.5);
            list.add(MinimumTime.of(cycle, MinimumType.PRIMARY, t, 1e-4, MinimumMethod.KVW));
        }
        assertThatThrownBy(() -> OcAnalysis.analyse(list, REFERENCE, false))
                .isInstanceOf(BadInputException.class)
                .hasMessageContaining("cycle 12 (primary)")
                .hasMessageContaining("collide");
    }

    @Test
    void secondaryCycleIsHalfInteger() {
        double t = REFERENCE.timeOf(7.5) + 0.001;
        assertThat(OcAnalysis.cycleOf(t, MinimumType.SECONDARY, REFERENCE, 0.5)).isEqualTo(7.5);
        assertThat(OcAnalysis.cycleOf(REFERENCE.timeOf(-3) - 0.01, MinimumType.PRIMARY, REFERENCE, 0.5)).isEqualTo(-3);
    }

    @Test
    void nonPositivePeriodIsRefusedNamingTheValue() {
        assertThatThrownBy(() -> new Ephemeris(2455000.0, 0.0))
                .isInstanceOf(BadInputException.class).hasMessageContaining("period 0.0");
        assertThatThrownBy(() -> new Ephemeris(2455000.0, -1.25))
                .isInstanceOf(BadInputException.class).hasMessageContaining("period -1.25");
    }
}
