package org.twinlight.time;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.data.Offset.offset;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.twinlight.BadInputException;

class TimeConverterTest {

    private static final TimeScale JD_TDB = TimeScale.parse("JD_TDB").orElseThrow();
    private static final TimeScale HJD_TDB = TimeScale.parse("HJD_TDB").orElseThrow();
    private static final double FIRST_JD = 2447892.5;   // 1990 Jan 1
    private static final double LAST_JD = 2464328.5;    // 2035 Jan 1

    /** Every known scale: 3 references × 4 standards × JD/MJD numbering. */
    private static List<TimeScale> allScales() {
        List<TimeScale> scales = new ArrayList<>();
        for (TimeReference r : TimeReference.values()) {
            for (TimeStandard s : TimeStandard.values()) {
                scales.add(new TimeScale(r, s, false));
                scales.add(new TimeScale(r, s, true));
            }
        }
        return scales;
    }

    @Test
    void everyPairRoundTripsWithinAMicrosecond() {
        // Round trips A → B → A over 1990–2035 and random sky positions (uniform on the sphere).
        Random random = new Random(7);
        List<TimeScale> scales = allScales();
        for (int k = 0; k < 12; k++) {
            double jd = FIRST_JD + random.nextDouble() * (LAST_JD - FIRST_JD);
            SkyDirection dir = new SkyDirection(random.nextDouble() * 360,
                    Math.toDegrees(Math.asin(2 * random.nextDouble() - 1)));
            for (TimeScale a : scales) {
                JulianDate date = JulianDate.of(jd, a.asJulianDays());
                for (TimeScale b : scales) {
                    JulianDate there = TimeConverter.convert(date, b, dir);
                    assertThat(there.scale()).isEqualTo(b.asJulianDays());
                    JulianDate back = TimeConverter.convert(there, a, dir);
                    assertThat(Math.abs(back.secondsSince(date))).as("%s → %s → %s", a, b, a).isLessThan(1e-6);
                }
            }
        }
    }

    @Test
    void heliocentricCorrectionAgreesWithTheClassicalFormula() {
        // Binnendijk's formula as quoted by Masi (vsnet-chat 1083):
        // HC = −0.0057755 d [R cosθ cosα cosδ + R sinθ (sinε sinδ + cosε cosδ sinα)], with R and θ from
        // Meeus's low-precision Sun (ch. 25) referred to J2000, ε the J2000 obliquity. Expected to agree
        // to ~1 s; the Sun's 0.01° accuracy allows ~0.1 s, which is the tolerance used.
        Random random = new Random(11);
        double eps = SolarSystemEphemeris.OBLIQUITY_J2000_RAD;
        for (int k = 0; k < 300; k++) {
            double jd = FIRST_JD + random.nextDouble() * (LAST_JD - FIRST_JD);
            double ra = Math.toRadians(random.nextDouble() * 360);
            double dec = Math.asin(2 * random.nextDouble() - 1);
            MeeusLowPrecisionSun sun = new MeeusLowPrecisionSun(jd);
            double theta = Math.toRadians(sun.trueLongitudeJ2000Deg());
            double r = sun.radiusAu;
            double hcDays = -0.0057755 * (r * Math.cos(theta) * Math.cos(ra) * Math.cos(dec)
                    + r * Math.sin(theta) * (Math.sin(eps) * Math.sin(dec) + Math.cos(eps) * Math.cos(dec) * Math.sin(ra)));
            SkyDirection dir = new SkyDirection(Math.toDegrees(ra), Math.toDegrees(dec));
            JulianDate tdb = JulianDate.of(jd, JD_TDB);
            double ours = TimeConverter.convert(tdb, HJD_TDB, dir).secondsSince(tdb);
            assertThat(ours).isCloseTo(hcDays * 86400, offset(0.1));
        }
    }

