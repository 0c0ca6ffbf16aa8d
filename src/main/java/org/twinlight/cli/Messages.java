package org.twinlight.cli;

import java.math.BigDecimal;
import java.util.Locale;

/** How numbers and long values appear in messages: readable, never hundreds of characters. */
public final class Messages {
    /** Words longer than this are shortened in messages. */
    static final int LONGEST_WORD = 120;

    private Messages() {
    }

    /** A number in at most about 14 characters: plain when moderate, else in exponent form. */
    public static String number(double v) {
        if (!Double.isFinite(v) || v == 0) {
            return Double.toString(v);
        }
        double a = Math.abs(v);
        if (a >= 1e-4 && a < 1e9) {
            return new BigDecimal(String.format(Locale.ROOT, "%.12g", v)).stripTrailingZeros().toPlainString();
        }
        return String.format(Locale.ROOT, "%.6g", v).replaceAll("\\.?0+e", "e");
    }

    /**
     * The message with every word (run of non-space characters) longer than {@value #LONGEST_WORD}
     * characters cut to its start and end, saying how long it was.
     */
    public static String shorten(String message) {
        if (message == null || message.length() <= LONGEST_WORD) {
            return message;
        }
        StringBuilder sb = new StringBuilder();
        int i = 0;
        int n = message.length();
        while (i < n) {
            int j = i;
            boolean space = Character.isWhitespace(message.charAt(i));
            while (j < n && Character.isWhitespace(message.charAt(j)) == space) {
                j++;
            }
            String word = message.substring(i, j);
            if (!space && word.length() > LONGEST_WORD) {
                sb.append(word, 0, 60).append("…[").append(word.length()).append(" characters]…")
                        .append(word, word.length() - 20, word.length());
            } else {
                sb.append(word);
            }
            i = j;
        }
        return sb.toString();
    }

    /**
     * {@code value ± uncertainty} with the uncertainty to two significant digits and the value to
     * the same decimal place (at least {@code minDecimals}); an uncertainty that is not a positive
     * number is written as "n/a" and the value to {@code minDecimals} places.
     */
    public static String valueWithUncertainty(double value, double uncertainty, int minDecimals) {
        if (!Double.isFinite(value)) {
            return "n/a";
        }
        if (!(uncertainty > 0) || !Double.isFinite(uncertainty)) {
            return String.format(Locale.ROOT, "%." + minDecimals + "f ± n/a", value);
        }
        int decimals = Math.max(minDecimals, Math.min(15, 1 - (int) Math.floor(Math.log10(uncertainty))));
        return String.format(Locale.ROOT, "%." + decimals + "f ± %." + decimals + "f", value, uncertainty);
    }

    /** {@code v} with {@code decimals} places, or "n/a" when it is NaN or infinite. */
    public static String fixed(double v, int decimals) {
        return Double.isFinite(v) ? String.format(Locale.ROOT, "%." + decimals + "f", v) : "n/a";
    }

    /** "1 point", "2 points": a count with its noun in the right number. */
    public static String count(long n, String singular, String plural) {
        return n + " " + (n == 1 ? singular : plural);
    }
}
