package org.twinlight.photometry;

import java.nio.file.Path;

/**
 * Reads a light curve from a delimited text file or a FITS binary table, whichever the file is.
 */
public final class LightCurveReader {

    private LightCurveReader() {
    }

    /**
     * Reads {@code file} with {@code options}.
     *
     * @throws org.twinlight.BadInputException naming the file, row or HDU and column when the
     *     file cannot be used
     */
    public static LightCurve read(Path file, ReadOptions options) {
        return SimpleTextReader.read(file, options);
    }
}
