package org.twinlight.report;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.function.Function;
import org.twinlight.BadInputException;
import org.twinlight.dimensions.BinaryElements;
import org.twinlight.dimensions.DimensionsPropagation;
import org.twinlight.dimensions.Quantity;
import org.twinlight.dimensions.SanityChecks;

/**
 * From the numbers of a {@code fit.json} to absolute dimensions and their files: the light-curve
 * elements with their covariance (or the fit's posterior chain), K1 and K2 from one of three
 * sources (given with errors, fitted jointly with the light curve in the same fit.json, or fitted
 * to a velocity file by the caller), the effective temperatures, the propagation of the errors,
 * the sanity warnings, and {@code dimensions.json}, {@code dimensions.txt}, {@code mass-radius.png}
 * and {@code mass-luminosity.png}. Used by the {@code dimensions} command and by {@code analyse}.
 */
public final class DimensionsFromFit {
    /** The files written, in order ({@code mass-luminosity.png} only with temperatures of both stars). */
    public static final List<String> FILES = List.of("dimensions.json", "dimensions.txt", "mass-radius.png",
            "mass-luminosity.png");

    private static final List<String> DRAWN = DimensionsPropagation.DRAWN;
    private static final int ECCENTRICITY = DRAWN.indexOf("eccentricity");
    private static final int K1 = DRAWN.indexOf("k1");
    private static final int K2 = DRAWN.indexOf("k2");
    private static final int TEFF1 = DRAWN.indexOf("teff1");
    private static final int TEFF2 = DRAWN.indexOf("teff2");
    private static final int SURFACE_BRIGHTNESS = DRAWN.indexOf("surfaceBrightnessRatio");
    private static final int OMEGA = DRAWN.indexOf("omega");
    private static final int PERIOD = DRAWN.indexOf("period");

    private DimensionsFromFit() {
    }

    /**
     * The light-curve elements of a fit.json as a mean and covariance over
     * {@link DimensionsPropagation#DRAWN} (K1, K2 from the fit only when it fitted them jointly with
     * velocities; the temperatures not yet set), and the posterior chain when the fit made one.
     *
     * @param fit the fit.json's content
     * @param fitName how messages name the fit.json
     * @param fromFit fit.json's parameter name of each drawn element (null: not from the fit)
     * @param mean the central values
     * @param covariance their covariance
     * @param chain the posterior chain, null when there is none
     * @param notes remarks on the inputs
     */
    public record Elements(FitJsonInput fit, String fitName, String[] fromFit, double[] mean, double[][] covariance,
            PosteriorChain chain, List<String> notes) {

        /** Whether the period, e or ω carry an error (K must then follow each drawn orbit). */
        public boolean orbitUncertain() {
            return covariance[PERIOD][PERIOD] > 0 || eccentricityOmegaUncertain();
        }

        /** Whether e or ω carry an error. */
        public boolean eccentricityOmegaUncertain() {
            return covariance[ECCENTRICITY][ECCENTRICITY] > 0 || covariance[OMEGA][OMEGA] > 0;
        }

        /** Whether K1 and K2 were fitted with the light curve (a joint fit with velocities). */
        public boolean semiAmplitudesFitted() {
            return fromFit[K1] != null;
        }
    }

