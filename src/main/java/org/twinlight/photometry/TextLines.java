package org.twinlight.photometry;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.Charset;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.AccessDeniedException;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import org.twinlight.BadInputException;

/**
 * The lines of a text file, read one at a time so that a file of any length is read in memory
 * proportional to its longest line. The encoding is found from the first bytes: UTF-16 (with a
 * byte-order mark, or without one when every second byte is zero) is read as such; otherwise the
 * file is read as UTF-8, and again from the start as ISO-8859-1 when it is not valid UTF-8. A
 * UTF-8 byte-order mark is dropped. Other bytes 0 mean a binary file, which is refused.
 */
final class TextLines implements AutoCloseable {

    /** What is done with the lines; run again from the start if the encoding has to change. */
    @FunctionalInterface
    interface Body<T> {
        T read(TextLines lines) throws IOException;
    }

    private static final int SNIFF_BYTES = 4096;

    private final BufferedReader reader;
    private final Charset charset;
    private int lineNumber;

    private TextLines(BufferedReader reader, Charset charset) {
        this.reader = reader;
        this.charset = charset;
    }

    /**
     * Runs {@code body} over the lines of {@code file} in the encoding the file has.
     *
     * @throws BadInputException when the file is missing, unreadable, a directory or binary
     */
    static <T> T read(Path file, Body<T> body) {
        if (Files.isDirectory(file)) {
            throw BadInputException.at(file, null, null, "a directory; expected a photometry file");
        }
        byte[] head = head(file);
        Charset cs = sniff(file, head);
        try {
            return readAs(file, cs, body, cs.equals(StandardCharsets.UTF_8));
        } catch (CharacterCodingException e) {
            try {
                return readAs(file, StandardCharsets.ISO_8859_1, body, false);
            } catch (IOException again) {
                throw unreadable(file, again);
            }
        } catch (IOException e) {
            throw unreadable(file, e);
        }
    }

    private static <T> T readAs(Path file, Charset cs, Body<T> body, boolean strict) throws IOException {
        InputStream in = Files.newInputStream(file);
        var decoder = cs.newDecoder();
        if (strict) {
            decoder.onMalformedInput(CodingErrorAction.REPORT).onUnmappableCharacter(CodingErrorAction.REPORT);
        } else {
            decoder.onMalformedInput(CodingErrorAction.REPLACE).onUnmappableCharacter(CodingErrorAction.REPLACE);
        }
        try (TextLines lines = new TextLines(new BufferedReader(new InputStreamReader(in, decoder), 1 << 16), cs)) {
            return body.read(lines);
        }
    }

    private static BadInputException unreadable(Path file, IOException e) {
        if (e instanceof NoSuchFileException) {
            return BadInputException.at(file, null, null, "no such file");
        }
        if (e instanceof AccessDeniedException) {
            return BadInputException.at(file, null, null, "cannot read the file: permission denied");
        }
        String m = e.getMessage();
        return BadInputException.at(file, null, null, "cannot read the file ("
                + (m == null || m.isBlank() ? "an input/output error" : m) + ")");
    }

    private static byte[] head(Path file) {
        try (InputStream in = Files.newInputStream(file)) {
            return in.readNBytes(SNIFF_BYTES);
        } catch (IOException e) {
            throw unreadable(file, e);
        }
    }

    /** The encoding of a file that starts with {@code head}; refuses binary files. */
    static Charset sniff(Path file, byte[] head) {
        if (head.length >= 2 && ((head[0] & 0xff) == 0xFE && (head[1] & 0xff) == 0xFF
                || (head[0] & 0xff) == 0xFF && (head[1] & 0xff) == 0xFE)) {
            return StandardCharsets.UTF_16; // reads the byte-order mark
        }
        int zeros = 0;
        int evenZeros = 0;
        int pairs = head.length / 2;
        for (int i = 0; i < head.length; i++) {
            if (head[i] == 0) {
                zeros++;
                if (i % 2 == 0) {
                    evenZeros++;
                }
            }
        }
        if (zeros == 0) {
            return StandardCharsets.UTF_8;
        }
        // UTF-16 text of mostly ASCII characters: one byte of most pairs is zero, always the same one
        if (pairs >= 2 && zeros >= 0.8 * pairs && zeros <= pairs && (evenZeros == 0 || evenZeros == zeros)) {
            return evenZeros == 0 ? StandardCharsets.UTF_16LE : StandardCharsets.UTF_16BE;
        }
        throw BadInputException.at(file, null, null, "a binary file that is not FITS (it holds zero bytes); "
                + "expected delimited text (UTF-8, ISO-8859-1 or UTF-16) or a FITS binary table");
    }

    /** The encoding the lines are read in. */
    Charset charset() {
        return charset;
    }

    /** The next line without its line end, or null at the end of the file. */
    String next() throws IOException {
        String line = reader.readLine();
        if (line == null) {
            return null;
        }
        lineNumber++;
        if (lineNumber == 1 && !line.isEmpty() && line.charAt(0) == '\uFEFF') {
            line = line.substring(1);
        }
        return line;
    }

    /** 1-based number of the line last returned by {@link #next()}. */
    int lineNumber() {
        return lineNumber;
    }

    @Override
    public void close() throws IOException {
        reader.close();
    }
}
