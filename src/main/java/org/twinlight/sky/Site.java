package org.twinlight.sky;

import java.util.Locale;
import org.twinlight.BadInputException;

/**
 * An observing site: geodetic latitude and longitude (east positive) in degrees and height above
 * the reference ellipsoid (or sea level: the difference is immaterial here) in metres.
 *
 * @param latitudeDeg geodetic latitude, degrees in [−90, 90]
 * @param longitudeDeg longitude east of Greenwich, degrees in [−180, 360)
 * @param heightM height, metres
 */
public record Site(double latitudeDeg, double longitudeDeg, double heightM) {

    /** @throws BadInputException naming the value and the allowed range */
    public Site {
        if (!(latitudeDeg >= -90 && latitudeDeg <= 90)) {
            throw new BadInputException(String.format(Locale.ROOT,
                    "site latitude %s° is outside −90° to +90° (give LAT,LON[,HEIGHT_M], latitude first)",
                    latitudeDeg));
        }
        if (!(longitudeDeg >= -180 && longitudeDeg < 360)) {
            throw new BadInputException(String.format(Locale.ROOT,
                    "site longitude %s° is outside −180° to +360° (east positive)", longitudeDeg));
        }
        if (!(heightM > -500 && heightM < 9000)) {
            throw new BadInputException(String.format(Locale.ROOT,
                    "site height %s m is not a height on the Earth's surface (expected −500 to 9000 m)", heightM));
        }
    }

    /**
     * Reads {@code LAT,LON[,HEIGHT_M]}: decimal degrees (longitude east positive) or sexagesimal
     * {@code ±dd:mm:ss}, height in metres (default 0).
     *
     * @param text the text as given
     * @param where where it came from, for messages (e.g. "option --site")
     */
    public static Site parse(String text, String where) {
        String[] parts = text == null ? new String[0] : text.trim().split("\\s*,\\s*");
        if (parts.length < 2 || parts.length > 3) {
            throw new BadInputException(where + ": cannot read site '" + text
                    + "': expected LAT,LON[,HEIGHT_M] (degrees, longitude east positive; height in metres)");
        }
        double lat = angle(parts[0], where, "latitude", text);
        double lon = angle(parts[1], where, "longitude", text);
        double height = 0;
        if (parts.length == 3) {
            try {
                height = Double.parseDouble(parts[2]);
            } catch (NumberFormatException e) {
                throw new BadInputException(where + ": cannot read the height '" + parts[2] + "' in site '" + text
                        + "': expected metres");
            }
        }
        try {
            return new Site(lat, lon, height);
        } catch (BadInputException e) {
            throw new BadInputException(where + ": " + e.getMessage());
        }
    }

    private static double angle(String field, String where, String what, String text) {
        String t = field.replace('−', '-');
        double sign = t.startsWith("-") ? -1 : 1;
        String body = t.startsWith("-") || t.startsWith("+") ? t.substring(1) : t;
        String[] f = body.split(":");
        try {
            double v = 0;
            double unit = 1;
            for (String s : f) {
                double x = Double.parseDouble(s);
                if (!(x >= 0) || (unit < 1 && x >= 60)) {
                    throw new NumberFormatException();
                }
                v += x * unit;
                unit /= 60;
            }
            if (f.length > 3) {
                throw new NumberFormatException();
            }
            return sign * v;
        } catch (NumberFormatException e) {
            throw new BadInputException(where + ": cannot read the " + what + " '" + field + "' in site '" + text
                    + "': expected decimal degrees or ±dd:mm:ss");
        }
    }
}
