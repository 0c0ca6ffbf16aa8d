package org.twinlight.report;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.UncheckedIOException;
import java.nio.file.Path;
import org.twinlight.timing.Ephemeris;
import org.twinlight.timing.minima.EphemerisFit;
import org.twinlight.timing.minima.EphemerisModel;
import org.twinlight.timing.minima.EphemerisParameter;
import org.twinlight.timing.minima.MinimumMethod;
import org.twinlight.timing.minima.MinimumSearchResult;
import org.twinlight.timing.minima.MinimumSkip;
import org.twinlight.timing.MinimumType;
import org.twinlight.timing.minima.OcAnalysis;
import org.twinlight.timing.minima.OcResult;
import org.twinlight.timing.minima.OcSeriesDifference;

/**
 * Writes {@code ephemeris.json}: the fitted linear ephemeris as {@code epoch} and {@code period}
 * ({@code {"value", "uncertainty"}}, days), the {@code timeScale}, the {@code quadratic} and
 * (when fitted) {@code lightTime} models, the {@code bic} of each model with the preferred one and
 * the {@code modelChoice} (the verdict, "no significant period change" unless a richer model
 * passed the strong-evidence and physical checks, with the notes),
 * the primary − secondary drift, and the {@code skipped} eclipses with their reasons. Numbers
 * that could not be estimated are written as {@code null}.
 */
public final class EphemerisJson {

    /**
     * What goes into the file.
     *
     * @param given the ephemeris given by the user
     * @param oc the O−C analysis, or null when too few minima were measured to fit
     * @param search the search for minima
     * @param method the method whose timings were fitted
     * @param secondaryPhase the secondary phase used
     * @param inputFile the photometry file name
     * @param inputSha256 its SHA-256, hex
     * @param softwareVersion twinlight's version
     */
    public record Content(Ephemeris given, OcResult oc, MinimumSearchResult search, MinimumMethod method,
            double secondaryPhase, String inputFile, String inputSha256, String softwareVersion) {
    }

    /** The caution every minima result carries. */
    public static final String CAUTION = "The times of minimum depend on the methods' assumptions: each eclipse is "
            + "taken as symmetric about its minimum (template fit, Kwee-van Woerden), the windows and the secondary "
            + "phase are as stated, and the errors come from the scatter of the light curve, scaled up for noise "
            + "correlated in time. Spots, a trend across an eclipse or an eccentric orbit can move a minimum away "
            + "from the conjunction. Check them (O-C plot, kvw-tpl differences, skipped eclipses) before "
            + "submission.";

