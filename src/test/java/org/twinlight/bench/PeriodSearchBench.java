package org.twinlight.bench;

import java.lang.management.ManagementFactory;
import java.util.Locale;
import org.twinlight.photometry.LightCurve;
import org.twinlight.timing.period.PeriodScenarios;
import org.twinlight.timing.period.PeriodSearch;
import org.twinlight.timing.period.PeriodSearchResult;
import org.twinlight.timing.period.PeriodSearchSettings;
import org.twinlight.timing.period.SyntheticEclipsingCurve;

/**
 * Benchmark of the whole period search (periodogram, candidates refined and compared, the decision, the
 * final measurement) on the reference light curves: 27 days at 2-minute cadence (~19,400 points, target
 * ≤ 1 s), three seasons of sparse survey data (800 points over 900 days, periods from 0.2 d, target
 * ≤ 10 s) and 4 years at 30-minute cadence (~70,100 points, target ≤ 60 s), all cores. Wall time and the
 * process CPU time are both printed: on a shared machine the wall time includes waiting for a core. Run
 * with {@code java -cp target/classes:target/test-classes:DEPS org.twinlight.bench.PeriodSearchBench [repeats]}.
 */
public final class PeriodSearchBench {
    private PeriodSearchBench() {
    }

    public static void main(String[] args) {
        int repeats = args.length > 0 ? Integer.parseInt(args[0]) : 3;
        System.out.printf(Locale.ROOT, "cores available: %d%n", Runtime.getRuntime().availableProcessors());
        SyntheticEclipsingCurve shortSystem = new SyntheticEclipsingCurve(3.4172, 2460000.9, 0.12, 0.04, 0.05, 0.5, 0.04, 0.3);
        LightCurve shortCurve = shortSystem.sample(2460000.0, 27, 2.0 / 1440, 0.002, 1, true);
        PeriodScenarios.Case survey = PeriodScenarios.sparseSurvey(1, 267);
        SyntheticEclipsingCurve longSystem = new SyntheticEclipsingCurve(5.8817, 2458001.3, 0.10, 0.03, 0.06, 0.47, 0.035, 0.3);
        LightCurve longCurve = longSystem.sample(2458000.0, 4 * 365.25, 30.0 / 1440, 0.003, 2, true);
        run("27 d, 2 min", shortCurve, shortSystem.periodDays(), repeats, 1);
        run("survey, 800 pts", survey.lightCurve(), survey.truePeriodDays(), repeats, 10);
        if (args.length < 2 || !args[1].equals("short")) {
            run("4 yr, 30 min", longCurve, longSystem.periodDays(), repeats, 60);
        }
    }

    private static double processCpuSeconds() {
        java.lang.management.OperatingSystemMXBean os = ManagementFactory.getOperatingSystemMXBean();
        return os instanceof com.sun.management.OperatingSystemMXBean sun ? sun.getProcessCpuTime() / 1e9
                : Double.NaN;
    }

    private static void run(String name, LightCurve lc, double truePeriod, int repeats, double targetSeconds) {
        double best = Double.POSITIVE_INFINITY;
        double bestCpu = Double.POSITIVE_INFINITY;
        PeriodSearchResult r = null;
        for (int k = 0; k < repeats; k++) {
            double c0 = processCpuSeconds();
            long t0 = System.nanoTime();
            r = PeriodSearch.search(lc, PeriodSearchSettings.defaults());
            double s = (System.nanoTime() - t0) / 1e9;
            double cpu = processCpuSeconds() - c0;
            best = Math.min(best, s);
            bestCpu = Math.min(bestCpu, cpu);
            System.out.printf(Locale.ROOT, "%-15s run %d: wall %.2f s, CPU %.2f s%n", name, k + 1, s, cpu);
        }
        System.out.printf(Locale.ROOT,
                "%-15s %d points, %d trial frequencies from %.3g d: best of %d wall %.2f s, CPU %.2f s (target %.0f s"
                        + " wall) %s; P = %.7f ± %.7f d (true %.7f), %s%n", name, lc.size(), r.search().frequencies(),
                r.search().minPeriodDays(), repeats, best, bestCpu, targetSeconds,
                best <= targetSeconds ? "MET" : "MISSED", r.periodDays(), r.periodUncertaintyDays(), truePeriod,
                r.decision().headline());
    }
}
