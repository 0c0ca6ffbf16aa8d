package org.twinlight.cli;

import java.nio.file.Path;
import java.util.Locale;
import org.twinlight.BadInputException;

/**
 * Checks of option values shared by every command, so the same kind of value is refused with the
 * same words everywhere (exit 2, naming the option and what was expected).
 */
public final class OptionChecks {
    /**
     * Shortest period accepted, days (86 s): the shortest eclipsing binaries known, double white
     * dwarfs, have periods of several minutes (from memory); anything shorter is a typing error.
     */
    public static final double MIN_PERIOD_DAYS = 1e-3;
    /**
     * Longest period accepted, days (about 270 years): the longest-period eclipsing binaries known
     * have periods of decades (from memory); a longer period cannot be measured from photometry.
     */
    public static final double MAX_PERIOD_DAYS = 1e5;
    /**
     * Longest text a FITS header card holds as a string value on one card: 80 characters less the
     * 10 of the keyword and "= " and the 2 quotes (FITS standard 4.0, sect. 4.2.1; from memory).
     */
    public static final int FITS_TEXT_LENGTH = 68;

    private OptionChecks() {
    }

    /** Refuses an empty path ({@code --out ""} would mean the current directory without saying so). */
    public static void notEmpty(String option, Path path) {
        if (path == null || path.toString().isBlank()) {
            throw new BadInputException("option " + option + ": empty; give a file or directory name");
        }
    }

    /** Refuses NaN and infinite values. */
    public static void finite(String option, Double value) {
        if (value != null && !Double.isFinite(value)) {
            throw new BadInputException("option " + option + ": expected a finite number, got " + value);
        }
    }

    /**
     * Refuses a period that is not a number of days between {@value #MIN_PERIOD_DAYS} and
     * {@value #MAX_PERIOD_DAYS}; null (not given) is accepted.
     */
    public static void periodDays(String option, Double days) {
        if (days == null) {
            return;
        }
        if (!(days >= MIN_PERIOD_DAYS && days <= MAX_PERIOD_DAYS)) {
            throw new BadInputException("option " + option + ": " + Messages.number(days) + " d is not a period "
                    + "this tool can measure; expected " + MIN_PERIOD_DAYS + " to " + Messages.number(MAX_PERIOD_DAYS)
                    + " days");
        }
    }

    /**
     * Refuses text with control characters (a newline or tab would split the rows of a table it is
     * written into); null (not given) is accepted.
     */
    public static void plainText(String option, String text) {
        if (text == null) {
            return;
        }
        for (int i = 0; i < text.length(); i++) {
            char c = text.charAt(i);
            if (Character.isISOControl(c)) {
                throw new BadInputException(String.format(Locale.ROOT, "option %s: the text holds a control "
                        + "character (U+%04X) at position %d; expected plain text on one line", option, (int) c,
                        i + 1));
            }
        }
    }

    /**
     * Refuses text a FITS header cannot hold as a string value: characters other than printable
     * ASCII, or more than {@value #FITS_TEXT_LENGTH} characters.
     */
    public static void fitsText(String option, String text) {
        if (text == null) {
            return;
        }
        plainText(option, text);
        for (int i = 0; i < text.length(); i++) {
            char c = text.charAt(i);
            if (c < 0x20 || c > 0x7E) {
                throw new BadInputException(String.format(Locale.ROOT, "option %s: '%s' holds '%c' at position %d; "
                        + "a FITS header holds printable ASCII characters only", option, Messages.shorten(text), c,
                        i + 1));
            }
        }
        if (text.length() > FITS_TEXT_LENGTH) {
            throw new BadInputException("option " + option + ": " + text.length() + " characters; a FITS header "
                    + "holds at most " + FITS_TEXT_LENGTH + " in one value");
        }
    }

    /** Refuses an input that is missing, a directory or unreadable, saying which. */
    public static void readableFile(Path file) {
        if (java.nio.file.Files.isDirectory(file)) {
            throw new BadInputException(file + ": a directory; expected a file");
        }
        if (!java.nio.file.Files.exists(file)) {
            throw new BadInputException(file + ": no such file");
        }
        if (!java.nio.file.Files.isReadable(file)) {
            throw new BadInputException(file + ": cannot read the file: permission denied");
        }
    }
}
