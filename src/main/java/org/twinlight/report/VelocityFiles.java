package org.twinlight.report;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.util.List;
import java.util.Locale;
import org.twinlight.velocity.VelocityData;
import org.twinlight.velocity.VelocityEstimate;
import org.twinlight.velocity.VelocityFitResult;
import org.twinlight.velocity.VelocityFitSettings;

/** Writes the results of a velocity fit: {@code velocities.json} and the terminal summary. */
public final class VelocityFiles {

    /** The caution every velocity result carries. */
    public static final String CAUTION = "K1, K2 and gamma depend on the model's assumptions: a Keplerian orbit of "
            + "two point masses, velocities free of line-profile distortion (no Rossiter-McLaughlin effect during "
            + "eclipses, no proximity effects of close, distorted stars, which bias K), and the stated errors. "
            + "Check the residuals and these effects before publication.";

    private static final ObjectMapper JSON = new ObjectMapper();

    private VelocityFiles() {
    }

    /**
     * The {@code velocities.json} document.
     *
     * @param derived derived quantities (mass ratio, M sin³i, a sin i), each value and uncertainty
     */
    public static ObjectNode json(VelocityFitResult r, VelocityData data, VelocityFitSettings settings,
            String inputFile, String sha256, String modelFile, ObjectNode derived, List<String> warnings,
            String softwareVersion) {
        ObjectNode root = JSON.createObjectNode();
        ObjectNode params = root.putObject("parameters");
        for (VelocityEstimate e : r.estimates()) {
            ObjectNode o = params.putObject(e.name());
            o.put("value", e.value());
            putNumber(o, "uncertainty", e.uncertainty());
            o.put("free", e.free());
            o.put("unit", e.unit());
        }
        for (int n = 1; n <= 2; n++) {
            ObjectNode jitter = params.putObject("jitter" + n);
            jitter.put("value", r.best().jitterKms(n));
            jitter.putNull("uncertainty");
            jitter.put("free", settings.fitJitter());
            jitter.put("unit", "km/s");
        }
        root.set("derived", derived);
        ObjectNode stats = root.putObject("statistics");
        stats.put("n", r.n());
        stats.put("n1", data.star1().size());
        stats.put("n2", data.star2().size());
        stats.put("chi2", r.chi2());
        stats.put("degreesOfFreedom", r.degreesOfFreedom());
        stats.put("reducedChi2", r.reducedChi2());
        stats.put("rms1", r.rms1Kms());
        putNumber(stats, "rms2", r.rms2Kms());
        stats.put("iterations", r.iterations());
        stats.put("errorsEstimatedFromScatter", r.errorsEstimated());
        FitFiles.putCorrelation(root, r.freeNames(), r.correlation());
        ArrayNode inst = root.putArray("instruments");
        data.instruments().forEach(inst::add);
        root.put("timeScale", data.timeScale().label());
        ObjectNode input = root.putObject("input");
        input.put("file", inputFile);
        input.put("sha256", sha256);
        ObjectNode rejected = input.putObject("rejectedRows");
        data.rejected().forEach(rejected::put);
        root.putObject("model").put("file", modelFile);
        ObjectNode set = root.putObject("settings");
        ArrayNode free = set.putArray("free");
        r.freeNames().forEach(free::add);
        set.put("jitter", settings.fitJitter() ? "fit" : String.valueOf(settings.jitterKms()));
        set.put("method", "Levenberg-Marquardt least squares; uncertainties from the covariance scaled by the "
                + "reduced chi-square when it exceeds 1, never scaled down");
        ObjectNode sw = root.putObject("software");
        sw.put("name", "twinlight");
        sw.put("version", softwareVersion);
        ArrayNode notes = root.putArray("notes");
        r.notes().forEach(notes::add);
        data.notes().forEach(n -> notes.add(data.source() + ": " + n));
        ArrayNode warn = root.putArray("warnings");
        warnings.forEach(warn::add);
        root.put("caution", CAUTION);
        return root;
    }

    /** Puts a number, or null for NaN and infinities (JSON has neither). */
    static void putNumber(ObjectNode o, String key, double v) {
        if (Double.isFinite(v)) {
            o.put(key, v);
        } else {
            o.putNull(key);
        }
    }

