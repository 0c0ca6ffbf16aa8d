package org.twinlight.batch;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;

/**
 * What the unit of work returns for one target.
 *
 * @param exitCode 0 success, 1 the work failed, 2 bad input (as the commands' exit codes)
 * @param message one line: what was found, or why it failed and what to try
 * @param keyResults the key numbers by name (contract names: {@code period}, {@code radius1}, ...),
 *     in the order to show them
 * @param files the result files written, names inside the target's output folder
 * @param thumbnail the file (inside the output folder) to show as the target's picture, or null
 */
public record TargetResult(int exitCode, String message, Map<String, KeyValue> keyResults, List<String> files,
        String thumbnail) {

    /**
     * One key number.
     *
     * @param value the value
     * @param uncertainty its 1σ uncertainty (NaN when it has none)
     */
    public record KeyValue(double value, double uncertainty) {
    }

    public TargetResult {
        Objects.requireNonNull(message, "message");
        if (exitCode < 0 || exitCode > 2) {
            throw new IllegalArgumentException("exit code must be 0, 1 or 2, got " + exitCode);
        }
        keyResults = java.util.Collections.unmodifiableMap(new LinkedHashMap<>(keyResults));
        files = List.copyOf(files);
    }

    /** A failure: the exit code (1 or 2) and the message, nothing written. */
    public static TargetResult failed(int exitCode, String message) {
        return new TargetResult(exitCode, message, Map.of(), List.of(), null);
    }

    /** True when the target succeeded. */
    public boolean ok() {
        return exitCode == 0;
    }
}
