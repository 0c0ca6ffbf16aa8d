package org.twinlight.sky;

import org.twinlight.time.JulianDate;

/**
 * Greenwich mean sidereal time (Meeus 1998, <i>Astronomical Algorithms</i>, eq. 12.4, the IAU 1982
 * expression). UT1 is taken as UTC (|UT1 − UTC| &lt; 0.9 s, 0.004° of hour angle); the equation of
 * the equinoxes (≤ 1.2 s) is left out, so this is mean, not apparent, sidereal time.
 */
public final class SiderealTime {

    private SiderealTime() {
    }

    /**
     * Greenwich mean sidereal time in degrees, [0, 360).
     *
     * @param utc the instant, UTC (taken as UT1)
     */
    public static double greenwichMeanDeg(JulianDate utc) {
        // day count split so that the large product keeps its precision
        double days = (utc.dayStartJd() - 2451545.0) + utc.fractionOfDay();
        double t = days / 36525.0;
        double theta = 280.46061837 + 360.98564736629 * (utc.dayStartJd() - 2451545.0)
                + 360.98564736629 * utc.fractionOfDay() + t * t * (0.000387933 - t / 38710000.0);
        return normalise(theta);
    }

    /** Local mean sidereal time at a site, degrees in [0, 360). */
    public static double localMeanDeg(JulianDate utc, Site site) {
        return normalise(greenwichMeanDeg(utc) + site.longitudeDeg());
    }

    static double normalise(double deg) {
        double d = deg % 360.0;
        return d < 0 ? d + 360.0 : d;
    }
}
