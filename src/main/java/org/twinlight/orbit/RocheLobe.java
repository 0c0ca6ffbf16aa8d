package org.twinlight.orbit;

/**
 * The volume-equivalent radius of a Roche lobe, Eggleton 1983 (ApJ 268, 368, eq. 2):
 * r_L/a = 0.49 q^{2/3} / [0.6 q^{2/3} + ln(1 + q^{1/3})], q = mass of the star whose lobe it is
 * over the companion's mass; better than 1 % for all 0 &lt; q &lt; ∞.
 */
public final class RocheLobe {

    private RocheLobe() {
    }

    /** r_L / a for mass ratio {@code q} = M_star / M_companion &gt; 0. */
    public static double eggletonRadius(double q) {
        double q13 = Math.cbrt(q);
        double q23 = q13 * q13;
        return 0.49 * q23 / (0.6 * q23 + Math.log1p(q13));
    }
}
