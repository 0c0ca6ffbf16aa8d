package org.twinlight.time;

/**
 * Converts instants between every combination of reference (JD, HJD, BJD) and standard (UTC,
 * TAI, TT, TDB), in JD or MJD numbering.
 *
 * <p>The route is always: remove the light-time delay of the source reference (by fixed-point
 * iteration, since the delay is evaluated at the geocentric instant), change the clock at the
 * geocentre ({@code UTC ↔ TAI ↔ TT ↔ TDB}), add the delay of the target reference. So HJD_UTC is
 * the geocentric UTC plus the heliocentric delay, and BJD_TDB the geocentric TDB plus the
 * barycentric delay (Eastman, Siverd &amp; Gaudi 2010, PASP 122, 935).
 *
 * <p>Accuracy, measured against the IAU SOFA/ERFA routines ({@code eraUtctai}, {@code eraTaitt},
 * {@code eraDtdb}, {@code eraEpv00}) over 1990–2035: see docs/time-scales.md. The observer is
 * placed at the geocentre (an error of at most 21 ms).
 *
 * <p>Limits: UTC before 1972 is refused; heliocentric and barycentric corrections need dates in
 * 1800–2050 (the ephemeris range). Both are reported as {@link org.twinlight.BadInputException}.
 */
public final class TimeConverter {

    /** Convergence of the inverse light-time iteration, seconds. */
    private static final double ITERATION_TOLERANCE_SECONDS = 1e-9;

    private TimeConverter() {
    }

    /**
     * True when converting from {@code from} to {@code to} needs the target's direction: when a
     * heliocentric or barycentric reference is involved and the two scales differ in more than
     * the JD/MJD numbering.
     */
    public static boolean needsDirection(TimeScale from, TimeScale to) {
        if (from.asJulianDays().equals(to.asJulianDays())) {
            return false;
        }
        return from.reference() != TimeReference.GEOCENTRIC || to.reference() != TimeReference.GEOCENTRIC;
    }

    /**
     * The instant {@code date} expressed in {@code target} (numbered in JD; use
     * {@link JulianDate#valueIn} for the MJD form).
     *
     * @param direction the target's direction; may be null only when {@link #needsDirection} is false
     */
    public static JulianDate convert(JulianDate date, TimeScale target, SkyDirection direction) {
        if (target == null || !target.isKnown()) {
            throw new IllegalArgumentException("the target time scale must be declared, got " + target);
        }
        TimeScale to = target.asJulianDays();
        if (date.scale().equals(to)) {
            return date;
        }
        if (direction == null && needsDirection(date.scale(), to)) {
            throw new IllegalArgumentException("converting " + date.scale().label() + " to " + to.label()
                    + " needs the target's right ascension and declination");
        }
        JulianDate geocentric = toGeocentric(date, direction);
        JulianDate clock = TimeStandards.convert(geocentric, to.standard());
        double delay = LightTime.delaySeconds(to.reference(), clock, direction);
        return clock.plusSeconds(delay).relabel(to);
    }

    /**
     * The number {@code value} in scale {@code from} converted to scale {@code to} (JD or MJD
     * numbering as each scale says).
     */
    public static double convert(double value, TimeScale from, TimeScale to, SkyDirection direction) {
        return convert(JulianDate.of(value, from), to, direction).valueIn(to);
    }

    /** Solves g + delay(g) = t for the geocentric instant g in the same standard. */
    private static JulianDate toGeocentric(JulianDate date, SkyDirection direction) {
        TimeReference reference = date.scale().reference();
        TimeScale geoScale = new TimeScale(TimeReference.GEOCENTRIC, date.scale().standard(), false);
        JulianDate referred = date.relabel(geoScale);
        if (reference == TimeReference.GEOCENTRIC) {
            return referred;
        }
        // The delay changes by at most ~1e-4 s per second (Earth's speed / c), so each step
        // shrinks the error ~1e4 times: three or four steps reach 1e-9 s.
        JulianDate geocentric = referred;
        for (int i = 0; i < 8; i++) {
            JulianDate next = referred.plusSeconds(-LightTime.delaySeconds(reference, geocentric, direction));
            double change = next.secondsSince(geocentric);
            geocentric = next;
            if (Math.abs(change) < ITERATION_TOLERANCE_SECONDS) {
                break;
            }
        }
        return geocentric;
    }
}
