package org.twinlight.analysis;

import java.nio.file.Path;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import org.twinlight.eclipse.ModelFile;
import org.twinlight.fit.FitData;
import org.twinlight.fit.FitSettings;
import org.twinlight.fit.StartingValues;
import org.twinlight.photometry.LightCurve;
import org.twinlight.photometry.LightCurveSummary;
import org.twinlight.time.TimeScale;
import org.twinlight.timing.Ephemeris;
import org.twinlight.timing.minima.MinimumSearchResult;
import org.twinlight.timing.minima.OcResult;
import org.twinlight.timing.period.PeriodSearchResult;

/**
 * What one run of {@link TargetAnalysis} has found so far, stage by stage; the report is written
 * from it whether the run finished or stopped. Owned by one run only (never shared between runs).
 */
final class AnalysisState {
    final AnalysisRequest request;
    final Instant started;
    /** The settings as used: the request's, with values found from the data made explicit. */
    AnalysisSettings settings;

    /** One input file. */
    record Input(Path file, String sha256, String band, String bandSource, LightCurve lightCurve,
            LightCurveSummary summary) {
    }

    final List<Input> inputs = new ArrayList<>();
    /** The light curve of the period search and the times of minimum (the largest file). */
    LightCurve main;
    TimeScale timeScale;

    PeriodSearchResult period;
    /** Where the period and epoch came from, in words. */
    String ephemerisSource;
    Ephemeris searchEphemeris;
    double secondaryPhase = 0.5;

    MinimumSearchResult minima;
    OcResult oc;
    /** The ephemeris the fit starts from. */
    Ephemeris ephemeris;

    ModelFile baseModel;
    java.util.Map<String, StartingValues> estimates;
    FitSettings fitSettings;
    List<FitData> fitData;
    MultiStartFit.Outcome fit;

    /** The velocity files of the joint fit and their data, in order (empty without velocities). */
    final List<Path> velocityFiles = new ArrayList<>();
    final List<org.twinlight.velocity.VelocityData> velocityData = new ArrayList<>();
    /** The velocities of the joint fit, null without one. */
    org.twinlight.fit.JointVelocities joint;
    /** The problem the fit's result solves when it is not the light curves' alone (the joint fit), else null. */
    org.twinlight.fit.FitProblem problem;
    /** The posterior sample, null when not sampled. */
    org.twinlight.fit.Posterior posterior;
    /** The absolute dimensions, null when not computed. */
    org.twinlight.report.DimensionsFromFit.Outcome dimensions;

    /** Why the run stopped (null when it did not), with the stage. */
    String failure;
    String failedStage;
    /** Reasons the answer is not certain although results exist (exit 1). */
    final List<String> doubts = new ArrayList<>();
    /** Remarks that do not change the verdict. */
    final List<String> notes = new ArrayList<>();
    /** Seconds spent per stage, in order. */
    final java.util.Map<String, Double> stageSeconds = new java.util.LinkedHashMap<>();

    AnalysisState(AnalysisRequest request, Instant started) {
        this.request = request;
        this.started = started;
        this.settings = request.settings();
    }

    String timeScaleLabel() {
        return timeScale == null ? "unknown" : timeScale.label();
    }
}
