package org.twinlight.photometry;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.function.DoubleUnaryOperator;
import org.twinlight.BadInputException;
import org.twinlight.time.TimeScale;

/**
 * Reads photometry from delimited text.
 *
 * <ul>
 *   <li>Delimiter: tab, semicolon or comma when the first line and at least 80 % of the first 50
 *       lines split into two or more fields on it (tried in that order), else white space.</li>
 *   <li>{@code #} starts a comment, on its own line or after the data. Blank lines are skipped.
 *       A comment {@code # time scale: LABEL} before the data declares the time scale (unless
 *       {@code --time-scale} is given).</li>
 *   <li>Header: the first non-comment line is a header when none of its fields is a number, or
 *       when one of them is not a number where the next line has a number.
 *       Without one, the last comment line before the data is taken as the header when it has
 *       as many fields as the data, none of them numbers, and names a time and a value column
 *       ({@code # time flux err}). With no header at all the columns are time, value and, when
 *       there are three or more, error.</li>
 *   <li>Numbers: Java decimal syntax; {@code nan}, {@code inf}, {@code -inf} in any case; a
 *       Fortran exponent {@code 1.5D-03}; a decimal comma ({@code 0,9871}) when the delimiter
 *       is not a comma.</li>
 * </ul>
 *
 * The file is read as UTF-8, or as ISO-8859-1 when it is not valid UTF-8. It is never changed.
 */
public final class TextTableReader {

    private static final int DELIMITER_SAMPLE_LINES = 50;

    private TextTableReader() {
    }

    /** Reads every band of {@code file}. */
    static Map<String, LightCurve> read(Path file, ReadOptions options) {
        if (options.hdu() != null) {
            throw BadInputException.at(file, null, null, "option --hdu applies to FITS files; this file is read as "
                    + "delimited text (it does not start with 'SIMPLE  =')");
        }
        List<String> lines = lines(file);
        List<Integer> dataLines = new ArrayList<>();
        for (int i = 0; i < lines.size(); i++) {
            String t = stripComment(lines.get(i)).trim();
            if (!t.isEmpty()) {
                dataLines.add(i);
            }
        }
        if (dataLines.isEmpty()) {
            throw BadInputException.at(file, null, null, lines.stream().allMatch(String::isBlank)
                    ? "the file is empty; expected rows of time, flux or magnitude and optional error"
                    : "the file holds only comments and blank lines; expected rows of time, flux or magnitude "
                            + "and optional error");
        }
        char delimiter = detectDelimiter(lines, dataLines);
        boolean decimalComma = delimiter != ',';

        List<String> first = split(stripComment(lines.get(dataLines.get(0))), delimiter);
        List<String> second = dataLines.size() > 1 ? split(stripComment(lines.get(dataLines.get(1))), delimiter) : null;
        List<String> header = null;
        int headerLine = -1;
        if (isHeader(first, second, decimalComma)) {
            header = first;
            headerLine = dataLines.get(0);
            dataLines.remove(0);
            if (dataLines.isEmpty()) {
                throw BadInputException.at(file, "line " + (headerLine + 1), null, "a header row and no data rows "
                        + "after it; expected rows of time, flux or magnitude and optional error");
            }
        }
        int width = header != null ? header.size() : first.size();
        ColumnChoice columns;
        if (header == null) {
            List<String> commented = commentHeader(lines, dataLines.get(0), delimiter, width, decimalComma, file,
                    options);
            if (commented != null) {
                header = commented;
            }
        }
        String where = header == null ? null : headerLine >= 0 ? "header line " + (headerLine + 1) : "comment header";
        columns = ColumnChoice.choose(file, where, header, width, options, true);

        String timeName = ColumnChoice.label(header, columns.time());
        String valueName = ColumnChoice.label(header, columns.value());
        ValueKind kind = options.valueKind() != null ? options.valueKind()
                : header != null && ColumnChoice.normalise(valueName).contains("mag") ? ValueKind.MAGNITUDE
                        : ValueKind.FLUX;
        TimeScale declared = declaredTimeScale(file, lines, dataLines.get(0));
        if (declared == null) {
            declared = header == null ? TimeScale.UNKNOWN : TimeScale.parse(timeName).orElse(TimeScale.UNKNOWN);
        }
        TimeScale scale = options.timeScale() != null ? options.timeScale() : declared;
        List<String> notes = LightCurveReader.overrideNotes(declared, options.timeScale());
        String bandName = ColumnChoice.label(header, columns.band());
        RowCollector rows = new RowCollector(file, RowPlace.TEXT_LINE, timeName, bandName, kind, columns.error() >= 0);
        int need = columns.widest();
        for (int index : dataLines) {
            List<String> f = split(stripComment(lines.get(index)), delimiter);
            readRow(rows, index + 1, f, need, columns, decimalComma);
        }
        double offset = options.timeOffsetDays() == null ? 0.0 : options.timeOffsetDays();
        Map<String, LightCurve> curves = rows.build(file.getFileName().toString(), null, scale,
                DoubleUnaryOperator.identity(), offset);
        if (options.valueKind() == null && kind == ValueKind.FLUX) {
            notes = new ArrayList<>(notes);
            notes.addAll(magnitudeLookalike(curves));
        }
        return LightCurveReader.withNotes(curves, notes);
    }

