package org.twinlight.photometry;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.twinlight.BadInputException;
import org.twinlight.time.TimeReference;
import org.twinlight.time.TimeScale;
import org.twinlight.time.TimeStandard;

class FitsTableReaderTest {

    @TempDir
    Path dir;

    /** A spacecraft-style table: times in days after a barycentric reference JD split in two keywords. */
    private static FitsFixture.Table barycentricTable() {
        return new FitsFixture.Table()
                .column("TIME", new double[] {1000.0, 1000.5, 1001.0, 1001.5, 1002.0})
                .column("SAP_FLUX", new float[] {900f, 901f, 899f, 902f, 900f})
                .column("PDCSAP_FLUX", new float[] {1000f, 1001f, Float.NaN, 998f, 1002f})
                .column("PDCSAP_FLUX_ERR", new float[] {1f, 1f, 1f, 1f, 1f})
                .column("QUALITY", new int[] {0, 0, 0, 128, 0})
                .key("EXTNAME", "LIGHTCURVE")
                .key("TIMESYS", "TDB").key("TIMEREF", "SOLARSYSTEM").key("TIMEUNIT", "d")
                .key("BJDREFI", 2457000).key("BJDREFF", 0.25);
    }

    private Path write(String name, FitsFixture fixture) throws IOException {
        Path p = dir.resolve(name);
        fixture.write(p);
        return p;
    }

    @Test
    void barycentricTableGivesAbsoluteBjdTdbAndCountsFlagsAndGaps() throws IOException {
        Path p = write("lc.fits", new FitsFixture().table(barycentricTable()));
        byte[] before = Files.readAllBytes(p);
        LightCurve lc = LightCurveReader.read(p, ReadOptions.defaults());
        // Rots et al. 2015 (A&A 574, A36): JD = reference + (TIMEZERO + value) x unit.
        assertThat(lc.timesDays()).containsExactly(2458000.25, 2458000.75, 2458002.25);
        assertThat(lc.timeScale()).isEqualTo(TimeScale.BJD_TDB);
        // PDCSAP_FLUX is preferred over SAP_FLUX, and its own _ERR column is the error.
        assertThat(lc.fluxes()).containsExactly(1000, 1001, 1002);
        assertThat(lc.fluxErrors()).containsExactly(1, 1, 1);
        assertThat(lc.rejectedRows()).containsEntry("quality flag set", 1).containsEntry("NaN or infinite", 1);
        assertThat(lc.originalKind()).isEqualTo(ValueKind.FLUX);
        assertThat(Files.readAllBytes(p)).isEqualTo(before);
    }

    @Test
    void splitMjdReferenceInSecondsWithTimeZero() throws IOException {
        FitsFixture.Table t = new FitsFixture.Table()
                .column("TIME", new double[] {0.0, 43200.0, 86400.0})
                .column("FLUX", new double[] {1, 2, 3})
                .key("TIMESYS", "TT").key("TIMEREF", "GEOCENTER")
                .key("MJDREFI", 59000).key("MJDREFF", 0.125)
                .key("TIMEUNIT", "s").key("TIMEZERO", 3600.0);
        LightCurve lc = LightCurveReader.read(write("mjd.fits", new FitsFixture().table(t)), ReadOptions.defaults());
        // MJD = JD - 2400000.5 (IAU; Rots et al. 2015, sect. 4.1.2): MJD 59000.125 + 1 h = JD 2459000.625 + 1/24.
        double start = 2459000.625 + 1.0 / 24;
        assertThat(lc.time(0)).isCloseTo(start, within(1e-9));
        assertThat(lc.time(1)).isCloseTo(start + 0.5, within(1e-9));
        assertThat(lc.time(2)).isCloseTo(start + 1.0, within(1e-9));
        assertThat(lc.timeScale()).isEqualTo(new TimeScale(TimeReference.GEOCENTRIC, TimeStandard.TT, false));
        assertThat(lc.hasErrors()).isFalse();
    }

