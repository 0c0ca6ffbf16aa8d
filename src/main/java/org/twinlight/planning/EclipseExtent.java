package org.twinlight.planning;

import java.util.Locale;
import org.twinlight.BadInputException;
import org.twinlight.eclipse.BinaryParameters;
import org.twinlight.orbit.Orbit;
import org.twinlight.timing.MinimumType;

/**
 * How far each eclipse reaches before and after its minimum: first contact = minimum − before,
 * last contact = minimum + after, days.
 *
 * @param primaryBeforeDays first contact of the primary eclipse before its minimum, days
 * @param primaryAfterDays last contact after it, days
 * @param secondaryBeforeDays the same for the secondary eclipse
 * @param secondaryAfterDays the same for the secondary eclipse
 * @param source how it was found, for notes ("fitted model: first and last contact", "--duration 3.2 h")
 */
public record EclipseExtent(double primaryBeforeDays, double primaryAfterDays, double secondaryBeforeDays,
        double secondaryAfterDays, String source) {

    /** The same symmetric duration for both eclipses. */
    public static EclipseExtent ofDuration(double durationDays, String source) {
        if (!(durationDays > 0) || !Double.isFinite(durationDays)) {
            throw new BadInputException(String.format(Locale.ROOT,
                    "eclipse duration must be a positive time, got %s d", durationDays));
        }
        return new EclipseExtent(durationDays / 2, durationDays / 2, durationDays / 2, durationDays / 2, source);
    }

    /** Length of the eclipse of a type, days. */
    public double durationDays(MinimumType type) {
        return type == MinimumType.PRIMARY ? primaryBeforeDays + primaryAfterDays
                : secondaryBeforeDays + secondaryAfterDays;
    }

    /** Before the minimum, days. */
    public double beforeDays(MinimumType type) {
        return type == MinimumType.PRIMARY ? primaryBeforeDays : secondaryBeforeDays;
    }

    /** After the minimum, days. */
    public double afterDays(MinimumType type) {
        return type == MinimumType.PRIMARY ? primaryAfterDays : secondaryAfterDays;
    }

    /**
     * First and last contacts of a two-sphere model: the times around each conjunction at which
     * the projected separation of the centres equals r₁ + r₂ (units of a), found on the model's
     * own orbit ({@link Orbit.Positions#signedSeparation}) by bisection to 0.01 s. The minimum is
     * taken at conjunction (for eccentric orbits the light minimum lies within seconds of it).
     *
     * @throws BadInputException when the model has no eclipse of a type (the stars miss each other)
     */
    public static EclipseExtent ofModel(BinaryParameters model) {
        Orbit orbit = model.orbit();
        Orbit.Positions positions = orbit.positions();
        double contact = model.sumOfRadii();
        double p = orbit.periodDays();
        double primary = orbit.epochDays();
        double secondary = primary + p * orbit.secondaryPhase();
        double reach = positions.conjunctionHalfWidth(contact) * p;
        double[] pri = contacts(positions, primary, contact, reach, "primary");
        double[] sec = contacts(positions, secondary, contact, reach, "secondary");
        return new EclipseExtent(pri[0], pri[1], sec[0], sec[1],
                "fitted model: first and last contact (projected separation = r1 + r2)");
    }

    private static double[] contacts(Orbit.Positions pos, double conjunction, double contact, double reach,
            String which) {
        if (Math.abs(pos.signedSeparation(conjunction)) >= contact) {
            throw new BadInputException(String.format(Locale.ROOT, "the model has no %s eclipse: at conjunction the"
                    + " stars are %.4f a apart, more than r1 + r2 = %.4f a; give --duration instead", which,
                    Math.abs(pos.signedSeparation(conjunction)), contact));
        }
        return new double[] {conjunction - edge(pos, conjunction, conjunction - reach, contact),
            edge(pos, conjunction, conjunction + reach, contact) - conjunction};
    }

    /** The time between {@code inside} (separation below contact) and {@code outside} where it equals contact. */
    private static double edge(Orbit.Positions pos, double inside, double outside, double contact) {
        double in = inside;
        double out = outside;
        while (Math.abs(out - in) > 1e-7) {
            double mid = 0.5 * (in + out);
            if (Math.abs(pos.signedSeparation(mid)) < contact) {
                in = mid;
            } else {
                out = mid;
            }
        }
        return 0.5 * (in + out);
    }
}
