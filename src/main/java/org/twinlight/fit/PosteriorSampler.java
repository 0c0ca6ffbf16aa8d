package org.twinlight.fit;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;
import java.util.function.BooleanSupplier;
import org.twinlight.BadInputException;
import org.twinlight.sampling.AutocorrelationTime;
import org.twinlight.sampling.Chain;
import org.twinlight.sampling.EnsembleSampler;
import org.twinlight.sampling.Marginal;
import org.twinlight.sampling.SamplerSettings;
import org.twinlight.sampling.SamplingProgress;

/**
 * Samples a fit's posterior with the ensemble sampler ({@link EnsembleSampler}), started from the
 * least-squares optimum: the walkers start in a small ball around it (a tenth of each parameter's
 * covariance uncertainty), the density is {@link PosteriorDensity} in the coordinates of
 * {@link SampledCoordinates}, and the chain is turned back into the contract's parameters and
 * derived quantities, summarised by {@link Marginal}.
 */
public final class PosteriorSampler {
    /** Radius of the starting ball in units of each parameter's least-squares uncertainty. */
    static final double START_BALL = 0.1;
    private static final int START_TRIES = 1000;

    private PosteriorSampler() {
    }

    /**
     * Samples the posterior of a solved fit.
     *
     * @param problem the problem the fit solved
     * @param best its least-squares result (the start, the uncertainties, the points clipped)
     * @param priors priors from the model file (none: uniform in the sampled coordinates)
     * @param settings walkers, step limit, seed, threads
     * @param progress told after every step
     * @param stop polled every step; true stops the run, returned as cancelled
     * @throws BadInputException for a prior on an unknown or fixed parameter, or one that excludes
     *     the least-squares values, naming the parameter
     */
    public static Posterior sample(FitProblem problem, FitResult best, Priors priors, SamplerSettings settings,
            SamplingProgress progress, BooleanSupplier stop) {
        WeightedResiduals objective = problem.objective();
        if (best.clippedCount() > 0) {
            objective = objective.withLeftOut(best.curves().stream().map(FittedCurve::clipped).toList());
        }
        ParameterLayout layout = objective.layout();
        double[] ext = best.parameters().stream().mapToDouble(Estimate::value).toArray();
        long midCycle = Math.round((objective.midTime() - ext[ParameterLayout.EPOCH]) / ext[ParameterLayout.PERIOD]);
        SampledCoordinates coords = new SampledCoordinates(layout, ext);
        String outside = coords.outside(coords.toSampled(ext));
        if (outside != null) {
            throw new BadInputException("the least-squares values put " + outside + ", where the posterior's prior is "
                    + "zero; fix those parameters or start the fit from physical values");
        }
        PosteriorDensity.Terms terms = new PosteriorDensity.Terms(layout, priors, ext, midCycle);
        terms.checkAllows(ext, priors);
        double chi2Scale = best.reducedChi2() > 0 ? best.reducedChi2() : 1;
        WeightedResiduals target = objective;
        double[][] start = startBall(layout, coords, best, ext, settings,
                new PosteriorDensity(target, coords, terms, chi2Scale));
        EnsembleSampler.Result run = EnsembleSampler.sample(() -> new PosteriorDensity(target, coords, terms, chi2Scale),
                start, settings, progress, stop);
        return summarise(run, layout, coords, best, midCycle, settings);
    }

    /** Walkers around the optimum, each redrawn until the posterior is positive there. */
    private static double[][] startBall(ParameterLayout layout, SampledCoordinates coords, FitResult best, double[] ext,
            SamplerSettings settings, PosteriorDensity density) {
        SplittableRandom rng = new SplittableRandom(settings.seed()).split().split();
        double[][] start = new double[settings.walkers()][];
        for (int w = 0; w < start.length; w++) {
            for (int tries = 0; start[w] == null; tries++) {
                if (tries == START_TRIES) {
                    throw new org.twinlight.WorkFailedException("the sampler cannot start: around the least-squares "
                            + "optimum the posterior is zero in " + START_TRIES + " trial positions; the optimum lies on "
                            + "the edge of the allowed region. Fix the parameters at their bound, or widen the priors");
                }
                double[] trial = ext.clone();
                for (int i = 0; i < ext.length; i++) {
                    FitParameter p = layout.parameter(i);
                    if (p.free()) {
                        double sigma = best.parameters().get(i).uncertainty();
                        if (!(sigma > 0) || !Double.isFinite(sigma)) {
                            sigma = p.scale();
                        }
                        trial[i] = fold(p, ext[i] + START_BALL * sigma * gaussian(rng));
                    }
                }
                double[] u = coords.toSampled(trial);
                if (density.at(u) > Double.NEGATIVE_INFINITY) {
                    start[w] = u;
                }
            }
        }
        return start;
    }

