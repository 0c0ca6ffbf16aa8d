package org.twinlight.cli;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;
import org.twinlight.BadInputException;
import org.twinlight.WorkFailedException;
import org.twinlight.eclipse.ModelFile;
import org.twinlight.fit.Baseline;
import org.twinlight.fit.EclipseFitter;
import org.twinlight.fit.FitData;
import org.twinlight.fit.FitProblem;
import org.twinlight.fit.GlobalSearch;
import org.twinlight.fit.Posterior;
import org.twinlight.fit.PosteriorSampler;
import org.twinlight.fit.FitResult;
import org.twinlight.fit.FitSettings;
import org.twinlight.fit.JointVelocities;
import org.twinlight.fit.Priors;
import org.twinlight.fit.NoiseDiagnostics;
import org.twinlight.fit.NoiseReport;
import org.twinlight.fit.StartingValues;
import org.twinlight.photometry.LightCurve;
import org.twinlight.report.FitFiles;
import org.twinlight.report.ModelFileJson;
import org.twinlight.report.FitPlot;
import org.twinlight.report.InputDigest;
import org.twinlight.report.PosteriorFiles;
import org.twinlight.report.JointFitFiles;
import org.twinlight.report.ResultSet;
import org.twinlight.time.TimeScale;
import org.twinlight.velocity.VelocityData;
import picocli.CommandLine.Command;
import org.twinlight.sky.Airmass;
import org.twinlight.sky.Equatorial;
import org.twinlight.sky.Site;
import org.twinlight.time.JulianDate;
import org.twinlight.time.SkyDirection;
import org.twinlight.time.TimeConverter;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/** {@code fit}: least-squares fit of the two-sphere model to one or more light curves. */
@Command(name = "fit", mixinStandardHelpOptions = true, versionProvider = VersionInfo.class, sortOptions = false,
        description = {"Fit the model of two limb-darkened spheres to one or more light curves "
                + "(several files = several bands or instruments sharing the geometry).",
            "Writes fit.json, residuals.csv, fit.png (one fit-BAND.png per further band) and model.json "
                + "(the best model, usable as a starting model).",
            "With --posterior also chain.csv.gz, trace.png and corner.png, and the posterior and convergence in "
                + "fit.json; a chain that has not converged is written but ends with exit code 1."})
public final class FitCommand implements Callable<Integer> {
    /** The band of a single file that names none. */
    static final String DEFAULT_BAND = "default";

    @picocli.CommandLine.Spec
    picocli.CommandLine.Model.CommandSpec spec;

    @Parameters(arity = "1..*", paramLabel = "FILE", description = "Light curves: delimited text or FITS tables.")
    List<Path> files;

    @Option(names = "--model", required = true, paramLabel = "START.json", description = "Starting model (JSON model file).")
    Path model;

    @Option(names = "--free", split = ",", paramLabel = "NAME",
            description = "Parameters to fit, comma-separated: period, epoch, radius1, radius2, inclination, "
                    + "eccentricity, omega, surfaceBrightnessRatio, thirdLight, limbDarkening1, limbDarkening2 "
                    + "(or one coefficient, e.g. limbDarkening1.a). Default: epoch,radius1,radius2,inclination,"
                    + "surfaceBrightnessRatio.")
    List<String> free;

    @Option(names = "--band", paramLabel = "NAME",
            description = "Band of each file, once per file in order (default: the file's band column; else, with "
                    + "several files, the file name without extension; a single file is the default band).")
    List<String> bands = new ArrayList<>();

    @Option(names = "--baseline", paramLabel = "KIND", defaultValue = "offset",
            description = "Flux normalisation per segment: none, offset, linear or quadratic (default: ${DEFAULT-VALUE}).")
    String baseline;

    @Option(names = "--segment-gap", paramLabel = "DAYS", defaultValue = "0.5",
            description = "Data are split into segments at gaps longer than this (default: ${DEFAULT-VALUE} d).")
    double segmentGapDays;

    @Option(names = "--max-iterations", paramLabel = "N", defaultValue = "200",
            description = "Iteration limit of the solver (default: ${DEFAULT-VALUE}).")
    int maxIterations;

    @Option(names = "--start", paramLabel = "model|auto", defaultValue = "model",
            description = "Starting values: model (those of --model) or auto (period, epoch, limb darkening and third "
                    + "light from --model; radii, inclination, e cos ω, e sin ω and surface-brightness ratio estimated "
                    + "from the depths, widths and phases of the eclipses in the folded data). Default: ${DEFAULT-VALUE}.")
    String startFrom;

