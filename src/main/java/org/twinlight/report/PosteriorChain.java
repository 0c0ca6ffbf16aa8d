package org.twinlight.report;

import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.io.Reader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.zip.GZIPInputStream;
import java.util.zip.ZipException;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.twinlight.BadInputException;

/**
 * The retained samples of a posterior sampler, read from the {@code chain.csv.gz} the fit writes
 * beside its fit.json: gzip-compressed CSV with the header {@code step,walker,logPosterior,NAME,...}
 * (NAME each free parameter's contract name, then the derived quantities), one row per walker and
 * step after burn-in.
 *
 * @param file where it was read from
 * @param names the sampled quantities' names (the columns after {@code logPosterior})
 * @param columns the values, {@code columns[j][row]} for {@code names.get(j)}
 */
public record PosteriorChain(Path file, List<String> names, double[][] columns) {

    /** The columns every chain starts with, in this order. */
    public static final List<String> LEADING = List.of("step", "walker", "logPosterior");

    /** Number of samples. */
    public int size() {
        return columns.length == 0 ? 0 : columns[0].length;
    }

    /** The samples of {@code name}, or null when the chain does not hold it. */
    public double[] column(String name) {
        int j = names.indexOf(name);
        return j < 0 ? null : columns[j];
    }

    /**
     * Reads a chain.
     *
     * @throws BadInputException naming the file, row and column of anything unreadable
     */
    public static PosteriorChain read(Path file) {
        CSVFormat format = CSVFormat.DEFAULT.builder().setHeader().setSkipHeaderRecord(true).setCommentMarker('#')
                .setIgnoreSurroundingSpaces(true).get();
        try (InputStream raw = Files.newInputStream(file);
                Reader r = new InputStreamReader(new GZIPInputStream(raw, 1 << 16), StandardCharsets.UTF_8);
                CSVParser csv = CSVParser.parse(r, format)) {
            List<String> header = csv.getHeaderNames();
            if (header.size() <= LEADING.size() || !header.subList(0, LEADING.size()).equals(LEADING)) {
                throw BadInputException.at(file, "header", null, "expected " + String.join(",", LEADING)
                        + ",NAME,... (the posterior chain the fit command writes), got " + String.join(",", header));
            }
            List<String> names = List.copyOf(header.subList(LEADING.size(), header.size()));
            List<double[]> rows = new ArrayList<>();
            for (CSVRecord rec : csv) {
                long line = rec.getRecordNumber() + 1;
                if (rec.size() != header.size()) {
                    throw BadInputException.at(file, "row " + line, null, "has " + rec.size() + " values for "
                            + header.size() + " columns");
                }
                double[] row = new double[names.size()];
                for (int j = 0; j < row.length; j++) {
                    row[j] = number(file, line, names.get(j), rec.get(LEADING.size() + j));
                }
                rows.add(row);
            }
            if (rows.isEmpty()) {
                throw BadInputException.at(file, null, null, "holds no samples (only a header)");
            }
            double[][] columns = new double[names.size()][rows.size()];
            for (int i = 0; i < rows.size(); i++) {
                double[] row = rows.get(i);
                for (int j = 0; j < row.length; j++) {
                    columns[j][i] = row[j];
                }
            }
            return new PosteriorChain(file, names, columns);
        } catch (NoSuchFileException e) {
            throw BadInputException.at(file, null, null, "not found; fit.json names it as its posterior chain "
                    + "(key 'convergence.chainFile'): keep the chain beside fit.json");
        } catch (ZipException e) {
            throw BadInputException.at(file, null, null, "not a gzip-compressed file (" + e.getMessage() + "); "
                    + "expected the chain.csv.gz the fit command writes");
        } catch (IllegalArgumentException | IllegalStateException e) {
            throw BadInputException.at(file, null, null, "not a readable CSV table: " + e.getMessage());
        } catch (IOException | java.io.UncheckedIOException e) {
            throw BadInputException.at(file, null, null, "cannot be read: " + e.getMessage());
        }
    }

    private static double number(Path file, long line, String column, String text) {
        try {
            double v = Double.parseDouble(text);
            if (Double.isFinite(v)) {
                return v;
            }
        } catch (NumberFormatException e) {
            // reported below
        }
        throw BadInputException.at(file, "row " + line, column, "expected a finite number, got '" + text + "'");
    }
}