    /**
     * A remark when values read as flux look like magnitudes: all between 3 and 30 with a spread of
     * under 2 (typical magnitudes of variable stars; common practice, no source).
     */
    private static List<String> magnitudeLookalike(Map<String, LightCurve> curves) {
        for (LightCurve lc : curves.values()) {
            double[] f = lc.fluxes();
            double lo = Arrays.stream(f).min().orElse(0);
            double hi = Arrays.stream(f).max().orElse(0);
            if (lo >= 3 && hi <= 30 && hi - lo < 2) {
                return List.of(String.format(Locale.ROOT, "the values (%.3f to %.3f) were read as flux but "
                        + "look like magnitudes; if they are, give --values magnitude", lo, hi));
            }
        }
        return List.of();
    }

    private static final java.util.regex.Pattern TIME_SCALE_COMMENT =
            java.util.regex.Pattern.compile("^\\s*#\\s*time[ _-]?scale\\s*[:=]\\s*(\\S+)",
                    java.util.regex.Pattern.CASE_INSENSITIVE);

    /**
     * The scale declared by a comment line {@code # time scale: BJD_TDB} before the data (as
     * twinlight's own CSV files carry), or null when there is none.
     */
    public static TimeScale declaredTimeScale(Path file, List<String> lines, int firstData) {
        for (int i = 0; i < firstData; i++) {
            java.util.regex.Matcher m = TIME_SCALE_COMMENT.matcher(lines.get(i));
            if (m.find()) {
                String label = m.group(1).replaceAll("[;,.]+$", "");
                int line = i + 1;
                return TimeScale.parse(label).orElseThrow(() -> BadInputException.at(file, "line " + line, null,
                        "unknown time scale '" + label + "' in the comment; expected one of "
                                + TimeScale.acceptedLabels()));
            }
        }
        return null;
    }

    private static void readRow(RowCollector rows, int lineNumber, List<String> f, int need, ColumnChoice c,
            boolean decimalComma) {
        String band = null;
        if (c.band() >= 0) {
            band = c.band() < f.size() ? f.get(c.band()) : "";
            if (band.isEmpty()) {
                rows.reject(null, RowRejection.MISSING_FIELD);
                return;
            }
        }
        if (f.size() <= need) {
            rows.reject(band, RowRejection.MISSING_FIELD);
            return;
        }
        int[] idx = {c.time(), c.value(), c.error(), c.quality()};
        double[] v = new double[idx.length];
        for (int k = 0; k < idx.length; k++) {
            if (idx[k] < 0) {
                v[k] = k == 3 ? 0.0 : Double.NaN;
                continue;
            }
            String s = f.get(idx[k]);
            if (s.isEmpty()) {
                rows.reject(band, RowRejection.MISSING_FIELD);
                return;
            }
            v[k] = number(s, decimalComma);
            if (Double.isNaN(v[k]) && !isNanToken(s)) {
                rows.reject(band, RowRejection.NOT_A_NUMBER);
                return;
            }
        }
        rows.add(lineNumber, band, v[0], v[1], v[2], v[3]);
    }

    public static List<String> lines(Path file) {
        byte[] bytes;
        try {
            bytes = Files.readAllBytes(file);
        } catch (NoSuchFileException e) {
            throw BadInputException.at(file, null, null, "no such file");
        } catch (IOException e) {
            throw BadInputException.at(file, null, null, "cannot read the file (" + e.getMessage() + ")");
        }
        for (int i = 0; i < Math.min(bytes.length, 4096); i++) {
            if (bytes[i] == 0) {
                throw BadInputException.at(file, null, null, "a binary file that is not FITS; expected delimited "
                        + "text or a FITS binary table");
            }
        }
        String text;
        try {
            text = StandardCharsets.UTF_8.newDecoder().onMalformedInput(CodingErrorAction.REPORT)
                    .onUnmappableCharacter(CodingErrorAction.REPORT).decode(ByteBuffer.wrap(bytes)).toString();
        } catch (CharacterCodingException e) {
            text = new String(bytes, StandardCharsets.ISO_8859_1);
        }
        if (text.startsWith("\uFEFF")) {
            text = text.substring(1);
        }
        return Arrays.asList(text.split("\r\n|\r|\n", -1));
    }

    public static String stripComment(String line) {
        int hash = line.indexOf('#');
        return hash >= 0 ? line.substring(0, hash) : line;
    }

