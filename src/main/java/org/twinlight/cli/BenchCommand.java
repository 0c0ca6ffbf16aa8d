package org.twinlight.cli;

import java.lang.management.ManagementFactory;
import java.lang.management.ThreadMXBean;
import java.util.Arrays;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;
import org.twinlight.eclipse.BinaryModel;
import org.twinlight.eclipse.ProximityEffects;
import org.twinlight.eclipse.BinaryParameters;
import org.twinlight.eclipse.LimbDarkening;
import org.twinlight.eclipse.ModelFile;
import org.twinlight.eclipse.SyntheticLightCurve;
import org.twinlight.fit.EclipseFitter;
import org.twinlight.fit.FitData;
import org.twinlight.fit.FitResult;
import org.twinlight.fit.FitSettings;
import org.twinlight.fit.ModelAdequacy;
import org.twinlight.orbit.Orbit;
import org.twinlight.photometry.LightCurve;
import org.twinlight.time.TimeScale;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

/**
 * {@code bench}: measures the speed of the model and the fit on a standard synthetic light curve,
 * so the figures in docs/performance.md can be reproduced on any machine.
 */
@Command(name = "bench", mixinStandardHelpOptions = true, versionProvider = VersionInfo.class, sortOptions = false,
        description = {"Measure the speed of the eclipse model and of a fit on a standard synthetic light curve: "
                + "20,000 points at 2-minute cadence, circular orbit, quadratic limb darkening, about 8%% of the "
                + "points in eclipse.",
            "Model timings are the CPU time of one thread; the fit time is wall-clock time."})
public final class BenchCommand implements Callable<Integer> {

    @picocli.CommandLine.Spec
    picocli.CommandLine.Model.CommandSpec spec;

    @Option(names = "--repeats", paramLabel = "N", defaultValue = "200",
            description = "Timed repetitions of each model measurement (default: ${DEFAULT-VALUE}).")
    int repeats;

    @Option(names = "--fits", paramLabel = "N", defaultValue = "5", description = "Timed fits (default: ${DEFAULT-VALUE}).")
    int fits;

    /** The benchmark system (demo values): r₁ + r₂ = 0.126 puts about 8 % of the phase in eclipse. */
    static final BinaryParameters SYSTEM = new BinaryParameters(2.4683, 2460200.3121, 0.075, 0.051, 89.1, 0, 90,
            0.71, 0, LimbDarkening.quadratic(0.42, 0.23), LimbDarkening.quadratic(0.48, 0.21), 0, 1);

    /** All three proximity terms and the light-travel time on (demo values). */
    static final ProximityEffects PROXIMITY = new ProximityEffects(0.8, null, 95.0, 118.75,
            ProximityEffects.Ellipsoidal.fromPhysics(0.32, 0.32), new ProximityEffects.Reflection(0.5, 0.5),
            ProximityEffects.Beaming.fromVelocities(1.0, 1.1));

