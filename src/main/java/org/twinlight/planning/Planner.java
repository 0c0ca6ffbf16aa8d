package org.twinlight.planning;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import org.twinlight.sky.Equatorial;
import org.twinlight.sky.Horizontal;
import org.twinlight.sky.MoonPlace;
import org.twinlight.sky.Precession;
import org.twinlight.sky.SiderealTime;
import org.twinlight.sky.Site;
import org.twinlight.sky.SunPlace;
import org.twinlight.time.JulianDate;
import org.twinlight.time.SunAndMoon;
import org.twinlight.time.TimeConverter;
import org.twinlight.time.TimeScale;
import org.twinlight.timing.MinimumType;

/**
 * Lists every primary and secondary minimum of the targets in a date range, seen from a site.
 *
 * <p>For each minimum: the time in the ephemeris's scale, converted to UTC at the geocentre
 * ({@link TimeConverter}: for HJD and BJD the light-time correction for the target's direction
 * is undone); its 1σ from the ephemeris covariance; first and last contact from the eclipse's
 * extent; the target's altitude and azimuth (precessed from J2000 to the date, Meeus ch. 21;
 * mean sidereal time, Meeus ch. 12; Meeus ch. 13) and the Sun's altitude at first contact,
 * minimum and last contact; the Moon at the minimum (Sun and Moon interpolated in an hourly
 * table, {@link SunMoonTable}). The verdict samples the eclipse every
 * {@value #SAMPLE_MINUTES} minutes (and at its contacts and minimum): whole when every sample is
 * within the limits, partial when the minimum and one whole branch are, else not observable. The
 * Sun's place at the minimum serves for the whole eclipse (it moves about 1° a day: under 0.15° of
 * altitude for eclipses under 7 h).
 */
public final class Planner {

    /** Step of the checks across an eclipse, minutes. */
    static final int SAMPLE_MINUTES = 5;

    /** Sidereal rotation, degrees of hour angle per day of UT (Meeus 1998, eq. 12.4). */
    private static final double SIDEREAL_DEG_PER_DAY = 360.98564736629;

    /** Margin around the range when choosing cycles, days: covers TT − UTC and light time (≤ 0.007 d). */
    private static final double CYCLE_MARGIN_DAYS = 0.05;

    private Planner() {
    }

    /**
     * The plan for targets seen from a site.
     *
     * @param targets the stars
     * @param site where from
     * @param range which dates
     * @param limits the limits of the verdicts
     */
    public static Plan plan(List<PlanningTarget> targets, Site site, DateRange range, ObservingLimits limits) {
        List<Prediction> all = new ArrayList<>();
        List<String> notes = new ArrayList<>();
        SunMoonTable table = new SunMoonTable(range.startJd(), range.endJd());
        // targets are independent: predicted in parallel, merged in the order given
        List<List<Prediction>> perTarget = targets.parallelStream()
                .map(target -> predict(target, site, range, limits, table)).toList();
        for (int k = 0; k < targets.size(); k++) {
            PlanningTarget target = targets.get(k);
            List<Prediction> mine = perTarget.get(k);
            long large = mine.stream().filter(Prediction::errorExceedsTenthOfEclipse).count();
            if (large > 0) {
                notes.add(String.format(Locale.ROOT, "%s: the 1σ timing error exceeds a tenth of the eclipse length"
                        + " in %d of %d minima (it grows with the cycle count); allow extra time before and after,"
                        + " or refine the ephemeris with new timings", target.name(), large, mine.size()));
            }
            all.addAll(mine);
        }
        all.sort(Comparator.comparingDouble((Prediction p) -> p.minimum().utc().jd()).thenComparing(Prediction::target));
        return new Plan(site, range, limits, targets, markClashes(all), notes);
    }

