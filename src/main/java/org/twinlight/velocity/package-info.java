/**
 * Radial velocities of the two stars: the values read from a file ({@link VelocityData}), the
 * reader (delimited text or FITS tables, through the photometry readers' parsing pieces), the
 * double-lined Keplerian model as a pure function of the parameters, a least-squares fit
 * around it, and the refit of K1 and K2 at another orbit (how K follows an orbit drawn from
 * elsewhere, with the velocities' likelihood of that orbit).
 *
 * <p>Depends on {@code orbit} (the Keplerian velocity curve), {@code photometry} (delimiters,
 * numbers, FITS time keywords, row-rejection reasons) and {@code time}; knows nothing of the
 * command line, plots or the report layer.
 */
package org.twinlight.velocity;
