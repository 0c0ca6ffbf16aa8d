package org.twinlight.time;

import org.apache.commons.math3.geometry.euclidean.threed.Vector3D;

/**
 * Light-time (Rømer) delays from the geocentre to the Sun's centre and to the solar-system
 * barycentre along the direction of a target: Δt = (r⊕ · n̂)/c, with r⊕ the Earth's position
 * relative to the reference point and n̂ the unit vector towards the target (e.g. Eastman, Siverd
 * &amp; Gaudi 2010, PASP 122, 935, eq. 1 without the Shapiro and Einstein terms). A signal reaches
 * the reference point Δt after the geocentre when the Earth is on the target's side. The
 * Shapiro delay (≤ 20 µs away from the Sun's limb) and the observer's offset from the geocentre
 * (≤ 21 ms, R⊕/c) are not included.
 */
final class LightTime {

    /** Light time for one astronomical unit, s: 149 597 870 700 m / 299 792 458 m s⁻¹ (IAU 2012 B2; SI). */
    static final double AU_LIGHT_TIME_SECONDS = 149597870700.0 / 299792458.0;

    private LightTime() {
    }

    /**
     * Delay in seconds to add to a geocentric time to refer it to {@code reference}.
     *
     * @param reference where the time is referred to (geocentric gives 0)
     * @param geocentric the geocentric instant, any standard from 1972 on for UTC
     * @param direction the target
     */
    static double delaySeconds(TimeReference reference, JulianDate geocentric, SkyDirection direction) {
        if (reference == TimeReference.GEOCENTRIC) {
            return 0;
        }
        JulianDate tdb = TimeStandards.convert(geocentric, TimeStandard.TDB);
        Vector3D earth = reference == TimeReference.HELIOCENTRIC
                ? SolarSystemEphemeris.earthHeliocentric(tdb)
                : SolarSystemEphemeris.earthBarycentric(tdb);
        return earth.dotProduct(direction.unitVector()) * AU_LIGHT_TIME_SECONDS;
    }
}
