package org.twinlight.photometry;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.twinlight.BadInputException;
import org.twinlight.time.TimeScale;

class TextTableReaderTest {

    @TempDir
    Path dir;

    private Path file(String name, String content) throws IOException {
        return TestFiles.text(dir, name, content);
    }

    private static ReadOptions options(String time, String value, String error) {
        return new ReadOptions(time, value, error, null, null, null, null, null, null);
    }

    @Test
    void commaSeparatedWithHeaderFindsColumnsByName() throws IOException {
        Path p = file("lc.csv", "# synthetic test data\nflux_err,flux,time\n0.002,1.001,2460000.10\n"
                + "0.003,0.950,2460000.20\n0.002,1.002,2460000.30\n");
        LightCurve lc = LightCurveReader.read(p, ReadOptions.defaults());
        assertThat(lc.timesDays()).containsExactly(2460000.10, 2460000.20, 2460000.30);
        assertThat(lc.fluxes()).containsExactly(1.001, 0.950, 1.002);
        assertThat(lc.fluxErrors()).containsExactly(0.002, 0.003, 0.002);
        assertThat(lc.originalKind()).isEqualTo(ValueKind.FLUX);
        assertThat(lc.timeScale()).isEqualTo(TimeScale.UNKNOWN);
        assertThat(lc.band()).isNull();
        assertThat(lc.rejectedCount()).isZero();
        assertThat(lc.source()).isEqualTo("lc.csv");
    }

    @Test
    void tabSeparatedMagnitudesWithScaleInTheHeader() throws IOException {
        Path p = file("lc.tsv", "BJD_TDB\tmag\tmag_err\n2460000.1\t12.0\t0.01\n2460000.2\t12.5\t0.02\n");
        LightCurve lc = LightCurveReader.read(p, ReadOptions.defaults());
        assertThat(lc.originalKind()).isEqualTo(ValueKind.MAGNITUDE);
        assertThat(lc.timeScale()).isEqualTo(TimeScale.BJD_TDB);
        // Pogson (1856, MNRAS 17, 12): F = 10^(-0.4 m), so 12 mag is 10^-4.8.
        assertThat(lc.flux(0)).isCloseTo(Math.pow(10, -4.8), within(1e-18));
        // sigma_F = 0.4 ln10 F sigma_m (first-order propagation, Bevington & Robinson 2003, eq. 3.14)
        assertThat(lc.fluxError(1)).isCloseTo(0.4 * Math.log(10) * Math.pow(10, -5.0) * 0.02, within(1e-18));
    }

    @Test
    void magnitudesWithoutAHeaderAreRefusedUntilStated() throws IOException {
        Path p = file("nohdr.dat", "2460000.1 11.80\n2460000.2 11.95\n2460000.3 11.81\n");
        assertThatThrownBy(() -> LightCurveReader.read(p, ReadOptions.defaults()))
                .isInstanceOf(BadInputException.class).hasMessageContaining("look like magnitudes")
                .hasMessageContaining("--values magnitude").hasMessageContaining("column 2");
        LightCurve stated = LightCurveReader.read(p, ReadOptions.defaults().withValueKind(ValueKind.MAGNITUDE));
        assertThat(stated.notes()).isEmpty();
        assertThat(stated.originalKind()).isEqualTo(ValueKind.MAGNITUDE);
        assertThat(LightCurveReader.read(p, ReadOptions.defaults().withValueKind(ValueKind.FLUX)).fluxes())
                .containsExactly(11.80, 11.95, 11.81);
    }

    @Test
    void magnitudeLikeValuesInAFluxColumnGiveARemark() throws IOException {
        Path p = file("flux.csv", "time,flux\n2460000.1,11.80\n2460000.2,11.95\n2460000.3,11.81\n");
        LightCurve lc = LightCurveReader.read(p, ReadOptions.defaults());
        assertThat(lc.originalKind()).isEqualTo(ValueKind.FLUX);
        assertThat(lc.notes()).singleElement().asString().contains("look like magnitudes").contains("--values magnitude");
    }