    /** Every minimum of one target in the range, in time order. */
    static List<Prediction> predict(PlanningTarget target, Site site, DateRange range, ObservingLimits limits,
            SunMoonTable table) {
        PredictionEphemeris eph = target.ephemeris();
        TimeScale scale = eph.timeScale();
        double zero = scale.zeroPointJd();
        double t0 = eph.ephemeris().epochDays();
        double p = eph.ephemeris().periodDays();
        double from = range.startJd() - zero - CYCLE_MARGIN_DAYS;
        double to = range.endJd() - zero + CYCLE_MARGIN_DAYS;
        long first = (long) Math.floor((from - t0) / p) - 1;
        long last = (long) Math.ceil((to - t0) / p) + 1;
        Equatorial j2000 = new Equatorial(target.direction().raDeg(), target.direction().decDeg());
        List<Prediction> out = new ArrayList<>();
        for (long n = first; n <= last; n++) {
            for (MinimumType type : MinimumType.values()) {
                double own = eph.timeOf(n, type);
                if (own < from || own > to) {
                    continue;
                }
                JulianDate utc = TimeConverter.convert(JulianDate.of(own, scale), TimeScale.JD_UTC, target.direction());
                if (utc.jd() < range.startJd() || utc.jd() >= range.endJd()) {
                    continue;
                }
                out.add(event(target, type, n, own, utc, j2000, site, limits, table));
            }
        }
        return out;
    }

    private static Prediction event(PlanningTarget target, MinimumType type, long n, double own, JulianDate utc,
            Equatorial j2000, Site site, ObservingLimits limits, SunMoonTable table) {
        PredictionEphemeris eph = target.ephemeris();
        double cycle = PredictionEphemeris.cycle(n, type);
        double error = eph.errorDays(cycle);
        double before = target.extent().beforeDays(type);
        double after = target.extent().afterDays(type);
        Equatorial direction = Precession.fromJ2000(j2000, SunAndMoon.centuriesSinceJ2000(utc));
        double lst = SiderealTime.localMeanDeg(utc, site);
        SunPlace sun = table.sun(utc.jd());
        MoonPlace moon = MoonPlace.seenFrom(table.moonKm(utc.jd()), site, lst, sun);
        Track track = new Track(direction, sun.direction(), site.latitudeDeg(), lst);
        SkyAtMoment start = track.at(utc, -before);
        SkyAtMoment minimum = track.at(utc, 0);
        SkyAtMoment end = track.at(utc, after);
        MoonView moonView = new MoonView(Horizontal.altitudeDeg(moon.direction(), site.latitudeDeg(), lst),
                moon.illuminatedFraction(), moon.direction().separationDeg(direction));
        Judgement j = judge(track, utc, before, after, limits);
        boolean large = error > target.extent().durationDays(type) / 10;
        String reason = j.reason;
        if (large) {
            reason += String.format(Locale.ROOT, "; 1σ timing error %.0f min exceeds a tenth of the eclipse (%.0f min)",
                    error * 1440, target.extent().durationDays(type) * 144);
        }
        return new Prediction(target.name(), type, cycle, own, eph.timeScale(), error, start, minimum, end, moonView,
                j.verdict, reason, large, List.of());
    }

    /** The target and the Sun over an eclipse, from their places at the minimum. */
    private record Track(Equatorial target, Equatorial sun, double latitudeDeg, double lstAtMinimumDeg) {
        double lst(double offsetDays) {
            return lstAtMinimumDeg + SIDEREAL_DEG_PER_DAY * offsetDays;
        }

        double targetAltitude(double offsetDays) {
            return Horizontal.altitudeDeg(target, latitudeDeg, lst(offsetDays));
        }

        double sunAltitude(double offsetDays) {
            return Horizontal.altitudeDeg(sun, latitudeDeg, lst(offsetDays));
        }

        SkyAtMoment at(JulianDate minimumUtc, double offsetDays) {
            JulianDate t = offsetDays == 0 ? minimumUtc : minimumUtc.plusSeconds(offsetDays * JulianDate.SECONDS_PER_DAY);
            return new SkyAtMoment(t, Horizontal.of(target, latitudeDeg, lst(offsetDays)), sunAltitude(offsetDays));
        }
    }

    private record Judgement(Verdict verdict, String reason) {
    }

    /** Why a moment fails the limits, or null when it passes. */
    private static String failure(Track track, double offset, ObservingLimits limits) {
        double sunAlt = track.sunAltitude(offset);
        if (sunAlt > limits.sunBelowDeg()) {
            return String.format(Locale.ROOT, "Sun at %+.0f° (limit %+.0f°)", sunAlt, limits.sunBelowDeg());
        }
        double alt = track.targetAltitude(offset);
        if (alt < limits.minAltitudeDeg()) {
            return String.format(Locale.ROOT, "target at %.0f° (limit %.0f°)", alt, limits.minAltitudeDeg());
        }
        return null;
    }

