package org.twinlight.sky;

import java.util.ArrayList;
import java.util.List;
import java.util.function.DoubleUnaryOperator;

/**
 * Times at which a body's altitude crosses a level (rising, setting, the Sun reaching −12°, ...):
 * the altitude is sampled on a grid and each sign change of (altitude − level) is refined by
 * Brent-style bisection and secant steps. Meeus 1998 (<i>Astronomical Algorithms</i>, ch. 15)
 * interpolates instead; both find the same root of the same altitude curve, this one to 0.1 s.
 */
public final class AltitudeCrossings {

    /** One crossing: a Julian date and whether the body was going up. */
    public record Crossing(double jd, boolean rising) {
    }

    /** Refinement stops when the bracket is narrower than this, days (0.1 s). */
    private static final double TOLERANCE_DAYS = 0.1 / 86400.0;

    private AltitudeCrossings() {
    }

    /**
     * Every crossing of {@code levelDeg} in [fromJd, toJd].
     *
     * @param altitudeDeg altitude as a function of the Julian date
     * @param stepDays grid step; crossings closer together than this may be missed (an hour is
     *     safe for the Sun, the Moon and stars away from the horizon-grazing case)
     */
    public static List<Crossing> find(DoubleUnaryOperator altitudeDeg, double fromJd, double toJd, double levelDeg,
            double stepDays) {
        List<Crossing> out = new ArrayList<>();
        double a = fromJd;
        double fa = altitudeDeg.applyAsDouble(a) - levelDeg;
        while (a < toJd) {
            double b = Math.min(toJd, a + stepDays);
            double fb = altitudeDeg.applyAsDouble(b) - levelDeg;
            if ((fa < 0) != (fb < 0)) {
                out.add(new Crossing(refine(altitudeDeg, levelDeg, a, fa, b, fb), fb >= 0));
            }
            a = b;
            fa = fb;
        }
        return out;
    }

    private static double refine(DoubleUnaryOperator f, double level, double a, double fa, double b, double fb) {
        double lo = a;
        double flo = fa;
        double hi = b;
        for (int i = 0; i < 100 && hi - lo > TOLERANCE_DAYS; i++) {
            double secant = lo - flo * (hi - lo) / (fb - flo);
            double mid = 0.5 * (lo + hi);
            // secant step when it falls well inside the bracket, else bisection
            double x = secant > lo + 0.05 * (hi - lo) && secant < hi - 0.05 * (hi - lo) && i % 2 == 0 ? secant : mid;
            double fx = f.applyAsDouble(x) - level;
            if ((fx < 0) == (flo < 0)) {
                lo = x;
                flo = fx;
            } else {
                hi = x;
                fb = fx;
            }
        }
        return 0.5 * (lo + hi);
    }
}