    public static char detectDelimiter(List<String> lines, List<Integer> dataLines) {
        int n = Math.min(dataLines.size(), DELIMITER_SAMPLE_LINES);
        for (char d : new char[] {'\t', ';', ','}) {
            // the first line (perhaps the header) must split, and most of the others: a short or broken
            // row must not turn a comma file into a white-space one (it is reported as a missing field)
            int splitting = 0;
            for (int k = 0; k < n; k++) {
                if (split(stripComment(lines.get(dataLines.get(k))), d).size() >= 2) {
                    splitting++;
                } else if (k == 0) {
                    splitting = Integer.MIN_VALUE;
                }
            }
            if (splitting >= Math.max(1, Math.ceil(0.8 * n))) {
                return d;
            }
        }
        return ' ';
    }

    /** Splits on {@code delimiter} ({@code ' '} = runs of white space), trims and unquotes the fields. */
    public static List<String> split(String line, char delimiter) {
        List<String> out = new ArrayList<>();
        int n = line.length();
        if (delimiter == ' ') {
            int i = 0;
            while (i < n) {
                while (i < n && Character.isWhitespace(line.charAt(i))) {
                    i++;
                }
                int start = i;
                while (i < n && !Character.isWhitespace(line.charAt(i))) {
                    i++;
                }
                if (i > start) {
                    out.add(unquote(line.substring(start, i)));
                }
            }
            return out;
        }
        String t = line.trim();
        int start = 0;
        while (true) {
            int end = t.indexOf(delimiter, start);
            if (end < 0) {
                out.add(unquote(t.substring(start).trim()));
                return out;
            }
            out.add(unquote(t.substring(start, end).trim()));
            start = end + 1;
        }
    }

    private static String unquote(String s) {
        if (s.length() >= 2 && (s.charAt(0) == '"' || s.charAt(0) == '\'') && s.charAt(s.length() - 1) == s.charAt(0)) {
            return s.substring(1, s.length() - 1).trim();
        }
        return s;
    }

    private static boolean isHeader(List<String> first, List<String> second, boolean decimalComma) {
        if (first.stream().allMatch(f -> !f.isEmpty() && isNotANumber(f, decimalComma))) {
            return true;
        }
        for (int j = 0; j < first.size(); j++) {
            boolean text = !first.get(j).isEmpty() && isNotANumber(first.get(j), decimalComma);
            if (text && (second == null || (j < second.size() && !isNotANumber(second.get(j), decimalComma)))) {
                return true;
            }
        }
        return false;
    }

    private static List<String> commentHeader(List<String> lines, int firstData, char delimiter, int width,
            boolean decimalComma, Path file, ReadOptions options) {
        for (int i = firstData - 1; i >= 0; i--) {
            String t = lines.get(i).trim();
            if (t.isEmpty()) {
                continue;
            }
            if (!t.startsWith("#")) {
                return null;
            }
            String body = t.replaceFirst("^#+", "");
            for (char d : new char[] {delimiter, ' '}) {
                List<String> f = split(body, d);
                if (f.size() == width && f.stream().allMatch(s -> !s.isEmpty() && isNotANumber(s, decimalComma))
                        && namesTimeAndValue(f, width, file, options)) {
                    return f;
                }
            }
            return null;
        }
        return null;
    }

    private static boolean namesTimeAndValue(List<String> names, int width, Path file, ReadOptions options) {
        try {
            ColumnChoice.choose(file, null, names, width, options, false);
            return true;
        } catch (BadInputException e) {
            return false;
        }
    }

    /** True when {@code s} is not a number in any of the accepted spellings. */
    public static boolean isNotANumber(String s, boolean decimalComma) {
        return Double.isNaN(number(s, decimalComma)) && !isNanToken(s);
    }

    public static boolean isNanToken(String s) {
        String t = s.trim().toLowerCase(Locale.ROOT);
        return t.equals("nan") || t.equals("+nan") || t.equals("-nan");
    }

    /** The number {@code s} spells, or NaN when it spells none (or spells NaN). */
    public static double number(String s, boolean decimalComma) {
        String t = s.trim();
        try {
            return Double.parseDouble(t);
        } catch (NumberFormatException e) {
            // fall through to the other spellings
        }
        String lower = t.toLowerCase(Locale.ROOT);
        switch (lower) {
            case "nan", "+nan", "-nan":
                return Double.NaN;
            case "inf", "+inf", "infinity", "+infinity":
                return Double.POSITIVE_INFINITY;
            case "-inf", "-infinity":
                return Double.NEGATIVE_INFINITY;
            default:
                break;
        }
        String u = lower;
        if (decimalComma && u.indexOf(',') >= 0 && u.indexOf('.') < 0 && u.indexOf(',') == u.lastIndexOf(',')) {
            u = u.replace(',', '.');
        }
        if (u.matches("[+-]?(\\d+\\.?\\d*|\\.\\d+)d[+-]?\\d+")) {
            u = u.replace('d', 'e');
        }
        if (u.equals(lower)) {
            return Double.NaN;
        }
        try {
            return Double.parseDouble(u);
        } catch (NumberFormatException e) {
            return Double.NaN;
        }
    }
}
