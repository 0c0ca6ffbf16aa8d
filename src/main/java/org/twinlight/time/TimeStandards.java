package org.twinlight.time;

/**
 * Conversions between the clocks UTC, TAI, TT and TDB at one place (the reference of the date is
 * kept). UTC ↔ TAI by the leap-second table ({@link LeapSeconds}) with the SOFA/ERFA convention
 * for leap-second days; TT = TAI + 32.184 s (IAU 1991 Res. A4; ERFA {@code TTMTAI}); TDB − TT by
 * {@link TdbMinusTt}.
 */
final class TimeStandards {

    /** TT − TAI in seconds, exact by definition (IAU 1991 Resolution A4; ERFA {@code TTMTAI}). */
    static final double TT_MINUS_TAI_SECONDS = 32.184;

    private TimeStandards() {
    }

    /** {@code date} read on the clock {@code target}, same reference. */
    static JulianDate convert(JulianDate date, TimeStandard target) {
        if (date.scale().standard() == target) {
            return date;
        }
        return fromTt(toTt(date), new TimeScale(date.scale().reference(), target, false));
    }

    private static JulianDate toTt(JulianDate date) {
        TimeScale tt = new TimeScale(date.scale().reference(), TimeStandard.TT, false);
        return switch (date.scale().standard()) {
            case TT -> date;
            case TAI -> date.plusSeconds(TT_MINUS_TAI_SECONDS).relabel(tt);
            case UTC -> utcToTai(date).plusSeconds(TT_MINUS_TAI_SECONDS).relabel(tt);
            case TDB -> {
                // TT = TDB − (TDB − TT)(TT): one fixed-point step from the TDB argument is exact
                // to 1e-13 s, since the series changes by ~1e-10 s per second of argument.
                JulianDate guess = date.plusSeconds(-TdbMinusTt.seconds(date.centuriesSinceJ2000()));
                yield date.plusSeconds(-TdbMinusTt.seconds(guess.centuriesSinceJ2000())).relabel(tt);
            }
        };
    }

    private static JulianDate fromTt(JulianDate tt, TimeScale target) {
        return switch (target.standard()) {
            case TT -> tt.relabel(target);
            case TAI -> tt.plusSeconds(-TT_MINUS_TAI_SECONDS).relabel(target);
            case UTC -> taiToUtc(tt.plusSeconds(-TT_MINUS_TAI_SECONDS).relabel(
                    new TimeScale(target.reference(), TimeStandard.TAI, false)));
            case TDB -> tt.plusSeconds(TdbMinusTt.seconds(tt.centuriesSinceJ2000())).relabel(target);
        };
    }

    /**
     * UTC → TAI as ERFA {@code eraUtctai} from 1972 on: the fraction of a UTC day is stretched to
     * 86401 SI seconds on a day that ends with a leap second, then TAI − UTC of that day is added.
     */
    static JulianDate utcToTai(JulianDate utc) {
        double dayStart = utc.dayStartJd();
        int offset = LeapSeconds.taiMinusUtc(dayStart);
        double dayLengthSeconds = JulianDate.SECONDS_PER_DAY + LeapSeconds.leapSecondsAtEndOfDay(dayStart);
        double siSeconds = utc.fractionOfDay() * dayLengthSeconds + offset;
        return JulianDate.split(dayStart, siSeconds / JulianDate.SECONDS_PER_DAY,
                new TimeScale(utc.scale().reference(), TimeStandard.TAI, false));
    }

    /** TAI → UTC by inverting {@link #utcToTai} (iterated as ERFA {@code eraTaiutc}). */
    static JulianDate taiToUtc(JulianDate tai) {
        TimeScale utcScale = new TimeScale(tai.scale().reference(), TimeStandard.UTC, false);
        JulianDate utc = tai.relabel(utcScale);
        for (int i = 0; i < 4; i++) {
            double error = tai.secondsSince(utcToTai(utc));
            if (error == 0) {
                break;
            }
            utc = utc.plusSeconds(error);
        }
        return utc;
    }
}
