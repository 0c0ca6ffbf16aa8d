package org.twinlight.planning;

import org.apache.commons.math3.geometry.euclidean.threed.Vector3D;
import org.twinlight.sky.MoonPlace;
import org.twinlight.sky.SunPlace;
import org.twinlight.time.JulianDate;
import org.twinlight.time.TimeScale;

/**
 * Geocentric Sun and Moon positions (km, equator of date) tabulated every
 * {@value #STEP_HOURS} hour over a range and interpolated linearly, so that a plan with tens of
 * thousands of minima evaluates the ephemerides once per hour rather than once per minimum. The
 * Moon's path bends by about 0.5°/h × 13°/day: linear interpolation over an hour is off by less than
 * 10 km (0.002°), the Sun's by far less.
 */
final class SunMoonTable {

    static final double STEP_HOURS = 1.0;

    private final double firstJd;
    private final double stepDays;
    private final Vector3D[] sun;
    private final Vector3D[] moon;

    SunMoonTable(double fromJd, double toJd) {
        stepDays = STEP_HOURS / 24.0;
        firstJd = fromJd - 1;
        int n = (int) Math.ceil((toJd + 1 - firstJd) / stepDays) + 1;
        sun = new Vector3D[n];
        moon = new Vector3D[n];
        for (int i = 0; i < n; i++) {
            JulianDate t = JulianDate.of(firstJd + i * stepDays, TimeScale.JD_UTC);
            sun[i] = SunPlace.at(t).vectorKm();
            moon[i] = MoonPlace.geocentricKm(t);
        }
    }

    SunPlace sun(double utcJd) {
        return SunPlace.ofVectorKm(interpolate(sun, utcJd));
    }

    Vector3D moonKm(double utcJd) {
        return interpolate(moon, utcJd);
    }

    private Vector3D interpolate(Vector3D[] table, double jd) {
        double x = (jd - firstJd) / stepDays;
        int i = (int) Math.floor(x);
        if (i < 0 || i + 1 >= table.length) {
            throw new IllegalArgumentException("Julian date " + jd + " is outside the table");
        }
        double f = x - i;
        return new Vector3D(1 - f, table[i], f, table[i + 1]);
    }
}
