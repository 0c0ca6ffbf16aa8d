package org.twinlight.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.Callable;
import org.twinlight.BadInputException;
import org.twinlight.analysis.AnalysisOutcome;
import org.twinlight.analysis.AnalysisRequest;
import org.twinlight.analysis.AnalysisSettings;
import org.twinlight.analysis.AnalysisSettingsJson;
import org.twinlight.analysis.TargetAnalysis;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/** {@code analyse FILE.. --out DIR}: the whole job on one target, from raw light curve to report.html. */
@Command(name = "analyse", mixinStandardHelpOptions = true, versionProvider = VersionInfo.class, sortOptions = false,
        description = {"The whole analysis of one eclipsing binary, from the raw light curve to a report: period "
                + "search (unless --period), times of minimum and ephemeris, starting values from the eclipses' "
                + "depths, widths and phases, and a least-squares fit of the two-sphere model from several starts; "
                + "then, when asked, the joint fit with radial velocities (--velocities), the posterior sample "
                + "(--posterior) and the absolute dimensions (from the velocities, or --k1 --k2). --seed seeds every "
                + "random draw of the run: the bootstrap of the minima, the global search, the sampler and the "
                + "dimensions' draws.",
            "Writes report.html (one page, plots embedded), results.json (every number of the page), "
                + "settings-used.json (run it again with --settings to repeat the run) and the files of each "
                + "stage (period.json, periodogram.png, minima.csv, ephemeris.json, o-c.png, fit.json, fit.png, "
                + "residuals.csv, model.json; with --posterior chain.csv.gz, trace.png, corner.png; with "
                + "--velocities velocities.png; with --velocities or --k1 --k2 dimensions.json, dimensions.txt, "
                + "mass-radius.png and, with --teff1, mass-luminosity.png). Exit 1 with a report that explains when "
                + "the data cannot give an answer (no eclipses, one eclipse only, no significant period), the period is ambiguous, or the "
                + "posterior sample has not converged.",
            "Every option can also be given in a settings file (docs/analyse.md); options win over the file."})
public final class AnalyseCommand implements Callable<Integer> {

    @Parameters(arity = "0..*", paramLabel = "FILE",
            description = "Light curves: delimited text or FITS tables (several = several bands sharing the "
                    + "geometry). May instead be listed under 'files' in --settings.")
    List<Path> files = new ArrayList<>();

    @Option(names = "--out", required = true, paramLabel = "DIR", description = "Output directory (created if missing).")
    Path out;

    @Option(names = "--settings", paramLabel = "FILE.json",
            description = "Settings file (JSON; keys in docs/analyse.md), e.g. the settings-used.json of an earlier run.")
    Path settingsFile;

    @Option(names = "--label", paramLabel = "NAME", description = "Name of the target in the report (default: the file name).")
    String label;

    @Option(names = "--band", paramLabel = "NAME", description = "Band of each file, once per file in order.")
    List<String> bands;

    @Option(names = "--period", paramLabel = "DAYS", description = "Orbital period; skips the period search.")
    Double period;

    @Option(names = "--epoch", paramLabel = "T0",
            description = "Time of a primary minimum, in the data's time scale (with --period; default: found).")
    Double epoch;

    @Option(names = "--min-period", paramLabel = "DAYS", description = "Shortest trial period of the search (default 0.2 d).")
    Double minPeriod;

    @Option(names = "--max-period", paramLabel = "DAYS", description = "Longest trial period (default: half the baseline).")
    Double maxPeriod;

    @Option(names = "--model", paramLabel = "START.json",
            description = "Starting model file: its period and epoch (unless --period) and limb darkening are used, "
                    + "and it is the first start of the fit.")
    Path model;

    @Option(names = "--free", split = ",", paramLabel = "NAME",
            description = "Parameters to fit (default: period,epoch,radius1,radius2,inclination,eccentricity,omega,"
                    + "surfaceBrightnessRatio).")
    List<String> free;

    @Option(names = "--baseline", paramLabel = "KIND", description = "none, offset (default), linear or quadratic per segment.")
    String baseline;