    /**
     * Where K1 and K2 come from.
     *
     * @param k1Kms K1, km/s (ignored when {@link Elements#semiAmplitudesFitted})
     * @param k2Kms K2, km/s
     * @param covariance 2 × 2 covariance of (K1, K2), km²/s²
     * @param perOrbit K refitted for each drawn orbit (null: K drawn with {@code covariance})
     * @param velocityOrbit what the velocities alone say of e and ω (null when unknown)
     * @param source where they came from, in words, for dimensions.json
     * @param file the velocity file (for messages and its digest), null when none
     * @param notes remarks
     * @param warnings warnings (e.g. the velocities' orbit disagrees with the light curve's)
     */
    public record SemiAmplitudes(double k1Kms, double k2Kms, double[][] covariance,
            DimensionsPropagation.SemiAmplitudesForOrbit perOrbit, DimensionsPropagation.VelocityOrbit velocityOrbit,
            String source, Path file, List<String> notes, List<String> warnings) {

        /**
         * K1 and K2 given with their 1σ errors (independent).
         *
         * @param orbit the elements, to say when the given K cannot follow the drawn orbit
         */
        public static SemiAmplitudes given(double k1, double k1Error, double k2, double k2Error, Elements orbit) {
            List<String> notes = new ArrayList<>();
            if (k1Error == 0 || k2Error == 0) {
                notes.add("K1 or K2 was given without an error: the errors of masses and radii leave it out");
            }
            if (orbit.orbitUncertain()) {
                notes.add("K1 and K2 were given, so they do not follow the period, e and omega drawn from "
                        + orbit.fitName() + "; give velocities to refit them per draw, or K errors that include the "
                        + "orbit's");
            }
            return new SemiAmplitudes(k1, k2, new double[][] {{k1Error * k1Error, 0}, {0, k2Error * k2Error}}, null,
                    null, String.format(Locale.ROOT, "given: K1 = %s +- %s, K2 = %s +- %s km/s", k1, k1Error, k2,
                            k2Error), null, notes, List.of());
        }

        /** K1 and K2 fitted jointly with the light curve: their values and correlations are the fit's. */
        public static SemiAmplitudes fitted(Elements el, String velocityFiles) {
            return new SemiAmplitudes(el.mean()[K1], el.mean()[K2], null, null, null, "fitted jointly with the "
                    + "light curve in " + el.fitName() + " to the velocities " + velocityFiles, null,
                    List.of("K1 and K2 come from the joint fit of the light curve and the velocities, with their "
                            + "correlations with the period, e, omega, the inclination and the radii"), List.of());
        }
    }

    /**
     * The effective temperatures (null when not given) and their 1σ errors, K.
     *
     * @param teff1 star 1's (the star eclipsed at primary eclipse)
     * @param teff1Error its error
     * @param teff2 star 2's (null: from Teff1 and the surface-brightness ratio)
     * @param teff2Error its error
     */
    public record Temperatures(Double teff1, double teff1Error, Double teff2, double teff2Error) {
        /** No temperatures: no luminosities. */
        public static final Temperatures NONE = new Temperatures(null, 0, null, 0);
    }

    /**
     * The dimensions and everything their files say.
     *
     * @param result the propagated dimensions
     * @param inputs what went in, for the record
     * @param warnings warnings for the reader
     * @param notes remarks
     */
    public record Outcome(DimensionsPropagation.Result result, DimensionsFiles.Inputs inputs, List<String> warnings,
            List<String> notes) {

        /** Whether luminosities of both stars were computed. */
        public boolean luminosities() {
            return result.estimates().containsKey(Quantity.LOG_LUMINOSITY1)
                    && result.estimates().containsKey(Quantity.LOG_LUMINOSITY2);
        }

        /** {@code dimensions.txt}. */
        public String table() {
            return DimensionsFiles.table(result, warnings, inputs.errorMethod());
        }
    }

