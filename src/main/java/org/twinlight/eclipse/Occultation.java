package org.twinlight.eclipse;

import org.apache.commons.math3.analysis.integration.gauss.GaussIntegrator;
import org.apache.commons.math3.analysis.integration.gauss.GaussIntegratorFactory;

/**
 * The fraction of a limb-darkened star's light hidden by an opaque disc in front of it.
 *
 * <p>Lengths are in units of the occulted star's radius: the occulting disc has radius {@code p}
 * and its centre lies at projected distance {@code z} from the centre of the occulted star.
 *
 * <p>Method (any law): the hidden flux is ∫ I(μ) 2α(r) r dr over the annuli of the occulted disc,
 * where 2α(r) is the angle of the annulus of radius r that lies behind the occulting disc. Annuli
 * wholly behind it are integrated in closed form ({@link LimbDarkening#centralFlux(double)}); the
 * partly hidden ones are integrated with Gauss–Legendre quadrature in the variable s = √μ =
 * (1−r²)^¼, which makes every law of the contract smooth at the limb, after a cosine
 * substitution that removes the square-root behaviour of α(r) at both ends of the interval.
 */
public final class Occultation {
    private static final int NODES = 48;
    private static final double[] COS_THETA = new double[NODES];
    private static final double[] SIN_WEIGHT = new double[NODES];

    static {
        GaussIntegrator rule = new GaussIntegratorFactory().legendre(NODES, 0.0, Math.PI);
        for (int i = 0; i < NODES; i++) {
            double theta = rule.getPoint(i);
            COS_THETA[i] = Math.cos(theta);
            SIN_WEIGHT[i] = Math.sin(theta) * rule.getWeight(i);
        }
    }

    private Occultation() {
    }

    /**
     * Fraction (0..1) of the flux of a star with limb darkening {@code ld} hidden by an opaque disc.
     *
     * @param ld intensity profile of the occulted star
     * @param p radius of the occulting disc in units of the occulted star's radius, p > 0
     * @param z projected distance between the centres, same unit, z ≥ 0
     */
    public static double hiddenFraction(LimbDarkening ld, double p, double z) {
        if (z >= 1 + p || p <= 0) {
            return 0.0;
        }
        if (z <= p - 1) {
            return 1.0;
        }
        double hidden = 0.0;
        // annuli r < p − z lie wholly behind the occulting disc
        if (p > z) {
            double rFull = p - z;
            hidden += 2 * Math.PI * ld.centralFlux(Math.sqrt(Math.max(0.0, (1 - rFull) * (1 + rFull))));
        }
        double rLow = Math.abs(z - p);
        double rHigh = Math.min(1.0, z + p);
        if (z > 0 && rHigh > rLow) {
            hidden += partialAnnuli(ld, p, z, rLow, rHigh);
        }
        double f = hidden / (2 * Math.PI * ld.totalFlux());
        return Math.max(0.0, Math.min(1.0, f));
    }

    /** ∫ over rLow ≤ r ≤ rHigh of I 2α r dr, in s = (1−r²)^¼ with a cosine substitution. */
    private static double partialAnnuli(LimbDarkening ld, double p, double z, double rLow, double rHigh) {
        double sA = Math.sqrt(Math.sqrt((1 - rLow) * (1 + rLow)));
        double sB = Math.sqrt(Math.sqrt(Math.max(0.0, (1 - rHigh) * (1 + rHigh))));
        double half = 0.5 * (sA - sB);
        double zz = (z - p) * (z + p); // z² − p², kept as a product to avoid cancellation when p ≫ 1
        double sum = 0.0;
        for (int i = 0; i < NODES; i++) {
            double s = sB + half * (1 - COS_THETA[i]);
            double s2 = s * s;
            double mu = s2;
            double r2 = 1 - s2 * s2;
            double r = Math.sqrt(r2);
            double c = (r2 + zz) / (2 * r * z);
            double alpha = c >= 1 ? 0.0 : c <= -1 ? Math.PI : Math.acos(c);
            // r dr = −2 s³ ds, and the annulus contributes I · 2α · r dr
            sum += SIN_WEIGHT[i] * 4 * s2 * s * alpha * ld.intensity(mu);
        }
        return sum * half;
    }
}
