package org.twinlight.fit;

import org.twinlight.eclipse.BinaryParameters;

/** Quantities derived from one band's model parameters (their definitions: docs/model.md). */
final class Derived {
    private Derived() {
    }

    /** The derived quantity {@code name} (one of {@link Priors#DERIVED_NAMES}) of {@code p}. */
    static double value(String name, BinaryParameters p) {
        double w = Math.toRadians(p.omegaDeg());
        return switch (name) {
            case "sumOfRadii" -> p.sumOfRadii();
            case "radiusRatio" -> p.radiusRatio();
            case "lightRatio" -> p.lightRatio();
            case "impactParameterPrimary" -> p.impactParameterPrimary();
            case "impactParameterSecondary" -> p.impactParameterSecondary();
            case "eCosOmega" -> p.eccentricity() * Math.cos(w);
            case "eSinOmega" -> p.eccentricity() * Math.sin(w);
            case "secondaryPhase" -> p.orbit().secondaryPhase();
            default -> throw new IllegalArgumentException("no derived quantity named " + name);
        };
    }

    /** Whether the quantity is defined per band (it depends on band values). */
    static boolean perBand(String name) {
        return name.equals("lightRatio");
    }
}
