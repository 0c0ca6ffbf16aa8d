package org.twinlight.cli;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import org.junit.jupiter.api.Test;
import org.twinlight.photometry.FitsFixture;

class InspectCommandTest extends CommandTestSupport {

    private int run(String... args) {
        return console.run(args);
    }

    /** Two nights of synthetic magnitudes at a 5-minute cadence, with one unreadable row. */
    private Path twoNights() throws IOException {
        StringBuilder sb = new StringBuilder("# synthetic light curve of a fictional system\nBJD_TDB,mag,mag_err\n");
        for (int night = 0; night < 2; night++) {
            for (int k = 0; k < 60; k++) {
                double t = 2460100.3 + night + k * 5.0 / 1440;
                sb.append(String.format(Locale.ROOT, "%.6f,%.4f,0.005%n", t, 11.0 + 0.001 * Math.sin(k)));
            }
        }
        sb.append("2460102.0,n/a,0.005\n");
        Path p = dir.resolve("nights.csv");
        Files.writeString(p, sb.toString());
        return p;
    }

    @Test
    void printsAHumanSummary() throws IOException {
        Path p = twoNights();
        int code = run("inspect", p.toString());
        assertThat(code).as(err.toString()).isZero();
        String text = out.toString();
        assertThat(text).contains("nights.csv").contains("BJD_TDB").contains("120 used, 1 rejected: not a number: 1")
                .contains("magnitudes").contains("Segments     2 (split at gaps longer than 0.5000 d = 12.0 h)")
                .contains("median 0.003472 d = 5.00 min").contains("Outliers     0");
        assertThat(err.toString()).isEmpty();
    }

    @Test
    void printsJson() throws IOException {
        Path p = twoNights();
        int code = run("inspect", p.toString(), "--json", "--segment-gap", "2");
        assertThat(code).isZero();
        JsonNode root = new ObjectMapper().readTree(out.toString());
        JsonNode band = root.get("bands").get(0);
        assertThat(band.get("points").asInt()).isEqualTo(120);
        assertThat(band.get("timeScale").asText()).isEqualTo("BJD_TDB");
        assertThat(band.get("valueKind").asText()).isEqualTo("magnitude");
        assertThat(band.get("segments")).hasSize(1);
        assertThat(band.get("gaps").asInt()).isEqualTo(1);
        assertThat(band.get("rejectedByReason").get("not a number").asInt()).isEqualTo(1);
        assertThat(band.get("medianCadenceDays").asDouble()).isCloseTo(5.0 / 1440, org.assertj.core.data.Offset.offset(2e-6)); // times written to 1e-6 d;
    }

    @Test
    void summarisesEachBand() throws IOException {
        Path p = dir.resolve("bands.csv");
        Files.writeString(p, "time,filter,flux\n1,B,1\n2,V,1\n3,B,1\n4,V,1\n");
        assertThat(run("inspect", p.toString())).isZero();
        assertThat(out.toString()).contains("Bands        2: B, V").contains("Band         V");
        out.getBuffer().setLength(0);
        assertThat(run("inspect", p.toString(), "--json")).isZero();
        assertThat(out.toString()).contains("\"band\" : \"B\"").contains("\"band\" : \"V\"");
    }

    @Test
    void readsAFitsTableWithItsTimeKeywords() throws IOException {
        Path p = dir.resolve("lc.fits");
        new FitsFixture().table(new FitsFixture.Table()
                .column("TIME", new double[] {100.0, 100.01, 100.02, 100.03})
                .column("FLUX", new float[] {1f, 0.99f, 1.01f, 1f})
                .column("FLUX_ERR", new float[] {0.01f, 0.01f, 0.01f, 0.01f})
                .column("QUALITY", new int[] {0, 0, 1, 0})
                .key("TIMESYS", "TDB").key("TIMEREF", "SOLARSYSTEM").key("TIMEUNIT", "d").key("BJDREFI", 2457000))
                .write(p);
        assertThat(run("inspect", p.toString())).as(err.toString()).isZero();
        assertThat(out.toString()).contains("BJD_TDB").contains("3 used, 1 rejected: quality flag set: 1")
                .contains("2457100.000000 to 2457100.030000");
        assertThat(run("inspect", p.toString(), "--hdu", "3")).isEqualTo(2);
        assertThat(err.toString()).contains("lc.fits").contains("HDU 3").contains("no such HDU");
    }