    /**
     * The elements of {@code fit}, with K1 and K2 from it when it fitted them jointly with velocities
     * (and {@code useFittedK}). The posterior chain fit.json names is used when present; an
     * unconverged one is refused unless {@code allowUnconverged}.
     *
     * @throws BadInputException naming the fit.json when it cannot give the elements
     */
    public static Elements elements(FitJsonInput fit, String fitName, boolean useFittedK, boolean allowUnconverged) {
        List<String> notes = new ArrayList<>();
        PosteriorChain chain = posteriorChain(fit, fitName, allowUnconverged);
        if (chain == null && fit.posterior()) {
            notes.add(fitName + " holds a posterior but names no chain file (key 'convergence.chainFile'): the errors "
                    + "come from normal draws with its uncertainties and correlations");
        }
        boolean fittedK = useFittedK && fit.values().containsKey("k1") && fit.values().containsKey("k2");
        String[] fromFit = {"period", "eccentricity", "inclination", fittedK ? "k1" : null, fittedK ? "k2" : null,
            "radius1", "radius2", null, null, "surfaceBrightnessRatio", "omega"};
        double[] mean = new double[DRAWN.size()];
        double[][] cov = new double[mean.length][mean.length];
        for (int i = 0; i < fromFit.length; i++) {
            if (fromFit[i] == null) {
                continue;
            }
            double fallback = switch (fromFit[i]) {
                case "eccentricity" -> fit.model().common().eccentricity();
                case "omega" -> fit.model().common().omegaDeg();
                default -> Double.NaN;
            };
            mean[i] = fit.values().getOrDefault(fromFit[i], fallback);
            for (int j = 0; j < fromFit.length; j++) {
                if (fromFit[j] != null) {
                    cov[i][j] = fit.covariance(fromFit[i], fromFit[j]);
                }
            }
        }
        if (!(mean[ECCENTRICITY] >= 0 && mean[ECCENTRICITY] < 1)) {
            throw BadInputException.at(fit.file(), "key 'parameters.eccentricity'", null, "expected 0 <= e < 1, got "
                    + mean[ECCENTRICITY]);
        }
        return new Elements(fit, fitName, fromFit, mean, cov, chain, notes);
    }

