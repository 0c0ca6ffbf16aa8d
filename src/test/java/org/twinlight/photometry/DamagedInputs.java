package org.twinlight.photometry;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Random;

/**
 * Damaged and unusual versions of a small good light curve, for the fuzz tests of the readers
 * and commands and their benchmark-sized run: a FITS table truncated at every header card, block
 * and row boundary; bytes flipped at random; random bytes; the same table in every text
 * encoding and locale format; huge fields.
 */
public final class DamagedInputs {
    /** Times, fluxes and errors of the good curve. */
    public final double[] time;
    public final double[] flux;
    public final double[] error;

    public DamagedInputs(int rows) {
        time = new double[rows];
        flux = new double[rows];
        error = new double[rows];
        for (int i = 0; i < rows; i++) {
            time[i] = 2460100.25 + i * 0.01;
            flux[i] = 1.0 - (i % 17 == 5 ? 0.2 : 0.0) + 1e-4 * ((i * 7919) % 13);
            error[i] = 0.001;
        }
    }

    /** The good table as text with the given field separator and decimal mark, one header row. */
    public String text(String separator, char decimalMark) {
        StringBuilder sb = new StringBuilder("# synthetic light curve of a fictional system, ° in a comment\n");
        sb.append(String.join(separator, "time", "flux", "flux_err")).append('\n');
        for (int i = 0; i < time.length; i++) {
            sb.append(String.join(separator, number(time[i], decimalMark), number(flux[i], decimalMark),
                    number(error[i], decimalMark))).append('\n');
        }
        return sb.toString();
    }

    private static String number(double v, char mark) {
        return String.format(Locale.ROOT, "%.6f", v).replace('.', mark);
    }

    /** The good table as a FITS binary table with barycentric time keywords. */
    public byte[] fits(Path scratch) throws IOException {
        Path p = scratch.resolve("good-" + System.nanoTime() + ".fits");
        double[] rel = new double[time.length];
        for (int i = 0; i < time.length; i++) {
            rel[i] = time[i] - 2460000.0;
        }
        new FitsFixture().table(new FitsFixture.Table().column("TIME", rel).column("FLUX", flux.clone())
                .column("FLUX_ERR", error.clone()).key("TIMESYS", "TDB").key("TREFPOS", "BARYCENTER")
                .key("TIMEUNIT", "d").key("JDREFI", 2460000).key("JDREFF", 0.0)).write(p);
        byte[] b = Files.readAllBytes(p);
        Files.delete(p);
        return b;
    }

    /**
     * Lengths at which to cut a FITS file: 0 to 10 bytes, every header card (80 bytes) and one
     * byte either side, every 2880-byte block, and every row of the table and one byte either side.
     */
    public static List<Integer> fitsCuts(byte[] fits, int rowBytes) {
        List<Integer> cuts = new ArrayList<>();
        for (int i = 0; i <= 10; i++) {
            cuts.add(i);
        }
        int dataStart = dataStart(fits);
        for (int at = 80; at < fits.length; at += 80) {
            if (at <= dataStart) {
                cuts.add(at - 1);
                cuts.add(at);
                cuts.add(at + 1);
            }
        }
        for (int at = dataStart; at < fits.length; at += rowBytes) {
            cuts.add(at - 1);
            cuts.add(at);
            cuts.add(at + 1);
        }
        for (int at = 2880; at < fits.length; at += 2880) {
            cuts.add(at);
        }
        return cuts.stream().filter(c -> c >= 0 && c < fits.length).distinct().sorted().toList();
    }

    /** Byte offset where the data of the last HDU start (after its END card's block). */
    static int dataStart(byte[] fits) {
        int lastEnd = 0;
        for (int at = 0; at + 80 <= fits.length; at += 80) {
            String card = new String(fits, at, 80, StandardCharsets.US_ASCII);
            if (card.startsWith("END     ")) {
                lastEnd = at;
            }
        }
        return (lastEnd / 2880 + 1) * 2880;
    }

    /** {@code original} with {@code flips} bytes set to random values at random places. */
    public static byte[] flipped(byte[] original, Random random, int flips) {
        byte[] b = original.clone();
        for (int k = 0; k < flips; k++) {
            b[random.nextInt(b.length)] = (byte) random.nextInt(256);
        }
        return b;
    }

    /** {@code n} random bytes. */
    public static byte[] randomBytes(Random random, int n) {
        byte[] b = new byte[n];
        random.nextBytes(b);
        return b;
    }

    /** The same text in the encodings a photometry file may come in, by name. */
    public static Map<String, byte[]> encodings(String text) {
        Map<String, byte[]> m = new LinkedHashMap<>();
        m.put("UTF-8", text.getBytes(StandardCharsets.UTF_8));
        m.put("UTF-8 with byte-order mark", concat(new byte[] {(byte) 0xEF, (byte) 0xBB, (byte) 0xBF},
                text.getBytes(StandardCharsets.UTF_8)));
        m.put("ISO-8859-1", text.getBytes(StandardCharsets.ISO_8859_1));
        m.put("UTF-16 (big-endian with mark)", text.getBytes(StandardCharsets.UTF_16));
        m.put("UTF-16LE with mark", concat(new byte[] {(byte) 0xFF, (byte) 0xFE},
                text.getBytes(StandardCharsets.UTF_16LE)));
        m.put("UTF-16LE without mark", text.getBytes(StandardCharsets.UTF_16LE));
        m.put("UTF-16BE without mark", text.getBytes(StandardCharsets.UTF_16BE));
        m.put("Windows line ends", text.replace("\n", "\r\n").getBytes(StandardCharsets.UTF_8));
        m.put("old Mac line ends", text.replace("\n", "\r").getBytes(StandardCharsets.UTF_8));
        return m;
    }

    /** The text with one field of {@code n} characters in the middle data row. */
    public String hugeField(int n) {
        String[] lines = text(",", '.').split("\n");
        int row = lines.length / 2;
        lines[row] = lines[row].replaceFirst(",[^,]*,", "," + "9".repeat(n) + "x,");
        return String.join("\n", lines) + "\n";
    }

    static byte[] concat(byte[] a, byte[] b) {
        byte[] c = Arrays.copyOf(a, a.length + b.length);
        System.arraycopy(b, 0, c, a.length, b.length);
        return c;
    }

    /** Writes bytes to a new file in {@code dir}. */
    public static Path write(Path dir, String name, byte[] bytes) throws IOException {
        return Files.write(dir.resolve(name), bytes);
    }
}
