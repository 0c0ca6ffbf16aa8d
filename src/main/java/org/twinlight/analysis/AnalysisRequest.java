package org.twinlight.analysis;

import java.nio.file.Path;
import java.util.Objects;

/**
 * One target to analyse: everything the unit of work needs, nothing shared.
 *
 * @param settings every choice of the analysis, the light-curve files included
 * @param outputDir folder the results are written to (created if missing)
 */
public record AnalysisRequest(AnalysisSettings settings, Path outputDir) {

    public AnalysisRequest {
        Objects.requireNonNull(settings, "settings");
        Objects.requireNonNull(outputDir, "outputDir");
    }

    /** The target's name: the label, else the first file's name. */
    public String label() {
        if (settings.label() != null && !settings.label().isBlank()) {
            return settings.label();
        }
        return settings.files().isEmpty() ? "target" : Path.of(settings.files().get(0)).getFileName().toString();
    }
}
