/**
 * Period search: Box Least Squares, phase dispersion minimisation, the P-against-2P decision and
 * the refinement of the period from eclipse timings.
 *
 * <p>May use {@code photometry}, {@code timing} (shared values), {@code time}, {@code orbit},
 * {@code eclipse}, {@code fit}; does not use {@code timing.minima}; knows nothing of commands or plots.
 */
package org.twinlight.timing.period;
