/**
 * Time scales and Julian dates: which clock and which reference point a column of times uses,
 * conversions between UTC, TAI, TT and TDB, and heliocentric/barycentric light-time corrections.
 *
 * <p>Public API: {@link org.twinlight.time.TimeScale} (with {@link org.twinlight.time.TimeReference}
 * and {@link org.twinlight.time.TimeStandard}), {@link org.twinlight.time.JulianDate} (split-day
 * instant), {@link org.twinlight.time.CalendarDate} (Meeus ch. 7),
 * {@link org.twinlight.time.SkyDirection} (target RA/Dec, J2000),
 * {@link org.twinlight.time.TimeConverter} (every scale to every other) and
 * {@link org.twinlight.time.SunAndMoon} (the Sun and Moon of the compact ephemeris, for planning). The leap-second table,
 * the TDB − TT series and the compact solar-system ephemeris are package-private; docs/time-scales.md
 * gives their sources and measured accuracy.
 *
 * <p>Independent of every other twinlight package except the exception types of
 * {@code org.twinlight}; uses Commons Math's {@code Vector3D}.
 */
package org.twinlight.time;