    /** A plain-text table for the terminal. */
    public static String summary(VelocityFitResult r, VelocityData data) {
        StringBuilder sb = new StringBuilder();
        sb.append(String.format(Locale.ROOT, "%-22s %16s %14s%n", "parameter", "value", "uncertainty"));
        for (VelocityEstimate e : r.estimates()) {
            String unc = e.free() ? Double.isFinite(e.uncertainty()) ? String.format(Locale.ROOT, "%.5g", e.uncertainty())
                    : "-" : "fixed";
            sb.append(String.format(Locale.ROOT, "%-22s %16s %14s %s%n", e.name(),
                    Math.abs(e.value()) >= 1e5 ? String.format(Locale.ROOT, "%.6f", e.value())
                            : String.format(Locale.ROOT, "%.6g", e.value()), unc, e.unit()));
        }
        for (int n = 1; n <= 2; n++) {
            if (r.best().jitterKms(n) > 0) {
                sb.append(String.format(Locale.ROOT, "%-22s %16.4g %14s km/s%n", "jitter" + n, r.best().jitterKms(n),
                        "-"));
            }
        }
        sb.append(String.format(Locale.ROOT, "%nn = %d (star 1: %d, star 2: %d), chi2 = %.2f, reduced chi2 = %.3f, "
                + "rms = %.3g / %.3g km/s, %d iterations; times in %s%n", r.n(), data.star1().size(),
                data.star2().size(), r.chi2(), r.reducedChi2(), r.rms1Kms(), r.rms2Kms(), r.iterations(),
                data.timeScale().label()));
        r.notes().forEach(n -> sb.append("note: ").append(n).append('\n'));
        return sb.toString();
    }

    /**
     * The quantities that follow from K1, K2, e and P alone: q = K1/K2, M sin³i of each star and
     * a sin i, with errors propagated by sampling the fit's covariance (the same propagation as
     * the dimensions command; see {@link org.twinlight.dimensions.AbsoluteDimensions}).
     */
    public static ObjectNode derivedJson(VelocityFitResult r, List<String> warnings) {
        org.twinlight.velocity.VelocityParameters p = r.best();
        org.twinlight.dimensions.BinaryElements el = new org.twinlight.dimensions.BinaryElements(p.periodDays(),
                p.eccentricity(), 90.0, p.k1Kms(), p.k2Kms(), 0.1, 0.1, Double.NaN, Double.NaN, Double.NaN);
        List<String> names = org.twinlight.dimensions.BinaryElements.NAMES;
        String[] fitNames = {"period", "eccentricity", null, "k1", "k2"};
        double[][] cov = new double[names.size()][names.size()];
        for (int i = 0; i < fitNames.length; i++) {
            for (int j = 0; j < fitNames.length; j++) {
                if (fitNames[i] != null && fitNames[j] != null) {
                    cov[i][j] = covariance(r, fitNames[i], fitNames[j]);
                }
            }
        }
        org.twinlight.dimensions.DimensionsPropagation.Result d =
                org.twinlight.dimensions.DimensionsPropagation.propagate(el, cov, 10_000, 1);
        warnings.addAll(d.notes());
        ObjectNode out = JSON.createObjectNode();
        DimensionsFiles.putEstimate(out, "massRatio", d.estimates().get(org.twinlight.dimensions.Quantity.MASS_RATIO));
        DimensionsFiles.putEstimate(out, "massSin3i1", d.estimates().get(org.twinlight.dimensions.Quantity.MSIN3I1));
        DimensionsFiles.putEstimate(out, "massSin3i2", d.estimates().get(org.twinlight.dimensions.Quantity.MSIN3I2));
        DimensionsFiles.putEstimate(out, "aSinI", d.estimates().get(org.twinlight.dimensions.Quantity.A_SIN_I));
        ObjectNode units = out.putObject("units");
        units.put("massRatio", "M2/M1");
        units.put("massSin3i1", "nominal solar masses");
        units.put("massSin3i2", "nominal solar masses");
        units.put("aSinI", "nominal solar radii");
        return out;
    }

    /**
     * Covariance of two of the fit's reported parameters: from the fit's matrix where both were
     * fitted directly; e (fitted as e cos ω, e sin ω) enters with its own variance only.
     */
    static double covariance(VelocityFitResult r, String a, String b) {
        if (a.equals("eccentricity") || b.equals("eccentricity")) {
            double s = r.estimate("eccentricity").uncertainty();
            return a.equals(b) && Double.isFinite(s) ? s * s : 0.0;
        }
        return r.covariance(a, b);
    }
}