    @Test
    void differentialMagnitudesInAColumnNamedValueAreRefused() throws IOException {
        // differential magnitudes scatter around zero: read as flux they gave a "significant" wrong period
        Path p = file("diff.csv", "time,value\n1,0.012\n2,-0.004\n3,0.35\n4,0.010\n5,-0.008\n");
        assertThatThrownBy(() -> LightCurveReader.read(p, ReadOptions.defaults()))
                .isInstanceOf(BadInputException.class).hasMessageContaining("column 'value'")
                .hasMessageContaining("2 of 5 values").hasMessageContaining("differential magnitudes")
                .hasMessageContaining("--values magnitude");
        Path centred = file("centred.csv", "time,flux\n1,0.002\n2,-0.004\n3,-0.35\n4,0.0\n5,-0.001\n");
        assertThatThrownBy(() -> LightCurveReader.read(centred, ReadOptions.defaults()))
                .isInstanceOf(BadInputException.class).hasMessageContaining("median of -0.001")
                .hasMessageContaining("positive level");
    }

    @Test
    void aShortRowInACommaFileIsAMissingFieldNotAnotherDelimiter() throws IOException {
        // regression: one row without its flux once made the whole file read as white-space separated
        Path p = file("short.csv", "time,flux\n2460000.1,1.0\n2460000.2\n2460000.3,0.9\n2460000.4,0.95\n"
                + "2460000.5,0.97\n");
        LightCurve lc = LightCurveReader.read(p, ReadOptions.defaults());
        assertThat(lc.size()).isEqualTo(4);
        assertThat(lc.rejectedRows()).containsOnlyKeys("missing field");
    }

    @Test
    void timeScaleCommentDeclaresTheScaleUnlessTheOptionDoes() throws IOException {
        Path p = file("own.csv", "# time scale: HJD_UTC\n# made by a test\ntime,flux\n2460000.1,1.0\n2460000.2,0.9\n");
        assertThat(LightCurveReader.read(p, ReadOptions.defaults()).timeScale()).isEqualTo(TimeScale.HJD_UTC);
        LightCurve overridden = LightCurveReader.read(p, ReadOptions.defaults().withTimeScale(TimeScale.BJD_TDB));
        assertThat(overridden.timeScale()).isEqualTo(TimeScale.BJD_TDB);
        assertThat(overridden.notes()).singleElement().asString().contains("declares").contains("HJD_UTC")
                .contains("BJD_TDB");
        assertThat(LightCurveReader.read(p, ReadOptions.defaults()).notes()).isEmpty();
        Path bad = file("bad.csv", "# time scale: HJD_XYZ\ntime,flux\n2460000.1,1.0\n");
        assertThatThrownBy(() -> LightCurveReader.read(bad, ReadOptions.defaults()))
                .isInstanceOf(BadInputException.class).hasMessageContaining("bad.csv").hasMessageContaining("line 1")
                .hasMessageContaining("HJD_XYZ");
    }

    @Test
    void whiteSpaceWithoutHeaderTakesTimeValueError() throws IOException {
        Path p = file("lc.dat", "  2460000.1   1.00  0.01  1.3\n2460000.2 0.98 0.01 1.4 # airmass last\n\n"
                + "2460000.3\t0.97   0.01 1.5\n");
        LightCurve lc = LightCurveReader.read(p, ReadOptions.defaults());
        assertThat(lc.size()).isEqualTo(3);
        assertThat(lc.fluxes()).containsExactly(1.00, 0.98, 0.97);
        assertThat(lc.fluxErrors()).containsExactly(0.01, 0.01, 0.01);
    }

    @Test
    void twoColumnsWithoutHeaderHaveNoErrors() throws IOException {
        LightCurve lc = LightCurveReader.read(file("lc.txt", "1.0 0.95\n2.0 1.05\n"), ReadOptions.defaults());
        assertThat(lc.hasErrors()).isFalse();
        assertThat(lc.fluxes()).containsExactly(0.95, 1.05);
    }

