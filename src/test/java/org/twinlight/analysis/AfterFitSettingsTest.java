package org.twinlight.analysis;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import com.fasterxml.jackson.databind.ObjectMapper;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.twinlight.BadInputException;

/** The settings keys of the stages after the fit: read, validated naming the key, written back unchanged. */
class AfterFitSettingsTest {
    @TempDir
    Path dir;

    private AnalysisSettings read(String json) throws Exception {
        Path f = Files.writeString(Files.createDirectories(dir.resolve("cfg")).resolve("s.json"), json);
        return AnalysisSettingsJson.read(f, AnalysisSettings.defaults());
    }

    @Test
    void keysAreReadWithPathsRelativeToTheFileAndWrittenBackUnchanged() throws Exception {
        AnalysisSettings s = read("""
                {"files": ["lc.csv"], "posterior": true, "jitter": true, "maxSteps": 5000, "walkers": 40, "threads": 2,
                 "velocities": ["rv/a.csv", "rv/b.csv"], "teff1": 6100, "teff1Error": 90, "draws": 4000, "seed": 7}
                """).validated("s.json");
        AfterFitSettings a = s.afterFit();
        assertThat(a.posterior()).isTrue();
        assertThat(a.jitter()).isTrue();
        assertThat(a.maxSteps()).isEqualTo(5000);
        assertThat(a.walkers()).isEqualTo(40);
        assertThat(a.velocities()).containsExactly(dir.resolve("cfg/rv/a.csv").toAbsolutePath().toString(),
                dir.resolve("cfg/rv/b.csv").toAbsolutePath().toString());
        assertThat(a.teff1K()).isEqualTo(6100.0);
        assertThat(a.dimensions()).isTrue();
        assertThat(s.seed()).isEqualTo(7L);
        Path used = Files.writeString(dir.resolve("settings-used.json"),
                new ObjectMapper().writeValueAsString(AnalysisSettingsJson.toJson(s)));
        assertThat(AnalysisSettingsJson.read(used, AnalysisSettings.defaults())).isEqualTo(s);
    }

    @Test
    void badValuesNameTheKey() {
        assertThatThrownBy(() -> read("{\"posterior\": \"yes\"}")).isInstanceOf(BadInputException.class)
                .hasMessageContaining("key 'posterior'").hasMessageContaining("true or false");
        assertThatThrownBy(() -> read("{\"velocities\": \"rv.csv\"}")).isInstanceOf(BadInputException.class)
                .hasMessageContaining("key 'velocities'").hasMessageContaining("array");
        for (String[] c : List.of(
                new String[] {"{\"files\": [\"x\"], \"maxSteps\": 100}", "maxSteps", "posterior"},
                new String[] {"{\"files\": [\"x\"], \"jitter\": true}", "jitter", "posterior"},
                new String[] {"{\"files\": [\"x\"], \"posterior\": true, \"walkers\": 7}", "walkers", "even"},
                new String[] {"{\"files\": [\"x\"], \"k1\": 60}", "k2", "missing"},
                new String[] {"{\"files\": [\"x\"], \"k1\": 60, \"k2\": -1}", "k2", "> 0"},
                new String[] {"{\"files\": [\"x\"], \"k1\": 60, \"k2\": 80, \"velocities\": [\"rv.csv\"]}", "k1",
                    "not both"},
                new String[] {"{\"files\": [\"x\"], \"teff1\": 5000}", "teff1", "need K1 and K2"},
                new String[] {"{\"files\": [\"x\"], \"k1\": 60, \"k2\": 80, \"draws\": 10}", "draws", "at least 100"})) {
            assertThatThrownBy(() -> read(c[0]).validated("s.json")).as(c[0]).isInstanceOf(BadInputException.class)
                    .hasMessageContaining("key '" + c[1] + "'").hasMessageContaining(c[2]);
        }
    }
}
