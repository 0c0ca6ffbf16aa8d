package org.twinlight.fit;

import java.util.Arrays;
import java.util.List;
import org.twinlight.BadInputException;
import org.twinlight.eclipse.ModelFile;

/**
 * A fit to be solved: the starting model, the data with their bands, the settings, and from them
 * the parameters ({@link ParameterLayout}) and the objective ({@link FitObjective}). Building
 * it checks the input; solving it is {@link EclipseFitter#optimize(FitProblem)}.
 */
public final class FitProblem {
    private final ModelFile start;
    private final List<FitData> data;
    private final FitSettings settings;
    private final FitObjective objective;
    private final Priors priors;
    private final JointVelocities velocities;

    private FitProblem(ModelFile start, List<FitData> data, FitSettings settings, Priors priors,
            JointVelocities velocities) {
        this.start = start;
        this.velocities = velocities;
        this.data = List.copyOf(data);
        this.settings = settings;
        this.priors = priors;
        List<String> bands = data.stream().map(FitData::band).distinct().toList();
        ParameterLayout layout = new ParameterLayout(start, bands, settings.free(), velocities);
        this.objective = new FitObjective(layout, new WeightedResiduals(layout, data, settings), priors);
    }

    /**
     * Checks the input and builds the problem.
     *
     * @throws BadInputException for unknown free-parameter names, or flux that is not normalised
     *     when no baseline is fitted
     */
    public static FitProblem of(ModelFile start, List<FitData> data, FitSettings settings) {
        return of(start, data, settings, Priors.none());
    }

    /**
     * Checks the input and builds the problem with priors.
     *
     * @throws BadInputException also for a prior on an unknown or fixed parameter, or one that
     *     excludes the starting value
     */
    public static FitProblem of(ModelFile start, List<FitData> data, FitSettings settings, Priors priors) {
        return of(start, data, settings, priors, null);
    }

    /**
     * Checks the input and builds a joint problem: the light curves and radial velocities in one
     * objective, sharing period, epoch, e and ω (null {@code velocities}: light curves alone).
     *
     * @throws BadInputException as {@link #of(ModelFile, List, FitSettings, Priors)}
     */
    public static FitProblem of(ModelFile start, List<FitData> data, FitSettings settings, Priors priors,
            JointVelocities velocities) {
        if (data.isEmpty()) {
            throw new IllegalArgumentException("no data to fit");
        }
        if (settings.baseline() == Baseline.NONE) {
            for (FitData d : data) {
                double[] f = d.lightCurve().fluxes();
                Arrays.sort(f);
                double median = f[f.length / 2];
                if (!(Math.abs(median - 1) < 0.5)) {
                    throw new BadInputException(d.lightCurve().source() + ": with --baseline none the flux must be "
                            + "normalised to about 1 out of eclipse, but its median is " + median
                            + "; use --baseline offset (the default) to fit the normalisation");
                }
            }
        }
        return new FitProblem(start, data, settings, priors, velocities);
    }

    /** The same data, settings and priors started from another model (a global search's best minimum). */
    public FitProblem startingFrom(ModelFile other) {
        return new FitProblem(other, data, settings, priors, velocities);
    }

    /** The radial velocities of a joint fit, or null. */
    public JointVelocities velocities() {
        return velocities;
    }

    public ModelFile start() {
        return start;
    }

    public List<FitData> data() {
        return data;
    }

    public FitSettings settings() {
        return settings;
    }

    /** The free parameters and every fixed one, with scales and bounds. */
    public List<FitParameter> parameters() {
        return objective.layout().parameters();
    }

    /** The objective every solver of this problem evaluates (all points; see {@link FitObjective#withClippingOf}). */
    public FitObjective objective() {
        return objective;
    }
}
