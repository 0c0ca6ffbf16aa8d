package org.twinlight.timing.period;

import java.util.Locale;
import org.twinlight.BadInputException;

/**
 * The trial periods of a search, days: from the floor ({@code --min-period}, else
 * {@link PeriodSearch#DEFAULT_MIN_PERIOD_DAYS} whatever the sampling: irregular sampling has no Nyquist
 * limit that rules out short periods) to the ceiling ({@code --max-period}, else half the baseline, so
 * that two eclipses of the same kind are covered).
 *
 * @param minPeriodDays shortest trial period, days
 * @param maxPeriodDays longest trial period, days
 * @param minFromUser true when the floor was given by the user
 * @param maxFromUser true when the ceiling was given by the user
 */
record SearchRange(double minPeriodDays, double maxPeriodDays, boolean minFromUser, boolean maxFromUser) {

    static SearchRange of(SearchData data, PeriodSearchSettings settings) {
        String source = data.source();
        double baseline = data.baselineDays();
        double minP = settings.minPeriodDays() != null ? settings.minPeriodDays()
                : PeriodSearch.DEFAULT_MIN_PERIOD_DAYS;
        double halfBaseline = baseline / 2;
        double maxP;
        if (settings.maxPeriodDays() != null) {
            if (settings.maxPeriodDays() > halfBaseline) {
                throw new BadInputException(String.format(Locale.ROOT,
                        "%s: maximum period %.6g d exceeds half the baseline (%.6g d of %.6g d): two eclipses of the"
                                + " same kind must be covered; lower --max-period or add data",
                        source, settings.maxPeriodDays(), halfBaseline, baseline));
            }
            maxP = settings.maxPeriodDays();
        } else {
            maxP = halfBaseline;
        }
        if (!(maxP > minP)) {
            if (settings.minPeriodDays() != null || settings.maxPeriodDays() != null) {
                throw new BadInputException(String.format(Locale.ROOT,
                        "%s: nothing to search: the shortest trial period %.6g d%s is not below the longest %.6g d%s",
                        source, minP, settings.minPeriodDays() != null ? " (--min-period)" : "", maxP,
                        settings.maxPeriodDays() != null ? " (--max-period)"
                                : String.format(Locale.ROOT, " (half the baseline of %.6g d)", baseline)));
            }
            throw new BadInputException(String.format(Locale.ROOT,
                    "%s: the baseline of %.6g d is too short: two eclipses must be covered, so the longest period"
                            + " that can be searched is %.6g d, which is not above the shortest trial period %.6g d",
                    source, baseline, maxP, minP));
        }
        return new SearchRange(minP, maxP, settings.minPeriodDays() != null, settings.maxPeriodDays() != null);
    }

    /** A note when {@code periodDays} lies within a factor of two of the floor or the ceiling, else empty. */
    java.util.Optional<String> edgeNote(double periodDays) {
        if (periodDays < 2 * minPeriodDays) {
            return java.util.Optional.of(String.format(Locale.ROOT, "the period lies within a factor of 2 of the"
                    + " search floor (%.4g d%s): a period shorter than the floor, e.g. P/2 = %.6g d, was not searched;"
                    + " rerun with --min-period %.3g to check", minPeriodDays, minFromUser ? ", --min-period"
                            : ", the default", periodDays / 2, minPeriodDays / 2.5));
        }
        if (periodDays > maxPeriodDays / 2) {
            return java.util.Optional.of(String.format(Locale.ROOT, "the period lies within a factor of 2 of the"
                    + " search ceiling (%.4g d%s): a longer period (e.g. 2P = %.6g d) could not be searched; data over"
                    + " a longer baseline would check it", maxPeriodDays, maxFromUser ? ", --max-period"
                            : ", half the baseline", 2 * periodDays));
        }
        return java.util.Optional.empty();
    }
}
