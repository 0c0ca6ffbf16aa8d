package org.twinlight.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;
import java.util.concurrent.Callable;
import java.util.function.DoubleUnaryOperator;
import org.twinlight.BadInputException;
import org.twinlight.WorkFailedException;
import org.twinlight.photometry.LightCurve;
import org.twinlight.report.EphemerisJson;
import org.twinlight.report.InputDigest;
import org.twinlight.report.MinimaCsv;
import org.twinlight.report.MinimaSubmissionTable;
import org.twinlight.report.OcPlot;
import org.twinlight.report.ResultSet;
import org.twinlight.time.SkyDirection;
import org.twinlight.time.TimeConverter;
import org.twinlight.time.TimeScale;
import org.twinlight.timing.Ephemeris;
import org.twinlight.timing.minima.EphemerisFit;
import org.twinlight.timing.minima.EphemerisParameter;
import org.twinlight.timing.minima.MinimumFinder;
import org.twinlight.timing.minima.MinimumMethod;
import org.twinlight.timing.minima.MinimumSearchResult;
import org.twinlight.timing.minima.MinimumSettings;
import org.twinlight.timing.minima.MinimumSkip;
import org.twinlight.timing.minima.MinimumTime;
import org.twinlight.timing.minima.OcAnalysis;
import org.twinlight.timing.minima.OcPoint;
import org.twinlight.timing.minima.OcResult;
import org.twinlight.timing.minima.OcSeriesDifference;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/**
 * {@code minima FILE --period P --epoch T0 --out DIR [--band B] [--object NAME] [--ra R --dec D]
 * [--to-scale SCALE] [--allow-unknown-scale]}: times of minimum of every covered eclipse, O−C and
 * ephemeris fits; writes {@code minima.csv}, {@code ephemeris.json},
 * {@code o-c.png} and {@code minima-submission.txt}.
 */
@Command(name = "minima", mixinStandardHelpOptions = true, sortOptions = false,
        description = {
            "Times of minimum of every primary and secondary eclipse covered by the light curve, measured by "
                    + "Kwee & van Woerden (1956) and by a fit of a symmetric template, with errors widened for "
                    + "correlated noise (the factor beta of Winn et al. 2008); partly covered eclipses are timed from "
                    + "the template of the well-covered ones and flagged. O−C against the ephemeris; linear, "
                    + "quadratic and light-time (third body) ephemeris fits; a period change is claimed only on "
                    + "strong evidence (BIC lower by more than 6, Kass & Raftery 1995) and physical checks, "
                    + "otherwise the answer is: no significant period change.",
            "Writes minima.csv, ephemeris.json, o-c.png and minima-submission.txt to --out. "
                    + "Eclipses that cannot be timed are listed with the reason. Data without a declared time "
                    + "scale are refused unless --allow-unknown-scale."})
public final class MinimaCommand implements Callable<Integer> {

    @Parameters(index = "0", paramLabel = "FILE", description = "Photometry file (delimited text or FITS table).")
    Path file;

    @Option(names = "--period", required = true, paramLabel = "DAYS",
            description = "Orbital period of the ephemeris, days (> 0).")
    double periodDays;

    @Option(names = "--epoch", required = true, paramLabel = "T0",
            description = "Time of a primary minimum (cycle 0), days, in the time scale of the data (after --time-offset is added).")
    double epochDays;

    @Option(names = "--out", required = true, paramLabel = "DIR", description = "Directory for the results (created if missing).")
    Path out;

    @Mixin
    PhotometryOptions photometry;

    @Option(names = "--secondary-phase", paramLabel = "F", defaultValue = "0.5",
            description = "Phase of the secondary minimum after the primary, 0 < F < 1 (default: ${DEFAULT-VALUE}).")
    double secondaryPhase;

    @Option(names = "--window", paramLabel = "WIDTH",
            description = "Full width of the window cut around each eclipse: a phase (e.g. 0.06) or a duration "
                    + "with a unit: 0.15d, 3.5h, 200min (default: 1.4 × the eclipse duration seen in the "
                    + "folded light curve).")
    String window;

    @Option(names = "--method", paramLabel = "kvw|template", defaultValue = "template",
            description = "Which timings the ephemeris fits, the plot and the submission table use; minima.csv "
                    + "has both (default: ${DEFAULT-VALUE}).")
    String method;

    @Option(names = "--oc-reference", paramLabel = "given|fitted", defaultValue = "given",
            description = "Take the O−C against the given ephemeris or against the fitted linear one "
                    + "(default: ${DEFAULT-VALUE}).")
    String ocReference;

