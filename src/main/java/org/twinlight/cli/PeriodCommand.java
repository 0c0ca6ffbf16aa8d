package org.twinlight.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.Locale;
import java.util.concurrent.Callable;
import org.twinlight.BadInputException;
import org.twinlight.photometry.LightCurve;
import org.twinlight.report.PeriodResultJson;
import org.twinlight.report.PeriodogramPlot;
import org.twinlight.report.ResultSet;
import org.twinlight.timing.period.PeriodDecision;
import org.twinlight.timing.period.PeriodSearch;
import org.twinlight.timing.period.PeriodSearchResult;
import org.twinlight.timing.period.PeriodSearchSettings;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/** {@code period FILE --out DIR}: eclipse period search, writing {@code period.json} and {@code periodogram.png}. */
@Command(name = "period", mixinStandardHelpOptions = true, versionProvider = VersionInfo.class,
        description = {
            "Searches a light curve for the period of its eclipses: a box-least-squares periodogram; the highest "
                    + "peak, its multiples and strong runners-up each refined from eclipse timings and compared by "
                    + "phase dispersion and timing χ²; the choice between P and 2P from a second eclipse, alternate "
                    + "eclipses and coverage. The verdict is confident, or ambiguous with the candidates and what "
                    + "observation would settle it.",
            "Writes period.json and periodogram.png to --out."})
public final class PeriodCommand implements Callable<Integer> {

    @Parameters(index = "0", paramLabel = "FILE", description = "Light curve: delimited text or FITS table.")
    Path file;

    @Option(names = "--out", required = true, paramLabel = "DIR",
            description = "Directory for period.json and periodogram.png (created if missing).")
    Path out;

    @Option(names = "--min-period", paramLabel = "DAYS",
            description = "Shortest trial period in days (default: 0.2 d, whatever the sampling; a note says when"
                    + " the answer lies within a factor 2 of it).")
    Double minPeriod;

    @Option(names = "--max-period", paramLabel = "DAYS",
            description = "Longest trial period in days (default and upper limit: half the baseline, so that two"
                    + " eclipses of the same kind are covered).")
    Double maxPeriod;

    @Option(names = "--single-thread", description = "Use one core only (default: all cores).")
    boolean singleThread;

    @Mixin
    PhotometryOptions photometry;

    @Spec
    picocli.CommandLine.Model.CommandSpec spec;

    @Override
    public Integer call() {
        OptionChecks.periodDays("--min-period", minPeriod);
        OptionChecks.periodDays("--max-period", maxPeriod);
        if (minPeriod != null && maxPeriod != null && !(maxPeriod > minPeriod)) {
            throw new BadInputException("options --min-period " + minPeriod + " and --max-period " + maxPeriod
                    + ": the maximum must exceed the minimum");
        }
        OptionChecks.readableFile(file);
        OutputTargets.checkDirectory(out, java.util.List.of("period.json", "periodogram.png"), java.util.List.of(file));
        LightCurve lc = photometry.read(file, spec.commandLine().getOut());
        PeriodSearchSettings settings = PeriodSearchSettings.defaults().withMinPeriodDays(minPeriod)
                .withMaxPeriodDays(maxPeriod).withParallel(!singleThread);
        PeriodSearchResult r = PeriodSearch.search(lc, settings);
        try (ResultSet set = ResultSet.open(out, "period")) {
            PeriodResultJson.write(set.file("period.json"), r, lc.timeScale().label(), file.getFileName().toString(),
                    org.twinlight.report.InputDigest.sha256(file), lc.rejectedCount(), VersionInfo.version(), lc.notes());
            PeriodogramPlot.write(set.file("periodogram.png"), r, lc);
            set.commit();
        }
        printSummary(spec.commandLine().getOut(), r, lc, out.resolve("period.json"), out.resolve("periodogram.png"));
        return 0;
    }

    private static void printSummary(PrintWriter w, PeriodSearchResult r, LightCurve lc, Path json, Path png) {
        PeriodSearchResult.SearchSummary s = r.search();
        w.printf(Locale.ROOT, "%s: %d points over %.3f d, time scale %s; %d trial periods from %.4g to %.4g d%n",
                lc.source(), s.points(), s.baselineDays(), lc.timeScale().label(), s.frequencies(),
                s.minPeriodDays(), s.maxPeriodDays());
        w.printf(Locale.ROOT, "period  %s d  (%s)%n", Messages.valueWithUncertainty(r.periodDays(),
                r.periodUncertaintyDays(), 8), r.uncertaintyMethod());
        r.periodCaution().ifPresent(c -> w.println("CAUTION " + c));
        w.printf(Locale.ROOT, "epoch   %.6f ± %.6f (time scale %s), primary depth %.5f, S/N %.1f%n", r.epochDays(),
                r.epochUncertaintyDays(), lc.timeScale().label(), r.primary().depth(), r.primary().signalToNoise());
        w.println("signal  " + r.significanceNote());
        r.secondary().ifPresentOrElse(sec -> w.printf(Locale.ROOT,
                "secondary at phase %.4f, depth %.5f (S/N %.1f), duration ratio %.3f%n", sec.phase(), sec.depth(),
                sec.signalToNoise(), sec.duration() / r.primary().duration()), () -> w.println("secondary: none seen"));
        PeriodDecision d = r.decision();
        w.println("DECISION " + d.headline().toUpperCase(Locale.ROOT).charAt(0) + d.headline().substring(1));
        w.println("evidence:");
        d.evidence().forEach(e -> w.println("  - " + e));
        if (!d.toSettle().isEmpty()) {
            w.println("to settle it:");
            d.toSettle().forEach(e -> w.println("  - " + e));
        }
        d.notes().forEach(e -> w.println("note: " + e));
        w.println("wrote " + json + " and " + png);
        w.flush();
    }

}
