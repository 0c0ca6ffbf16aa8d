package org.twinlight.cli;

import java.io.PrintWriter;
import java.io.StringWriter;
import picocli.CommandLine;

/** Runs the twinlight command line in-process and keeps what it prints, for command tests. */
final class ConsoleCapture {
    final StringWriter out = new StringWriter();
    final StringWriter err = new StringWriter();

    /** Runs {@code twinlight args...} and returns the exit code. */
    int run(String... args) {
        CommandLine cl = TwinlightCommand.commandLine();
        cl.setOut(new PrintWriter(out, true));
        cl.setErr(new PrintWriter(err, true));
        return cl.execute(args);
    }
}