    @Option(names = "--clip", paramLabel = "SIGMA|none", defaultValue = "5",
            description = "Leave out points whose residual from the model exceeds SIGMA robust standard deviations, "
                    + "refitting until none change (at least 3; default: ${DEFAULT-VALUE}); none keeps every point. "
                    + "The input is never changed; fit.json counts what was left out.")
    String clip;

    @Option(names = "--global", description = "Search the whole range of the free parameters first (a Latin-hypercube "
            + "multistart, each start finished by least squares, on all cores): every distinct minimum goes to fit.json "
            + "under \"minima\", a note names any that fits almost as well (Δχ² < 9), and the best is fitted as usual.")
    boolean global;

    @Option(names = "--airmass", paramLabel = "column|computed",
            description = "Fit an extinction term per segment, linear in the airmass, with the baseline: from the "
                    + "file's airmass column, or computed from --ra, --dec and --site (default: none).")
    String airmass;

    @Option(names = "--ra", paramLabel = "RA", description = "Right ascension, J2000, for --airmass computed: degrees "
            + "or hh:mm:ss.s.")
    String ra;

    @Option(names = "--dec", paramLabel = "DEC", description = "Declination, J2000, for --airmass computed: degrees or "
            + "±dd:mm:ss.")
    String dec;

    @Option(names = "--site", paramLabel = "LAT,LON[,H]|FILE", description = "Observing site for --airmass computed: "
            + "latitude, longitude (degrees, east positive), height (m); or a site file.")
    String site;

    @Option(names = "--inflate-errors", paramLabel = "beta|none", defaultValue = "none",
            description = "beta: multiply the errors by max(1, beta), the time-averaging factor of the residuals "
                    + "(correlated noise), before the final uncertainties are formed and before sampling "
                    + "(--posterior); none: leave them "
                    + "(default: ${DEFAULT-VALUE}). Either way fit.json's noise block gives beta, the "
                    + "residual-permutation spread and the error to quote.")
    String inflateErrors;

    @Option(names = "--velocities", paramLabel = "RV.csv",
            description = "Radial velocities (text or FITS table, as the velocities command reads) fitted jointly with "
                    + "the light curves: one more data set sharing period, epoch, e and omega; K1, K2, gamma and one "
                    + "offset per further instrument (or file) are fitted too. Repeat for several files. Their time "
                    + "scale must be the light curves'. Adds velocities.png.")
    List<Path> velocityFiles = new ArrayList<>();

    @Option(names = "--out", required = true, paramLabel = "DIR", description = "Output directory (created if missing).")
    Path out;

    @Mixin
    PhotometryOptions photometry;

    @Mixin
    PosteriorOptions sampling;

    @Mixin
    VelocityColumnOptions velocityColumns;

