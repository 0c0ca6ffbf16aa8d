package org.twinlight.photometry;

/**
 * How rows of an input are named in messages: {@code "line 12"} for text files,
 * {@code "row 12 of HDU 1"} for FITS tables (numbers 1-based).
 */
record RowPlace(String singular, String plural, String suffix) {

    static final RowPlace TEXT_LINE = new RowPlace("line", "lines", "");

    static RowPlace fitsRow(int hdu) {
        return new RowPlace("row", "rows", " of HDU " + hdu);
    }

    String one(int number) {
        return singular + " " + number + suffix;
    }

    String pair(int first, int second) {
        return plural + " " + first + " and " + second + suffix;
    }
}
