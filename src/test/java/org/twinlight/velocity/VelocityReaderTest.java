package org.twinlight.velocity;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.twinlight.BadInputException;
import org.twinlight.photometry.FitsFixture;
import org.twinlight.time.TimeScale;

class VelocityReaderTest {

    @TempDir
    Path dir;

    private Path text(String name, String content) throws IOException {
        Path p = dir.resolve(name);
        Files.writeString(p, content);
        return p;
    }

    @Test
    void headerNamesInAnyOrderWithAMissingStarAndInstruments() throws IOException {
        Path f = text("rv.csv", """
                # time scale: BJD_TDB
                instrument,v2_err,v2,time,v1,v1_err
                north,1.2,40.5,2460100.10,-30.1,0.8
                north,,,2460101.20,12.0,0.8
                south,1.5,-51.0,2460102.30,44.2,0.9
                south,1.5,nan,2460103.40,20.0,0.9
                """);
        VelocityData d = VelocityReader.read(f, VelocityReadOptions.defaults());
        assertThat(d.timeScale()).isEqualTo(TimeScale.BJD_TDB);
        assertThat(d.star1().size()).isEqualTo(4);
        assertThat(d.star2().size()).isEqualTo(2);
        assertThat(d.star2().velocitiesKms()).containsExactly(40.5, -51.0);
        assertThat(d.star2().errorsKms()).containsExactly(1.2, 1.5);
        assertThat(d.instruments()).containsExactly("north", "south");
        assertThat(d.star2().instruments()).containsExactly(0, 1);
        assertThat(d.rejectedCount()).isZero();
    }

    @Test
    void headerlessSemicolonsWithDecimalCommasAndRowAccounting() throws IOException {
        Path f = text("rv.dat", """
                2460100,10;-30,1;0,8;40,5;1,2
                2460101,20;12,0;0,0;-3,0;1,1
                2460102,30;abc;0,9;-51,0;1,5
                2460103,40;20,0;0,9;;
                2460104,50;nan;0,9;nan;1,0
                abc;12,0;0,9;-3,0;1,1
                """);
        VelocityData d = VelocityReader.read(f, VelocityReadOptions.defaults().withTimeScale(TimeScale.HJD_UTC));
        assertThat(d.timeScale()).isEqualTo(TimeScale.HJD_UTC);
        // row 2: star 1's error is 0 (star 1 dropped, star 2 kept); row 3: not a number;
        // row 4: star 2 absent; row 5: neither star measured; row 6: the time is not a number
        assertThat(d.star1().velocitiesKms()).containsExactly(-30.1, 20.0);
        assertThat(d.star2().velocitiesKms()).containsExactly(40.5, -3.0);
        assertThat(d.rejected()).containsEntry("star 1: error not positive", 1).containsEntry("v1: not a number", 1)
                .containsEntry("time: not a number", 1)
                .containsEntry("missing field", 1);
        assertThat(d.star1().rowNumbers()).containsExactly(1, 4);
    }

    @Test
    void columnsChosenByOption() throws IOException {
        Path f = text("rv.csv", """
                HJD_UTC;va;sa;vb;sb
                2460100.1;-30.1;0.8;40.5;1.2
                2460101.2;12.0;0.8;-3.0;1.1
                """);
        VelocityReadOptions o = new VelocityReadOptions(null, "va", "sa", "vb", "sb", null, null, 0.0, null);
        VelocityData d = VelocityReader.read(f, o);
        assertThat(d.star2().velocitiesKms()).containsExactly(40.5, -3.0);
        assertThat(d.timeScale()).isEqualTo(TimeScale.HJD_UTC);
        assertThatThrownBy(() -> VelocityReader.read(f, VelocityReadOptions.defaults()))
                .isInstanceOf(BadInputException.class).hasMessageContaining("rv.csv")
                .hasMessageContaining("no velocity column");
    }

    @Test
    void badFilesNameFileAndProblem() throws IOException {
        Path few = text("few.txt", "2460100.1 -30.1 40.5\n");
        assertThatThrownBy(() -> VelocityReader.read(few, null)).isInstanceOf(BadInputException.class)
                .hasMessageContaining("few.txt").hasMessageContaining("no header row");
        Path none = text("none.csv", "time,v1,v1_err,v2,v2_err\n2460100,x,1,y,1\n");
        assertThatThrownBy(() -> VelocityReader.read(none, null)).isInstanceOf(BadInputException.class)
                .hasMessageContaining("no usable velocity");
        assertThatThrownBy(() -> VelocityReader.read(dir.resolve("missing.csv"), null))
                .hasMessageContaining("no such file");
    }

    @Test
    void fitsTableWithTimeKeywords() throws IOException {
        Path f = dir.resolve("rv.fits");
        new FitsFixture().table(new FitsFixture.Table()
                .column("TIME", new double[] {100.5, 101.5, 102.5})
                .column("RV1", new double[] {-30.0, 10.0, 25.0})
                .column("RV1_ERR", new double[] {0.5, 0.5, 0.5})
                .column("RV2", new double[] {40.0, Double.NaN, -30.0})
                .column("RV2_ERR", new double[] {0.7, 0.7, 0.7})
                .key("TIMESYS", "TDB").key("TIMEREF", "SOLARSYSTEM").key("MJDREFI", 60000).key("MJDREFF", 0.0)
                .key("TIMEUNIT", "d")).write(f);
        VelocityData d = VelocityReader.read(f, null);
        assertThat(d.timeScale()).isEqualTo(TimeScale.BJD_TDB);
        // FITS time standard: JD = 2400000.5 + MJDREF + value (days)
        assertThat(d.star1().timesDays()[0]).isEqualTo(2400000.5 + 60000 + 100.5);
        assertThat(d.star2().size()).isEqualTo(2);
        assertThat(d.star1().errorsKms()).containsExactly(0.5, 0.5, 0.5);
    }
}
