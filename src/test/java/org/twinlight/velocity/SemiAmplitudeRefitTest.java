package org.twinlight.velocity;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.Set;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.LUDecomposition;
import org.junit.jupiter.api.Test;

class SemiAmplitudeRefitTest {

    private static final VelocityParameters ECCENTRIC = new VelocityParameters(5.71, 2460200.0, 0.30, 140.0, 55.0,
            70.0, 3.0, new double[] {0.0, 1.7}, 0.0, 0.0);

    @Test
    void atTheFittedOrbitTheLinearRefitIsTheLevenbergMarquardtFit() {
        // At a fixed orbit the model is linear in K1, K2, γ and the offsets, so the normal equations
        // must reach the minimum Commons Math's Levenberg–Marquardt optimizer found, with the same
        // covariance (the K block of (JᵀJ)⁻¹ scaled by max(1, χ²/ν)).
        VelocityData data = SyntheticVelocities.make(ECCENTRIC, 30, 1.5, 2.5, 2, 1.0, 11);
        VelocityFitResult fit = VelocityFitter.fit(data, ECCENTRIC, new VelocityFitSettings(Set.of(), 0, true, 200));
        SemiAmplitudeRefit.Refit r = SemiAmplitudeRefit.of(data, fit).refit(ECCENTRIC.periodDays(),
                ECCENTRIC.eccentricity(), ECCENTRIC.omegaDeg());
        assertThat(r.k1Kms()).isCloseTo(fit.best().k1Kms(), within(1e-6 * fit.estimate("k1").uncertainty() * 1e3));
        assertThat(r.k2Kms()).isCloseTo(fit.best().k2Kms(), within(1e-6 * fit.estimate("k2").uncertainty() * 1e3));
        assertThat(Math.sqrt(r.covariance()[0][0])).isCloseTo(fit.estimate("k1").uncertainty(),
                within(1e-4 * fit.estimate("k1").uncertainty()));
        assertThat(r.covariance()[0][1]).isCloseTo(fit.covariance("k1", "k2"),
                within(1e-4 * Math.abs(fit.covariance("k1", "k1"))));
    }

    @Test
    void theOrbitOfTheVelocitiesIsTheMostLikely() {
        // The likelihood of the orbit (K, γ, offsets marginalised) peaks near the orbit the
        // velocities themselves fit best: moving e or ω by 3 of the free fit's σ lowers it by
        // about 4.5 (½ · 3²), and by at least 2 here.
        VelocityData data = SyntheticVelocities.make(ECCENTRIC, 40, 1.5, 2.5, 1, 1.0, 5);
        VelocityParameters start = new VelocityParameters(5.71, 2460200.0, 0.30, 140.0, 55.0, 70.0, 3.0,
                new double[] {0.0}, 0.0, 0.0);
        VelocityFitResult free = VelocityFitter.fit(data, start, new VelocityFitSettings(Set.of("eccentricity",
                "omega"), 0, false, 200));
        SemiAmplitudeRefit refit = SemiAmplitudeRefit.of(data, free);
        double best = refit.refit(5.71, free.best().eccentricity(), free.best().omegaDeg()).logLikelihood();
        double se = free.estimate("eccentricity").uncertainty();
        double sw = free.estimate("omega").uncertainty();
        for (double[] d : new double[][] {{3 * se, 0}, {-3 * se, 0}, {0, 3 * sw}, {0, -3 * sw}}) {
            double other = refit.refit(5.71, free.best().eccentricity() + d[0], free.best().omegaDeg() + d[1])
                    .logLikelihood();
            assertThat(best - other).as("drop at " + d[0] + ", " + d[1]).isBetween(2.0, 9.0);
        }
    }

    @Test
    void smallInverseAgreesWithCommonsMath() {
        double[][] a = {{4, 1.2, -0.5, 0.3}, {1.2, 3, 0.7, 0}, {-0.5, 0.7, 2.5, 0.4}, {0.3, 0, 0.4, 1.1}};
        double[] logDet = new double[1];
        double[][] inv = SemiAmplitudeRefit.invertPositiveDefinite(a, logDet);
        LUDecomposition lu = new LUDecomposition(new Array2DRowRealMatrix(a));
        double[][] expected = lu.getSolver().getInverse().getData();
        for (int i = 0; i < a.length; i++) {
            for (int j = 0; j < a.length; j++) {
                assertThat(inv[i][j]).isCloseTo(expected[i][j], within(1e-12));
            }
        }
        assertThat(logDet[0]).isCloseTo(Math.log(lu.getDeterminant()), within(1e-12));
        assertThat(SemiAmplitudeRefit.invertPositiveDefinite(new double[][] {{1, 1}, {1, 1}}, logDet)).isNull();
    }
}
