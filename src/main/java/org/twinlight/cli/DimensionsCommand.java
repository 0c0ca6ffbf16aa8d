package org.twinlight.cli;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;
import org.twinlight.BadInputException;
import org.twinlight.analysis.AfterFitSettings;
import org.twinlight.dimensions.DimensionsPropagation;
import org.twinlight.report.DimensionsFromFit;
import org.twinlight.report.FitJsonInput;
import org.twinlight.velocity.VelocityData;
import org.twinlight.velocity.VelocityFitResult;
import org.twinlight.velocity.VelocityFitter;
import org.twinlight.velocity.VelocityParameters;
import org.twinlight.velocity.SemiAmplitudeRefit;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;

/** {@code dimensions}: masses, radii, gravities and luminosities from a light-curve fit and velocities. */
@Command(name = "dimensions", mixinStandardHelpOptions = true, versionProvider = VersionInfo.class,
        sortOptions = false,
        description = {"Absolute dimensions of a double-lined eclipsing binary: from fit.json (period, e, i, "
                + "fractional radii, with their correlations) and K1, K2 (fitted from --velocities, given, or of the "
                + "joint light-curve + velocity fit in fit.json when neither is given): "
                + "a, M1, M2, q, R1, R2, log g, mean densities, synchronous rotation; with --teff1 (and --teff2): "
                + "luminosities and bolometric magnitudes (IAU 2015 nominal solar values, Resolutions B2 and B3). "
                + "Errors by sampling: the posterior chain of fit.json when the fit made one, else normal draws "
                + "with fit.json's covariance.",
            "Writes dimensions.json, dimensions.txt, mass-radius.png and (with temperatures) mass-luminosity.png."})
public final class DimensionsCommand implements Callable<Integer> {

    @picocli.CommandLine.Spec
    picocli.CommandLine.Model.CommandSpec spec;

    @Option(names = "--fit", required = true, paramLabel = "fit.json", description = "Result of the fit command.")
    Path fit;

    @Option(names = "--velocities", paramLabel = "RV.csv",
            description = "Velocity file of both stars: K1 and K2 are fitted with the orbit of fit.json "
                    + "(as the velocities command does, with e and omega fixed), and refitted for each draw of the "
                    + "period, e and omega, so their errors carry the orbit's.")
    Path velocities;

    @Mixin
    DimensionsOptions given;

    @Option(names = "--jitter", paramLabel = "KMS|fit", defaultValue = "0",
            description = "With --velocities: extra velocity scatter in km/s, or 'fit' (default: ${DEFAULT-VALUE}).")
    String jitter;

    @Option(names = "--allow-unconverged", description = "Use the posterior chain of fit.json even when the "
            + "sampler judged it unconverged (its errors may then be too small; the outputs say so).")
    boolean allowUnconverged;

    @Option(names = "--seed", paramLabel = "S", defaultValue = "1", description = "Seed of the draws (default: ${DEFAULT-VALUE}).")
    long seed;

    @Option(names = "--object", paramLabel = "NAME", description = "Name of the star, for the plot titles "
            + "(default: the light curve named in fit.json).")
    String object;

    @Option(names = "--out", required = true, paramLabel = "DIR", description = "Output directory (created if missing).")
    Path out;

    @Mixin
    VelocityFileOptions velocityOptions;

