package org.twinlight.report;

import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import org.twinlight.time.TimeScale;
import org.twinlight.timing.Ephemeris;
import org.twinlight.timing.minima.MinimumTime;

/**
 * Writes {@code minima.csv}: {@code cycle,type,time,error,method,n_points} (the contract's
 * columns, in that order), then {@code beta}, the correlated-noise factor, and {@code coverage} ({@code full} or
 * {@code partial}); one row per minimum and
 * method, after {@code #} comment lines naming the time scale, the source and the ephemeris
 * of the cycle numbers. Times and errors in days; cycle an integer for primary, n + 0.5 for
 * secondary.
 */
public final class MinimaCsv {

    private MinimaCsv() {
    }

    public static void write(Path target, List<MinimumTime> minima, TimeScale timeScale, String source,
            Ephemeris ephemeris) {
        StringBuilder sb = new StringBuilder();
        sb.append("# times of minimum; time scale: ").append(timeScale.isKnown() ? timeScale.label() : "unknown")
                .append("; times and errors in days\n");
        sb.append("# source: ").append(source).append('\n');
        sb.append(String.format(Locale.ROOT, "# cycle numbers from epoch %.8f, period %.10f d%n",
                ephemeris.epochDays(), ephemeris.periodDays()));
        sb.append("# beta: correlated-noise factor of the light near the eclipse (Winn et al. 2008); the error "
                + "already includes max(1, beta); empty when it could not be estimated\n");
        sb.append("# coverage: full, or partial (time from the template, shape and depth fixed by the well-covered "
                + "eclipses)\n");
        sb.append("cycle,type,time,error,method,n_points,beta,coverage\n");
        for (MinimumTime m : minima) {
            sb.append(cycleText(m.cycle())).append(',').append(m.type().label()).append(',')
                    .append(String.format(Locale.ROOT, "%.8f,%.8f", m.timeDays(), m.errorDays())).append(',')
                    .append(m.method().label()).append(',').append(m.nPoints()).append(',')
                    .append(Double.isFinite(m.beta()) ? String.format(Locale.ROOT, "%.2f", m.beta()) : "")
                    .append(',').append(m.partial() ? "partial" : "full").append('\n');
        }
        AtomicFiles.writeString(target, sb.toString());
    }

    /** "12" for a primary cycle, "12.5" for a secondary one. */
    public static String cycleText(double cycle) {
        return cycle == Math.rint(cycle) ? Long.toString((long) cycle) : String.format(Locale.ROOT, "%.1f", cycle);
    }
}
