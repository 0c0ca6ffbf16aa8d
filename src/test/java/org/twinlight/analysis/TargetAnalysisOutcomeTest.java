package org.twinlight.analysis;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.twinlight.BadInputException;

/**
 * What the analysis says when the data cannot give an answer (exit 1 and a report that explains),
 * the settings file (validation naming the key, and the round trip through settings-used.json), and
 * text from input files escaped in the report.
 */
class TargetAnalysisOutcomeTest {
    private static final ObjectMapper JSON = new ObjectMapper();

    @Test
    void noEclipsesIsExitOneWithAReportThatSaysSo() throws IOException {
        Path f = AnalysedCurves.writeFlat(AnalysedCurves.root().resolve("flat.csv"), 3);
        AnalysedCurves.Outcome run = AnalysedCurves.run(settings(f), AnalysedCurves.root().resolve("flat"), f);
        assertThat(run.outcome().exitCode()).isEqualTo(1);
        assertThat(run.outcome().message()).contains("no significant period").contains("No eclipse stands out");
        String html = Files.readString(run.outputDir().resolve("report.html"));
        assertThat(html).contains("could not be completed").contains("no significant period");
        JsonNode results = JSON.readTree(run.outputDir().resolve("results.json").toFile());
        assertThat(results.path("status").path("verdict").asText()).isEqualTo("failed");
        assertThat(results.path("period").path("decision").path("status").asText()).isEqualTo("not-significant");
        assertThat(run.outputDir().resolve("fit.json")).doesNotExist();
    }

    @Test
    void oneEclipseOnlyIsExitOneAndNamesTheReason() throws IOException {
        Path f = AnalysedCurves.writeOneEclipse(AnalysedCurves.root().resolve("one-eclipse.csv"), 4);
        AnalysedCurves.Outcome run = AnalysedCurves.run(settings(f), AnalysedCurves.root().resolve("one-eclipse"), f);
        assertThat(run.outcome().exitCode()).as(run.outcome().message()).isEqualTo(1);
        assertThat(run.outcome().message()).containsAnyOf("one eclipse only", "does not repeat");
        assertThat(run.outputDir().resolve("report.html")).exists();
    }

    @Test
    void settingsUsedRepeatTheRunExactly() throws IOException {
        AnalysedCurves.Outcome first = AnalysedCurves.ground(1);
        Path used = first.outputDir().resolve("settings-used.json");
        AnalysisSettings again = AnalysisSettingsJson.read(used, AnalysisSettings.defaults()).validated(used.toString());
        assertThat(again).isEqualTo(AnalysisSettingsJson.read(used, AnalysisSettings.defaults()));
        Path out = AnalysedCurves.root().resolve("ground-1-again");
        AnalysedCurves.Outcome second = AnalysedCurves.run(again, out, first.input());
        assertThat(second.outcome().exitCode()).isEqualTo(first.outcome().exitCode());
        JsonNode a = JSON.readTree(first.outputDir().resolve("results.json").toFile());
        JsonNode b = JSON.readTree(out.resolve("results.json").toFile());
        for (String part : List.of("period", "ephemeris", "minima", "starts", "data")) {
            assertThat(b.path(part)).as(part).isEqualTo(a.path(part));
        }
        assertThat(b.path("fit").path("parameters")).isEqualTo(a.path("fit").path("parameters"));
        assertThat(b.path("fit").path("derived")).isEqualTo(a.path("fit").path("derived"));
        assertThat(Files.readString(out.resolve("settings-used.json"))).isEqualTo(Files.readString(used));
    }

    @Test
    void settingsFileErrorsNameTheKey() throws IOException {
        Path dir = AnalysedCurves.root();
        assertThatThrownBy(() -> readSettings(dir, "{\"perod\": 2.0}")).isInstanceOf(BadInputException.class)
                .hasMessageContaining("key 'perod'").hasMessageContaining("unknown key");
        assertThatThrownBy(() -> readSettings(dir, "{\"starts\": \"six\"}")).isInstanceOf(BadInputException.class)
                .hasMessageContaining("key 'starts'").hasMessageContaining("expected an integer");
        assertThatThrownBy(() -> readSettings(dir, "{\"files\": [\"x.csv\"], \"clip\": 1.5}").validated("s.json"))
                .isInstanceOf(BadInputException.class).hasMessageContaining("key 'clip'");
        assertThatThrownBy(() -> readSettings(dir, "{\"files\": [\"x.csv\"], \"epoch\": 2460000.5}")
                .validated("s.json")).isInstanceOf(BadInputException.class).hasMessageContaining("key 'epoch'")
                .hasMessageContaining("needs a period");
        assertThatThrownBy(() -> readSettings(dir, "{\"limbDarkening1\": {\"law\": \"cubic\"}}"))
                .isInstanceOf(BadInputException.class).hasMessageContaining("limbDarkening1")
                .hasMessageContaining("cubic");
        assertThatThrownBy(() -> readSettings(dir, "[1, 2]")).isInstanceOf(BadInputException.class)
                .hasMessageContaining("one JSON object");
    }

    @Test
    void textFromInputsIsEscapedInTheReport() throws IOException {
        Path f = AnalysedCurves.writeFlat(AnalysedCurves.root().resolve("<img src=x onerror=alert(1)>&.csv"), 5);
        AnalysisSettings s = settings(f).with("label", "<script>alert('x')</script> & \"Co\"");
        AnalysedCurves.Outcome run = AnalysedCurves.run(s, AnalysedCurves.root().resolve("hostile"), f);
        String html = Files.readString(run.outputDir().resolve("report.html"));
        assertThat(html).doesNotContain("<script").doesNotContain("<img src=x")
                .contains("&lt;script&gt;alert(&#39;x&#39;)&lt;/script&gt; &amp; &quot;Co&quot;")
                .contains("&lt;img src=x onerror=alert(1)&gt;&amp;.csv");
    }

    private static AnalysisSettings readSettings(Path dir, String json) throws IOException {
        Path f = dir.resolve("settings-test.json");
        Files.writeString(f, json);
        return AnalysisSettingsJson.read(f, AnalysisSettings.defaults());
    }

    private static AnalysisSettings settings(Path f) {
        return AnalysisSettings.defaults().withFiles(List.of(f.toString()));
    }
}
