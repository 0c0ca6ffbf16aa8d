package org.twinlight.photometry;

import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.Map;
import java.util.stream.Collectors;
import org.twinlight.BadInputException;

/**
 * Reads a light curve from a delimited text file or a FITS binary table, whichever the file is
 * (a FITS file starts with {@code SIMPLE  =}; gzip-compressed {@code .fits.gz} is read too).
 * The file is never modified. See {@code docs/reading-photometry.md} for the columns, keywords
 * and rejection rules.
 */
public final class LightCurveReader {

    private LightCurveReader() {
    }

    /**
     * Reads {@code file} with {@code options}. A file whose band column holds several bands is
     * refused: read it with {@link #readBands}.
     *
     * @throws org.twinlight.BadInputException naming the file, row or HDU and column when the
     *     file cannot be used
     */
    public static LightCurve read(Path file, ReadOptions options) {
        Map<String, LightCurve> bands = readBands(file, options);
        if (bands.size() > 1) {
            String list = bands.entrySet().stream()
                    .map(e -> e.getKey() + " (" + e.getValue().size() + " points)")
                    .collect(Collectors.joining(", "));
            String column = options.bandColumn();
            throw BadInputException.at(file, null, column, "the file holds " + bands.size() + " bands: " + list
                    + "; a light curve must be one band. Give one file per band (or read it as several bands "
                    + "where the command offers that)");
        }
        return bands.values().iterator().next();
    }

    /**
     * Reads every band of {@code file}: one light curve per value of the band column, in order of
     * first appearance, or a single entry (keyed by the band, or {@code ""} when there is none)
     * when the file has no band column. Times must be strictly increasing within each band.
     *
     * @throws org.twinlight.BadInputException naming the file, row or HDU and column when the
     *     file cannot be used
     */
    public static Map<String, LightCurve> readBands(Path file, ReadOptions options) {
        ReadOptions o = options == null ? ReadOptions.defaults() : options;
        if (Files.isDirectory(file)) {
            throw BadInputException.at(file, null, null, "a directory; expected a photometry file");
        }
        if (isFits(file)) {
            return FitsTableReader.read(file, o);
        }
        return TextTableReader.read(file, o);
    }

    /** Whether the file starts like a FITS file; a missing or unreadable file is bad input. */
    private static boolean isFits(Path file) {
        byte[] head;
        try (InputStream in = Files.newInputStream(file)) {
            head = in.readNBytes(16);
        } catch (NoSuchFileException e) {
            throw BadInputException.at(file, null, null, "no such file");
        } catch (java.nio.file.AccessDeniedException e) {
            throw BadInputException.at(file, null, null, "cannot read the file: permission denied");
        } catch (IOException e) {
            throw BadInputException.at(file, null, null, "cannot read the file (" + e.getMessage() + ")");
        }
        return FitsTableReader.looksLikeFits(head, file.getFileName().toString());
    }

    /**
     * Reads one column of numbers from a delimited text file by the same rules as {@link #read}
     * (delimiter, decimal comma, header, byte-order mark, encoding), for commands that need a
     * column of times only.
     *
     * @param choice header name or 1-based number of the column; null for the column the header
     *     names as the time, else the first column holding a number in the first data row
     * @throws org.twinlight.BadInputException naming the file, the lines and the column when a row
     *     holds no number there, or the column does not exist
     */
    public static TextColumn readColumn(Path file, String choice) {
        if (!Files.isDirectory(file) && isFits(file)) {
            throw BadInputException.at(file, null, null, "a FITS file; this command reads a column of times from "
                    + "delimited text");
        }
        return TextTableReader.readColumn(file, choice);
    }

    /**
     * Index (0-based) of the column that a header row names as the time, by the same names the
     * readers detect (time, bjd, hjd, jd, mjd, btjd, ..., or a scale label such as BJD_TDB), or −1.
     */
    public static int timeColumnIndex(java.util.List<String> header) {
        return ColumnChoice.timeColumn(header);
    }

    /** The remark made when an option overrides the time scale a file declares itself; none when they agree. */
    public static java.util.List<String> overrideNotes(org.twinlight.time.TimeScale declared,
            org.twinlight.time.TimeScale option) {
        if (option == null || declared == null || !declared.isKnown() || declared.equals(option)) {
            return java.util.List.of();
        }
        return java.util.List.of("the file declares its times as " + declared.label() + ", but --time-scale "
                + option.label() + " was given and is used");
    }

    /** Every light curve of a map with the remarks added. */
    static java.util.Map<String, LightCurve> withNotes(java.util.Map<String, LightCurve> curves,
            java.util.List<String> notes) {
        if (notes.isEmpty()) {
            return curves;
        }
        java.util.Map<String, LightCurve> out = new java.util.LinkedHashMap<>();
        curves.forEach((band, lc) -> out.put(band, lc.withNotes(notes)));
        return out;
    }
}
