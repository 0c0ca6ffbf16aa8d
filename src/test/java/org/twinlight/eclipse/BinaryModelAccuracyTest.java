package org.twinlight.eclipse;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.apache.commons.math3.analysis.solvers.BrentSolver;
import org.apache.commons.math3.geometry.euclidean.threed.Rotation;
import org.apache.commons.math3.geometry.euclidean.threed.RotationConvention;
import org.apache.commons.math3.geometry.euclidean.threed.Vector3D;
import org.junit.jupiter.api.Test;

/**
 * The whole model against an independent computation: the orbit from Kepler's equation solved by
 * Commons Math's Brent solver and rotated into the sky with Commons Math's {@link Rotation}, the
 * occulted light from {@link ReferenceOccultation} (adaptive Commons Math quadrature of the
 * intensity over the overlap), the light ratio from quadrature of the intensity profiles. Claim:
 * normalised flux within 1e-6, over partial, total, annular and grazing eclipses, radius ratios
 * 0.05–20, circular and eccentric orbits, and both eclipses.
 */
class BinaryModelAccuracyTest {

    /** Independent flux at time t. */
    private static double referenceFlux(BinaryParameters p, double t) {
        double e = p.eccentricity();
        double w = Math.toRadians(p.omegaDeg());
        // mean anomaly of primary conjunction, ν = 90° − ω (tan(E/2) = √((1−e)/(1+e)) tan(ν/2))
        double nuC = Math.PI / 2 - w;
        double eC = 2 * Math.atan(Math.sqrt((1 - e) / (1 + e)) * Math.tan(nuC / 2));
        double mC = eC - e * Math.sin(eC);
        double m = mC + 2 * Math.PI * (t - p.epochDays()) / p.periodDays();
        m = Math.IEEEremainder(m, 2 * Math.PI);
        final double mm = m;
        double ecc = new BrentSolver(1e-15, 1e-15).solve(500, x -> x - e * Math.sin(x) - mm, -Math.PI - 1, Math.PI + 1);
        double nu = 2 * Math.atan2(Math.sqrt(1 + e) * Math.sin(ecc / 2), Math.sqrt(1 - e) * Math.cos(ecc / 2));
        double r = 1 - e * Math.cos(ecc);
        // star 1 relative to star 2 in the orbital plane, x towards star 1's periastron
        Vector3D inPlane = new Vector3D(r * Math.cos(nu), r * Math.sin(nu), 0);
        // rotate by ω in the plane, then tilt by i about the line of nodes: z points away from the observer
        Rotation toSky = new Rotation(Vector3D.PLUS_I, Math.toRadians(p.inclinationDeg()), RotationConvention.VECTOR_OPERATOR)
                .applyTo(new Rotation(Vector3D.PLUS_K, w, RotationConvention.VECTOR_OPERATOR));
        Vector3D sky = toSky.applyTo(inPlane);
        double d = Math.hypot(sky.getX(), sky.getY());
        double l1 = p.radius1() * p.radius1() * ReferenceOccultation.integrate(mu -> p.limbDarkening1().intensity(mu) * mu, 0, 1);
        double l2 = p.surfaceBrightnessRatio() * p.radius2() * p.radius2()
                * ReferenceOccultation.integrate(mu -> p.limbDarkening2().intensity(mu) * mu, 0, 1);
        double lost;
        if (sky.getZ() > 0) { // star 1 behind: primary eclipse
            lost = l1 * ReferenceOccultation.hiddenFraction(p.limbDarkening1(), p.radius2() / p.radius1(), d / p.radius1());
        } else {
            lost = l2 * ReferenceOccultation.hiddenFraction(p.limbDarkening2(), p.radius1() / p.radius2(), d / p.radius2());
        }
        return 1 - lost / (l1 + l2) * (1 - p.thirdLight());
    }

    private static void compareAroundBothEclipses(BinaryParameters p) {
        BinaryModel model = new BinaryModel(p);
        double secondary = p.orbit().secondaryPhase();
        double halfWidth = (p.radius1() + p.radius2()) / Math.PI * 1.2;
        for (double centre : new double[] {0, secondary}) {
            for (int k = -6; k <= 6; k++) {
                double t = p.epochDays() + (centre + halfWidth * k / 6.0) * p.periodDays();
                assertThat(model.instantaneousFlux(t)).as("%s at phase %.4f", p, centre + halfWidth * k / 6.0)
                        .isCloseTo(referenceFlux(p, t), within(1e-6));
            }
        }
    }

    private static BinaryParameters system(double r1, double r2, double inc, double e, double w, LimbDarkening ld1,
            LimbDarkening ld2) {
        return new BinaryParameters(3.1, 100.0, r1, r2, inc, e, w, 0.7, 0.1, ld1, ld2, 0, 1);
    }

    @Test
    void circularOrbitsOverRadiusRatiosAndGeometries() {
        LimbDarkening q1 = LimbDarkening.quadratic(0.45, 0.2);
        LimbDarkening q2 = LimbDarkening.quadratic(0.3, 0.25);
        double[][] radii = {{0.1, 0.005}, {0.1, 0.03}, {0.1, 0.1}, {0.03, 0.09}, {0.04, 0.8}};
        for (double[] r : radii) {
            double sum = r[0] + r[1];
            // central (total/annular), partial, and grazing (impact parameter near r₁ + r₂)
            for (double b : new double[] {0, 0.5 * sum, 0.97 * sum}) {
                double inc = Math.toDegrees(Math.acos(b));
                compareAroundBothEclipses(system(r[0], r[1], inc, 0, 90, q1, q2));
            }
        }
    }

    @Test
    void eccentricOrbitsAndOtherLaws() {
        LimbDarkening[] laws = {
            LimbDarkening.of(LimbDarkeningLaw.SQUARE_ROOT, 0.1, 0.55),
            LimbDarkening.of(LimbDarkeningLaw.LOGARITHMIC, 0.7, 0.25),
            LimbDarkening.of(LimbDarkeningLaw.POWER_2, 0.65, 0.55),
            LimbDarkening.of(LimbDarkeningLaw.FOUR_PARAMETER, 0.5, -0.2, 0.6, -0.25),
            LimbDarkening.of(LimbDarkeningLaw.LINEAR, 0.6),
            LimbDarkening.uniform(),
        };
        for (int i = 0; i < laws.length; i++) {
            LimbDarkening a = laws[i];
            LimbDarkening b = laws[(i + 1) % laws.length];
            compareAroundBothEclipses(system(0.09, 0.06, 88.5, 0.25, 40 + 50 * i, a, b));
        }
    }
}
