package org.twinlight.photometry;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Random;
import org.apache.commons.math3.distribution.NormalDistribution;
import org.junit.jupiter.api.Test;
import org.twinlight.time.TimeScale;

class LightCurveSummaryTest {

    private static final double CADENCE_DAYS = 2.0 / 1440;
    private static final double START = 2460000.3;

    /** Three nights of 100 points at a 2-minute cadence, one day apart, with 10 points missing in night 2. */
    private static double[] threeNights() {
        List<Double> t = new ArrayList<>();
        for (int night = 0; night < 3; night++) {
            for (int k = 0; k < 100; k++) {
                if (night == 1 && k >= 40 && k < 50) {
                    continue;
                }
                t.add(START + night + k * CADENCE_DAYS);
            }
        }
        return t.stream().mapToDouble(Double::doubleValue).toArray();
    }

    private static LightCurve curve(double[] t, double[] f) {
        return new LightCurve("synthetic", "V", TimeScale.BJD_TDB, ValueKind.FLUX, t, f, null,
                Map.of("quality flag set", 4));
    }

    private static double[] noise(int n, double sigma, long seed) {
        Random r = new Random(seed);
        double[] f = new double[n];
        for (int i = 0; i < n; i++) {
            f[i] = 1.0 + sigma * r.nextGaussian();
        }
        return f;
    }

    @Test
    void segmentsSplitAtGapsLongerThanTheGap() {
        double[] t = threeNights();
        LightCurve lc = curve(t, new double[t.length]);
        assertThat(Segments.starts(lc, 0.5)).containsExactly(0, 100, 190);
        List<LightCurve> parts = Segments.split(lc, Segments.DEFAULT_GAP_DAYS);
        assertThat(parts).extracting(LightCurve::size).containsExactly(100, 90, 100);
        assertThat(parts.get(1).startDays()).isEqualTo(START + 1);
        // The 11-cadence hole in night 2 (22 min) splits it only with a gap shorter than the hole.
        assertThat(Segments.starts(lc, 20.0 / 1440)).hasSize(4);
        // One whole day between the nights, minus the 99 cadences of a night: not longer than itself.
        assertThat(Segments.starts(lc, 1.0)).containsExactly(0);
        assertThatThrownBy(() -> Segments.starts(lc, 0)).isInstanceOf(IllegalArgumentException.class);
    }

    @Test
    void summaryReportsSpanCadenceGapsAndSegments() {
        double[] t = threeNights();
        LightCurveSummary s = LightCurveSummary.of(curve(t, noise(t.length, 1e-3, 1)), 0.5);
        assertThat(s.points()).isEqualTo(290);
        assertThat(s.spanDays()).isCloseTo(2 + 99 * CADENCE_DAYS, within(1e-8));
        assertThat(s.medianCadenceDays()).isCloseTo(CADENCE_DAYS, within(1e-8));
        // Two nights' breaks and the hole in night 2 are longer than 5 cadences.
        assertThat(s.gapCount()).isEqualTo(3);
        assertThat(s.largestIntervalDays()).isCloseTo(1 - 99 * CADENCE_DAYS, within(1e-8));
        assertThat(s.segments()).extracting(LightCurveSummary.Segment::points).containsExactly(100, 90, 100);
        assertThat(s.segments().get(2).startDays()).isEqualTo(START + 2);
        assertThat(s.rejectedRows()).containsEntry("quality flag set", 4);
        assertThat(s.rejectedCount()).isEqualTo(4);
        assertThat(s.band()).isEqualTo("V");
        assertThat(s.timeScale()).isEqualTo(TimeScale.BJD_TDB);
        assertThat(s.hasErrors()).isFalse();
        assertThat(s.medianErrorFlux()).isNaN();
    }

