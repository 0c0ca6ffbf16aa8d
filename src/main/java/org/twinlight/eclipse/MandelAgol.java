package org.twinlight.eclipse;

/**
 * Closed-form occultation of a star with a uniform, linear or quadratic limb-darkening law by an
 * opaque disc, after K. Mandel &amp; E. Agol 2002, "Analytic light curves for planetary transit
 * searches", ApJ 580, L171 (their Table 1 and eq. 1–8 of section 3).
 *
 * <p>Lengths in units of the occulted star's radius: p is the radius of the occulting disc and z
 * the distance between the centres. With a = (z−p)², b = (z+p)², q = p²−z² and
 * k² = (1−a)/(4zp), the hidden fraction of the quadratic law 1 − u₁(1−μ) − u₂(1−μ)² is
 * <pre>
 *   [(1−c₂) λᵉ + c₂ (λᵈ + ⅔ Θ(p−z)) − c₄ ηᵈ] / (4Ω),
 *   c₂ = u₁ + 2u₂,  c₄ = −u₂,  Ω = (1−u₁−u₂)/4 + c₂/6 + c₄/8,
 * </pre>
 * where λᵉ is the overlap area over π, and λᵈ, ηᵈ are the piecewise functions λ₁, λ₂, η₁, η₂ of
 * MA02 Table 1 written with complete elliptic integrals. The expressions below were written from
 * memory of that table; the tests confirm them against an independent numerical integration to
 * 1e-11 over all geometries (MandelAgolTest, OccultationAllLawsTest). The special lines of that table
 * (z = p, z = 1−p, z = 0, p = ½) are not used: on them and in a narrow band around each, near
 * z = 0, for p &gt; 100 and for p &lt; 0.001, where the general expressions are 0/0 or lose digits to cancellation,
 * {@link #hiddenFraction} returns NaN so that the caller falls back to quadrature. Differences of
 * nearly equal numbers are formed as products: z²−p² = (z−p)(z+p), 1−a = (1−z+p)(1+z−p),
 * 1−b = (1−z−p)(1+z+p), and the complementary moduli are passed to the elliptic integrals
 * directly, so the closed form keeps about 1e-14 right up to the special lines.
 */
final class MandelAgol {
    /**
     * Width of the bands around the lines z = p and z = |1−p| where the quadrature is used. With
     * q, a, 1−a and 1−b formed as products the closed form keeps about 1e-14 right up to these
     * lines (a scan down to distances of 1e-14 is in the tests); on them it is 0/0, and within
     * this band the characteristic 1/a or b/a and the modulus approach their limits so closely
     * that little is gained by trusting it.
     */
    static final double NEAR_LINE = 1e-9;
    /**
     * Below this z the factor 1/√(pz) of λ₁ (reached only for p close to 1) multiplies the
     * rounding of its bracket: the error grows like 1e-16/√z (4e-9 at z = 1e-8).
     */
    static final double NEAR_CENTRE = 1e-4;
    /** Above this p the terms of λ₁ grow like p³ and cancel: the error grows like 1e-15 p³ (1e-9 at p = 100). */
    static final double LARGE_P = 100;
    /**
     * Below this p, λ₁ and λ₂ are O(p²) sums of O(1) terms: the absolute error stays at rounding
     * level but the relative error grows like 1e-16/p² (1e-6 at p = 1e-4), while the quadrature
     * keeps its relative accuracy.
     */
    static final double SMALL_P = 1e-3;

    private MandelAgol() {
    }

    /**
     * Fraction of the star's flux hidden, for the quadratic law with coefficients u₁, u₂ (u₂ = 0
     * is the linear law, u₁ = u₂ = 0 the uniform disc); NaN where the closed form is not trusted.
     * Requires p &gt; 0 and |1−p| &lt; z &lt; 1+p or z &lt; 1−p (the caller handles no overlap and
     * full cover).
     */
    static double hiddenFraction(double u1, double u2, double p, double z) {
        double zMinusP = z - p;
        double zPlusP = z + p;
        if (Math.abs(zMinusP) < NEAR_LINE * Math.max(1.0, p) || z < NEAR_CENTRE || p > LARGE_P || p < SMALL_P
                || Math.abs(zPlusP - 1) < NEAR_LINE || Math.abs(z - Math.abs(1 - p)) < NEAR_LINE) {
            return Double.NaN;
        }
        return hiddenFractionUnguarded(u1, u2, p, z);
    }