    @Option(names = "--min-points", paramLabel = "N", defaultValue = "12",
            description = "Fewest data points an eclipse window must hold (default: ${DEFAULT-VALUE}).")
    int minPoints;

    @Option(names = "--observer", paramLabel = "NAME", description = "Observer, written into the submission table.")
    String observer;

    @Option(names = "--band", paramLabel = "NAME", description = "Band: the one measured when the file holds "
            + "several, and the band written into the submission table (default: the file's band, if it names one).")
    String band;

    @Option(names = "--object", paramLabel = "NAME", description = "Name of the star, written into the submission table.")
    String object;

    @Option(names = "--ra", paramLabel = "RA",
            description = "Target right ascension, J2000: decimal degrees or hh:mm:ss.s (as for the time command). "
                    + "Needed by --to-scale from or to HJD/BJD; written into the submission table.")
    String ra;

    @Option(names = "--dec", paramLabel = "DEC",
            description = "Target declination, J2000: decimal degrees or ±dd:mm:ss.s.")
    String dec;

    @Option(names = "--to-scale", paramLabel = "SCALE",
            description = "Convert the times of minimum (and --epoch) from the data's time scale to this one, "
                    + "e.g. BJD_TDB, before the O−C and every output (needs the data's scale declared).")
    String toScale;

    @Option(names = "--allow-unknown-scale",
            description = "Write the results even though the time scale of the data is unknown (by default this is "
                    + "refused: times of minimum without a time scale cannot be compared with others).")
    boolean allowUnknownScale;

    @Spec
    CommandSpec spec;