    /**
     * Propagates the elements, K1, K2 and the temperatures to the dimensions.
     *
     * @param draws number of draws
     * @param seed seed of the draws
     * @throws BadInputException when the central elements give no physical system
     */
    public static Outcome propagate(Elements el, SemiAmplitudes k, Temperatures t, int draws, long seed) {
        double[] mean = el.mean().clone();
        double[][] cov = new double[mean.length][];
        for (int i = 0; i < mean.length; i++) {
            cov[i] = el.covariance()[i].clone();
        }
        List<String> notes = new ArrayList<>(el.notes());
        notes.addAll(k.notes());
        if (!el.semiAmplitudesFitted()) {
            mean[K1] = k.k1Kms();
            mean[K2] = k.k2Kms();
            cov[K1][K1] = k.covariance()[0][0];
            cov[K2][K2] = k.covariance()[1][1];
            cov[K1][K2] = cov[K2][K1] = k.covariance()[0][1];
        }
        mean[TEFF1] = t.teff1() == null ? Double.NaN : t.teff1();
        mean[TEFF2] = t.teff2() == null ? Double.NaN : t.teff2();
        cov[TEFF1][TEFF1] = t.teff1() == null ? 0 : t.teff1Error() * t.teff1Error();
        cov[TEFF2][TEFF2] = t.teff2() == null ? 0 : t.teff2Error() * t.teff2Error();
        String teff2Source = null;
        if (t.teff2() != null) {
            teff2Source = "given";
        } else if (t.teff1() != null && !Double.isNaN(mean[SURFACE_BRIGHTNESS])) {
            teff2Source = "Teff1 x J^(1/4) from the fitted central surface-brightness ratio J: an approximation that "
                    + "treats J as bolometric; in a band it understates the temperature difference (J grows more "
                    + "slowly than T^4 in the red); give Teff2 for a published result";
            notes.add("Teff2 = " + teff2Source);
        }
        boolean surfaceBrightnessUsed = t.teff1() != null && t.teff2() == null;
        if (!surfaceBrightnessUsed) {
            // J is used only to derive Teff2
            Arrays.fill(cov[SURFACE_BRIGHTNESS], 0);
            for (double[] row : cov) {
                row[SURFACE_BRIGHTNESS] = 0;
            }
            mean[SURFACE_BRIGHTNESS] = Double.NaN;
        }
        String missingCorrelations = el.chain() != null ? null : missingCorrelations(el, cov);
        BinaryElements central = BinaryElements.fromVector(mean);
        String problem = central.problem();
        if (problem != null) {
            throw new BadInputException(el.fitName() + (k.file() != null ? " and " + k.file() : "") + ": " + problem);
        }
        double[][] samples = el.chain() == null ? null : chainSamples(el, surfaceBrightnessUsed);
        DimensionsPropagation.SemiAmplitudesForOrbit kForOrbit = k.perOrbit();
        if (kForOrbit != null && samples == null && !el.orbitUncertain()) {
            kForOrbit = null; // the orbit is exact: K need not be refitted per draw
        }
        DimensionsPropagation.Result r;
        try {
            r = DimensionsPropagation.propagate(new DimensionsPropagation.Inputs(central, mean[OMEGA], cov, kForOrbit,
                    samples, k.velocityOrbit()), draws, seed);
        } catch (IllegalArgumentException e) {
            throw new BadInputException(el.fitName() + ": " + e.getMessage());
        }
        List<String> warnings = new ArrayList<>(k.warnings());
        if (missingCorrelations != null) {
            warnings.add(missingCorrelations);
        }
        String geometry = SanityChecks.eclipseGeometry(central, el.fit().model().common().omegaDeg());
        if (geometry != null) {
            warnings.add(geometry);
        }
        warnings.addAll(SanityChecks.warnings(r.central(), central));
        boolean combined = kForOrbit != null;
        if (combined) {
            notes.add(String.format(Locale.ROOT, "the orbit combines the light curve and the velocities (draws of the "
                    + "light curve's orbit weighted by the velocities' likelihood, K1 and K2 refitted per draw; "
                    + "%.0f effective draws): e = %.4f +- %.4f, omega = %.2f +- %.2f deg, K1 = %.3f +- %.3f, "
                    + "K2 = %.3f +- %.3f km/s; the values and errors under 'elements' are these",
                    r.effectiveDraws(), r.elementValues()[ECCENTRICITY], r.elementErrors()[ECCENTRICITY],
                    r.elementValues()[OMEGA], r.elementErrors()[OMEGA], r.elementValues()[K1], r.elementErrors()[K1],
                    r.elementValues()[K2], r.elementErrors()[K2]));
        }
        Map<String, double[]> used = new LinkedHashMap<>();
        for (int i = 0; i < mean.length; i++) {
            used.put(DRAWN.get(i), combined ? new double[] {r.elementValues()[i], r.elementErrors()[i]}
                    : new double[] {mean[i], Math.sqrt(cov[i][i])});
        }
        String errorMethod = errorMethod(el, combined);
        DimensionsFiles.Inputs in = new DimensionsFiles.Inputs(el.fitName(), InputDigest.sha256(el.fit().file()),
                k.source(), k.file() == null ? null : InputDigest.sha256(k.file()), teff2Source,
                el.fit().timeScale().label(), seed, used, el.chain() == null ? "covariance" : "posteriorChain",
                errorMethod);
        return new Outcome(r, in, warnings, notes);
    }

    /**
     * Writes dimensions.json, dimensions.txt, mass-radius.png and, with luminosities of both stars,
     * mass-luminosity.png, each to {@code target.apply(name)}.
     *
     * @return the names written
     */
    public static List<String> write(Outcome o, Function<String, Path> target, String title, String version) {
        FitFiles.writeJson(target.apply("dimensions.json"), DimensionsFiles.json(o.result(), o.inputs(), o.warnings(),
                o.notes(), version));
        AtomicFiles.writeString(target.apply("dimensions.txt"), o.table());
        DimensionsPlots.massRadius(o.result(), target.apply("mass-radius.png"), title);
        if (!o.luminosities()) {
            return FILES.subList(0, 3);
        }
        DimensionsPlots.massLuminosity(o.result(), target.apply("mass-luminosity.png"), title);
        return FILES;
    }

