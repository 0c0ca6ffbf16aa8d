package org.twinlight.fit;

import java.util.Collections;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Set;

/**
 * What to fit and how.
 *
 * @param free names of the free parameters (contract names; {@code limbDarkening1} frees all of
 *     star 1's coefficients, {@code limbDarkening1.a} only the one named a)
 * @param baseline the per-segment flux normalisation
 * @param segmentGapDays data are split into segments at gaps longer than this, days
 * @param maxIterations iteration limit of the least-squares solver
 */
public record FitSettings(Set<String> free, Baseline baseline, double segmentGapDays, int maxIterations) {

    /** The free parameters when none are named: the geometry and the surface-brightness ratio. */
    public static final List<String> DEFAULT_FREE = List.of("epoch", "radius1", "radius2", "inclination",
            "surfaceBrightnessRatio");

    public FitSettings {
        free = Collections.unmodifiableSet(new LinkedHashSet<>(free));
        if (free.isEmpty()) {
            throw new IllegalArgumentException("at least one parameter must be free");
        }
        if (!(segmentGapDays > 0)) {
            throw new IllegalArgumentException("the segment gap must be positive, got " + segmentGapDays);
        }
        if (maxIterations < 1) {
            throw new IllegalArgumentException("the iteration limit must be ≥ 1, got " + maxIterations);
        }
    }

    /** Default settings: {@link #DEFAULT_FREE}, one offset per segment, 0.5 d segment gap. */
    public static FitSettings defaults() {
        return new FitSettings(new LinkedHashSet<>(DEFAULT_FREE), Baseline.OFFSET, 0.5, 200);
    }

    public FitSettings withFree(Set<String> names) {
        return new FitSettings(names, baseline, segmentGapDays, maxIterations);
    }

    public FitSettings withBaseline(Baseline b) {
        return new FitSettings(free, b, segmentGapDays, maxIterations);
    }

    public FitSettings withSegmentGapDays(double d) {
        return new FitSettings(free, baseline, d, maxIterations);
    }

    public FitSettings withMaxIterations(int n) {
        return new FitSettings(free, baseline, segmentGapDays, n);
    }
}
