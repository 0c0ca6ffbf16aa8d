package org.twinlight.analysis;

import java.nio.file.Path;
import java.util.Objects;

/**
 * One target to analyse: everything the unit of work needs, nothing shared.
 *
 * @param settings every choice of the analysis, the light-curve files included
 * @param outputDir folder the results are written to (created if missing)
 * @param threads threads the analysis may use for its own parallel work (period search, Jacobian
 *     columns, global search): 0 for every core; a batch gives 1, so that targets, not the columns
 *     of one target, fill the cores
 */
public record AnalysisRequest(AnalysisSettings settings, Path outputDir, int threads) {

    public AnalysisRequest {
        Objects.requireNonNull(settings, "settings");
        Objects.requireNonNull(outputDir, "outputDir");
        if (threads < 0) {
            throw new IllegalArgumentException("threads must be 0 (every core) or positive, got " + threads);
        }
    }

    /** A request that may use every core. */
    public AnalysisRequest(AnalysisSettings settings, Path outputDir) {
        this(settings, outputDir, 0);
    }

    /** The same request with another number of threads (0: every core). */
    public AnalysisRequest withThreads(int n) {
        return new AnalysisRequest(settings, outputDir, n);
    }

    /** The target's name: the label, else the first file's name. */
    public String label() {
        if (settings.label() != null && !settings.label().isBlank()) {
            return settings.label();
        }
        return settings.files().isEmpty() ? "target" : Path.of(settings.files().get(0)).getFileName().toString();
    }
}
