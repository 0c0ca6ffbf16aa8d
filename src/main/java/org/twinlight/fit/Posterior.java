package org.twinlight.fit;

import java.util.List;
import org.twinlight.sampling.Convergence;
import org.twinlight.sampling.Marginal;

/**
 * The sampled posterior of a fit: every walker's values of the free parameters and the derived
 * quantities at every step (burn-in included, for the trace plots), the marginal summaries over
 * the retained steps, and how the run ended.
 *
 * @param names column names: the free parameters' contract names ({@code radius1},
 *     {@code thirdLight@V}), then the derived quantities that depend on them
 * @param parameterCount how many of the columns are free parameters
 * @param walkers number of walkers
 * @param values values[step × walkers + walker][column]
 * @param logPosterior ln posterior (up to a constant) of each row of {@code values}
 * @param marginals per column, over the steps after burn-in
 * @param convergence how the run ended (steps, burn-in, τ, acceptance, the verdict)
 * @param seed the seed of the run
 * @param notes remarks for the user
 */
public record Posterior(List<String> names, int parameterCount, int walkers, double[][] values, double[] logPosterior,
        List<Marginal> marginals, Convergence convergence, long seed, List<String> notes) {

    public int steps() {
        return convergence.steps();
    }

    public int burnIn() {
        return convergence.burnIn();
    }

    /** Value of column {@code col} for walker {@code w} after step {@code step}. */
    public double value(int step, int w, int col) {
        return values[step * walkers + w][col];
    }

    /** The largest autocorrelation time over every column, in steps. */
    public double maxAutocorrelationTime() {
        double m = 0;
        for (Marginal g : marginals) {
            if (!Double.isNaN(g.autocorrelationTime())) {
                m = Math.max(m, g.autocorrelationTime());
            }
        }
        return m;
    }

    /** The column of a name, −1 if absent. */
    public int column(String name) {
        return names.indexOf(name);
    }

    /** Values of one column over the retained steps, every walker. */
    public double[] retained(int col) {
        int rows = (steps() - burnIn()) * walkers;
        double[] out = new double[rows];
        for (int r = 0; r < rows; r++) {
            out[r] = values[burnIn() * walkers + r][col];
        }
        return out;
    }
}
