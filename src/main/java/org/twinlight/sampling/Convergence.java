package org.twinlight.sampling;

/**
 * How a sampling run ended and whether its chain may be used.
 *
 * @param converged true when the retained chain is at least the required number of
 *     autocorrelation times long and τ had settled
 * @param reason in words: why it converged or why not
 * @param cancelled true when the run was stopped from outside
 * @param steps steps per walker run
 * @param burnIn steps discarded at the start
 * @param autocorrelationTimes τ of each coordinate over the retained chain, in steps
 * @param acceptanceFraction fraction of moves accepted over the retained chain
 * @param evaluations density evaluations
 */
public record Convergence(boolean converged, String reason, boolean cancelled, int steps, int burnIn,
        double[] autocorrelationTimes, double acceptanceFraction, long evaluations) {

    /** The largest τ (NaN if any is undefined). */
    public double maxAutocorrelationTime() {
        double m = 0;
        for (double t : autocorrelationTimes) {
            if (Double.isNaN(t)) {
                return Double.NaN;
            }
            m = Math.max(m, t);
        }
        return m;
    }

    /** Retained steps over the largest τ. */
    public double chainLengthInTau() {
        return (steps - burnIn) / maxAutocorrelationTime();
    }
}
