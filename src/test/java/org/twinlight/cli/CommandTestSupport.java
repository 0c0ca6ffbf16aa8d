package org.twinlight.cli;

import java.io.StringWriter;
import java.nio.file.Path;
import org.junit.jupiter.api.io.TempDir;

/** What the command tests share: a scratch directory and the captured console of one run. */
abstract class CommandTestSupport {
    @TempDir
    Path dir;

    final ConsoleCapture console = new ConsoleCapture();
    final StringWriter out = console.out;
    final StringWriter err = console.err;
}
