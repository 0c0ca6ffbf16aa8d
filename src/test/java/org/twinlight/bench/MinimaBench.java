package org.twinlight.bench;

import java.util.Map;
import java.util.Random;
import org.twinlight.photometry.LightCurve;
import org.twinlight.photometry.ValueKind;
import org.twinlight.time.TimeScale;
import org.twinlight.timing.Ephemeris;
import org.twinlight.timing.minima.MinimumFinder;
import org.twinlight.timing.minima.MinimumMethod;
import org.twinlight.timing.minima.MinimumSearchResult;
import org.twinlight.timing.minima.MinimumSettings;
import org.twinlight.timing.minima.OcAnalysis;
import org.twinlight.timing.minima.OcResult;

/**
 * Times the search for minima and the O−C fits on a synthetic 27-day, 2-minute light curve
 * (about 19,400 points, period 3.1 d). Run with
 * {@code java -cp target/classes:target/test-classes:$(deps) org.twinlight.bench.MinimaBench}.
 */
public final class MinimaBench {

    private MinimaBench() {
    }

    public static void main(String[] args) {
        double period = 3.1;
        double epoch = 2460100.2;
        double half = 0.08;
        Random random = new Random(4);
        int n = (int) (27.0 * 720);
        double[] t = new double[n];
        double[] f = new double[n];
        double[] e = new double[n];
        for (int i = 0; i < n; i++) {
            t[i] = epoch - 1 + i / 720.0;
            double phase = (t[i] - epoch) / period;
            double x = (phase - Math.rint(phase)) * period;
            double xs = (phase - 0.5 - Math.rint(phase - 0.5)) * period;
            f[i] = 1 - 0.3 * dip(x, half) - 0.12 * dip(xs, half) + 0.002 * random.nextGaussian();
            e[i] = 0.002;
        }
        LightCurve lc = new LightCurve("bench", null, TimeScale.BJD_TDB, ValueKind.FLUX, t, f, e, Map.of());
        Ephemeris eph = new Ephemeris(epoch, period);
        for (int k = 0; k < 5; k++) {
            long t0 = System.nanoTime();
            MinimumSearchResult r = MinimumFinder.find(lc, eph, MinimumSettings.defaults());
            long t1 = System.nanoTime();
            OcResult oc = OcAnalysis.analyse(r.minima(MinimumMethod.TEMPLATE), eph, true);
            long t2 = System.nanoTime();
            System.out.printf("%d points, %d minima: search and timing %.0f ms, O−C fits %.0f ms (preferred %s)%n",
                    lc.size(), r.minima().size(), (t1 - t0) / 1e6, (t2 - t1) / 1e6, oc.preferred().label());
        }
    }

    private static double dip(double x, double half) {
        double u = x / half;
        return Math.abs(u) >= 1 ? 0 : Math.pow(1 - u * u, 1.5);
    }
}
