package org.twinlight.analysis;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.ForkJoinTask;
import java.util.function.Consumer;
import org.twinlight.BadInputException;
import org.twinlight.fit.EclipseFitter;
import org.twinlight.fit.FitProblem;
import org.twinlight.fit.FitResult;
import org.twinlight.fit.JointVelocities;
import org.twinlight.fit.NoiseDiagnostics;
import org.twinlight.fit.NoiseReport;
import org.twinlight.fit.Posterior;
import org.twinlight.fit.PosteriorSampler;
import org.twinlight.sampling.SamplerSettings;
import org.twinlight.sampling.SamplingProgress;
import org.twinlight.velocity.VelocityData;
import org.twinlight.velocity.VelocityReader;

/**
 * The stages after the least-squares fit of the light curves: the joint fit with radial
 * velocities (the same objective as {@code fit --velocities}: the light curves and the velocities
 * together, from the light-curve fit) and the posterior sample ({@link PosteriorSampler}, as
 * {@code fit --posterior}). The dimensions are computed from the fit.json these give, when the
 * files are written ({@link AnalysisFiles}).
 */
final class AfterFit {

    private AfterFit() {
    }

    /**
     * Reads the velocity files before any work, so that a missing or unreadable one is bad input
     * (exit 2) at once; refuses velocities on another time scale than the light curves'.
     */
    static void readVelocities(AnalysisState st, Consumer<String> sink) {
        for (String name : st.settings.afterFit().velocities()) {
            Path f = Path.of(name);
            AnalysisFiles.refuseOverwrite(st.request.outputDir(), f);
            if (!Files.isRegularFile(f)) {
                throw new BadInputException(f + ": no such file (settings key 'velocities', option --velocities)");
            }
            VelocityData d = VelocityReader.read(f, null);
            if (d.timeScale().isKnown() && st.timeScale.isKnown() && !d.timeScale().equals(st.timeScale)) {
                throw new BadInputException(f + ": its times are " + d.timeScale().label() + " but the light curves' "
                        + "are " + st.timeScale.label() + "; convert the velocity times to " + st.timeScale.label()
                        + " first (the time command)");
            }
            if (!d.timeScale().isKnown() || !st.timeScale.isKnown()) {
                st.notes.add("the time scale of " + f.getFileName() + " or of the light curves is unknown, so they "
                        + "cannot be checked against each other; a mismatch shifts the phases by up to a minute");
            }
            d.notes().forEach(n -> sink.accept("note: " + f + ": " + n));
            sink.accept(String.format(Locale.ROOT, "%s: %d velocities of star 1, %d of star 2%s", f, d.star1().size(),
                    d.star2().size(), d.rejectedCount() > 0 ? ", " + d.rejectedCount() + " not used" : ""));
            st.velocityFiles.add(f);
            st.velocityData.add(d);
        }
    }

    /** The light curves and the velocities fitted together, from the light-curve fit. */
    static void jointFit(AnalysisState st, Consumer<String> sink) {
        FitResult lightCurves = st.fit.result();
        JointVelocities joint = JointVelocities.of(st.velocityData, lightCurves.model().common());
        FitProblem problem = FitProblem.of(lightCurves.model(), st.fitData, st.fit.problem().settings(), st.fit.priors(),
                joint);
        sink.accept("joint fit of the light curves and " + st.velocityData.size() + " velocity file(s) ...");
        FitResult r = EclipseFitter.optimize(problem);
        NoiseReport noise = NoiseDiagnostics.of(problem, r);
        List<String> notes = new ArrayList<>(st.fit.notes());
        notes.add("the light curves and the radial velocities were fitted together (from the light-curve fit, "
                + "whose χ²ν was " + String.format(Locale.ROOT, "%.3f", lightCurves.reducedChi2()) + "): the "
                + "parameters, fit.png and residuals.csv are the joint fit's");
        notes.addAll(noise.notes(r));
        st.joint = joint;
        st.problem = problem;
        st.fit = new MultiStartFit.Outcome(r, st.fit.trials(), st.fit.thinnedPoints(), List.copyOf(notes), noise,
                st.fit.priors(), st.fit.orbit(), st.fit.inclinationProfile(), problem);
        sink.accept(String.format(Locale.ROOT, "joint fit: χ²ν = %.3f, K1 = %s, K2 = %s km/s", r.reducedChi2(),
                AnalysisReport.withError(r.get("k1")), joint.doubleLined() ? AnalysisReport.withError(r.get("k2"))
                        : "not determined"));
    }

    /** The posterior sample from the (joint) fit; an unconverged chain is a doubt (exit 1). */
    static void posterior(AnalysisState st, Consumer<String> sink) {
        AfterFitSettings a = st.settings.afterFit();
        FitProblem problem = st.problem != null ? st.problem
                : FitProblem.of(st.fit.result().model(), st.fitData, st.fit.problem().settings(), st.fit.priors());
        int free = PosteriorSampler.dimension(problem, a.jitter());
        if (a.walkers() != null && a.walkers() < 2 * free + 2) {
            throw AnalysisSettings.bad("settings", "walkers", "expected an even number of at least " + (2 * free + 2)
                    + " (twice the " + free + (a.jitter() ? " free parameters and jitter terms" : " free parameters")
                    + ", plus 2), got " + a.walkers());
        }
        SamplerSettings s = SamplerSettings.of(a.walkers() != null ? a.walkers() : SamplerSettings.defaultWalkers(free),
                a.maxSteps() != null ? a.maxSteps() : AfterFitSettings.DEFAULT_MAX_STEPS, st.settings.seed(),
                a.threads() != null ? a.threads() : defaultThreads());
        sink.accept("sampling the posterior (" + s.walkers() + " walkers, at most " + s.maxSteps() + " steps) ...");
        Posterior p = PosteriorSampler.sample(problem, st.fit.result(), s, a.jitter(), SamplingProgress.NONE, () -> false);
        st.posterior = p;
        sink.accept(String.format(Locale.ROOT, "posterior: %d steps, max τ %.1f steps, %s", p.steps(),
                p.convergence().maxAutocorrelationTime(), p.convergence().converged() ? "converged"
                        : "NOT converged (" + p.convergence().reason() + ")"));
        if (!p.convergence().converged()) {
            st.doubts.add("the posterior sample has not converged: " + p.convergence().reason() + ". fit.json and "
                    + "chain.csv.gz say \"converged\": false; do not quote its intervals (the dimensions' errors "
                    + "come from the fit's covariance instead). Run again with a larger maxSteps (e.g. "
                    + 2 * p.steps() + "), fewer free parameters, or a model file whose priors rule out what the "
                    + "data cannot decide");
        }
    }

    /**
     * The sampler's threads when the settings give none: those of the pool the analysis runs in (one
     * in a batch, where targets fill the cores), else every processor.
     */
    private static int defaultThreads() {
        return ForkJoinTask.inForkJoinPool() ? ForkJoinTask.getPool().getParallelism()
                : Runtime.getRuntime().availableProcessors();
    }
}
