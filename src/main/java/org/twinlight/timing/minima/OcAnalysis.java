package org.twinlight.timing.minima;

import org.twinlight.timing.Ephemeris;
import org.twinlight.timing.MinimumType;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.Comparator;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import org.twinlight.BadInputException;
import org.twinlight.WorkFailedException;
import org.twinlight.statistics.FitStatistics;

/**
 * O−C diagram and ephemeris fits. The O−C are taken against a reference ephemeris (given, or a
 * fitted linear one); then, weighted by the timing errors:
 * <ul>
 * <li>a linear ephemeris T = T₀ + P·E,</li>
 * <li>a quadratic one T = T₀ + P·E + Q·E², with dP/dE = 2Q and dP/dt = 2Q/P,</li>
 * <li>a linear one plus the light-travel-time effect of a third body (Irwin 1952), see
 * {@link EphemerisLightTimeFitter},</li>
 * </ul>
 * each with its Bayesian information criterion BIC = χ² + k·ln n (Schwarz 1978, Ann. Stat. 6,
 * 461). A richer model than the linear one is preferred only on strong evidence and physical
 * checks, see {@link OcModelChoice}; otherwise the answer is "no significant period change". When both primary and secondary minima are present (four timings or
 * more), every model has one more free parameter, the displacement of the secondaries from phase
 * 0.5, so eccentric orbits are fitted without bias. Uncertainties are the formal ones multiplied by
 * max(1, √(χ²/(n − k))) (common practice, no source), so scatter beyond the stated timing errors
 * widens them.
 */
public final class OcAnalysis {
    /** Words of the note given when the secondary offset is fixed instead of fitted. */
    static final String OFFSET_NOT_SEPARABLE = "cannot be separated";

    /** Fewest timings for which the light-time model is tried. */
    public static final int MIN_TIMINGS_FOR_LIGHT_TIME = 15;
    /** Largest widening of the period's error that fitting the secondary offset may cost (common practice, no source). */
    public static final double MAX_PERIOD_ERROR_INFLATION = 2.0;
    /** Days per Julian year, for dP/dt in seconds per year (IAU: 365.25 d). */
    private static final double DAYS_PER_JULIAN_YEAR = 365.25;
    private static final double SECONDS_PER_DAY = 86400.0;

    private OcAnalysis() {
    }

    /**
     * The cycle number of a minimum observed at {@code timeDays}: the nearest integer for a
     * primary, n + 0.5 for a secondary expected at phase {@code secondaryPhase}.
     */
    public static double cycleOf(double timeDays, MinimumType type, Ephemeris ephemeris, double secondaryPhase) {
        double phase = type == MinimumType.PRIMARY ? 0 : secondaryPhase;
        return Math.round(ephemeris.cyclesSinceEpoch(timeDays) - phase) + type.cycleOffset();
    }

    /**
     * Builds the O−C diagram of {@code minima} against {@code reference} and fits the models.
     *
     * @param minima timings of one method (cycle numbers assigned)
     * @param reference the ephemeris for the O−C
     * @param tryLightTime whether to fit the light-time model (only with at least
     *     {@link #MIN_TIMINGS_FOR_LIGHT_TIME} timings)
     * @throws BadInputException when two minima share a cycle and type, or an error is not positive
     * @throws WorkFailedException when there are fewer than two cycles to fit
     */
    public static OcResult analyse(List<MinimumTime> minima, Ephemeris reference, boolean tryLightTime) {
        return analyse(minima, reference, tryLightTime, Double.NaN, Double.NaN);
    }

