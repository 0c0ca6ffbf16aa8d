/**
 * Timing: period search, times of minimum, cycle counts, O−C and ephemerides.
 *
 * <p>May use {@code photometry}, {@code time}, {@code orbit}, {@code eclipse}, {@code fit};
 * knows nothing of commands or plots.
 */
package org.twinlight.timing;
