package org.twinlight.photometry;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.function.DoubleUnaryOperator;
import nom.tam.fits.BasicHDU;
import nom.tam.fits.BinaryTable;
import nom.tam.fits.BinaryTableHDU;
import nom.tam.fits.Fits;
import nom.tam.fits.Header;
import nom.tam.util.Quantizer;
import org.twinlight.BadInputException;
import org.twinlight.time.TimeScale;

/**
 * Reads photometry from a FITS binary table with nom-tam-fits: the HDU chosen with
 * {@link ReadOptions#hdu()}, else the first binary table. Columns are found by name as for
 * text ({@link ColumnChoice}); for the value the systematics-corrected {@code PDCSAP_FLUX} is
 * preferred, then {@code FLUX}, {@code SAP_FLUX}, magnitudes ({@code MAG}); the error is the
 * value column's {@code _ERR} twin when there is one. A {@code QUALITY} column (or the one
 * named in the options) drops rows with non-zero flags. Times follow {@link FitsTime}.
 * The band is the band column's value when there is one, else the {@code FILTER} or
 * {@code BAND} keyword.
 */
public final class FitsTableReader {

    private FitsTableReader() {
    }

    /** Whether the file starts like a FITS file ({@code SIMPLE  =}), or is a gzip file named *.fits.gz etc. */
    public static boolean looksLikeFits(byte[] head, String fileName) {
        String start = new String(head, 0, Math.min(head.length, 9), java.nio.charset.StandardCharsets.US_ASCII);
        if (start.equals("SIMPLE  =")) {
            return true;
        }
        String n = fileName.toLowerCase(Locale.ROOT);
        boolean gzip = head.length >= 2 && (head[0] & 0xff) == 0x1f && (head[1] & 0xff) == 0x8b;
        return gzip && (n.endsWith(".fits.gz") || n.endsWith(".fit.gz") || n.endsWith(".fts.gz"));
    }

    /** Reads every band of the table. */
    static Map<String, LightCurve> read(Path file, ReadOptions options) {
        List<BasicHDU<?>> hdus = new ArrayList<>();
        try (Fits fits = new Fits(file.toFile())) {
            BasicHDU<?> h;
            while ((h = nextHdu(fits, file, hdus.size())) != null) {
                hdus.add(h);
                boolean found = options.hdu() != null ? hdus.size() > options.hdu() : h instanceof BinaryTableHDU;
                if (found) {
                    break; // HDUs after the one wanted are not read, so damage there does not matter
                }
            }
            int index = chooseHdu(file, hdus, options.hdu());
            return readTable(file, index, (BinaryTableHDU) hdus.get(index), hdus.get(0).getHeader(), options);
        } catch (IOException e) {
            throw BadInputException.at(file, null, null, "cannot read the FITS file (" + reason(e) + ")");
        }
    }

    public static BasicHDU<?> nextHdu(Fits fits, Path file, int index) {
        try {
            return fits.readHDU();
        } catch (IOException | RuntimeException e) {
            if (index == 0) {
                throw BadInputException.at(file, "HDU 0", null, "not a readable FITS file, damaged or truncated (" + reason(e)
                        + "); expected a FITS file with a binary table");
            }
            throw BadInputException.at(file, "HDU " + index, null, "the FITS file is damaged or truncated ("
                    + reason(e) + ")");
        }
    }

    public static int chooseHdu(Path file, List<BasicHDU<?>> hdus, Integer wanted) {
        if (wanted != null) {
            if (wanted >= hdus.size()) {
                throw BadInputException.at(file, "HDU " + wanted, null, "no such HDU; the file has " + hdus.size()
                        + " HDU" + (hdus.size() == 1 ? "" : "s") + ": " + describe(hdus));
            }
            if (!(hdus.get(wanted) instanceof BinaryTableHDU)) {
                throw BadInputException.at(file, "HDU " + wanted, null, "this HDU holds " + kind(hdus.get(wanted))
                        + ", expected a binary table; the file has: " + describe(hdus));
            }
            return wanted;
        }
        for (int i = 0; i < hdus.size(); i++) {
            if (hdus.get(i) instanceof BinaryTableHDU) {
                return i;
            }
        }
        throw BadInputException.at(file, null, null, "no binary table in the file; expected one holding time "
                + "and flux columns; the file has: " + describe(hdus));
    }

