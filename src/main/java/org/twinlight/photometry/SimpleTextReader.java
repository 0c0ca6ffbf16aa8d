package org.twinlight.photometry;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.twinlight.BadInputException;
import org.twinlight.time.TimeScale;

/**
 * A first reader for comma- or white-space-separated text with time, value and optional error in
 * the first three columns. To be replaced by the full delimited-text and FITS readers.
 */
final class SimpleTextReader {
    private SimpleTextReader() {
    }

    static LightCurve read(Path file, ReadOptions options) {
        List<String> lines;
        try {
            lines = Files.readAllLines(file, StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw BadInputException.at(file, null, null, "cannot read the file (" + e.getMessage() + ")");
        }
        List<double[]> rows = new ArrayList<>();
        Map<String, Integer> rejected = new LinkedHashMap<>();
        for (String line : lines) {
            String t = line.trim();
            if (t.isEmpty() || t.startsWith("#")) {
                continue;
            }
            String[] f = t.split("[,;\\s]+");
            try {
                double time = Double.parseDouble(f[0]);
                double v = Double.parseDouble(f[1]);
                double e = f.length > 2 ? Double.parseDouble(f[2]) : Double.NaN;
                rows.add(new double[] {time, v, e});
            } catch (RuntimeException ex) {
                if (!rows.isEmpty()) {
                    rejected.merge("not a number", 1, Integer::sum);
                }
            }
        }
        if (rows.isEmpty()) {
            throw BadInputException.at(file, null, null, "no numeric rows found");
        }
        int n = rows.size();
        double[] time = new double[n];
        double[] flux = new double[n];
        double[] err = new double[n];
        boolean hasErr = true;
        double offset = options.timeOffsetDays() == null ? 0 : options.timeOffsetDays();
        for (int i = 0; i < n; i++) {
            time[i] = rows.get(i)[0] + offset;
            flux[i] = rows.get(i)[1];
            err[i] = rows.get(i)[2];
            hasErr &= Double.isFinite(err[i]);
        }
        TimeScale scale = options.timeScale() == null ? TimeScale.UNKNOWN : options.timeScale();
        return new LightCurve(file.getFileName().toString(), null, scale, ValueKind.FLUX, time, flux,
                hasErr ? err : null, rejected);
    }
}
