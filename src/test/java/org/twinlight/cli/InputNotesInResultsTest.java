package org.twinlight.cli;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;

/** The reader's remarks on an input reach the JSON results, not only the terminal. */
class InputNotesInResultsTest extends CommandTestSupport {

    private static final Path SAMPLE = Path.of("sample-curves", "corvel-pair-ground.csv");

    @Test
    void periodAndEphemerisJsonCarryTheReadersNotes() throws Exception {
        // the file declares HJD_UTC; an overriding --time-scale is a remark the results must keep
        Path out = dir.resolve("p");
        assertThat(console.run("period", SAMPLE.toString(), "--time-scale", "BJD_TDB", "--out", out.toString()))
                .isZero();
        JsonNode p = new ObjectMapper().readTree(out.resolve("period.json").toFile());
        assertThat(p.at("/input/notes").toString()).contains("declares its times as HJD_UTC", "BJD_TDB");

        Path m = dir.resolve("m");
        assertThat(console.run("minima", SAMPLE.toString(), "--time-scale", "BJD_TDB", "--period", "0.8731542",
                "--epoch", "2460571.41238", "--out", m.toString())).isZero();
        JsonNode e = new ObjectMapper().readTree(m.resolve("ephemeris.json").toFile());
        assertThat(e.at("/input/notes").toString()).contains("declares its times as HJD_UTC");
    }
}