    @Override
    public Integer call() {
        List<Path> inputFiles = new ArrayList<>(files);
        inputFiles.add(model);
        inputFiles.addAll(velocityFiles);
        List<String> targets = new ArrayList<>(List.of("fit.json", "residuals.csv", "model.json", "fit.png"));
        if (sampling.posterior) {
            targets.addAll(List.of(PosteriorFiles.CHAIN_FILE, "trace.png", "corner.png"));
        }
        if (!velocityFiles.isEmpty()) {
            targets.add("velocities.png");
        }
        OutputTargets.checkDirectory(out, targets, inputFiles);
        ModelFile start = ModelFileJson.read(model);
        Priors priors = ModelFileJson.readPriors(model);
        if (!bands.isEmpty() && bands.size() != files.size()) {
            throw new BadInputException("option --band: given " + bands.size() + " time(s) for " + files.size()
                    + " file(s); give it once per file, in order, or not at all");
        }
        Baseline base = Baseline.parse(baseline).orElseThrow(() -> new BadInputException(
                "option --baseline: expected none, offset, linear or quadratic, got '" + baseline + "'"));
        if (!(segmentGapDays > 0)) {
            throw new BadInputException("option --segment-gap: expected a positive number of days, got " + segmentGapDays);
        }
        if (maxIterations < 1) {
            throw new BadInputException("option --max-iterations: expected a positive integer, got " + maxIterations);
        }
        if (free != null && trimmed(free).isEmpty()) {
            throw new BadInputException("option --free: no parameter names given; name at least one, e.g. "
                    + String.join(",", FitSettings.DEFAULT_FREE));
        }
        FitSettings settings = new FitSettings(
                new LinkedHashSet<>(free == null || free.isEmpty() ? FitSettings.DEFAULT_FREE : trimmed(free)), base,
                segmentGapDays, maxIterations, clipSigma(clip));

        List<FitData> data = new ArrayList<>();
        List<FitFiles.InputRecord> inputs = new ArrayList<>();
        TimeScale scale = null;
        Path scaleFrom = null;
        for (int i = 0; i < files.size(); i++) {
            Path f = files.get(i);
            LightCurve lc = photometry.read(f, console());
            String bandSource = !bands.isEmpty() ? "option --band" : lc.band() != null ? "band column"
                    : files.size() > 1 ? "file name" : "default";
            String band = switch (bandSource) {
                case "option --band" -> bands.get(i);
                case "band column" -> lc.band();
                case "file name" -> baseName(f);
                default -> DEFAULT_BAND;
            };
            if (scale == null) {
                scale = lc.timeScale();
                scaleFrom = f;
            } else if (!scale.equals(lc.timeScale())) {
                throw new BadInputException(f + ": its times are " + lc.timeScale().label() + " but " + scaleFrom
                        + " has " + scale.label() + "; convert them to one time scale first (the time command)");
            }
            if (!start.covers(band)) {
                throw new BadInputException(model + ": the model gives surfaceBrightnessRatio only per band ("
                        + String.join(", ", start.bands().keySet()) + ") and " + f + " is band '" + band
                        + "' (" + bandSource + "); name its band with --band or add the band to the model file");
            }
            lc = withAirmass(lc, f, base);
            data.add(new FitData(lc, band));
            String digest = InputDigest.sha256(f);
            for (FitFiles.InputRecord earlier : inputs) {
                if (earlier.sha256().equals(digest)) {
                    console().println("note: " + f + " has the same content as " + earlier.file()
                            + ": the same points count twice and the uncertainties come out too small");
                }
            }
            inputs.add(new FitFiles.InputRecord(f.toString(), digest, band, bandSource, lc.size()));
            if (lc.rejectedCount() > 0) {
                console().printf(Locale.ROOT, "%s: %d row(s) not used: %s%n", f, lc.rejectedCount(), lc.rejectedRows());
            }
        }

        List<String> startNotes = new ArrayList<>();
        if (startFrom.trim().equalsIgnoreCase("auto")) {
            Map<String, StartingValues> estimates = StartingValues.fromData(data, start);
            start = StartingValues.apply(start, estimates, settings.free());
            estimates.forEach((band, e) -> startNotes.add((estimates.size() > 1 ? "band " + band + ": " : "")
                    + e.describe()));
            startNotes.forEach(n -> console().println("note: " + n));
        } else if (!startFrom.trim().equalsIgnoreCase("model")) {
            throw new BadInputException("option --start: expected model or auto, got '" + startFrom + "'");
        }
        for (int i = 0; i < data.size(); i++) {
            EpochChecks.near(start.common().epochDays(), start.common().periodDays(),
                    data.get(i).lightCurve().timesDays(), files.get(i).toString(), model + ": key 'epoch'");
        }
        boolean inflate = inflateErrors(inflateErrors);
        List<VelocityData> velocityData = readVelocities(scale, scaleFrom);
        JointVelocities joint = velocityData.isEmpty() ? null : JointVelocities.of(velocityData, start.common());
        if (joint != null) {
            joint.notes().forEach(n -> console().println("note: " + n));
        }
        FitProblem problem = FitProblem.of(start, data, settings, priors, joint);
        int freeCount = PosteriorSampler.dimension(problem, sampling.posterior && sampling.jitter);
        sampling.check(freeCount, global, inflate);
        sampling.checkPriors(priors);
        GlobalSearch.Result search = null;
        if (global) {
            search = GlobalSearch.run(problem, sampling.seed(), 0);
            console().printf(Locale.ROOT, "global search: %d starts, %d distinct minim%s%n", search.starts(),
                    search.minima().size(), search.minima().size() == 1 ? "um" : "a");
            problem = search.best();
        }
        FitResult r = EclipseFitter.optimize(problem);
        NoiseReport noise = NoiseDiagnostics.of(problem, r);
        FitResult sampledFrom = r;
        if (inflate) {
            sampledFrom = NoiseDiagnostics.forInflatedSampling(r, noise.inflation());
            r = NoiseDiagnostics.inflate(r, noise.inflation());
            noise = noise.withInflationApplied();
        }
        Posterior posterior = sampling.posterior ? sampling.sample(problem, sampledFrom, freeCount,
                spec.commandLine().getErr()) : null;

        com.fasterxml.jackson.databind.node.ObjectNode doc = FitFiles.fitJson(r, settings, scale, inputs,
                VersionInfo.version());
        com.fasterxml.jackson.databind.node.ObjectNode settingsNode =
                (com.fasterxml.jackson.databind.node.ObjectNode) doc.get("settings");
        settingsNode.put("airmass", airmass == null ? "none" : airmass.trim().toLowerCase(Locale.ROOT));
        if (global || sampling.posterior) {
            settingsNode.put("seed", sampling.seed());
        }
        if (sampling.posterior) {
            settingsNode.put("jitter", sampling.jitter);
        }
        com.fasterxml.jackson.databind.node.ArrayNode notes = (com.fasterxml.jackson.databind.node.ArrayNode) doc.get("notes");
        startNotes.forEach(notes::add);
        FitFiles.putPriors(doc, priors);
        if (search != null) {
            FitFiles.putMinima(doc, search);
            search.notes().forEach(n -> console().println("note: " + n));
        }
        FitFiles.putNoise(doc, noise, r);
        for (FitData d : data) {
            d.lightCurve().notes().forEach(n -> notes.add(d.lightCurve().source() + ": " + n));
        }
        if (posterior != null) {
            PosteriorFiles.addTo(doc, posterior);
        }
        if (joint != null) {
            JointFitFiles.putVelocities(doc, r, joint, velocityFiles);
        }
        List<String> bandList = data.stream().map(FitData::band).distinct().toList();
        try (ResultSet set = ResultSet.open(out, "fit")) {
            FitFiles.writeJson(set.file("fit.json"), doc);
            FitFiles.writeResiduals(set.file("residuals.csv"), r, scale);
            FitFiles.writeJson(set.file("model.json"), ModelFileJson.toJson(r.model()));
            String title = "Fit of " + files.get(0).getFileName();
            FitPlot.write(r, bandList.get(0), set.file("fit.png"), title, scale.label());
            for (int b = 1; b < bandList.size(); b++) {
                FitPlot.write(r, bandList.get(b), set.file("fit-" + safe(bandList.get(b)) + ".png"), title,
                        scale.label());
            }
            if (posterior != null) {
                PosteriorFiles.writeAll(set::file, posterior, "Posterior of " + files.get(0).getFileName());
            }
            if (joint != null) {
                JointFitFiles.writePlots(set::file, r, joint, velocityFiles, files.get(0).getFileName().toString());
            }
            set.commit();
        }
        console().print(FitFiles.summary(r, scale));
        console().print(FitFiles.noiseSummary(noise, r));
        noise.notes(r).forEach(n -> console().println("note: " + n));
        console().println("caution: " + FitFiles.caution(r.model()));
        if (joint != null) {
            console().print(JointFitFiles.summary(r, joint));
        }
        String written = "fit.json, residuals.csv, model.json, fit.png" + (joint != null ? ", velocities.png" : "");
        if (posterior == null) {
            console().println("wrote " + written + " to " + out);
            return 0;
        }
        console().print(PosteriorFiles.summary(posterior));
        console().println("wrote " + written + ", " + PosteriorFiles.CHAIN_FILE
                + ", trace.png and corner.png to " + out);
        if (!posterior.convergence().converged()) {
            throw new WorkFailedException("the posterior sample has not converged: " + posterior.convergence().reason()
                    + ". The files were written with \"converged\": false; do not quote its intervals. Try a larger "
                    + "--max-steps (e.g. " + 2 * posterior.steps() + "), fewer free parameters, or priors that "
                    + "rule out what the data cannot decide");
        }
        return 0;
    }

