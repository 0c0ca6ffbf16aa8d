/**
 * Absolute dimensions of a double-lined eclipsing binary: the physical constants (each named by
 * its provenance), masses, radii, surface gravities, luminosities and bolometric magnitudes from
 * the orbit and the fractional radii, their uncertainties by sampling, and sanity checks.
 *
 * <p>Depends on no other twinlight package except the shared exception types; knows nothing of
 * files, the command line or plots.
 */
package org.twinlight.dimensions;
