package org.twinlight.time;

import org.apache.commons.math3.geometry.euclidean.threed.Vector3D;

/**
 * Mean Keplerian elements of the major planets and their rates, referred to the mean ecliptic and
 * equinox of J2000, from E. M. Standish, "Keplerian Elements for Approximate Positions of the
 * Major Planets" (JPL Solar System Dynamics), Table 1, a fit to DE405 valid 1800–2050 (values
 * transcribed from memory; their agreement with the IAU-standard Earth ephemeris is measured in
 * the tests and in docs/time-scales.md).
 *
 * <p>Each row: semi-major axis a (au), eccentricity e, inclination I (deg), mean longitude L
 * (deg), longitude of perihelion ϖ (deg), longitude of the ascending node Ω (deg), then the same
 * six rates per Julian century of TDB. Mass ratios Sun/planet are the IAU (1976) / DE405 system
 * values (IERS Conventions 2003, Table 3.1; from memory), for the barycentre.
 */
enum PlanetElements {
    MERCURY(6023600.0,
            0.38709927, 0.20563593, 7.00497902, 252.25032350, 77.45779628, 48.33076593,
            0.00000037, 0.00001906, -0.00594749, 149472.67411175, 0.16047689, -0.12534081),
    VENUS(408523.71,
            0.72333566, 0.00677672, 3.39467605, 181.97909950, 131.60246718, 76.67984255,
            0.00000390, -0.00004107, -0.00078890, 58517.81538729, 0.00268329, -0.27769418),
    /** The Earth–Moon barycentre; the mass ratio is Sun/(Earth + Moon). */
    EARTH_MOON_BARYCENTRE(328900.56,
            1.00000261, 0.01671123, -0.00001531, 100.46457166, 102.93768193, 0.0,
            0.00000562, -0.00004392, -0.01294668, 35999.37244981, 0.32327364, 0.0),
    MARS(3098708.0,
            1.52371034, 0.09339410, 1.84969142, -4.55343205, -23.94362959, 49.55953891,
            0.00001847, 0.00007882, -0.00813131, 19140.30268499, 0.44441088, -0.29257343),
    JUPITER(1047.3486,
            5.20288700, 0.04838624, 1.30439695, 34.39644051, 14.72847983, 100.47390909,
            -0.00011607, -0.00013253, -0.00183714, 3034.74612775, 0.21252668, 0.20469106),
    SATURN(3497.898,
            9.53667594, 0.05386179, 2.48599187, 49.95424423, 92.59887831, 113.66242448,
            -0.00125060, -0.00050991, 0.00193609, 1222.49362201, -0.41897216, -0.28867794),
    URANUS(22902.98,
            19.18916464, 0.04725744, 0.77263783, 313.23810451, 170.95427630, 74.01692503,
            -0.00196176, -0.00004397, -0.00242939, 428.48202785, 0.40805281, 0.04240589),
    NEPTUNE(19412.24,
            30.06992276, 0.00859048, 1.77004347, -55.12002969, 44.96476227, 131.78422574,
            0.00026291, 0.00005105, 0.00035372, 218.45945325, -0.32241464, -0.00508664);

    /** Sun's mass over this body's mass. */
    final double sunMassRatio;
    private final double[] base;
    private final double[] rate;

    PlanetElements(double sunMassRatio, double a, double e, double i, double l, double peri, double node,
            double aRate, double eRate, double iRate, double lRate, double periRate, double nodeRate) {
        this.sunMassRatio = sunMassRatio;
        this.base = new double[] {a, e, i, l, peri, node};
        this.rate = new double[] {aRate, eRate, iRate, lRate, periRate, nodeRate};
    }

    /**
     * Heliocentric position in au, mean ecliptic and equinox of J2000 (Standish's recipe: mean
     * anomaly M = L − ϖ, argument of perihelion ω = ϖ − Ω, Kepler's equation, rotation by ω, I, Ω).
     *
     * @param t Julian centuries of TDB from J2000.0
     */
    Vector3D heliocentricEcliptic(double t) {
        double a = base[0] + rate[0] * t;
        double e = base[1] + rate[1] * t;
        double inc = Math.toRadians(base[2] + rate[2] * t);
        double meanLongitude = base[3] + rate[3] * t;
        double perihelion = base[4] + rate[4] * t;
        double node = Math.toRadians(base[5] + rate[5] * t);
        double omega = Math.toRadians(perihelion) - node;
        double meanAnomaly = Math.toRadians(Math.IEEEremainder(meanLongitude - perihelion, 360.0));
        double ecc = solveKepler(meanAnomaly, e);
        double xOrbit = a * (Math.cos(ecc) - e);
        double yOrbit = a * Math.sqrt(1 - e * e) * Math.sin(ecc);
        double cw = Math.cos(omega);
        double sw = Math.sin(omega);
        double cn = Math.cos(node);
        double sn = Math.sin(node);
        double ci = Math.cos(inc);
        double si = Math.sin(inc);
        double x = (cw * cn - sw * sn * ci) * xOrbit + (-sw * cn - cw * sn * ci) * yOrbit;
        double y = (cw * sn + sw * cn * ci) * xOrbit + (-sw * sn + cw * cn * ci) * yOrbit;
        double z = (sw * si) * xOrbit + (cw * si) * yOrbit;
        return new Vector3D(x, y, z);
    }

    /** Eccentric anomaly (rad) from E − e sin E = M by Newton's method (e &lt; 0.3 here). */
    static double solveKepler(double meanAnomaly, double e) {
        double ecc = meanAnomaly + e * Math.sin(meanAnomaly);
        for (int k = 0; k < 20; k++) {
            double step = (ecc - e * Math.sin(ecc) - meanAnomaly) / (1 - e * Math.cos(ecc));
            ecc -= step;
            if (Math.abs(step) < 1e-15) {
                break;
            }
        }
        return ecc;
    }
}