    @Override
    public Integer call() {
        List<Path> inputs = new ArrayList<>(List.of(fit));
        if (velocities != null) {
            inputs.add(velocities);
        }
        OutputTargets.checkDirectory(out, DimensionsFromFit.FILES, inputs);
        checkOptions();
        if (object != null) {
            OptionChecks.plainText("--object", object);
        }
        FitJsonInput lc = FitJsonInput.read(fit);
        boolean fittedK = velocities == null && given.k1 == null && given.k2 == null;
        DimensionsFromFit.Elements el = DimensionsFromFit.elements(lc, fit.toString(), fittedK, allowUnconverged);
        if (fittedK && !el.semiAmplitudesFitted()) {
            throw new BadInputException("K1 and K2 are needed: give --velocities RV.csv, or --k1 and --k2 (km/s), or "
                    + "a fit.json of a joint fit with velocities (" + fit + " has no k1 and k2)");
        }
        DimensionsFromFit.SemiAmplitudes k;
        if (velocities != null) {
            k = fromVelocities(lc, el);
        } else if (fittedK) {
            k = DimensionsFromFit.SemiAmplitudes.fitted(el, "named in " + fit);
        } else {
            k = DimensionsFromFit.SemiAmplitudes.given(given.k1, DimensionsOptions.orZero(given.k1Error), given.k2,
                    DimensionsOptions.orZero(given.k2Error), el);
        }
        DimensionsFromFit.Outcome r = DimensionsFromFit.propagate(el, k,
                new DimensionsFromFit.Temperatures(given.teff1, DimensionsOptions.orZero(given.teff1Error), given.teff2,
                        DimensionsOptions.orZero(given.teff2Error)), draws(), seed);
        List<String> written = DimensionsFromFit.write(r, out::resolve, "Absolute dimensions of " + objectName(lc),
                VersionInfo.version());
        console().print(r.table());
        r.notes().forEach(n -> console().println("note: " + n));
        r.result().notes().forEach(n -> console().println("note: " + n));
        r.warnings().forEach(w -> console().println("warning: " + w));
        console().println("wrote " + String.join(", ", written.subList(0, written.size() - 1)) + " and "
                + written.get(written.size() - 1) + " to " + out);
        return 0;
    }

    /**
     * K1 and K2 fitted to --velocities at the light curve's orbit, refitted for each drawn orbit
     * (weighted by the velocities' likelihood) when the orbit carries an error.
     */
    private DimensionsFromFit.SemiAmplitudes fromVelocities(FitJsonInput lc, DimensionsFromFit.Elements el) {
        List<String> notes = new ArrayList<>();
        List<String> warnings = new ArrayList<>();
        VelocityData data = velocityOptions.read(velocities, console());
        VelocityFileOptions.checkTimeScale(data, velocities, lc.timeScale(), fit, console());
        VelocityFitResult v = fitVelocities(data, lc, notes);
        double[][] cov = {{v.covariance("k1", "k1"), v.covariance("k1", "k2")},
            {v.covariance("k1", "k2"), v.covariance("k2", "k2")}};
        VelocityFitResult weights = v;
        DimensionsPropagation.VelocityOrbit velocityOrbit = null;
        if (el.eccentricityOmegaUncertain()) {
            VelocityFitResult free = fitFreeOrbit(data, v, notes);
            if (free != null) {
                weights = free;
                double[][] eo = SemiAmplitudeRefit.eccentricityOmegaCovariance(free);
                if (eo != null) {
                    velocityOrbit = new DimensionsPropagation.VelocityOrbit(free.best().eccentricity(),
                            free.best().omegaDeg(), eo);
                }
                String disagreement = orbitDisagreement(free, el.mean(), el.covariance());
                if (disagreement != null) {
                    warnings.add(disagreement);
                }
            }
        }
        return new DimensionsFromFit.SemiAmplitudes(v.best().k1Kms(), v.best().k2Kms(), cov,
                SemiAmplitudeRefit.of(data, weights)::drawInto, velocityOrbit, "velocities " + velocities, velocities,
                notes, warnings);
    }

    /** What the plots are titled with: --object, else the fitted light curve, else the fit.json. */
    private String objectName(FitJsonInput lc) {
        if (object != null && !object.isBlank()) {
            return object.trim();
        }
        return lc.lightCurveName() != null ? lc.lightCurveName() + " (" + fit.getFileName() + ")"
                : String.valueOf(fit.getFileName());
    }

    private int draws() {
        return given.draws == null ? AfterFitSettings.DEFAULT_DRAWS : given.draws;
    }

    /** Checks the options, with the rules of analyse's settings (messages naming the options). */
    private void checkOptions() {
        AfterFitSettings s = AfterFitSettings.defaults();
        for (java.util.Map.Entry<String, Object> e : given.settingsEntries().entrySet()) {
            if (e.getValue() != null) {
                s = s.with(e.getKey(), e.getValue());
            }
        }
        if (velocities != null || given.k1 == null && given.k2 == null) {
            // K from the velocities, or from a joint fit in fit.json (checked when it is read)
            s = s.with("velocities", List.of(velocities != null ? velocities.toString() : fit.toString()));
        }
        try {
            s.validated("options");
        } catch (BadInputException e) {
            throw new BadInputException(optionNames(e.getMessage()));
        }
    }