    @Test
    void columnUnitOverridesTimeUnitAndHeliocentricJdRef() throws IOException {
        FitsFixture.Table t = new FitsFixture.Table()
                .column("TIME", new double[] {0.0, 30.0})
                .column("MAG", new double[] {10.0, 10.5})
                .column("MAG_ERR", new double[] {0.01, 0.02})
                .key("TUNIT1", "min").key("TIMEUNIT", "s")
                .key("TIMESYS", "UTC").key("TIMEREF", "HELIOCENTER").key("JDREF", 2450000.5);
        LightCurve lc = LightCurveReader.read(write("hjd.fits", new FitsFixture().table(t)), ReadOptions.defaults());
        assertThat(lc.time(0)).isEqualTo(2450000.5);
        assertThat(lc.time(1)).isCloseTo(2450000.5 + 30.0 / 1440, within(1e-9));
        assertThat(lc.timeScale()).isEqualTo(TimeScale.HJD_UTC);
        assertThat(lc.originalKind()).isEqualTo(ValueKind.MAGNITUDE);
        assertThat(lc.flux(0)).isCloseTo(1e-4, within(1e-18));
    }

    @Test
    void dateReferenceIsTheJulianDateOfTheCalendarDate() throws IOException {
        FitsFixture.Table t = new FitsFixture.Table()
                .column("TIME", new double[] {0.0, 1.0})
                .column("FLUX", new double[] {1, 1})
                .key("TIMESYS", "TT").key("DATEREF", "2000-01-01T12:00:00").key("TIMEUNIT", "d");
        LightCurve lc = LightCurveReader.read(write("date.fits", new FitsFixture().table(t)), ReadOptions.defaults());
        // J2000.0 = 2000 January 1, 12h TT = JD 2451545.0 (IAU 1976; Explanatory Supplement 1992, sect. 2.26).
        assertThat(lc.time(0)).isEqualTo(2451545.0);
        assertThat(lc.time(1)).isEqualTo(2451546.0);
    }

    private LightCurve readWithKeys(String name, String... keysAndValues) throws IOException {
        FitsFixture.Table t = new FitsFixture.Table()
                .column("TIME", new double[] {0.0, 1.0})
                .column("FLUX", new double[] {1, 1})
                .key("TIMEUNIT", "d").key("MJDREF", 60000.0);
        for (int i = 0; i < keysAndValues.length; i += 2) {
            t.key(keysAndValues[i], keysAndValues[i + 1]);
        }
        return LightCurveReader.read(write(name, new FitsFixture().table(t)), ReadOptions.defaults());
    }

    @ParameterizedTest
    @ValueSource(strings = {"2023-02-29", "2023-02-30T99:00:00", "2023-13-01", "2023-04-31T00:00:00",
        "2023-01-01T23:60:00", "2023-01-01T12:00:61"})
    void anImpossibleDateReferenceIsRefusedNotRolledOver(String date) throws IOException {
        FitsFixture.Table t = new FitsFixture.Table()
                .column("TIME", new double[] {0.0, 1.0})
                .column("FLUX", new double[] {1, 1})
                .key("TIMESYS", "TT").key("DATEREF", date).key("TIMEUNIT", "d");
        Path p = write("bad-date.fits", new FitsFixture().table(t));
        assertThatThrownBy(() -> LightCurveReader.read(p, ReadOptions.defaults()))
                .isInstanceOf(BadInputException.class).hasMessageContaining("key 'DATEREF'")
                .hasMessageContaining(date);
    }

    @Test
    void aLeapDayAndALeapSecondAreValidDateReferences() throws IOException {
        // 2024 is a Gregorian leap year; 2016-12-31T23:59:60 UTC was a leap second (IERS Bulletin C 52)
        FitsFixture.Table t = new FitsFixture.Table()
                .column("TIME", new double[] {0.0, 1.0})
                .column("FLUX", new double[] {1, 1})
                .key("TIMESYS", "TT").key("DATEREF", "2024-02-29").key("TIMEUNIT", "d");
        LightCurve lc = LightCurveReader.read(write("leap.fits", new FitsFixture().table(t)), ReadOptions.defaults());
        // independent: java.time's day count from 1970-01-01, whose 0 h is JD 2440587.5 (Explanatory
        // Supplement 1992, table 15.3: the Julian date of the Unix epoch)
        assertThat(lc.time(0)).isEqualTo(java.time.LocalDate.of(2024, 2, 29).toEpochDay() + 2440587.5);
        t.key("DATEREF", "2016-12-31T23:59:60");
        assertThat(LightCurveReader.read(write("leap-second.fits", new FitsFixture().table(t)), ReadOptions.defaults())
                .size()).isEqualTo(2);
    }

