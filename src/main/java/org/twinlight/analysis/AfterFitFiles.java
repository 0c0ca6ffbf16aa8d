package org.twinlight.analysis;

import com.fasterxml.jackson.databind.node.ObjectNode;
import java.util.Map;
import org.twinlight.BadInputException;
import org.twinlight.WorkFailedException;
import org.twinlight.dimensions.DimensionEstimate;
import org.twinlight.dimensions.Quantity;
import org.twinlight.report.DimensionsFromFit;
import org.twinlight.report.FitJsonInput;
import org.twinlight.report.JointFitFiles;
import org.twinlight.report.PosteriorFiles;
import org.twinlight.report.ResultSet;

/**
 * The files of the stages after the fit, written with the others by {@link AnalysisFiles}: the
 * posterior and velocity blocks of fit.json, chain.csv.gz, trace.png, corner.png, the velocity
 * plots, and the absolute dimensions computed from the fit.json just written (as the
 * {@code dimensions} command computes them from a fit.json).
 */
final class AfterFitFiles {
    /** Key results of the dimensions: the name in the outcome (and summary.csv) and the quantity. */
    private static final Map<String, Quantity> KEY_DIMENSIONS = keyDimensions();

    private AfterFitFiles() {
    }

    private static Map<String, Quantity> keyDimensions() {
        Map<String, Quantity> m = new java.util.LinkedHashMap<>();
        m.put("mass1", Quantity.MASS1);
        m.put("mass2", Quantity.MASS2);
        m.put("radius1Rsun", Quantity.RADIUS1);
        m.put("radius2Rsun", Quantity.RADIUS2);
        m.put("logg1", Quantity.LOGG1);
        m.put("logg2", Quantity.LOGG2);
        m.put("logLuminosity1", Quantity.LOG_LUMINOSITY1);
        m.put("logLuminosity2", Quantity.LOG_LUMINOSITY2);
        return java.util.Collections.unmodifiableMap(m);
    }

    /** Adds the {@code posterior}, {@code convergence} and {@code velocities} blocks to fit.json, as {@code fit} does. */
    static void addToFitJson(AnalysisState st, ObjectNode doc) {
        if (st.posterior != null) {
            PosteriorFiles.addTo(doc, st.posterior);
        }
        if (st.joint != null) {
            JointFitFiles.putVelocities(doc, st.fit.result(), st.joint, st.velocityFiles);
        }
    }

    /** chain.csv.gz, trace.png, corner.png and the velocity plots, as {@code fit} writes them. */
    static void writeFitExtras(AnalysisState st, ResultSet set, Map<String, byte[]> images) {
        if (st.posterior != null) {
            PosteriorFiles.writeAll(set::file, st.posterior, "Posterior of " + st.request.label());
            images.put("trace.png", AnalysisFiles.bytes(set.file("trace.png")));
            images.put("corner.png", AnalysisFiles.bytes(set.file("corner.png")));
        }
        if (st.joint != null) {
            for (String name : JointFitFiles.writePlots(set::file, st.fit.result(), st.joint, st.velocityFiles,
                    st.request.label())) {
                images.put(name, AnalysisFiles.bytes(set.file(name)));
            }
        }
    }

    /**
     * The absolute dimensions from the fit.json just written to {@code set}, when K1 and K2 are known
     * (fitted jointly, or given): dimensions.json, dimensions.txt, mass-radius.png and, with
     * temperatures, mass-luminosity.png; {@code "dimensions"} in results.json. When they cannot be
     * computed the run has a doubt saying why (exit 1).
     */
    static void writeDimensions(AnalysisState st, ResultSet set, String version, ObjectNode results,
            Map<String, byte[]> images) {
        AfterFitSettings a = st.settings.afterFit();
        if (!a.dimensions()) {
            return;
        }
        if (st.joint == null && !a.velocities().isEmpty()) {
            return; // the joint fit did not run (the run stopped before)
        }
        if (st.joint != null && !st.joint.doubleLined()) {
            st.doubts.add("no absolute dimensions: the velocity files have no velocities of star 2, so K2 and the "
                    + "masses are unknown (a single-lined orbit gives only the mass function)");
            return;
        }
        try {
            FitJsonInput fit = FitJsonInput.read(set.file("fit.json"));
            if (fit.convergence() != null && !fit.convergence().converged()) {
                // an unconverged chain's spread is not the posterior's: the covariance gives the errors
                fit = new FitJsonInput(fit.file(), fit.timeScale(), fit.model(), fit.values(), fit.uncertainties(),
                        fit.correlationNames(), fit.correlation(), false, fit.lightCurveName(), null, fit.firstBand());
            }
            DimensionsFromFit.Elements el = DimensionsFromFit.elements(fit, "fit.json", st.joint != null, false);
            DimensionsFromFit.SemiAmplitudes k = st.joint != null
                    ? DimensionsFromFit.SemiAmplitudes.fitted(el, String.join(", ", st.velocityFiles.stream()
                            .map(f -> f.getFileName().toString()).toList()))
                    : DimensionsFromFit.SemiAmplitudes.given(a.k1Kms(), a.k1ErrorKms(), a.k2Kms(), a.k2ErrorKms(), el);
            DimensionsFromFit.Outcome o = DimensionsFromFit.propagate(el, k, new DimensionsFromFit.Temperatures(
                    a.teff1K(), a.teff1ErrorK(), a.teff2K(), a.teff2ErrorK()), a.draws(), st.settings.seed());
            for (String name : DimensionsFromFit.write(o, set::file, "Absolute dimensions of " + st.request.label(),
                    version)) {
                if (name.endsWith(".png")) {
                    images.put(name, AnalysisFiles.bytes(set.file(name)));
                }
            }
            st.dimensions = o;
            o.warnings().forEach(w -> st.notes.add("dimensions: " + w));
            results.set("dimensions", AnalysisFiles.readJson(set.file("dimensions.json")));
        } catch (BadInputException | WorkFailedException e) {
            st.doubts.add("the absolute dimensions could not be computed: " + e.getMessage());
        }
    }

    /** The key results of the dimensions: masses, radii (nominal solar units), log g and, with temperatures, log L. */
    static void keyResults(AnalysisState st, Map<String, AnalysisOutcome.Value> m) {
        if (st.dimensions == null) {
            return;
        }
        KEY_DIMENSIONS.forEach((name, q) -> {
            DimensionEstimate e = st.dimensions.result().estimates().get(q);
            if (e != null) {
                m.put(name, new AnalysisOutcome.Value(e.value(), e.uncertainty()));
            }
        });
    }
}
