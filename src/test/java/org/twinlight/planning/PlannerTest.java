package org.twinlight.planning;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.time.LocalDate;
import java.util.List;
import org.apache.commons.math3.linear.MatrixUtils;
import org.apache.commons.math3.linear.RealMatrix;
import org.junit.jupiter.api.Test;
import org.twinlight.BadInputException;
import org.twinlight.eclipse.BinaryParameters;
import org.twinlight.sky.Site;
import org.twinlight.time.JulianDate;
import org.twinlight.time.SkyDirection;
import org.twinlight.time.TimeConverter;
import org.twinlight.time.TimeScale;
import org.twinlight.timing.Ephemeris;
import org.twinlight.timing.MinimumType;

class PlannerTest {

    /** A fictional site at 50° N, 10° E, 300 m. */
    private static final Site SITE = new Site(50, 10, 300);
    private static final SkyDirection STAR = new SkyDirection(120.0, 40.0);
    private static final DateRange MARCH = DateRange.of(LocalDate.of(2027, 3, 1), LocalDate.of(2027, 4, 1), false);

    private static PlanningTarget target(String name, PredictionEphemeris eph) {
        return new PlanningTarget(name, STAR, eph, EclipseExtent.ofDuration(0.15, "--duration 3.6h"));
    }

    @Test
    void cycleZeroReproducesTheEphemerisExactly() {
        double epoch = 2461470.3172;
        PredictionEphemeris eph = PredictionEphemeris.of(epoch, 1.7341, 2e-4, 3e-6, TimeScale.BJD_TDB);
        assertThat(eph.timeOf(0, MinimumType.PRIMARY)).isEqualTo(epoch);
        assertThat(eph.errorDays(0)).isEqualTo(2e-4);
        Plan plan = Planner.plan(List.of(target("A", eph)), SITE, MARCH, ObservingLimits.DEFAULT);
        Prediction zero = plan.predictions().stream().filter(p -> p.cycle() == 0).findFirst().orElseThrow();
        assertThat(zero.minimumOwnScale()).isEqualTo(epoch);
        // back from UTC at the geocentre to BJD_TDB: the same instant to a microsecond
        double back = TimeConverter.convert(zero.minimum().utc(), TimeScale.BJD_TDB, STAR).jd();
        assertThat((back - epoch) * 86400).isCloseTo(0, within(1e-3));
    }

    // The light-time correction undone: HJD − JD = −(1 au/c)·[R cos θ cos α cos δ + R sin θ (sin ε sin δ
    // + cos ε cos δ sin α)] (Binnendijk's classical formula, as quoted in /work/shared/REFERENCE-VALUES.md
    // §3; θ the Sun's longitude, R its distance). The compact formula is good to about a second.
    // Without undoing the correction the error would be up to 499 s.
    @Test
    void heliocentricMinimaAreMovedToTheEarthByTheClassicalCorrection() {
        double epoch = 2461470.3172;
        PredictionEphemeris eph = PredictionEphemeris.of(epoch, 1.7341, 0, 0, TimeScale.HJD_UTC);
        Prediction zero = Planner.plan(List.of(target("A", eph)), SITE, MARCH, ObservingLimits.DEFAULT)
                .predictions().stream().filter(p -> p.cycle() == 0).findFirst().orElseThrow();
        double jd = zero.minimum().utc().jd();
        // the Sun's geometric longitude and distance, Meeus 1998 ch. 25 low-accuracy formulae
        double t = (jd - 2451545.0) / 36525;
        double l0 = 280.46646 + 36000.76983 * t;
        double m = Math.toRadians(357.52911 + 35999.05029 * t);
        double e = 0.016708634;
        double c = 1.914602 * Math.sin(m) + 0.019993 * Math.sin(2 * m) + 0.000289 * Math.sin(3 * m);
        // referred to the J2000 equinox like the star: Meeus 1998 ch. 25, θ₂₀₀₀ = θ − 0.01397°·(years from 2000)
        double theta = Math.toRadians(l0 + c - 1.397 * t);
        double nu = m + Math.toRadians(c);
        double r = 1.000001018 * (1 - e * e) / (1 + e * Math.cos(nu));
        double eps = Math.toRadians(23.4392911);
        double a = Math.toRadians(STAR.raDeg());
        double d = Math.toRadians(STAR.decDeg());
        double hc = -0.0057755 * (r * Math.cos(theta) * Math.cos(a) * Math.cos(d)
                + r * Math.sin(theta) * (Math.sin(eps) * Math.sin(d) + Math.cos(eps) * Math.cos(d) * Math.sin(a)));
        assertThat((epoch - hc - jd) * 86400).isCloseTo(0, within(1.0));
    }