    @Test
    void theStandardsReferencePositionKeywordGivesBarycentricTimes() throws IOException {
        // Rots et al. 2015 (A&A 574, A36), sect. 4.2: TREFPOS = 'BARYCENTER' with TIMESYS = 'TDB' is BJD_TDB
        assertThat(readWithKeys("trefpos.fits", "TIMESYS", "TDB", "TREFPOS", "BARYCENTER").timeScale())
                .isEqualTo(TimeScale.BJD_TDB);
        assertThat(readWithKeys("helio.fits", "TIMESYS", "UTC", "TREFPOS", "HELIOCENTER").timeScale())
                .isEqualTo(TimeScale.parse("HJD_UTC").orElseThrow());
        // the older keyword alone, and both when they agree
        assertThat(readWithKeys("timeref.fits", "TIMESYS", "TDB", "TIMEREF", "SOLARSYSTEM").timeScale())
                .isEqualTo(TimeScale.BJD_TDB);
        assertThat(readWithKeys("both.fits", "TIMESYS", "TDB", "TREFPOS", "BARYCENTER", "TIMEREF", "SOLARSYSTEM")
                .timeScale()).isEqualTo(TimeScale.BJD_TDB);
    }

    @Test
    void contradictoryOrUnknownTimeKeywordsAreRefused() {
        assertThatThrownBy(() -> readWithKeys("clash.fits", "TIMESYS", "TDB", "TREFPOS", "BARYCENTER", "TIMEREF",
                "LOCAL")).isInstanceOf(BadInputException.class).hasMessageContaining("key 'TREFPOS'")
                .hasMessageContaining("contradicts the older keyword TIMEREF");
        assertThatThrownBy(() -> readWithKeys("sys.fits", "TIMESYS", "BJD")).isInstanceOf(BadInputException.class)
                .hasMessageContaining("key 'TIMESYS'").hasMessageContaining("'BJD' is not a time scale");
        assertThatThrownBy(() -> readWithKeys("pos.fits", "TREFPOS", "MOON")).isInstanceOf(BadInputException.class)
                .hasMessageContaining("key 'TREFPOS'");
    }

    @Test
    void noTimeKeywordsLeavesTimesAsGivenAndScaleUnknown() throws IOException {
        FitsFixture.Table t = new FitsFixture.Table()
                .column("BJD", new double[] {2459000.1, 2459000.2})
                .column("FLUX", new double[] {1, 1})
                .key("TIMEUNIT", "d").key("FILTER", "Ic");
        LightCurve lc = LightCurveReader.read(write("plain.fits", new FitsFixture().table(t)), ReadOptions.defaults());
        assertThat(lc.timesDays()).containsExactly(2459000.1, 2459000.2);
        assertThat(lc.timeScale()).isEqualTo(TimeScale.UNKNOWN);
        assertThat(lc.band()).isEqualTo("Ic");
    }

    @Test
    void declaredScaleOverridesAndMjdFormIsNumberedAsMjd() throws IOException {
        Path p = write("lc.fits", new FitsFixture().table(barycentricTable()));
        TimeScale bmjd = TimeScale.parse("BMJD_TDB").orElseThrow();
        LightCurve lc = LightCurveReader.read(p, ReadOptions.defaults().withTimeScale(bmjd));
        assertThat(lc.timeScale()).isEqualTo(bmjd);
        assertThat(lc.time(0)).isCloseTo(2458000.25 - 2400000.5, within(1e-9));
    }

    @Test
    void hduOptionChoosesTheTable() throws IOException {
        FitsFixture.Table second = new FitsFixture.Table()
                .column("TIME", new double[] {1, 2, 3}).column("FLUX", new double[] {7, 8, 9});
        Path p = write("two.fits", new FitsFixture().table(barycentricTable()).table(second));
        LightCurve lc = LightCurveReader.read(p, new ReadOptions(null, null, null, null, null, null, null, null, 2));
        assertThat(lc.fluxes()).containsExactly(7, 8, 9);
    }

    @Test
    void firstBinaryTableAfterAnImage() throws IOException {
        Path p = write("img.fits", new FitsFixture().image(new float[][] {{1, 2}, {3, 4}}).table(barycentricTable()));
        assertThat(LightCurveReader.read(p, ReadOptions.defaults()).size()).isEqualTo(3);
    }

