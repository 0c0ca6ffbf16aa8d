package org.twinlight.photometry;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.twinlight.BadInputException;

/** The optional airmass column of text tables: read by its header name, with the row rules of the values. */
class AirmassColumnTest {
    @TempDir
    Path dir;

    @Test
    void airmassIsReadBesideTheFlux() throws Exception {
        Path f = Files.writeString(dir.resolve("night.csv"), "time,flux,err,AirMass\n1.0,1.00,0.01,1.20\n"
                + "1.1,0.99,0.01,nan\n1.2,0.98,0.01,1.31\n1.3,0.97,0.01,\n");
        LightCurve lc = LightCurveReader.read(f, ReadOptions.defaults());
        assertThat(lc.size()).isEqualTo(2);
        assertThat(lc.airmass()).containsExactly(1.20, 1.31);
        // a row without a usable airmass is counted like one without a usable value
        assertThat(lc.rejectedCount()).isEqualTo(2);
        assertThat(lc.slice(1, 2).airmass()).containsExactly(1.31);
    }

    @Test
    void fitsTablesCarryTheirAirmassColumnToo() throws Exception {
        FitsFixture.Table t = new FitsFixture.Table()
                .column("TIME", new double[] {2460000.1, 2460000.2, 2460000.3})
                .column("FLUX", new double[] {1, 0.99, 0.98})
                .column("AIRMASS", new double[] {1.4, Double.NaN, 1.2});
        Path f = dir.resolve("night.fits");
        new FitsFixture().table(t).write(f);
        LightCurve lc = LightCurveReader.read(f, ReadOptions.defaults());
        assertThat(lc.airmass()).containsExactly(1.4, 1.2);
        assertThat(lc.rejectedCount()).isEqualTo(1);
    }

    @Test
    void noAirmassColumnMeansNoAirmass() throws Exception {
        Path f = Files.writeString(dir.resolve("plain.csv"), "time,flux\n1.0,1.0\n1.1,0.99\n");
        assertThat(LightCurveReader.read(f, ReadOptions.defaults()).hasAirmass()).isFalse();
    }

    @Test
    void anAirmassBelowOneIsRefusedNamingLineAndColumn() throws Exception {
        Path f = Files.writeString(dir.resolve("bad.csv"), "time,flux,airmass\n1.0,1.0,1.1\n1.1,0.99,0.8\n");
        assertThatThrownBy(() -> LightCurveReader.read(f, ReadOptions.defaults())).isInstanceOf(BadInputException.class)
                .hasMessageContaining("bad.csv").hasMessageContaining("line 3").hasMessageContaining("airmass");
    }
}