    /** Parses --inflate-errors: beta (true) or none (false). */
    static boolean inflateErrors(String text) {
        String t = text.trim();
        if (t.equalsIgnoreCase("beta")) {
            return true;
        }
        if (t.equalsIgnoreCase("none")) {
            return false;
        }
        throw new BadInputException("option --inflate-errors: expected beta or none, got '" + text + "'");
    }

    /**
     * Reads the --velocities files and checks that their time scale is the light curves'.
     *
     * @throws BadInputException naming both files and scales when they differ
     */
    private List<VelocityData> readVelocities(TimeScale lightCurveScale, Path lightCurveFile) {
        List<VelocityData> out = new ArrayList<>();
        for (Path f : velocityFiles) {
            VelocityData d = VelocityFileOptions.read(f, velocityColumns.toReadOptions(null, null, null, null), console());
            VelocityFileOptions.checkTimeScale(d, f, lightCurveScale, "the light curve " + lightCurveFile,
                    lightCurveFile, console());
            out.add(d);
        }
        return out;
    }

    /** Parses --clip: a number of standard deviations (≥ 3) or none. */
    static double clipSigma(String text) {
        String t = text.trim();
        if (t.equalsIgnoreCase("none")) {
            return Double.NaN;
        }
        double v;
        try {
            v = Double.parseDouble(t);
        } catch (NumberFormatException e) {
            throw new BadInputException("option --clip: expected a number of standard deviations (at least "
                    + FitSettings.MIN_CLIP_SIGMA + ") or none, got '" + text + "'");
        }
        if (!(v >= FitSettings.MIN_CLIP_SIGMA) || Double.isInfinite(v)) {
            throw new BadInputException("option --clip: expected a number of standard deviations of at least "
                    + FitSettings.MIN_CLIP_SIGMA + " (below it honest points of Gaussian noise are lost) or none, got "
                    + text);
        }
        return v;
    }

