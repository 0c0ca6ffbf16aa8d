package org.twinlight.batch;

import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.twinlight.analysis.AnalysisOutcome;
import org.twinlight.analysis.AnalysisRequest;
import org.twinlight.analysis.AnalysisSettings;
import org.twinlight.analysis.AnalysisSettingsJson;
import org.twinlight.analysis.TargetAnalysis;

/**
 * The batch's unit of work: the one-command analysis ({@link TargetAnalysis#run}) of a target,
 * with the target turned into an analysis request and the outcome into a target result.
 *
 * <p>The settings of a target are, from the least to the most specific: the analysis defaults
 * with the batch's options ({@code base}), then the target's settings file (its keys replace
 * those), then the manifest's cells (files, label, period, model, velocities, K1, K2, temperatures). Holds only {@code base}: one
 * instance serves every target and thread.
 */
public final class AnalysisUnit implements UnitOfWork {
    private final AnalysisSettings base;

    /** @param base the settings every target starts from (the defaults with the batch's options) */
    public AnalysisUnit(AnalysisSettings base) {
        this.base = base;
    }

    @Override
    public TargetResult run(BatchTarget t) {
        // one thread per target: the batch's threads fill the cores with targets
        AnalysisOutcome o = TargetAnalysis.run(new AnalysisRequest(settings(t), t.outputDir(), 1));
        Map<String, TargetResult.KeyValue> keys = new LinkedHashMap<>();
        o.keyResults().forEach((name, v) -> keys.put(name, new TargetResult.KeyValue(v.value(), v.uncertainty())));
        List<String> files = o.files().stream().map(f -> name(t, f)).toList();
        return new TargetResult(o.exitCode(), o.message(), keys, files,
                o.thumbnail() == null ? null : name(t, o.thumbnail()));
    }

    /** The analysis settings of a target. */
    AnalysisSettings settings(BatchTarget t) {
        AnalysisSettings s = t.settings() == null ? base : AnalysisSettingsJson.read(t.settings(), base);
        s = s.withFiles(t.files().stream().map(Path::toString).toList()).with("label", t.label());
        if (t.periodDays() != null) {
            s = s.with("period", t.periodDays());
        }
        if (t.model() != null) {
            s = s.with("model", t.model().toString());
        }
        if (!t.velocities().isEmpty()) {
            s = s.with("velocities", t.velocities().stream().map(Path::toString).toList());
        }
        for (Map.Entry<String, Double> e : t.afterFit().entrySet()) {
            s = s.with(e.getKey(), e.getValue());
        }
        return s.validated(t.settings() == null ? t.origin() : t.settings() + " and " + t.origin());
    }

    /** A written file by its name inside the target's folder (its full path when it lies elsewhere). */
    private static String name(BatchTarget t, Path f) {
        Path abs = f.toAbsolutePath().normalize();
        return abs.startsWith(t.outputDir()) ? t.outputDir().relativize(abs).toString() : abs.toString();
    }
}