    private static String describe(List<BasicHDU<?>> hdus) {
        StringBuilder sb = new StringBuilder();
        for (int i = 0; i < hdus.size(); i++) {
            sb.append(i == 0 ? "" : ", ").append("HDU ").append(i).append(' ').append(kind(hdus.get(i)));
        }
        return sb.toString();
    }

    private static String kind(BasicHDU<?> hdu) {
        String name = hdu.getClass().getSimpleName().replace("HDU", "");
        String ext = hdu.getHeader().getStringValue("EXTNAME");
        return switch (name) {
            case "BinaryTable" -> "a binary table";
            case "AsciiTable" -> "an ASCII table";
            case "Image" -> hdu.getHeader().getIntValue("NAXIS", 0) == 0 ? "no data" : "an image";
            default -> name.toLowerCase(Locale.ROOT);
        } + (ext == null ? "" : " (" + ext.trim() + ")");
    }

    private static Map<String, LightCurve> readTable(Path file, int index, BinaryTableHDU hdu, Header primary,
            ReadOptions options) {
        String where = "HDU " + index;
        BinaryTable table;
        try {
            table = hdu.getData();
        } catch (RuntimeException e) {
            throw BadInputException.at(file, where, null, "cannot read the table (" + reason(e) + ")");
        }
        int ncols = hdu.getNCols();
        List<String> names = new ArrayList<>(ncols);
        for (int c = 0; c < ncols; c++) {
            String n = hdu.getColumnName(c);
            names.add(n == null || n.isBlank() ? "column " + (c + 1) : n.trim());
        }
        if (ncols == 0) {
            throw BadInputException.at(file, where, null, "the binary table has no columns; expected time and flux");
        }
        ColumnChoice c = ColumnChoice.choose(file, where, names, ncols, options, true);
        for (int col : new int[] {c.time(), c.value(), c.error(), c.quality()}) {
            if (col >= 0 && !isNumericScalar(table, col)) {
                throw BadInputException.at(file, where, names.get(col), "expected a column of single numbers, "
                        + "found format " + hdu.getHeader().getStringValue("TFORM" + (col + 1)));
            }
        }
        String valueName = names.get(c.value());
        String valueUnit = hdu.getColumnMeta(c.value(), "TUNIT");
        ValueKind kind = options.valueKind() != null ? options.valueKind()
                : ColumnChoice.normalise(valueName).contains("mag")
                        || (valueUnit != null && valueUnit.trim().toLowerCase(Locale.ROOT).startsWith("mag"))
                                ? ValueKind.MAGNITUDE : ValueKind.FLUX;
        String bandName = c.band() >= 0 ? names.get(c.band()) : null;
        int airmassCol = ColumnChoice.airmassColumn(names);
        if (airmassCol >= 0 && !isNumericScalar(table, airmassCol)) {
            throw BadInputException.at(file, where, names.get(airmassCol), "expected a column of single numbers, "
                    + "found format " + hdu.getHeader().getStringValue("TFORM" + (airmassCol + 1)));
        }
        RowCollector rows = new RowCollector(file, RowPlace.fitsRow(index), names.get(c.time()), bandName, kind,
                c.error() >= 0, airmassCol >= 0 ? names.get(airmassCol) : null);
        int nrows = table.getNRows();
        double[] times;
        double[] values;
        double[] errors;
        double[] flags;
        double[] airmass;
        Object[] bands;
        try {
            times = column(table, c.time());
            values = column(table, c.value());
            errors = c.error() >= 0 ? column(table, c.error()) : null;
            flags = c.quality() >= 0 ? column(table, c.quality()) : null;
            airmass = airmassCol >= 0 ? column(table, airmassCol) : null;
            bands = c.band() >= 0 ? bandColumn(table, c.band(), nrows) : null;
        } catch (RuntimeException e) {
            throw BadInputException.at(file, where, null, "cannot read the table rows; the file may be truncated ("
                    + reason(e) + ")");
        }
        double typicalTime = Double.NaN;
        for (int r = 0; r < nrows; r++) {
            if (Double.isNaN(typicalTime) && Double.isFinite(times[r])) {
                typicalTime = times[r];
            }
            String band = bands == null ? null : String.valueOf(bands[r]).trim();
            if (band != null && band.isEmpty()) {
                rows.reject(null, RowRejection.MISSING_FIELD);
                continue;
            }
            rows.add(r + 1, band, times[r], values[r], errors == null ? Double.NaN : errors[r],
                    flags == null ? 0.0 : flags[r], airmass == null ? Double.NaN : airmass[r]);
        }
        FitsTime time = FitsTime.of(file, index, hdu.getHeader(), primary, hdu.getColumnMeta(c.time(), "TUNIT"),
                typicalTime);
        TimeScale scale = time.scale();
        DoubleUnaryOperator toDays = time::toDays;
        if (options.timeScale() != null) {
            scale = options.timeScale();
            double zero = time.declared() ? scale.zeroPointJd() : 0.0;
            toDays = v -> time.toDays(v) - zero;
        }
        double offset = options.timeOffsetDays() == null ? 0.0 : options.timeOffsetDays();
        String fixedBand = bandKeyword(hdu.getHeader(), primary);
        List<String> notes = time.declared()
                ? LightCurveReader.overrideNotes(time.scale(), options.timeScale()) : List.of();
        Map<String, LightCurve> curves = rows.build(file.getFileName().toString(), fixedBand, scale, toDays, offset);
        List<String> all = new ArrayList<>(notes);
        all.addAll(ValueCheck.check(file, valueName, kind, options.valueKind() != null, curves));
        return LightCurveReader.withNotes(curves, all);
    }

