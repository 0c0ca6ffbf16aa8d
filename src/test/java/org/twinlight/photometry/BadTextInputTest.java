package org.twinlight.photometry;

import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.twinlight.BadInputException;

/** Every unusable text input is a {@link BadInputException} whose message says where and what. */
class BadTextInputTest {

    @TempDir
    Path dir;

    private Path file(String name, String content) throws IOException {
        return TestFiles.text(dir, name, content);
    }

    private static ReadOptions column(String time, String value) {
        return new ReadOptions(time, value, null, null, null, null, null, null, null);
    }

    @Test
    void emptyFile() throws IOException {
        Path p = file("empty.csv", "");
        assertThatThrownBy(() -> LightCurveReader.read(p, ReadOptions.defaults()))
                .isInstanceOf(BadInputException.class).hasMessageContaining("empty.csv").hasMessageContaining("empty");
    }

    @Test
    void onlyComments() throws IOException {
        Path p = file("c.csv", "# nothing here\n\n# still nothing\n");
        assertThatThrownBy(() -> LightCurveReader.read(p, ReadOptions.defaults()))
                .isInstanceOf(BadInputException.class).hasMessageContaining("c.csv").hasMessageContaining("only comments");
    }

    @Test
    void missingFile() {
        Path p = dir.resolve("absent.csv");
        assertThatThrownBy(() -> LightCurveReader.read(p, ReadOptions.defaults()))
                .isInstanceOf(BadInputException.class).hasMessageContaining("absent.csv")
                .hasMessageContaining("no such file");
    }

    @Test
    void noNumericRows() throws IOException {
        Path p = file("words.csv", "time,flux\nmonday,bright\ntuesday,dim\n");
        assertThatThrownBy(() -> LightCurveReader.read(p, ReadOptions.defaults()))
                .isInstanceOf(BadInputException.class).hasMessageContaining("words.csv")
                .hasMessageContaining("no usable rows").hasMessageContaining("not a number: 2");
    }

    @Test
    void headerWithoutTimeColumnListsTheColumns() throws IOException {
        Path p = file("cols.csv", "when,flux,err\n1,2,3\n");
        assertThatThrownBy(() -> LightCurveReader.read(p, ReadOptions.defaults()))
                .isInstanceOf(BadInputException.class).hasMessageContaining("cols.csv")
                .hasMessageContaining("header line 1").hasMessageContaining("no time column")
                .hasMessageContaining("1 'when', 2 'flux', 3 'err'").hasMessageContaining("--time-column");
    }

    @Test
    void headerWithoutValueColumn() throws IOException {
        Path p = file("cols.csv", "time,brightness\n1,2\n");
        assertThatThrownBy(() -> LightCurveReader.read(p, ReadOptions.defaults()))
                .isInstanceOf(BadInputException.class).hasMessageContaining("no flux or magnitude column")
                .hasMessageContaining("'brightness'");
    }

    @Test
    void namedColumnThatDoesNotExist() throws IOException {
        Path p = file("cols.csv", "time,flux\n1,2\n");
        assertThatThrownBy(() -> LightCurveReader.read(p, column(null, "counts")))
                .isInstanceOf(BadInputException.class).hasMessageContaining("cols.csv")
                .hasMessageContaining("column 'counts'").hasMessageContaining("--value-column")
                .hasMessageContaining("1 'time', 2 'flux'");
    }

    @Test
    void numberedColumnBeyondTheTable() throws IOException {
        Path p = file("cols.txt", "1 2\n3 4\n");
        assertThatThrownBy(() -> LightCurveReader.read(p, column("1", "5")))
                .isInstanceOf(BadInputException.class).hasMessageContaining("cols.txt")
                .hasMessageContaining("column 5 does not exist").hasMessageContaining("2 columns");
    }

    @Test
    void namedColumnWithoutHeader() throws IOException {
        Path p = file("cols.txt", "1 2\n3 4\n");
        assertThatThrownBy(() -> LightCurveReader.read(p, column("time", null)))
                .isInstanceOf(BadInputException.class).hasMessageContaining("no header row");
    }

    @Test
    void sameColumnTwice() throws IOException {
        Path p = file("cols.csv", "time,flux\n1,2\n");
        assertThatThrownBy(() -> LightCurveReader.read(p, column("1", "time")))
                .isInstanceOf(BadInputException.class).hasMessageContaining("as time and as value");
    }

    @Test
    void unsortedTimesNameTheLinesAndColumn() throws IOException {
        Path p = file("unsorted.csv", "# comment\ntime,flux\n1.0,1\n2.0,1\n1.5,1\n3.0,1\n");
        assertThatThrownBy(() -> LightCurveReader.read(p, ReadOptions.defaults()))
                .isInstanceOf(BadInputException.class).hasMessageContaining("unsorted.csv")
                .hasMessageContaining("lines 4 and 5").hasMessageContaining("column 'time'")
                .hasMessageContaining("1.5 follows 2.0").hasMessageContaining("not strictly increasing");
    }

    @Test
    void duplicateTimesAreNamed() throws IOException {
        Path p = file("dup.txt", "1 1\n2 1\n2 1.1\n3 1\n3 1\n");
        assertThatThrownBy(() -> LightCurveReader.read(p, ReadOptions.defaults()))
                .isInstanceOf(BadInputException.class).hasMessageContaining("dup.txt")
                .hasMessageContaining("lines 2 and 3").hasMessageContaining("duplicate time 2.0")
                .hasMessageContaining("2 places in all");
    }

    @Test
    void binaryFileThatIsNotFits() throws IOException {
        Path p = dir.resolve("blob.bin");
        Files.write(p, new byte[] {1, 2, 0, 4, 5});
        assertThatThrownBy(() -> LightCurveReader.read(p, ReadOptions.defaults()))
                .isInstanceOf(BadInputException.class).hasMessageContaining("blob.bin")
                .hasMessageContaining("binary file that is not FITS");
    }

    @Test
    void bandWithoutUsableRowsIsNamed() throws IOException {
        Path p = file("bands.csv", "time,band,mag\n1,V,10\n2,I,99.999\n3,V,10.1\n4,I,99.999\n");
        assertThatThrownBy(() -> LightCurveReader.readBands(p, ReadOptions.defaults()))
                .isInstanceOf(BadInputException.class).hasMessageContaining("bands.csv")
                .hasMessageContaining("column 'band'").hasMessageContaining("band 'I' has no usable rows")
                .hasMessageContaining("magnitude out of range: 2");
    }

    @Test
    void hduOptionOnTextIsRefused() throws IOException {
        Path p = file("lc.csv", "time,flux\n1,1\n");
        assertThatThrownBy(() -> LightCurveReader.read(p, new ReadOptions(null, null, null, null, null, null, null,
                null, 1))).isInstanceOf(BadInputException.class).hasMessageContaining("lc.csv")
                .hasMessageContaining("--hdu applies to FITS files");
    }
}