    @Test
    void columnsChosenByNumberAndByName() throws IOException {
        Path p = file("lc.csv", "a,b,c,d\n10,1.5,0.1,0.7\n11,1.6,0.2,0.8\n");
        LightCurve byNumber = LightCurveReader.read(p, options("1", "4", "3"));
        assertThat(byNumber.fluxes()).containsExactly(0.7, 0.8);
        assertThat(byNumber.fluxErrors()).containsExactly(0.1, 0.2);
        LightCurve byName = LightCurveReader.read(p, options("A", "b", null));
        assertThat(byName.fluxes()).containsExactly(1.5, 1.6);
        assertThat(byName.hasErrors()).isFalse();
    }

    @Test
    void semicolonsWithDecimalCommas() throws IOException {
        Path p = file("lc.csv", "time;rel_flux;err\n2460000,10;0,995;0,002\n2460000,20;1,005;0,002\n");
        LightCurve lc = LightCurveReader.read(p, ReadOptions.defaults());
        assertThat(lc.timesDays()).containsExactly(2460000.10, 2460000.20);
        assertThat(lc.fluxes()).containsExactly(0.995, 1.005);
    }

    @Test
    void headerInTheLastCommentLine() throws IOException {
        Path p = file("lc.txt", "# observer: test\n# hjd mag err\n2450000.1 10.0 0.01\n2450000.2 10.1 0.01\n");
        LightCurve lc = LightCurveReader.read(p, ReadOptions.defaults());
        assertThat(lc.originalKind()).isEqualTo(ValueKind.MAGNITUDE);
        // "hjd" alone does not say which clock: the scale stays unknown.
        assertThat(lc.timeScale()).isEqualTo(TimeScale.UNKNOWN);
    }

    @Test
    void declaredScaleAndOffsetApply() throws IOException {
        Path p = file("lc.csv", "btjd,flux\n1000.5,1\n1001.5,1\n");
        ReadOptions o = new ReadOptions(null, null, null, null, null, ValueKind.FLUX, TimeScale.BJD_TDB, 2457000.0,
                null);
        LightCurve lc = LightCurveReader.read(p, o);
        assertThat(lc.timesDays()).containsExactly(2458000.5, 2458001.5);
        assertThat(lc.timeScale()).isEqualTo(TimeScale.BJD_TDB);
    }

    @Test
    void valuesOptionOverridesTheHeader() throws IOException {
        Path p = file("lc.csv", "time,value\n1,0\n2,5\n");
        LightCurve lc = LightCurveReader.read(p, ReadOptions.defaults().withValueKind(ValueKind.MAGNITUDE));
        // 5 magnitudes are a factor of 100 in flux by definition (Pogson 1856).
        assertThat(lc.fluxes()).containsExactly(new double[] {1.0, 0.01}, within(1e-15));
    }

    @Test
    void unusableRowsAreCountedByReason() throws IOException {
        Path p = file("lc.csv", "time,mag,err,quality\n"
                + "1,10.0,0.01,0\n"
                + "2,abc,0.01,0\n"      // not a number
                + "3,nan,0.01,0\n"      // NaN
                + "4,10.0,0,0\n"        // error not positive
                + "5,10.0,-0.1,0\n"     // error not positive
                + "6,10.0,0.01,4\n"     // flagged
                + "7,99.0,0.01,0\n"     // magnitude sentinel
                + "8,10.0\n"            // missing field
                + "9,,0.01,0\n"         // empty field
                + "10,10.2,0.01,0\n");
        LightCurve lc = LightCurveReader.read(p, ReadOptions.defaults());
        assertThat(lc.timesDays()).containsExactly(1, 10);
        assertThat(lc.rejectedRows()).containsExactlyInAnyOrderEntriesOf(Map.of(
                "not a number", 1, "NaN or infinite", 1, "error not positive", 2, "quality flag set", 1,
                "magnitude out of range", 1, "missing field", 2));
        assertThat(lc.rejectedCount()).isEqualTo(8);
    }

