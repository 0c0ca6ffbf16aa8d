package org.twinlight.cli;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;
import org.twinlight.BadInputException;
import org.twinlight.dimensions.BinaryElements;
import org.twinlight.dimensions.DimensionsPropagation;
import org.twinlight.dimensions.Quantity;
import org.twinlight.dimensions.SanityChecks;
import org.twinlight.report.DimensionsFiles;
import org.twinlight.report.DimensionsPlots;
import org.twinlight.report.FitFiles;
import org.twinlight.report.FitJsonInput;
import org.twinlight.report.InputDigest;
import org.twinlight.report.PosteriorChain;
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
                + "fractional radii, with their correlations) and K1, K2 (fitted from --velocities, or given): "
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

    @Option(names = "--k1", paramLabel = "KMS", description = "K1 in km/s, instead of --velocities.")
    Double k1;

    @Option(names = "--k1-error", paramLabel = "KMS", description = "1-sigma error of --k1 (default 0: mass errors are then understated).")
    double k1Error;

    @Option(names = "--k2", paramLabel = "KMS", description = "K2 in km/s, instead of --velocities.")
    Double k2;

    @Option(names = "--k2-error", paramLabel = "KMS", description = "1-sigma error of --k2.")
    double k2Error;

    @Option(names = "--teff1", paramLabel = "K", description = "Effective temperature of star 1 (the star eclipsed at primary eclipse).")
    Double teff1;

    @Option(names = "--teff1-error", paramLabel = "K", description = "Its 1-sigma error.")
    double teff1Error;

    @Option(names = "--teff2", paramLabel = "K", description = "Effective temperature of star 2 (default: Teff1 times the fourth root of the fitted surface-brightness ratio, an approximation).")
    Double teff2;

    @Option(names = "--teff2-error", paramLabel = "K", description = "Its 1-sigma error.")
    double teff2Error;

    @Option(names = "--jitter", paramLabel = "KMS|fit", defaultValue = "0",
            description = "With --velocities: extra velocity scatter in km/s, or 'fit' (default: ${DEFAULT-VALUE}).")
    String jitter;

    @Option(names = "--draws", paramLabel = "N", defaultValue = "10000",
            description = "Number of draws for the error propagation (default: ${DEFAULT-VALUE}).")
    int draws;

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
        OutputTargets.checkDirectory(out, List.of("dimensions.json", "dimensions.txt", "mass-radius.png",
                "mass-luminosity.png"), inputs);
        checkOptions();
        if (object != null) {
            OptionChecks.plainText("--object", object);
        }
        FitJsonInput lc = FitJsonInput.read(fit);
        List<String> notes = new ArrayList<>();
        PosteriorChain chain = posteriorChain(lc);
        if (chain == null && lc.posterior()) {
            notes.add(fit + " holds a posterior but names no chain file (key 'convergence.chainFile'): the errors "
                    + "come from normal draws with its uncertainties and correlations");
        }
        List<String> drawn = DimensionsPropagation.DRAWN;
        double[] mean = new double[drawn.size()];
        double[][] cov = new double[mean.length][mean.length];
        String[] fromFit = {"period", "eccentricity", "inclination", null, null, "radius1", "radius2", null, null,
            "surfaceBrightnessRatio", "omega"};
        for (int i = 0; i < fromFit.length; i++) {
            if (fromFit[i] == null) {
                continue;
            }
            double fallback = switch (fromFit[i]) {
                case "eccentricity" -> lc.model().common().eccentricity();
                case "omega" -> lc.model().common().omegaDeg();
                default -> Double.NaN;
            };
            mean[i] = lc.values().getOrDefault(fromFit[i], fallback);
            for (int j = 0; j < fromFit.length; j++) {
                if (fromFit[j] != null) {
                    cov[i][j] = lc.covariance(fromFit[i], fromFit[j]);
                }
            }
        }
        if (!(mean[1] >= 0 && mean[1] < 1)) {
            throw BadInputException.at(fit, "key 'parameters.eccentricity'", null, "expected 0 <= e < 1, got " + mean[1]);
        }
        String kSource;
        String kSha = null;
        DimensionsPropagation.SemiAmplitudesForOrbit kForOrbit = null;
        DimensionsPropagation.VelocityOrbit velocityOrbit = null;
        List<String> orbitWarnings = new ArrayList<>();
        if (velocities != null) {
            VelocityData data = velocityOptions.read(velocities, console());
            VelocityFileOptions.checkTimeScale(data, velocities, lc.timeScale(), fit, console());
            VelocityFitResult v = fitVelocities(data, lc, notes);
            mean[3] = v.best().k1Kms();
            mean[4] = v.best().k2Kms();
            cov[3][3] = v.covariance("k1", "k1");
            cov[4][4] = v.covariance("k2", "k2");
            cov[3][4] = cov[4][3] = v.covariance("k1", "k2");
            VelocityFitResult weights = v;
            if (cov[1][1] > 0 || cov[10][10] > 0) {
                VelocityFitResult free = fitFreeOrbit(data, v, notes);
                if (free != null) {
                    weights = free;
                    double[][] eo = SemiAmplitudeRefit.eccentricityOmegaCovariance(free);
                    if (eo != null) {
                        velocityOrbit = new DimensionsPropagation.VelocityOrbit(free.best().eccentricity(),
                                free.best().omegaDeg(), eo);
                    }
                    String disagreement = orbitDisagreement(free, mean, cov);
                    if (disagreement != null) {
                        orbitWarnings.add(disagreement);
                    }
                }
            }
            kForOrbit = SemiAmplitudeRefit.of(data, weights)::drawInto;
            kSource = "velocities " + velocities;
            kSha = InputDigest.sha256(velocities);
        } else {
            mean[3] = k1;
            mean[4] = k2;
            cov[3][3] = k1Error * k1Error;
            cov[4][4] = k2Error * k2Error;
            kSource = String.format(Locale.ROOT, "given: K1 = %s +- %s, K2 = %s +- %s km/s", k1, k1Error, k2, k2Error);
            if (k1Error == 0 || k2Error == 0) {
                notes.add("K1 or K2 was given without an error: the errors of masses and radii leave it out");
            }
            if (cov[0][0] > 0 || cov[1][1] > 0 || cov[10][10] > 0) {
                notes.add("K1 and K2 were given, so they do not follow the period, e and omega drawn from "
                        + fit + "; give --velocities to refit them per draw, or K errors that include the orbit's");
            }
        }
        mean[7] = teff1 == null ? Double.NaN : teff1;
        mean[8] = teff2 == null ? Double.NaN : teff2;
        cov[7][7] = teff1 == null ? 0 : teff1Error * teff1Error;
        cov[8][8] = teff2 == null ? 0 : teff2Error * teff2Error;
        String teff2Source = null;
        if (teff2 != null) {
            teff2Source = "given";
        } else if (teff1 != null && !Double.isNaN(mean[9])) {
            teff2Source = "Teff1 x J^(1/4) from the fitted central surface-brightness ratio J: an approximation that "
                    + "treats J as bolometric; in a band it understates the temperature difference (J grows more "
                    + "slowly than T^4 in the red); give --teff2 for a published result";
            notes.add("Teff2 = " + teff2Source);
        }
        if (teff2 == null) {
            cov[8][8] = 0;
        }
        boolean surfaceBrightnessUsed = teff1 != null && teff2 == null;
        if (!surfaceBrightnessUsed) {
            // J is used only to derive Teff2
            java.util.Arrays.fill(cov[9], 0);
            for (double[] row : cov) {
                row[9] = 0;
            }
            mean[9] = Double.NaN;
        }
        String missingCorrelations = chain != null ? null : missingCorrelations(lc, fromFit, cov);
        BinaryElements central = BinaryElements.fromVector(mean);
        String problem = central.problem();
        if (problem != null) {
            throw new BadInputException(fit + (velocities != null ? " and " + velocities : "") + ": " + problem);
        }
        double[][] samples = chain == null ? null : chainSamples(chain, lc, fromFit, surfaceBrightnessUsed);
        if (kForOrbit != null && samples == null && cov[0][0] == 0 && cov[1][1] == 0 && cov[10][10] == 0) {
            kForOrbit = null; // the orbit is exact: K need not be refitted per draw
        }
        DimensionsPropagation.Result r;
        try {
            r = DimensionsPropagation.propagate(new DimensionsPropagation.Inputs(central, mean[10], cov, kForOrbit,
                    samples, velocityOrbit), draws, seed);
        } catch (IllegalArgumentException e) {
            throw new BadInputException(fit + ": " + e.getMessage());
        }
        List<String> warnings = new ArrayList<>(orbitWarnings);
        if (missingCorrelations != null) {
            warnings.add(missingCorrelations);
        }
        String geometry = SanityChecks.eclipseGeometry(central, lc.model().common().omegaDeg());
        if (geometry != null) {
            warnings.add(geometry);
        }
        warnings.addAll(SanityChecks.warnings(r.central(), central));
        Map<String, double[]> used = new LinkedHashMap<>();
        boolean combined = kForOrbit != null;
        if (combined) {
            notes.add(String.format(Locale.ROOT, "the orbit combines the light curve and the velocities (draws of the "
                    + "light curve's orbit weighted by the velocities' likelihood, K1 and K2 refitted per draw; "
                    + "%.0f effective draws): e = %.4f +- %.4f, omega = %.2f +- %.2f deg, K1 = %.3f +- %.3f, "
                    + "K2 = %.3f +- %.3f km/s; the values and errors under 'elements' are these",
                    r.effectiveDraws(), r.elementValues()[1], r.elementErrors()[1], r.elementValues()[10],
                    r.elementErrors()[10], r.elementValues()[3], r.elementErrors()[3], r.elementValues()[4],
                    r.elementErrors()[4]));
        }
        for (int i = 0; i < mean.length; i++) {
            used.put(drawn.get(i), combined ? new double[] {r.elementValues()[i], r.elementErrors()[i]}
                    : new double[] {mean[i], Math.sqrt(cov[i][i])});
        }
        String errorSource = errorSource(chain, lc, kForOrbit != null);
        DimensionsFiles.Inputs in = new DimensionsFiles.Inputs(fit.toString(), InputDigest.sha256(fit), kSource, kSha,
                teff2Source, lc.timeScale().label(), seed, used, chain == null ? "covariance" : "posteriorChain",
                errorSource);
        FitFiles.writeJson(out.resolve("dimensions.json"), DimensionsFiles.json(r, in, warnings, notes,
                VersionInfo.version()));
        String table = DimensionsFiles.table(r, warnings, errorSource);
        org.twinlight.report.AtomicFiles.writeString(out.resolve("dimensions.txt"), table);
        String title = "Absolute dimensions of " + objectName(lc);
        DimensionsPlots.massRadius(r, out.resolve("mass-radius.png"), title);
        boolean luminosities = r.estimates().containsKey(Quantity.LOG_LUMINOSITY1)
                && r.estimates().containsKey(Quantity.LOG_LUMINOSITY2);
        if (luminosities) {
            DimensionsPlots.massLuminosity(r, out.resolve("mass-luminosity.png"), title);
        }
        console().print(table);
        notes.forEach(n -> console().println("note: " + n));
        r.notes().forEach(n -> console().println("note: " + n));
        warnings.forEach(w -> console().println("warning: " + w));
        console().println("wrote dimensions.json, dimensions.txt, mass-radius.png" + (luminosities
                ? " and mass-luminosity.png" : "") + " to " + out);
        return 0;
    }

    /**
     * A warning when fit.json gives errors for two or more of the elements used but not their
     * correlations (no {@code correlation} block, or one without some of them): they are then drawn
     * as independent, which for r2 and i (often correlated near −1 in partial eclipses) can make
     * the radius errors far too large or too small. Null when nothing is missing.
     */
    private String missingCorrelations(FitJsonInput lc, String[] fromFit, double[][] cov) {
        List<String> withErrors = new ArrayList<>();
        List<String> missing = new ArrayList<>();
        for (int i = 0; i < fromFit.length; i++) {
            if (fromFit[i] != null && cov[i][i] > 0) {
                withErrors.add(fromFit[i]);
                if (!lc.correlationNames().contains(fromFit[i])) {
                    missing.add(fromFit[i]);
                }
            }
        }
        if (withErrors.size() < 2 || missing.isEmpty()) {
            return null;
        }
        String what = lc.correlationNames().isEmpty() ? "has no 'correlation' block"
                : "has no correlations for " + String.join(", ", missing) + " in its 'correlation' block";
        return fit + " " + what + ": the errors of " + String.join(", ", withErrors) + " were drawn as "
                + "independent, so the errors of radii, masses and luminosities ignore their correlations (r2 and "
                + "the inclination, for one, are typically strongly correlated) and may be much too large or too "
                + "small; use the fit.json the fit command wrote, which carries them";
    }

    /** What the plots are titled with: --object, else the fitted light curve, else the fit.json. */
    private String objectName(FitJsonInput lc) {
        if (object != null && !object.isBlank()) {
            return object.trim();
        }
        return lc.lightCurveName() != null ? lc.lightCurveName() + " (" + fit.getFileName() + ")"
                : String.valueOf(fit.getFileName());
    }

    private void checkOptions() {
        boolean givenK = k1 != null || k2 != null;
        if (velocities != null && givenK) {
            throw new BadInputException("options --velocities and --k1/--k2: give one source of K1 and K2, not both");
        }
        if (velocities == null && !givenK) {
            throw new BadInputException("K1 and K2 are needed: give --velocities RV.csv, or --k1 and --k2 (km/s)");
        }
        if (velocities == null && (k1 == null || k2 == null)) {
            throw new BadInputException("option --" + (k1 == null ? "k1" : "k2") + ": missing; the masses need the "
                    + "semi-amplitudes of both stars (no second star: a single-lined orbit gives only the mass "
                    + "function)");
        }
        if (k1 != null && !(k1 > 0)) {
            throw new BadInputException("option --k1: expected a semi-amplitude > 0 km/s, got " + k1);
        }
        if (k2 != null && !(k2 > 0)) {
            throw new BadInputException("option --k2: expected a semi-amplitude > 0 km/s, got " + k2);
        }
        for (Object[] o : new Object[][] {{"--teff1", teff1}, {"--teff2", teff2}}) {
            if (o[1] != null && !((Double) o[1] > 0)) {
                throw new BadInputException("option " + o[0] + ": expected a temperature > 0 K, got " + o[1]);
            }
        }
        for (Object[] o : new Object[][] {{"--k1-error", k1Error}, {"--k2-error", k2Error},
            {"--teff1-error", teff1Error}, {"--teff2-error", teff2Error}}) {
            if (!((Double) o[1] >= 0) || !Double.isFinite((Double) o[1])) {
                throw new BadInputException("option " + o[0] + ": expected an error >= 0, got " + o[1]);
            }
        }
        if (draws < 100) {
            throw new BadInputException("option --draws: expected at least 100 draws, got " + draws);
        }
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

    /**
     * The posterior chain named by fit.json, or null when there is none. An unconverged chain is
     * refused unless {@code --allow-unconverged}: its spread is not the posterior's.
     */
    private PosteriorChain posteriorChain(FitJsonInput lc) {
        FitJsonInput.Convergence c = lc.convergence();
        if (c == null || c.chainFile() == null) {
            return null;
        }
        if (!c.converged()) {
            if (!allowUnconverged) {
                throw BadInputException.at(fit, "key 'convergence.converged'", null, "false: the posterior chain "
                        + c.chainFile().getFileName() + " did not converge" + (c.reason().isBlank() ? "" : " ("
                        + c.reason() + ")") + ", so its spread is not the posterior's and errors from it could be "
                        + "much too small. Run the fit with more steps, or give --allow-unconverged to use it anyway "
                        + "(the outputs then say so)");
            }
        }
        return PosteriorChain.read(c.chainFile());
    }

    /**
     * The chain's rows as {@link DimensionsPropagation#DRAWN} vectors: the light-curve elements
     * fit.json gives with an error, taken from the chain's column of the same name (or NAME@BAND
     * of fit.json's first band); NaN in the columns the chain does not hold.
     */
    private double[][] chainSamples(PosteriorChain chain, FitJsonInput lc, String[] fromFit,
            boolean surfaceBrightnessUsed) {
        double[][] out = new double[chain.size()][fromFit.length];
        for (double[] row : out) {
            java.util.Arrays.fill(row, Double.NaN);
        }
        List<String> missing = new ArrayList<>();
        for (int i = 0; i < fromFit.length; i++) {
            String name = fromFit[i];
            if (name == null || (name.equals("surfaceBrightnessRatio") && !surfaceBrightnessUsed)
                    || !(lc.uncertainties().getOrDefault(name, 0.0) > 0)) {
                continue;
            }
            double[] column = chain.column(name);
            if (column == null && lc.firstBand() != null) {
                column = chain.column(name + "@" + lc.firstBand());
            }
            if (column == null) {
                missing.add(name);
                continue;
            }
            for (int row = 0; row < column.length; row++) {
                out[row][i] = column[row];
            }
        }
        if (!missing.isEmpty()) {
            throw BadInputException.at(chain.file(), "header", null, "no column for " + String.join(", ", missing)
                    + ", which " + fit + " gives as fitted; expected the chain written with that fit.json");
        }
        return out;
    }

    /** How the errors were propagated, for dimensions.json and dimensions.txt. */
    private static String errorSource(PosteriorChain chain, FitJsonInput fitInput, boolean refit) {
        String lc = chain == null ? "fit.json's covariance (normal draws of the light-curve elements with its "
                + "uncertainties and correlations)" : "the posterior chain " + chain.file() + " (" + chain.size() + " rows"
                + (fitInput.convergence().converged() ? "" : "; NOT CONVERGED, used because --allow-unconverged was "
                        + "given: the errors may be much too small") + ")";
        return lc + (refit ? "; K1 and K2 refitted to the velocities for each draw's period, e and omega" : "");
    }

    private java.io.PrintWriter console() {
        return spec.commandLine().getOut();
    }
}
