package org.twinlight.sampling;

import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

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

    /**
     * The same with the coordinates the reason mentions by number ("coordinate 3") named as well,
     * from {@code names} in coordinate order.
     */
    public Convergence withCoordinateNames(List<String> names) {
        Matcher m = Pattern.compile("coordinate (\\d+)").matcher(reason);
        StringBuilder b = new StringBuilder();
        while (m.find()) {
            int k = Integer.parseInt(m.group(1));
            m.appendReplacement(b, Matcher.quoteReplacement(k < names.size()
                    ? "coordinate " + k + ", " + names.get(k) : m.group()));
        }
        m.appendTail(b);
        return new Convergence(converged, b.toString(), cancelled, steps, burnIn, autocorrelationTimes,
                acceptanceFraction, evaluations);
    }
}
