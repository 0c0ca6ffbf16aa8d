package org.twinlight.eclipse;

import org.apache.commons.math3.analysis.integration.gauss.GaussIntegrator;
import org.apache.commons.math3.analysis.integration.gauss.GaussIntegratorFactory;

/**
 * The fraction of a limb-darkened star's light hidden by an opaque disc in front of it.
 *
 * <p>Lengths are in units of the occulted star's radius: the occulting disc has radius {@code p}
 * and its centre lies at projected distance {@code z} from the centre of the occulted star.
 *
 * <p>Methods:
 * <ul>
 * <li>uniform disc: the exact lens area ({@link DiscOverlap});</li>
 * <li>linear and quadratic laws: the closed form of Mandel &amp; Agol 2002 (ApJ 580, L171) with
 * complete elliptic integrals ({@link MandelAgol}), except near the lines z = p, z = |1−p| and
 * z = 0 where it loses digits;</li>
 * <li>every other case: the hidden flux is split as ∫∫ I dA = (overlap area)·I(1) + ∫∫ (I − I(1))
 * dA over the overlap. The first term is exact. In the second, annuli of radius r wholly behind
 * the occulting disc are integrated in closed form ({@link LimbDarkening#centralFlux(double)}) and
 * the partly hidden ones as ∫ (I − 1) 2α(r) r dr, with 2α(r) the angle of the annulus behind the
 * disc, by Gauss–Legendre quadrature in s = √μ = (1−r²)^¼ (which makes every law of the contract
 * smooth at the limb) after a cosine substitution that removes the square-root behaviour of α at
 * the ends of the interval. Subtracting the central intensity makes the integrand vanish like r³
 * at the disc centre, so the rapid turn of α(r) near r = |z−p| when the occulting limb passes
 * close to the centre costs no accuracy. The rule has 8, 12 or 16 nodes by geometry;
 * half-integer powers of μ are products of s, and arccos goes through arcsin.</li>
 * </ul>
 *
 * <p>Accuracy: within 1e-7 of an independent adaptive integration for every law and geometry
 * tested (largest difference found 1.5e-8); see {@code docs/occultation.md}.
 */
public final class Occultation {
    /** Node counts of the precomputed Gauss–Legendre rules; the last one only serves the tests. */
    static final int[] NODE_COUNTS = {8, 12, 16, 64};
    /** Index of the finest rule, accurate to about 1e-13, against which the tests compare. */
    static final int FINEST_RULE = 3;
    private static final int RULE_8 = 0;
    private static final int RULE_12 = 1;
    private static final int RULE_16 = 2;
    private static final double[][] COS_THETA = new double[NODE_COUNTS.length][];
    private static final double[][] SIN_WEIGHT = new double[NODE_COUNTS.length][];

    static {
        GaussIntegratorFactory factory = new GaussIntegratorFactory();
        for (int k = 0; k < NODE_COUNTS.length; k++) {
            int n = NODE_COUNTS[k];
            GaussIntegrator rule = factory.legendre(n, 0.0, Math.PI);
            COS_THETA[k] = new double[n];
            SIN_WEIGHT[k] = new double[n];
            for (int i = 0; i < n; i++) {
                double theta = rule.getPoint(i);
                COS_THETA[k][i] = Math.cos(theta);
                SIN_WEIGHT[k][i] = Math.sin(theta) * rule.getWeight(i);
            }
        }
    }

    private Occultation() {
    }

    /**
     * Fraction (0..1) of the flux of a star with limb darkening {@code ld} hidden by an opaque disc.
     *
     * @param ld intensity profile of the occulted star
     * @param p radius of the occulting disc in units of the occulted star's radius, p &gt; 0
     *     (p ≤ 0 hides nothing)
     * @param z projected distance between the centres, same unit, z ≥ 0
     * @return the hidden fraction, or NaN when p or z is NaN (so that a model evaluated at
     *     undefined parameters is undefined rather than an error deep inside a fit)
     * @throws IllegalArgumentException when z is negative
     */
    public static double hiddenFraction(LimbDarkening ld, double p, double z) {
        if (Double.isNaN(p) || Double.isNaN(z)) {
            return Double.NaN;
        }
        if (z < 0) {
            throw new IllegalArgumentException("occultation needs a centre distance z >= 0, got z=" + z + " (p=" + p + ")");
        }
        if (z >= 1 + p || p <= 0) {
            return 0.0;
        }
        if (z <= p - 1) {
            return 1.0;
        }
        switch (ld.law()) {
            case UNIFORM:
                return clamp(DiscOverlap.areaOverPi(p, z));
            case LINEAR:
            case QUADRATIC: {
                double u2 = ld.law() == LimbDarkeningLaw.QUADRATIC ? ld.coefficient(1) : 0.0;
                double closed = MandelAgol.hiddenFraction(ld.coefficient(0), u2, p, z);
                if (!Double.isNaN(closed)) {
                    return clamp(closed);
                }
                break;
            }
            default:
                break;
        }
        // the closed form forms the overlap area itself: computed here only when it is not used
        return clamp(byQuadrature(ld, p, z, DiscOverlap.areaOverPi(p, z)));
    }

