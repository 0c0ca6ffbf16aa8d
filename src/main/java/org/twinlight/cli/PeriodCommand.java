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
import org.twinlight.timing.period.PeriodCandidate;
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
            "Searches a light curve for the period of its eclipses: a box-least-squares periodogram, confirmed "
                    + "with phase dispersion minimisation, with the choice between P and 2P for near-equal "
                    + "eclipses, a period uncertainty from eclipse timings, and runners-up.",
            "Writes period.json and periodogram.png to --out."})
public final class PeriodCommand implements Callable<Integer> {

    @Parameters(index = "0", paramLabel = "FILE", description = "Light curve: delimited text or FITS table.")
    Path file;

    @Option(names = "--out", required = true, paramLabel = "DIR",
            description = "Directory for period.json and periodogram.png (created if missing).")
    Path out;

    @Option(names = "--min-period", paramLabel = "DAYS",
            description = "Shortest trial period in days (default: 0.2 d, or longer when the cadence is too coarse"
                    + " for 15 %% eclipses to span three points).")
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
        w.printf(Locale.ROOT, "epoch   %.6f ± %.6f (time scale %s), primary depth %.5f, S/N %.1f%n", r.epochDays(),
                r.epochUncertaintyDays(), lc.timeScale().label(), r.primary().depth(), r.primary().signalToNoise());
        w.println("signal  " + r.significanceNote());
        if (r.secondary() != null) {
            w.printf(Locale.ROOT, "secondary at phase %.4f, depth %.5f (S/N %.1f), duration ratio %.3f%n",
                    r.secondary().phase(), r.secondary().depth(), r.secondary().signalToNoise(),
                    r.secondary().duration() / r.primary().duration());
        } else {
            w.println("secondary: none seen");
        }
        w.println("P or 2P: " + r.halfPeriod().explanation());
        w.printf(Locale.ROOT, "PDM Θ at the period %.4f: %s%n", r.candidates().get(0).pdmTheta(),
                r.pdmAgrees() ? "agrees (lowest among unrelated runners-up)" : "does NOT single out this period");
        w.println("runners-up:");
        for (PeriodCandidate c : r.candidates()) {
            if (!c.role().equals("best")) {
                w.printf(Locale.ROOT, "  %14.8f d  SR %.5g  SDE %5s  Θ %.4f  %s%n", c.periodDays(), c.blsPower(),
                        Messages.fixed(c.sde(), 1), c.pdmTheta(), c.role());
            }
        }
        w.println("wrote " + json + " and " + png);
        w.flush();
    }

}
