package org.twinlight.cli;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.regex.Pattern;
import org.twinlight.BadInputException;

/**
 * Reads one column of times from a delimited text file (comma, tab, semicolon or white space;
 * {@code #} comments; an optional header row, recognised by a non-numeric field). Every data row
 * must hold a number in the chosen column; bad rows are reported by line number.
 */
final class TimeColumnFile {

    /** One time as read: its 1-based line number, its text as written and its value. */
    record Entry(int line, String text, double value) {
    }

    /** The times of one column and the column's name (header name, or "column N"). */
    record Column(String name, List<Entry> entries) {
    }

    private static final Pattern DELIMITER = Pattern.compile("[,;\\s]+");
    private static final Pattern DECIMAL = Pattern.compile("[+-]?(\\d+\\.?\\d*|\\.\\d+)([eE][+-]?\\d+)?");
    private static final int LINES_LISTED = 5;

    private TimeColumnFile() {
    }

    /**
     * Reads the column chosen by {@code choice} (a header name or a 1-based number; null for the
     * column the header names as the time, else the first column holding a number in the first
     * data row).
     */
    static Column read(Path file, String choice) {
        List<String> lines;
        try {
            lines = Files.readAllLines(file, StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw BadInputException.at(file, null, null, "cannot read the file (" + e.getMessage() + ")");
        }
        String[] header = null;
        int index = -1;
        String name = null;
        List<Entry> entries = new ArrayList<>();
        List<Integer> badLines = new ArrayList<>();
        for (int i = 0; i < lines.size(); i++) {
            String text = lines.get(i).trim();
            if (text.isEmpty() || text.startsWith("#")) {
                continue;
            }
            String[] fields = DELIMITER.split(text);
            int lineNumber = i + 1;
            if (index < 0) {
                if (header == null && entries.isEmpty() && badLines.isEmpty() && !allNumeric(fields)) {
                    header = fields;
                    continue;
                }
                index = chooseColumn(file, lineNumber, choice, header, fields);
                name = header != null && index < header.length ? header[index] : "column " + (index + 1);
            }
            if (index >= fields.length || !DECIMAL.matcher(fields[index]).matches()) {
                badLines.add(lineNumber);
                continue;
            }
            entries.add(new Entry(lineNumber, fields[index], Double.parseDouble(fields[index])));
        }
        if (!badLines.isEmpty()) {
            throw BadInputException.at(file, describeLines(badLines), name, "expected a time (a decimal number)");
        }
        if (entries.isEmpty()) {
            throw BadInputException.at(file, null, name, "no times found (only comments, blank lines or a header)");
        }
        return new Column(name, entries);
    }

    private static boolean allNumeric(String[] fields) {
        for (String f : fields) {
            if (!DECIMAL.matcher(f).matches()) {
                return false;
            }
        }
        return true;
    }

    private static int chooseColumn(Path file, int lineNumber, String choice, String[] header, String[] firstRow) {
        if (choice == null && header != null) {
            int named = org.twinlight.photometry.LightCurveReader.timeColumnIndex(java.util.Arrays.asList(header));
            if (named >= 0) {
                return named;
            }
        }
        if (choice == null) {
            for (int c = 0; c < firstRow.length; c++) {
                if (DECIMAL.matcher(firstRow[c]).matches()) {
                    return c;
                }
            }
            throw BadInputException.at(file, "line " + lineNumber, null,
                    "no numeric column in the first data row; choose the time column with --column NAME|N");
        }
        String c = choice.trim();
        if (c.matches("\\d+")) {
            int n = Integer.parseInt(c);
            if (n < 1) {
                throw new BadInputException("option --column: column numbers start at 1, got " + c);
            }
            return n - 1;
        }
        if (header == null) {
            throw BadInputException.at(file, null, c, "the file has no header row, so columns can only be chosen"
                    + " by number (--column N, 1-based)");
        }
        for (int k = 0; k < header.length; k++) {
            if (header[k].toLowerCase(Locale.ROOT).equals(c.toLowerCase(Locale.ROOT))) {
                return k;
            }
        }
        throw BadInputException.at(file, "header", c, "no such column; the header has " + String.join(", ", header));
    }

    private static String describeLines(List<Integer> lines) {
        StringBuilder sb = new StringBuilder(lines.size() == 1 ? "line " : "lines ");
        for (int k = 0; k < Math.min(lines.size(), LINES_LISTED); k++) {
            sb.append(k > 0 ? ", " : "").append(lines.get(k));
        }
        if (lines.size() > LINES_LISTED) {
            sb.append(" and ").append(lines.size() - LINES_LISTED).append(" more");
        }
        return sb.toString();
    }
}
