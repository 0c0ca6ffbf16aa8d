/**
 * Fitting: parameters with bounds and scales, Levenberg–Marquardt least squares through a small
 * model interface, covariances and fit statistics.
 *
 * <p>May use {@code eclipse}, {@code orbit}, {@code photometry}; knows nothing of commands or plots.
 */
package org.twinlight.fit;