    private static List<String> trimmed(List<String> names) {
        List<String> t = new ArrayList<>();
        for (String n : names) {
            if (!n.isBlank()) {
                t.add(n.trim());
            }
        }
        return t;
    }

    static String baseName(Path f) {
        String n = f.getFileName().toString();
        int dot = n.lastIndexOf('.');
        return dot > 0 ? n.substring(0, dot) : n;
    }

    private static String safe(String s) {
        return s.replaceAll("[^A-Za-z0-9_.-]", "_");
    }

    private java.io.PrintWriter console() {
        return spec.commandLine().getOut();
    }

    /**
     * The light curve with the airmass the fit is to use: the file's column ({@code --airmass
     * column}), one computed for each time ({@code computed}), or none (the default, which also
     * drops a column the file has).
     */
    private LightCurve withAirmass(LightCurve lc, Path f, Baseline base) {
        if (airmass == null) {
            if (lc.hasAirmass()) {
                console().println("note: " + f + " has an airmass column; --airmass column fits an extinction term "
                        + "per segment with it");
            }
            return lc.hasAirmass() ? lc.withAirmass(null) : lc;
        }
        String mode = airmass.trim().toLowerCase(Locale.ROOT);
        if (!mode.equals("column") && !mode.equals("computed")) {
            throw new BadInputException("option --airmass: expected column or computed, got '" + airmass + "'");
        }
        if (base == Baseline.NONE) {
            throw new BadInputException("option --airmass: the extinction term is solved with the baseline, so it "
                    + "needs --baseline offset, linear or quadratic, not none");
        }
        if (mode.equals("column")) {
            if (!lc.hasAirmass()) {
                throw new BadInputException("option --airmass column: " + f + " has no airmass column (a column "
                        + "named 'airmass'); add one, or use --airmass computed with --ra, --dec and --site");
            }
            return lc;
        }
        SkyDirection direction = SkyPositionOptions.parse(ra, dec, "--airmass computed");
        if (site == null) {
            throw new BadInputException("option --site is missing: --airmass computed needs the observing site "
                    + "(LAT,LON[,HEIGHT_M] or a site file)");
        }
        if (lc.timeScale() == TimeScale.UNKNOWN) {
            throw new BadInputException(f + ": the time scale is unknown, so the airmass cannot be computed; declare "
                    + "it with --time-scale");
        }
        Site where = SkyPositionOptions.site(site);
        Equatorial j2000 = new Equatorial(direction.raDeg(), direction.decDeg());
        double[] t = lc.timesDays();
        double[] x = new double[t.length];
        for (int i = 0; i < t.length; i++) {
            JulianDate utc = TimeConverter.convert(JulianDate.of(t[i], lc.timeScale()), TimeScale.JD_UTC, direction);
            try {
                x[i] = Airmass.at(j2000, where, utc);
            } catch (IllegalArgumentException e) {
                throw new BadInputException(f + ": at time " + t[i] + " " + e.getMessage() + " from the site given; "
                        + "check --ra, --dec, --site (longitude east positive) and the time scale");
            }
        }
        return lc.withAirmass(x);
    }
}
