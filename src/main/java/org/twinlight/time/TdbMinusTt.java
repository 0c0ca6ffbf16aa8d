package org.twinlight.time;

/**
 * TDB − TT at the geocentre, in seconds, from the periodic series of Kaplan (2005), USNO
 * Circular 179, eq. 2.6: the seven largest terms of Fairhead &amp; Bretagnon (1990, A&amp;A 229,
 * 240). Its largest difference from the full 787-term series is 9.3 µs over 1900–2100 (recomputed
 * with ERFA {@code eraDtdb}); the observer's topocentric terms (≤ 2 µs) are left out.
 */
final class TdbMinusTt {

    private TdbMinusTt() {
    }

    /**
     * TDB − TT in seconds.
     *
     * @param centuriesSinceJ2000 Julian centuries of TT (or TDB: the difference does not matter
     *     at this precision) from J2000.0
     */
    static double seconds(double centuriesSinceJ2000) {
        double t = centuriesSinceJ2000;
        // Kaplan 2005, USNO Circular 179, eq. 2.6; coefficients in seconds, arguments in radians.
        return 0.001657 * Math.sin(628.3076 * t + 6.2401)
                + 0.000022 * Math.sin(575.3385 * t + 4.2970)
                + 0.000014 * Math.sin(1256.6152 * t + 6.1969)
                + 0.000005 * Math.sin(606.9777 * t + 4.0212)
                + 0.000005 * Math.sin(52.9691 * t + 0.4444)
                + 0.000002 * Math.sin(21.3299 * t + 5.5431)
                + 0.000010 * t * Math.sin(628.3076 * t + 4.2490);
    }
}