    /**
     * As {@link #analyse(List, Ephemeris, boolean)}, with the displacement of the secondaries from
     * phase 0.5 measured elsewhere (e.g. in the folded light curve), days, or NaN when unknown. It
     * is used only when the timings cannot fit that displacement without losing the period:
     * when fitting it would widen the period's error more than {@link #MAX_PERIOD_ERROR_INFLATION}
     * times (primaries and secondaries from different seasons), it is fixed at this value (at 0
     * when unknown), with a note.
     */
    public static OcResult analyse(List<MinimumTime> minima, Ephemeris reference, boolean tryLightTime,
            double measuredSecondaryOffsetDays, double measuredSecondaryOffsetErrorDays) {
        checkTimings(minima);
        List<MinimumTime> sorted = new ArrayList<>(minima);
        sorted.sort(Comparator.comparingDouble(MinimumTime::timeDays));
        int n = sorted.size();
        double[] cycle = new double[n];
        boolean[] secondary = new boolean[n];
        double[] oc = new double[n];
        double[] sigma = new double[n];
        List<OcPoint> points = new ArrayList<>();
        boolean anyPrimary = false;
        boolean anySecondary = false;
        for (int i = 0; i < n; i++) {
            MinimumTime m = sorted.get(i);
            cycle[i] = m.cycle();
            secondary[i] = m.type() == MinimumType.SECONDARY;
            anyPrimary |= !secondary[i];
            anySecondary |= secondary[i];
            oc[i] = m.timeDays() - reference.timeOf(m.cycle());
            sigma[i] = m.errorDays();
            points.add(new OcPoint(m.cycle(), m.type(), m.timeDays(), m.errorDays(), oc[i], m.partial()));
        }
        long distinct = Arrays.stream(cycle).distinct().count();
        if (distinct < 2) {
            throw new WorkFailedException("an ephemeris needs timings from at least two cycles; found " + distinct);
        }
        boolean withSecondary = anyPrimary && anySecondary && n >= 4;
        EphemerisFit linear = polynomial(EphemerisModel.LINEAR, cycle, secondary, oc, sigma, reference, withSecondary);
        String secondaryNote = null;
        double[] ocFit = oc.clone();
        double fixedOffset = Double.NaN;
        if (withSecondary) {
            EphemerisFit free = linear;
            EphemerisFit pooled = polynomial(EphemerisModel.LINEAR, cycle, secondary, oc, sigma, reference, false);
            double inflation = linear.parameter("period").orElseThrow().uncertainty()
                    / pooled.parameter("period").orElseThrow().uncertainty();
            if (inflation > MAX_PERIOD_ERROR_INFLATION) {
                fixedOffset = Double.isFinite(measuredSecondaryOffsetDays) ? measuredSecondaryOffsetDays : 0;
                secondaryNote = String.format(Locale.ROOT, "the secondary offset from phase 0.5 " + OFFSET_NOT_SEPARABLE
                        + " from the period with these timings (fitting it would widen the period's error %.1f-fold, "
                        + "e.g. primaries and secondaries from different seasons): it is fixed at %.2f min, %s",
                        inflation, fixedOffset * 1440, Double.isFinite(measuredSecondaryOffsetDays)
                                ? "the offset measured in the folded light curve" : "i.e. the secondary at phase 0.5");
                withSecondary = false;
                for (int i = 0; i < n; i++) {
                    ocFit[i] -= secondary[i] ? fixedOffset : 0;
                }
                linear = polynomial(EphemerisModel.LINEAR, cycle, secondary, ocFit, sigma, reference, false)
                        .withFixedSecondaryOffset(fixedOffset);
                // The fixed offset is itself uncertain; refit with it moved by ±1σ and add the half-difference
                // of each result to its uncertainty (propagation of a fixed parameter's error, common
                // practice, no source), so the period is never more precise than the offset allows.
                double offsetError = Double.isFinite(measuredSecondaryOffsetErrorDays) ? measuredSecondaryOffsetErrorDays
                        : 0;
                if (offsetError > 0) {
                    linear = linear.withFixedOffsetError(
                            refitWithOffset(cycle, secondary, oc, sigma, reference, fixedOffset + offsetError),
                            refitWithOffset(cycle, secondary, oc, sigma, reference, fixedOffset - offsetError),
                            offsetError);
                    secondaryNote += String.format(Locale.ROOT, " ± %.2f min (its resolution, carried into the epoch"
                            + " and period errors)", offsetError * 1440);
                }
                if (linear.parameter("period").orElseThrow().uncertainty()
                        >= free.parameter("period").orElseThrow().uncertainty()) {
                    // the folded light curve places the secondary no better than the timings do: fit it
                    linear = free;
                    withSecondary = true;
                    ocFit = oc.clone();
                    fixedOffset = Double.NaN;
                    secondaryNote = null;
                }
            }
        }
        EphemerisFit quadratic = null;
        int quadraticK = (withSecondary ? 4 : 3);
        if (n > quadraticK && distinct >= 3) {
            quadratic = fixed(polynomial(EphemerisModel.QUADRATIC, cycle, secondary, ocFit, sigma, reference,
                    withSecondary), fixedOffset);
        }
        EphemerisFit lightTime = null;
        if (tryLightTime && n >= MIN_TIMINGS_FOR_LIGHT_TIME) {
            lightTime = fixed(EphemerisLightTimeFitter.fit(cycle, secondary, ocFit, sigma, reference, withSecondary),
                    fixedOffset);
        }
        double[] times = new double[n];
        for (int i = 0; i < n; i++) {
            times[i] = reference.timeOf(cycle[i]);
        }
        OcModelChoice.Choice choice = OcModelChoice.choose(linear, quadratic, lightTime, times, reference.periodDays());
        List<String> notes = new ArrayList<>(choice.notes());
        if (secondaryNote != null) {
            notes.add(secondaryNote);
        }
        return new OcResult(reference, points, linear, quadratic, lightTime, choice.preferred(), notes,
                seriesDifference(cycle, secondary, oc, sigma));
    }