    @Test
    void outliersAreFoundAndScatterIsRobustOverManySeeds() {
        double[] t = threeNights();
        double sigma = 1e-3;
        int[] spikes = {17, 150, 260};
        // With a 5-sigma cut the chance that Gaussian noise alone crosses it is tiny: check it with
        // Commons Math so that the exact count below is a fair expectation.
        // (2 light curves per seed).
        int seeds = 40;
        double tail = 2 * new NormalDistribution().cumulativeProbability(-LightCurveSummary.OUTLIER_SIGMAS);
        assertThat(tail * t.length * seeds * 2).isLessThan(0.05);
        double sumRatio = 0;
        for (long seed = 1; seed <= seeds; seed++) {
            double[] f = noise(t.length, sigma, seed);
            LightCurveSummary clean = LightCurveSummary.of(curve(t, f.clone()), 0.5);
            for (int i : spikes) {
                f[i] += 30 * sigma;
            }
            LightCurveSummary spiked = LightCurveSummary.of(curve(t, f), 0.5);
            assertThat(spiked.outlierCount()).as("seed %d", seed).isEqualTo(spikes.length);
            assertThat(clean.outlierCount()).as("seed %d", seed).isZero();
            // Three spikes barely move a MAD-based scatter (breakdown point 50 %, Rousseeuw & Croux 1993).
            assertThat(spiked.scatterFlux()).isCloseTo(clean.scatterFlux(), within(0.05 * clean.scatterFlux()));
            sumRatio += clean.scatterFlux() / sigma;
        }
        // The scaled residuals make 1.4826 MAD an estimate of the noise sigma itself: the mean over the
        // seeds is within 3 % of it (the large-sample median variance used for the scaling is ~1 % off
        // for ten neighbours).
        assertThat(sumRatio / seeds).isCloseTo(1.0, within(0.03));
    }

    @Test
    void fluxRangeAndMedian() {
        LightCurveSummary s = LightCurveSummary.of(new LightCurve("x", null, TimeScale.UNKNOWN, ValueKind.MAGNITUDE,
                new double[] {1, 2, 3, 4}, new double[] {0.5, 2.0, 1.0, 1.5}, new double[] {0.1, 0.3, 0.2, 0.4},
                null), 0.5);
        assertThat(s.minFlux()).isEqualTo(0.5);
        assertThat(s.maxFlux()).isEqualTo(2.0);
        assertThat(s.medianFlux()).isEqualTo(1.25);
        assertThat(s.medianErrorFlux()).isCloseTo(0.25, within(1e-15));
        assertThat(s.segments()).hasSize(4);
        assertThat(s.valueKind()).isEqualTo(ValueKind.MAGNITUDE);
    }

    @Test
    void onePointHasNoCadence() {
        LightCurveSummary s = LightCurveSummary.of(curve(new double[] {5}, new double[] {1}), 0.5);
        assertThat(s.medianCadenceDays()).isNaN();
        assertThat(s.gapCount()).isZero();
        assertThat(s.spanDays()).isZero();
        assertThat(s.segments()).hasSize(1);
        assertThat(s.outlierCount()).isZero();
    }

    @Test
    void eclipseBranchesAreNotOutliersButSpikesAre() {
        // regression: the first and last points of steep eclipse branches (2-minute cadence, 450 ppm
        // noise, 40 % deep eclipses) were once counted as 5σ outliers. A smooth trapezoid eclipse
        // (invented demo shape) with white noise, then five 12σ spikes injected.
        Random rng = new Random(17);
        int n = 9000;
        double[] t = new double[n];
        double[] f = new double[n];
        double sigma = 450e-6;
        for (int i = 0; i < n; i++) {
            t[i] = 2460000 + i * 2.0 / 1440;
            double phase = ((t[i] - 2460000.3) / 1.7) % 1.0;
            double x = Math.min(Math.abs(phase), Math.abs(phase - 0.5)); // primary and secondary
            double depth = Math.abs(phase) < 0.25 ? 0.42 : 0.28;
            double dip = x < 0.005 ? depth : x < 0.03 ? depth * (0.03 - x) / 0.025 : 0;
            f[i] = 1 - dip + sigma * rng.nextGaussian();
        }
        LightCurve clean = new LightCurve("trapezoids", null, TimeScale.UNKNOWN, ValueKind.FLUX, t, f, null, Map.of());
        assertThat(LightCurveSummary.of(clean, 0.5).outlierCount()).isZero();
        for (int k : new int[] {500, 2100, 4000, 6100, 8000}) {
            f[k] += (k % 2 == 0 ? 12 : -12) * sigma;
        }
        LightCurve spiky = new LightCurve("spikes", null, TimeScale.UNKNOWN, ValueKind.FLUX, t, f, null, Map.of());
        assertThat(LightCurveSummary.of(spiky, 0.5).outlierCount()).isEqualTo(5);
    }
}
