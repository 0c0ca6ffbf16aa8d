package org.twinlight.cli;

import java.io.PrintWriter;
import org.twinlight.BadInputException;
import org.twinlight.WorkFailedException;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

/** The {@code twinlight} command: a set of sub-commands, one per job. */
@Command(name = "twinlight",
        mixinStandardHelpOptions = true,
        versionProvider = VersionInfo.class,
        description = "Eclipsing-binary light curves: inspect, period, times of minimum and O−C, model fit, velocities, absolute dimensions, time scales.",
        subcommands = {
            CommandLine.HelpCommand.class,
            SimulateCommand.class,
            FitCommand.class,
            BenchCommand.class,
            TimeCommand.class,
            InspectCommand.class,
            MinimaCommand.class,
            PeriodCommand.class,
            VelocitiesCommand.class,
            DimensionsCommand.class,
            PredictCommand.class,
        })
public final class TwinlightCommand implements Runnable {

    @Option(names = "--debug", scope = CommandLine.ScopeType.INHERIT,
            description = "Print the full stack trace when something goes wrong.")
    boolean debug;

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Override
    public void run() {
        spec.commandLine().usage(spec.commandLine().getOut());
    }

    /**
     * The FITS library reports damaged files through java.util.logging with a stack trace; twinlight
     * reports them itself. Held here so the setting is not garbage-collected with the logger.
     */
    private static final java.util.logging.Logger FITS_LOG = java.util.logging.Logger.getLogger("nom.tam");

    /** Builds the command line with twinlight's exit codes: 0 success, 1 work failed, 2 bad input or usage. */
    public static CommandLine commandLine() {
        FITS_LOG.setLevel(java.util.logging.Level.OFF);
        CommandLine cl = new CommandLine(new TwinlightCommand());
        cl.setExitCodeExceptionMapper(t -> t instanceof WorkFailedException ? 1 : 2);
        cl.setExecutionExceptionHandler((ex, commandLine, parseResult) -> {
            boolean wantTrace = parseResult.hasMatchedOption("--debug")
                    || parseResult.subcommands().stream().anyMatch(p -> p.hasMatchedOption("--debug"));
            PrintWriter err = commandLine.getErr();
            if (wantTrace) {
                ex.printStackTrace(err);
            }
            if (ex instanceof BadInputException) {
                err.println("error: " + ex.getMessage());
                return 2;
            }
            if (ex instanceof WorkFailedException) {
                err.println("failed: " + ex.getMessage());
                return 1;
            }
            if (ex instanceof java.io.UncheckedIOException) {
                err.println("failed: " + ex.getMessage());
                return 1;
            }
            err.println("internal error: " + ex + (wantTrace ? "" : " (run again with --debug for details)"));
            return 1;
        });
        return cl;
    }

    public static void main(String[] args) {
        CommandLine cl = commandLine();
        if (java.util.Arrays.asList(args).contains("--debug")) {
            FITS_LOG.setLevel(java.util.logging.Level.ALL);
        }
        System.exit(cl.execute(args));
    }
}
