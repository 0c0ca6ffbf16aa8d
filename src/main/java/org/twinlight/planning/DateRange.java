package org.twinlight.planning;

import java.time.LocalDate;
import java.time.temporal.ChronoUnit;
import org.twinlight.BadInputException;

/**
 * The dates to plan for: from 0h UTC of {@code start} up to (not including) 0h UTC of {@code end}.
 *
 * @param start first date, UTC
 * @param end the date after the last one, UTC
 */
public record DateRange(LocalDate start, LocalDate end) {

    /** Longest range accepted without being forced: ten years (a typo in a year is likelier than a wish). */
    public static final int MAX_YEARS_UNFORCED = 10;

    /**
     * The span of the leap-second table (UTC from 1972 January 1) and of the Sun and Moon
     * ephemerides (to 2050 December 31), less the one-day margin of the planner's hourly table.
     */
    static final LocalDate FIRST = LocalDate.of(1972, 1, 2);
    static final LocalDate LAST = LocalDate.of(2050, 12, 29);

    /**
     * Checks a range.
     *
     * @param force accept more than {@link #MAX_YEARS_UNFORCED} years
     * @throws BadInputException for an empty or reversed range, one beyond 1972–2050, or a long one unforced
     */
    public static DateRange of(LocalDate start, LocalDate end, boolean force) {
        if (end.isBefore(start)) {
            throw new BadInputException("date range is reversed: --end " + end + " is before --start " + start);
        }
        if (!end.isAfter(start)) {
            throw new BadInputException("date range is empty: --end " + end + " must be after --start " + start
                    + " (the range runs from 0h UTC of --start to 0h UTC of --end)");
        }
        if (start.isBefore(FIRST) || end.isAfter(LAST)) {
            throw new BadInputException("date range " + start + " to " + end + " reaches outside " + FIRST + " to "
                    + LAST + ", where UTC and the Sun and Moon ephemerides are defined");
        }
        if (!force && start.plusYears(MAX_YEARS_UNFORCED).isBefore(end)) {
            throw new BadInputException("date range " + start + " to " + end + " is longer than "
                    + MAX_YEARS_UNFORCED + " years; shorten it or add --force");
        }
        return new DateRange(start, end);
    }

    /** Julian date (UTC) of 0h of the start. */
    public double startJd() {
        return jd(start);
    }

    /** Julian date (UTC) of 0h of the end. */
    public double endJd() {
        return jd(end);
    }

    /** Number of days. */
    public long days() {
        return ChronoUnit.DAYS.between(start, end);
    }

    private static double jd(LocalDate d) {
        return d.toEpochDay() + 2440587.5;
    }
}
