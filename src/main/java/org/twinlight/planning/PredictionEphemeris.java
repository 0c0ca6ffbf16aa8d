package org.twinlight.planning;

import java.util.Locale;
import org.twinlight.BadInputException;
import org.twinlight.time.TimeScale;
import org.twinlight.timing.Ephemeris;
import org.twinlight.timing.MinimumType;

/**
 * A linear ephemeris with its covariance and time scale, for predicting minima.
 *
 * @param ephemeris epoch (primary minimum of cycle 0) and period, days, in {@code timeScale}
 * @param epochErrorDays 1σ of the epoch, days (0 when unknown)
 * @param periodErrorDays 1σ of the period, days (0 when unknown)
 * @param epochPeriodCovarianceDays2 cov(T0, P), days² (0 when not known)
 * @param timeScale the scale of the epoch; must be declared
 * @param secondaryPhase phase of the secondary minimum after the primary, (0, 1); 0.5 for a circular orbit
 */
public record PredictionEphemeris(Ephemeris ephemeris, double epochErrorDays, double periodErrorDays,
        double epochPeriodCovarianceDays2, TimeScale timeScale, double secondaryPhase) {

    /** @throws BadInputException for an unknown time scale or impossible errors */
    public PredictionEphemeris {
        if (timeScale == null || !timeScale.isKnown()) {
            throw new BadInputException("the ephemeris has no time scale: its epoch cannot be turned into UTC at the"
                    + " site; declare it (e.g. BJD_TDB, HJD_UTC or JD_UTC)");
        }
        if (!(epochErrorDays >= 0) || !(periodErrorDays >= 0)) {
            throw new BadInputException(String.format(Locale.ROOT,
                    "ephemeris errors must be ≥ 0 days, got epoch ±%s, period ±%s", epochErrorDays, periodErrorDays));
        }
        if (!Double.isFinite(epochPeriodCovarianceDays2)
                || epochPeriodCovarianceDays2 * epochPeriodCovarianceDays2
                > epochErrorDays * epochErrorDays * periodErrorDays * periodErrorDays * (1 + 1e-9)) {
            throw new BadInputException(String.format(Locale.ROOT, "ephemeris covariance cov(T0, P) = %s d² is not "
                    + "possible with σ(T0) = %s d and σ(P) = %s d (|correlation| must be ≤ 1)",
                    epochPeriodCovarianceDays2, epochErrorDays, periodErrorDays));
        }
        if (!(secondaryPhase > 0 && secondaryPhase < 1)) {
            throw new BadInputException("secondary phase must be in (0, 1), got " + secondaryPhase);
        }
    }

    /** An ephemeris with uncorrelated errors and the secondary at phase 0.5. */
    public static PredictionEphemeris of(double epochDays, double periodDays, double epochErrorDays,
            double periodErrorDays, TimeScale timeScale) {
        return new PredictionEphemeris(new Ephemeris(epochDays, periodDays), epochErrorDays, periodErrorDays, 0,
                timeScale, 0.5);
    }

    /** The same with another secondary phase. */
    public PredictionEphemeris withSecondaryPhase(double phase) {
        return new PredictionEphemeris(ephemeris, epochErrorDays, periodErrorDays, epochPeriodCovarianceDays2,
                timeScale, phase);
    }

    /**
     * The cycle count E of a minimum: n for a primary, n + 0.5 for a secondary (the contract's
     * numbering, whatever the secondary's actual phase).
     */
    public static double cycle(long n, MinimumType type) {
        return n + type.cycleOffset();
    }

    /**
     * Time of the minimum of cycle {@code n} and {@code type}, days in {@link #timeScale}:
     * T0 + P·n for a primary, T0 + P·(n + secondary phase) for a secondary. For n = 0, primary,
     * exactly the epoch.
     */
    public double timeOf(long n, MinimumType type) {
        double phase = type == MinimumType.PRIMARY ? 0 : secondaryPhase;
        return ephemeris.epochDays() + ephemeris.periodDays() * (n + phase);
    }

    /**
     * 1σ of a predicted time, days: σ² = σ_T0² + E²σ_P² + 2E cov(T0, P), with E the cycle count
     * from the epoch (the variance of a linear function of T0 and P; e.g. Bevington &amp; Robinson
     * 2003, <i>Data Reduction and Error Analysis</i>, eq. 3.13).
     */
    public double errorDays(double cycles) {
        double v = epochErrorDays * epochErrorDays + cycles * cycles * periodErrorDays * periodErrorDays
                + 2 * cycles * epochPeriodCovarianceDays2;
        return Math.sqrt(Math.max(0, v));
    }
}
