package org.twinlight.eclipse;

/**
 * Area common to two discs: the unit disc and a disc of radius p whose centre is at distance z
 * from it. This is the fraction λᵉ of a uniform star hidden by an opaque disc (Mandel &amp; Agol
 * 2002, ApJ 580, L171, eq. 1), and the exact part of every limb-darkened occultation computed in
 * {@link Occultation}.
 *
 * <p>The two half-angles of the lens are taken with atan2 from the sides of the triangle formed
 * by the centres and an intersection point: its doubled area √((1−a)(b−1)), a = (z−p)²,
 * b = (z+p)², is formed from products of sums and differences (Heron's formula factored), so
 * neither angle loses digits at tangency, where arccos of a cosine near ±1 would.
 */
final class DiscOverlap {
    private DiscOverlap() {
    }

    /** Overlap area divided by π, i.e. the hidden fraction of a uniform unit disc; p &gt; 0, z ≥ 0. */
    static double areaOverPi(double p, double z) {
        if (z >= 1 + p) {
            return 0.0;
        }
        if (z <= p - 1) {
            return 1.0;
        }
        if (z <= 1 - p) {
            return p * p;
        }
        double zMinusP = z - p;
        double zPlusP = z + p;
        double root = Math.sqrt((1 - zMinusP) * (1 + zMinusP) * (zPlusP - 1) * (zPlusP + 1));
        double kappa1 = Math.atan2(root, 1 - (p - z) * (p + z)); // angle at the unit disc's centre
        double kappa0 = Math.atan2(root, p * p + (z - 1) * (z + 1)); // angle at the occulting disc's centre
        return lensOverPi(p, kappa0, kappa1, root);
    }

    /**
     * λᵉ = [p² κ₀ + κ₁ − ½√(4z² − (1+z²−p²)²)] / π from the half-angles κ₀ (at the occulting
     * disc's centre) and κ₁ (at the unit disc's centre) and the root √((1−a)(b−1)).
     */
    static double lensOverPi(double p, double kappa0, double kappa1, double root) {
        return (p * p * kappa0 + kappa1 - 0.5 * root) / Math.PI;
    }
}
