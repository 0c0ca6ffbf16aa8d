package org.twinlight.cli;

import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.time.LocalDate;
import java.time.format.DateTimeParseException;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;
import org.twinlight.BadInputException;
import org.twinlight.planning.DateRange;
import org.twinlight.planning.EclipseExtent;
import org.twinlight.planning.ObservingLimits;
import org.twinlight.planning.Plan;
import org.twinlight.planning.Planner;
import org.twinlight.planning.PlanningTarget;
import org.twinlight.planning.PredictionEphemeris;
import org.twinlight.report.FitFiles;
import org.twinlight.report.PlanChart;
import org.twinlight.report.PlanTable;
import org.twinlight.report.PlanningInputs;
import org.twinlight.report.PredictionsCalendar;
import org.twinlight.report.PredictionsCsv;
import org.twinlight.sky.Site;
import org.twinlight.time.SkyDirection;
import org.twinlight.time.TimeScale;
import org.twinlight.timing.Ephemeris;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/**
 * {@code predict}: the minima to come in a date range, seen from a site; writes
 * {@code predictions.csv}, {@code predictions.ics} and {@code predictions.png}.
 */
@Command(name = "predict", mixinStandardHelpOptions = true, sortOptions = false,
        description = {
            "Every primary and secondary minimum in a date range, seen from a site: time in UTC (and in the"
                    + " ephemeris's scale) with its 1σ from the ephemeris covariance, first and last contact, the"
                    + " target's altitude and azimuth, the Sun, the Moon, and a verdict (whole, partial,"
                    + " not-observable) with the reason.",
            "Writes predictions.csv, predictions.ics (iCalendar) and predictions.png to --out and prints a short"
                    + " table. Several targets: --targets LIST.csv. Methods and accuracy: docs/planning.md."})
public final class PredictCommand implements Callable<Integer> {

    /** The files written. */
    static final List<String> OUTPUTS = List.of("predictions.csv", "predictions.ics", "predictions.png");

    @Option(names = "--ephemeris", paramLabel = "FILE", description = "ephemeris.json written by minima.")
    Path ephemerisFile;

    @Option(names = "--fit", paramLabel = "FILE", description = "fit.json written by fit: its model gives the "
            + "eclipses' first and last contacts (and the ephemeris when --ephemeris and --period are not given).")
    Path fitFile;

    @Option(names = "--period", paramLabel = "DAYS", description = "Period, days (with --epoch and --time-scale).")
    Double periodDays;

    @Option(names = "--epoch", paramLabel = "T0", description = "Time of a primary minimum, in --time-scale.")
    Double epochDays;

    @Option(names = "--time-scale", paramLabel = "SCALE",
            description = "Scale of --epoch: e.g. BJD_TDB, HJD_UTC, JD_UTC, MJD_UTC.")
    String timeScale;

    @Option(names = "--period-error", paramLabel = "DAYS", defaultValue = "0", description = "1σ of --period, days (default: ${DEFAULT-VALUE}).")
    double periodErrorDays;

    @Option(names = "--epoch-error", paramLabel = "DAYS", defaultValue = "0", description = "1σ of --epoch, days (default: ${DEFAULT-VALUE}).")
    double epochErrorDays;

    @Option(names = "--ra", paramLabel = "RA", description = "Right ascension, J2000: degrees or hh:mm:ss.s.")
    String ra;

    @Option(names = "--dec", paramLabel = "DEC", description = "Declination, J2000: degrees or ±dd:mm:ss.")
    String dec;

    @Option(names = "--name", paramLabel = "NAME", defaultValue = "target",
            description = "Name of the target in the outputs (default: ${DEFAULT-VALUE}).")
    String name;

    @Option(names = "--targets", paramLabel = "LIST.csv", description = "Several targets: CSV with name, ra, dec and "
            + "either ephemeris (a file) or period, epoch, time_scale [, period_error, epoch_error]; optional "
            + "duration_hours or fit. Replaces --ephemeris/--fit/--period and --ra/--dec.")
    Path targetList;

    @Option(names = "--site", required = true, paramLabel = "LAT,LON[,H]|FILE",
            description = "Site: latitude, longitude (degrees, east positive), height (m); or a file with that"
                    + " line, or with lines latitude: .., longitude: .., height: ..")
    String site;