    /** A settings message with the keys turned into option names ({@code key 'k1Error'} → {@code option --k1-error}). */
    private static String optionNames(String message) {
        java.util.regex.Matcher m = java.util.regex.Pattern.compile("options: key '([A-Za-z0-9]+)'").matcher(message);
        if (!m.find()) {
            return message;
        }
        String option = "--" + m.group(1).replaceAll("([a-z0-9])([A-Z])", "$1-$2").toLowerCase(java.util.Locale.ROOT);
        return m.replaceFirst("option " + option);
    }

    private VelocityFitResult fitVelocities(VelocityData data, FitJsonInput lc, List<String> notes) {
        VelocityParameters start = VelocitiesCommand.start(lc.model().common(), data);
        VelocityFitResult v = VelocityFitter.fit(data, start, VelocitiesCommand.settings(List.of(), jitter, 200));
        notes.add(String.format(Locale.ROOT, "K1 = %.3f +- %.3f, K2 = %.3f +- %.3f km/s fitted to %d velocities of "
                + "%s with the orbit of %s (reduced chi2 %.2f); these errors hold at that orbit, the dimensions' "
                + "errors also carry the orbit's (K refitted for each draw of period, e and omega)",
                v.estimate("k1").value(), v.estimate("k1").uncertainty(), v.estimate("k2").value(),
                v.estimate("k2").uncertainty(), v.n(), velocities, fit, v.reducedChi2()));
        v.notes().forEach(n -> notes.add("velocities: " + n));
        return v;
    }

    /**
     * The velocities fitted with e and ω free as well (from the fit at the light curve's orbit):
     * their own best orbit, whose scatter sets the error scale and jitter of the refits (at the
     * light curve's orbit a misfit would inflate them) and whose e, ω say where the velocities
     * place the orbit. Null, with a note, when the velocities cannot fit e and ω.
     */
    private VelocityFitResult fitFreeOrbit(VelocityData data, VelocityFitResult fixed, List<String> notes) {
        try {
            return VelocityFitter.fit(data, fixed.best(), VelocitiesCommand.settings(List.of("eccentricity", "omega"),
                    jitter, 200));
        } catch (BadInputException | org.twinlight.WorkFailedException e) {
            notes.add("the velocities alone cannot fit e and omega (" + e.getMessage() + "); K is refitted per draw "
                    + "of the light curve's orbit with the weights and error scale of the fit at its central orbit");
            return null;
        }
    }

    /**
     * A warning when the velocities' e cos ω and e sin ω differ from the light curve's by more than
     * the 99.73 % (3σ) limit of χ² with 2 degrees of freedom, 11.83: the two fits then describe
     * different orbits and combining them is not meaningful.
     */
    private String orbitDisagreement(VelocityFitResult free, double[] mean, double[][] cov) {
        double[][] v = SemiAmplitudeRefit.eccentricityOmegaCovariance(free);
        if (v == null) {
            return null;
        }
        double de = free.best().eccentricity() - mean[1];
        double dw = free.best().omegaDeg() - mean[10];
        dw -= 360 * Math.rint(dw / 360);
        double a = v[0][0] + cov[1][1];
        double b = v[0][1] + cov[1][10];
        double d = v[1][1] + cov[10][10];
        double det = a * d - b * b;
        if (!(det > 0)) {
            return null;
        }
        double chi2 = (d * de * de - 2 * b * de * dw + a * dw * dw) / det;
        if (chi2 <= 11.83) {
            return null;
        }
        return String.format(Locale.ROOT, "the velocities alone give e = %.4f +- %.4f, omega = %.1f +- %.1f deg; "
                + "%s gives e = %.4f +- %.4f, omega = %.1f +- %.1f deg: they disagree (chi2 = %.1f for 2 degrees of "
                + "freedom, beyond 3 sigma), so the combined errors are not to be trusted. Check the epoch and "
                + "the star order of the velocities, or fit the light curve and velocities jointly",
                free.best().eccentricity(), free.estimate("eccentricity").uncertainty(), free.best().omegaDeg(),
                free.estimate("omega").uncertainty(), fit, mean[1], Math.sqrt(cov[1][1]), mean[10],
                Math.sqrt(cov[10][10]), chi2);
    }

    private java.io.PrintWriter console() {
        return spec.commandLine().getOut();
    }
}
