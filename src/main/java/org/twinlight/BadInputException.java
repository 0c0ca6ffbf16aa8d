package org.twinlight;

import java.nio.file.Path;

/**
 * Input that twinlight cannot use: a malformed file, a missing column, a value out of range.
 * The message always names where the problem is (file, line or HDU, column or key) and what was
 * expected. Commands turn it into exit code 2 with the message and no stack trace.
 */
public class BadInputException extends RuntimeException {
    private static final long serialVersionUID = 1L;

    public BadInputException(String message) {
        super(message);
    }

    public BadInputException(String message, Throwable cause) {
        super(message, cause);
    }

    /**
     * A message of the form {@code file: where, column 'c': problem}.
     *
     * @param file the input file (may be null when the input is not a file)
     * @param where "line 12", "row 40 of HDU 1", "key 'period'", or null
     * @param column column name or null
     * @param problem what was wrong and what was expected
     */
    public static BadInputException at(Path file, String where, String column, String problem) {
        StringBuilder sb = new StringBuilder();
        if (file != null) {
            sb.append(file);
        }
        if (where != null && !where.isEmpty()) {
            sb.append(sb.length() > 0 ? ": " : "").append(where);
        }
        if (column != null && !column.isEmpty()) {
            sb.append(sb.length() > 0 ? ", " : "").append("column '").append(column).append('\'');
        }
        if (sb.length() > 0) {
            sb.append(": ");
        }
        sb.append(problem);
        return new BadInputException(sb.toString());
    }
}
