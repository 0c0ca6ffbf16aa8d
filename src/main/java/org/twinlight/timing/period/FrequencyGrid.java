package org.twinlight.timing.period;

import java.util.Arrays;

/**
 * The trial frequencies of a period search (cycles per day), set by the baseline and the shortest
 * eclipse duration that the data can show.
 *
 * <p>Rule. A folded eclipse of duration q (fraction of the period) is sharp as long as the phase
 * error accumulated over the baseline T stays well below q. Two neighbouring trial frequencies differ
 * by Δf = q<sub>eff</sub>(f) / (k·T), with k the oversampling (default 2). The true frequency lies
 * within Δf/2 of a grid point and the best box absorbs the mean phase, so the phase error at either end
 * of the baseline is at most Δf·T/4 = q<sub>eff</sub>/(4k), an eighth of the duration for k = 2. This
 * is the usual BLS requirement that the grid resolve the phase drift of the shortest trial duration
 * across the baseline (Kovács, Zucker &amp; Mazeh 2002, A&amp;A 391, 369, Sect. 2).
 *
 * <p>The shortest usable duration is q<sub>eff</sub>(f) = min(max(q<sub>min</sub>, c·f), {@link
 * #LARGEST_EFFECTIVE_DURATION}), with c the time resolution of the data (days, the spacing of the
 * closest points, see {@link SearchData#resolutionDays()}): an eclipse cannot look shorter than about
 * one exposure, so at high trial frequencies the step widens in proportion to f and the grid becomes
 * logarithmic. The cap keeps the grid fine enough for eclipses of a twentieth of the period whatever
 * the sampling: irregular (survey) sampling has no Nyquist limit, and a few points a night still
 * resolve a short eclipse across many nights.
 */
final class FrequencyGrid {
    /**
     * Largest q<sub>eff</sub>, fraction of the period: eclipses of detached binaries last a few per cent of
     * the period, so the grid never gets coarser than this needs (common practice, no source).
     */
    static final double LARGEST_EFFECTIVE_DURATION = 0.05;
    private final double[] frequencies;
    private final double shortestDuration;
    private final double resolutionDays;

    private final double baselineDays;
    private final double oversampling;

    private FrequencyGrid(double[] frequencies, double shortestDuration, double resolutionDays, double baselineDays,
            double oversampling) {
        this.frequencies = frequencies;
        this.shortestDuration = shortestDuration;
        this.resolutionDays = resolutionDays;
        this.baselineDays = baselineDays;
        this.oversampling = oversampling;
    }

    /**
     * @param baselineDays span of the data, days
     * @param resolutionDays time resolution of the data (spacing of the closest points), days
     * @param minPeriodDays shortest trial period
     * @param maxPeriodDays longest trial period
     * @param shortestDuration shortest trial duration, fraction of the period
     * @param oversampling k in the rule above
     */
    static FrequencyGrid build(double baselineDays, double resolutionDays, double minPeriodDays, double maxPeriodDays,
            double shortestDuration, double oversampling) {
        double fMin = 1.0 / maxPeriodDays;
        double fMax = 1.0 / minPeriodDays;
        double[] f = new double[1024];
        int n = 0;
        double x = fMin;
        while (x <= fMax) {
            if (n == f.length) {
                f = Arrays.copyOf(f, n * 2);
            }
            f[n++] = x;
            x += effective(shortestDuration, resolutionDays, x) / (oversampling * baselineDays);
        }
        return new FrequencyGrid(Arrays.copyOf(f, n), shortestDuration, resolutionDays, baselineDays, oversampling);
    }

    /** The grid over the same range with the same rule for a baseline {@code factor} times shorter. */
    FrequencyGrid coarser(int factor) {
        double lo = frequencies[0];
        double hi = frequencies[frequencies.length - 1];
        FrequencyGrid g = build(baselineDays / factor, resolutionDays, 1.0 / hi, 1.0 / lo, shortestDuration, oversampling);
        if (g.frequencies[g.frequencies.length - 1] < hi) {
            double[] f = Arrays.copyOf(g.frequencies, g.frequencies.length + 1);
            f[f.length - 1] = hi;
            return new FrequencyGrid(f, shortestDuration, resolutionDays, baselineDays / factor, oversampling);
        }
        return g;
    }

    int size() {
        return frequencies.length;
    }

    double frequency(int i) {
        return frequencies[i];
    }

    /** The shortest duration (fraction of the period) the data can show at frequency f. */
    double effectiveShortestDuration(double f) {
        return effective(shortestDuration, resolutionDays, f);
    }

    private static double effective(double shortestDuration, double resolutionDays, double f) {
        return Math.max(shortestDuration, Math.min(LARGEST_EFFECTIVE_DURATION, resolutionDays * f));
    }
}