    @Option(names = "--start", required = true, paramLabel = "YYYY-MM-DD", description = "First date, UTC (from 0h).")
    String start;

    @Option(names = "--end", required = true, paramLabel = "YYYY-MM-DD",
            description = "End date, UTC: the range stops at 0h of this date.")
    String end;

    @Option(names = "--duration", paramLabel = "TIME", converter = DurationConverter.class,
            description = "Eclipse length, first to last contact, when no --fit model gives it: e.g. 3.5h, 200min, 0.15d.")
    Double durationDays;

    @Option(names = "--min-altitude", paramLabel = "DEG", defaultValue = "30",
            description = "Lowest target altitude, degrees (default: ${DEFAULT-VALUE}).")
    double minAltitudeDeg;

    @Option(names = "--sun-below", paramLabel = "DEG", defaultValue = "-12",
            description = "Highest Sun altitude, degrees (default: ${DEFAULT-VALUE}; −6 civil, −18 astronomical).")
    double sunBelowDeg;

    @Option(names = "--observable-only", description = "Keep only minima that are whole or partial.")
    boolean observableOnly;

    @Option(names = "--force", description = "Accept a range of more than ten years.")
    boolean force;

    @Option(names = "--out", required = true, paramLabel = "DIR", description = "Folder for the results.")
    Path out;

    @Spec
    CommandSpec spec;

    /** Reads 3.5h, 200min, 0.15d (and 2h30m) as days. */
    static final class DurationConverter implements CommandLine.ITypeConverter<Double> {
        @Override
        public Double convert(String text) {
            String t = text.trim().toLowerCase(Locale.ROOT);
            java.util.regex.Matcher m = java.util.regex.Pattern
                    .compile("(\\d+(?:\\.\\d*)?)\\s*(d|h|min|m)(?:\\s*(\\d+(?:\\.\\d*)?)\\s*(?:min|m))?").matcher(t);
            if (!m.matches()) {
                throw new CommandLine.TypeConversionException("'" + text + "' is not a duration: give a number with a"
                        + " unit, e.g. 3.5h, 200min, 0.15d or 2h30m");
            }
            double v = Double.parseDouble(m.group(1));
            double days = switch (m.group(2)) {
                case "d" -> v;
                case "h" -> v / 24;
                default -> v / 1440;
            };
            if (m.group(3) != null) {
                days += Double.parseDouble(m.group(3)) / 1440;
            }
            return days;
        }
    }

    @Override
    public Integer call() {
        Site where = readSite();
        DateRange range = DateRange.of(date("--start", start), date("--end", end), force);
        ObservingLimits limits = new ObservingLimits(minAltitudeDeg, sunBelowDeg);
        List<Path> inputs = new ArrayList<>();
        inputs.add(ephemerisFile);
        inputs.add(fitFile);
        inputs.add(targetList);
        OutputTargets.checkDirectory(out, OUTPUTS, inputs);
        List<String> notes = new ArrayList<>();
        if (targetList != null && (ephemerisFile != null || fitFile != null || periodDays != null || epochDays != null
                || timeScale != null || ra != null || dec != null)) {
            throw new BadInputException("option --targets: the target list gives each target's position and"
                    + " ephemeris; leave out --ephemeris, --fit, --period, --epoch, --time-scale, --ra and --dec");
        }
        List<PlanningTarget> targets = targetList != null ? PlanningInputs.readTargetList(targetList, defaultExtent(),
                notes) : List.of(singleTarget(notes));
        Plan plan = Planner.plan(targets, where, range, limits);
        notes.addAll(plan.notes());
        if (targets.stream().anyMatch(t -> t.extent().source().startsWith("fitted model"))) {
            notes.add("first and last contacts come from the fitted model: " + FitFiles.CAUTION);
        }
        if (observableOnly) {
            plan = plan.observableOnly();
        }
        Path csv = out.resolve("predictions.csv");
        Path ics = out.resolve("predictions.ics");
        Path png = out.resolve("predictions.png");
        PredictionsCsv.write(csv, plan);
        PredictionsCalendar.write(ics, plan, Instant.now(), VersionInfo.version());
        PlanChart.write(png, plan);

        PrintWriter w = spec.commandLine().getOut();
        long observable = plan.predictions().stream().filter(p -> p.verdict().observable()).count();
        w.printf(Locale.ROOT, "%d minima of %d target(s) from %s to %s (0h UTC), site %.4f°, %.4f°, %.0f m; %d"
                + " observable (target ≥ %.0f°, Sun ≤ %+.0f°)%n%n", plan.predictions().size(), targets.size(),
                range.start(), range.end(), where.latitudeDeg(), where.longitudeDeg(), where.heightM(), observable,
                limits.minAltitudeDeg(), limits.sunBelowDeg());
        w.print(PlanTable.format(plan, 40));
        for (String n : notes) {
            w.println("note: " + n);
        }
        w.printf("wrote %s, %s, %s%n", csv, ics, png);
        w.flush();
        return 0;
    }

