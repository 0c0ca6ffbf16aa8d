/**
 * Timing: the values shared by the period search and the times of minimum (the linear
 * {@link org.twinlight.timing.Ephemeris} and {@link org.twinlight.timing.MinimumType}); the work itself lives in
 * {@code timing.period} (period search) and {@code timing.minima} (times of minimum, O−C, ephemerides).
 *
 * <p>May use {@code photometry}, {@code time}, {@code orbit}, {@code eclipse}, {@code fit};
 * knows nothing of commands or plots.
 */
package org.twinlight.timing;