    @Test
    void columnsChosenByNameAndNumber() throws IOException {
        Path p = write("lc.fits", new FitsFixture().table(barycentricTable()));
        LightCurve sap = LightCurveReader.read(p, new ReadOptions(null, "sap_flux", null, null, null, null, null, null,
                null));
        assertThat(sap.flux(0)).isEqualTo(900);
        assertThat(sap.hasErrors()).isFalse();
        LightCurve third = LightCurveReader.read(p, new ReadOptions("1", "3", "4", null, null, null, null, null, null));
        assertThat(third.fluxes()).containsExactly(1000, 1001, 1002);
    }

    @Test
    void unknownHduIsNamed() throws IOException {
        Path p = write("lc.fits", new FitsFixture().table(barycentricTable()));
        assertThatThrownBy(() -> LightCurveReader.read(p, new ReadOptions(null, null, null, null, null, null, null,
                null, 5))).isInstanceOf(BadInputException.class).hasMessageContaining("lc.fits")
                .hasMessageContaining("HDU 5").hasMessageContaining("no such HDU")
                .hasMessageContaining("HDU 1 a binary table (LIGHTCURVE)");
    }

    @Test
    void hduThatIsNotATable() throws IOException {
        Path p = write("lc.fits", new FitsFixture().table(barycentricTable()));
        assertThatThrownBy(() -> LightCurveReader.read(p, new ReadOptions(null, null, null, null, null, null, null,
                null, 0))).isInstanceOf(BadInputException.class).hasMessageContaining("HDU 0")
                .hasMessageContaining("expected a binary table");
    }

    @Test
    void fileWithoutTable() throws IOException {
        Path p = write("img.fits", new FitsFixture().image(new float[][] {{1, 2}, {3, 4}}));
        assertThatThrownBy(() -> LightCurveReader.read(p, ReadOptions.defaults()))
                .isInstanceOf(BadInputException.class).hasMessageContaining("img.fits")
                .hasMessageContaining("no binary table").hasMessageContaining("HDU 1 an image");
    }

    /** Cut inside the table's header, inside its data, and (from the end) inside its last data block. */
    @ParameterizedTest
    @ValueSource(ints = {2880 + 1000, -2880 + 10})
    void truncatedFile(int cut) throws IOException {
        Path whole = write("lc.fits", new FitsFixture().table(barycentricTable()));
        byte[] bytes = Files.readAllBytes(whole);
        Path cutFile = dir.resolve("cut.fits");
        Files.write(cutFile, Arrays.copyOf(bytes, cut > 0 ? cut : bytes.length + cut));
        assertThatThrownBy(() -> LightCurveReader.read(cutFile, ReadOptions.defaults()))
                .isInstanceOf(BadInputException.class).hasMessageContaining("cut.fits")
                .hasMessageContaining("HDU 1").hasMessageContaining("truncated");
    }

    @Test
    void missingColumnListsTheColumns() throws IOException {
        FitsFixture.Table t = new FitsFixture.Table()
                .column("TIME", new double[] {1, 2}).column("COUNTS", new double[] {1, 1});
        Path p = write("cols.fits", new FitsFixture().table(t));
        assertThatThrownBy(() -> LightCurveReader.read(p, ReadOptions.defaults()))
                .isInstanceOf(BadInputException.class).hasMessageContaining("cols.fits").hasMessageContaining("HDU 1")
                .hasMessageContaining("no flux or magnitude column").hasMessageContaining("1 'TIME', 2 'COUNTS'");
    }

    @Test
    void unsortedRowsAreNamedWithTheirHdu() throws IOException {
        FitsFixture.Table t = new FitsFixture.Table()
                .column("TIME", new double[] {1, 2, 3, 2.5}).column("FLUX", new double[] {1, 1, 1, 1});
        Path p = write("unsorted.fits", new FitsFixture().table(t));
        assertThatThrownBy(() -> LightCurveReader.read(p, ReadOptions.defaults()))
                .isInstanceOf(BadInputException.class).hasMessageContaining("unsorted.fits")
                .hasMessageContaining("rows 3 and 4 of HDU 1").hasMessageContaining("column 'TIME'");
    }

