package org.twinlight.report;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.OutputStreamWriter;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;

import org.twinlight.fit.GlobalSearch;
import org.twinlight.fit.Prior;
import org.twinlight.fit.Priors;
import org.twinlight.fit.Estimate;
import org.twinlight.fit.FitResult;
import org.twinlight.fit.FitSettings;
import org.twinlight.fit.FittedCurve;
import org.twinlight.fit.ModelAdequacy;
import org.twinlight.eclipse.ModelFile;
import org.twinlight.fit.NoiseReport;
import org.twinlight.time.TimeScale;

/** Writes the results of a fit: {@code fit.json}, {@code residuals.csv} and the best model file. */
public final class FitFiles {
    /** The caution every fit result carries. */
    public static final String CAUTION = "The fitted parameters depend on the model's assumptions: two spherical "
            + "stars without reflection, ellipsoidal or beaming effects, the chosen limb-darkening law, and the "
            + "stated third light. Check them (residuals, correlations, other limb-darkening choices) before "
            + "publication.";
    /** The caution of a fit whose model has proximity effects. */
    public static final String CAUTION_CLOSE_PAIR = "The fitted parameters depend on the model's assumptions: two "
            + "spheres with first-order proximity terms (ellipsoidal variation, Lambert-sphere reflection, beaming; "
            + "valid for radii well inside the Roche lobes), the chosen limb-darkening and gravity-darkening "
            + "coefficients, and the stated third light. Check them (residuals, correlations, other "
            + "limb-darkening choices) before publication.";

    /** The caution for a fitted model. */
    public static String caution(ModelFile model) {
        return model.common().proximity().changesLight() ? CAUTION_CLOSE_PAIR : CAUTION;
    }

