package org.twinlight.analysis;

import java.nio.file.Path;
import java.util.List;
import java.util.Map;

/**
 * What an analysis gives back: the exit code, the message, the key results and the files written.
 *
 * @param exitCode 0 success; 1 the work failed or the answer is not certain (the message and the
 *     report say why and what to try); 2 bad input or settings (nothing written)
 * @param message one paragraph for the user
 * @param keyResults key results by their names in the result files ({@code period},
 *     {@code radius1}, {@code inclination}, ...), in a fixed order
 * @param files the files written, in the output folder
 * @param thumbnail a small picture of the fit (or of the periodogram when there is no fit) for an
 *     index page; null when nothing was drawn
 */
public record AnalysisOutcome(int exitCode, String message, Map<String, Value> keyResults, List<Path> files,
        Path thumbnail) {

    public AnalysisOutcome {
        keyResults = java.util.Collections.unmodifiableMap(new java.util.LinkedHashMap<>(keyResults));
        files = List.copyOf(files);
    }

    /** True for exit code 0. */
    public boolean succeeded() {
        return exitCode == 0;
    }

    /**
     * A value with its 1σ uncertainty (NaN when it has none).
     *
     * @param value the value, in the unit of the result files
     * @param uncertainty its 1σ uncertainty
     */
    public record Value(double value, double uncertainty) {
    }
}