    /** {@link #hiddenFraction} without the bands of ill-conditioning (for the scans of the tests). */
    static double hiddenFractionUnguarded(double u1, double u2, double p, double z) {
        double zMinusP = z - p;
        double zPlusP = z + p;
        double c2 = u1 + 2 * u2;
        double c4 = -u2;
        double omega = (1 - u1 - u2) / 4 + c2 / 6 + c4 / 8;
        double a = zMinusP * zMinusP;
        double b = zPlusP * zPlusP;
        if (a == 0 || z == 0 || zPlusP == 1) {
            return Double.NaN; // the general expressions are 0/0 on these lines
        }
        double q = (p - z) * (p + z); // p² − z² as a product: no cancellation when z ≈ p
        double oneMinusA = (1 - zMinusP) * (1 + zMinusP);
        double oneMinusB = (1 - zPlusP) * (1 + zPlusP);
        double lambdaE;
        double lambdaD;
        double etaD;
        if (zPlusP < 1) {
            // the disc lies inside the stellar disc (MA02 Table 1, cases 3 and 9)
            lambdaE = p * p;
            if (c2 == 0 && c4 == 0) {
                return lambdaE;
            }
            lambdaD = lambda2(p, z, a, b, q, oneMinusA, oneMinusB);
            etaD = 0.5 * p * p * (p * p + 2 * z * z);
        } else {
            // the limbs cross (MA02 Table 1, cases 2 and 8)
            double root = Math.sqrt(oneMinusA * -oneMinusB); // √((1−a)(b−1)) = √(4z² − (1+z²−p²)²)
            double kappa1 = Math.atan2(root, 1 - q);
            double kappa0 = Math.atan2(root, p * p + (z - 1) * (z + 1));
            lambdaE = DiscOverlap.lensOverPi(p, kappa0, kappa1, root);
            if (c2 == 0 && c4 == 0) {
                return lambdaE;
            }
            lambdaD = lambda1(p, z, a, b, q, oneMinusA, oneMinusB);
            double eta2 = 0.5 * p * p * (p * p + 2 * z * z);
            etaD = (kappa1 + 2 * eta2 * kappa0 - 0.25 * (1 + 5 * p * p + z * z) * root) / (2 * Math.PI);
        }
        double theta = p > z ? 2.0 / 3.0 : 0.0;
        return ((1 - c2) * lambdaE + c2 * (lambdaD + theta) - c4 * etaD) / (4 * omega);
    }

    /** λ₁ of MA02 Table 1, for |1−p| &lt; z &lt; 1+p (modulus k &lt; 1). */
    private static double lambda1(double p, double z, double a, double b, double q, double oneMinusA,
            double oneMinusB) {
        double fourPz = 4 * p * z;
        double kc = Math.sqrt(-oneMinusB / fourPz); // √(1−k²) = √((b−1)/(4pz))
        double coefficientK = oneMinusB * (2 * b + a - 3) - 3 * q * (b - 2);
        double coefficientE = fourPz * (z * z + 7 * p * p - 4);
        double termsKE = EllipticIntegrals.combinationOfFirstAndSecondKind(kc, coefficientK, coefficientE);
        double bigPi = EllipticIntegrals.completeThirdKind(1 / a, kc); // Π((a−1)/a, k): 1 − n = 1/a
        double termPi = -3 * (q / a) * bigPi;
        return (termsKE + termPi) / (9 * Math.PI * Math.sqrt(p * z));
    }

    /** λ₂ of MA02 Table 1, for z + p &lt; 1 (the elliptic integrals take the modulus 1/k &lt; 1). */
    private static double lambda2(double p, double z, double a, double b, double q, double oneMinusA,
            double oneMinusB) {
        double kc = Math.sqrt(oneMinusB / oneMinusA); // √(1 − 1/k²) = √((1−b)/(1−a))
        double coefficientK = 1 - 5 * z * z + p * p + q * q;
        double coefficientE = oneMinusA * (z * z + 7 * p * p - 4);
        double termsKE = EllipticIntegrals.combinationOfFirstAndSecondKind(kc, coefficientK, coefficientE);
        double bigPi = EllipticIntegrals.completeThirdKind(b / a, kc); // Π((a−b)/a, 1/k): 1 − n = b/a
        double termPi = -3 * (q / a) * bigPi;
        return 2 * (termsKE + termPi) / (9 * Math.PI * Math.sqrt(oneMinusA));
    }
}