    @Override
    public Integer call() {
        PrintWriter o = spec.commandLine().getOut();
        if (!(periodDays > 0) || !Double.isFinite(periodDays)) {
            throw new BadInputException("option --period: " + periodDays + " d is not allowed; expected a period > 0 days");
        }
        OptionChecks.periodDays("--period", periodDays);
        if (!Double.isFinite(epochDays)) {
            throw new BadInputException("option --epoch: " + epochDays + " is not a finite time in days");
        }
        MinimumMethod chosen = MinimumMethod.parse(method).orElseThrow(() -> new BadInputException(
                "option --method: expected 'kvw' or 'template', got '" + method + "'"));
        boolean fittedReference = switch (ocReference.trim().toLowerCase(Locale.ROOT)) {
            case "given" -> false;
            case "fitted" -> true;
            default -> throw new BadInputException(
                    "option --oc-reference: expected 'given' or 'fitted', got '" + ocReference + "'");
        };
        if (!(secondaryPhase > 0 && secondaryPhase < 1)) {
            throw new BadInputException("option --secondary-phase: " + secondaryPhase + " is not allowed; expected 0 < F < 1");
        }
        if (minPoints < 6) {
            throw new BadInputException("option --min-points: " + minPoints + " is not allowed; expected ≥ 6");
        }
        checkOneLine("--observer", observer);
        checkOneLine("--object", object);
        checkOneLine("--band", band);
        TimeScale target = toScale == null ? null : TimeScale.parse(toScale).filter(TimeScale::isKnown)
                .orElseThrow(() -> new BadInputException("option --to-scale: unknown time scale '" + toScale
                        + "'; expected one of " + TimeScale.acceptedLabels().replace(", unknown", "")));
        Ephemeris given = new Ephemeris(epochDays, periodDays);
        MinimumSettings settings = MinimumSettings.defaults().withSecondaryPhase(secondaryPhase).withMinPoints(minPoints);
        if (window != null) {
            settings = settings.withWindowDays(windowDays(window, periodDays));
        }

        OutputTargets.checkDirectory(out, List.of("minima.csv", "ephemeris.json", "o-c.png", "minima-submission.txt"),
                List.of(file));
        LightCurve lc = oneBand(photometry.readBands(file, o));
        EpochChecks.near(epochDays, periodDays, lc.timesDays(), file.toString(), "option --epoch");
        String bandName = band != null ? band : lc.band();
        TimeScale dataScale = lc.timeScale();
        TimeScale scale = target != null ? target : dataScale;
        if (target != null && !dataScale.isKnown()) {
            throw BadInputException.at(file, null, null, "the time scale of the times is not declared, so they cannot "
                    + "be converted to " + target.label() + "; declare it with --time-scale (e.g. HJD_UTC or JD_UTC)");
        }
        if (!scale.isKnown() && !allowUnknownScale) {
            throw BadInputException.at(file, null, null, "the time scale of the times is not declared, and times of "
                    + "minimum without one cannot be compared with others; declare it with --time-scale (e.g. "
                    + "HJD_UTC), convert with --to-scale BJD_TDB, or write the results anyway with "
                    + "--allow-unknown-scale");
        }
        boolean convert = target != null && !target.equals(dataScale);
        SkyDirection direction = null;
        if (convert && TimeConverter.needsDirection(dataScale, target)) {
            direction = SkyPositionOptions.parse(ra, dec, "option --to-scale: converting " + dataScale.label()
                    + " to " + target.label());
        } else if (ra != null || dec != null) {
            direction = SkyPositionOptions.parse(ra, dec, "writing the coordinates into the submission table");
        }
        MinimumSearchResult search = MinimumFinder.find(lc, given, settings);
        if (convert) {
            SkyDirection d = direction;
            DoubleUnaryOperator toTarget = t -> convertTime(t, dataScale, target, d);
            search = search.inTimeScale(toTarget, target);
            given = new Ephemeris(toTarget.applyAsDouble(epochDays), periodDays);
            o.printf(Locale.ROOT, "times of minimum and --epoch converted from %s to %s (epoch %.6f)%n",
                    dataScale.label(), target.label(), given.epochDays());
        }
        List<MinimumTime> timings = search.minima(chosen);
        if (timings.isEmpty()) {
            throw new WorkFailedException("no eclipse could be measured in " + file + " (" + search.skipped().size()
                    + " skipped: " + reasonSummary(search.skipped()) + "); check --period/--epoch, or widen --window");
        }
        OcResult oc = null;
        Ephemeris givenEphemeris = given;
        long cycles = timings.stream().mapToDouble(MinimumTime::cycle).distinct().count();
        if (cycles >= 2) {
            oc = OcAnalysis.analyse(timings, given, true, search.secondaryOffsetDays(),
                    search.secondaryOffsetErrorDays());
            if (fittedReference) {
                oc = OcAnalysis.analyse(timings, oc.linear().linearPart(), true, search.secondaryOffsetDays(),
                    search.secondaryOffsetErrorDays());
            }
        }
        Ephemeris reference = oc != null ? oc.reference() : given;
        List<OcPoint> points = oc != null ? oc.points() : timings.stream()
                .map(m -> new OcPoint(m.cycle(), m.type(), m.timeDays(), m.errorDays(),
                        m.timeDays() - givenEphemeris.timeOf(m.cycle()), m.partial()))
                .toList();

        String version = VersionInfo.version();
        String source = file.getFileName().toString();
        try (ResultSet set = ResultSet.open(out, "minima")) {
            MinimaCsv.write(set.file("minima.csv"), search.minima(), scale, source, given);
            EphemerisJson.write(set.file("ephemeris.json"), new EphemerisJson.Content(given, oc, search, chosen,
                    secondaryPhase, source, InputDigest.sha256(file), version), lc.notes());
            OcPlot.write(set.file("o-c.png"), points, oc, String.format(Locale.ROOT, "T0 = %.6f, P = %.8f d",
                    reference.epochDays(), reference.periodDays()), scale, chosen.label(), search.secondaryPhase(),
                    reference.periodDays());
            MinimaSubmissionTable.write(set.file("minima-submission.txt"), new MinimaSubmissionTable.Content(timings,
                    scale, convert ? dataScale : null, source, reference, object, direction, observer, bandName,
                    version));
            set.commit();
        }

        printSummary(o, lc, scale, search, chosen, oc);
        o.println("caution: " + EphemerisJson.CAUTION);
        o.flush();
        return 0;
    }

    /** The light curve of the band named by --band, or the only one; several without --band is bad input. */
    private LightCurve oneBand(Map<String, LightCurve> bands) {
        if (bands.size() == 1 && band == null) {
            return bands.values().iterator().next();
        }
        if (band != null) {
            LightCurve chosen = bands.get(band);
            if (chosen != null) {
                return chosen;
            }
            if (bands.size() == 1) {
                // A file without a band column: --band only labels the table.
                LightCurve only = bands.values().iterator().next();
                if (only.band() == null || only.band().isEmpty()) {
                    return only;
                }
            }
            throw BadInputException.at(file, null, photometry.bandColumn, "no band '" + band
                    + "' in the file; it holds " + String.join(", ", bands.keySet()));
        }
        throw BadInputException.at(file, null, photometry.bandColumn, "the file holds " + bands.size() + " bands ("
                + String.join(", ", bands.keySet()) + "); choose one with --band, times of minimum are measured "
                + "band by band");
    }

