package org.twinlight.statistics;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.LUDecomposition;
import org.junit.jupiter.api.Test;

/** The shared covariance and error-scaling rule. */
class FitStatisticsTest {

    @Test
    void covarianceIsTheScaledInverseOfTheNormalMatrix() {
        // Independent: Commons Math's LU inverse (a general-purpose library).
        double[][] jac = {{1, 0.2, 0}, {0.3, 1, 0.1}, {0, 0.5, 2}, {1, 1, 1}, {0.2, -0.4, 0.7}};
        double[][] jtj = Covariance.normalMatrix(jac);
        double[][] ref = new LUDecomposition(new Array2DRowRealMatrix(jac).transpose()
                .multiply(new Array2DRowRealMatrix(jac))).getSolver().getInverse().scalarMultiply(2.5).getData();
        double[][] c = Covariance.fromNormalMatrix(jtj, 2.5);
        for (int a = 0; a < 3; a++) {
            for (int b = 0; b < 3; b++) {
                assertThat(c[a][b]).isCloseTo(ref[a][b], within(1e-12));
            }
        }
        double[][] corr = FitStatistics.correlation(c);
        assertThat(corr[1][1]).isEqualTo(1.0);
        assertThat(corr[0][1]).isCloseTo(c[0][1] / Math.sqrt(c[0][0] * c[1][1]), within(1e-15));
    }

    @Test
    void aSingularNormalMatrixNamesTheUndeterminedCombination() {
        // columns 0 and 2 always enter as their sum: only x0 + x2 is determined, x0 − x2 is not
        double[][] jac = {{1, 0.3, 1}, {2, -1, 2}, {0.5, 0.2, 0.5}, {1, 1, 1}};
        assertThatThrownBy(() -> Covariance.fromNormalMatrix(Covariance.normalMatrix(jac), 1))
                .isInstanceOfSatisfying(Covariance.Degenerate.class, d -> {
                    assertThat(d.involved()).containsExactly(0, 2);
                    assertThat(Math.abs(d.direction()[0] + d.direction()[2])).isLessThan(1e-8);
                });
    }

    @Test
    void errorsAreScaledByChi2NuWhenEstimatedAndNeverDownWhenStated() {
        assertThat(FitStatistics.varianceScale(50, 100, true)).isEqualTo(0.5);
        assertThat(FitStatistics.varianceScale(50, 100, false)).isEqualTo(1.0);
        assertThat(FitStatistics.varianceScale(250, 100, false)).isEqualTo(2.5);
        assertThat(FitStatistics.varianceScale(250, 100, true)).isEqualTo(2.5);
        assertThat(FitStatistics.varianceScale(3, 0, false)).isEqualTo(1.0);
        // Schwarz 1978: χ² + k ln n
        assertThat(FitStatistics.bic(100, 3, 1000)).isCloseTo(100 + 3 * Math.log(1000), within(1e-12));
        assertThat(FitStatistics.rms(new double[] {3, -4})).isCloseTo(Math.sqrt(12.5), within(1e-15));
    }
}
