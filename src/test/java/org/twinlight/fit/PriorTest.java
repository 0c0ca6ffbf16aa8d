package org.twinlight.fit;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import org.apache.commons.math3.distribution.NormalDistribution;
import org.apache.commons.math3.distribution.UniformRealDistribution;
import org.junit.jupiter.api.Test;

/** The prior densities against Commons Math's distributions (a general-purpose library). */
class PriorTest {

    @Test
    void normalLogDensityIsTheGaussian() {
        Prior.Normal p = new Prior.Normal(0.42, 0.03);
        NormalDistribution ref = new NormalDistribution(0.42, 0.03);
        for (double x : new double[] {0.3, 0.41, 0.42, 0.5, 0.9}) {
            assertThat(p.logDensity(x)).isCloseTo(ref.logDensity(x), within(1e-10));
        }
        assertThat(p.residual(0.48)).isCloseTo(2.0, within(1e-12));
        assertThat(p.allows(1e6)).isTrue();
    }

    @Test
    void uniformLogDensityIsFlatInsideAndExcludesOutside() {
        Prior.Uniform p = new Prior.Uniform(80, 90);
        UniformRealDistribution ref = new UniformRealDistribution(80, 90);
        for (double x : new double[] {80, 83.2, 90}) {
            assertThat(p.logDensity(x)).isCloseTo(Math.log(ref.density(x)), within(1e-12));
        }
        assertThat(p.logDensity(79.999)).isEqualTo(Double.NEGATIVE_INFINITY);
        assertThat(p.allows(90.001)).isFalse();
    }

    @Test
    void impossiblePriorsAreRefused() {
        assertThatThrownBy(() -> new Prior.Uniform(1, 1)).hasMessageContaining("lo < hi");
        assertThatThrownBy(() -> new Prior.Uniform(0, Double.POSITIVE_INFINITY)).hasMessageContaining("finite");
        assertThatThrownBy(() -> new Prior.Normal(0, 0)).hasMessageContaining("sigma");
        assertThatThrownBy(() -> new Prior.Normal(Double.NaN, 1)).hasMessageContaining("mean");
    }
}
