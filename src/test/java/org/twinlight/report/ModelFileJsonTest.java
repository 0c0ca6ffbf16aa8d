package org.twinlight.report;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.twinlight.BadInputException;
import org.twinlight.eclipse.ModelFile;

/** Reading and writing model files. */
class ModelFileJsonTest {
    private static final String GEOMETRY = """
            "period": 1.7, "epoch": 2460100.5, "radius1": 0.15, "radius2": 0.11, "inclination": 87,
            """;

    @TempDir
    Path dir;

    @Test
    void multiBandModelNeedsNoCommonSurfaceBrightnessWhenEveryBandGivesOne() throws Exception {
        // regression: a common surfaceBrightnessRatio was required even when every band gave its own
        Path f = Files.writeString(dir.resolve("m.json"), "{" + GEOMETRY
                + "\"bands\": {\"B\": {\"surfaceBrightnessRatio\": 0.45}, \"R\": {\"surfaceBrightnessRatio\": 0.7}}}");
        ModelFile m = ModelFileJson.read(f);
        assertThat(m.forBand("B").surfaceBrightnessRatio()).isEqualTo(0.45);
        assertThat(m.forBand("R").surfaceBrightnessRatio()).isEqualTo(0.7);
        assertThat(m.covers("V")).isFalse();
        assertThatThrownBy(() -> m.forBand("V")).hasMessageContaining("only per band");
        // written back without inventing a common value, and read again the same
        Path back = Files.writeString(dir.resolve("back.json"), ModelFileJson.toJson(m).toString());
        assertThat(ModelFileJson.toJson(m).has("surfaceBrightnessRatio")).isFalse();
        assertThat(ModelFileJson.read(back)).isEqualTo(m);
    }

    @Test
    void aBandWithoutItsOwnSurfaceBrightnessStillNeedsTheCommonOne() throws Exception {
        Path f = Files.writeString(dir.resolve("m.json"), "{" + GEOMETRY
                + "\"bands\": {\"B\": {\"surfaceBrightnessRatio\": 0.45}, \"R\": {\"thirdLight\": 0.1}}}");
        assertThatThrownBy(() -> ModelFileJson.read(f)).isInstanceOf(BadInputException.class)
                .hasMessageContaining("surfaceBrightnessRatio").hasMessageContaining("band 'R'");
    }

    @Test
    void trailingTextAfterTheModelIsRefused() throws Exception {
        Path f = Files.writeString(dir.resolve("m.json"), "{" + GEOMETRY + "\"surfaceBrightnessRatio\": 0.5}\nextra");
        assertThatThrownBy(() -> ModelFileJson.read(f)).isInstanceOf(BadInputException.class)
                .hasMessageContaining("line 3");
        Path ok = Files.writeString(dir.resolve("ok.json"), "{" + GEOMETRY + "\"surfaceBrightnessRatio\": 0.5}\n\n");
        assertThat(ModelFileJson.read(ok).common().surfaceBrightnessRatio()).isEqualTo(0.5);
    }
}
