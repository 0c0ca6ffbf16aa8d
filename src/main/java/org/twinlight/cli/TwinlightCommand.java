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
        description = "Eclipsing-binary light curves: inspect, period, times of minimum and O−C, model fit, velocities, absolute dimensions, time scales, and the minima to come seen from a site.",
        subcommands = {
            CommandLine.HelpCommand.class,
            SimulateCommand.class,
            AnalyseCommand.class,
            FitCommand.class,
            BenchCommand.class,
            TimeCommand.class,
            InspectCommand.class,
            MinimaCommand.class,
            PeriodCommand.class,
            VelocitiesCommand.class,
            DimensionsCommand.class,
            PredictCommand.class,
            BatchCommand.class,
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
                err.println("error: " + Messages.shorten(ex.getMessage()));
                return 2;
            }
            if (ex instanceof WorkFailedException || ex instanceof java.io.UncheckedIOException) {
                err.println("failed: " + Messages.shorten(ex.getMessage()));
                return 1;
            }
            err.println("internal error: " + Messages.shorten(String.valueOf(ex))
                    + (wantTrace ? "" : " (run again with --debug for details)"));
            return 1;
        });
        CommandLine.IParameterExceptionHandler usage = cl.getParameterExceptionHandler();
        cl.setParameterExceptionHandler((ex, args) -> usage.handleParseException(
                new CommandLine.ParameterException(ex.getCommandLine(), Messages.shorten(ex.getMessage()), ex), args));
        return cl;
    }

    /**
     * Runs the command line; a shortage of memory ends the run with a message naming the heap option
     * (exit 1) instead of the Java virtual machine's stack trace.
     */
    static int execute(CommandLine cl, String[] args) {
        try {
            return cl.execute(args);
        } catch (OutOfMemoryError e) {
            cl.getErr().println(outOfMemoryMessage(Runtime.getRuntime().maxMemory()));
            cl.getErr().flush();
            return 1;
        }
    }

    /** What to do when the memory given to Java (at most {@code maxHeapBytes}) ran out. */
    static String outOfMemoryMessage(long maxHeapBytes) {
        long mb = maxHeapBytes / (1024 * 1024);
        return "failed: out of memory: the input or the work needs more than the " + mb + " MB Java may use here. "
                + "Give Java more memory with the heap option -Xmx, e.g. java -Xmx" + Math.max(1, 2 * mb / 1024 + 1)
                + "g -jar twinlight.jar ..., or use a shorter light curve (fewer rows or a coarser cadence)";
    }

    public static void main(String[] args) {
        CommandLine cl = commandLine();
        if (java.util.Arrays.asList(args).contains("--debug")) {
            FITS_LOG.setLevel(java.util.logging.Level.ALL);
        }
        System.exit(execute(cl, args));
    }
}