    @Test
    void badTimeUnitNamesTheKey() throws IOException {
        FitsFixture.Table t = new FitsFixture.Table()
                .column("TIME", new double[] {1, 2}).column("FLUX", new double[] {1, 1})
                .key("TIMEUNIT", "fortnight").key("MJDREF", 50000.0);
        Path p = write("unit.fits", new FitsFixture().table(t));
        assertThatThrownBy(() -> LightCurveReader.read(p, ReadOptions.defaults()))
                .isInstanceOf(BadInputException.class).hasMessageContaining("unit.fits")
                .hasMessageContaining("HDU 1, key 'TIMEUNIT'").hasMessageContaining("fortnight");
    }

    @Test
    void vectorColumnIsRefused() throws IOException {
        FitsFixture.Table t = new FitsFixture.Table()
                .column("TIME", new double[] {1, 2}).column("FLUX", new double[][] {{1, 2}, {3, 4}});
        Path p = write("vec.fits", new FitsFixture().table(t));
        assertThatThrownBy(() -> LightCurveReader.read(p, ReadOptions.defaults()))
                .isInstanceOf(BadInputException.class).hasMessageContaining("column 'FLUX'")
                .hasMessageContaining("single numbers");
    }

    @Test
    void scaledIntegerColumnsAndNullValues() throws IOException {
        // FITS standard 4.0 (Pence et al. 2010, A&A 524, A42), sect. 7.3.2: physical = TZEROn + TSCALn x stored;
        // a stored value equal to TNULLn is undefined.
        FitsFixture.Table t = new FitsFixture.Table()
                .column("TIME", new double[] {1, 2, 3})
                .column("FLUX", new short[] {-32768, 100, 7})
                .key("TZERO2", 32768).key("TSCAL2", 0.5).key("TNULL2", 7);
        LightCurve lc = LightCurveReader.read(write("scaled.fits", new FitsFixture().table(t)), ReadOptions.defaults());
        assertThat(lc.fluxes()).containsExactly(16384.0, 32818.0);
        assertThat(lc.rejectedRows()).containsEntry("NaN or infinite", 1);
    }

    @Test
    void clockWithoutReferenceTakesMjdZeroUnlessTimesAreFullJulianDates() throws IOException {
        // Rots et al. 2015, sect. 4.1.2: without a reference keyword MJDREF = 0 (from memory).
        FitsFixture.Table mjd = new FitsFixture.Table()
                .column("TIME", new double[] {59000.0, 59000.5}).column("FLUX", new double[] {1, 1})
                .key("TIMESYS", "UTC").key("TIMEUNIT", "d");
        LightCurve a = LightCurveReader.read(write("mjd.fits", new FitsFixture().table(mjd)), ReadOptions.defaults());
        assertThat(a.timesDays()).containsExactly(2459000.5, 2459001.0);
        assertThat(a.timeScale()).isEqualTo(TimeScale.JD_UTC);
        FitsFixture.Table jd = new FitsFixture.Table()
                .column("TIME", new double[] {2459000.5, 2459001.0}).column("FLUX", new double[] {1, 1})
                .key("TIMESYS", "UTC").key("TIMEREF", "HELIOCENTER").key("TIMEUNIT", "d");
        LightCurve b = LightCurveReader.read(write("jd.fits", new FitsFixture().table(jd)), ReadOptions.defaults());
        assertThat(b.timesDays()).containsExactly(2459000.5, 2459001.0);
        assertThat(b.timeScale()).isEqualTo(TimeScale.HJD_UTC);
    }

    @Test
    void otherClocksGiveJulianDatesOfUnknownScale() throws IOException {
        FitsFixture.Table t = new FitsFixture.Table()
                .column("TIME", new double[] {0.0, 1.0}).column("FLUX", new double[] {1, 1})
                .key("TIMESYS", "TCB").key("TIMEREF", "SOLARSYSTEM").key("MJDREF", 50000.0).key("TIMEUNIT", "d");
        LightCurve lc = LightCurveReader.read(write("tcb.fits", new FitsFixture().table(t)), ReadOptions.defaults());
        assertThat(lc.timesDays()).containsExactly(2450000.5, 2450001.5);
        assertThat(lc.timeScale()).isEqualTo(TimeScale.UNKNOWN);
    }
}
