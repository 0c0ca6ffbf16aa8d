package org.twinlight.report;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.twinlight.BadInputException;
import org.twinlight.planning.EclipseExtent;
import org.twinlight.planning.PlanningTarget;
import org.twinlight.sky.Site;
import org.twinlight.time.TimeScale;

class PlanningInputsTest {

    @TempDir
    Path dir;

    private Path file(String name, String text) throws IOException {
        Path p = dir.resolve(name);
        Files.writeString(p, text);
        return p;
    }

    @Test
    void ephemerisJsonWithoutCovarianceSaysItAssumesNone() throws IOException {
        Path p = file("ephemeris.json", "{\"epoch\": {\"value\": 2460571.412402, \"uncertainty\": 4.2e-5},"
                + " \"period\": {\"value\": 0.873232092, \"uncertainty\": 5.05e-5}, \"timeScale\": \"BJD_TDB\","
                + " \"secondaryPhaseMeasured\": {\"value\": 0.4997, \"uncertainty\": 0.0002},"
                + " \"bic\": {\"linear\": 4.4, \"preferred\": \"quadratic\"}}");
        PlanningInputs.ReadEphemeris r = PlanningInputs.readEphemerisJson(p);
        assertThat(r.ephemeris().ephemeris().epochDays()).isEqualTo(2460571.412402);
        assertThat(r.ephemeris().timeScale()).isEqualTo(TimeScale.BJD_TDB);
        assertThat(r.ephemeris().secondaryPhase()).isEqualTo(0.4997);
        assertThat(r.ephemeris().epochPeriodCovarianceDays2()).isZero();
        assertThat(r.notes()).anySatisfy(n -> assertThat(n).contains("uncorrelated"))
                .anySatisfy(n -> assertThat(n).contains("prefers the quadratic"));
    }

    @Test
    void aCorrelationBlockGivesTheCovariance() throws IOException {
        Path p = file("fitlike.json", "{\"epoch\": {\"value\": 2460571.4, \"uncertainty\": 1e-4},"
                + " \"period\": {\"value\": 0.87, \"uncertainty\": 2e-6}, \"timeScale\": \"HJD_UTC\","
                + " \"correlation\": {\"names\": [\"period\", \"epoch\"], \"matrix\": [[1, -0.8], [-0.8, 1]]}}");
        PlanningInputs.ReadEphemeris r = PlanningInputs.readEphemerisJson(p);
        assertThat(r.ephemeris().epochPeriodCovarianceDays2()).isCloseTo(-0.8 * 1e-4 * 2e-6, within(1e-18));
        assertThat(r.notes()).isEmpty();
    }

    @Test
    void missingOrUnknownTimeScaleIsRefusedNamingTheKey() throws IOException {
        Path p = file("e.json", "{\"epoch\": {\"value\": 1, \"uncertainty\": 0}, \"period\": {\"value\": 2}}");
        assertThatThrownBy(() -> PlanningInputs.readEphemerisJson(p)).isInstanceOf(BadInputException.class)
                .hasMessageContaining("e.json").hasMessageContaining("timeScale").hasMessageContaining("missing");
    }

    @Test
    void siteFilesInEitherForm() throws IOException {
        assertThat(PlanningInputs.readSiteFile(file("a.txt", "# home\n-31.5, 115.9, 30\n")))
                .isEqualTo(new Site(-31.5, 115.9, 30));
        assertThat(PlanningInputs.readSiteFile(file("b.txt", "latitude: 52:12:00\nlongitude = -1.5\nheight: 80\n")))
                .isEqualTo(new Site(52.2, -1.5, 80));
        assertThatThrownBy(() -> PlanningInputs.readSiteFile(file("c.txt", "height: 80\n")))
                .hasMessageContaining("c.txt").hasMessageContaining("latitude");
    }

    @Test
    void aTargetListRowWithoutALengthNamesTheLineAndColumn() throws IOException {
        Path list = file("t.csv", "name,ra,dec,period,epoch,time_scale\nDemo A,10,20,1.5,2461000.2,BJD_TDB\n"
                + "Demo B,11,21,2.5,2461000.7,HJD_UTC\n");
        List<String> notes = new ArrayList<>();
        List<PlanningTarget> t = PlanningInputs.readTargetList(list, EclipseExtent.ofDuration(0.1, "x"), notes);
        assertThat(t).extracting(PlanningTarget::name).containsExactly("Demo A", "Demo B");
        assertThatThrownBy(() -> PlanningInputs.readTargetList(list, null, notes))
                .hasMessageContaining("t.csv: line 2").hasMessageContaining("duration_hours");
        Path bad = file("u.csv", "name,ra,dec,period,epoch,time_scale\nDemo C,25:00:00,20,1.5,2461000.2,BJD_TDB\n");
        assertThatThrownBy(() -> PlanningInputs.readTargetList(bad, EclipseExtent.ofDuration(0.1, "x"), notes))
                .hasMessageContaining("u.csv: line 2").hasMessageContaining("right ascension");
    }
}
