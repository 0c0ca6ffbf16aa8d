package org.twinlight.eclipse;

import java.util.function.DoubleUnaryOperator;
import org.apache.commons.math3.analysis.integration.IterativeLegendreGaussIntegrator;
import org.apache.commons.math3.analysis.integration.UnivariateIntegrator;

/**
 * An independent high-precision occultation for tests, built on Commons Math's adaptive
 * Gauss–Legendre integrator (Apache Commons Math 3.6.1, {@code IterativeLegendreGaussIntegrator}).
 *
 * <p>The occulted flux is the area integral of I over the overlap, in polar coordinates (r, φ)
 * centred on the occulted star: ∫ r dr ∫ dφ I(r). The intensity does not depend on φ, so the
 * inner integral is the intensity times the length of angle of the circle of radius r that lies
 * inside the occulting disc, found here from the intersection point of the two circles with
 * atan2. The outer integral is split at the kinks r = |z−p| and r = z+p and taken in the variable
 * μ = √(1−r²) (no subtraction of the central intensity, no closed forms, no use of the production
 * code except {@link LimbDarkening#intensity(double)}), after a cosine substitution on each piece.
 * The normalising total flux 2π∫I μ dμ is integrated numerically too.
 */
final class ReferenceOccultation {
    private static final double RELATIVE = 1e-12;
    private static final double ABSOLUTE = 1e-14;

    private ReferenceOccultation() {
    }

    static double hiddenFraction(LimbDarkening ld, double p, double z) {
        double total = integrate(mu -> ld.intensity(mu) * mu, 0.0, 1.0);
        // kinks of the arc length at r = |z−p| and r = z+p; then geometric cuts above |z−p| so that
        // the turn of the arc over a scale |z−p| near the disc centre is resolved; then r = ½,
        // below which the integral is taken in r, above it in μ (smooth at the limb)
        double inner = Math.abs(z - p);
        java.util.List<Double> cuts = new java.util.ArrayList<>(java.util.List.of(0.0, inner, z + p, 0.5, 1.0));
        for (double c = 4 * inner; c < 0.5 && inner > 0; c *= 4) {
            cuts.add(c);
        }
        java.util.Collections.sort(cuts);
        double hidden = 0.0;
        for (int i = 0; i + 1 < cuts.size(); i++) {
            double r1 = Math.min(1.0, cuts.get(i));
            double r2 = Math.min(1.0, cuts.get(i + 1));
            if (r2 <= r1) {
                continue;
            }
            double rMid = 0.5 * (r1 + r2);
            if (rMid < z - p || rMid > z + p) {
                continue;
            }
            boolean whole = rMid < p - z;
            if (r2 <= 0.5) {
                hidden += integrate(r -> {
                    double mu = Math.sqrt((1 - r) * (1 + r));
                    return ld.intensity(mu) * (whole ? Math.PI : halfArcInside(r, p, z)) * r;
                }, r1, r2);
            } else {
                double muHigh = Math.sqrt((1 - r1) * (1 + r1));
                double muLow = Math.sqrt((1 - r2) * (1 + r2));
                hidden += integrate(mu -> {
                    double r = Math.sqrt((1 - mu) * (1 + mu));
                    return ld.intensity(mu) * (whole ? Math.PI : halfArcInside(r, p, z)) * mu;
                }, muLow, muHigh);
            }
        }
        return hidden / (Math.PI * total);
    }

    /** Half the angle of the circle of radius r (centred on the star) inside the occulting disc. */
    static double halfArcInside(double r, double p, double z) {
        // intersection point (x, y) of the circles x² + y² = r² and (x − z)² + y² = p²
        double x = (r * r + z * z - p * p) / (2 * z);
        double y2 = r * r - x * x;
        if (y2 <= 0) {
            return x > 0 ? 0.0 : Math.PI;
        }
        return Math.atan2(Math.sqrt(y2), x);
    }

    /** ∫ f from a to b with the substitution x = a + (b−a)(1 − cos θ)/2, θ in [0, π]. */
    static double integrate(DoubleUnaryOperator f, double a, double b) {
        return integrate(f, a, b, RELATIVE, ABSOLUTE);
    }

    /** As {@link #integrate(DoubleUnaryOperator, double, double)} with the given accuracies. */
    static double integrate(DoubleUnaryOperator f, double a, double b, double relative, double absolute) {
        if (b <= a) {
            return 0.0;
        }
        UnivariateIntegrator integrator = new IterativeLegendreGaussIntegrator(8, relative, absolute, 2, 200);
        double half = 0.5 * (b - a);
        return integrator.integrate(10_000_000,
                t -> f.applyAsDouble(a + half * (1 - Math.cos(t))) * half * Math.sin(t), 0.0, Math.PI);
    }
}
