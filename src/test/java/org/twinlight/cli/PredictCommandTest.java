package org.twinlight.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * The predict command as a user runs it: help, the contract's output columns, target lists and bad input.
 * The ephemerides here are demo inputs (invented numbers for a fictional target, not check values);
 * the physics of the predictions is checked against its published sources in PlannerTest and
 * SkyReferenceTest.
 */
class PredictCommandTest extends CommandTestSupport {

    /** The contract's columns of predictions.csv (INTERFACE.md, "predict"), then reason. */
    private static final String CONTRACT_COLUMNS = "target,type,cycle,minimum_utc,minimum_jd_utc,error_minutes,"
            + "start_utc,end_utc,altitude_deg,azimuth_deg,sun_altitude_deg,moon_altitude_deg,moon_illumination,"
            + "moon_separation_deg,verdict,reason";

    private int run(String... args) {
        List<String> all = new ArrayList<>(List.of("predict"));
        all.addAll(List.of(args));
        return console.run(all.toArray(String[]::new));
    }

    private List<String> ephemerisArgs(String... more) {
        List<String> a = new ArrayList<>(List.of("--period", "0.8341", "--epoch", "2461470.3172", "--time-scale",
                "BJD_TDB", "--epoch-error", "0.0002", "--period-error", "2e-6", "--ra", "08:00:00", "--dec", "+40",
                "--duration", "3.6h", "--site", "50,10,300", "--out", dir.resolve("out").toString()));
        a.addAll(List.of(more));
        return a;
    }

    private Path file(String name, String content) throws IOException {
        Path p = dir.resolve(name);
        Files.writeString(p, content, StandardCharsets.UTF_8);
        return p;
    }

    @Test
    void helpNamesTheOptions() {
        assertThat(run("--help")).isZero();
        assertThat(out.toString()).contains("--ephemeris", "--fit", "--period", "--ra", "--site", "--start", "--end",
                "--min-altitude", "--sun-below", "--observable-only", "--targets", "--duration", "--force");
    }

    @Test
    void writesTheThreeFilesWithTheContractColumns() throws IOException {
        List<String> a = ephemerisArgs("--start", "2027-03-01", "--end", "2027-03-04");
        assertThat(run(a.toArray(String[]::new))).as(err.toString()).isZero();
        Path outDir = dir.resolve("out");
        List<String> csv = Files.readAllLines(outDir.resolve("predictions.csv"));
        assertThat(csv.get(0)).startsWith(CONTRACT_COLUMNS + ",");
        // one minimum every P/2 = 0.417 d over 3 days
        assertThat(csv).hasSize(1 + 7);
        assertThat(csv.get(1)).matches("target,(primary|secondary),-?\\d+(\\.5)?,2027-03-0\\dT\\d\\d:\\d\\d:\\d\\dZ,.*");
        assertThat(Files.readString(outDir.resolve("predictions.ics"))).startsWith("BEGIN:VCALENDAR\r\n");
        assertThat(Files.size(outDir.resolve("predictions.png"))).isGreaterThan(10_000);
        assertThat(out.toString()).contains("7 minima of 1 target", "verdict", "whole");
    }

    @Test
    void observableOnlyDropsTheRest() throws IOException {
        List<String> a = ephemerisArgs("--start", "2027-03-01", "--end", "2027-03-04", "--observable-only");
        assertThat(run(a.toArray(String[]::new))).as(err.toString()).isZero();
        List<String> csv = Files.readAllLines(dir.resolve("out/predictions.csv"));
        assertThat(csv.subList(1, csv.size())).isNotEmpty()
                .allSatisfy(l -> assertThat(l).containsAnyOf(",whole,", ",partial,").doesNotContain("not-observable"));
    }