    /** The linear ephemeris of O−C from which a secondary offset {@code offsetDays} was taken out. */
    private static EphemerisFit refitWithOffset(double[] cycle, boolean[] secondary, double[] oc, double[] sigma,
            Ephemeris reference, double offsetDays) {
        double[] shifted = oc.clone();
        for (int i = 0; i < shifted.length; i++) {
            shifted[i] -= secondary[i] ? offsetDays : 0;
        }
        return polynomial(EphemerisModel.LINEAR, cycle, secondary, shifted, sigma, reference, false)
                .withFixedSecondaryOffset(offsetDays);
    }

    /** {@code fit} with the secondary offset fixed at {@code offsetDays}; unchanged when that is NaN or fit is null. */
    private static EphemerisFit fixed(EphemerisFit fit, double offsetDays) {
        return fit == null || Double.isNaN(offsetDays) ? fit : fit.withFixedSecondaryOffset(offsetDays);
    }

    private static void checkTimings(List<MinimumTime> minima) {
        Map<String, MinimumTime> seen = new HashMap<>();
        for (MinimumTime m : minima) {
            if (!(m.errorDays() > 0) || !Double.isFinite(m.errorDays())) {
                throw new BadInputException(String.format(Locale.ROOT,
                        "minimum at %.6f (cycle %s): error %s d is not allowed; expected an error > 0 days",
                        m.timeDays(), cycleLabel(m.cycle()), m.errorDays()));
            }
            double frac = m.cycle() - Math.floor(m.cycle());
            double expected = m.type().cycleOffset();
            if (Math.abs(frac - expected) > 1e-9) {
                throw new BadInputException(String.format(Locale.ROOT,
                        "minimum at %.6f: cycle %s does not fit a %s minimum (expected %s)", m.timeDays(),
                        cycleLabel(m.cycle()), m.type().label(),
                        m.type() == MinimumType.PRIMARY ? "an integer" : "an integer + 0.5"));
            }
            MinimumTime previous = seen.put(m.type() + "/" + m.cycle(), m);
            if (previous != null) {
                throw new BadInputException(String.format(Locale.ROOT,
                        "cycle numbers collide: cycle %s (%s) is assigned to two minima, at %.6f and %.6f; "
                                + "check the period or remove one of them",
                        cycleLabel(m.cycle()), m.type().label(), previous.timeDays(), m.timeDays()));
            }
        }
    }

    static String cycleLabel(double cycle) {
        return cycle == Math.rint(cycle) ? String.valueOf((long) cycle) : String.valueOf(cycle);
    }

