package org.twinlight.batch;

import java.io.IOException;
import java.io.Reader;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.twinlight.BadInputException;
import org.twinlight.report.AtomicFiles;

/**
 * A manifest: a CSV table with a header, one target per row. Columns (any order, names in any
 * case):
 * <ul>
 * <li>{@code file} (or {@code files}), required: the light curve, or several separated by
 * {@code ;} (bands or instruments of one target);</li>
 * <li>{@code label}: the name to show (default: the first file's name);</li>
 * <li>{@code period}: a period in days to use instead of a period search;</li>
 * <li>{@code model}: a model file (starting model);</li>
 * <li>{@code settings}: a settings file for the analysis;</li>
 * <li>{@code velocities}: radial-velocity files (several separated by {@code ;}), fitted jointly with
 * the light curves, then the absolute dimensions;</li>
 * <li>{@code k1}, {@code k1Error}, {@code k2}, {@code k2Error} (km/s): semi-amplitudes instead of
 * velocities, for the dimensions; {@code teff1}, {@code teff1Error}, {@code teff2},
 * {@code teff2Error} (K): effective temperatures, for luminosities.</li>
 * </ul>
 * Paths are relative to the manifest's folder and may not lead out of it (after {@code ..} and
 * symbolic links are followed) unless outside paths are allowed; every file must exist. Lines
 * starting with {@code #} and empty lines are skipped. Any problem is a {@link BadInputException}
 * naming the manifest, the row (1 = the first row under the header) with its line, and the
 * column, before any target is run.
 */
public final class Manifest {
    /** The columns a manifest may have. */
    public static final List<String> COLUMNS = List.of("file", "label", "period", "model", "settings", "velocities",
            "k1", "k1Error", "k2", "k2Error", "teff1", "teff1Error", "teff2", "teff2Error");
    /** The columns of numbers for the stages after the fit (the settings keys of the same names). */
    private static final List<String> NUMBER_COLUMNS = COLUMNS.subList(COLUMNS.indexOf("k1"), COLUMNS.size());

    private Manifest() {
    }

    /**
     * The targets of the manifest, each with its output folder in {@code outRoot}.
     *
     * @param allowOutside whether paths may lead out of the manifest's folder
     */
    public static List<BatchTarget> read(Path manifest, Path outRoot, boolean allowOutside) {
        CSVFormat format = CSVFormat.DEFAULT.builder().setHeader().setSkipHeaderRecord(true).setCommentMarker('#')
                .setIgnoreSurroundingSpaces(true).setIgnoreEmptyLines(true).get();
        Path base = manifest.toAbsolutePath().normalize().getParent();
        Path out = outRoot.toAbsolutePath().normalize();
        List<BatchTarget> targets = new ArrayList<>();
        TargetDiscovery.Ids ids = new TargetDiscovery.Ids();
        try (Reader r = Files.newBufferedReader(manifest, StandardCharsets.UTF_8);
                CSVParser csv = CSVParser.parse(r, format)) {
            Map<String, String> columns = columns(manifest, csv.getHeaderNames());
            int row = 0;
            for (CSVRecord rec : csv) {
                row++;
                Row cells = new Row(manifest, base, allowOutside, rec, columns,
                        "row " + row + " (line " + csv.getCurrentLineNumber() + ")");
                targets.add(cells.target(ids, out));
            }
        } catch (NoSuchFileException e) {
            throw BadInputException.at(manifest, null, null, "manifest not found");
        } catch (CharacterCodingException e) {
            throw BadInputException.at(manifest, null, null, "not UTF-8 text; expected a manifest CSV with the columns "
                    + String.join(", ", COLUMNS));
        } catch (IOException | java.io.UncheckedIOException | IllegalStateException e) {
            String why = e instanceof IOException io ? AtomicFiles.reason(io) : String.valueOf(e.getMessage());
            throw BadInputException.at(manifest, null, null, "cannot read the manifest as CSV (" + why + ")");
        }
        if (targets.isEmpty()) {
            throw BadInputException.at(manifest, null, null, "the manifest has no rows; expected a header ("
                    + String.join(",", COLUMNS) + ") and one row per target");
        }
        return targets;
    }

    /** The header's columns by their standard name; an unknown or repeated column is bad input. */
    private static Map<String, String> columns(Path manifest, List<String> header) {
        Map<String, String> byName = new LinkedHashMap<>();
        for (String h : header) {
            String lower = h.trim().toLowerCase(Locale.ROOT);
            String name = lower.equals("files") ? "file"
                    : COLUMNS.stream().filter(c -> c.equalsIgnoreCase(lower)).findFirst().orElse(lower);
            if (!COLUMNS.contains(name)) {
                throw BadInputException.at(manifest, "header", h, "not a manifest column; expected "
                        + String.join(", ", COLUMNS));
            }
            if (byName.put(name, h) != null) {
                throw BadInputException.at(manifest, "header", h, "given twice");
            }
        }
        if (!byName.containsKey("file")) {
            throw BadInputException.at(manifest, "header", "file", "missing; a manifest needs a header row with a "
                    + "file column (and optionally " + String.join(", ", COLUMNS.subList(1, COLUMNS.size())) + ")");
        }
        return byName;
    }

