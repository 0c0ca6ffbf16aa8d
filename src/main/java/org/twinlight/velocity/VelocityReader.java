package org.twinlight.velocity;

import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import nom.tam.fits.BasicHDU;
import nom.tam.fits.BinaryTable;
import nom.tam.fits.BinaryTableHDU;
import nom.tam.fits.Fits;
import org.twinlight.BadInputException;
import org.twinlight.photometry.FitsTableReader;
import org.twinlight.photometry.FitsTime;
import org.twinlight.photometry.LightCurveReader;
import org.twinlight.photometry.RowRejection;
import org.twinlight.photometry.TextTableReader;
import org.twinlight.time.TimeScale;

/**
 * Reads radial velocities (km/s) from delimited text or a FITS binary table: columns time, v1,
 * v1_err, v2, v2_err and optionally instrument, in any order, found by header name or chosen by
 * option ({@link VelocityColumns}). Text files follow the photometry reader's rules for
 * delimiters, comments, numbers (decimal commas, Fortran exponents, nan) and the
 * {@code # time scale: LABEL} comment; a header row is a first line with a field that is not a
 * number. FITS tables follow the FITS time standard through {@link FitsTime}. One star may be
 * missing on a row (empty field or NaN); see {@link VelocityRows} for what else is dropped and
 * counted. The file is never modified.
 */
public final class VelocityReader {

    private VelocityReader() {
    }

    /**
     * Reads {@code file}.
     *
     * @throws BadInputException naming the file, line or HDU and column when it cannot be used
     */
    public static VelocityData read(Path file, VelocityReadOptions options) {
        VelocityReadOptions o = options == null ? VelocityReadOptions.defaults() : options;
        if (Files.isDirectory(file)) {
            throw BadInputException.at(file, null, null, "a directory; expected a velocity file");
        }
        byte[] head;
        try (InputStream in = Files.newInputStream(file)) {
            head = in.readNBytes(16);
        } catch (NoSuchFileException e) {
            throw BadInputException.at(file, null, null, "no such file");
        } catch (IOException e) {
            throw BadInputException.at(file, null, null, "cannot read the file (" + e.getMessage() + ")");
        }
        if (FitsTableReader.looksLikeFits(head, file.getFileName().toString())) {
            return readFits(file, o);
        }
        return readText(file, o);
    }

    private static VelocityData readText(Path file, VelocityReadOptions o) {
        if (o.hdu() != null) {
            throw BadInputException.at(file, null, null, "option --hdu applies to FITS files; this file is read as "
                    + "delimited text");
        }
        List<String> lines = TextTableReader.lines(file);
        List<Integer> data = new ArrayList<>();
        for (int i = 0; i < lines.size(); i++) {
            if (!TextTableReader.stripComment(lines.get(i)).isBlank()) {
                data.add(i);
            }
        }
        if (data.isEmpty()) {
            throw BadInputException.at(file, null, null, "no data rows; expected rows of time, v1, v1_err, v2, "
                    + "v2_err[, instrument] in km/s");
        }
        char delimiter = TextTableReader.detectDelimiter(lines, data);
        boolean decimalComma = delimiter != ',';
        List<String> first = TextTableReader.split(TextTableReader.stripComment(lines.get(data.get(0))), delimiter);
        List<String> header = null;
        String where = null;
        if (first.stream().anyMatch(f -> !f.isEmpty() && TextTableReader.isNotANumber(f, decimalComma))) {
            header = first;
            where = "header line " + (data.get(0) + 1);
            data.remove(0);
        }
        VelocityColumns c = VelocityColumns.choose(file, where, header, first.size(), o);
        TimeScale declared = TextTableReader.declaredTimeScale(file, lines, data.isEmpty() ? lines.size() : data.get(0));
        if (declared == null) {
            declared = header == null ? TimeScale.UNKNOWN
                    : TimeScale.parse(header.get(c.time())).orElse(TimeScale.UNKNOWN);
        }
        TimeScale scale = o.timeScale() != null ? o.timeScale() : declared;
        VelocityRows rows = new VelocityRows(file, c.e1() >= 0, c.e2() >= 0);
        for (int index : data) {
            List<String> f = TextTableReader.split(TextTableReader.stripComment(lines.get(index)), delimiter);
            readTextRow(rows, index + 1, f, c, decimalComma);
        }
        double offset = o.timeOffsetDays() == null ? 0.0 : o.timeOffsetDays();
        return rows.build(file.getFileName().toString(), scale, offset,
                LightCurveReader.overrideNotes(declared, o.timeScale()));
    }

