/**
 * Statistics every least-squares fit of the project reports the same way: the covariance from
 * JᵀJ (with the direction the data cannot determine when it is singular), correlations, the RMS,
 * the Bayesian information criterion and the one rule by which uncertainties are scaled with χ²ν
 * ({@link org.twinlight.statistics.FitStatistics#varianceScale}). Depends on no other twinlight
 * package, so the light-curve fit, the O−C fit and the velocity fit all use it.
 */
package org.twinlight.statistics;