    /** The cells of one row, read column by column. */
    private record Row(Path manifest, Path base, boolean allowOutside, CSVRecord rec, Map<String, String> columns,
            String where) {

        BatchTarget target(TargetDiscovery.Ids ids, Path out) {
            if (!rec.isConsistent()) {
                throw BadInputException.at(manifest, where, null, rec.size() + " cells for " + columns.size()
                        + " columns in the header");
            }
            List<Path> files = paths("file");
            if (files.isEmpty()) {
                throw BadInputException.at(manifest, where, columns.get("file"), "empty; every row needs a light curve");
            }
            String label = cell("label");
            if (label.chars().anyMatch(Character::isISOControl)) {
                throw BadInputException.at(manifest, where, columns.get("label"), "holds a control character (a line "
                        + "break or tab); expected one line of text");
            }
            if (label.isEmpty()) {
                label = files.get(0).getFileName().toString();
            }
            String id = ids.unique(cell("label").isEmpty() ? TargetDiscovery.baseName(label) : label);
            return new BatchTarget(id, label, files, period(), optionalPath("model"), optionalPath("settings"),
                    paths("velocities"), numbers(), out.resolve(id), manifest.getFileName() + " " + where);
        }

        /** The files of a cell, separated by ';' (empty for an empty cell). */
        private List<Path> paths(String name) {
            String text = cell(name);
            List<Path> out = new ArrayList<>();
            if (text.isEmpty()) {
                return out;
            }
            for (String part : text.split(";", -1)) {
                if (part.isBlank()) {
                    throw BadInputException.at(manifest, where, columns.get(name), "an empty name between ';' in '"
                            + text + "'; expected file names separated by ';'");
                }
                out.add(path(name, part.trim()));
            }
            return out;
        }

        /** The numbers of the stages after the fit given in the row, by column. */
        private Map<String, Double> numbers() {
            Map<String, Double> out = new java.util.LinkedHashMap<>();
            for (String name : NUMBER_COLUMNS) {
                String text = cell(name);
                if (text.isEmpty()) {
                    continue;
                }
                double v;
                try {
                    v = Double.parseDouble(text);
                } catch (NumberFormatException e) {
                    v = Double.NaN;
                }
                if (!Double.isFinite(v) || v < 0 || (v == 0 && !name.endsWith("Error"))) {
                    throw BadInputException.at(manifest, where, columns.get(name), "'" + text + "' is not "
                            + (name.endsWith("Error") ? "an error; expected a number >= 0" : "a value; expected a "
                                    + "number > 0") + " (" + (name.startsWith("k") ? "km/s" : "K") + ", a point as "
                                    + "decimal mark), or an empty cell");
                }
                out.put(name, v);
            }
            return out;
        }

        private String cell(String name) {
            String header = columns.get(name);
            return header == null || !rec.isSet(header) ? "" : rec.get(header).trim();
        }

        private Double period() {
            String text = cell("period");
            if (text.isEmpty()) {
                return null;
            }
            double p;
            try {
                p = Double.parseDouble(text);
            } catch (NumberFormatException e) {
                p = Double.NaN;
            }
            if (!(p > 0) || Double.isInfinite(p)) {
                throw BadInputException.at(manifest, where, columns.get("period"), "'" + text + "' is not a period;"
                        + " expected a number of days > 0 (a point as decimal mark), or an empty cell to search for it");
            }
            return p;
        }

        private Path optionalPath(String name) {
            String text = cell(name);
            return text.isEmpty() ? null : path(name, text);
        }

        /** The cell's path resolved against the manifest's folder, checked to exist and to stay inside. */
        private Path path(String name, String text) {
            String column = columns.get(name);
            Path p;
            try {
                p = base.resolve(text).normalize();
            } catch (java.nio.file.InvalidPathException e) {
                throw BadInputException.at(manifest, where, column, "'" + text + "' is not a file name");
            }
            if (!Files.isRegularFile(p)) {
                throw BadInputException.at(manifest, where, column, "'" + text + "': " + (Files.isDirectory(p)
                        ? "a folder; expected a file" : "no such file (paths are relative to the manifest's folder "
                                + base + ")"));
            }
            if (!allowOutside) {
                Path real;
                Path realBase;
                try {
                    real = p.toRealPath();
                    realBase = base.toRealPath();
                } catch (IOException e) {
                    throw BadInputException.at(manifest, where, column, "'" + text + "': " + AtomicFiles.reason(e));
                }
                if (!p.startsWith(base) || !real.startsWith(realBase)) {
                    throw BadInputException.at(manifest, where, column, "'" + text + "' leads out of the manifest's "
                            + "folder " + base + "; move the file beside the manifest, or allow it with "
                            + "--allow-outside");
                }
            }
            return p;
        }
    }
}
