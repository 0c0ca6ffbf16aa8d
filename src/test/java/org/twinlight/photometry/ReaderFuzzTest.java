package org.twinlight.photometry;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.Map;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.twinlight.BadInputException;

/**
 * Every damaged or unusual file either reads to the right light curve or is refused with a
 * {@link BadInputException} naming the file (and, for FITS, the HDU); no other exception escapes,
 * no library internals reach the message, and no input is changed. The larger run of the same
 * checks is {@code org.twinlight.bench.FuzzBench}.
 */
class ReaderFuzzTest {
    private static final int ROWS = 40;
    private final DamagedInputs good = new DamagedInputs(ROWS);

    @TempDir
    Path dir;

    /** Reads {@code bytes} as a file: the light curve, or null when refused properly. */
    static LightCurve readOrRefused(Path file, byte[] bytes) {
        LightCurve lc = null;
        try {
            lc = LightCurveReader.read(file, ReadOptions.defaults());
        } catch (BadInputException e) {
            assertThat(e.getMessage()).as("message for %s", file).contains(file.toString())
                    .doesNotContain("Exception").doesNotContain("Cannot invoke").doesNotContain("\tat ")
                    .doesNotContain("nom.tam");
        }
        try {
            assertThat(Files.readAllBytes(file)).as("input unchanged").isEqualTo(bytes);
        } catch (java.io.IOException e) {
            throw new AssertionError(e);
        }
        return lc;
    }

    private void assertTheGoodCurve(LightCurve lc, String what) {
        assertThat(lc.size()).as(what).isEqualTo(ROWS);
        for (int i = 0; i < ROWS; i++) {
            assertThat(lc.time(i)).as(what).isCloseTo(good.time[i], within(1e-9));
            assertThat(lc.flux(i)).as(what).isCloseTo(good.flux[i], within(1e-9));
            assertThat(lc.fluxError(i)).as(what).isCloseTo(good.error[i], within(1e-12));
        }
    }

    @Test
    void aFitsTableCutAtEveryCardBlockAndRowIsRefusedOrReadWhole() throws Exception {
        byte[] fits = good.fits(dir);
        Path whole = DamagedInputs.write(dir, "whole.fits", fits);
        assertTheGoodCurve(readOrRefused(whole, fits), "uncut");
        int refused = 0;
        var cuts = DamagedInputs.fitsCuts(fits, 3 * 8);
        for (int cut : cuts) {
            byte[] part = Arrays.copyOf(fits, cut);
            Path p = DamagedInputs.write(dir, "cut-" + cut + ".fits", part);
            LightCurve lc = readOrRefused(p, part);
            if (lc == null) {
                refused++;
            } else {
                // a cut inside the padding after the last row loses nothing; anything else must be refused
                assertTheGoodCurve(lc, "cut at " + cut);
            }
        }
        assertThat(cuts.size()).isGreaterThan(150);
        assertThat(refused).isGreaterThan(cuts.size() / 2);
    }

    @Test
    void randomlyFlippedBytesNeverLetAnExceptionEscape() throws Exception {
        byte[] fits = good.fits(dir);
        byte[] csv = good.text(",", '.').getBytes(java.nio.charset.StandardCharsets.UTF_8);
        Random random = new Random(11);
        for (int k = 0; k < 150; k++) {
            byte[] f = DamagedInputs.flipped(fits, random, 1 + random.nextInt(4));
            readOrRefused(DamagedInputs.write(dir, "flip-" + k + ".fits", f), f);
            byte[] c = DamagedInputs.flipped(csv, random, 1 + random.nextInt(4));
            readOrRefused(DamagedInputs.write(dir, "flip-" + k + ".csv", c), c);
        }
        for (int k = 0; k < 30; k++) {
            byte[] b = DamagedInputs.randomBytes(random, random.nextInt(5000));
            assertThat(readOrRefused(DamagedInputs.write(dir, "random-" + k + ".dat", b), b)).isNull();
        }
    }

    @Test
    void everyEncodingReadsToTheSameCurve() throws Exception {
        for (Map.Entry<String, byte[]> e : DamagedInputs.encodings(good.text(",", '.')).entrySet()) {
            Path p = DamagedInputs.write(dir, "enc.csv", e.getValue());
            LightCurve lc = readOrRefused(p, e.getValue());
            assertThat(lc).as(e.getKey()).isNotNull();
            assertTheGoodCurve(lc, e.getKey());
        }
    }

    @Test
    void localeFormatsReadToTheSameCurveOrAreRefusedWithTheReason() throws Exception {
        for (String sep : new String[] {"\t", ";", " ", "  "}) {
            for (char mark : new char[] {'.', ','}) {
                byte[] b = good.text(sep, mark).getBytes(java.nio.charset.StandardCharsets.UTF_8);
                LightCurve lc = readOrRefused(DamagedInputs.write(dir, "locale.txt", b), b);
                assertTheGoodCurve(lc, "separator '" + sep + "', decimal " + mark);
            }
        }
        // a decimal comma in comma-separated fields cannot be read: refused naming the field count
        byte[] b = good.text(",", ',').getBytes(java.nio.charset.StandardCharsets.UTF_8);
        Path p = DamagedInputs.write(dir, "comma.csv", b);
        assertThat(readOrRefused(p, b)).isNull();
        try {
            LightCurveReader.read(p, ReadOptions.defaults());
        } catch (BadInputException e) {
            assertThat(e.getMessage()).contains("line 3", "6 fields where the header line 2 names 3 columns",
                    "decimal comma");
        }
    }

    @Test
    void aHugeFieldIsARejectedRowNotAFailure() throws Exception {
        byte[] b = good.hugeField(2_000_000).getBytes(java.nio.charset.StandardCharsets.UTF_8);
        LightCurve lc = readOrRefused(DamagedInputs.write(dir, "huge.csv", b), b);
        assertThat(lc.size()).isEqualTo(ROWS - 1);
        assertThat(lc.rejectedRows()).containsEntry("not a number", 1);
    }

    @Test
    void aDirectoryAnEmptyFileAndAMissingFileAreNamedAsSuch() throws Exception {
        for (Object[] c : new Object[][] {{dir, "a directory"}, {Files.createFile(dir.resolve("empty.csv")),
            "empty"}, {dir.resolve("missing.csv"), "no such file"}}) {
            try {
                LightCurveReader.read((Path) c[0], ReadOptions.defaults());
                throw new AssertionError("read " + c[0]);
            } catch (BadInputException e) {
                assertThat(e.getMessage()).contains((String) c[1]);
            }
        }
    }
}
