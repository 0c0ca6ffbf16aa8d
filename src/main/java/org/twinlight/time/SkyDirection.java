package org.twinlight.time;

import java.util.Locale;
import org.apache.commons.math3.geometry.euclidean.threed.Vector3D;

/**
 * A target's direction: right ascension and declination in degrees, ICRS / J2000 mean equator and
 * equinox (the two agree to 0.02″, far below what light-time corrections need).
 *
 * @param raDeg right ascension, degrees in [0, 360)
 * @param decDeg declination, degrees in [−90, 90]
 */
public record SkyDirection(double raDeg, double decDeg) {

    public SkyDirection {
        if (!(raDeg >= 0 && raDeg < 360)) {
            throw new IllegalArgumentException("right ascension must be in [0, 360) degrees, got " + raDeg);
        }
        if (!(decDeg >= -90 && decDeg <= 90)) {
            throw new IllegalArgumentException("declination must be in [−90, 90] degrees, got " + decDeg);
        }
    }

    /** Unit vector towards the target, ICRS axes. */
    public Vector3D unitVector() {
        double ra = Math.toRadians(raDeg);
        double dec = Math.toRadians(decDeg);
        return new Vector3D(Math.cos(dec) * Math.cos(ra), Math.cos(dec) * Math.sin(ra), Math.sin(dec));
    }

    /**
     * Reads a right ascension: decimal degrees ({@code 83.6331}) or sexagesimal hours
     * {@code hh:mm:ss.s} (also separated by spaces, or with h/m/s letters).
     *
     * @throws IllegalArgumentException naming the text and the accepted forms
     */
    public static double parseRaDeg(String text) {
        double deg = parseAngle(text, "right ascension", "degrees (0 ≤ RA < 360) or hh:mm:ss.s", 15.0);
        if (!(deg >= 0 && deg < 360)) {
            throw new IllegalArgumentException("right ascension '" + text + "' is outside 0–360° (0–24 h)");
        }
        return deg;
    }

    /**
     * Reads a declination: decimal degrees ({@code -5.39}) or sexagesimal {@code ±dd:mm:ss.s}
     * (also separated by spaces, or with d/m/s letters); the sign applies to the whole value, so
     * {@code -00:30:00} is −0.5°.
     *
     * @throws IllegalArgumentException naming the text and the accepted forms
     */
    public static double parseDecDeg(String text) {
        double deg = parseAngle(text, "declination", "degrees (−90 to 90) or ±dd:mm:ss.s", 1.0);
        if (!(deg >= -90 && deg <= 90)) {
            throw new IllegalArgumentException("declination '" + text + "' is outside −90° to +90°");
        }
        return deg;
    }

    /**
     * Decimal degrees, or sexagesimal fields (a:b:c, a b c, or with unit letters) scaled by
     * {@code sexagesimalUnitDeg} (15 for hours, 1 for degrees). The sign applies to the whole.
     */
    private static double parseAngle(String text, String what, String expected, double sexagesimalUnitDeg) {
        String problem = "cannot read " + what + " '" + text + "': expected " + expected;
        String t = text == null ? "" : text.trim().toLowerCase(Locale.ROOT).replace('−', '-');
        double sign = t.startsWith("-") ? -1 : 1;
        if (t.startsWith("-") || t.startsWith("+")) {
            t = t.substring(1).trim();
        }
        String number = "\\d+(\\.\\d*)?|\\.\\d+";
        if (t.matches(number)) {
            return sign * Double.parseDouble(t);
        }
        String[] fields = t.split("\\s*[:hdms°'\"\\s]\\s*");
        if (fields.length < 1 || fields.length > 3 || t.isEmpty()) {
            throw new IllegalArgumentException(problem);
        }
        double value = 0;
        double unit = 1;
        for (int i = 0; i < fields.length; i++) {
            if (!fields[i].matches(number)) {
                throw new IllegalArgumentException(problem);
            }
            double field = Double.parseDouble(fields[i]);
            if (i < fields.length - 1 && field != Math.rint(field)) {
                throw new IllegalArgumentException(problem + " (only the last field may have decimals)");
            }
            if (i > 0 && field >= 60) {
                throw new IllegalArgumentException(problem + " (minutes and seconds must be below 60)");
            }
            value += field * unit;
            unit /= 60;
        }
        return sign * value * sexagesimalUnitDeg;
    }
}