    private static final ObjectMapper JSON = new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT);

    /**
     * One input file as recorded in results.
     *
     * @param file path as given
     * @param sha256 digest of its bytes
     * @param band band it was fitted in
     * @param bandSource where the band's name came from ({@code option --band}, {@code band column},
     *     {@code file name}, or {@code default} for a single file that names none)
     * @param points number of points read
     */
    public record InputRecord(String file, String sha256, String band, String bandSource, int points) {
    }

    private FitFiles() {
    }

    /** The {@code fit.json} document. */
    public static ObjectNode fitJson(FitResult r, FitSettings settings, TimeScale scale, List<InputRecord> inputs,
            String softwareVersion) {
        ObjectNode root = JSON.createObjectNode();
        boolean multiBand = r.curves().stream().map(FittedCurve::band).distinct().count() > 1;
        ObjectNode params = root.putObject("parameters");
        putEstimates(params, r.parameters(), multiBand, true);
        ObjectNode derived = root.putObject("derived");
        putEstimates(derived, r.derived(), multiBand, false);
        ObjectNode stats = root.putObject("statistics");
        stats.put("n", r.n());
        stats.put("chi2", r.chi2());
        stats.put("reducedChi2", r.reducedChi2());
        stats.put("rms", r.rms());
        stats.put("bic", r.bic());
        stats.put("fittedQuantities", r.freeCount());
        stats.put("iterations", r.iterations());
        stats.put("evaluations", r.evaluations());
        stats.put("errorsEstimatedFromScatter", r.errorsEstimated());
        ObjectNode clip = stats.putObject("clipped");
        clip.put("sigma", settings.clips() ? settings.clipSigma() : null);
        clip.put("total", r.clippedCount());
        ObjectNode reasons = clip.putObject("byReason");
        r.clipped().forEach(reasons::put);
        root.set("adequacy", adequacyJson(r.adequacy()));
        putCorrelation(root, r.freeNames(), r.correlation());
        root.set("model", ModelFileJson.toJson(r.model()));
        root.put("timeScale", scale.label());
        ObjectNode input = root.putObject("input");
        input.put("file", inputs.get(0).file());
        input.put("sha256", inputs.get(0).sha256());
        ArrayNode files = input.putArray("files");
        for (InputRecord in : inputs) {
            ObjectNode f = files.addObject();
            f.put("file", in.file());
            f.put("sha256", in.sha256());
            f.put("band", in.band());
            f.put("bandSource", in.bandSource());
            f.put("points", in.points());
        }
        ObjectNode sw = root.putObject("software");
        sw.put("name", "twinlight");
        sw.put("version", softwareVersion);
        ObjectNode set = root.putObject("settings");
        ArrayNode free = set.putArray("free");
        settings.free().forEach(free::add);
        set.put("baseline", settings.baseline().label());
        set.put("segmentGapDays", settings.segmentGapDays());
        set.put("maxIterations", settings.maxIterations());
        if (settings.clips()) {
            set.put("clipSigma", settings.clipSigma());
        } else {
            set.put("clipSigma", "none");
        }
        set.put("method", "Levenberg-Marquardt least squares; uncertainties from the covariance scaled by the reduced "
                + (r.errorsEstimated() ? "chi-square (errors estimated from the scatter)"
                        : "chi-square when above 1 (errors as stated)"));
        ArrayNode notes = root.putArray("notes");
        r.notes().forEach(notes::add);
        root.put("caution", caution(r.model()));
        return root;
    }

    /**
     * The global search's distinct minima, best first: {@code "minima": [{"chi2", "parameters":
     * {NAME: value}, "starts"}]} (χ² over every point, before clipping; parameters the free ones and
     * radiusRatio, sumOfRadii), and its notes added to {@code "notes"}.
     */
    public static void putMinima(ObjectNode root, GlobalSearch.Result search) {
        ArrayNode minima = root.putArray("minima");
        for (GlobalSearch.Minimum m : search.minima()) {
            ObjectNode o = minima.addObject();
            o.put("chi2", m.chi2());
            ObjectNode p = o.putObject("parameters");
            m.parameters().forEach(p::put);
            o.put("starts", m.starts());
        }
        ObjectNode settings = (ObjectNode) root.get("settings");
        if (settings != null) {
            settings.put("globalSearchStarts", search.starts());
        }
        ArrayNode notes = (ArrayNode) root.get("notes");
        if (notes != null) {
            search.notes().forEach(notes::add);
        }
    }

    /** The priors used, under {@code settings.priors} in the model file's form. */
    public static void putPriors(ObjectNode root, Priors priors) {
        if (priors.isEmpty() || !(root.get("settings") instanceof ObjectNode settings)) {
            return;
        }
        ObjectNode out = settings.putObject("priors");
        priors.byName().forEach((name, prior) -> {
            ArrayNode pair = out.putObject(name).putArray(prior instanceof Prior.Uniform ? "uniform" : "normal");
            if (prior instanceof Prior.Uniform u) {
                pair.add(u.lower()).add(u.upper());
            } else if (prior instanceof Prior.Normal n) {
                pair.add(n.mean()).add(n.sigma());
            }
        });
    }

    /**
     * Adds the {@code "noise"} block to a {@code fit.json} document and its notes to the
     * document's notes: β per bin width and adopted, the residual-permutation spread per free
     * parameter, and per free parameter the error to quote with where it comes from.
     */
    public static void putNoise(ObjectNode doc, NoiseReport noise, FitResult r) {
        ObjectNode o = doc.putObject("noise");
        o.put("beta", finiteOrNull(noise.beta()));
        o.put("betaRule", NoiseReport.BETA_RULE);
        ObjectNode widths = o.putObject("betaByBinMinutes");
        noise.betaByBinMinutes().forEach((w, b) -> widths.put(String.format(Locale.ROOT, "%.0f", w), finiteOrNull(b)));
        o.put("eclipseMinutes", finiteOrNull(noise.eclipseMinutes()));
        ObjectNode perm = o.putObject("residualPermutation");
        noise.permutationSigma().forEach((name, sigma) -> perm.putObject(name).put("sigma", finiteOrNull(sigma)));
        o.put("shifts", noise.shifts());
        o.put("errorsInflatedBy", noise.appliedFactor());
        o.put("rule", NoiseReport.QUOTE_RULE);
        ObjectNode quoted = o.putObject("quoted");
        for (Estimate e : freeEstimates(r)) {
            String label = label(e, r);
            double q = noise.quoted(label, e.uncertainty());
            ObjectNode entry = quoted.putObject(label);
            entry.put("uncertainty", q);
            entry.put("from", q > e.uncertainty() * noise.inflation() / noise.appliedFactor() ? "residualPermutation"
                    : noise.inflation() > noise.appliedFactor() ? "covarianceTimesBeta" : "covariance");
        }
        ArrayNode notes = (ArrayNode) doc.get("notes");
        noise.notes(r).forEach(notes::add);
    }

    /** The terminal lines of the noise diagnostics: β and a table of the errors with the one to quote. */
    public static String noiseSummary(NoiseReport noise, FitResult r) {
        StringBuilder sb = new StringBuilder();
        String widths = noise.betaByBinMinutes().entrySet().stream().map(e -> String.format(Locale.ROOT,
                "%.0f min %.2f", e.getKey(), e.getValue())).collect(java.util.stream.Collectors.joining("; "));
        sb.append(String.format(Locale.ROOT, "%ncorrelated noise: beta = %.2f (%s: %s); residual permutation over %d "
                + "shifts%n", noise.beta(), NoiseReport.BETA_RULE, widths, noise.shifts()));
        sb.append(String.format(Locale.ROOT, "%-28s %14s %14s %14s%n", "error of", noise.appliedFactor() > 1
                ? "cov. x beta" : "covariance", "permutation", "quote"));
        for (Estimate e : freeEstimates(r)) {
            String label = label(e, r);
            sb.append(String.format(Locale.ROOT, "%-28s %14s %14s %14s%n", label, format(e.uncertainty()),
                    format(noise.permutationSigma().getOrDefault(label, Double.NaN)),
                    format(noise.quoted(label, e.uncertainty()))));
        }
        sb.append("(").append(NoiseReport.QUOTE_RULE).append(")\n");
        return sb.toString();
    }

    private static List<Estimate> freeEstimates(FitResult r) {
        return r.parameters().stream().filter(Estimate::free).toList();
    }

    private static String label(Estimate e, FitResult r) {
        boolean multiBand = r.curves().stream().map(FittedCurve::band).distinct().count() > 1;
        return e.band() == null || !multiBand ? e.name() : e.name() + "@" + e.band();
    }

    private static Double finiteOrNull(double v) {
        return Double.isFinite(v) ? v : null;
    }

    /** {@code "correlation": {"names": [..], "matrix": [[..]]}}, entries rounded to 1e-6. */
    static void putCorrelation(ObjectNode root, List<String> freeNames, double[][] correlation) {
        ObjectNode corr = root.putObject("correlation");
        ArrayNode names = corr.putArray("names");
        freeNames.forEach(names::add);
        ArrayNode matrix = corr.putArray("matrix");
        for (double[] row : correlation) {
            ArrayNode a = matrix.addArray();
            for (double v : row) {
                a.add(Math.round(v * 1e6) / 1e6);
            }
        }
    }

    private static void putEstimates(ObjectNode target, List<Estimate> list, boolean multiBand, boolean withFree) {
        for (Estimate e : list) {
            ObjectNode holder = target;
            if (multiBand && e.band() != null) {
                ObjectNode bands = target.has("bands") ? (ObjectNode) target.get("bands") : target.putObject("bands");
                holder = bands.has(e.band()) ? (ObjectNode) bands.get(e.band()) : bands.putObject(e.band());
            }
            ObjectNode o = holder.putObject(e.name());
            o.put("value", e.value());
            o.put("uncertainty", e.uncertainty());
            if (e.isLimit()) {
                ObjectNode limit = o.putObject("limit");
                limit.put("side", e.limit().side());
                limit.put("value95", e.limit().value95());
            }
            if (withFree) {
                o.put("free", e.free());
            }
        }
    }

    private static ObjectNode adequacyJson(ModelAdequacy.Result a) {
        ObjectNode o = JSON.createObjectNode();
        o.put("describesData", a.describesData());
        o.put("falseAlarmPerCheck", ModelAdequacy.FALSE_ALARM);
        ObjectNode chi = o.putObject("chiSquare");
        chi.put("tested", a.chi2Tested());
        chi.put("passed", a.chi2Passed());
        chi.put("reducedChi2", a.reducedChi2());
        chi.put("expectedSpread", a.expectedSpread());
        ObjectNode runs = o.putObject("runsTest");
        runs.put("passed", a.runsPassed());
        runs.put("runs", a.runs());
        runs.put("expected", a.expectedRuns());
        runs.put("z", a.runsZ());
        ObjectNode binned = o.putObject("binnedByPhase");
        binned.put("passed", a.binnedPassed());
        binned.put("chi2", a.binnedChi2());
        binned.put("bins", a.bins());
        binned.put("probability", a.binnedProbability());
        binned.put("inEclipseChi2", a.inEclipseChi2());
        binned.put("inEclipseBins", a.inEclipseBins());
        binned.put("largestMeanResidual", a.largestBinnedResidual());
        binned.put("largestMeanResidualPhase", Double.isNaN(a.largestBinPhase()) ? null : a.largestBinPhase());
        o.put("note", a.note());
        return o;
    }

    /** Writes a JSON document atomically. */
    public static void writeJson(Path target, ObjectNode doc) {
        try {
            AtomicFiles.writeString(target, JSON.writeValueAsString(doc) + "\n");
        } catch (JsonProcessingException e) {
            throw new IllegalStateException("cannot serialise " + target, e);
        }
    }

    /**
     * {@code residuals.csv}: time, phase, band, flux (baseline divided out), error, model,
     * residual (data − model), clipped (1 for a point left out as an outlier), one row per point,
     * after a {@code #} line with the time scale.
     */
    public static void writeResiduals(Path target, FitResult r, TimeScale scale) {
        double period = r.model().common().periodDays();
        double epoch = r.model().common().epochDays();
        AtomicFiles.write(target, out -> {
            Writer w = new OutputStreamWriter(out, StandardCharsets.UTF_8);
            w.write("# time scale: " + scale.label() + "; flux divided by the fitted baseline; phase 0 = primary eclipse\n");
            w.write("time,phase,band,flux,error,model,residual,clipped\n");
            for (FittedCurve c : r.curves()) {
                for (int i = 0; i < c.size(); i++) {
                    double t = c.timesDays()[i];
                    double ph = (t - epoch) / period;
                    ph -= Math.floor(ph);
                    w.write(String.format(Locale.ROOT, "%s,%.7f,%s,%.8f,%.3e,%.8f,%.3e,%d%n", Double.toString(t), ph,
                            c.band(), c.flux()[i], c.errors()[i], c.model()[i], c.residual(i),
                            c.clipped()[i] ? 1 : 0));
                }
            }
            w.flush();
        });
    }

    /** A plain-text table of the estimates, for the terminal. */
    public static String summary(FitResult r, TimeScale scale) {
        StringBuilder sb = new StringBuilder();
        sb.append(String.format(Locale.ROOT, "%-28s %18s %14s%n", "parameter", "value", "uncertainty"));
        for (Estimate e : r.parameters()) {
            sb.append(row(e));
        }
        sb.append(String.format(Locale.ROOT, "%n%-28s %18s %14s%n", "derived", "value", "uncertainty"));
        for (Estimate e : r.derived()) {
            sb.append(row(e));
        }
        sb.append(String.format(Locale.ROOT, "%nn = %d, chi2 = %.2f, reduced chi2 = %.3f, rms = %.1f ppm, BIC = %.2f, "
                + "%d iterations; times in %s%n", r.n(), r.chi2(), r.reducedChi2(), r.rms() * 1e6, r.bic(),
                r.iterations(), scale.label()));
        for (String n : r.notes()) {
            sb.append("note: ").append(n).append('\n');
        }
        return sb.toString();
    }

    private static String row(Estimate e) {
        String name = e.band() == null ? e.name() : e.name() + " [" + e.band() + "]";
        String unc = !e.free() ? "fixed" : e.isLimit() ? String.format(Locale.ROOT, "%s (%s %s at 95%%)",
                format(e.uncertainty()), e.limit().side().equals("lower") ? ">" : "<", format(e.limit().value95()))
                : format(e.uncertainty());
        return String.format(Locale.ROOT, "%-28s %18s %14s%n", name, format(e.value()), unc);
    }

    private static String format(double v) {
        double a = Math.abs(v);
        if (a >= 1e5) {
            return String.format(Locale.ROOT, "%.6f", v);
        }
        return String.format(Locale.ROOT, "%.7g", v);
    }

}
