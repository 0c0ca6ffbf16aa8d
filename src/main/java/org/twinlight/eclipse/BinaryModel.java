package org.twinlight.eclipse;

import org.twinlight.orbit.Orbit;

/**
 * The normalised flux of two limb-darkened spheres in orbit, with third light and exposure
 * smearing:
 *
 * <pre>
 *   F = [(L₁ − ΔL₁) + (L₂ − ΔL₂)] / (L₁ + L₂) · (1 − ℓ₃) + ℓ₃
 * </pre>
 *
 * where ΔLⱼ is the light of star j hidden by the other star (at most one of them is non-zero at a
 * time), so that the out-of-eclipse flux is 1. Proximity effects (reflection, ellipsoidal
 * variation, beaming) are not modelled.
 *
 * <p>Immutable and thread-safe.
 */
public final class BinaryModel {
    private final BinaryParameters parameters;
    private final Orbit.Positions positions;
    private final double r1;
    private final double r2;
    private final double contactDistance;
    private final double contactPhaseHalfWidth;
    private final double weight1;
    private final double weight2;
    private final double thirdLight;
    private final LimbDarkening ld1;
    private final LimbDarkening ld2;
    private final double[] subExposureOffsets;

    public BinaryModel(BinaryParameters p) {
        this.parameters = p;
        this.positions = p.orbit().positions();
        this.r1 = p.radius1();
        this.r2 = p.radius2();
        this.contactDistance = r1 + r2;
        this.contactPhaseHalfWidth = positions.conjunctionHalfWidth(contactDistance);
        double lightRatio = p.lightRatio();
        this.weight1 = 1 / (1 + lightRatio);
        this.weight2 = lightRatio / (1 + lightRatio);
        this.thirdLight = p.thirdLight();
        this.ld1 = p.limbDarkening1();
        this.ld2 = p.limbDarkening2();
        int n = p.exposureTimeDays() > 0 ? p.supersample() : 1;
        this.subExposureOffsets = new double[n];
        for (int k = 0; k < n; k++) {
            subExposureOffsets[k] = n == 1 ? 0.0 : p.exposureTimeDays() * ((k + 0.5) / n - 0.5);
        }
    }

    public BinaryParameters parameters() {
        return parameters;
    }

    /** Normalised flux at one time, including exposure smearing. */
    public double flux(double timeDays) {
        if (subExposureOffsets.length == 1) {
            return instantaneousFlux(timeDays);
        }
        double sum = 0;
        for (double dt : subExposureOffsets) {
            sum += instantaneousFlux(timeDays + dt);
        }
        return sum / subExposureOffsets.length;
    }

    /** Normalised flux at many times, into {@code out} (same length). */
    public void flux(double[] timesDays, double[] out) {
        for (int i = 0; i < timesDays.length; i++) {
            out[i] = flux(timesDays[i]);
        }
    }

    /** Normalised flux at many times. */
    public double[] flux(double[] timesDays) {
        double[] out = new double[timesDays.length];
        flux(timesDays, out);
        return out;
    }

    /** Normalised flux at an instant, no smearing. */
    public double instantaneousFlux(double timeDays) {
        if (positions.surelyApart(timeDays, contactPhaseHalfWidth)) {
            return 1.0;
        }
        double d = positions.signedSeparation(timeDays);
        double ad = Math.abs(d);
        if (ad >= contactDistance) {
            return 1.0;
        }
        double lost;
        if (d >= 0) {
            // star 2 in front of star 1: primary eclipse
            lost = weight1 * Occultation.hiddenFraction(ld1, r2 / r1, ad / r1);
        } else {
            lost = weight2 * Occultation.hiddenFraction(ld2, r1 / r2, ad / r2);
        }
        return 1.0 - lost * (1 - thirdLight);
    }
}
