package org.twinlight.bench;

import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.twinlight.planning.DateRange;
import org.twinlight.planning.EclipseExtent;
import org.twinlight.planning.ObservingLimits;
import org.twinlight.planning.Plan;
import org.twinlight.planning.Planner;
import org.twinlight.planning.PlanningTarget;
import org.twinlight.planning.PredictionEphemeris;
import org.twinlight.report.PlanChart;
import org.twinlight.report.PredictionsCalendar;
import org.twinlight.report.PredictionsCsv;
import org.twinlight.sky.Site;
import org.twinlight.time.SkyDirection;
import org.twinlight.time.TimeScale;

/**
 * Times a one-year plan for 100 fictional targets (periods 0.3–10 d, log-uniform; positions
 * uniform on the sky north of −30°; BJD_TDB ephemerides) from one site, and the writing of
 * predictions.csv, predictions.ics and the chart. Run with
 * {@code java -cp target/classes:target/test-classes:$(deps) org.twinlight.bench.PlanningBench}.
 */
public final class PlanningBench {

    private PlanningBench() {
    }

    public static void main(String[] args) throws Exception {
        Random random = new Random(13);
        List<PlanningTarget> targets = new ArrayList<>();
        for (int i = 0; i < 100; i++) {
            double period = 0.3 * Math.pow(10 / 0.3, random.nextDouble());
            double dec = Math.toDegrees(Math.asin(-0.5 + 1.5 * random.nextDouble()));
            PredictionEphemeris eph = PredictionEphemeris.of(2461000 + period * random.nextDouble(), period, 2e-4,
                    3e-7 * period, TimeScale.BJD_TDB);
            targets.add(new PlanningTarget(String.format("Bench %03d", i), new SkyDirection(360 * random.nextDouble(),
                    dec), eph, EclipseExtent.ofDuration(0.08 * Math.cbrt(period), "bench")));
        }
        Site site = new Site(48.5, 9.1, 400);
        DateRange year = DateRange.of(LocalDate.of(2027, 1, 1), LocalDate.of(2028, 1, 1), false);
        Path dir = Files.createTempDirectory("planning-bench");
        // process CPU time (all threads, GC included): on a shared machine the wall time mostly measures the queue
        com.sun.management.OperatingSystemMXBean os = (com.sun.management.OperatingSystemMXBean)
                java.lang.management.ManagementFactory.getOperatingSystemMXBean();
        for (int k = 0; k < 3; k++) {
            long c0 = os.getProcessCpuTime();
            long t0 = System.nanoTime();
            Plan plan = Planner.plan(targets, site, year, ObservingLimits.DEFAULT);
            long t1 = System.nanoTime();
            long c1 = os.getProcessCpuTime();
            PredictionsCsv.write(dir.resolve("predictions.csv"), plan);
            PredictionsCalendar.write(dir.resolve("predictions.ics"), plan, Instant.now(), "bench");
            long t2 = System.nanoTime();
            PlanChart.write(dir.resolve("predictions.png"), plan);
            long t3 = System.nanoTime();
            long c3 = os.getProcessCpuTime();
            long observable = plan.predictions().stream().filter(p -> p.verdict().observable()).count();
            System.out.printf("100 targets, 1 year: %d minima (%d observable); plan %.2f s, CSV + iCalendar %.2f s,"
                    + " chart %.2f s, total %.2f s wall; process CPU: plan %.2f s, total %.2f s%n",
                    plan.predictions().size(), observable, (t1 - t0) / 1e9, (t2 - t1) / 1e9, (t3 - t2) / 1e9,
                    (t3 - t0) / 1e9, (c1 - c0) / 1e9, (c3 - c0) / 1e9);
        }
    }
}
