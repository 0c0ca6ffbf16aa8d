package org.twinlight.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;

/** A run that needs more memory than Java was given ends with a message naming -Xmx, not a stack trace. */
class OutOfMemoryMessageTest extends CommandTestSupport {
    private static final String MODEL = """
            {"period": 2.61, "epoch": 2460300.25, "radius1": 0.13, "radius2": 0.09, "inclination": 88.0,
             "surfaceBrightnessRatio": 0.6,
             "limbDarkening1": {"law": "quadratic", "coefficients": [0.4, 0.2]},
             "limbDarkening2": {"law": "quadratic", "coefficients": [0.45, 0.2]}}
            """;

    @Test
    void aSmallHeapGivesExitOneAndTheHeapOption() throws Exception {
        Path model = Files.writeString(dir.resolve("m.json"), MODEL);
        String java = Path.of(System.getProperty("java.home"), "bin", "java").toString();
        // 28.8 million points need ~0.7 GB; Java gets 32 MB
        Process p = new ProcessBuilder(List.of(java, "-Xmx32m", "-cp", System.getProperty("java.class.path"),
                TwinlightCommand.class.getName(), "simulate", "--model", model.toString(), "--start", "0", "--end",
                "20000", "--cadence", "1", "--out", dir.resolve("big.csv").toString()))
                .redirectErrorStream(true).start();
        assertThat(p.waitFor(60, TimeUnit.SECONDS)).isTrue();
        String output = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
        assertThat(p.exitValue()).isEqualTo(1);
        assertThat(output).contains("out of memory", "-Xmx", "32 MB").doesNotContain("OutOfMemoryError")
                .doesNotContain("\tat ");
        assertThat(Files.exists(dir.resolve("big.csv"))).isFalse();
    }

    @Test
    void theMessageSuggestsMoreThanTheCurrentHeap() {
        assertThat(TwinlightCommand.outOfMemoryMessage(512L << 20)).contains("512 MB", "-Xmx2g");
        assertThat(TwinlightCommand.outOfMemoryMessage(4L << 30)).contains("4096 MB", "-Xmx9g");
    }
}
