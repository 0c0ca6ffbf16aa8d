/**
 * Radial velocities of the two stars: the values read from a file ({@link VelocityData}), the
 * reader (delimited text or FITS tables, through the photometry readers' parsing pieces), the
 * double-lined Keplerian model as a pure function of the parameters, and a least-squares fit
 * around it.
 *
 * <p>Depends on {@code orbit} (the Keplerian velocity curve), {@code photometry} (delimiters,
 * numbers, FITS time keywords, row-rejection reasons) and {@code time}; knows nothing of the
 * command line, plots or the report layer.
 */
package org.twinlight.velocity;
