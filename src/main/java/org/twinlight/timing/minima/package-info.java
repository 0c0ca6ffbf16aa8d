/**
 * Times of minimum (symmetric-template fit, Kwee–van Woerden), cycle counts, O−C and the linear,
 * quadratic and light-time ephemerides.
 *
 * <p>May use {@code photometry}, {@code timing} (shared values), {@code time}, {@code orbit},
 * {@code eclipse}, {@code fit}; does not use {@code timing.period}; knows nothing of commands or plots.
 */
package org.twinlight.timing.minima;
