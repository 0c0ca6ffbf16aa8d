package org.twinlight.fit;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.twinlight.eclipse.BinaryParameters;
import org.twinlight.orbit.RocheLobe;

/** The remarks for the user, made from a fit's result after the fit. */
final class FitNotes {

    /**
     * The largest fractional radius a sphere with first-order tidal terms describes: common
     * practice puts the limit near r ≈ 0.25–0.3 (no source); the lower end is taken.
     */
    static final double MAX_SPHERICAL_RADIUS = 0.25;

    private FitNotes() {
    }

    /**
     * Notes for each star too large for spheres plus first-order proximity terms: a fractional
     * radius above {@link #MAX_SPHERICAL_RADIUS}, compared with its Roche-lobe radius (Eggleton
     * 1983, ApJ 268, 368) from the model's mass ratio, or with the lobe of an equal-mass pair when
     * the model has none.
     */
    static List<String> distortion(BinaryParameters p) {
        List<String> notes = new ArrayList<>();
        Double q = p.proximity().effectiveMassRatio();
        for (int star = 1; star <= 2; star++) {
            double r = star == 1 ? p.radius1() : p.radius2();
            // the lobe of star j takes its own mass over the companion's: m1/m2 = 1/q for star 1
            double lobe = RocheLobe.eggletonRadius(q == null ? 1.0 : star == 1 ? 1 / q : q);
            String lobeText = q == null
                    ? String.format(Locale.ROOT, "with no massRatio in the model, the Roche lobe of an equal-mass pair "
                            + "is %.3f (Eggleton 1983)", lobe)
                    : String.format(Locale.ROOT, "it fills %.0f%% of its Roche lobe (radius %.3f for massRatio %.3g; "
                            + "Eggleton 1983)", 100 * r / lobe, lobe, q);
            if (r >= lobe) {
                notes.add(String.format(Locale.ROOT, "star %d is too distorted for this model: radius%d = %.3f reaches "
                        + "its Roche lobe (%s); the pair is semi-detached or in contact and spheres cannot describe it, "
                        + "so its radii and inclination are not to be trusted", star, star, r, lobeText));
            } else if (r > MAX_SPHERICAL_RADIUS) {
                notes.add(String.format(Locale.ROOT, "star %d is too distorted for this model: radius%d = %.3f is above "
                        + "%.2f, where a sphere with first-order tidal terms stops describing the star (common "
                        + "practice); %s. Radii and inclination may be biased; %s", star, star, r,
                        MAX_SPHERICAL_RADIUS, lobeText, p.proximity().ellipsoidal() == null
                                ? "switch on the ellipsoidal and reflection terms (docs/model.md) and compare, or "
                                        + "use a model of distorted stars"
                                : "treat the fitted values with caution or use a model of distorted stars"));
            }
        }
        return notes;
    }

    /**
     * @param r the result (its notes are ignored)
     * @param bands the fitted bands
     * @param unboundedLimits names of values at a bound whose profile never reached the 95% level
     */
    static List<String> of(FitResult r, List<String> bands, List<String> unboundedLimits) {
        List<String> notes = new ArrayList<>();
        if (r.adequacy().note() != null) {
            notes.add(r.adequacy().note());
        }
        if (r.clippedCount() > 0) {
            notes.add(String.format(Locale.ROOT, "%d point(s) were left out as outliers against the model "
                    + "(%s); the input file is unchanged and residuals.csv lists them", r.clippedCount(),
                    r.clipped().entrySet().stream().filter(e -> e.getValue() > 0)
                            .map(e -> e.getValue() + (e.getKey().equals("aboveModel") ? " above" : " below") + " the model").reduce((a, b) -> a + ", " + b).orElse("")));
        }
        for (Estimate e : r.parameters()) {
            if (e.isLimit()) {
                notes.add(String.format(Locale.ROOT, "%s sits at its physical bound: reported as a one-sided limit, "
                        + "%s %s %.6g at 95%% (best %.6g, one-sided 68%% distance %.3g)", e.name(), e.name(),
                        e.limit().side().equals("lower") ? ">" : "<", e.limit().value95(), e.value(),
                        e.uncertainty()));
            }
            boolean geometry = e.name().equals("radius1") || e.name().equals("radius2");
            if (geometry && e.free() && e.uncertainty() > 0.5 * e.value()) {
                notes.add(String.format(Locale.ROOT, "%s is barely constrained (%.3g ± %.3g): treat the geometry as "
                        + "undetermined", e.name(), e.value(), e.uncertainty()));
            }
        }
        for (String name : unboundedLimits) {
            notes.add(name + ": the data do not bound it at the 95% level anywhere in its range; its limit is the "
                    + "end of the range searched");
        }
        if (r.parameters().stream().anyMatch(e -> e.name().equals("eccentricity") && e.isLimit())
                && r.parameters().stream().anyMatch(e -> e.name().equals("omega") && e.free())) {
            notes.add("with the eccentricity consistent with 0, omega is undetermined: quote eCosOmega and eSinOmega");
        }
        notes.addAll(distortion(r.model().common()));
        if (r.errorsEstimated()) {
            notes.add("some data had no errors: they were estimated from the point-to-point scatter");
        }
        for (String band : bands) {
            BinaryParameters bp = r.model().forBand(band);
            String where = bands.size() > 1 ? " in band " + band : "";
            for (int star = 1; star <= 2; star++) {
                if (!(star == 1 ? bp.limbDarkening1() : bp.limbDarkening2()).isNonNegative()) {
                    notes.add("the fitted limb darkening of star " + star + where + " gives a negative intensity near "
                            + "the limb: the data do not constrain it; fix its coefficients or choose another law");
                }
            }
        }
        double[][] corr = r.correlation();
        for (int a = 0; a < corr.length; a++) {
            for (int b = a + 1; b < corr.length; b++) {
                if (Math.abs(corr[a][b]) > 0.98) {
                    notes.add(String.format(Locale.ROOT, "%s and %s are strongly correlated (%.3f): their errors are "
                            + "not independent; use the correlation matrix when propagating them",
                            r.freeNames().get(a), r.freeNames().get(b), corr[a][b]));
                }
            }
        }
        return List.copyOf(notes);
    }
}