    /** A converted time; a time outside the converter's range is bad input naming the option. */
    private static double convertTime(double time, TimeScale from, TimeScale to, SkyDirection direction) {
        try {
            return TimeConverter.convert(time, from, to, direction);
        } catch (BadInputException e) {
            throw new BadInputException("option --to-scale: " + String.format(Locale.ROOT, "%.6f", time) + ": "
                    + e.getMessage());
        }
    }

    /** Text that goes into an output file must stay on one line: no control characters. */
    static void checkOneLine(String option, String text) {
        if (text == null) {
            return;
        }
        for (int i = 0; i < text.length(); i++) {
            char c = text.charAt(i);
            if (Character.isISOControl(c) || c == '\u2028' || c == '\u2029') {
                throw new BadInputException(String.format(Locale.ROOT, "option %s: the text contains a control "
                        + "character (U+%04X) at position %d; give it on one line, without line breaks or tabs",
                        option, (int) c, i + 1));
            }
        }
    }

    /** A phase (plain number below 1) or a duration with a unit d, h or min, as days. */
    static double windowDays(String text, double periodDays) {
        String s = text.trim().toLowerCase(Locale.ROOT);
        double factor;
        String number;
        if (s.endsWith("min")) {
            factor = 1 / 1440.0;
            number = s.substring(0, s.length() - 3);
        } else if (s.endsWith("h")) {
            factor = 1 / 24.0;
            number = s.substring(0, s.length() - 1);
        } else if (s.endsWith("d")) {
            factor = 1;
            number = s.substring(0, s.length() - 1);
        } else {
            factor = periodDays;
            number = s;
        }
        double v;
        try {
            v = Double.parseDouble(number.trim());
        } catch (NumberFormatException e) {
            throw new BadInputException("option --window: '" + text + "' is not a phase (e.g. 0.06) or a duration "
                    + "(e.g. 0.15d, 3.5h, 200min)");
        }
        if (!(v > 0) || !Double.isFinite(v) || (factor == periodDays && v >= 0.5)) {
            throw new BadInputException("option --window: '" + text + "' is not allowed; expected a phase in (0, 0.5) "
                    + "or a positive duration with a unit d, h or min");
        }
        return v * factor;
    }

    private static String reasonSummary(List<MinimumSkip> skipped) {
        Map<String, Integer> byReason = new TreeMap<>();
        for (MinimumSkip s : skipped) {
            String r = s.reason();
            int colon = r.indexOf(':');
            byReason.merge(colon > 0 ? r.substring(0, colon) : r, 1, Integer::sum);
        }
        List<String> parts = new ArrayList<>();
        byReason.forEach((r, n) -> parts.add(n + " × " + r));
        return String.join(", ", parts);
    }