    /** The general method of the class comment, for any law; p &gt; 0, |p−1| &lt; z &lt; 1+p or z ≤ 1−p. */
    static double byQuadrature(LimbDarkening ld, double p, double z, double lensOverPi) {
        return byQuadrature(ld, p, z, lensOverPi, chooseRule(p, z));
    }

    /** As {@link #byQuadrature(LimbDarkening, double, double, double)} with the rule {@code NODE_COUNTS[rule]}. */
    static double byQuadrature(LimbDarkening ld, double p, double z, double lensOverPi, int rule) {
        // deficit = ∫∫ over the overlap of (I − 1) dA, divided by 2π
        double deficit = 0.0;
        if (p > z) {
            // annuli r < p − z lie wholly behind the occulting disc: ∫ (I − 1) μ dμ from μ₀ to 1
            double rFull = p - z;
            double mu0 = Math.sqrt(Math.max(0.0, (1 - rFull) * (1 + rFull)));
            deficit += ld.centralFlux(mu0) - 0.5 * rFull * rFull;
        }
        double rLow = Math.abs(z - p);
        double rHigh = Math.min(1.0, z + p);
        if (z > 0 && rHigh > rLow) {
            deficit += partialAnnuli(ld, p, z, rLow, rHigh, rule) / (2 * Math.PI);
        }
        return (0.5 * lensOverPi + deficit) / ld.totalFlux();
    }

    /**
     * Index into {@link #NODE_COUNTS} of the rule used for the partly hidden annuli. The error of
     * a rule grows with the hidden fraction (about as p² to p³) and is largest near the lines
     * z = p (the occulting limb crosses the centre, where s = (1−r²)^¼ is a poor variable) and
     * z = 1 − p (the occulting disc touches the limb from inside). The choice below comes from
     * maps of the error of each rule against the finest one for strongly darkened profiles of
     * every law (OccultationRuleChoiceTest, OccultationAllLawsTest): 8 nodes for a small disc well
     * inside the limb, 16 within 0.3 of z + p = 1 or (for p &gt; 0.12) of z = p, 12 elsewhere.
     * The worst error found with the chosen rule is 1.5e-8 (linear law, u = 1, where z ≈ p ≈ ½
     * meets both lines), against the 1e-7 aimed at.
     */
    static int chooseRule(double p, double z) {
        if (p <= 0.2 && z + p <= 0.8) {
            return RULE_8;
        }
        boolean nearContact = Math.abs(z + p - 1) <= 0.3;
        boolean nearCentre = Math.abs(z - p) <= 0.3 && p > 0.12;
        return nearContact || nearCentre ? RULE_16 : RULE_12;
    }

    /**
     * ∫ over rLow ≤ r ≤ rHigh of (I − 1) 2α r dr, in s = (1−r²)^¼ with a cosine substitution, with
     * the rule {@code NODE_COUNTS[rule]}.
     */
    static double partialAnnuli(LimbDarkening ld, double p, double z, double rLow, double rHigh, int rule) {
        double[] cosTheta = COS_THETA[rule];
        double[] sinWeight = SIN_WEIGHT[rule];
        double sA = Math.sqrt(Math.sqrt((1 - rLow) * (1 + rLow)));
        double sB = Math.sqrt(Math.sqrt(Math.max(0.0, (1 - rHigh) * (1 + rHigh))));
        double half = 0.5 * (sA - sB);
        double q = (p - z) * (p + z); // p² − z², kept as a product to avoid cancellation when p ≫ 1
        double twoZ = 2 * z;
        double sum = 0.0;
        for (int i = 0; i < cosTheta.length; i++) {
            double s = sB + half * (1 - cosTheta[i]);
            double s2 = s * s;
            double r2 = (1 - s2) * (1 + s2);
            double r = Math.sqrt(r2);
            double c = (r2 - q) / (twoZ * r);
            double alpha = arccos(c);
            // r dr = −2 s³ ds, and the annulus contributes (I − 1) · 2α · r dr
            sum += sinWeight[i] * s2 * s * alpha * ld.intensityDeficitAtRootMu(s);
        }
        return 4 * sum * half;
    }

    /**
     * arccos c in [0, π] (c outside [−1, 1] is taken as ±1), by the half-angle identities
     * arccos c = 2 arcsin √((1−c)/2) for c &gt; ½, π − 2 arcsin √((1+c)/2) for c &lt; −½ and
     * π/2 − arcsin c otherwise (Abramowitz &amp; Stegun 1964, 4.4.3 and 4.4.4; from memory). They
     * keep the digits of 1 ∓ c near ±1, and they keep arcsin in |x| ≤ ½, where the Java runtime
     * is several times faster than its arccos for |c| &gt; ½ (measured: ~75 ns against 600–900 ns
     * on OpenJDK 17), which otherwise dominates the quadrature.
     */
    static double arccos(double c) {
        if (c > 0.5) {
            return c >= 1 ? 0.0 : 2 * Math.asin(Math.sqrt(0.5 * (1 - c)));
        }
        if (c < -0.5) {
            return c <= -1 ? Math.PI : Math.PI - 2 * Math.asin(Math.sqrt(0.5 * (1 + c)));
        }
        return 0.5 * Math.PI - Math.asin(c);
    }

    private static double clamp(double f) {
        return Math.max(0.0, Math.min(1.0, f));
    }
}