    /** True when a moment is within the limits (the cheap form of {@link #failure}). */
    private static boolean within(Track track, double offset, ObservingLimits limits) {
        return track.sunAltitude(offset) <= limits.sunBelowDeg() && track.targetAltitude(offset) >= limits.minAltitudeDeg();
    }

    /** The first failing offset in [from, to] (walking from {@code from} towards {@code to}), or NaN. */
    private static double firstFailure(Track track, double from, double to, ObservingLimits limits) {
        double step = SAMPLE_MINUTES / 1440.0;
        int n = (int) Math.ceil(Math.abs(to - from) / step);
        for (int i = 0; i <= n; i++) {
            double x = i == n ? to : from + Math.signum(to - from) * i * step;
            if (!within(track, x, limits)) {
                return x;
            }
        }
        return Double.NaN;
    }

    private static Judgement judge(Track track, JulianDate utc, double before, double after, ObservingLimits limits) {
        String atMinimum = failure(track, 0, limits);
        if (atMinimum != null) {
            return new Judgement(Verdict.NOT_OBSERVABLE, atMinimum + " at minimum");
        }
        double ingressFail = firstFailure(track, 0, -before, limits);
        double egressFail = firstFailure(track, 0, after, limits);
        boolean ingress = Double.isNaN(ingressFail);
        boolean egress = Double.isNaN(egressFail);
        if (ingress && egress) {
            return new Judgement(Verdict.WHOLE, String.format(Locale.ROOT,
                    "first to last contact with the target above %.0f° and the Sun below %+.0f°",
                    limits.minAltitudeDeg(), limits.sunBelowDeg()));
        }
        String cutIn = ingress ? null : describe(track, utc, ingressFail, limits, "before");
        String cutOut = egress ? null : describe(track, utc, egressFail, limits, "from");
        if (ingress) {
            return new Judgement(Verdict.PARTIAL, "minimum and ingress; egress cut: " + cutOut);
        }
        if (egress) {
            return new Judgement(Verdict.PARTIAL, "minimum and egress; ingress cut: " + cutIn);
        }
        return new Judgement(Verdict.NOT_OBSERVABLE, "minimum only, neither branch whole: " + cutIn + "; " + cutOut);
    }

    private static String describe(Track track, JulianDate utc, double offset, ObservingLimits limits, String word) {
        JulianDate t = utc.plusSeconds(offset * JulianDate.SECONDS_PER_DAY);
        return failure(track, offset, limits) + " " + word + " " + UtcText.hourMinute(t) + " UTC";
    }

    /** Marks, on each observable minimum, the other targets' observable eclipses that overlap it. */
    static List<Prediction> markClashes(List<Prediction> sorted) {
        List<Prediction> observable = sorted.stream().filter(p -> p.verdict().observable())
                .sorted(Comparator.comparingDouble(p -> p.start().utc().jd())).toList();
        java.util.Map<Prediction, List<String>> clashes = new java.util.IdentityHashMap<>();
        for (int i = 0; i < observable.size(); i++) {
            Prediction a = observable.get(i);
            for (int k = i + 1; k < observable.size(); k++) {
                Prediction b = observable.get(k);
                if (b.start().utc().jd() >= a.end().utc().jd()) {
                    break;
                }
                if (!a.target().equals(b.target())) {
                    clashes.computeIfAbsent(a, x -> new ArrayList<>()).add(label(b));
                    clashes.computeIfAbsent(b, x -> new ArrayList<>()).add(label(a));
                }
            }
        }
        List<Prediction> out = new ArrayList<>(sorted.size());
        for (Prediction p : sorted) {
            List<String> c = clashes.get(p);
            out.add(c == null ? p : p.withClashes(c));
        }
        return out;
    }

    private static String label(Prediction p) {
        return p.target() + " " + p.type().label() + " " + UtcText.hourMinute(p.start().utc()) + "–"
                + UtcText.hourMinute(p.end().utc());
    }
}
