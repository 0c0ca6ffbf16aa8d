package org.twinlight.cli;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.data.Offset.offset;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.twinlight.time.TimeConverter;
import org.twinlight.time.TimeScale;

class TimeCommandTest extends CommandTestSupport {

    private int run(String... args) {
        String[] all = new String[args.length + 1];
        all[0] = "time";
        System.arraycopy(args, 0, all, 1, args.length);
        return console.run(all);
    }

    private Path file(String name, String content) throws IOException {
        Path p = dir.resolve(name);
        Files.writeString(p, content, StandardCharsets.UTF_8);
        return p;
    }

    @Test
    void helpDescribesEveryOption() {
        assertThat(run("--help")).isZero();
        assertThat(out.toString()).contains("--from", "--to", "--ra", "--dec", "--out", "--column", "BJD_TDB");
    }

    @Test
    void convertsUtcToTtOnStandardOutputWithoutAPosition() throws IOException {
        // TT − UTC = 69.184 s after 2017 (IAU: TT − TAI = 32.184 s; IERS leap-second table).
        Path in = file("times.txt", "# observer log\n2460000.5 12.1\n2460001.25 12.3\n");
        assertThat(run(in.toString(), "--from", "JD_UTC", "--to", "JD_TT")).isZero();
        List<String> lines = out.toString().lines().toList();
        assertThat(lines.get(0)).startsWith("#").contains("time_in: JD_UTC", "time_out: JD_TT");
        assertThat(lines.get(1)).isEqualTo("time_in,time_out");
        assertThat(lines).hasSize(4);
        String[] row = lines.get(2).split(",");
        assertThat(row[0]).isEqualTo("2460000.5");
        assertThat((Double.parseDouble(row[1]) - 2460000.5) * 86400).isCloseTo(69.184, offset(1e-4));
        // full double precision: the text reads back to exactly the library's value
        assertThat(Double.parseDouble(row[1])).isEqualTo(TimeConverter.convert(2460000.5, TimeScale.JD_UTC,
                TimeScale.parse("JD_TT").orElseThrow(), null));
    }

    @Test
    void writesBjdToAFileAtomicallyFromANamedColumnWithSexagesimalPosition() throws IOException {
        Path in = file("lc.csv", "flux,time,err\n1.0,59000.25,0.01\n0.9,59000.30,0.01\n");
        Path result = dir.resolve("out/bjd.csv");
        int code = run(in.toString(), "--from", "MJD_UTC", "--to", "BJD_TDB", "--column", "time",
                "--ra", "05:34:31.94", "--dec", "+22:00:52.2", "--out", result.toString());
        assertThat(code).as(err.toString()).isZero();
        List<String> lines = Files.readAllLines(result);
        assertThat(lines.get(0)).contains("MJD_UTC", "BJD_TDB", "RA 83.633083", "Dec +22.014500");
        assertThat(lines).hasSize(4);
        double bjd = Double.parseDouble(lines.get(2).split(",")[1]);
        // IAU route computed with ERFA (src/test/resources/org/twinlight/time/make_erfa_reference.py, the
        // last two rows of erfa-reference.csv): BMJD_TDB 59000.245160416307, i.e. BJD_TDB − JD_UTC = −418.14 s.
        // Tolerance 0.1 s, the accuracy ErfaReferenceTest holds over 1990–2035.
        double diffSeconds = (bjd - 2459000.75) * 86400;
        assertThat(diffSeconds).isCloseTo((59000.245160416307 - 59000.25) * 86400, offset(0.1));
        assertThat(diffSeconds).isCloseTo(-418.14, offset(0.11));
        assertThat(out.toString()).contains("2 times converted");
        try (var listing = Files.list(result.getParent())) {
            assertThat(listing.map(p -> p.getFileName().toString())).containsExactly("bjd.csv");
        }
    }

    @Test
    void missingOrUnknownScaleIsRefused() throws IOException {
        Path in = file("t.txt", "2460000.5\n");
        assertThat(run(in.toString(), "--to", "BJD_TDB", "--ra", "10", "--dec", "10")).isEqualTo(2);
        assertThat(err.toString()).contains("no declared time scale", "--from");
        assertThat(run(in.toString(), "--from", "unknown", "--to", "JD_TT")).isEqualTo(2);
        assertThat(err.toString()).contains("unknown time scale cannot be converted");
        assertThat(run(in.toString(), "--from", "JD_GPS", "--to", "JD_TT")).isEqualTo(2);
        assertThat(err.toString()).contains("unknown time scale 'JD_GPS'", "BJD_TDB");
        assertThat(run(in.toString(), "--from", "JD_UTC")).isEqualTo(2);
        assertThat(err.toString()).contains("--to");
        assertThat(err.toString()).doesNotContain("Exception", "\tat ");
    }

    @Test
    void positionIsRequiredOnlyWhenNeeded() throws IOException {
        Path in = file("t.txt", "2460000.5\n");
        assertThat(run(in.toString(), "--from", "JD_UTC", "--to", "HJD_UTC")).isEqualTo(2);
        assertThat(err.toString()).contains("--ra and --dec");
        assertThat(run(in.toString(), "--from", "JD_UTC", "--to", "HJD_UTC", "--ra", "25:00:00", "--dec", "0"))
                .isEqualTo(2);
        assertThat(err.toString()).contains("option --ra", "outside");
        assertThat(run(in.toString(), "--from", "JD_UTC", "--to", "MJD_TDB")).isZero();
    }