    private Site readSite() {
        return SkyPositionOptions.site(site);
    }

    private static LocalDate date(String option, String text) {
        try {
            return LocalDate.parse(text.trim());
        } catch (DateTimeParseException e) {
            throw new BadInputException("option " + option + ": '" + text + "' is not a date; expected YYYY-MM-DD (UTC)");
        }
    }

    private EclipseExtent defaultExtent() {
        if (durationDays != null) {
            return EclipseExtent.ofDuration(durationDays, String.format(Locale.ROOT, "--duration %.2f h",
                    durationDays * 24));
        }
        return null;
    }

    private PlanningTarget singleTarget(List<String> notes) {
        SkyDirection direction = SkyPositionOptions.parse(ra, dec,
                "a prediction without --targets LIST.csv");
        PredictionEphemeris eph = ephemeris(notes);
        EclipseExtent extent;
        if (fitFile != null) {
            extent = EclipseExtent.ofModel(PlanningInputs.readFitModel(fitFile));
            if (durationDays != null) {
                notes.add("--duration is ignored: the eclipse contacts come from the model in " + fitFile);
            }
        } else if (durationDays != null) {
            extent = defaultExtent();
        } else {
            throw new BadInputException("the eclipse length is missing: give --fit fit.json (its model gives the"
                    + " contacts) or --duration (e.g. 3.5h)");
        }
        return new PlanningTarget(name, direction, eph, extent);
    }

    private PredictionEphemeris ephemeris(List<String> notes) {
        boolean byNumbers = periodDays != null || epochDays != null || timeScale != null;
        if (ephemerisFile != null && byNumbers) {
            throw new BadInputException("give the ephemeris once: --ephemeris FILE or --period/--epoch/--time-scale,"
                    + " not both");
        }
        if (ephemerisFile != null) {
            PlanningInputs.ReadEphemeris r = PlanningInputs.readEphemerisJson(ephemerisFile);
            notes.addAll(r.notes());
            return fitFile == null ? r.ephemeris()
                    : r.ephemeris().withSecondaryPhase(PlanningInputs.readFitModel(fitFile).orbit().secondaryPhase());
        }
        if (byNumbers) {
            if (periodDays == null || epochDays == null || timeScale == null) {
                throw new BadInputException("an ephemeris by numbers needs all of --period, --epoch and --time-scale");
            }
            TimeScale scale = TimeScale.parse(timeScale).orElseThrow(() -> new BadInputException("option --time-scale:"
                    + " unknown time scale '" + timeScale + "'; expected one of " + TimeScale.acceptedLabels()));
            PredictionEphemeris eph = new PredictionEphemeris(new Ephemeris(epochDays, periodDays), epochErrorDays,
                    periodErrorDays, 0, scale, 0.5);
            if (fitFile != null) {
                eph = eph.withSecondaryPhase(PlanningInputs.readFitModel(fitFile).orbit().secondaryPhase());
            }
            if (epochErrorDays == 0 && periodErrorDays == 0) {
                notes.add("no --epoch-error or --period-error: the predicted times are shown with 0 error");
            }
            return eph;
        }
        if (fitFile != null) {
            PlanningInputs.ReadEphemeris r = PlanningInputs.readFitEphemeris(fitFile);
            notes.addAll(r.notes());
            return r.ephemeris();
        }
        throw new BadInputException("no ephemeris: give --ephemeris ephemeris.json, --fit fit.json, or --period,"
                + " --epoch and --time-scale");
    }
}