    @Test
    void heliocentricCorrectionPeaksNearOneAuOfLightTimesCosBeta() {
        // |HJD − JD| ≤ 1 au/c = 8.3 min (Eastman, Siverd & Gaudi 2010, PASP 122, 935), scaled by the
        // Earth–Sun distance 1 ± 0.0167 au (Meeus 1998 eq. 25.4, e = 0.0167) and by cos β for a target at
        // ecliptic latitude β.
        double eps = SolarSystemEphemeris.OBLIQUITY_J2000_RAD;
        for (double betaDeg : new double[] {0, 30, 60, 85}) {
            for (double lambdaDeg = 0; lambdaDeg < 360; lambdaDeg += 45) {
                double beta = Math.toRadians(betaDeg);
                double lambda = Math.toRadians(lambdaDeg);
                // ecliptic → equatorial (J2000)
                double x = Math.cos(beta) * Math.cos(lambda);
                double y = Math.cos(beta) * Math.sin(lambda) * Math.cos(eps) - Math.sin(beta) * Math.sin(eps);
                double z = Math.cos(beta) * Math.sin(lambda) * Math.sin(eps) + Math.sin(beta) * Math.cos(eps);
                double ra = Math.toDegrees(Math.atan2(y, x));
                SkyDirection dir = new SkyDirection(ra < 0 ? ra + 360 : ra, Math.toDegrees(Math.asin(z)));
                double peak = 0;
                for (double jd = 2460310.5; jd < 2460310.5 + 366; jd += 0.25) {
                    JulianDate utc = JulianDate.of(jd, TimeScale.JD_UTC);
                    peak = Math.max(peak, Math.abs(TimeConverter.convert(utc, TimeScale.HJD_UTC, dir).secondsSince(utc)));
                }
                double expected = LightTime.AU_LIGHT_TIME_SECONDS * Math.cos(beta);
                assertThat(peak).as("β = %s°, λ = %s°", betaDeg, lambdaDeg)
                        .isBetween(expected * 0.983 - 0.5, expected * 1.0168 + 0.5);
                // 8.3 min is the rounded 1 au/c = 499.0 s; at aphelion the Earth is 1.0167 au from the Sun.
                assertThat(peak).isLessThan(499.005 * 1.0168);
            }
        }
    }

    @Test
    void barycentricAndHeliocentricTimesDifferByAFewSeconds() {
        // BJD − HJD on one clock is (r☉ · n̂)/c: "of the order of 4/5 secs" (Masi, vsnet-chat 1083) and
        // "up to ±4 s" (Eastman, Siverd & Gaudi 2010, PASP 122, 935, and the authors' explanation pages). The Sun's barycentric distance
        // reaches about 0.0102 au (5.1 s) at most.
        Random random = new Random(3);
        double worst = 0;
        for (int k = 0; k < 2000; k++) {
            double jd = FIRST_JD + random.nextDouble() * (LAST_JD - FIRST_JD);
            SkyDirection dir = new SkyDirection(random.nextDouble() * 360,
                    Math.toDegrees(Math.asin(2 * random.nextDouble() - 1)));
            JulianDate hjd = JulianDate.of(jd, HJD_TDB);
            double diff = TimeConverter.convert(hjd, TimeScale.BJD_TDB, dir).secondsSince(hjd);
            worst = Math.max(worst, Math.abs(diff));
        }
        assertThat(worst).isBetween(3.0, 5.1);
    }

    @Test
    void bjdTdbMinusHjdUtcIncludesTheClockDifference() {
        // After 2017: TDB − UTC = 69.184 s + (TDB − TT) (≤ 1.7 ms), plus BJD − HJD (≤ 5.1 s).
        SkyDirection dir = new SkyDirection(120, -30);
        for (double jd = 2458000.5; jd < 2462000.5; jd += 50.5) {
            JulianDate hjd = JulianDate.of(jd, TimeScale.HJD_UTC);
            double diff = TimeConverter.convert(hjd, TimeScale.BJD_TDB, dir).secondsSince(hjd);
            assertThat(diff).isBetween(69.184 - 5.2, 69.184 + 5.2);
        }
    }

    @Test
    void directionIsNeededOnlyForHeliocentricOrBarycentricChanges() {
        TimeScale mjdUtc = TimeScale.parse("MJD_UTC").orElseThrow();
        TimeScale bmjdTdb = TimeScale.parse("BMJD_TDB").orElseThrow();
        assertThat(TimeConverter.needsDirection(TimeScale.JD_UTC, JD_TDB)).isFalse();
        assertThat(TimeConverter.needsDirection(TimeScale.BJD_TDB, bmjdTdb)).isFalse();
        assertThat(TimeConverter.needsDirection(TimeScale.JD_UTC, TimeScale.HJD_UTC)).isTrue();
        assertThat(TimeConverter.needsDirection(TimeScale.HJD_UTC, HJD_TDB)).isTrue();
        assertThat(TimeConverter.convert(60000.5, mjdUtc, TimeScale.JD_UTC, null)).isEqualTo(2460001.0);
        assertThatThrownBy(() -> TimeConverter.convert(2460000.5, TimeScale.JD_UTC, TimeScale.BJD_TDB, null))
                .hasMessageContaining("right ascension");
    }

    @Test
    void datesOutsideTheEphemerisRangeAreRefused() {
        // A time given as BJD − 2457000 must not be corrected as if it were a full Julian date.
        SkyDirection dir = new SkyDirection(10, 10);
        assertThatThrownBy(() -> TimeConverter.convert(1500.25, TimeScale.BJD_TDB, TimeScale.JD_UTC, dir))
                .isInstanceOf(BadInputException.class)
                .hasMessageContaining("1800–2050")
                .hasMessageContaining("2457000");
    }
}