    @Test
    void badRowsAreReportedByLineNumber() throws IOException {
        Path in = file("bad.txt", "time mag\n2460000.5 12\n2460000.6 12\nnan? 12\n2460000.7 12\n\n- 3\n");
        assertThat(run(in.toString(), "--from", "JD_UTC", "--to", "JD_TT")).isEqualTo(2);
        assertThat(err.toString()).contains("bad.txt", "lines 4, 7", "column 'time'", "expected a time");
    }

    @Test
    void utcBefore1972IsRefusedNamingTheLine() throws IOException {
        Path in = file("old.txt", "2441317.5\n2441000.5\n");
        assertThat(run(in.toString(), "--from", "JD_UTC", "--to", "JD_TT")).isEqualTo(2);
        assertThat(err.toString()).contains("old.txt", "line 2", "before 1972");
    }

    @Test
    void offsetTimesAreRefusedForBarycentricCorrection() throws IOException {
        Path in = file("btjd.txt", "1500.25\n");
        assertThat(run(in.toString(), "--from", "BJD_TDB", "--to", "HJD_UTC", "--ra", "10", "--dec", "-5")).isEqualTo(2);
        assertThat(err.toString()).contains("line 1", "1800–2050");
    }

    @Test
    void inputFileIsNeverOverwritten() throws IOException {
        Path in = file("t.txt", "2460000.5\n");
        assertThat(run(in.toString(), "--from", "JD_UTC", "--to", "JD_TT", "--out", in.toString())).isEqualTo(2);
        assertThat(err.toString()).contains("would overwrite the input");
        assertThat(Files.readString(in)).isEqualTo("2460000.5\n");
    }

    @Test
    void columnChoiceErrorsNameTheColumn() throws IOException {
        Path noHeader = file("a.txt", "2460000.5 1\n");
        assertThat(run(noHeader.toString(), "--from", "JD_UTC", "--to", "JD_TT", "--column", "time")).isEqualTo(2);
        assertThat(err.toString()).contains("no header row");
        Path header = file("b.txt", "hjd,mag\n2460000.5,1\n");
        assertThat(run(header.toString(), "--from", "JD_UTC", "--to", "JD_TT", "--column", "bjd")).isEqualTo(2);
        assertThat(err.toString()).contains("no such column", "1 'hjd', 2 'mag'");
        assertThat(run(header.toString(), "--from", "JD_UTC", "--to", "JD_TT", "--column", "3")).isEqualTo(2);
        assertThat(err.toString()).contains("column 3 does not exist", "2 columns");
        assertThat(run(header.toString(), "--from", "JD_UTC", "--to", "JD_TT", "--column", "99")).isEqualTo(2);
        assertThat(err.toString()).contains("column 99 does not exist");
        Path empty = file("c.txt", "# nothing\n");
        assertThat(run(empty.toString(), "--from", "JD_UTC", "--to", "JD_TT")).isEqualTo(2);
        assertThat(err.toString()).contains("no times found");
    }

    @Test
    void timeColumnIsFoundByItsHeaderNameWhereverItStands() throws IOException {
        // regression: a header "flux,hjd_utc" once made the first numeric column (flux) be converted
        Path in = file("named.csv", "flux,hjd_utc\n1.0,2455197.5\n0.9,2455197.6\n");
        assertThat(run(in.toString(), "--from", "HJD_UTC", "--to", "HJD_TDB", "--ra", "120", "--dec", "30")).isZero();
        assertThat(out.toString()).contains("2455197.5,").doesNotContain("\n1.0,");
    }

    @Test
    void decimalCommasAndAByteOrderMarkAreReadAsEveryReaderReadsThem() throws IOException {
        // TT − UTC = 69.184 s after 2017 (IAU: TT − TAI = 32.184 s; IERS leap-second table)
        double ttMinusUtc = 69.184 / 86400;
        for (String sep : new String[] {"\t", ";"}) {
            Path in = file("comma.txt", "time" + sep + "mag\n2460570,301" + sep + "11,83\n2460570,302" + sep
                    + "11,84\n");
            out.getBuffer().setLength(0);
            assertThat(run(in.toString(), "--from", "JD_UTC", "--to", "JD_TT")).isZero();
            List<String> lines = out.toString().lines().toList();
            assertThat(lines).hasSize(4);
            // the input time is echoed as a number the CSV can hold, not as "2460570,301"
            assertThat(lines.get(2)).startsWith("2460570.301,");
            assertThat(Double.parseDouble(lines.get(2).split(",")[1])).isCloseTo(2460570.301 + ttMinusUtc,
                    offset(1e-8));
        }
        Path bom = dir.resolve("bom.txt");
        Files.write(bom, "\uFEFF2460570.301\n2460570.302\n".getBytes(StandardCharsets.UTF_8));
        out.getBuffer().setLength(0);
        assertThat(run(bom.toString(), "--from", "JD_UTC", "--to", "JD_TT")).isZero();
        // both rows converted: the first is not taken for a header
        assertThat(out.toString().lines().filter(l -> l.startsWith("2460570.30"))).hasSize(2);
    }

    @Test
    void aNegativeJulianDateIsBadInputNamingTheLine() throws IOException {
        Path in = file("neg.txt", "2460000.5\n-5\n");
        assertThat(run(in.toString(), "--from", "JD_UTC", "--to", "JD_TT")).isEqualTo(2);
        assertThat(err.toString()).contains("neg.txt", "line 2", "-5").doesNotContain("internal error");
        Path huge = file("huge.txt", "2460000.5\n1e300\n");
        assertThat(run(huge.toString(), "--from", "JD_TT", "--to", "JD_TDB")).isEqualTo(2);
        assertThat(err.toString()).contains("line 2", "1e300 is not a (modified) Julian date");
        assertThat(out.toString()).doesNotContain("0000000000000000000000");
    }
}