    private static void readTextRow(VelocityRows rows, int line, List<String> f, VelocityColumns c,
            boolean decimalComma) {
        if (c.time() >= f.size() || f.get(c.time()).isEmpty()) {
            rows.reject("time", RowRejection.MISSING_FIELD);
            return;
        }
        int[] idx = {c.time(), c.v1(), c.e1(), c.v2(), c.e2()};
        String[] roles = {"time", "v1", "v1_err", "v2", "v2_err"};
        double[] x = new double[idx.length];
        for (int k = 0; k < idx.length; k++) {
            String s = idx[k] >= 0 && idx[k] < f.size() ? f.get(idx[k]) : "";
            x[k] = s.isEmpty() ? Double.NaN : TextTableReader.number(s, decimalComma);
            if (!s.isEmpty() && Double.isNaN(x[k]) && !TextTableReader.isNanToken(s)) {
                rows.reject(roles[k], RowRejection.NOT_A_NUMBER);
                return;
            }
        }
        String instrument = "";
        if (c.instrument() >= 0) {
            instrument = c.instrument() < f.size() ? f.get(c.instrument()) : "";
            if (instrument.isEmpty()) {
                rows.reject(RowRejection.MISSING_FIELD);
                return;
            }
        }
        rows.add(line, x[0], new double[] {0, x[1], x[3]}, new double[] {0, x[2], x[4]}, instrument);
    }

    private static VelocityData readFits(Path file, VelocityReadOptions o) {
        List<BasicHDU<?>> hdus = new ArrayList<>();
        try (Fits fits = new Fits(file.toFile())) {
            BasicHDU<?> h;
            while ((h = FitsTableReader.nextHdu(fits, file, hdus.size())) != null) {
                hdus.add(h);
                if (o.hdu() != null ? hdus.size() > o.hdu() : h instanceof BinaryTableHDU) {
                    break;
                }
            }
            int index = FitsTableReader.chooseHdu(file, hdus, o.hdu());
            return readTable(file, index, (BinaryTableHDU) hdus.get(index), hdus.get(0), o);
        } catch (IOException e) {
            throw BadInputException.at(file, null, null, "cannot read the FITS file (" + e.getMessage() + ")");
        }
    }

    private static VelocityData readTable(Path file, int index, BinaryTableHDU hdu, BasicHDU<?> primary,
            VelocityReadOptions o) {
        String where = "HDU " + index;
        BinaryTable table;
        try {
            table = hdu.getData();
        } catch (RuntimeException e) {
            throw BadInputException.at(file, where, null, "cannot read the table (" + e.getMessage() + ")");
        }
        List<String> names = new ArrayList<>();
        for (int k = 0; k < hdu.getNCols(); k++) {
            String n = hdu.getColumnName(k);
            names.add(n == null || n.isBlank() ? "column " + (k + 1) : n.trim());
        }
        VelocityColumns c = VelocityColumns.choose(file, where, names, names.size(), o);
        int n = table.getNRows();
        double[][] cols = new double[5][];
        int[] idx = {c.time(), c.v1(), c.e1(), c.v2(), c.e2()};
        try {
            for (int k = 0; k < idx.length; k++) {
                if (idx[k] >= 0) {
                    cols[k] = FitsTableReader.column(table, idx[k]);
                } else {
                    cols[k] = new double[n];
                    Arrays.fill(cols[k], Double.NaN);
                }
            }
        } catch (RuntimeException e) {
            throw BadInputException.at(file, where, null, "cannot read the velocity columns as numbers ("
                    + e.getMessage() + ")");
        }
        double typical = Arrays.stream(cols[0]).filter(Double::isFinite).findFirst().orElse(Double.NaN);
        FitsTime time = FitsTime.of(file, index, hdu.getHeader(), primary.getHeader(),
                hdu.getColumnMeta(c.time(), "TUNIT"), typical);
        TimeScale scale = o.timeScale() != null ? o.timeScale() : time.scale();
        double zero = o.timeScale() != null && time.declared() ? o.timeScale().zeroPointJd() : 0.0;
        VelocityRows rows = new VelocityRows(file, c.e1() >= 0, c.e2() >= 0);
        for (int r = 0; r < n; r++) {
            String instrument = "";
            if (c.instrument() >= 0) {
                Object v = table.get(r, c.instrument());
                instrument = v == null ? "" : String.valueOf(v).trim();
                if (instrument.isEmpty()) {
                    rows.reject(RowRejection.MISSING_FIELD);
                    continue;
                }
            }
            double t = Double.isFinite(cols[0][r]) ? time.toDays(cols[0][r]) - zero : cols[0][r];
            rows.add(r + 1, t, new double[] {0, cols[1][r], cols[3][r]}, new double[] {0, cols[2][r], cols[4][r]},
                    instrument);
        }
        double offset = o.timeOffsetDays() == null ? 0.0 : o.timeOffsetDays();
        List<String> notes = time.declared() ? LightCurveReader.overrideNotes(time.scale(), o.timeScale()) : List.of();
        return rows.build(file.getFileName().toString(), scale, offset, notes);
    }
}
