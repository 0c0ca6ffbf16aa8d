package org.twinlight.fit;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.twinlight.eclipse.BinaryParameters;

/** The remarks for the user, made from a fit's result after the fit. */
final class FitNotes {

    private FitNotes() {
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