    @Test
    void aTargetListGivesOneMergedPlan() throws IOException {
        Path eph = file("eph.json", "{\"epoch\": {\"value\": 2461471.1, \"uncertainty\": 0.0005},"
                + " \"period\": {\"value\": 2.4117, \"uncertainty\": 1e-5}, \"timeScale\": \"HJD_UTC\"}");
        Path list = file("targets.csv", "name,ra,dec,ephemeris,period,epoch,time_scale,duration_hours\n"
                + "Alpha Demo,08:00:00,+40:00:00,,0.8341,2461470.3172,BJD_TDB,3.6\n"
                + "Beta Demo,10:30:00,+25:00:00," + eph.getFileName() + ",,,,5.5\n");
        assertThat(run("--targets", list.toString(), "--site", "50,10", "--start", "2027-03-01", "--end",
                "2027-03-15", "--out", dir.resolve("out").toString())).as(err.toString()).isZero();
        List<String> csv = Files.readAllLines(dir.resolve("out/predictions.csv"));
        assertThat(csv.stream().filter(l -> l.startsWith("Alpha Demo,"))).hasSizeGreaterThan(30);
        assertThat(csv.stream().filter(l -> l.startsWith("Beta Demo,"))).hasSizeBetween(10, 13);
        assertThat(csv.stream().filter(l -> l.contains("clashes with") || l.matches(".*,[^,]*–[^,]*$"))).isNotEmpty();
        assertThat(out.toString()).contains("clash: ");
        List<String> times = csv.subList(1, csv.size()).stream().map(l -> l.split(",")[3]).toList();
        assertThat(times).isSorted();
    }

    @Test
    void aTargetListWithASinglePositionIsAmbiguous() throws IOException {
        Path list = file("targets.csv", "name,ra,dec,period,epoch,time_scale,duration_hours\n"
                + "Alpha Demo,08:00:00,+40:00:00,0.8341,2461470.3172,BJD_TDB,3.6\n");
        assertThat(run("--targets", list.toString(), "--ra", "10", "--dec", "20", "--site", "50,10", "--start",
                "2027-03-01", "--end", "2027-03-02", "--out", dir.resolve("out").toString())).isEqualTo(2);
        assertThat(err.toString()).contains("option --targets", "leave out");
    }

    @Test
    void anImpossibleLatitudeIsBadInput() {
        List<String> a = ephemerisArgs("--start", "2027-03-01", "--end", "2027-03-04");
        a.set(a.indexOf("50,10,300"), "95,10");
        assertThat(run(a.toArray(String[]::new))).isEqualTo(2);
        assertThat(err.toString()).contains("option --site", "latitude 95.0° is outside").doesNotContain("Exception");
    }

    @Test
    void emptyReversedAndOverlongRangesAreBadInput() {
        assertThat(run(ephemerisArgs("--start", "2027-03-04", "--end", "2027-03-04").toArray(String[]::new)))
                .isEqualTo(2);
        assertThat(err.toString()).contains("date range is empty");
        assertThat(run(ephemerisArgs("--start", "2027-03-04", "--end", "2027-03-01").toArray(String[]::new)))
                .isEqualTo(2);
        assertThat(err.toString()).contains("reversed");
        assertThat(run(ephemerisArgs("--start", "2027-03-04", "--end", "2038-03-05").toArray(String[]::new)))
                .isEqualTo(2);
        assertThat(err.toString()).contains("longer than 10 years", "--force");
        assertThat(run(ephemerisArgs("--start", "2027-3-4", "--end", "2027-03-05").toArray(String[]::new)))
                .isEqualTo(2);
        assertThat(err.toString()).contains("expected YYYY-MM-DD");
    }

    @Test
    void anEphemerisWithoutATimeScaleIsBadInput() throws IOException {
        Path eph = file("ephemeris.json", "{\"epoch\": {\"value\": 2461471.1, \"uncertainty\": 0.0005},"
                + " \"period\": {\"value\": 2.4117, \"uncertainty\": 1e-5}, \"timeScale\": \"unknown\"}");
        assertThat(run("--ephemeris", eph.toString(), "--ra", "10", "--dec", "20", "--duration", "3h", "--site",
                "50,10", "--start", "2027-03-01", "--end", "2027-03-05", "--out", dir.resolve("out").toString()))
                .isEqualTo(2);
        assertThat(err.toString()).contains("ephemeris.json", "timeScale", "without a time scale");
    }

    @Test
    void aMissingDurationSaysWhatToGive() {
        List<String> a = ephemerisArgs("--start", "2027-03-01", "--end", "2027-03-04");
        int i = a.indexOf("--duration");
        a.remove(i);
        a.remove(i);
        assertThat(run(a.toArray(String[]::new))).isEqualTo(2);
        assertThat(err.toString()).contains("--fit", "--duration");
    }
}