    /** Linear or quadratic ephemeris by weighted linear least squares on the O−C. */
    private static EphemerisFit polynomial(EphemerisModel model, double[] cycle, boolean[] secondary, double[] oc,
            double[] sigma, Ephemeris reference, boolean withSecondary) {
        boolean quadratic = model == EphemerisModel.QUADRATIC;
        int n = cycle.length;
        int k = 2 + (quadratic ? 1 : 0) + (withSecondary ? 1 : 0);
        double[][] design = new double[n][k];
        for (int i = 0; i < n; i++) {
            int c = 0;
            design[i][c++] = 1;
            design[i][c++] = cycle[i];
            if (quadratic) {
                design[i][c++] = cycle[i] * cycle[i];
            }
            if (withSecondary) {
                design[i][c] = secondary[i] ? 1 : 0;
            }
        }
        EphemerisLeastSquares.Solution sol = EphemerisLeastSquares.solve(design, oc, sigma);
        double scale = errorScale(sol.chi2(), n, k);
        double[] b = sol.coefficients();
        List<EphemerisParameter> params = new ArrayList<>();
        double period = reference.periodDays() + b[1];
        params.add(new EphemerisParameter("epoch", reference.epochDays() + b[0], scale * sol.sigma(0), "d"));
        params.add(new EphemerisParameter("period", period, scale * sol.sigma(1), "d"));
        double q = 0;
        if (quadratic) {
            q = b[2];
            double sq = scale * sol.sigma(2);
            params.add(new EphemerisParameter("q", q, sq, "d"));
            params.add(new EphemerisParameter("dPdE", 2 * q, 2 * sq, "d/cycle"));
            params.add(new EphemerisParameter("dPdt", 2 * q / period, 2 * sq / period, "d/d"));
            double toSecondsPerYear = SECONDS_PER_DAY * DAYS_PER_JULIAN_YEAR;
            params.add(new EphemerisParameter("dPdtSecondsPerYear", 2 * q / period * toSecondsPerYear,
                    2 * sq / period * toSecondsPerYear, "s/yr"));
        }
        double s = 0;
        if (withSecondary) {
            s = b[k - 1];
            params.add(new EphemerisParameter("secondaryOffset", s, scale * sol.sigma(k - 1), "d"));
        }
        return new EphemerisFit(model, reference, b[0], b[1], q, s, null, params, sol.chi2(), n, k,
                bic(sol.chi2(), k, n), scale, scale * scale * sol.covariance()[0][1]);
    }

    static double errorScale(double chi2, int n, int k) {
        // the project's one rule for stated errors (the minima's own timing errors): max(1, χ²ν)
        return Math.sqrt(FitStatistics.varianceScale(chi2, n - k, false));
    }

    static double bic(double chi2, int k, int n) {
        return FitStatistics.bic(chi2, k, n);
    }

    /** Straight lines through each series around the common mean cycle; null without two cycles of each. */
    private static OcSeriesDifference seriesDifference(double[] cycle, boolean[] secondary, double[] oc, double[] sigma) {
        double meanCycle = Arrays.stream(cycle).average().orElse(0);
        double[][] lines = new double[2][];
        int[] counts = new int[2];
        for (int type = 0; type < 2; type++) {
            List<double[]> rows = new ArrayList<>();
            List<Double> ys = new ArrayList<>();
            List<Double> ss = new ArrayList<>();
            Set<Double> cycles = new HashSet<>();
            for (int i = 0; i < cycle.length; i++) {
                if (secondary[i] == (type == 1)) {
                    rows.add(new double[] {1, cycle[i] - meanCycle});
                    ys.add(oc[i]);
                    ss.add(sigma[i]);
                    cycles.add(cycle[i]);
                }
            }
            if (cycles.size() < 2) {
                return null;
            }
            EphemerisLeastSquares.Solution sol = EphemerisLeastSquares.solve(rows.toArray(new double[0][]),
                    ys.stream().mapToDouble(Double::doubleValue).toArray(),
                    ss.stream().mapToDouble(Double::doubleValue).toArray());
            double scale = errorScale(sol.chi2(), rows.size(), 2);
            lines[type] = new double[] {sol.coefficients()[0], scale * sol.sigma(0), sol.coefficients()[1],
                scale * sol.sigma(1)};
            counts[type] = rows.size();
        }
        double[] p = lines[0];
        double[] s = lines[1];
        return new OcSeriesDifference(meanCycle, p[0] - s[0], Math.hypot(p[1], s[1]), p[2] - s[2],
                Math.hypot(p[3], s[3]), counts[0], counts[1]);
    }
}
