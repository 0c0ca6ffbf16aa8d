package org.twinlight.timing.minima;

/**
 * Primary minus secondary O−C, from straight lines fitted to each series separately around the
 * common mean cycle Ē: the mean difference at Ē and its trend per cycle. In an eccentric orbit
 * the secondary is displaced from phase 0.5 by about (2P/π)·e·cos ω (to first order in e), and
 * apsidal motion makes that displacement change: the two series drift in opposite directions and
 * the trend is non-zero (e.g. Giménez &amp; Garcia-Pelayo 1983, Ap&amp;SS 92, 203; from memory).
 *
 * @param meanCycle Ē
 * @param meanDifferenceDays (O−C)_primary − (O−C)_secondary at Ē, days
 * @param meanDifferenceErrorDays its 1σ, days
 * @param trendDaysPerCycle the change of that difference per cycle, days/cycle
 * @param trendErrorDaysPerCycle its 1σ, days/cycle
 * @param primaryCount number of primary timings
 * @param secondaryCount number of secondary timings
 */
public record OcSeriesDifference(double meanCycle, double meanDifferenceDays, double meanDifferenceErrorDays,
        double trendDaysPerCycle, double trendErrorDaysPerCycle, int primaryCount, int secondaryCount) {
}
