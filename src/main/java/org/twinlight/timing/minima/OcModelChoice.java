package org.twinlight.timing.minima;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * Which ephemeris an O−C diagram supports, decided so that noise is not sold as a period change.
 * The linear ephemeris is the answer unless a richer model earns its place on two counts:
 * <ol>
 * <li><b>Strong evidence</b>: its BIC lies more than {@link #STRONG_DELTA_BIC} below that of the
 * simpler model it would replace (linear, or quadratic for a light-time orbit). ΔBIC &gt; 6 is
 * "strong" evidence on the scale of Kass &amp; Raftery (1995, J. Am. Stat. Assoc. 90, 773, §3.2);
 * 2–6 is only "positive", and on timings of constant period a ΔBIC of a few units turns up by
 * chance (see {@code OcModelChoiceTest}).</li>
 * <li><b>Physical checks</b>: a quadratic term must differ from zero by at least
 * {@link #MIN_SIGNIFICANCE}σ; a light-time orbit must have an amplitude K of at least
 * {@link #MIN_SIGNIFICANCE}σ, an eccentricity clear of the fit's bound (below
 * {@link #MAX_ECCENTRICITY_ACCEPTED}), an outer period of at least {@link #MIN_OUTER_TO_INNER}
 * binary periods (a shorter outer orbit is not a stable hierarchical triple, Mardling &amp;
 * Aarseth 2001, MNRAS 321, 398, from memory; and small multiples of the binary period are where
 * the sampling of the timings aliases), above the shortest period the spacing of the timings can
 * show, and no longer than the span of the timings (less than one outer orbit covered cannot
 * distinguish an orbit from a slow period change).</li>
 * </ol>
 * Every rejected model gets a note saying which test it failed and by how much.
 */
final class OcModelChoice {

    /** ΔBIC above which the evidence counts as strong (Kass &amp; Raftery 1995, §3.2). */
    static final double STRONG_DELTA_BIC = 6.0;
    /** Smallest value/σ of the term that makes a model differ from the linear one. */
    static final double MIN_SIGNIFICANCE = 3.0;
    /** A light-time eccentricity at or above this is at the fit's bound (0.95), not measured. */
    static final double MAX_ECCENTRICITY_ACCEPTED = EphemerisLightTimeFitter.MAX_ECCENTRICITY - 0.03;
    /** Fewest binary periods in an outer orbit that is accepted. */
    static final double MIN_OUTER_TO_INNER = 10.0;

    /**
     * @param preferred the model the data support
     * @param notes why each richer model was or was not accepted, for people
     */
    record Choice(EphemerisModel preferred, List<String> notes) {
        Choice {
            notes = List.copyOf(notes);
        }
    }

    private OcModelChoice() {
    }

    /**
     * @param linear the linear fit
     * @param quadratic the quadratic fit, or null
     * @param lightTime the light-time fit, or null
     * @param times the calculated times of the timings, days
     * @param binaryPeriodDays the binary's period, days
     */
    static Choice choose(EphemerisFit linear, EphemerisFit quadratic, EphemerisFit lightTime, double[] times,
            double binaryPeriodDays) {
        List<String> notes = new ArrayList<>();
        EphemerisFit best = linear;
        if (quadratic != null) {
            List<String> failed = new ArrayList<>();
            double delta = linear.bic() - quadratic.bic();
            if (!(delta > STRONG_DELTA_BIC)) {
                failed.add(deltaText(delta, "linear"));
            }
            EphemerisParameter q = quadratic.parameter("q").orElseThrow();
            double z = Math.abs(q.value()) / q.uncertainty();
            if (!(z >= MIN_SIGNIFICANCE)) {
                failed.add(String.format(Locale.ROOT, "the quadratic term is %.1fσ from zero (need %.0fσ)", z,
                        MIN_SIGNIFICANCE));
            }
            if (failed.isEmpty()) {
                best = quadratic;
                notes.add(String.format(Locale.ROOT, "quadratic accepted: ΔBIC = %.1f against linear, "
                        + "quadratic term %.1fσ from zero", delta, z));
            } else {
                notes.add("quadratic not accepted: " + String.join("; ", failed));
            }
        }
        if (lightTime != null) {
            List<String> failed = lightTimeProblems(lightTime, best, times, binaryPeriodDays);
            if (failed.isEmpty()) {
                notes.add(String.format(Locale.ROOT, "light-time orbit accepted: ΔBIC = %.1f against %s",
                        best.bic() - lightTime.bic(), best.model().label()));
                best = lightTime;
            } else {
                notes.add("light-time orbit not accepted: " + String.join("; ", failed));
            }
        }
        if (best == linear) {
            notes.add(0, "no significant period change: the linear ephemeris is the answer");
        }
        return new Choice(best.model(), notes);
    }

    private static List<String> lightTimeProblems(EphemerisFit lightTime, EphemerisFit simpler, double[] times,
            double binaryPeriodDays) {
        List<String> failed = new ArrayList<>();
        double delta = simpler.bic() - lightTime.bic();
        if (!(delta > STRONG_DELTA_BIC)) {
            failed.add(deltaText(delta, simpler.model().label()));
        }
        EphemerisParameter k = lightTime.parameter("lightTimeAmplitude").orElseThrow();
        double z = k.value() / k.uncertainty();
        if (!(z >= MIN_SIGNIFICANCE)) {
            failed.add(String.format(Locale.ROOT, "its amplitude %.2g ± %.2g d is %.1fσ (need %.0fσ)", k.value(),
                    k.uncertainty(), z, MIN_SIGNIFICANCE));
        }
        double e = lightTime.lightTime().eccentricity();
        if (!(e < MAX_ECCENTRICITY_ACCEPTED)) {
            failed.add(String.format(Locale.ROOT, "its eccentricity %.2f is at the fit's bound %.2f", e,
                    EphemerisLightTimeFitter.MAX_ECCENTRICITY));
        }
        double p3 = lightTime.lightTime().periodDays();
        double ratio = p3 / binaryPeriodDays;
        if (!(ratio >= MIN_OUTER_TO_INNER)) {
            failed.add(String.format(Locale.ROOT, "its period %.4g d is only %.1f binary periods (need %.0f)", p3,
                    ratio, MIN_OUTER_TO_INNER));
        }
        EphemerisLightTimeFitter.SearchRange range = EphemerisLightTimeFitter.searchRange(times, binaryPeriodDays);
        if (!(p3 >= range.minDays())) {
            failed.add(String.format(Locale.ROOT, "its period %.4g d is below the %.4g d the spacing of the timings "
                    + "can show", p3, range.minDays()));
        }
        if (!(p3 <= range.spanDays())) {
            failed.add(String.format(Locale.ROOT, "its period %.4g d is longer than the %.4g d the timings span "
                    + "(less than one orbit seen)", p3, range.spanDays()));
        }
        return failed;
    }

    private static String deltaText(double delta, String against) {
        return String.format(Locale.ROOT, "ΔBIC = %.1f against %s, not above %.0f (strong evidence, "
                + "Kass & Raftery 1995)", delta, against, STRONG_DELTA_BIC);
    }
}
