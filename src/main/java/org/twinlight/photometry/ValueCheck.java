package org.twinlight.photometry;

import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.twinlight.BadInputException;

/**
 * Checks that values read as flux (because nothing said they were magnitudes) can be flux. The
 * rules, applied when the user did not state {@code --values}:
 *
 * <ol>
 *   <li>A median value ≤ 0 cannot be the level of a flux: refused, whatever the column's name
 *       (differential magnitudes scatter around 0; a flux with its level subtracted cannot be
 *       normalised).</li>
 *   <li>In a column whose name does not say flux ({@code value}, or no header): any value ≤ 0,
 *       or all values between 3 and 30 with a spread under 2 (the magnitudes of variable stars),
 *       is refused as looking like magnitudes.</li>
 *   <li>In a column named as flux, values between 3 and 30 with a spread under 2 give a remark
 *       only, kept with the light curve and written into the results.</li>
 * </ol>
 * The thresholds are common practice, no source. Refusals say how to state what the values are:
 * {@code --values magnitude} or {@code --values flux}.
 */
final class ValueCheck {
    private ValueCheck() {
    }

    /** The remarks to keep with the light curves; refuses values that cannot be flux. */
    static List<String> check(Path file, String valueName, ValueKind kind, boolean stated,
            Map<String, LightCurve> curves) {
        if (kind != ValueKind.FLUX || stated) {
            return List.of();
        }
        boolean namedFlux = valueName != null && ColumnChoice.normalise(valueName).contains("flux");
        String column = valueName == null || valueName.matches("\\d+") ? "column " + (valueName == null ? 2 : valueName)
                : valueName;
        String how = "; give --values magnitude if they are magnitudes, or --values flux to read them as flux anyway";
        for (LightCurve lc : curves.values()) {
            double[] f = lc.fluxes();
            double lo = Double.POSITIVE_INFINITY;
            double hi = Double.NEGATIVE_INFINITY;
            int notPositive = 0;
            for (double v : f) {
                lo = Math.min(lo, v);
                hi = Math.max(hi, v);
                if (v <= 0) {
                    notPositive++;
                }
            }
            double median = RobustStatistics.medianBySelection(f, f.length);
            String band = lc.band() == null || lc.band().isEmpty() ? "" : " (band " + lc.band() + ")";
            if (median <= 0) {
                throw BadInputException.at(file, null, column, String.format(Locale.ROOT, "the values read as flux"
                        + "%s have a median of %.4g, but a flux must have a positive level: they look like "
                        + "differential magnitudes or a flux with its level subtracted", band, median) + how);
            }
            if (!namedFlux && notPositive > 0) {
                throw BadInputException.at(file, null, column, String.format(Locale.ROOT, "%d of %d values read as "
                        + "flux%s are zero or negative (lowest %.4g) and the column's name does not say flux: they "
                        + "look like differential magnitudes", notPositive, f.length, band, lo) + how);
            }
            if (lo >= 3 && hi <= 30 && hi - lo < 2) {
                String text = String.format(Locale.ROOT, "the values%s (%.3f to %.3f) were read as flux but look "
                        + "like magnitudes", band, lo, hi);
                if (!namedFlux) {
                    throw BadInputException.at(file, null, column, text + how);
                }
                return List.of(text + "; if they are, give --values magnitude");
            }
        }
        return List.of();
    }
}