    @Test
    void zeroAndNegativeFluxAreKept() throws IOException {
        // faint targets: background-subtracted flux may dip to or below zero around a positive level
        LightCurve lc = LightCurveReader.read(file("lc.csv", "time,flux\n1,0.0\n2,-0.004\n3,0.01\n4,0.02\n"
                + "5,0.015\n"), ReadOptions.defaults());
        assertThat(lc.fluxes()).containsExactly(0.0, -0.004, 0.01, 0.02, 0.015);
    }

    @Test
    void severalBandsAreReadApartAndRefusedAsOne() throws IOException {
        Path p = file("multi.csv", "time,filter,mag,err\n1,V,10,0.01\n1.5,B,10.5,0.01\n2,V,10.1,0.01\n"
                + "2.5,B,10.6,0.01\n3,V,10.2,0.01\n");
        Map<String, LightCurve> bands = LightCurveReader.readBands(p, ReadOptions.defaults());
        assertThat(bands).containsOnlyKeys("V", "B");
        assertThat(bands.get("V").timesDays()).containsExactly(1, 2, 3);
        assertThat(bands.get("B").band()).isEqualTo("B");
        assertThatThrownBy(() -> LightCurveReader.read(p, ReadOptions.defaults()))
                .isInstanceOf(BadInputException.class)
                .hasMessageContaining("multi.csv").hasMessageContaining("2 bands")
                .hasMessageContaining("V (3 points)").hasMessageContaining("B (2 points)");
    }

    @Test
    void oneBandGivesItsLabel() throws IOException {
        LightCurve lc = LightCurveReader.read(file("lc.csv", "time,band,flux\n1,Rc,1\n2,Rc,1\n"),
                ReadOptions.defaults());
        assertThat(lc.band()).isEqualTo("Rc");
    }

    @Test
    void bandsMayEachBeSortedOnTheirOwn() throws IOException {
        Path p = file("lc.csv", "time,band,flux\n1,V,1\n2,V,1\n1,B,1\n2,B,1\n");
        assertThat(LightCurveReader.readBands(p, ReadOptions.defaults())).hasSize(2);
    }

    @Test
    void theInputFileIsNotChanged() throws IOException {
        Path p = file("lc.csv", "time,flux\n1,1\n2,0.9\n");
        byte[] before = Files.readAllBytes(p);
        long modified = Files.getLastModifiedTime(p).toMillis();
        LightCurveReader.read(p, ReadOptions.defaults());
        assertThat(Files.readAllBytes(p)).isEqualTo(before);
        assertThat(Files.getLastModifiedTime(p).toMillis()).isEqualTo(modified);
    }

    @Test
    void aCommentLineThatNamesNoColumnsIsNotAHeader() throws IOException {
        Path p = file("lc.txt", "# clear sky tonight\n1.0 0.99 0.01\n2.0 1.01 0.01\n");
        LightCurve lc = LightCurveReader.read(p, ReadOptions.defaults());
        assertThat(lc.fluxes()).containsExactly(0.99, 1.01);
        assertThat(lc.fluxErrors()).containsExactly(0.01, 0.01);
    }

    @Test
    void quotedFieldsFortranExponentsAndTextNanAreRead() throws IOException {
        Path p = file("lc.csv", "\"time\",\"flux\",\"band\"\n\"1.0\",9.9D-01,\"V\"\n2.0,NaN,\"V\"\n3.0,1.0E+00,V\n");
        LightCurve lc = LightCurveReader.read(p, ReadOptions.defaults());
        assertThat(lc.fluxes()).containsExactly(0.99, 1.0);
        assertThat(lc.band()).isEqualTo("V");
        assertThat(lc.rejectedRows()).containsEntry("NaN or infinite", 1);
    }

    @Test
    void rowsWithoutTheirBandCountInEveryBand() throws IOException {
        Path p = file("lc.csv", "time,band,flux\n1,B,1\n2,V,1\n3,,1\n4,B,1\n5,V,1\n");
        Map<String, LightCurve> bands = LightCurveReader.readBands(p, ReadOptions.defaults());
        assertThat(bands.get("B").rejectedRows()).containsEntry("missing field", 1);
        assertThat(bands.get("V").rejectedRows()).containsEntry("missing field", 1);
    }
}
