package org.twinlight.timing.period;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.Random;
import org.apache.commons.math3.stat.descriptive.moment.Variance;
import org.junit.jupiter.api.Test;
import org.twinlight.photometry.LightCurve;

class PhaseDispersionTest {

    /**
     * Stellingwerf 1978 (ApJ 224, 953), Θ = s²/σ² with the pooled bin variance s² = Σ(n_j−1)s_j²/(Σn_j − M):
     * recomputed here with Commons Math's unbiased variance per bin (one cover).
     */
    @Test
    void thetaIsThePooledBinVarianceOverTheTotalVariance() {
        Random rnd = new Random(11);
        int n = 500;
        double[] t = new double[n];
        double[] x = new double[n];
        for (int i = 0; i < n; i++) {
            t[i] = i * 0.037 + 0.01 * rnd.nextDouble();
            x[i] = Math.sin(2 * Math.PI * t[i] / 1.9) + 0.3 * rnd.nextGaussian();
        }
        double period = 1.9;
        int bins = 10;
        // Both covers: the grid as is and shifted by half a bin.
        double pooled = 0;
        int dof = 0;
        for (int cover = 0; cover < PhaseDispersion.COVERS; cover++) {
            for (int b = 0; b < bins; b++) {
                java.util.List<Double> in = new java.util.ArrayList<>();
                for (int i = 0; i < n; i++) {
                    double ph = (t[i] - t[0]) / period + (double) cover / (PhaseDispersion.COVERS * bins);
                    ph -= Math.floor(ph);
                    if ((int) (ph * bins) == b) {
                        in.add(x[i]);
                    }
                }
                if (in.size() > 1) {
                    double v = new Variance(true).evaluate(in.stream().mapToDouble(Double::doubleValue).toArray());
                    pooled += (in.size() - 1) * v;
                    dof += in.size() - 1;
                }
            }
        }
        double expected = pooled / dof / new Variance(true).evaluate(x);
        assertThat(new PhaseDispersion(t, x).theta(period, bins).theta()).isCloseTo(expected, within(1e-9));
    }

    /** For white noise no period is special: Θ averages 1 over seeds (Stellingwerf 1978, Sect. II). */
    @Test
    void noiseGivesThetaNearOne() {
        double sum = 0;
        int seeds = 20;
        for (int seed = 0; seed < seeds; seed++) {
            Random rnd = new Random(seed);
            double[] t = new double[1000];
            double[] x = new double[1000];
            for (int i = 0; i < t.length; i++) {
                t[i] = i * 0.02;
                x[i] = rnd.nextGaussian();
            }
            sum += new PhaseDispersion(t, x).theta(1.37, 20).theta();
        }
        assertThat(sum / seeds).isCloseTo(1.0, within(0.03));
    }

    /** Scanning Θ around a synthetic binary finds its minimum at the true period, over seeds. */
    @Test
    void minimumOfThetaIsAtTheTruePeriod() {
        SyntheticEclipsingCurve sys = SyntheticEclipsingCurve.circular(1.6180, 0.08, 0.03, 0.06);
        for (long seed = 1; seed <= 5; seed++) {
            LightCurve lc = sys.sample(0, 15, 10.0 / 1440, 0.004, seed, false);
            PhaseDispersion pdm = new PhaseDispersion(lc.timesDays(), lc.fluxes());
            double binDays = 0.2 * 0.06 * 1.618 / 2;
            double bestP = 0;
            double bestTheta = Double.POSITIVE_INFINITY;
            // 0.6P to 1.6P: excludes the half period (P/2 folds the two unequal eclipses together,
            // worse) and the double period (also a minimum, as every multiple of P is).
            for (double p = 0.6 * 1.618; p < 1.6 * 1.618; p += 0.0004) {
                double th = pdm.thetaWithBinWidth(p, binDays).theta();
                if (th < bestTheta) {
                    bestTheta = th;
                    bestP = p;
                }
            }
            assertThat(bestP).isCloseTo(1.618, within(0.002));
            assertThat(bestTheta).isLessThan(0.5);
            assertThat(pdm.thetaWithBinWidth(1.618 / 2, binDays).theta()).isGreaterThan(bestTheta + 0.1);
        }
    }
}
