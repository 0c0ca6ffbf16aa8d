package org.twinlight.report;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.twinlight.dimensions.AstronomicalConstants;
import org.twinlight.dimensions.DimensionEstimate;
import org.twinlight.dimensions.DimensionsPropagation;
import org.twinlight.dimensions.Quantity;

/** Writes absolute dimensions: {@code dimensions.json} (the contract's form) and {@code dimensions.txt}. */
public final class DimensionsFiles {

    /** The caution every dimensions result carries. */
    public static final String CAUTION = "The dimensions inherit the assumptions of the light-curve and velocity "
            + "fits: two spherical stars, the chosen limb-darkening law, the stated third light, Keplerian "
            + "velocities free of line-profile distortion. Luminosities need effective temperatures from outside "
            + "this tool. Check them before publication.";

    private static final ObjectMapper JSON = new ObjectMapper();

    /**
     * What went into the dimensions, for the record.
     *
     * @param fitFile the fit.json
     * @param fitSha256 its digest
     * @param velocities where K1 and K2 came from ("velocities FILE", or "given")
     * @param velocitiesSha256 digest of the velocity file, null when K was given
     * @param teff2Source how Teff2 was obtained, null when there are no temperatures
     * @param timeScale the fit's time scale label
     * @param seed seed of the draws
     * @param elements the elements used: name → {value, uncertainty}
     * @param errorSource {@code "posteriorChain"} or {@code "covariance"}: where the light-curve
     *     elements' draws came from
     * @param errorMethod how the errors were propagated, in words
     */
    public record Inputs(String fitFile, String fitSha256, String velocities, String velocitiesSha256,
            String teff2Source, String timeScale, long seed, Map<String, double[]> elements, String errorSource,
            String errorMethod) {
    }

    private DimensionsFiles() {
    }

    /** The {@code dimensions.json} document. */
    public static ObjectNode json(DimensionsPropagation.Result r, Inputs in, List<String> warnings, List<String> notes,
            String softwareVersion) {
        ObjectNode root = JSON.createObjectNode();
        ObjectNode star1 = root.putObject("star1");
        ObjectNode star2 = root.putObject("star2");
        ObjectNode system = root.putObject("system");
        ObjectNode units = root.putObject("units");
        for (Quantity q : Quantity.values()) {
            DimensionEstimate e = r.estimates().get(q);
            if (e == null) {
                continue;
            }
            ObjectNode target = q.star() == 1 ? star1 : q.star() == 2 ? star2 : system;
            putEstimate(target, q.key(), e);
            units.put(q.key(), q.unit());
        }
        String[][] orbit = {{"period", "d"}, {"eccentricity", ""}, {"omega", "deg"}, {"inclination", "deg"},
            {"k1", "km/s"}, {"k2", "km/s"}, {"radius1", "R1/a"}, {"radius2", "R2/a"}};
        ObjectNode used = root.putObject("elements");
        for (String[] o : orbit) {
            double[] v = in.elements().get(o[0]);
            if (v != null) {
                ObjectNode n = used.putObject(o[0]);
                n.put("value", v[0]);
                n.put("uncertainty", v[1]);
                units.put(o[0], o[1]);
            }
        }
        ObjectNode input = root.putObject("input");
        input.put("fit", in.fitFile());
        input.put("fitSha256", in.fitSha256());
        input.put("velocities", in.velocities());
        if (in.velocitiesSha256() != null) {
            input.put("velocitiesSha256", in.velocitiesSha256());
        }
        if (in.teff2Source() != null) {
            input.put("teff2", in.teff2Source());
        }
        root.put("timeScale", in.timeScale());
        ObjectNode method = root.putObject("method");
        method.put("errorSource", in.errorSource());
        method.put("uncertainties", "standard deviation of " + (r.draws() - r.rejected()) + " draws from "
                + in.errorMethod() + "; K1, K2 and the temperatures drawn normal with their errors; "
                + "lower68/upper68 are the 16th and 84th percentiles; uncertaintyFirstOrder (linear propagation of "
                + "fit.json's covariance) is given where it differs from the sampled one by more than 10%");
        method.put("draws", r.draws());
        method.put("rejectedDraws", r.rejected());
        method.put("seed", in.seed());
        ObjectNode constants = root.putObject("constants");
        constants.put("IAU_2015_NOMINAL_SOLAR_RADIUS_M", AstronomicalConstants.IAU_2015_NOMINAL_SOLAR_RADIUS_M);
        constants.put("IAU_2015_NOMINAL_SOLAR_MASS_PARAMETER_M3_S2",
                AstronomicalConstants.IAU_2015_NOMINAL_SOLAR_MASS_PARAMETER_M3_S2);
        constants.put("IAU_2015_NOMINAL_SOLAR_LUMINOSITY_W", AstronomicalConstants.IAU_2015_NOMINAL_SOLAR_LUMINOSITY_W);
        constants.put("IAU_2015_B2_ZERO_POINT_LUMINOSITY_W", AstronomicalConstants.IAU_2015_B2_ZERO_POINT_LUMINOSITY_W);
        constants.put("CODATA_2018_STEFAN_BOLTZMANN_W_M2_K4", AstronomicalConstants.CODATA_2018_STEFAN_BOLTZMANN_W_M2_K4);
        constants.put("CODATA_2018_GRAVITATIONAL_CONSTANT_M3_KG_S2",
                AstronomicalConstants.CODATA_2018_GRAVITATIONAL_CONSTANT_M3_KG_S2);
        ObjectNode sw = root.putObject("software");
        sw.put("name", "twinlight");
        sw.put("version", softwareVersion);
        ArrayNode w = root.putArray("warnings");
        warnings.forEach(w::add);
        ArrayNode n = root.putArray("notes");
        notes.forEach(n::add);
        r.notes().forEach(n::add);
        root.put("caution", CAUTION);
        return root;
    }

