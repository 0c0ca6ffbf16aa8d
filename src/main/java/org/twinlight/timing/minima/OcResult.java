package org.twinlight.timing.minima;

import org.twinlight.timing.Ephemeris;

import java.util.List;
import java.util.Objects;
import java.util.stream.Stream;

/**
 * An O−C diagram with the ephemeris models fitted to it.
 *
 * @param reference the ephemeris the O−C are taken against
 * @param points the timings with their O−C, in time order
 * @param linear the linear ephemeris fit
 * @param quadratic the quadratic ephemeris fit, or null when there are too few timings
 * @param lightTime the light-travel-time fit, or null when not attempted or not possible
 * @param preferred the model the data support: linear unless a richer one passed the strong-evidence
 *     and physical checks of {@link OcModelChoice}
 * @param modelNotes why each richer model was or was not accepted, for people
 * @param primaryMinusSecondary primary and secondary drifts, or null without two of each type
 */
public record OcResult(Ephemeris reference, List<OcPoint> points, EphemerisFit linear, EphemerisFit quadratic,
        EphemerisFit lightTime, EphemerisModel preferred, List<String> modelNotes, OcSeriesDifference primaryMinusSecondary) {

    public OcResult {
        Objects.requireNonNull(reference, "reference");
        Objects.requireNonNull(linear, "linear");
        points = List.copyOf(points);
        modelNotes = List.copyOf(modelNotes);
    }

    /** The fit of the preferred model. */
    public EphemerisFit preferredFit() {
        return switch (preferred) {
            case LINEAR -> linear;
            case QUADRATIC -> quadratic;
            case LIGHT_TIME -> lightTime;
        };
    }

    /** True when a period change (quadratic or light-time) passed the checks. */
    public boolean periodChangeFound() {
        return preferred != EphemerisModel.LINEAR;
    }

    /** The ΔBIC above which a richer model counts (strong evidence, Kass &amp; Raftery 1995). */
    public static double strongEvidenceDeltaBic() {
        return OcModelChoice.STRONG_DELTA_BIC;
    }

    /**
     * True when the secondary offset from phase 0.5 was fixed at the value measured in the folded
     * light curve instead of fitted to the timings (see {@link OcAnalysis}).
     */
    public boolean secondaryOffsetFixed() {
        return modelNotes.stream().anyMatch(n -> n.contains(OcAnalysis.OFFSET_NOT_SEPARABLE));
    }

    /** Every fitted model, linear first. */
    public List<EphemerisFit> fits() {
        return Stream.of(linear, quadratic, lightTime).filter(Objects::nonNull).toList();
    }
}
