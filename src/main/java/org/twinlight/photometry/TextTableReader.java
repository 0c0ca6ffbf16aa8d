package org.twinlight.photometry;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.ArrayList;
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
 * The file is read line by line ({@link TextLines}: UTF-8, ISO-8859-1 when it is not valid UTF-8,
 * or UTF-16), so memory grows with the number of rows kept, not with the file. Values read as
 * flux are checked by {@link ValueCheck}. The file is never changed.
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
        return TextLines.read(file, lines -> readTable(file, options, lines));
    }

    /**
     * Reads one column of numbers, as the {@code time} command needs: chosen by {@code choice} (a
     * header name or 1-based number), else the column the header names as the time, else the
     * first column holding a number in the first data row. Every data row must hold a number
     * there; the rows that do not are named in the error.
     */
    static TextColumn readColumn(Path file, String choice) {
        return TextLines.read(file, lines -> column(file, choice, lines));
    }

    /** The first lines of a file, up to the first {@value #DELIMITER_SAMPLE_LINES} + 1 data lines. */
    private record Prelude(List<String> lines, List<Integer> data, boolean complete) {
    }

    /** Delimiter, decimal mark and header of a table, found from its first lines. */
    private record Layout(char delimiter, boolean decimalComma, List<String> header, String where, int firstData,
            int width) {
        List<String> fields(String line) {
            return split(stripComment(line), delimiter);
        }
    }

    private static Prelude prelude(TextLines src) throws IOException {
        List<String> lines = new ArrayList<>();
        List<Integer> data = new ArrayList<>();
        while (data.size() <= DELIMITER_SAMPLE_LINES) {
            String line = src.next();
            if (line == null) {
                return new Prelude(lines, data, true);
            }
            lines.add(line);
            if (!stripComment(line).trim().isEmpty()) {
                data.add(lines.size() - 1);
            }
        }
        return new Prelude(lines, data, false);
    }

    private static Layout layout(Path file, Prelude p, ReadOptions options) {
        List<String> lines = p.lines();
        List<Integer> dataLines = p.data();
        char delimiter = detectDelimiter(lines, dataLines);
        boolean decimalComma = delimiter != ',';
        List<String> first = split(stripComment(lines.get(dataLines.get(0))), delimiter);
        List<String> second = dataLines.size() > 1 ? split(stripComment(lines.get(dataLines.get(1))), delimiter) : null;
        List<String> header = null;
        int firstData = 0;
        String where = null;
        if (isHeader(first, second, decimalComma)) {
            header = first;
            int headerLine = dataLines.get(0);
            firstData = 1;
            where = "header line " + (headerLine + 1);
            if (dataLines.size() == 1) {
                throw BadInputException.at(file, "line " + (headerLine + 1), null, "a header row and no data rows "
                        + "after it; expected rows of time, flux or magnitude and optional error");
            }
        }
        int width = header != null ? header.size() : first.size();
        if (header == null) {
            List<String> commented = commentHeader(lines, dataLines.get(0), delimiter, width, decimalComma, file,
                    options);
            if (commented != null) {
                header = commented;
                where = "comment header";
            }
        }
        if (header == null && delimiter == ',') {
            refuseDecimalCommasInCommaFields(file, lines, dataLines);
        }
        return new Layout(delimiter, decimalComma, header, where, firstData, width);
    }

    /**
     * A comma-separated file without a header whose numbers hold no decimal point and whose rows
     * all have an even number of fields (at least four) is most likely written with a decimal
     * comma ({@code 2460570,301,11,83}): the fields cannot be told apart, so it is refused.
     */
    private static void refuseDecimalCommasInCommaFields(Path file, List<String> lines, List<Integer> dataLines) {
        for (int idx : dataLines) {
            String t = stripComment(lines.get(idx));
            int n = split(t, ',').size();
            if (t.indexOf('.') >= 0 || n < 4 || n % 2 != 0) {
                return;
            }
        }
        int line = dataLines.get(0) + 1;
        throw BadInputException.at(file, "line " + line, null, "the numbers hold no decimal point and every row has "
                + "an even number of comma-separated fields: the file looks written with decimal commas, which "
                + "cannot be told apart from the commas between the fields. Separate the fields with semicolons "
                + "or tabs, or write decimal points");
    }

    private static Map<String, LightCurve> readTable(Path file, ReadOptions options, TextLines src)
            throws IOException {
        Prelude p = prelude(src);
        List<String> lines = p.lines();
        if (p.data().isEmpty()) {
            throw BadInputException.at(file, null, null, lines.stream().allMatch(String::isBlank)
                    ? "the file is empty; expected rows of time, flux or magnitude and optional error"
                    : "the file holds only comments and blank lines; expected rows of time, flux or magnitude "
                            + "and optional error");
        }
        Layout layout = layout(file, p, options);
        List<String> header = layout.header();
        ColumnChoice columns = ColumnChoice.choose(file, layout.where(), header, layout.width(), options, true);

        String timeName = ColumnChoice.label(header, columns.time());
        String valueName = ColumnChoice.label(header, columns.value());
        ValueKind kind = options.valueKind() != null ? options.valueKind()
                : header != null && ColumnChoice.normalise(valueName).contains("mag") ? ValueKind.MAGNITUDE
                        : ValueKind.FLUX;
        TimeScale declared = declaredTimeScale(file, lines, p.data().get(0));
        if (declared == null) {
            declared = header == null ? TimeScale.UNKNOWN : TimeScale.parse(timeName).orElse(TimeScale.UNKNOWN);
        }
        TimeScale scale = options.timeScale() != null ? options.timeScale() : declared;
        List<String> notes = new ArrayList<>(LightCurveReader.overrideNotes(declared, options.timeScale()));
        if (!src.charset().equals(java.nio.charset.StandardCharsets.UTF_8)
                && !src.charset().equals(java.nio.charset.StandardCharsets.ISO_8859_1)) {
            notes.add("the file is UTF-16 text and was read as such");
        }
        String bandName = ColumnChoice.label(header, columns.band());
        int airmass = ColumnChoice.airmassColumn(header);
        RowCollector rows = new RowCollector(file, RowPlace.TEXT_LINE, timeName, bandName, kind, columns.error() >= 0,
                airmass >= 0 ? header.get(airmass) : null);
        int need = Math.max(columns.widest(), airmass);
        for (int k = layout.firstData(); k < p.data().size(); k++) {
            int index = p.data().get(k);
            readRow(file, layout, rows, index + 1, layout.fields(lines.get(index)), need, columns, airmass);
        }
        String line;
        while ((line = src.next()) != null) {
            String t = stripComment(line);
            if (!t.isBlank()) {
                readRow(file, layout, rows, src.lineNumber(), split(t, layout.delimiter()), need, columns, airmass);
            }
        }
        double offset = options.timeOffsetDays() == null ? 0.0 : options.timeOffsetDays();
        Map<String, LightCurve> curves = rows.build(file.getFileName().toString(), null, scale,
                DoubleUnaryOperator.identity(), offset);
        notes.addAll(ValueCheck.check(file, valueName, kind, options.valueKind() != null, curves));
        return LightCurveReader.withNotes(curves, notes);
    }

    private static TextColumn column(Path file, String choice, TextLines src) throws IOException {
        Prelude p = prelude(src);
        if (p.data().isEmpty()) {
            throw BadInputException.at(file, null, null, "no times found (only comments, blank lines or a header)");
        }
        Layout layout = layout(file, p, ReadOptions.defaults());
        List<String> header = layout.header();
        List<String> firstRow = layout.fields(p.lines().get(p.data().get(layout.firstData())));
        int index = -1;
        if (choice != null && !choice.isBlank()) {
            index = ColumnChoice.resolve(file, layout.where(), header, layout.width(), choice, "--column");
        } else if (header != null) {
            index = ColumnChoice.timeColumn(header);
        }
        if (index < 0) {
            for (int c = 0; c < firstRow.size() && index < 0; c++) {
                if (!isNotANumber(firstRow.get(c), layout.decimalComma())) {
                    index = c;
                }
            }
            if (index < 0) {
                throw BadInputException.at(file, "line " + (p.data().get(layout.firstData()) + 1), null,
                        "no numeric column in the first data row; choose the time column with --column NAME|N");
            }
        }
        String name = header != null && index < header.size() ? header.get(index) : "column " + (index + 1);
        TextColumn.Builder out = new TextColumn.Builder(name);
        List<Integer> bad = new ArrayList<>();
        for (int k = layout.firstData(); k < p.data().size(); k++) {
            int i = p.data().get(k);
            List<String> f = layout.fields(p.lines().get(i));
            checkFieldCount(file, layout, i + 1, f);
            columnValue(out, bad, i + 1, f, index, layout.decimalComma());
        }
        String line;
        while ((line = src.next()) != null) {
            String t = stripComment(line);
            if (!t.isBlank()) {
                List<String> f = split(t, layout.delimiter());
                checkFieldCount(file, layout, src.lineNumber(), f);
                columnValue(out, bad, src.lineNumber(), f, index, layout.decimalComma());
            }
        }
        if (!bad.isEmpty()) {
            throw BadInputException.at(file, describeLines(bad, out.badCount()), name,
                    "expected a time (a decimal number)");
        }
        return out.build();
    }

    private static void columnValue(TextColumn.Builder out, List<Integer> bad, int lineNumber, List<String> f,
            int index, boolean decimalComma) {
        String text = index < f.size() ? f.get(index) : "";
        double v = number(text, decimalComma);
        if (!Double.isFinite(v)) {
            out.countBad();
            if (bad.size() < LINES_LISTED) {
                bad.add(lineNumber);
            }
            return;
        }
        out.add(lineNumber, text, v);
    }

    private static final int LINES_LISTED = 5;

    private static String describeLines(List<Integer> lines, int total) {
        StringBuilder sb = new StringBuilder(total == 1 ? "line " : "lines ");
        for (int k = 0; k < lines.size(); k++) {
            sb.append(k > 0 ? ", " : "").append(lines.get(k));
        }
        if (total > lines.size()) {
            sb.append(" and ").append(total - lines.size()).append(" more");
        }
        return sb.toString();
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

    private static void readRow(Path file, Layout layout, RowCollector rows, int lineNumber, List<String> f, int need,
            ColumnChoice c, int airmass) {
        boolean decimalComma = layout.decimalComma();
        checkFieldCount(file, layout, lineNumber, f);
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
        int[] idx = {c.time(), c.value(), c.error(), c.quality(), airmass};
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
        rows.add(lineNumber, band, v[0], v[1], v[2], v[3], v[4]);
    }

    /**
     * Every line of a small text file (a velocity table), read with the same encoding rules as the
     * photometry ({@link TextLines}); photometry itself is read line by line, never whole.
     */
    public static List<String> lines(Path file) {
        return TextLines.read(file, src -> {
            List<String> all = new java.util.ArrayList<>();
            for (String line = src.next(); line != null; line = src.next()) {
                all.add(line);
            }
            return all;
        });
    }

    /** Refuses a row with more fields than the header names (a decimal comma in comma-separated fields). */
    private static void checkFieldCount(Path file, Layout layout, int lineNumber, List<String> f) {
        if (layout.header() != null && filled(f) > layout.header().size()) {
            throw BadInputException.at(file, "line " + lineNumber, null, filled(f) + " fields where the "
                    + layout.where() + " names " + layout.header().size() + " columns"
                    + (layout.delimiter() == ',' ? "; if the numbers are written with a decimal comma, the comma "
                            + "cannot also separate the fields: use semicolons or tabs between them" : ""));
        }
    }

    /** Number of fields up to the last non-empty one (a trailing delimiter adds no field). */
    private static int filled(List<String> f) {
        int n = f.size();
        while (n > 0 && f.get(n - 1).isEmpty()) {
            n--;
        }
        return n;
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

    /**
     * Longest field taken for a number: a double has 17 significant digits, so a field of more
     * than 64 characters is not one (and is not parsed, so a field of megabytes costs nothing).
     */
    private static final int LONGEST_NUMBER = 64;
    /** A Fortran exponent {@code 1.5d-03}; written without nested repetition so it runs in linear time. */
    private static final java.util.regex.Pattern FORTRAN_EXPONENT =
            java.util.regex.Pattern.compile("[+-]?(?:\\d+(?:\\.\\d*)?|\\.\\d+)d[+-]?\\d+");

    /** The number {@code s} spells, or NaN when it spells none (or spells NaN). */
    public static double number(String s, boolean decimalComma) {
        String t = s.trim();
        if (t.length() > LONGEST_NUMBER) {
            return Double.NaN;
        }
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
        if (FORTRAN_EXPONENT.matcher(u).matches()) {
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
