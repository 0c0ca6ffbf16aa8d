/**
 * Period search: Box Least Squares detection, every candidate period refined from its own eclipse
 * timings and compared (phase dispersion, in-eclipse dispersion, timing χ²), the half-period resolution
 * from a second eclipse, alternate eclipses and coverage, and the verdict (confident, ambiguous with what
 * would settle it, or not significant).
 *
 * <p>May use {@code photometry}, {@code timing} (shared values), {@code time}, {@code orbit},
 * {@code eclipse}, {@code fit}; does not use {@code timing.minima}; knows nothing of commands or plots.
 */
package org.twinlight.timing.period;
