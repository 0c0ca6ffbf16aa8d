package org.twinlight.planning;

/**
 * The Moon at a minimum, seen from the site.
 *
 * @param altitudeDeg topocentric geometric altitude, degrees
 * @param illuminatedFraction illuminated fraction of the disc, 0–1
 * @param separationDeg angular distance from the target, degrees
 */
public record MoonView(double altitudeDeg, double illuminatedFraction, double separationDeg) {
}
