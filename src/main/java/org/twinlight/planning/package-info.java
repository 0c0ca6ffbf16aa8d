/**
 * Eclipse predictions seen from a site: the ephemeris with its covariance
 * ({@link org.twinlight.planning.PredictionEphemeris}), the eclipse's extent around each minimum
 * ({@link org.twinlight.planning.EclipseExtent}, from a fitted model's contacts or a given
 * duration), the date range and limits, and the {@link org.twinlight.planning.Planner} that lists
 * every minimum in a range with its times in UTC, uncertainty, the sky at the site and a verdict.
 *
 * <p>Depends on {@code time}, {@code sky}, {@code orbit}, {@code eclipse} (the model's parameters)
 * and {@code timing} (the ephemeris and minimum types); no files, no terminal, no plots.
 */
package org.twinlight.planning;
