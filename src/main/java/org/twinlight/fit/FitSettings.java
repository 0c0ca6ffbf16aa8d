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
 * @param clipSigma residuals further than this many robust standard deviations from the model
 *     are left out and the fit repeated; NaN keeps every point
 */
public record FitSettings(Set<String> free, Baseline baseline, double segmentGapDays, int maxIterations,
        double clipSigma) {

    /** The free parameters when none are named: the geometry and the surface-brightness ratio. */
    public static final List<String> DEFAULT_FREE = List.of("epoch", "radius1", "radius2", "inclination",
            "surfaceBrightnessRatio");

    /**
     * Default clipping level, in robust standard deviations of the normalised residuals. At 5σ
     * Gaussian noise loses one point in about 1.7 million (common practice, no source).
     */
    public static final double DEFAULT_CLIP_SIGMA = 5.0;

    /** The smallest clipping level accepted: below it, honest points of Gaussian noise go. */
    public static final double MIN_CLIP_SIGMA = 3.0;

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
        if (!Double.isNaN(clipSigma) && !(clipSigma >= MIN_CLIP_SIGMA && clipSigma < Double.POSITIVE_INFINITY)) {
            throw new IllegalArgumentException("the clipping level must be at least " + MIN_CLIP_SIGMA
                    + " standard deviations (or none), got " + clipSigma);
        }
    }

    /** Settings without clipping. */
    public FitSettings(Set<String> free, Baseline baseline, double segmentGapDays, int maxIterations) {
        this(free, baseline, segmentGapDays, maxIterations, DEFAULT_CLIP_SIGMA);
    }

    /** Default settings: {@link #DEFAULT_FREE}, one offset per segment, 0.5 d segment gap, 5σ clipping. */
    public static FitSettings defaults() {
        return new FitSettings(new LinkedHashSet<>(DEFAULT_FREE), Baseline.OFFSET, 0.5, 200, DEFAULT_CLIP_SIGMA);
    }

    /** Whether outliers are clipped. */
    public boolean clips() {
        return !Double.isNaN(clipSigma);
    }

    public FitSettings withFree(Set<String> names) {
        return new FitSettings(names, baseline, segmentGapDays, maxIterations, clipSigma);
    }

    public FitSettings withBaseline(Baseline b) {
        return new FitSettings(free, b, segmentGapDays, maxIterations, clipSigma);
    }

    public FitSettings withSegmentGapDays(double d) {
        return new FitSettings(free, baseline, d, maxIterations, clipSigma);
    }

    public FitSettings withMaxIterations(int n) {
        return new FitSettings(free, baseline, segmentGapDays, n, clipSigma);
    }

    /** Clipping at {@code sigma} robust standard deviations; NaN for none. */
    public FitSettings withClipSigma(double sigma) {
        return new FitSettings(free, baseline, segmentGapDays, maxIterations, sigma);
    }
}