    /** A trial value beyond a reachable edge (e < 0, i > 90°) reflected back inside. */
    private static double fold(FitParameter p, double v) {
        return switch (p.edge()) {
            case LOWER -> v < p.lower() ? 2 * p.lower() - v : v;
            case UPPER -> v > p.upper() ? 2 * p.upper() - v : v;
            case NONE -> v;
        };
    }

    private static double gaussian(SplittableRandom rng) {
        // Box–Muller
        double u1 = 1 - rng.nextDouble();
        double u2 = rng.nextDouble();
        return Math.sqrt(-2 * Math.log(u1)) * Math.cos(2 * Math.PI * u2);
    }

    private static Posterior summarise(EnsembleSampler.Result run, ParameterLayout layout, SampledCoordinates coords,
            FitResult best, long midCycle, SamplerSettings settings) {
        Chain chain = run.chain();
        boolean multiBand = layout.bands().size() > 1;
        List<String> names = new ArrayList<>();
        List<Integer> columns = new ArrayList<>();
        List<double[]> edges = new ArrayList<>();
        for (int i = 0; i < layout.externalSize(); i++) {
            FitParameter p = layout.parameter(i);
            if (p.free()) {
                names.add(p.label(multiBand));
                columns.add(i);
                edges.add(new double[] {p.edge() == FitParameter.Edge.LOWER ? p.lower() : Double.NaN,
                    p.edge() == FitParameter.Edge.UPPER ? p.upper() : Double.NaN});
            }
        }
        int parameterCount = names.size();
        boolean inclinationFree = layout.isFree(ParameterLayout.INCLINATION);
        EclipseFitter.Reported at = EclipseFitter.Reported.at(layout, coords.toExternal(chain.position(0, 0)), 0,
                midCycle);
        for (int j = 0; j < at.names().size(); j++) {
            if (best.derived().get(j).free()) {
                String n = at.names().get(j);
                names.add(n + (at.bands().get(j) == null ? "" : "@" + at.bands().get(j)));
                columns.add(layout.externalSize() + j);
                // i = 90° is b = 0: an impact parameter piles up at 0 when the inclination does at 90°
                edges.add(new double[] {inclinationFree && n.startsWith("impactParameter") ? 0 : Double.NaN,
                    Double.NaN});
            }
        }
        int walkers = chain.walkers();
        int steps = chain.steps();
        double[][] values = new double[steps * walkers][];
        double[] logp = new double[steps * walkers];
        double[] ext = new double[layout.externalSize()];
        for (int t = 0; t < steps; t++) {
            for (int w = 0; w < walkers; w++) {
                coords.toExternal(chain.position(t, w), ext);
                double[] all = EclipseFitter.Reported.at(layout, ext, 0, midCycle).values();
                double[] row = new double[columns.size()];
                for (int c = 0; c < row.length; c++) {
                    row[c] = all[columns.get(c)];
                }
                values[t * walkers + w] = row;
                logp[t * walkers + w] = chain.logDensity(t, w);
            }
        }
        int burnIn = run.convergence().burnIn();
        List<Marginal> marginals = new ArrayList<>();
        for (int c = 0; c < columns.size(); c++) {
            double[][] series = new double[walkers][steps - burnIn];
            double[] flat = new double[walkers * (steps - burnIn)];
            for (int t = burnIn; t < steps; t++) {
                for (int w = 0; w < walkers; w++) {
                    double v = values[t * walkers + w][c];
                    series[w][t - burnIn] = v;
                    flat[(t - burnIn) * walkers + w] = v;
                }
            }
            double tau = steps - burnIn >= 2 ? AutocorrelationTime.of(series) : Double.NaN;
            marginals.add(Marginal.of(flat, tau, edges.get(c)[0], edges.get(c)[1]));
        }
        List<String> notes = new ArrayList<>();
        notes.add(String.format(Locale.ROOT, "the likelihood uses the errors scaled by the least-squares reduced "
                + "chi-square (%.3f), the same rule as the covariance uncertainties", best.reducedChi2()));
        return new Posterior(List.copyOf(names), parameterCount, walkers, values, logp, List.copyOf(marginals),
                run.convergence(), settings.seed(), List.copyOf(notes));
    }
}
