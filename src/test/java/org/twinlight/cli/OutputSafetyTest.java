package org.twinlight.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** No command writes a result over one of its inputs (regression: period and minima once did). */
class OutputSafetyTest {
    @TempDir
    Path dir;

    private Path inputNamed(String name) throws Exception {
        Path sample = Path.of("sample-curves", "corvel-pair-ground.csv");
        return Files.copy(sample, dir.resolve(name));
    }

    @Test
    void periodRefusesToOverwriteAnInputNamedLikeItsResult() throws Exception {
        Path in = inputNamed("period.json");
        byte[] before = Files.readAllBytes(in);
        ConsoleCapture c = new ConsoleCapture();
        assertThat(c.run("period", in.toString(), "--out", dir.toString())).isEqualTo(2);
        assertThat(c.err.toString()).contains("would overwrite the input");
        assertThat(Files.readAllBytes(in)).isEqualTo(before);
    }

    @Test
    void minimaRefusesToOverwriteAnInputNamedLikeItsResult() throws Exception {
        Path in = inputNamed("minima.csv");
        byte[] before = Files.readAllBytes(in);
        ConsoleCapture c = new ConsoleCapture();
        assertThat(c.run("minima", in.toString(), "--period", "0.8731542", "--epoch", "2460571.41238", "--out",
                dir.toString())).isEqualTo(2);
        assertThat(c.err.toString()).contains("would overwrite the input");
        assertThat(Files.readAllBytes(in)).isEqualTo(before);
    }

    @Test
    void outPointingAtAFileIsUsageError() throws Exception {
        Path in = inputNamed("lc.csv");
        ConsoleCapture c = new ConsoleCapture();
        assertThat(c.run("period", in.toString(), "--out", in.toString())).isEqualTo(2);
        assertThat(c.err.toString()).contains("--out").contains("is a file");
    }
}
