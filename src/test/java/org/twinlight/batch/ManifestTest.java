package org.twinlight.batch;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.twinlight.BadInputException;

/** Manifests: paths relative to the manifest and kept inside its folder; errors name the row and column. */
class ManifestTest {
    @TempDir
    Path dir;

    private Path base;
    private Path out;

    @BeforeEach
    void files() throws Exception {
        base = Files.createDirectories(dir.resolve("survey"));
        out = dir.resolve("results");
        Files.createDirectories(base.resolve("curves"));
        for (String f : List.of("curves/a.csv", "curves/a-r.csv", "curves/b.fits", "a.model.json")) {
            Files.writeString(base.resolve(f), "x\n");
        }
        Files.writeString(dir.resolve("secret.csv"), "x\n");
    }

    private Path manifest(String text) throws Exception {
        return Files.writeString(base.resolve("targets.csv"), text);
    }

    @Test
    void rowsBecomeTargetsWithPathsRelativeToTheManifest() throws Exception {
        List<BatchTarget> t = Manifest.read(manifest("""
                # survey field 3
                File,label,period,model
                curves/a.csv;curves/a-r.csv,Field 3 / star A,1.25,a.model.json

                curves/b.fits,,,
                curves/b.fits,,,
                """), out, false);
        assertThat(t).hasSize(3);
        assertThat(t.get(0).files()).containsExactly(base.resolve("curves/a.csv"), base.resolve("curves/a-r.csv"));
        assertThat(t.get(0).label()).isEqualTo("Field 3 / star A");
        assertThat(t.get(0).id()).isEqualTo("Field_3___star_A");
        assertThat(t.get(0).periodDays()).isEqualTo(1.25);
        assertThat(t.get(0).model()).isEqualTo(base.resolve("a.model.json"));
        assertThat(t.get(0).outputDir()).isEqualTo(out.toAbsolutePath().resolve("Field_3___star_A"));
        assertThat(t.get(1).label()).isEqualTo("b.fits");
        // the same file twice: two targets, two folders
        assertThat(t.get(1).id()).isEqualTo("b");
        assertThat(t.get(2).id()).isEqualTo("b-2");
    }

    @Test
    void aPathLeadingOutOfTheManifestsFolderIsRefusedUnlessAllowed() throws Exception {
        Path m = manifest("file,label\ncurves/a.csv,ok\n../secret.csv,sneaky\n");
        assertThatThrownBy(() -> Manifest.read(m, out, false)).isInstanceOf(BadInputException.class)
                .hasMessageContaining("targets.csv").hasMessageContaining("row 2 (line 3)")
                .hasMessageContaining("column 'file'").hasMessageContaining("leads out of the manifest's folder")
                .hasMessageContaining("--allow-outside");
        assertThat(Manifest.read(m, out, true).get(1).files()).containsExactly(dir.resolve("secret.csv"));

        Path absolute = manifest("file\n" + dir.resolve("secret.csv") + "\n");
        assertThatThrownBy(() -> Manifest.read(absolute, out, false)).hasMessageContaining("row 1")
                .hasMessageContaining("leads out");
        Path model = manifest("file,model\ncurves/a.csv,curves/../../secret.csv\n");
        assertThatThrownBy(() -> Manifest.read(model, out, false)).hasMessageContaining("column 'model'")
                .hasMessageContaining("leads out");
    }

    @Test
    void aSymbolicLinkLeadingOutIsRefused() throws Exception {
        Path link = base.resolve("curves/link.csv");
        try {
            Files.createSymbolicLink(link, dir.resolve("secret.csv"));
        } catch (UnsupportedOperationException | java.io.IOException e) {
            org.junit.jupiter.api.Assumptions.abort("symbolic links cannot be made here: " + e);
        }
        Path m = manifest("file\ncurves/link.csv\n");
        assertThatThrownBy(() -> Manifest.read(m, out, false)).hasMessageContaining("column 'file'")
                .hasMessageContaining("leads out");
    }

    @Test
    void badCellsAreNamedByRowAndColumn() throws Exception {
        assertThatThrownBy(() -> Manifest.read(manifest("file,colour\ncurves/a.csv,red\n"), out, false))
                .hasMessageContaining("header, column 'colour'").hasMessageContaining("not a manifest column");
        assertThatThrownBy(() -> Manifest.read(manifest("label\nA\n"), out, false))
                .hasMessageContaining("column 'file'").hasMessageContaining("missing");
        assertThatThrownBy(() -> Manifest.read(manifest("file,period\ncurves/a.csv,1.2\ncurves/a.csv,1,5\n"), out,
                false)).hasMessageContaining("row 2");
        assertThatThrownBy(() -> Manifest.read(manifest("file,period\ncurves/a.csv,-3\n"), out, false))
                .hasMessageContaining("row 1 (line 2), column 'period'").hasMessageContaining("'-3' is not a period");
        assertThatThrownBy(() -> Manifest.read(manifest("file\ncurves/missing.csv\n"), out, false))
                .hasMessageContaining("row 1 (line 2), column 'file'").hasMessageContaining("no such file");
        assertThatThrownBy(() -> Manifest.read(manifest("file\ncurves/a.csv;\n"), out, false))
                .hasMessageContaining("an empty name between ';'");
        assertThatThrownBy(() -> Manifest.read(manifest("file,label\n"), out, false))
                .hasMessageContaining("the manifest has no rows");
        assertThatThrownBy(() -> Manifest.read(manifest("file,label\ncurves/a.csv,\"two\nlines\"\n"), out, false))
                .hasMessageContaining("column 'label'").hasMessageContaining("control character");
    }
    @Test
    void velocitiesAndNumbersOfTheDimensionsAreReadFromTheirColumns() throws Exception {
        Files.writeString(base.resolve("curves/a-rv1.csv"), "x\n");
        Files.writeString(base.resolve("curves/a-rv2.csv"), "x\n");
        List<BatchTarget> t = Manifest.read(manifest("""
                file,velocities,k1,k1Error,k2,teff1
                curves/a.csv,curves/a-rv1.csv; curves/a-rv2.csv,,,,5800
                curves/b.fits,,61.5,0.4,80.2,
                """), out, false);
        assertThat(t.get(0).velocities()).containsExactly(base.resolve("curves/a-rv1.csv"),
                base.resolve("curves/a-rv2.csv"));
        assertThat(t.get(0).afterFit()).containsExactly(java.util.Map.entry("teff1", 5800.0));
        assertThat(t.get(1).velocities()).isEmpty();
        assertThat(t.get(1).afterFit()).containsEntry("k1", 61.5).containsEntry("k1Error", 0.4)
                .containsEntry("k2", 80.2).hasSize(3);
        assertThat(t.get(1).fingerprint()).isNotEqualTo(Manifest.read(manifest("""
                file,k1,k2
                curves/b.fits,61.5,80.3
                """), out, false).get(0).fingerprint());
        assertThatThrownBy(() -> Manifest.read(manifest("""
                file,k1
                curves/a.csv,fast
                """), out, false)).isInstanceOf(BadInputException.class).hasMessageContaining("column 'k1'")
                .hasMessageContaining("'fast'");
        assertThatThrownBy(() -> Manifest.read(manifest("""
                file,velocities
                curves/a.csv,../secret.csv
                """), out, false)).isInstanceOf(BadInputException.class).hasMessageContaining("velocities")
                .hasMessageContaining("--allow-outside");
    }
}
