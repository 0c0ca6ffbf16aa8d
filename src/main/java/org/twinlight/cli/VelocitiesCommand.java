package org.twinlight.cli;

import com.fasterxml.jackson.databind.node.ObjectNode;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Set;
import java.util.concurrent.Callable;
import org.twinlight.BadInputException;
import org.twinlight.eclipse.BinaryParameters;
import org.twinlight.report.FitFiles;
import org.twinlight.report.InputDigest;
import org.twinlight.report.ModelInput;
import org.twinlight.report.VelocityFiles;
import org.twinlight.report.VelocityPlot;
import org.twinlight.velocity.StarVelocities;
import org.twinlight.velocity.VelocityData;
import org.twinlight.velocity.VelocityFitResult;
import org.twinlight.velocity.VelocityFitSettings;
import org.twinlight.velocity.VelocityFitter;
import org.twinlight.velocity.VelocityParameters;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/** {@code velocities}: fit the double-lined velocity curves of both stars. */
@Command(name = "velocities", mixinStandardHelpOptions = true, versionProvider = VersionInfo.class,
        sortOptions = false,
        description = {"Fit the radial velocities of both stars with a double-lined Keplerian orbit: K1, K2, the "
                + "systemic velocity gamma and one offset per further instrument; e and omega, period and epoch on "
                + "request. Period, epoch (primary conjunction), e and omega are taken from the model.",
            "Writes velocities.json and velocities.png."})
public final class VelocitiesCommand implements Callable<Integer> {

    @picocli.CommandLine.Spec
    picocli.CommandLine.Model.CommandSpec spec;

    @Parameters(index = "0", paramLabel = "FILE", description = "Velocity file: text or FITS table with time, v1, "
            + "v1_err, v2, v2_err[, instrument] in km/s.")
    Path file;

    @Option(names = "--model", required = true, paramLabel = "M.json",
            description = "Model file or fit.json giving period, epoch, eccentricity and omega.")
    Path model;

    @Option(names = "--free", split = ",", paramLabel = "NAME",
            description = "Further parameters to fit: eccentricity, omega (either frees both), period, epoch. "
                    + "K1, K2, gamma and instrument offsets are always fitted.")
    List<String> free = new ArrayList<>();

    @Option(names = "--jitter", paramLabel = "KMS|fit", defaultValue = "0",
            description = "Extra scatter added in quadrature to every error: a value in km/s, or 'fit' for the "
                    + "value for each star that makes its chi2/nu = 1 (default: ${DEFAULT-VALUE}).")
    String jitter;

    @Option(names = "--max-iterations", paramLabel = "N", defaultValue = "200",
            description = "Iteration limit of the solver (default: ${DEFAULT-VALUE}).")
    int maxIterations;

    @Option(names = "--object", paramLabel = "NAME", description = "Name of the star, for the plot title "
            + "(default: the velocity file's name).")
    String object;

    @Option(names = "--out", required = true, paramLabel = "DIR", description = "Output directory (created if missing).")
    Path out;

    @Mixin
    VelocityFileOptions velocityOptions;

    @Override
    public Integer call() {
        OutputTargets.checkDirectory(out, List.of("velocities.json", "velocities.png"), List.of(file, model));
        VelocityFitSettings settings = settings(free, jitter, maxIterations);
        if (object != null) {
            OptionChecks.plainText("--object", object);
        }
        ModelInput m = ModelInput.read(model);
        VelocityData data = velocityOptions.read(file, console());
        VelocityFileOptions.checkTimeScale(data, file, m.timeScale(), model, console());
        VelocityFitResult r = VelocityFitter.fit(data, start(m.model().common(), data), settings);
        List<String> warnings = new ArrayList<>();
        ObjectNode derived = VelocityFiles.derivedJson(r, warnings);
        FitFiles.writeJson(out.resolve("velocities.json"), VelocityFiles.json(r, data, settings, file.toString(),
                InputDigest.sha256(file), model.toString(), derived, warnings, VersionInfo.version()));
        VelocityPlot.write(r, data, out.resolve("velocities.png"), "Radial velocities of "
                + (object != null && !object.isBlank() ? object.trim() : String.valueOf(file.getFileName())));
        console().print(VelocityFiles.summary(r, data));
        warnings.forEach(w -> console().println("warning: " + w));
        console().println("caution: " + VelocityFiles.CAUTION);
        console().println("wrote velocities.json and velocities.png to " + out);
        return 0;
    }

    /** The fit settings from the options; shared with {@code dimensions --velocities}. */
    static VelocityFitSettings settings(List<String> free, String jitter, int maxIterations) {
        Set<String> names = new LinkedHashSet<>();
        for (String f : free) {
            if (!f.isBlank()) {
                names.add(f.trim());
            }
        }
        boolean fitJitter = jitter.trim().equalsIgnoreCase("fit");
        double value = 0;
        if (!fitJitter) {
            try {
                value = Double.parseDouble(jitter.trim());
            } catch (NumberFormatException e) {
                throw new BadInputException("option --jitter: expected a velocity in km/s or 'fit', got '" + jitter + "'");
            }
        }
        return new VelocityFitSettings(names, value, fitJitter, maxIterations);
    }

    /** Start: the model's orbit; γ the mean velocity, K half the range of each star's velocities. */
    static VelocityParameters start(BinaryParameters orbit, VelocityData data) {
        double sum = 0;
        int n = 0;
        for (int s = 1; s <= 2; s++) {
            for (double v : data.star(s).velocitiesKms()) {
                sum += v;
                n++;
            }
        }
        double gamma = sum / n;
        return new VelocityParameters(orbit.periodDays(), orbit.epochDays(), orbit.eccentricity(), orbit.omegaDeg(),
                halfRange(data.star1()), halfRange(data.star2()), gamma, new double[data.instruments().size()], 0.0, 0.0);
    }

    private static double halfRange(StarVelocities s) {
        double lo = Double.POSITIVE_INFINITY;
        double hi = Double.NEGATIVE_INFINITY;
        for (double v : s.velocitiesKms()) {
            lo = Math.min(lo, v);
            hi = Math.max(hi, v);
        }
        return s.size() > 1 ? Math.max(1.0, 0.5 * (hi - lo)) : 10.0;
    }

    private java.io.PrintWriter console() {
        return spec.commandLine().getOut();
    }
}
