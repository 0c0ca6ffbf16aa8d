package org.twinlight.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.PrintWriter;
import java.io.StringWriter;
import org.junit.jupiter.api.Test;
import picocli.CommandLine;

class TwinlightCommandTest {

    @Test
    void versionIsPrintedAndExitsZero() {
        CommandLine cl = TwinlightCommand.commandLine();
        StringWriter out = new StringWriter();
        cl.setOut(new PrintWriter(out));
        int code = cl.execute("--version");
        assertThat(code).isZero();
        assertThat(out.toString()).startsWith("twinlight ");
    }

    @Test
    void unknownOptionIsUsageErrorWithExitTwo() {
        CommandLine cl = TwinlightCommand.commandLine();
        StringWriter err = new StringWriter();
        cl.setErr(new PrintWriter(err));
        int code = cl.execute("--no-such-option");
        assertThat(code).isEqualTo(2);
        assertThat(err.toString()).contains("--no-such-option");
    }
}
