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
     * @param settings walkers, step limit, seed, threads
     * @param progress told after every step
     * @param stop polled every step; true stops the run, returned as cancelled
     * @throws BadInputException for a prior on an unknown or fixed parameter, or one that excludes
     *     the least-squares values, naming the parameter
     */
    public static Posterior sample(FitProblem problem, FitResult best, SamplerSettings settings,
            SamplingProgress progress, BooleanSupplier stop) {
        return sample(problem, best, settings, false, progress, stop);
    }

    /**
     * Samples the posterior of a solved fit, with or without jitter terms ({@link JitterTerms}: one
     * per light-curve band and velocity file, the errors then taken as stated instead of scaled by
     * the fit's reduced χ²).
     *
     * @param jitter whether to sample the jitter terms
     * @throws BadInputException as {@link #sample(FitProblem, FitResult, SamplerSettings,
     *     SamplingProgress, BooleanSupplier)}, and for a prior on a jitter without {@code jitter}
     */
    public static Posterior sample(FitProblem problem, FitResult best, SamplerSettings settings, boolean jitter,
            SamplingProgress progress, BooleanSupplier stop) {
        FitObjective objective = problem.objective().withClippingOf(best);
        JitterTerms.checkPriors(objective.priors(), jitter);
        JitterTerms jitterTerms = jitter ? JitterTerms.of(objective) : JitterTerms.none();
        ParameterLayout layout = objective.layout();
        double[] ext = best.parameters().stream().mapToDouble(Estimate::value).toArray();
        long midCycle = Math.round((objective.lightCurves().midTime() - ext[ParameterLayout.EPOCH]) / ext[ParameterLayout.PERIOD]);
        SampledCoordinates coords = new SampledCoordinates(layout, ext);
        String outside = coords.outside(coords.toSampled(ext));
        if (outside != null) {
            throw new BadInputException("the least-squares values put " + outside + ", where the posterior's prior is "
                    + "zero; fix those parameters or start the fit from physical values");
        }
        // with jitter terms the errors are as stated: the jitter takes the place of the χ²ν scaling
        double chi2Scale = jitter || !(best.reducedChi2() > 0) ? 1 : best.reducedChi2();
        FitObjective target = objective;
        double[][] start = startBall(layout, coords, jitterTerms, best, ext, settings,
                new PosteriorDensity(target, coords, chi2Scale, jitterTerms));
        EnsembleSampler.Result run = EnsembleSampler.sample(
                () -> new PosteriorDensity(target, coords, chi2Scale, jitterTerms), start, settings, progress, stop);
        return summarise(run, layout, coords, jitterTerms, best, midCycle, settings);
    }

    /**
     * Refuses a prior on a jitter ({@code jitter}, {@code jitterVelocity}, with or without
     * {@code @NAME}) when the posterior is sampled without jitter terms (or not at all).
     *
     * @throws BadInputException naming the prior
     */
    public static void checkPriors(Priors priors, boolean jitter) {
        JitterTerms.checkPriors(priors, jitter);
    }

    /** Number of sampled coordinates: the free parameters, and with {@code jitter} one per band and velocity file. */
    public static int dimension(FitProblem problem, boolean jitter) {
        FitObjective objective = problem.objective();
        int free = (int) objective.parameters().stream().filter(FitParameter::free).count();
        return free + (jitter ? JitterTerms.of(objective).size() : 0);
    }

    /** Walkers around the optimum, each redrawn until the posterior is positive there. */
    private static double[][] startBall(ParameterLayout layout, SampledCoordinates coords, JitterTerms jitter,
            FitResult best, double[] ext, SamplerSettings settings, PosteriorDensity density) {
        // a jitter starts where it would bring χ²ν to 1, at least a tenth of the median error
        double excess = Math.sqrt(Math.max(best.reducedChi2() - 1, 0.01));
        double[] lnJitter = new double[jitter.size()];
        for (int k = 0; k < lnJitter.length; k++) {
            JitterTerms.Term t = jitter.terms().get(k);
            lnJitter[k] = Math.log(t.start(excess * t.medianError()));
        }
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
                double[] u = java.util.Arrays.copyOf(coords.toSampled(trial), coords.size() + lnJitter.length);
                for (int k = 0; k < lnJitter.length; k++) {
                    u[coords.size() + k] = lnJitter[k] + START_BALL * gaussian(rng);
                }
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
            JitterTerms jitter, FitResult best, long midCycle, SamplerSettings settings) {
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
        // a jitter: column −(k + 1), s = exp of its sampled ln s; s = 0 is its reachable edge
        for (int k = 0; k < jitter.size(); k++) {
            names.add(jitter.terms().get(k).label());
            columns.add(-(k + 1));
            edges.add(new double[] {0, Double.NaN});
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
                double[] u = chain.position(t, w);
                coords.toExternal(u, ext);
                double[] all = EclipseFitter.Reported.at(layout, ext, 0, midCycle).values();
                double[] row = new double[columns.size()];
                for (int c = 0; c < row.length; c++) {
                    int col = columns.get(c);
                    row[c] = col >= 0 ? all[col] : Math.exp(u[coords.size() - col - 1]);
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
        if (jitter.size() == 0) {
            notes.add(String.format(Locale.ROOT, "the likelihood uses the errors scaled by the least-squares reduced "
                    + "chi-square (%.3f), the same rule as the covariance uncertainties", best.reducedChi2()));
        } else {
            notes.add("the likelihood uses the errors as stated with a sampled jitter added in quadrature ("
                    + String.join(", ", jitter.terms().stream().map(JitterTerms.Term::label).toList())
                    + ", in the units of the data: flux relative to the out-of-eclipse level, km/s), not the "
                    + "least-squares error scaling; the default prior of each jitter is log-uniform from "
                    + JitterTerms.LOWER_FACTOR + " to " + (int) JitterTerms.UPPER_FACTOR + " times the median stated error");
        }
        return new Posterior(List.copyOf(names), parameterCount, walkers, values, logp, List.copyOf(marginals),
                run.convergence(), settings.seed(), List.copyOf(notes));
    }
}