    @Override
    public Integer call() {
        if (repeats < 1 || fits < 1) {
            throw new org.twinlight.BadInputException("options --repeats and --fits: expected positive integers");
        }
        double[] t = SyntheticLightCurve.regularTimes(2460200.0, 2460200.0 + 19999 * 2.0 / 1440, 2.0, List.of(), null);
        BinaryModel model = new BinaryModel(SYSTEM);
        Orbit.Positions positions = SYSTEM.orbit().positions();
        double[] out = new double[t.length];
        int eclipsed = 0;
        model.flux(t, out);
        for (double f : out) {
            if (f < 1) {
                eclipsed++;
            }
        }
        console().printf(Locale.ROOT, "light curve: %d points, %.1f%% in eclipse%n", t.length, 100.0 * eclipsed / t.length);

        double[] sink = new double[1];
        Runnable positionsOnly = () -> {
            double s = 0;
            for (double ti : t) {
                s += positions.signedSeparation(ti);
            }
            sink[0] += s;
        };
        Runnable fullModel = () -> model.flux(t, out);
        // one time at a time: every occultation exact, no table
        Runnable exactModel = () -> {
            for (int i = 0; i < t.length; i++) {
                out[i] = model.flux(t[i]);
            }
        };
        double posMs = medianMillis(positionsOnly, repeats);
        double modelMs = medianMillis(fullModel, repeats);
        double exactMs = medianMillis(exactModel, repeats);
        console().printf(Locale.ROOT, "orbital positions only: %.3f ms CPU per evaluation (median of %d)%n", posMs, repeats);
        console().printf(Locale.ROOT, "full model:             %.3f ms CPU per evaluation (median of %d), %.2f x positions; "
                + "occultations from a table per evaluation%n", modelMs, repeats, modelMs / posMs);
        console().printf(Locale.ROOT, "full model, exact:      %.3f ms CPU per evaluation (median of %d), every occultation "
                + "computed exactly (%.2f x the table)%n", exactMs, repeats, exactMs / modelMs);

        BinaryModel eccentric = new BinaryModel(SYSTEM.withEccentricityOmega(0.2, 70));
        double eccMs = medianMillis(() -> eccentric.flux(t, out), repeats);
        console().printf(Locale.ROOT, "full model, e = 0.2:    %.3f ms CPU per evaluation (median of %d), Kepler's equation solved "
                + "near the conjunctions only%n", eccMs, repeats);

        BinaryParameters closePair = SYSTEM.withProximity(PROXIMITY);
        BinaryModel close = new BinaryModel(closePair);
        double closeMs = medianMillis(() -> close.flux(t, out), repeats);
        // as the fit uses it: a new model (with its tables) for every trial point
        double builtMs = medianMillis(() -> new BinaryModel(SYSTEM).flux(t, out), repeats);
        double closeBuiltMs = medianMillis(() -> new BinaryModel(closePair).flux(t, out), repeats);
        console().printf(Locale.ROOT, "full model with ellipsoidal variation, reflection, beaming and light-travel time: "
                + "%.3f ms CPU per evaluation (median of %d), %.2f x the spherical model; built anew for each "
                + "evaluation, as in a fit: %.3f ms, %.2f x%n", closeMs, repeats, closeMs / modelMs, closeBuiltMs,
                closeBuiltMs / builtMs);

        LightCurve lc = SyntheticLightCurve.observe(model, t, 300, 7, "bench", "bench", TimeScale.BJD_TDB);
        ModelFile start = ModelFile.of(SYSTEM.withRadii(SYSTEM.radius1() * 1.05, SYSTEM.radius2() * 0.95)
                .withInclinationDeg(SYSTEM.inclinationDeg() - 0.5).withSurfaceBrightnessRatio(0.75)
                .withEpochDays(SYSTEM.epochDays() + 0.001));
        FitSettings settings = FitSettings.defaults().withFree(new LinkedHashSet<>(FitSettings.DEFAULT_FREE));
        EclipseFitter.fit(start, List.of(new FitData(lc, "bench")), settings); // warm-up
        FitSettings keepAll = settings.withClipSigma(Double.NaN);
        double[] fitMs = new double[fits];
        double[] plainMs = new double[fits];
        FitResult last = null;
        // the two settings alternate, so that a slow moment of a shared machine hits both alike
        for (int k = 0; k < fits; k++) {
            long t0 = System.nanoTime();
            last = EclipseFitter.fit(start, List.of(new FitData(lc, "bench")), settings);
            fitMs[k] = (System.nanoTime() - t0) / 1e6;
            t0 = System.nanoTime();
            EclipseFitter.fit(start, List.of(new FitData(lc, "bench")), keepAll);
            plainMs[k] = (System.nanoTime() - t0) / 1e6;
        }
        Arrays.sort(fitMs);
        Arrays.sort(plainMs);
        console().printf(Locale.ROOT, "fit (5 free parameters + offset): %.0f ms wall (median of %d), %d iterations, "
                + "%d evaluations%n", fitMs[fits / 2], fits, last.iterations(), last.evaluations());
        FitResult r = last;
        double adequacyMs = medianMillis(() -> ModelAdequacy.check(r.curves(), c -> r.model().common(), r.freeCount(),
                r.errorsEstimated()), repeats);
        console().printf(Locale.ROOT, "fit with --clip none: %.0f ms wall (median of %d); clipping adds %.1f%%; the "
                + "model-adequacy checks take %.2f ms (%.2f%% of the fit)%n", plainMs[fits / 2], fits,
                100 * (fitMs[fits / 2] - plainMs[fits / 2]) / plainMs[fits / 2], adequacyMs,
                100 * adequacyMs / fitMs[fits / 2]);
        return 0;
    }

    /**
     * Median thread CPU time of one run, ms: a loaded machine stretches wall-clock time but hardly
     * the CPU time of the thread itself.
     */
    private static double medianMillis(Runnable r, int repeats) {
        ThreadMXBean mx = ManagementFactory.getThreadMXBean();
        // enough runs for the compiler to have finished with the code measured
        for (int i = 0; i < Math.max(200, repeats); i++) {
            r.run();
        }
        double[] ms = new double[repeats];
        for (int i = 0; i < repeats; i++) {
            long t0 = mx.getCurrentThreadCpuTime();
            r.run();
            ms[i] = (mx.getCurrentThreadCpuTime() - t0) / 1e6;
        }
        Arrays.sort(ms);
        return ms[repeats / 2];
    }

    private java.io.PrintWriter console() {
        return spec.commandLine().getOut();
    }
}