    // σ² = σ_T0² + E²σ_P² + 2E cov(T0, P): the variance of T0 + E·P, computed here as J Σ Jᵀ with
    // Commons Math matrices (Bevington & Robinson 2003, eq. 3.13).
    @Test
    void errorIsPropagatedFromTheCovariance() {
        double sT = 3e-4;
        double sP = 2e-6;
        double cov = -0.6 * sT * sP;
        PredictionEphemeris eph = new PredictionEphemeris(new Ephemeris(2461465.3, 1.2), sT, sP, cov,
                TimeScale.BJD_TDB, 0.5);
        RealMatrix sigma = MatrixUtils.createRealMatrix(new double[][] {{sT * sT, cov}, {cov, sP * sP}});
        for (double cycle : new double[] {-500.5, -3, 0.5, 17, 2000, 12345.5}) {
            RealMatrix j = MatrixUtils.createRowRealMatrix(new double[] {1, cycle});
            double expected = Math.sqrt(j.multiply(sigma).multiply(j.transpose()).getEntry(0, 0));
            assertThat(eph.errorDays(cycle)).isCloseTo(expected, within(1e-12 + 1e-9 * expected));
        }
        assertThat(eph.errorDays(10000)).isGreaterThan(eph.errorDays(1000));
    }

    @Test
    void largeErrorsAreFlaggedPastATenthOfTheEclipse() {
        // σ_P = 1e-5 d over ~1000 cycles: ~0.01 d, above a tenth of 0.15 d only for E > 1500
        PredictionEphemeris eph = PredictionEphemeris.of(2461470.3172 - 1.7341 * 2000, 1.7341, 0, 1e-5,
                TimeScale.BJD_TDB);
        Plan plan = Planner.plan(List.of(target("A", eph)), SITE, MARCH, ObservingLimits.DEFAULT);
        assertThat(plan.predictions()).allSatisfy(p -> {
            assertThat(p.errorExceedsTenthOfEclipse()).isEqualTo(p.errorDays() > 0.015);
            assertThat(p.errorExceedsTenthOfEclipse()).isTrue();
            assertThat(p.reason()).contains("exceeds a tenth of the eclipse");
        });
        assertThat(plan.notes()).anySatisfy(n -> assertThat(n).contains("A: the 1σ timing error exceeds"));
    }

    @Test
    void verdictsAgreeWithTheSkyAtContactsAndMinimum() {
        PredictionEphemeris eph = PredictionEphemeris.of(2461470.3172, 0.8341, 1e-4, 1e-6, TimeScale.BJD_TDB);
        Plan plan = Planner.plan(List.of(target("A", eph)), SITE, MARCH, ObservingLimits.DEFAULT);
        // one minimum per 0.417 d over 31 days
        assertThat(plan.predictions()).hasSizeBetween(72, 76);
        assertThat(plan.predictions()).extracting(Prediction::verdict).contains(Verdict.WHOLE, Verdict.NOT_OBSERVABLE);
        for (Prediction p : plan.predictions()) {
            boolean minOk = p.minimum().sunAltitudeDeg() <= -12 && p.minimum().target().altitudeDeg() >= 30;
            boolean startOk = p.start().sunAltitudeDeg() <= -12 && p.start().target().altitudeDeg() >= 30;
            boolean endOk = p.end().sunAltitudeDeg() <= -12 && p.end().target().altitudeDeg() >= 30;
            if (p.verdict() == Verdict.WHOLE) {
                assertThat(minOk && startOk && endOk).as(p.toString()).isTrue();
            } else if (p.verdict() == Verdict.PARTIAL) {
                assertThat(minOk && (startOk || endOk) && !(startOk && endOk)).as(p.toString()).isTrue();
            } else if (!minOk) {
                assertThat(p.reason()).endsWith("at minimum");
            }
            assertThat(p.end().utc().jd() - p.start().utc().jd()).isCloseTo(0.15, within(1e-9));
            assertThat(p.moon().illuminatedFraction()).isBetween(0.0, 1.0);
        }
    }

    @Test
    void observableOnlyKeepsWholeAndPartial() {
        PredictionEphemeris eph = PredictionEphemeris.of(2461470.3172, 0.8341, 1e-4, 1e-6, TimeScale.BJD_TDB);
        Plan plan = Planner.plan(List.of(target("A", eph)), SITE, MARCH, ObservingLimits.DEFAULT).observableOnly();
        assertThat(plan.predictions()).isNotEmpty().allSatisfy(p -> assertThat(p.verdict().observable()).isTrue());
    }

    @Test
    void overlappingObservableEclipsesOfTwoTargetsAreMarkedAsClashes() {
        PredictionEphemeris eph = PredictionEphemeris.of(2461470.3172, 0.8341, 1e-4, 1e-6, TimeScale.BJD_TDB);
        PredictionEphemeris shifted = PredictionEphemeris.of(2461470.3172 + 0.05, 0.8341, 1e-4, 1e-6,
                TimeScale.BJD_TDB);
        Plan plan = Planner.plan(List.of(target("A", eph), target("B", shifted)), SITE, MARCH, ObservingLimits.DEFAULT);
        assertThat(plan.predictions()).isSortedAccordingTo(
                (x, y) -> Double.compare(x.minimum().utc().jd(), y.minimum().utc().jd()));
        List<Prediction> observable = plan.predictions().stream().filter(p -> p.verdict().observable()).toList();
        assertThat(observable).isNotEmpty();
        assertThat(observable).anySatisfy(p -> assertThat(p.clashes()).anySatisfy(c -> assertThat(c).startsWith("B ")));
        assertThat(plan.predictions()).filteredOn(p -> !p.verdict().observable())
                .allSatisfy(p -> assertThat(p.clashes()).isEmpty());
    }

