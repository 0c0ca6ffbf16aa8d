package org.twinlight.fit;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;

/**
 * The priors of a fit, by name: a parameter's contract name ({@code radius1}), a band-dependent
 * one with its band ({@code thirdLight@V}; without a band it holds in every band), or a derived
 * quantity ({@link #DERIVED_NAMES}). Immutable; the names are checked against the fit's parameters
 * when the problem is built ({@link FitProblem}).
 *
 * @param byName prior per name, in the order given
 * @param source where the priors were read (a model file), for messages; may be empty
 */
public record Priors(Map<String, Prior> byName, String source) {

    /** Derived quantities a prior may be put on (the names of fit.json's derived block). */
    public static final List<String> DERIVED_NAMES = List.of("sumOfRadii", "radiusRatio", "lightRatio",
            "impactParameterPrimary", "impactParameterSecondary", "eCosOmega", "eSinOmega", "secondaryPhase");

    public Priors {
        Objects.requireNonNull(source, "source");
        byName = Collections.unmodifiableMap(new LinkedHashMap<>(byName));
    }

    /** No priors. */
    public static Priors none() {
        return new Priors(Map.of(), "");
    }

    public boolean isEmpty() {
        return byName.isEmpty();
    }

    /** The prior on a name, or null. */
    public Prior get(String name) {
        return byName.get(name);
    }

    /** The name without its band ({@code thirdLight@V} → {@code thirdLight}). */
    static String baseName(String name) {
        int at = name.indexOf('@');
        return at < 0 ? name : name.substring(0, at);
    }

    /** The band of a name, or null ({@code thirdLight@V} → {@code V}). */
    static String bandOf(String name) {
        int at = name.indexOf('@');
        return at < 0 ? null : name.substring(at + 1);
    }
}
