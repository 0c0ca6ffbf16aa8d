package org.twinlight.sky;

import org.twinlight.time.JulianDate;
import org.twinlight.time.SunAndMoon;

/** The airmass of a star seen from a site. */
public final class Airmass {

    private Airmass() {
    }

    /**
     * Relative optical airmass at a geometric altitude, Kasten &amp; Young 1989 (Appl. Opt. 28, 4735;
     * coefficients from memory): X = 1/[sin h + 0.50572 (h + 6.07995°)^−1.6364], h in degrees;
     * close to sec z high in the sky and finite (about 38) at the horizon.
     *
     * @throws IllegalArgumentException below the horizon
     */
    public static double ofAltitudeDeg(double altitudeDeg) {
        if (!(altitudeDeg >= 0 && altitudeDeg <= 90)) {
            throw new IllegalArgumentException("the star is below the horizon (altitude " + altitudeDeg + "°)");
        }
        return 1 / (Math.sin(Math.toRadians(altitudeDeg)) + 0.50572 * Math.pow(altitudeDeg + 6.07995, -1.6364));
    }

    /**
     * The airmass of a J2000 direction from a site at an instant: precessed to the date, altitude
     * from the local mean sidereal time (UTC taken as UT1), then {@link #ofAltitudeDeg}.
     */
    public static double at(Equatorial j2000, Site site, JulianDate utc) {
        Equatorial now = Precession.fromJ2000(j2000, SunAndMoon.centuriesSinceJ2000(utc));
        return ofAltitudeDeg(Horizontal.altitudeDeg(now, site.latitudeDeg(), SiderealTime.localMeanDeg(utc, site)));
    }
}