    // Total duration of a circular-orbit eclipse between first and last contact:
    // T = (P/π) asin(√((r1 + r2)² − b²)/sin i), b = cos i in units of a (Winn 2010, "Transits and
    // Occultations", in Exoplanets, ed. Seager, eq. 14, with R*/a + Rp/a = r1 + r2).
    @Test
    void contactsOfACircularModelMatchTheClosedForm() {
        double p = 2.3;
        double r1 = 0.18;
        double r2 = 0.11;
        double inc = 84.0;
        BinaryParameters model = BinaryParameters.circular(p, 2461000.0, r1, r2, inc, 0.6);
        EclipseExtent extent = EclipseExtent.ofModel(model);
        double b = Math.cos(Math.toRadians(inc));
        double expected = p / Math.PI * Math.asin(Math.sqrt((r1 + r2) * (r1 + r2) - b * b) / Math.sin(Math.toRadians(inc)));
        assertThat(extent.durationDays(MinimumType.PRIMARY)).isCloseTo(expected, within(1e-6));
        assertThat(extent.durationDays(MinimumType.SECONDARY)).isCloseTo(expected, within(1e-6));
        assertThat(extent.primaryBeforeDays()).isCloseTo(extent.primaryAfterDays(), within(1e-6));
    }

    @Test
    void aModelWhoseStarsMissHasNoContacts() {
        BinaryParameters model = BinaryParameters.circular(2.3, 2461000.0, 0.05, 0.04, 70, 0.6);
        assertThatThrownBy(() -> EclipseExtent.ofModel(model)).isInstanceOf(BadInputException.class)
                .hasMessageContaining("no primary eclipse").hasMessageContaining("--duration");
    }

    @Test
    void badRangesAndSitesAreRefusedWithTheirReason() {
        LocalDate d = LocalDate.of(2027, 3, 1);
        assertThatThrownBy(() -> DateRange.of(d, d, false)).hasMessageContaining("empty");
        assertThatThrownBy(() -> DateRange.of(d, d.minusDays(1), false)).hasMessageContaining("reversed");
        assertThatThrownBy(() -> DateRange.of(d, d.plusYears(11), false)).hasMessageContaining("--force");
        assertThat(DateRange.of(d, d.plusYears(11), true).days()).isGreaterThan(4000);
        assertThatThrownBy(() -> Site.parse("91,10", "option --site")).isInstanceOf(BadInputException.class)
                .hasMessageContaining("latitude 91.0° is outside");
        assertThatThrownBy(() -> Site.parse("-90.5,10", "option --site")).hasMessageContaining("latitude");
        assertThat(Site.parse("-29:15:00,-70.73,2400", "x")).isEqualTo(new Site(-29.25, -70.73, 2400));
        assertThatThrownBy(() -> PredictionEphemeris.of(1, 2, 0, 0, TimeScale.UNKNOWN))
                .hasMessageContaining("no time scale");
    }

    @Test
    void rangesAtBothEndsOfTheEphemeridesArePlannedAndBeyondThemRefused() {
        PredictionEphemeris eph = PredictionEphemeris.of(2461470.3172, 0.8341, 1e-4, 1e-6, TimeScale.BJD_TDB);
        for (LocalDate start : new LocalDate[] {LocalDate.of(1972, 1, 2), LocalDate.of(2050, 12, 25)}) {
            DateRange r = DateRange.of(start, start.plusDays(4), false);
            assertThat(Planner.plan(List.of(target("A", eph)), SITE, r, ObservingLimits.DEFAULT).predictions())
                    .hasSizeBetween(8, 11);
        }
        assertThatThrownBy(() -> DateRange.of(LocalDate.of(1971, 12, 30), LocalDate.of(1972, 1, 5), false))
                .isInstanceOf(BadInputException.class).hasMessageContaining("1972-01-02");
        assertThatThrownBy(() -> DateRange.of(LocalDate.of(2050, 12, 26), LocalDate.of(2051, 1, 1), false))
                .isInstanceOf(BadInputException.class).hasMessageContaining("2050-12-29");
    }

    @Test
    void julianDateTextIsIso8601() {
        assertThat(UtcText.iso(JulianDate.ofDateTime(2027, 3, 14, 21, 7, 33.4, TimeScale.JD_UTC)))
                .isEqualTo("2027-03-14T21:07:33Z");
    }
}
