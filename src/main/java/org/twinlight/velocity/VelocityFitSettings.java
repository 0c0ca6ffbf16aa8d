package org.twinlight.velocity;

import java.util.Set;

/**
 * What a velocity fit may change.
 *
 * @param free optional free parameters besides K1, K2, γ and the instrument offsets (which are
 *     always fitted): {@code eccentricity} and {@code omega} (freeing either frees both, fitted
 *     as e cos ω and e sin ω), {@code period}, {@code epoch}
 * @param jitterKms a fixed jitter added in quadrature to the errors (0 = none); ignored when
 *     {@code fitJitter}
 * @param fitJitter choose each star's jitter so that its χ² equals its share of the degrees of
 *     freedom (0 when the scatter is already within the errors)
 * @param maxIterations iteration limit of the solver
 */
public record VelocityFitSettings(Set<String> free, double jitterKms, boolean fitJitter, int maxIterations) {

    /** The optional parameters that may be freed. */
    public static final Set<String> OPTIONAL = Set.of("eccentricity", "omega", "period", "epoch");

    public VelocityFitSettings {
        free = Set.copyOf(free);
        for (String f : free) {
            if (!OPTIONAL.contains(f) && !Set.of("k1", "k2", "gamma").contains(f)) {
                throw new org.twinlight.BadInputException("option --free: unknown parameter '" + f + "'; velocities "
                        + "always fit k1, k2, gamma and the instrument offsets, and may also fit eccentricity, "
                        + "omega, period, epoch");
            }
        }
        if (!(jitterKms >= 0) || !Double.isFinite(jitterKms)) {
            throw new org.twinlight.BadInputException("option --jitter: expected a velocity >= 0 km/s or 'fit', got "
                    + jitterKms);
        }
        if (maxIterations < 1) {
            throw new org.twinlight.BadInputException("option --max-iterations: expected a positive integer, got "
                    + maxIterations);
        }
    }

    public static VelocityFitSettings defaults() {
        return new VelocityFitSettings(Set.of(), 0.0, false, 200);
    }

    boolean eccentric() {
        return free.contains("eccentricity") || free.contains("omega");
    }
}
