package org.twinlight.batch;

import java.io.IOException;
import java.nio.file.DirectoryStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Locale;
import java.util.Set;
import org.twinlight.BadInputException;
import org.twinlight.report.AtomicFiles;

/**
 * The targets of a folder: one target per light-curve file directly inside it (text tables
 * {@code .csv .txt .dat .tsv .tab}, FITS tables {@code .fits .fit .fts}, also gzip-compressed
 * {@code .fits.gz}), in the order of their names. Subfolders, hidden files and other files (model
 * files, pictures, notes) are not targets; a target of several files (bands, instruments) or with
 * a period, model or velocities of its own is described in a manifest ({@link Manifest}).
 */
public final class TargetDiscovery {
    private static final List<String> LIGHT_CURVE_ENDINGS = List.of(".csv", ".txt", ".dat", ".tsv", ".tab", ".fits",
            ".fit", ".fts", ".fits.gz", ".fit.gz", ".fts.gz");
    /** Longest target id (file systems allow 255 bytes per name). */
    private static final int MAX_ID_LENGTH = 100;

    private TargetDiscovery() {
    }

    /**
     * The targets of {@code folder}, each with its output folder in {@code outRoot}.
     *
     * @throws BadInputException when the folder cannot be read or holds no light curve
     */
    public static List<BatchTarget> fromFolder(Path folder, Path outRoot) {
        List<Path> files = new ArrayList<>();
        try (DirectoryStream<Path> entries = Files.newDirectoryStream(folder)) {
            for (Path p : entries) {
                String name = p.getFileName().toString();
                if (!name.startsWith(".") && Files.isRegularFile(p) && isLightCurveName(name)) {
                    files.add(p.toAbsolutePath().normalize());
                }
            }
        } catch (IOException e) {
            throw BadInputException.at(folder, null, null, "cannot list the folder: " + AtomicFiles.reason(e));
        }
        if (files.isEmpty()) {
            throw BadInputException.at(folder, null, null, "no light curve in the folder; expected files ending in "
                    + String.join(", ", LIGHT_CURVE_ENDINGS) + " (one target each), or give a manifest CSV");
        }
        files.sort(null);
        Path out = outRoot.toAbsolutePath().normalize();
        Ids ids = new Ids();
        List<BatchTarget> targets = new ArrayList<>();
        for (Path f : files) {
            String name = f.getFileName().toString();
            String id = ids.unique(baseName(name));
            targets.add(new BatchTarget(id, name, List.of(f), null, null, null, List.of(), null, out.resolve(id), f.toString()));
        }
        return targets;
    }

    /** Whether a file name ends like a light curve. */
    static boolean isLightCurveName(String name) {
        String n = name.toLowerCase(Locale.ROOT);
        return LIGHT_CURVE_ENDINGS.stream().anyMatch(n::endsWith);
    }

    /** A file name without its light-curve ending. */
    static String baseName(String name) {
        String n = name.toLowerCase(Locale.ROOT);
        for (String ending : LIGHT_CURVE_ENDINGS) {
            if (n.endsWith(ending) && name.length() > ending.length()) {
                return name.substring(0, name.length() - ending.length());
            }
        }
        int dot = name.lastIndexOf('.');
        return dot > 0 ? name.substring(0, dot) : name;
    }

    /** Folder names for targets: plain characters, unique in the batch, the same for the same input. */
    static final class Ids {
        private final Set<String> used = new HashSet<>();

        /** A plain, unused folder name made from {@code wanted}; a name already used gets -2, -3, ... */
        String unique(String wanted) {
            String base = plain(wanted);
            String id = base;
            for (int k = 2; !used.add(id.toLowerCase(Locale.ROOT)); k++) {
                id = base + "-" + k;
            }
            return id;
        }

        /** Letters, digits, '-', '_' and '.' (not first); anything else becomes '_'. */
        static String plain(String text) {
            StringBuilder sb = new StringBuilder();
            for (int i = 0; i < text.length() && sb.length() < MAX_ID_LENGTH; i++) {
                char c = text.charAt(i);
                boolean plain = c < 128 && (Character.isLetterOrDigit(c) || c == '-' || c == '_' || c == '.');
                sb.append(plain && !(c == '.' && sb.isEmpty()) ? c : '_');
            }
            String s = sb.toString();
            return s.isEmpty() || s.chars().allMatch(c -> c == '_') ? "target" + s : s;
        }
    }
}
