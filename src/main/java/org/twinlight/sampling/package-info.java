/**
 * Sampling of a probability density: the affine-invariant ensemble sampler (Goodman &amp; Weare
 * 2010, Comm. App. Math. Comp. Sci. 5, 65) with walkers evaluated in parallel, the integrated
 * autocorrelation time (Sokal 1997), the convergence rule and the summaries of marginal
 * distributions (medians, central intervals, one-sided limits at a bound).
 *
 * <p>Independent of every other twinlight package: it sees a density only as a function of a
 * vector ({@link org.twinlight.sampling.LogDensity}). Knows nothing of files, commands or plots.
 */
package org.twinlight.sampling;