    /**
     * A scalar numeric column as doubles: integers through the column's TSCALn, TZEROn and TNULLn
     * (a null value becomes NaN), unsigned bytes as 0..255, floating-point values as stored.
     */
    public static double[] column(BinaryTable table, int col) {
        Object data = table.getFlattenedColumn(col);
        Quantizer q = table.getDescriptor(col).getQuantizer();
        if (data instanceof double[] d) {
            return d.clone();
        }
        if (data instanceof float[] f) {
            double[] out = new double[f.length];
            for (int i = 0; i < f.length; i++) {
                out[i] = f[i];
            }
            return out;
        }
        long[] raw;
        if (data instanceof long[] l) {
            raw = l;
        } else if (data instanceof int[] a) {
            raw = new long[a.length];
            for (int i = 0; i < a.length; i++) {
                raw[i] = a[i];
            }
        } else if (data instanceof short[] a) {
            raw = new long[a.length];
            for (int i = 0; i < a.length; i++) {
                raw[i] = a[i];
            }
        } else if (data instanceof byte[] a) {
            raw = new long[a.length];
            for (int i = 0; i < a.length; i++) {
                raw[i] = a[i] & 0xff;
            }
        } else {
            throw new IllegalStateException("unexpected column data " + (data == null ? "null" : data.getClass()));
        }
        double[] out = new double[raw.length];
        for (int i = 0; i < raw.length; i++) {
            out[i] = q == null ? raw[i] : q.toDouble(raw[i]);
        }
        return out;
    }

    private static Object[] bandColumn(BinaryTable table, int col, int nrows) {
        Object[] out = new Object[nrows];
        for (int r = 0; r < nrows; r++) {
            out[r] = table.get(r, col);
        }
        return out;
    }

    private static boolean isNumericScalar(BinaryTable table, int col) {
        BinaryTable.ColumnDesc d = table.getDescriptor(col);
        return d.isNumeric() && !d.isComplex() && d.getElementCount() == 1 && !d.isVariableSize();
    }

    private static String bandKeyword(Header table, Header primary) {
        for (Header h : new Header[] {table, primary}) {
            for (String key : new String[] {"FILTER", "BAND"}) {
                String v = h.getStringValue(key);
                if (v != null && !v.isBlank()) {
                    return v.trim();
                }
            }
        }
        return null;
    }

    /**
     * What went wrong in the FITS library, in words: the end of the file reached early, or the
     * library's message when it is one a person can read; never a Java class or method name.
     */
    static String reason(Throwable e) {
        for (Throwable t = e; t != null; t = t.getCause()) {
            if (t instanceof java.io.EOFException) {
                return "the file ends before the data its header announces";
            }
        }
        String m = e.getMessage();
        if (m == null || m.isBlank() || m.contains("Cannot invoke") || m.contains("java.") || m.contains("nom.tam")
                || m.contains("Exception") || m.contains("\"null\"")) {
            return "the header or data cannot be decoded";
        }
        return m.length() > 200 ? m.substring(0, 200) + "…" : m;
    }
}
