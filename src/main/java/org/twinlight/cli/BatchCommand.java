package org.twinlight.cli;

import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;
import java.util.concurrent.atomic.AtomicBoolean;
import org.twinlight.BadInputException;
import org.twinlight.analysis.AnalysisSettings;
import org.twinlight.batch.BatchIndex;
import org.twinlight.batch.BatchJournal;
import org.twinlight.batch.BatchRunner;
import org.twinlight.batch.BatchTarget;
import org.twinlight.batch.AnalysisUnit;
import org.twinlight.batch.Manifest;
import org.twinlight.batch.ProgressBar;
import org.twinlight.batch.TargetDiscovery;
import org.twinlight.batch.UnitOfWork;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/** {@code batch (DIR | MANIFEST.csv) --out DIR}: the analysis of many targets, resumable. */
@Command(name = "batch", mixinStandardHelpOptions = true, versionProvider = VersionInfo.class, sortOptions = false,
        description = {
            "Run analyse on many targets on all cores, each target into its own folder DIR/TARGET (report.html, "
                    + "results.json and the files of each stage).",
            "Targets: every light curve in a folder (one target per file), or the rows of a manifest CSV with the "
                    + "columns file (several separated by ;), label, period, model, settings (an analyse settings "
                    + "file), velocities (several separated by ;: fitted jointly with the light curves, then absolute "
                    + "dimensions), k1, k1Error, k2, k2Error (km/s, instead of velocities), teff1, teff1Error, teff2, "
                    + "teff2Error (K); paths relative to the manifest. With dimensions, summary.csv has mass1, mass2, "
                    + "radius1Rsun, radius2Rsun, logg1, logg2 (and logLuminosity1, logLuminosity2).",
            "A failing target is recorded with its exit code and message and the batch goes on. An interrupted "
                    + "batch (Ctrl-C, kill) run again with the same --out resumes: finished targets are kept, a "
                    + "half-done one is redone from scratch. Writes summary.csv and index.html to --out.",
            "Exit codes: 0 every target succeeded, 1 some target failed (see summary.csv), 2 bad usage or a bad "
                    + "manifest."})
public final class BatchCommand implements Callable<Integer> {
    /** Most threads accepted (more than this is a typing error rather than a machine). */
    static final int MAX_THREADS = 1024;

    @Parameters(index = "0", paramLabel = "DIR|MANIFEST.csv",
            description = "A folder of light curves, or a manifest CSV.")
    Path input;

    @Option(names = "--out", required = true, paramLabel = "DIR",
            description = "Folder for the targets' folders, summary.csv and index.html (created if missing); "
                    + "the same folder again resumes the batch.")
    Path out;

    @Option(names = "--threads", paramLabel = "N",
            description = "Targets analysed at once (default: all cores of the machine).")
    Integer threads;

    @Option(names = "--allow-outside",
            description = "Let paths in the manifest lead out of its folder (refused by default).")
    boolean allowOutside;

    @Option(names = "--retry-failed",
            description = "Run targets again that failed in an earlier run of this batch (by default they are kept "
                    + "as recorded).")
    boolean retryFailed;

    @Mixin
    PhotometryOptions photometry;

    @Spec
    picocli.CommandLine.Model.CommandSpec spec;

    @Override
    public Integer call() {
        OptionChecks.notEmpty("--out", out);
        OptionChecks.notEmpty("DIR|MANIFEST.csv", input);
        if (Files.exists(out) && !Files.isDirectory(out)) {
            throw new BadInputException("option --out: " + out + " is a file; expected a folder for the batch");
        }
        int cores = Runtime.getRuntime().availableProcessors();
        int n = threads == null ? cores : threads;
        if (n < 1 || n > MAX_THREADS) {
            throw new BadInputException("option --threads: expected 1 to " + MAX_THREADS + " (this machine has "
                    + cores + " cores), got " + n);
        }
        photometry.toReadOptions();
        UnitOfWork unit = new AnalysisUnit(baseSettings());
        List<BatchTarget> targets = targets();

        PrintWriter o = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        BatchIndex.write(out, targets, List.copyOf(BatchJournal.read(out).values()));
        AtomicBoolean finished = new AtomicBoolean();
        Thread interrupted = new Thread(() -> {
            if (!finished.get()) {
                err.println();
                err.println("interrupted: finished targets are kept; run the same command again to resume");
                err.flush();
            }
        });
        Runtime.getRuntime().addShutdownHook(interrupted);
        BatchRunner.Outcome outcome;
        try {
            BatchRunner.Progress progress = System.console() != null ? new ProgressBar(err) : BatchRunner.Progress.NONE;
            outcome = new BatchRunner(unit, n, retryFailed).run(targets, out, progress);
            BatchIndex.write(out, targets, outcome.entries());
        } finally {
            finished.set(true);
            removeHook(interrupted);
        }
        o.printf(Locale.ROOT, "batch: %d targets, %d ok, %d failed (%d run now, %d kept from an earlier run), "
                + "%d thread%s%n", targets.size(), outcome.ok(), outcome.failed(), outcome.ranNow(),
                outcome.fromBefore(), n, n == 1 ? "" : "s");
        o.println("wrote " + out.resolve(BatchIndex.SUMMARY) + " and " + out.resolve(BatchIndex.INDEX));
        o.println("caution: " + org.twinlight.report.FitFiles.CAUTION);
        o.flush();
        if (outcome.failed() > 0) {
            err.printf(Locale.ROOT, "failed: %d of %d targets failed (summary.csv lists each with its exit code and "
                    + "message); fix them and run the same command with --retry-failed%n", outcome.failed(),
                    targets.size());
            err.flush();
            return 1;
        }
        return 0;
    }

    /** The analysis defaults with the photometry options of the batch (keys of the settings file). */
    private AnalysisSettings baseSettings() {
        AnalysisSettings s = AnalysisSettings.defaults();
        for (Map.Entry<String, Object> e : photometry.settingsEntries().entrySet()) {
            if (e.getValue() != null) {
                s = s.with(e.getKey(), e.getValue());
            }
        }
        return s;
    }

    /** The targets of the folder or manifest given. */
    private List<BatchTarget> targets() {
        if (Files.isDirectory(input)) {
            if (input.toAbsolutePath().normalize().equals(out.toAbsolutePath().normalize())) {
                throw new BadInputException("option --out: " + out + " is the folder of the light curves; the "
                        + "results go into a folder of their own, choose another --out");
            }
            return TargetDiscovery.fromFolder(input, out);
        }
        if (!Files.exists(input)) {
            throw BadInputException.at(input, null, null, "no such file or folder; expected a folder of light "
                    + "curves or a manifest CSV");
        }
        if (!input.getFileName().toString().toLowerCase(Locale.ROOT).endsWith(".csv")) {
            throw BadInputException.at(input, null, null, "neither a folder of light curves nor a manifest (a "
                    + ".csv file with the columns " + String.join(", ", Manifest.COLUMNS) + ")");
        }
        return Manifest.read(input, out, allowOutside);
    }

    private static void removeHook(Thread hook) {
        try {
            Runtime.getRuntime().removeShutdownHook(hook);
        } catch (IllegalStateException e) {
            // the virtual machine is already shutting down
        }
    }
}
