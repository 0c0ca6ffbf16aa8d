/**
 * The sky seen from a site, for planning observations: the {@link org.twinlight.sky.Site},
 * sidereal time, precession from J2000 to the equator of date, horizontal coordinates, the Sun and
 * the Moon (place, altitude, illuminated fraction), darkness and the times a body crosses an
 * altitude. Methods and accuracy: docs/planning.md (Meeus, <i>Astronomical Algorithms</i>, 2nd ed.,
 * chapters 11, 12, 13, 15, 21, 22 and 48).
 *
 * <p>Depends only on {@code org.twinlight.time} (Julian dates, the Sun and Moon ephemerides) and
 * the exception types of {@code org.twinlight}; no files, no terminal, no plots.
 */
package org.twinlight.sky;