    @Test
    void declaredScaleIsShownAndUnknownSaysSo() throws IOException {
        Path p = dir.resolve("plain.txt");
        Files.writeString(p, "1 1\n2 1\n3 1\n");
        assertThat(run("inspect", p.toString())).isZero();
        assertThat(out.toString()).contains("unknown (declare it with --time-scale)");
        out.getBuffer().setLength(0);
        assertThat(run("inspect", p.toString(), "--time-scale", "HJD_UTC", "--time-offset", "2450000")).isZero();
        assertThat(out.toString()).contains("HJD_UTC").contains("2450001.000000 to 2450003.000000");
    }

    @Test
    void missingFileIsExitTwoWithoutStackTrace() {
        Path p = dir.resolve("nothing.csv");
        assertThat(run("inspect", p.toString())).isEqualTo(2);
        assertThat(err.toString()).contains("nothing.csv").contains("no such file").doesNotContain("\tat ");
    }

    @Test
    void unsortedFileIsExitTwoNamingTheLines() throws IOException {
        Path p = dir.resolve("unsorted.csv");
        Files.writeString(p, "time,flux\n2,1\n1,1\n");
        assertThat(run("inspect", p.toString())).isEqualTo(2);
        assertThat(err.toString()).contains("unsorted.csv").contains("lines 2 and 3").contains("column 'time'")
                .doesNotContain("\tat ");
    }

    @Test
    void badOptionValuesAreExitTwo() throws IOException {
        Path p = twoNights();
        assertThat(run("inspect", p.toString(), "--segment-gap", "0")).isEqualTo(2);
        assertThat(err.toString()).contains("--segment-gap");
        assertThat(run("inspect", p.toString(), "--values", "counts")).isEqualTo(2);
        assertThat(err.toString()).contains("--values");
        assertThat(run("inspect", p.toString(), "--time-scale", "martian")).isEqualTo(2);
        assertThat(err.toString()).contains("martian");
        assertThat(run("inspect")).isEqualTo(2);
    }

    @Test
    void helpDescribesTheOptions() {
        assertThat(run("inspect", "--help")).isZero();
        assertThat(out.toString()).contains("--segment-gap").contains("--json").contains("--time-column")
                .contains("--hdu");
    }

    @Test
    void magnitudesAreShownInMagnitudesNotAsTinyFluxes() throws IOException {
        Path p = twoNights();
        assertThat(run("inspect", p.toString())).isZero();
        String text = out.toString();
        // 11.0 ± 0.001 mag as written; 10^(-0.4·11) = 4e-5 must not be what the user reads
        assertThat(text).contains("Magnitudes   brightest 10.9990, median 11.0", "faintest 11.0010")
                .contains("Errors       median 0.0050 mag").doesNotContain("e-05").doesNotContain("Flux  ");
        out.getBuffer().setLength(0);
        assertThat(run("inspect", p.toString(), "--json")).isZero();
        JsonNode m = new ObjectMapper().readTree(out.toString()).at("/bands/0/magnitudes");
        assertThat(m.get("faintest").asDouble()).isCloseTo(11.001, org.assertj.core.data.Offset.offset(1e-4));
        assertThat(m.get("medianError").asDouble()).isCloseTo(0.005, org.assertj.core.data.Offset.offset(1e-9));
    }

    @Test
    void onePointSaysScatterIsNotMeasuredAndCountsInTheSingular() throws IOException {
        Path p = dir.resolve("one.csv");
        Files.writeString(p, "time,flux\n2460100.5,1.0\n");
        assertThat(run("inspect", p.toString())).isZero();
        assertThat(out.toString()).contains("1 point\n", "Scatter      not measured").doesNotContain("NaN");
    }
}
