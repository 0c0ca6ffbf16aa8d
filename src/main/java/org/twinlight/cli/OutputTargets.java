package org.twinlight.cli;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.twinlight.BadInputException;

/**
 * Checks where results will be written before any work is done: an output directory must be a
 * directory (or not exist yet), and no result may land on an input file.
 */
final class OutputTargets {
    private OutputTargets() {
    }

    /**
     * Refuses {@code --out DIR} when it is an existing file, or when one of the result files named
     * {@code outputNames} inside it is one of the {@code inputs}.
     */
    static void checkDirectory(Path outDir, List<String> outputNames, List<Path> inputs) {
        OptionChecks.notEmpty("--out", outDir);
        if (Files.exists(outDir) && !Files.isDirectory(outDir)) {
            throw new BadInputException("option --out: " + outDir + " is a file; expected a directory for the results"
                    + " (it is created if missing)");
        }
        for (String name : outputNames) {
            checkFile(outDir.resolve(name), inputs);
        }
    }

    /** Refuses an output file that is one of the inputs. */
    static void checkFile(Path target, List<Path> inputs) {
        OptionChecks.notEmpty("--out", target);
        if (Files.isDirectory(target)) {
            throw new BadInputException("option --out: " + target + " is a directory; expected a file name");
        }
        Path t = target.toAbsolutePath().normalize();
        for (Path in : inputs) {
            if (in == null) {
                continue;
            }
            Path a = in.toAbsolutePath().normalize();
            if (t.equals(a) || sameFile(t, a)) {
                throw new BadInputException("option --out: writing " + target + " would overwrite the input " + in
                        + "; input files are never modified, choose another output place");
            }
        }
    }

    private static boolean sameFile(Path a, Path b) {
        try {
            return Files.exists(a) && Files.exists(b) && Files.isSameFile(a, b);
        } catch (IOException e) {
            return false;
        }
    }
}