    @Option(names = "--segment-gap", paramLabel = "DAYS", description = "Gap that splits segments (default 0.5 d).")
    Double segmentGap;

    @Option(names = "--clip", paramLabel = "SIGMA|none", description = "Outlier clipping against the model (default 5).")
    String clip;

    @Option(names = "--max-iterations", paramLabel = "N", description = "Iteration limit of the fit (default 200).")
    Integer maxIterations;

    @Option(names = "--starts", paramLabel = "N", description = "Starting points of the fit (default 6).")
    Integer starts;

    @Option(names = "--exposure-time", paramLabel = "DAYS",
            description = "Exposure time for smearing (default: the median spacing of the points; 0 for none).")
    Double exposureTime;

    @Option(names = "--supersample", paramLabel = "N", description = "Sub-exposures per exposure (default: one per 2 minutes of exposure).")
    Integer supersample;

    @Option(names = "--velocities", paramLabel = "RV.csv",
            description = "Radial velocities of both stars (repeatable, e.g. one file per instrument): after the "
                    + "light-curve fit, the light curves and velocities are fitted together (as fit --velocities), "
                    + "then the absolute dimensions are computed from that fit.")
    List<Path> velocities;

    @Mixin
    DimensionsOptions dimensions;

    @Mixin
    PosteriorOptions sampling;

    @Mixin
    PhotometryOptions photometry;

    @Spec
    picocli.CommandLine.Model.CommandSpec spec;

    @Override
    public Integer call() {
        PrintWriter o = spec.commandLine().getOut();
        AnalysisSettings s = AnalysisSettings.defaults();
        String where = "options";
        if (settingsFile != null) {
            OptionChecks.readableFile(settingsFile);
            s = AnalysisSettingsJson.read(settingsFile, s);
            where = settingsFile + " and the options";
        }
        for (Map.Entry<String, Object> e : options().entrySet()) {
            if (e.getValue() != null) {
                s = s.with(e.getKey(), e.getValue());
            }
        }
        if (!files.isEmpty()) {
            for (Path f : files) {
                OptionChecks.readableFile(f);
            }
            s = s.withFiles(files.stream().map(f -> f.toAbsolutePath().normalize().toString()).toList());
        }
        s = s.validated(where);
        AnalysisOutcome outcome = TargetAnalysis.run(new AnalysisRequest(s, out), line -> {
            o.println(line);
            o.flush();
        });
        if (outcome.exitCode() == 2) {
            throw new BadInputException(outcome.message());
        }
        if (outcome.exitCode() != 0) {
            o.println("exit code 1: see " + out.resolve("report.html") + " for what the data could not settle");
        }
        o.flush();
        return outcome.exitCode();
    }

    /** The options given, by their key in the settings file. */
    private Map<String, Object> options() {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("label", label);
        m.put("bands", bands);
        m.putAll(photometry.settingsEntries());
        m.put("period", period);
        m.put("epoch", epoch);
        m.put("minPeriod", minPeriod);
        m.put("maxPeriod", maxPeriod);
        m.put("model", model == null ? null : model.toAbsolutePath().normalize().toString());
        m.put("free", free);
        m.put("baseline", baseline);
        m.put("segmentGap", segmentGap);
        m.put("clip", clip == null ? null : FitCommand.clipSigma(clip));
        m.put("maxIterations", maxIterations);
        m.put("starts", starts);
        m.put("exposureTime", exposureTime);
        m.put("supersample", supersample);
        m.put("seed", sampling.seed);
        m.put("posterior", sampling.posterior ? Boolean.TRUE : null);
        m.put("jitter", sampling.jitter ? Boolean.TRUE : null);
        m.put("maxSteps", sampling.maxSteps);
        m.put("walkers", sampling.walkers);
        m.put("threads", sampling.threads);
        m.put("velocities", velocities == null ? null : velocities.stream()
                .map(f -> f.toAbsolutePath().normalize().toString()).toList());
        m.putAll(dimensions.settingsEntries());
        return m;
    }
}