    private void printSummary(PrintWriter o, LightCurve lc, TimeScale timeScale, MinimumSearchResult search,
            MinimumMethod chosen, OcResult oc) {
        String scale = timeScale.label();
        o.printf(Locale.ROOT, "%s: %d points, time scale %s%n", lc.source(), lc.size(), lc.timeScale().label());
        o.printf(Locale.ROOT, "eclipse windows: primary %.1f min, secondary %.1f min%n",
                search.primaryWindowDays() * 1440, search.secondaryWindowDays() * 1440);
        o.printf(Locale.ROOT, "%-9s %-9s %-17s %-10s %-10s %-10s %-7s %s%n", "cycle", "type", "time (" + scale + ")",
                "σ tpl (s)", "σ kvw (s)", "kvw−tpl(s)", "points", "β");
        List<MinimumTime> tpl = search.minima(MinimumMethod.TEMPLATE);
        List<MinimumTime> kvw = search.minima(MinimumMethod.KVW);
        for (MinimumTime t : search.minima(chosen)) {
            MinimumTime a = find(tpl, t);
            MinimumTime b = find(kvw, t);
            o.printf(Locale.ROOT, "%-9s %-9s %-17.6f %-10s %-10s %-10s %-7d %s%n", MinimaCsv.cycleText(t.cycle()),
                    t.type().label(), t.timeDays(), seconds(a == null ? Double.NaN : a.errorDays()),
                    seconds(b == null ? Double.NaN : b.errorDays()),
                    seconds(a == null || b == null ? Double.NaN : b.timeDays() - a.timeDays()), t.nPoints(),
                    (Double.isFinite(t.beta()) ? String.format(Locale.ROOT, "%.2f", t.beta()) : "-")
                            + (t.partial() ? "  partly covered: time from the template" : ""));
        }
        search.notes().forEach(n -> o.println("note: " + n));
        if (search.secondaryDeeperThanPrimary()) {
            o.printf(Locale.ROOT, "warning: the eclipses at phase %.3f (depth %.3f) are deeper than those at phase 0 "
                    + "(depth %.3f): the epoch may be a secondary minimum; add %.6f d to --epoch to count the deeper "
                    + "eclipses as primary%n", secondaryPhase, search.secondaryDepth(), search.primaryDepth(),
                    secondaryPhase * periodDays);
        }
        if (!search.skipped().isEmpty()) {
            o.printf("skipped %d eclipse(s):%n", search.skipped().size());
            for (MinimumSkip s : search.skipped()) {
                o.printf(Locale.ROOT, "  cycle %-8s %-9s near %.5f (%d points): %s%n", MinimaCsv.cycleText(s.cycle()),
                        s.type().label(), s.predictedTimeDays(), s.nPoints(), s.reason());
            }
        }
        if (oc == null) {
            o.println("only one cycle measured: no ephemeris fitted");
            return;
        }
        EphemerisFit lin = oc.linear();
        EphemerisParameter e0 = lin.parameter("epoch").orElseThrow();
        EphemerisParameter p = lin.parameter("period").orElseThrow();
        o.printf(Locale.ROOT, "linear ephemeris (%s timings): T0 = %.6f ± %.6f, P = %.9f ± %.9f d, %s%n",
                chosen.label(), e0.value(), e0.uncertainty(), p.value(), p.uncertainty(),
                Double.isFinite(lin.reducedChi2()) ? String.format(Locale.ROOT, "χ²/ν = %.2f", lin.reducedChi2())
                        : "no degrees of freedom left (errors from the timings alone)");
        lin.parameter("secondaryOffset").ifPresent(s -> o.print(Double.isFinite(s.uncertainty())
                ? String.format(Locale.ROOT, "secondary displaced from phase 0.5 by %.2f ± %.2f min%n",
                        s.value() * 1440, s.uncertainty() * 1440)
                : String.format(Locale.ROOT, "secondary displacement from phase 0.5 fixed at %.2f min (not fitted)%n",
                        s.value() * 1440)));
        if (oc.quadratic() != null) {
            EphemerisParameter d = oc.quadratic().parameter("dPdE").orElseThrow();
            EphemerisParameter dt = oc.quadratic().parameter("dPdtSecondsPerYear").orElseThrow();
            o.printf(Locale.ROOT, "quadratic: dP/dE = %.3e ± %.3e d/cycle (dP/dt = %.3f ± %.3f s/yr)%n", d.value(),
                    d.uncertainty(), dt.value(), dt.uncertainty());
        }
        if (oc.lightTime() != null) {
            EphemerisFit lt = oc.lightTime();
            o.printf(Locale.ROOT, "light-time orbit%s: P3 = %.1f ± %.1f d, semi-amplitude %.2f min, e = %.2f%n",
                    oc.preferred() == lt.model() ? "" : " (not preferred)",
                    lt.parameter("lightTimePeriod").orElseThrow().value(),
                    lt.parameter("lightTimePeriod").orElseThrow().uncertainty(),
                    lt.parameter("semiAmplitude").orElseThrow().value() * 1440,
                    lt.parameter("eccentricity").orElseThrow().value());
        }
        StringBuilder bic = new StringBuilder("BIC:");
        for (EphemerisFit f : oc.fits()) {
            bic.append(String.format(Locale.ROOT, " %s %.1f", f.model().label(), f.bic()));
        }
        o.println(bic + " → preferred: " + oc.preferred().label() + (oc.periodChangeFound() ? ""
                : " (no significant period change)"));
        oc.modelNotes().forEach(n -> o.println("  " + n));
        OcSeriesDifference d = oc.primaryMinusSecondary();
        if (d != null) {
            o.printf(Locale.ROOT, "primary − secondary O−C: %.2f ± %.2f min, trend %.3e ± %.3e d/cycle%n",
                    d.meanDifferenceDays() * 1440, d.meanDifferenceErrorDays() * 1440, d.trendDaysPerCycle(),
                    d.trendErrorDaysPerCycle());
        }
    }

    /** The minimum of the same eclipse in {@code list}, or null. */
    private static MinimumTime find(List<MinimumTime> list, MinimumTime like) {
        return list.stream().filter(m -> m.cycle() == like.cycle() && m.type() == like.type()).findFirst()
                .orElse(null);
    }

    /** Days as seconds with one decimal, or "-" when unknown. */
    private static String seconds(double days) {
        return Double.isFinite(days) ? String.format(Locale.ROOT, "%.1f", days * 86400) : "-";
    }
}