    /** {@code {"value", "uncertainty", "lower68", "upper68"[, "uncertaintyFirstOrder"]}} under {@code key}. */
    static void putEstimate(ObjectNode target, String key, DimensionEstimate e) {
        ObjectNode o = target.putObject(key);
        o.put("value", e.value());
        o.put("uncertainty", e.uncertainty());
        o.put("lower68", e.lower68());
        o.put("upper68", e.upper68());
        if (e.firstOrderDiffers()) {
            o.put("uncertaintyFirstOrder", e.firstOrderUncertainty());
        }
    }

    /** {@code dimensions.txt}: a table to paste into a paper, value ± error rounded to the error's 2 digits. */
    public static String table(DimensionsPropagation.Result r, List<String> warnings, String errorMethod) {
        StringBuilder sb = new StringBuilder();
        sb.append("# Absolute dimensions (nominal solar units, IAU 2015 Resolution B3; M_bol on the IAU 2015 B2 scale)\n");
        sb.append("# errors: standard deviation of ").append(r.draws() - r.rejected()).append(" draws from ")
                .append(errorMethod).append('\n');
        sb.append(String.format(Locale.ROOT, "%-46s %-22s %-22s%n", "quantity", "star 1", "star 2"));
        Quantity[][] rows = {{Quantity.MASS1, Quantity.MASS2}, {Quantity.RADIUS1, Quantity.RADIUS2},
            {Quantity.LOGG1, Quantity.LOGG2}, {Quantity.DENSITY1, Quantity.DENSITY2},
            {Quantity.SYNC_VELOCITY1, Quantity.SYNC_VELOCITY2}, {Quantity.TEFF1, Quantity.TEFF2},
            {Quantity.LOG_LUMINOSITY1, Quantity.LOG_LUMINOSITY2}, {Quantity.MBOL1, Quantity.MBOL2}};
        for (Quantity[] row : rows) {
            DimensionEstimate a = r.estimates().get(row[0]);
            DimensionEstimate b = r.estimates().get(row[1]);
            if (a == null && b == null) {
                continue;
            }
            sb.append(String.format(Locale.ROOT, "%-46s %-22s %-22s%n", row[0].label() + " (" + row[0].unit() + ")",
                    a == null ? "-" : rounded(a), b == null ? "-" : rounded(b)));
        }
        sb.append('\n');
        for (Quantity q : new Quantity[] {Quantity.SEMI_MAJOR_AXIS, Quantity.A_SIN_I, Quantity.MASS_RATIO,
            Quantity.TOTAL_MASS}) {
            DimensionEstimate e = r.estimates().get(q);
            sb.append(String.format(Locale.ROOT, "%-46s %s%n", q.label() + " (" + q.unit() + ")", rounded(e)));
        }
        for (String w : warnings) {
            sb.append("# warning: ").append(w).append('\n');
        }
        sb.append("# ").append(CAUTION).append('\n');
        return sb.toString();
    }

    /**
     * {@code value ± error} with the error rounded to two significant digits and the value to the
     * same decimal place (common practice, no source).
     */
    public static String rounded(DimensionEstimate e) {
        return rounded(e.value(), e.uncertainty());
    }

    static String rounded(double value, double error) {
        if (!(error > 0) || !Double.isFinite(error)) {
            return String.format(Locale.ROOT, "%.6g", value);
        }
        int exponent = (int) Math.floor(Math.log10(error));
        int decimals = Math.max(0, 1 - exponent);
        double step = Math.pow(10, exponent - 1);
        double err = Math.round(error / step) * step;
        double val = Math.round(value / step) * step;
        return String.format(Locale.ROOT, "%." + decimals + "f ± %." + decimals + "f", val, err);
    }
}
