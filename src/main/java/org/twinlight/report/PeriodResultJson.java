package org.twinlight.report;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import org.twinlight.timing.period.EclipseEvent;
import org.twinlight.timing.period.OddEvenComparison;
import org.twinlight.timing.period.PeriodCandidate;
import org.twinlight.timing.period.PeriodDecision;
import org.twinlight.timing.period.PeriodSearchResult;

/**
 * Writes {@code period.json}: the contract's {@code period}, {@code method}, {@code secondaryPhase} and
 * {@code candidates}, plus the epoch, the time scale, the eclipses, the period decision (confident, ambiguous
 * or not significant) with its evidence and what would settle it, the caution that goes with the period (null
 * when there is none), the comparison of alternate eclipses, the search settings, the input file and the software version.
 * Numbers that do not exist (NaN) are written as null.
 */
public final class PeriodResultJson {
    private static final ObjectMapper MAPPER = new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT);

    private PeriodResultJson() {
    }

    /**
     * @param target the file to write (atomically)
     * @param r the search result
     * @param timeScale label of the data's time scale ("unknown" when undeclared)
     * @param inputFile name of the input file
     * @param sha256 SHA-256 of the input file, hex
     * @param rejectedRows rows of the input that were read but not used
     * @param version software version
     */
    public static void write(Path target, PeriodSearchResult r, String timeScale, String inputFile, String sha256,
            int rejectedRows, String version) {
        write(target, r, timeScale, inputFile, sha256, rejectedRows, version, List.of());
    }

    /** As above, with the reader's remarks on the input (kept as {@code input.notes}). */
    public static void write(Path target, PeriodSearchResult r, String timeScale, String inputFile, String sha256,
            int rejectedRows, String version, List<String> inputNotes) {
        AtomicFiles.writeString(target, toJson(r, timeScale, inputFile, sha256, rejectedRows, version, inputNotes));
    }

    static String toJson(PeriodSearchResult r, String timeScale, String inputFile, String sha256, int rejectedRows,
            String version) {
        return toJson(r, timeScale, inputFile, sha256, rejectedRows, version, List.of());
    }

    static String toJson(PeriodSearchResult r, String timeScale, String inputFile, String sha256, int rejectedRows,
            String version, List<String> inputNotes) {
        ObjectNode root = MAPPER.createObjectNode();
        valueWithError(root.putObject("period"), r.periodDays(), r.periodUncertaintyDays());
        valueWithError(root.putObject("epoch"), r.epochDays(), r.epochUncertaintyDays());
        root.put("timeScale", timeScale);
        root.put("method", "BLS");
        root.put("methodReference", "box least squares, Kovács, Zucker & Mazeh 2002, A&A 391, 369");
        root.put("uncertaintyMethod", r.uncertaintyMethod());
        text(root, "caution", r.periodCaution().orElse(null));
        root.put("significant", r.significant());
        number(root, "sde", r.sde());
        root.put("significance", r.significanceNote());
        decision(root.putObject("decision"), r.decision());
        if (r.secondary().isPresent()) {
            EclipseEvent sec = r.secondary().get();
            number(root, "secondaryPhase", sec.phase());
            double ratio = sec.duration() / r.primary().duration();
            double ratioError = Math.abs(ratio) * Math.hypot(sec.durationError() / sec.duration(),
                    r.primary().durationError() / r.primary().duration());
            valueWithError(root.putObject("widthRatio"), ratio, ratioError);
        } else {
            root.putNull("secondaryPhase");
            root.putNull("widthRatio");
        }
        eclipse(root, "primary", r.primary());
        eclipse(root, "secondary", r.secondary().orElse(null));
        if (r.oddEven().isPresent()) {
            oddEven(root.putObject("alternateEclipses"), r.oddEven().get());
        } else {
            root.putNull("alternateEclipses");
        }
        ArrayNode cands = root.putArray("candidates");
        for (PeriodCandidate c : r.candidates()) {
            ObjectNode o = cands.addObject();
            number(o, "period", c.periodDays());
            number(o, "power", c.blsPower());
            o.put("method", "BLS");
            number(o, "periodUncertainty", c.refined().periodErrorDays());
            o.put("relation", c.relation());
            number(o, "sde", c.sde());
            number(o, "pdmTheta", c.pdmTheta());
            number(o, "timingReducedChi2", c.refined().timingReducedChiSquare().orElse(Double.NaN));
            o.put("timings", c.refined().timings());
            text(o, "caution", c.refined().caution().orElse(null));
            o.put("coherent", c.consistent());
            o.put("assessment", c.assessment());
        }
        PeriodSearchResult.SearchSummary s = r.search();
        ObjectNode search = root.putObject("search");
        search.put("points", s.points());
        number(search, "baseline", s.baselineDays());
        number(search, "cadence", s.cadenceDays());
        number(search, "resolution", s.resolutionDays());
        number(search, "minPeriod", s.minPeriodDays());
        number(search, "maxPeriod", s.maxPeriodDays());
        search.put("frequencies", s.frequencies());
        ArrayNode d = search.putArray("durationFractions");
        s.durationFractions().forEach(d::add);
        search.put("weighted", s.weighted());
        ObjectNode units = root.putObject("units");
        units.put("period", "d");
        units.put("epoch", "d, in timeScale");
        units.put("depth", "relative flux (median = 1)");
        units.put("duration", "equivalent duration, fraction of the period");
        units.put("power", "BLS signal residue SR");
        units.put("alternatives", "d");
        ObjectNode input = root.putObject("input");
        input.put("file", inputFile);
        input.put("sha256", sha256);
        input.put("rejectedRows", rejectedRows);
        inputNotes.forEach(input.putArray("notes")::add);
        root.putObject("software").put("version", version);
        try {
            return MAPPER.writeValueAsString(root) + System.lineSeparator();
        } catch (JsonProcessingException e) {
            throw new IllegalStateException("cannot serialise period result", e);
        }
    }

    private static void decision(ObjectNode o, PeriodDecision d) {
        o.put("status", d.status().label());
        number(o, "period", d.periodDays());
        ArrayNode alt = o.putArray("alternatives");
        d.alternativesDays().forEach(alt::add);
        ArrayNode ev = o.putArray("evidence");
        d.evidence().forEach(ev::add);
        ArrayNode settle = o.putArray("toSettle");
        d.toSettle().forEach(settle::add);
        ArrayNode notes = o.putArray("notes");
        d.notes().forEach(notes::add);
        o.put("rule", "confident only when every coherent candidate is a multiple of the period, the data cover"
                + " eclipses on consecutive cycles, and a second eclipse, a difference of alternate eclipses or a"
                + " flat-bottomed eclipse decides between P and 2P; otherwise ambiguous");
    }

    private static void oddEven(ObjectNode o, OddEvenComparison c) {
        number(o, "comparedAtPeriod", 2 * c.shortPeriodDays());
        o.put("covered", c.covered());
        o.put("evenGroups", c.evenGroups());
        o.put("oddGroups", c.oddGroups());
        number(o, "depthDifferenceSigma", c.depthDifferenceSigma());
        number(o, "widthDifferenceSigma", c.widthDifferenceSigma());
        number(o, "timeDifferenceSigma", c.shiftDifferenceSigma());
        number(o, "chi2", c.chiSquare());
        number(o, "chi2Threshold", OddEvenComparison.CHI2_THRESHOLD);
        o.put("differ", c.differ());
        o.put("explanation", c.describe());
    }

    private static void eclipse(ObjectNode parent, String name, EclipseEvent e) {
        if (e == null) {
            parent.putNull(name);
            return;
        }
        ObjectNode o = parent.putObject(name);
        number(o, "phase", e.phase());
        valueWithError(o.putObject("depth"), e.depth(), e.depthError());
        valueWithError(o.putObject("duration"), e.duration(), e.durationError());
        number(o, "signalToNoise", e.signalToNoise());
    }

    private static void valueWithError(ObjectNode o, double value, double error) {
        number(o, "value", value);
        number(o, "uncertainty", error);
    }

    private static void text(ObjectNode o, String key, String v) {
        if (v == null) {
            o.putNull(key);
        } else {
            o.put(key, v);
        }
    }

    private static void number(ObjectNode o, String key, double v) {
        if (Double.isFinite(v)) {
            o.put(key, v);
        } else {
            o.putNull(key);
        }
    }
}