    /**
     * A warning when fit.json gives errors for two or more of the elements used but not their
     * correlations (no {@code correlation} block, or one without some of them): they are then drawn
     * as independent, which for r2 and i (often correlated near −1 in partial eclipses) can make
     * the radius errors far too large or too small. Null when nothing is missing.
     */
    private static String missingCorrelations(Elements el, double[][] cov) {
        List<String> withErrors = new ArrayList<>();
        List<String> missing = new ArrayList<>();
        for (int i = 0; i < el.fromFit().length; i++) {
            String name = el.fromFit()[i];
            if (name != null && cov[i][i] > 0) {
                withErrors.add(name);
                if (!el.fit().correlationNames().contains(name)) {
                    missing.add(name);
                }
            }
        }
        if (withErrors.size() < 2 || missing.isEmpty()) {
            return null;
        }
        String what = el.fit().correlationNames().isEmpty() ? "has no 'correlation' block"
                : "has no correlations for " + String.join(", ", missing) + " in its 'correlation' block";
        return el.fitName() + " " + what + ": the errors of " + String.join(", ", withErrors) + " were drawn as "
                + "independent, so the errors of radii, masses and luminosities ignore their correlations (r2 and "
                + "the inclination, for one, are typically strongly correlated) and may be much too large or too "
                + "small; use the fit.json the fit command wrote, which carries them";
    }

    /**
     * The posterior chain named by fit.json, or null when there is none. An unconverged chain is
     * refused unless {@code allowUnconverged}: its spread is not the posterior's.
     */
    private static PosteriorChain posteriorChain(FitJsonInput fit, String fitName, boolean allowUnconverged) {
        FitJsonInput.Convergence c = fit.convergence();
        if (c == null || c.chainFile() == null) {
            return null;
        }
        if (!c.converged() && !allowUnconverged) {
            throw BadInputException.at(Path.of(fitName), "key 'convergence.converged'", null, "false: the posterior "
                    + "chain " + c.chainFile().getFileName() + " did not converge" + (c.reason().isBlank() ? "" : " ("
                    + c.reason() + ")") + ", so its spread is not the posterior's and errors from it could be much "
                    + "too small. Run the fit with more steps, or give --allow-unconverged to use it anyway (the "
                    + "outputs then say so)");
        }
        return PosteriorChain.read(c.chainFile());
    }

    /**
     * The chain's rows as {@link DimensionsPropagation#DRAWN} vectors: the elements fit.json gives
     * with an error, taken from the chain's column of the same name (or NAME@BAND of fit.json's
     * first band); NaN in the columns the chain does not hold.
     */
    private static double[][] chainSamples(Elements el, boolean surfaceBrightnessUsed) {
        PosteriorChain chain = el.chain();
        FitJsonInput fit = el.fit();
        double[][] out = new double[chain.size()][el.fromFit().length];
        for (double[] row : out) {
            Arrays.fill(row, Double.NaN);
        }
        List<String> missing = new ArrayList<>();
        for (int i = 0; i < el.fromFit().length; i++) {
            String name = el.fromFit()[i];
            if (name == null || (name.equals("surfaceBrightnessRatio") && !surfaceBrightnessUsed)
                    || !(fit.uncertainties().getOrDefault(name, 0.0) > 0)) {
                continue;
            }
            double[] column = chain.column(name);
            if (column == null && fit.firstBand() != null) {
                column = chain.column(name + "@" + fit.firstBand());
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
                    + ", which " + el.fitName() + " gives as fitted; expected the chain written with that fit.json");
        }
        return out;
    }

    /** How the errors were propagated, for dimensions.json and dimensions.txt. */
    private static String errorMethod(Elements el, boolean refit) {
        PosteriorChain chain = el.chain();
        String lc = chain == null ? "fit.json's covariance (normal draws of the light-curve elements with its "
                + "uncertainties and correlations)" : "the posterior chain " + chain.file().getFileName() + " ("
                + chain.size() + " rows" + (el.fit().convergence().converged() ? "" : "; NOT CONVERGED, used "
                        + "because --allow-unconverged was given: the errors may be much too small") + ")";
        return lc + (el.semiAmplitudesFitted() ? "; K1 and K2 from the joint fit, drawn with the elements" : "")
                + (refit ? "; K1 and K2 refitted to the velocities for each draw's period, e and omega" : "");
    }
}
