package org.twinlight.photometry;

import java.util.Arrays;

/**
 * One column of numbers read from a delimited text file by the same rules as the light-curve
 * reader (delimiter, decimal comma, header, byte-order mark, encoding): the column's name, and
 * for each data row its 1-based line number, the field as written and its value.
 */
public final class TextColumn {
    private final String name;
    private final int[] lineNumbers;
    private final String[] texts;
    private final double[] values;

    private TextColumn(String name, int[] lineNumbers, String[] texts, double[] values) {
        this.name = name;
        this.lineNumbers = lineNumbers;
        this.texts = texts;
        this.values = values;
    }

    /** The header name of the column, or {@code "column N"}. */
    public String name() {
        return name;
    }

    public int size() {
        return values.length;
    }

    /** 1-based line number of row {@code i}. */
    public int lineNumber(int i) {
        return lineNumbers[i];
    }

    /** The field of row {@code i} as written in the file. */
    public String text(int i) {
        return texts[i];
    }

    /** The value of row {@code i}. */
    public double value(int i) {
        return values[i];
    }

    /** Collects the rows while the file is read. */
    static final class Builder {
        private final String name;
        private int size;
        private int bad;
        private int[] lines = new int[64];
        private String[] texts = new String[64];
        private double[] values = new double[64];

        Builder(String name) {
            this.name = name;
        }

        void add(int line, String text, double value) {
            if (size == values.length) {
                lines = Arrays.copyOf(lines, 2 * size);
                texts = Arrays.copyOf(texts, 2 * size);
                values = Arrays.copyOf(values, 2 * size);
            }
            lines[size] = line;
            texts[size] = text;
            values[size] = value;
            size++;
        }

        void countBad() {
            bad++;
        }

        int badCount() {
            return bad;
        }

        TextColumn build() {
            return new TextColumn(name, Arrays.copyOf(lines, size), Arrays.copyOf(texts, size),
                    Arrays.copyOf(values, size));
        }
    }
}
