package org.twinlight.photometry;

import java.util.ArrayList;
import java.util.List;

/**
 * Splits a light curve into segments (nights, orbits of a spacecraft, observing runs) wherever
 * the time between two consecutive points is longer than a gap, in days. Each segment can carry
 * its own flux normalisation in a fit.
 */
public final class Segments {

    /** The default gap that starts a new segment, days (half a day separates nights). */
    public static final double DEFAULT_GAP_DAYS = 0.5;

    private Segments() {
    }

    /**
     * The index of the first point of every segment: 0, then each i with
     * {@code time(i) − time(i−1) > gapDays}.
     *
     * @param gapDays the gap, days; positive and finite
     */
    public static int[] starts(LightCurve lightCurve, double gapDays) {
        if (!(gapDays > 0) || Double.isInfinite(gapDays)) {
            throw new IllegalArgumentException("segment gap must be a positive number of days, got " + gapDays);
        }
        int n = lightCurve.size();
        int[] buffer = new int[Math.max(n, 1)];
        int count = 0;
        if (n > 0) {
            buffer[count++] = 0;
        }
        for (int i = 1; i < n; i++) {
            if (lightCurve.time(i) - lightCurve.time(i - 1) > gapDays) {
                buffer[count++] = i;
            }
        }
        return java.util.Arrays.copyOf(buffer, count);
    }

    /** The segments as light curves (same source, band, scale and rejection counts), in time order. */
    public static List<LightCurve> split(LightCurve lightCurve, double gapDays) {
        int[] s = starts(lightCurve, gapDays);
        List<LightCurve> out = new ArrayList<>(s.length);
        for (int k = 0; k < s.length; k++) {
            int end = k + 1 < s.length ? s[k + 1] : lightCurve.size();
            out.add(lightCurve.slice(s[k], end));
        }
        return out;
    }
}