    private static final ObjectMapper MAPPER = new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT);

    private EphemerisJson() {
    }

    public static void write(Path target, Content c) {
        write(target, c, java.util.List.of());
    }

    /** As above, with the reader's remarks on the input (kept as {@code input.notes}). */
    public static void write(Path target, Content c, java.util.List<String> inputNotes) {
        ObjectNode root = MAPPER.createObjectNode();
        if (c.oc() != null) {
            EphemerisFit linear = c.oc().linear();
            root.set("epoch", quantity(linear.parameter("epoch").orElseThrow()));
            root.set("period", quantity(linear.parameter("period").orElseThrow()));
            number(root, "epochPeriodCovariance", linear.epochPeriodCovarianceDays2());
        } else {
            root.set("epoch", quantity(c.given().epochDays(), Double.NaN));
            root.set("period", quantity(c.given().periodDays(), Double.NaN));
        }
        root.put("fitted", c.oc() != null);
        root.put("caution", CAUTION);
        root.put("timeScale", c.search().timeScale().label());
        root.put("method", c.method().label());
        // where secondaries were looked for, and where the linear ephemeris puts them (offset fitted)
        root.put("secondaryPhaseAssumed", c.secondaryPhase());
        root.put("secondaryPhaseUsed", c.search().secondaryPhase());
        ArrayNode searchNotes = root.putArray("searchNotes");
        c.search().notes().forEach(searchNotes::add);
        if (c.oc() != null) {
            c.oc().linear().parameter("secondaryOffset").ifPresent(off -> {
                double p = c.oc().linear().parameter("period").orElseThrow().value();
                ObjectNode m = root.putObject("secondaryPhaseMeasured");
                m.put("value", 0.5 + off.value() / p); // cycles of secondaries are n + 0.5
                number(m, "uncertainty", off.uncertainty() / p);
                // fixed at the folded light curve's value when the timings could not fit it
                m.put("fittedToTimings", !c.oc().secondaryOffsetFixed());
            });
        }
        ObjectNode given = root.putObject("givenEphemeris");
        given.put("epoch", c.given().epochDays());
        given.put("period", c.given().periodDays());
        ObjectNode counts = root.putObject("minima");
        counts.put("primary", c.search().minima(c.method()).stream().filter(m -> m.type() == MinimumType.PRIMARY).count());
        counts.put("secondary",
                c.search().minima(c.method()).stream().filter(m -> m.type() == MinimumType.SECONDARY).count());
        counts.put("skipped", c.search().skipped().size());
        ObjectNode window = root.putObject("windowDays");
        window.put("primary", c.search().primaryWindowDays());
        window.put("secondary", c.search().secondaryWindowDays());
        if (c.oc() != null) {
            OcResult oc = c.oc();
            ObjectNode ref = root.putObject("ocReference");
            ref.put("epoch", oc.reference().epochDays());
            ref.put("period", oc.reference().periodDays());
            root.set("linear", model(oc.linear()));
            if (oc.quadratic() != null) {
                root.set("quadratic", model(oc.quadratic()));
            } else {
                root.putNull("quadratic");
                root.put("quadraticNotFitted", "too few timings: a quadratic ephemeris needs more timings than "
                        + "its free parameters and minima from at least three cycles, found " + oc.points().size());
            }
            if (oc.lightTime() != null) {
                root.set("lightTime", model(oc.lightTime()));
            } else {
                root.putNull("lightTime");
                root.put("lightTimeNotFitted", "a light-time orbit is fitted from " + OcAnalysis.MIN_TIMINGS_FOR_LIGHT_TIME
                        + " timings on (or was not asked for); found " + oc.points().size());
            }
            ObjectNode bic = root.putObject("bic");
            for (EphemerisFit f : oc.fits()) {
                number(bic, f.model().label(), f.bic());
            }
            bic.put("preferred", oc.preferred().label());
            ObjectNode choice = root.putObject("modelChoice");
            choice.put("preferred", oc.preferred().label());
            choice.put("periodChange", oc.periodChangeFound());
            choice.put("verdict", oc.periodChangeFound()
                    ? (oc.preferred() == EphemerisModel.QUADRATIC ? "period change (quadratic ephemeris)"
                            : "light-time orbit of a third body")
                    : "no significant period change");
            choice.put("deltaBicThreshold", OcResult.strongEvidenceDeltaBic());
            choice.put("thresholdSource", "Kass & Raftery 1995, J. Am. Stat. Assoc. 90, 773: ΔBIC > 6 is strong evidence");
            ArrayNode notes = choice.putArray("notes");
            oc.modelNotes().forEach(notes::add);
            OcSeriesDifference d = oc.primaryMinusSecondary();
            if (d != null) {
                ObjectNode diff = root.putObject("primaryMinusSecondary");
                diff.put("meanCycle", d.meanCycle());
                diff.set("meanDifference", quantity(d.meanDifferenceDays(), d.meanDifferenceErrorDays()));
                diff.set("trendPerCycle", quantity(d.trendDaysPerCycle(), d.trendErrorDaysPerCycle()));
                diff.put("unit", "d, d/cycle");
                diff.put("primaryCount", d.primaryCount());
                diff.put("secondaryCount", d.secondaryCount());
            }
        }
        ArrayNode skipped = root.putArray("skipped");
        for (MinimumSkip s : c.search().skipped()) {
            ObjectNode o = skipped.addObject();
            number(o, "cycle", s.cycle());
            o.put("type", s.type().label());
            number(o, "predictedTime", s.predictedTimeDays());
            o.put("nPoints", s.nPoints());
            o.put("reason", s.reason());
        }
        ObjectNode input = root.putObject("input");
        input.put("file", c.inputFile());
        input.put("sha256", c.inputSha256());
        inputNotes.forEach(input.putArray("notes")::add);
        root.putObject("software").put("version", c.softwareVersion());
        try {
            AtomicFiles.writeString(target, MAPPER.writeValueAsString(root) + "\n");
        } catch (JsonProcessingException e) {
            throw new UncheckedIOException(e);
        }
    }

    private static ObjectNode model(EphemerisFit fit) {
        ObjectNode o = MAPPER.createObjectNode();
        for (EphemerisParameter p : fit.parameters()) {
            ObjectNode q = quantity(p.value(), p.uncertainty());
            q.put("unit", p.unit());
            o.set(p.name(), q);
        }
        number(o, "chi2", fit.chi2());
        number(o, "reducedChi2", fit.reducedChi2());
        o.put("n", fit.n());
        o.put("freeParameters", fit.freeParameters());
        number(o, "bic", fit.bic());
        number(o, "errorScale", fit.errorScale());
        return o;
    }

    private static ObjectNode quantity(EphemerisParameter p) {
        return quantity(p.value(), p.uncertainty());
    }

    private static ObjectNode quantity(double value, double uncertainty) {
        ObjectNode o = MAPPER.createObjectNode();
        number(o, "value", value);
        number(o, "uncertainty", uncertainty);
        return o;
    }

    /** Puts a number, or null when it is not finite (JSON has no NaN). */
    private static void number(ObjectNode o, String key, double v) {
        if (Double.isFinite(v)) {
            o.put(key, v);
        } else {
            o.putNull(key);
        }
    }
}
