package org.twinlight.batch;

import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HexFormat;
import java.util.List;
import java.util.Objects;

/**
 * One target of a batch: everything its unit of work needs, and the folder it writes into.
 *
 * @param id the target's name in the batch: a plain folder name, unique in the batch, the same on
 *     every run of the same input (its output folder is {@code --out/id})
 * @param label the label to show (the manifest's label, else the first file's name)
 * @param files the light curve(s), absolute paths; several are several bands or instruments
 * @param periodDays a period to use instead of a period search, days; null to search
 * @param model a model file (starting model), or null
 * @param settings a settings file for the analysis, or null
 * @param velocities radial-velocity files fitted jointly with the light curves (empty: none)
 * @param afterFit numbers of the stages after the fit by their settings key ({@code k1}, {@code k1Error},
 *     {@code k2}, {@code k2Error}, {@code teff1}, {@code teff1Error}, {@code teff2}, {@code teff2Error});
 *     only those given
 * @param outputDir the target's own output folder (absolute)
 * @param origin where the target was described, for messages ("targets.csv row 4", or the file)
 */
public record BatchTarget(String id, String label, List<Path> files, Double periodDays, Path model, Path settings,
        List<Path> velocities, java.util.Map<String, Double> afterFit, Path outputDir, String origin) {

    public BatchTarget {
        Objects.requireNonNull(id, "id");
        Objects.requireNonNull(label, "label");
        Objects.requireNonNull(outputDir, "outputDir");
        files = List.copyOf(files);
        velocities = velocities == null ? List.of() : List.copyOf(velocities);
        afterFit = afterFit == null ? java.util.Map.of()
                : java.util.Collections.unmodifiableMap(new java.util.TreeMap<>(afterFit));
        if (files.isEmpty()) {
            throw new IllegalArgumentException("a target needs at least one light curve");
        }
    }

    /**
     * A short fingerprint of the target's description (files, period, model, settings, velocities,
     * the numbers after the fit, label): a finished target is taken from the journal on a new run only when it is unchanged.
     * The content of the files is not read (that would cost a pass over every light curve on each
     * resume); to redo targets whose files changed under the same names, start a fresh {@code --out}.
     */
    public String fingerprint() {
        String text = String.join("\u0000", label, files.toString(), String.valueOf(periodDays),
                String.valueOf(model), String.valueOf(settings), velocities.isEmpty() ? "null"
                        : velocities.size() == 1 ? velocities.get(0).toString() : velocities.toString())
                + (afterFit.isEmpty() ? "" : "\u0000" + afterFit);
        try {
            byte[] d = MessageDigest.getInstance("SHA-256").digest(text.getBytes(StandardCharsets.UTF_8));
            return HexFormat.of().formatHex(d, 0, 8);
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("SHA-256 is part of every Java runtime", e);
        }
    }
}
