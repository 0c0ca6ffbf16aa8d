package org.twinlight.report;

import java.io.OutputStreamWriter;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.Locale;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVPrinter;
import org.twinlight.planning.Plan;
import org.twinlight.planning.Prediction;
import org.twinlight.planning.UtcText;
import org.twinlight.sky.Darkness;

/**
 * Writes {@code predictions.csv}: the contract's columns (target, type, cycle, minimum_utc,
 * minimum_jd_utc, error_minutes, start_utc, end_utc, altitude_deg, azimuth_deg, sun_altitude_deg,
 * moon_altitude_deg, moon_illumination, moon_separation_deg, verdict), then {@code reason}, then
 * the time of minimum in the ephemeris's own scale, the target's place at first and last contact,
 * the Sun there, the darkness at minimum and the clashes with other targets.
 */
public final class PredictionsCsv {

    /** The columns, in order. */
    public static final String[] COLUMNS = {"target", "type", "cycle", "minimum_utc", "minimum_jd_utc",
        "error_minutes", "start_utc", "end_utc", "altitude_deg", "azimuth_deg", "sun_altitude_deg",
        "moon_altitude_deg", "moon_illumination", "moon_separation_deg", "verdict", "reason", "minimum_own_scale",
        "time_scale", "start_altitude_deg", "start_azimuth_deg", "end_altitude_deg", "end_azimuth_deg",
        "sun_altitude_start_deg", "sun_altitude_end_deg", "darkness", "clashes"};

    private PredictionsCsv() {
    }

    /** Writes the file atomically. */
    public static void write(Path target, Plan plan) {
        AtomicFiles.write(target, out -> {
            Writer w = new OutputStreamWriter(out, StandardCharsets.UTF_8);
            try (CSVPrinter csv = new CSVPrinter(w, CSVFormat.DEFAULT.builder().setRecordSeparator("\n").get())) {
                csv.printRecord((Object[]) COLUMNS);
                for (Prediction p : plan.predictions()) {
                    csv.printRecord(row(p));
                }
            }
        });
    }

    private static Object[] row(Prediction p) {
        return new Object[] {p.target(), p.type().label(), cycle(p.cycle()), UtcText.iso(p.minimum().utc()),
            f(p.minimum().utc().jd(), 6), f(p.errorDays() * 1440, 2),
            UtcText.iso(p.start().utc()), UtcText.iso(p.end().utc()), f(p.minimum().target().altitudeDeg(), 2),
            f(p.minimum().target().azimuthDeg(), 2), f(p.minimum().sunAltitudeDeg(), 2),
            f(p.moon().altitudeDeg(), 2), f(p.moon().illuminatedFraction(), 3), f(p.moon().separationDeg(), 1),
            p.verdict().label(), p.reason(), f(p.minimumOwnScale(), 6),
            p.ownScale().label(), f(p.start().target().altitudeDeg(), 2), f(p.start().target().azimuthDeg(), 2),
            f(p.end().target().altitudeDeg(), 2), f(p.end().target().azimuthDeg(), 2),
            f(p.start().sunAltitudeDeg(), 2), f(p.end().sunAltitudeDeg(), 2),
            Darkness.of(p.minimum().sunAltitudeDeg()).label(), String.join("; ", p.clashes())};
    }

    static String cycle(double c) {
        return c == Math.rint(c) ? Long.toString((long) c) : String.format(Locale.ROOT, "%.1f", c);
    }

    /** Fixed-point text with {@code decimals} decimals, as {@code %.Nf} would write it (rounded half up), faster. */
    static String f(double v, int decimals) {
        if (!Double.isFinite(v) || Math.abs(v) > 1e12) {
            return String.format(Locale.ROOT, "%." + decimals + "f", v);
        }
        long scale = POWERS[decimals];
        long units = Math.round(Math.abs(v) * scale);
        StringBuilder sb = new StringBuilder(24);
        if (Double.doubleToRawLongBits(v) < 0) { // as the formatter: -0.0004 gives -0.00
            sb.append('-');
        }
        sb.append(units / scale);
        if (decimals > 0) {
            String frac = Long.toString(units % scale);
            sb.append('.');
            for (int i = frac.length(); i < decimals; i++) {
                sb.append('0');
            }
            sb.append(frac);
        }
        return sb.toString();
    }

    private static final long[] POWERS = {1, 10, 100, 1000, 10000, 100000, 1000000, 10000000};
}
