package org.twinlight.fit;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.twinlight.fit.CalibrationRuns.Geometry;
import org.twinlight.fit.CalibrationRuns.Noise;
import org.twinlight.fit.CalibrationRuns.Outcome;

/**
 * Are the errors the fit tells the user to quote calibrated? Synthetic nights of a known system
 * (total and partial eclipses) with white noise and with 2000 ppm noise correlated over 30 min;
 * the ±1σ and ±1.96σ intervals must hold the truth about 68 % and 95 % of the time (a Gaussian's
 * central intervals). The large version is {@code bench.CalibrationBench} (figures in
 * docs/uncertainties.md).
 *
 * <p>Bounds: binomial, 3σ either side (σ = √(p(1−p)/n)). The five parameters of one light curve
 * are correlated, so n is taken as twice the number of curves rather than five times (common
 * practice, no source): loose, but the covariance errors alone fail them under correlated noise
 * (checked below, so the test can fail).
 */
class NoiseCalibrationTest {

    private static List<Outcome> runs(Geometry g, Noise noise, long firstSeed, int seeds) {
        List<Outcome> out = new ArrayList<>();
        for (long seed = firstSeed; seed < firstSeed + seeds; seed++) {
            out.add(CalibrationRuns.run(g, noise, seed, NoiseDiagnostics.MAX_SHIFTS));
        }
        return out;
    }

    private static List<Double> all(List<Outcome> runs, boolean quoted) {
        return CalibrationRuns.byParameter(runs, quoted).values().stream().flatMap(List::stream).toList();
    }

    private static double[] band(double p, int curves) {
        double sigma = Math.sqrt(p * (1 - p) / (2.0 * curves));
        return new double[] {p - 3 * sigma, Math.min(1, p + 3 * sigma)};
    }

    @Test
    void quotedErrorsCoverTheTruthUnderCorrelatedNoise() {
        List<Outcome> red = new ArrayList<>(runs(Geometry.PARTIAL, Noise.RED, 9101, 8));
        red.addAll(runs(Geometry.TOTAL, Noise.RED, 9201, 5));
        int curves = red.size();
        double[] in68 = band(0.6827, curves);
        double[] in95 = band(0.9545, curves);
        List<Double> quoted = all(red, true);
        assertThat(CalibrationRuns.coverage(quoted, 1.0)).as("68 %% coverage of the quoted errors")
                .isBetween(in68[0], in68[1]);
        assertThat(CalibrationRuns.coverage(quoted, 1.959964)).as("95 %% coverage of the quoted errors")
                .isBetween(in95[0], in95[1]);
        // the covariance errors alone (scaled by χ²ν) are far too small here: the test has teeth
        assertThat(CalibrationRuns.coverage(all(red, false), 1.959964)).as("95 %% coverage of the covariance errors")
                .isLessThan(in95[0]);
        // correlated noise is seen: β well above 1 in most curves (the bench's median is about 2.5)
        assertThat(red.stream().filter(o -> o.beta() > 1.5).count()).isGreaterThanOrEqualTo(curves - 2);
    }

    @Test
    void whiteNoiseLeavesTheErrorsAlone() {
        List<Outcome> white = runs(Geometry.PARTIAL, Noise.WHITE, 9301, 5);
        double[] in68 = band(0.6827, white.size());
        double[] in95 = band(0.9545, white.size());
        List<Double> quoted = all(white, true);
        assertThat(CalibrationRuns.coverage(quoted, 1.0)).isBetween(in68[0], in68[1]);
        assertThat(CalibrationRuns.coverage(quoted, 1.959964)).isBetween(in95[0], in95[1]);
        for (Outcome o : white) {
            // white noise: β = 1 up to the upward pull of taking the largest of several noisy β_w
            assertThat(o.beta()).isBetween(0.8, 1.45);
            for (Map.Entry<String, Double> e : o.covarianceSigma().entrySet()) {
                double ratio = o.noise().quoted(e.getKey(), e.getValue()) / e.getValue();
                // the quoted error stays within a factor 1.6 of the covariance error (common practice, no source)
                assertThat(ratio).as(e.getKey()).isBetween(1.0, 1.6);
            }
        }
    }
}
