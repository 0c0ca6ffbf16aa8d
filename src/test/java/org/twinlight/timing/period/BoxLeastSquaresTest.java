package org.twinlight.timing.period;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.Random;
import org.apache.commons.math3.stat.regression.SimpleRegression;
import org.junit.jupiter.api.Test;
import org.twinlight.photometry.LightCurve;

class BoxLeastSquaresTest {

    /**
     * KZM 2002 (A&A 391, 369, Eqs. 4–6): with equal weights, N·SR² is the drop in the sum of squared
     * residuals when a two-level box replaces a constant, i.e. the regression sum of squares of the
     * flux on the in-box indicator. Commons Math's least-squares regression gives it independently.
     */
    @Test
    void signalResidueEqualsTheVarianceExplainedByATwoLevelBox() {
        SyntheticEclipsingCurve sys = SyntheticEclipsingCurve.circular(1.7, 0.05, 0.02, 0.06);
        // Jittered times, so that no point sits exactly on a box edge (where rounding would decide).
        Random rnd = new Random(7);
        double[] t = new double[1200];
        double[] f = new double[t.length];
        for (int i = 0; i < t.length; i++) {
            t[i] = i * 0.01 + 0.004 * rnd.nextDouble();
            f[i] = sys.flux(t[i]) + 0.003 * rnd.nextGaussian();
        }
        BoxLeastSquares bls = new BoxLeastSquares(t, f, null, PeriodSearchSettings.DEFAULT_DURATIONS);
        for (double trial : new double[] {1.7, 0.85, 1.234}) {
            BoxLeastSquares.Box box = bls.bestBox(1 / trial, 0.01);
            SimpleRegression reg = new SimpleRegression();
            for (int i = 0; i < t.length; i++) {
                // In the box: the time lies within half a box duration of a box centre, counted in days
                // from the nearest centre t_c + k·P (written out here, not taken from the production code).
                double centre = bls.referenceTimeDays() + box.centrePhase() * trial;
                double k = Math.rint((t[i] - centre) / trial);
                boolean in = Math.abs(t[i] - (centre + k * trial)) < 0.5 * box.durationFraction() * trial;
                reg.addData(in ? 1 : 0, f[i]);
            }
            double expected = reg.getRegressionSumSquares() / t.length;
            assertThat(box.signalResidue() * box.signalResidue()).isCloseTo(expected, within(1e-3 * expected));
            // The depth is minus the fitted slope: the in-box level below the out-of-box level.
            assertThat(box.depth()).isCloseTo(-reg.getSlope(), within(1e-3 * Math.abs(reg.getSlope())));
        }
    }

    /** The segmented fold must reproduce the direct fold's periodogram (both are the same statistic). */
    @Test
    void segmentedPeriodogramMatchesFoldingEveryPoint() {
        SyntheticEclipsingCurve sys = SyntheticEclipsingCurve.circular(2.2, 0.02, 0.005, 0.05);
        LightCurve lc = sys.sample(0, 20, 5.0 / 1440, 0.004, 3, false);
        double[] t = lc.timesDays();
        BoxLeastSquares bls = new BoxLeastSquares(t, lc.fluxes(), null, PeriodSearchSettings.DEFAULT_DURATIONS);
        FrequencyGrid grid = FrequencyGrid.build(20, 5.0 / 1440, 0.5, 10, 0.01, 2);
        double[] power = bls.power(grid, 20, false);
        int best = 0;
        for (int k = 0; k < power.length; k++) {
            if (power[k] > power[best]) {
                best = k;
            }
        }
        assertThat(1 / grid.frequency(best)).isCloseTo(2.2, within(0.01));
        // Work split over cores changes nothing: every frequency is computed the same way.
        assertThat(bls.power(grid, 20, true)).containsExactly(power);
        double peak = power[best];
        for (int k = 0; k < power.length; k += 37) {
            double f = grid.frequency(k);
            double direct = bls.bestBox(f, grid.effectiveShortestDuration(f)).signalResidue();
            assertThat(power[k]).isCloseTo(direct, within(0.05 * peak));
        }
    }

    /** The grid rule: step = q_eff/(k·T), q_eff = max(q_min, min(0.05, resolution·f)). */
    @Test
    void frequencyStepFollowsTheDocumentedRule() {
        double baseline = 30;
        double cadence = 0.02;
        FrequencyGrid g = FrequencyGrid.build(baseline, cadence, 0.25, 15, 0.01, 2);
        assertThat(g.frequency(0)).isCloseTo(1 / 15.0, within(1e-12));
        assertThat(g.frequency(g.size() - 1)).isLessThanOrEqualTo(4.0);
        for (int k = 0; k + 1 < g.size(); k += 101) {
            double f = g.frequency(k);
            double step = Math.max(0.01, Math.min(0.05, cadence * f)) / (2 * baseline);
            assertThat(g.frequency(k + 1) - f).isCloseTo(step, within(1e-12));
        }
    }

    /** Errors enter as weights σ⁻²: a point with a huge error must not make a box. */
    @Test
    void pointsWithLargeErrorsCarryLittleWeight() {
        int n = 2000;
        double[] t = new double[n];
        double[] f = new double[n];
        double[] e = new double[n];
        Random rnd = new Random(5);
        for (int i = 0; i < n; i++) {
            t[i] = i * 0.01;
            boolean bad = ((t[i] / 1.3) % 1) < 0.03;
            f[i] = 1 + 0.001 * rnd.nextGaussian() - (bad ? 0.05 : 0);
            e[i] = bad ? 10 : 0.001;
        }
        double weighted = new BoxLeastSquares(t, f, e, PeriodSearchSettings.DEFAULT_DURATIONS)
                .bestBox(1 / 1.3, 0.01).signalResidue();
        double unweighted = new BoxLeastSquares(t, f, null, PeriodSearchSettings.DEFAULT_DURATIONS)
                .bestBox(1 / 1.3, 0.01).signalResidue();
        assertThat(weighted).isLessThan(0.1 * unweighted);
    }
}
