package org.twinlight.report;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.twinlight.BadInputException;
import org.twinlight.eclipse.ModelFile;
import org.twinlight.fit.Prior;
import org.twinlight.fit.Priors;

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

    @Test
    void priorsAreReadWithTheirKindAndValues() throws Exception {
        Path f = Files.writeString(dir.resolve("p.json"), "{" + GEOMETRY + "\"surfaceBrightnessRatio\": 0.5, "
                + "\"priors\": {\"lightRatio\": {\"normal\": [0.42, 0.03]}, \"inclination\": {\"uniform\": [80, 90]}}}");
        Priors p = ModelFileJson.readPriors(f);
        assertThat(p.byName().keySet()).containsExactly("lightRatio", "inclination");
        assertThat(p.get("lightRatio")).isEqualTo(new Prior.Normal(0.42, 0.03));
        assertThat(p.get("inclination")).isEqualTo(new Prior.Uniform(80, 90));
        assertThat(p.source()).isEqualTo(f.toString());
        // the model itself is read as before
        assertThat(ModelFileJson.read(f).common().inclinationDeg()).isEqualTo(87);
        Path none = Files.writeString(dir.resolve("n.json"), "{" + GEOMETRY + "\"surfaceBrightnessRatio\": 0.5}");
        assertThat(ModelFileJson.readPriors(none).isEmpty()).isTrue();
    }

    @Test
    void impossiblePriorsAreRefusedNamingTheKey() throws Exception {
        String[][] cases = {
            {"{\"uniform\": [90, 80]}", "lo < hi"},
            {"{\"uniform\": [80, 80]}", "lo < hi"},
            {"{\"normal\": [0.4, 0]}", "positive, finite sigma"},
            {"{\"normal\": [0.4, -0.1]}", "positive, finite sigma"},
            {"{\"normal\": [0.4, 1e400]}", "positive, finite sigma"},
            {"{\"gaussian\": [0.4, 0.1]}", "unknown kind of prior"},
            {"{\"normal\": [0.4]}", "two numbers"},
            {"{\"normal\": [0.4, \"a\"]}", "two numbers"},
            {"{\"normal\": [0.4, 0.1], \"uniform\": [0, 1]}", "expected"},
            {"3", "expected"},
        };
        for (String[] c : cases) {
            Path f = Files.writeString(dir.resolve("bad.json"), "{" + GEOMETRY + "\"surfaceBrightnessRatio\": 0.5, "
                    + "\"priors\": {\"radius1\": " + c[0] + "}}");
            assertThatThrownBy(() -> ModelFileJson.readPriors(f)).as(c[0]).isInstanceOf(BadInputException.class)
                    .hasMessageContaining(f.toString()).hasMessageContaining("priors.radius1")
                    .hasMessageContaining(c[1]);
        }
    }
}
