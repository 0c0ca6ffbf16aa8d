package org.twinlight.analysis;

import java.util.List;
import org.twinlight.BadInputException;
import org.twinlight.eclipse.LimbDarkening;
import org.twinlight.fit.Baseline;
import org.twinlight.fit.FitSettings;
import org.twinlight.photometry.ReadOptions;
import org.twinlight.photometry.ValueKind;
import org.twinlight.time.TimeScale;

/**
 * Every choice of an analysis, one field per key of the settings file ({@code docs/analyse.md});
 * null means "find it from the data" or "detect it". Immutable; {@code withX} copies.
 *
 * @param files the light curves (several = several bands or instruments sharing the geometry)
 * @param label the target's name in the report (null: the first file's name)
 * @param bands the band of each file, in order (empty: the file's band column, else its name)
 * @param timeScale declared time scale of text files, e.g. {@code BJD_TDB} (null: from the file)
 * @param timeOffsetDays days added to every time
 * @param timeColumn time column, by name or 1-based number
 * @param valueColumn flux or magnitude column
 * @param errorColumn error column
 * @param bandColumn band column
 * @param qualityColumn quality-flag column
 * @param values {@code flux} or {@code magnitude}
 * @param hdu FITS HDU of the table
 * @param periodDays the period, days (null: searched)
 * @param epochDays time of a primary minimum, days (null: found)
 * @param minPeriodDays shortest trial period of the search
 * @param maxPeriodDays longest trial period of the search
 * @param model a starting model file (null: starting values from the data)
 * @param free the parameters fitted
 * @param baseline flux normalisation per segment: none, offset, linear or quadratic
 * @param segmentGapDays gap that splits the data into segments, days
 * @param clipSigma outlier clipping level in robust σ (NaN: no clipping)
 * @param maxIterations solver iteration limit
 * @param starts number of starting points of the fit
 * @param limbDarkening1 limb darkening of star 1 (ignored when a model file is given)
 * @param limbDarkening2 limb darkening of star 2
 * @param exposureTimeDays exposure time for smearing, days (null: the median spacing of the points)
 * @param supersample sub-exposures per exposure (null: one per 2 minutes of exposure, at least 1)
 * @param seed seed of every random draw (the bootstrap of the times of minimum, the global search, the
 *     posterior sampler and the draws of the dimensions)
 * @param afterFit the stages after the fit: posterior, joint fit with velocities, dimensions
 */
public record AnalysisSettings(List<String> files, String label, List<String> bands, String timeScale,
        Double timeOffsetDays, String timeColumn, String valueColumn, String errorColumn, String bandColumn,
        String qualityColumn, String values, Integer hdu, Double periodDays, Double epochDays, Double minPeriodDays,
        Double maxPeriodDays, String model, List<String> free, String baseline, double segmentGapDays,
        double clipSigma, int maxIterations, int starts, LimbDarkening limbDarkening1,
        LimbDarkening limbDarkening2, Double exposureTimeDays, Integer supersample, long seed,
        AfterFitSettings afterFit) {

    /**
     * Parameters fitted by default: the ephemeris, the whole geometry, the orbit's shape (e = 0 is an
     * ordinary point of the fit) and the first limb-darkening coefficient of each star (the second
     * fixed: the two are strongly correlated; common practice, no source). A fixed limb darkening
     * that differs from the stars' biases the radii and inclination by many of their formal errors
     * at space-mission precision.
     */
    public static final List<String> DEFAULT_FREE = List.of("period", "epoch", "radius1", "radius2", "inclination",
            "eccentricity", "omega", "surfaceBrightnessRatio", "limbDarkening1.a", "limbDarkening2.a");
    /** Starting points of the fit by default. */
    public static final int DEFAULT_STARTS = 6;
    /**
     * Limb darkening when none is given: quadratic (a, b) = (0.4, 0.25) for both stars, typical of
     * solar-type stars in visual bands (common practice, no source). Fixed unless named free.
     */
    public static final LimbDarkening DEFAULT_LIMB_DARKENING = LimbDarkening.quadratic(0.4, 0.25);

    public AnalysisSettings {
        files = files == null ? List.of() : List.copyOf(files);
        bands = bands == null ? List.of() : List.copyOf(bands);
        free = free == null ? DEFAULT_FREE : List.copyOf(free);
        afterFit = afterFit == null ? AfterFitSettings.defaults() : afterFit;
    }

    /** Nothing declared: everything found from the data, with the defaults above. */
    public static AnalysisSettings defaults() {
        return new AnalysisSettings(List.of(), null, List.of(), null, null, null, null, null, null, null, null, null,
                null, null, null, null, null, DEFAULT_FREE, "offset", 0.5, FitSettings.DEFAULT_CLIP_SIGMA, 200,
                DEFAULT_STARTS, DEFAULT_LIMB_DARKENING, DEFAULT_LIMB_DARKENING, null, null, 1L,
                AfterFitSettings.defaults());
    }

    public AnalysisSettings withFiles(List<String> v) {
        return with("files", v);
    }

    public AnalysisSettings withEphemeris(Double period, Double epoch) {
        return with("period", period).with("epoch", epoch);
    }

    public AnalysisSettings withExposure(Double exposureDays, Integer subExposures) {
        return with("exposureTime", exposureDays).with("supersample", subExposures);
    }

/**
 * A copy with the setting named {@code key} (a key of the settings file) set to {@code v}, of the
 * key's type (String, Double, Integer, Long, Boolean, List of String or LimbDarkening).
 */
    @SuppressWarnings("unchecked")
    public AnalysisSettings with(String key, Object v) {
        if (AfterFitSettings.KEYS.contains(key)) {
            return withAfterFit(afterFit.with(key, v));
        }
        return new AnalysisSettings(key.equals("files") ? (List<String>) v : files,
                key.equals("label") ? (String) v : label,
                key.equals("bands") ? (List<String>) v : bands,
                key.equals("timeScale") ? (String) v : timeScale,
                key.equals("timeOffset") ? (Double) v : timeOffsetDays,
                key.equals("timeColumn") ? (String) v : timeColumn,
                key.equals("valueColumn") ? (String) v : valueColumn,
                key.equals("errorColumn") ? (String) v : errorColumn,
                key.equals("bandColumn") ? (String) v : bandColumn,
                key.equals("qualityColumn") ? (String) v : qualityColumn,
                key.equals("values") ? (String) v : values,
                key.equals("hdu") ? (Integer) v : hdu,
                key.equals("period") ? (Double) v : periodDays,
                key.equals("epoch") ? (Double) v : epochDays,
                key.equals("minPeriod") ? (Double) v : minPeriodDays,
                key.equals("maxPeriod") ? (Double) v : maxPeriodDays,
                key.equals("model") ? (String) v : model,
                key.equals("free") ? (List<String>) v : free,
                key.equals("baseline") ? (String) v : baseline,
                key.equals("segmentGap") ? (Double) v : segmentGapDays,
                key.equals("clip") ? (Double) v : clipSigma,
                key.equals("maxIterations") ? (Integer) v : maxIterations,
                key.equals("starts") ? (Integer) v : starts,
                key.equals("limbDarkening1") ? (LimbDarkening) v : limbDarkening1,
                key.equals("limbDarkening2") ? (LimbDarkening) v : limbDarkening2,
                key.equals("exposureTime") ? (Double) v : exposureTimeDays,
                key.equals("supersample") ? (Integer) v : supersample,
                key.equals("seed") ? (Long) v : seed, afterFit);
    }

    /** A copy with the settings of the stages after the fit replaced. */
    public AnalysisSettings withAfterFit(AfterFitSettings a) {
        return new AnalysisSettings(files, label, bands, timeScale, timeOffsetDays, timeColumn, valueColumn,
                errorColumn, bandColumn, qualityColumn, values, hdu, periodDays, epochDays, minPeriodDays,
                maxPeriodDays, model, free, baseline, segmentGapDays, clipSigma, maxIterations, starts, limbDarkening1,
                limbDarkening2, exposureTimeDays, supersample, seed, a);
    }

    /**
     * Checks the values that do not depend on the data; a bad one is a {@link BadInputException}
     * naming its key ({@code where} says where the settings came from).
     */
    public AnalysisSettings validated(String where) {
        if (files.isEmpty()) {
            throw bad(where, "files", "no light curve given; name at least one file");
        }
        if (!bands.isEmpty() && bands.size() != files.size()) {
            throw bad(where, "bands", bands.size() + " band(s) for " + files.size() + " file(s); give one per file, in "
                    + "order, or none");
        }
        readOptions(where);
        positive(where, "period", periodDays);
        finite(where, "epoch", epochDays);
        positive(where, "minPeriod", minPeriodDays);
        positive(where, "maxPeriod", maxPeriodDays);
        if (minPeriodDays != null && maxPeriodDays != null && !(maxPeriodDays > minPeriodDays)) {
            throw bad(where, "maxPeriod", "must exceed minPeriod (" + minPeriodDays + " d), got " + maxPeriodDays);
        }
        if (epochDays != null && periodDays == null) {
            throw bad(where, "epoch", "an epoch needs a period: give the period too, or neither");
        }
        if (free.isEmpty()) {
            throw bad(where, "free", "no parameter named; name at least one, e.g. " + String.join(",", DEFAULT_FREE));
        }
        baselineKind(where);
        if (!(segmentGapDays > 0) || Double.isInfinite(segmentGapDays)) {
            throw bad(where, "segmentGap", "expected a positive number of days, got " + segmentGapDays);
        }
        if (!Double.isNaN(clipSigma) && !(clipSigma >= FitSettings.MIN_CLIP_SIGMA && Double.isFinite(clipSigma))) {
            throw bad(where, "clip", "expected a number of standard deviations of at least "
                    + FitSettings.MIN_CLIP_SIGMA + " or \"none\", got " + clipSigma);
        }
        if (maxIterations < 1) {
            throw bad(where, "maxIterations", "expected a positive integer, got " + maxIterations);
        }
        if (starts < 1 || starts > 50) {
            throw bad(where, "starts", "expected an integer from 1 to 50, got " + starts);
        }
        if (exposureTimeDays != null && !(exposureTimeDays >= 0 && Double.isFinite(exposureTimeDays))) {
            throw bad(where, "exposureTime", "expected days ≥ 0, got " + exposureTimeDays);
        }
        if (supersample != null && (supersample < 1 || supersample > 200)) {
            throw bad(where, "supersample", "expected an integer from 1 to 200, got " + supersample);
        }
        afterFit.validated(where);
        return this;
    }

    /** The reading options of every file. */
    public ReadOptions readOptions(String where) {
        ValueKind kind = null;
        if (values != null) {
            kind = switch (values.trim().toLowerCase(java.util.Locale.ROOT)) {
                case "flux" -> ValueKind.FLUX;
                case "magnitude", "magnitudes", "mag" -> ValueKind.MAGNITUDE;
                default -> throw bad(where, "values", "expected \"flux\" or \"magnitude\", got \"" + values + "\"");
            };
        }
        TimeScale scale = timeScale == null ? null : TimeScale.parse(timeScale).orElseThrow(() -> bad(where,
                "timeScale", "unknown time scale \"" + timeScale + "\"; expected one of " + TimeScale.acceptedLabels()));
        finite(where, "timeOffset", timeOffsetDays);
        if (hdu != null && hdu < 0) {
            throw bad(where, "hdu", "expected an HDU index ≥ 0, got " + hdu);
        }
        return new ReadOptions(timeColumn, valueColumn, errorColumn, bandColumn, qualityColumn, kind, scale,
                timeOffsetDays, hdu);
    }

    /** The baseline kind. */
    public Baseline baselineKind(String where) {
        return Baseline.parse(baseline).orElseThrow(() -> bad(where, "baseline",
                "expected none, offset, linear or quadratic, got \"" + baseline + "\""));
    }

    private static void positive(String where, String key, Double v) {
        if (v != null && !(v > 0 && Double.isFinite(v))) {
            throw bad(where, key, "expected a positive number of days, got " + v);
        }
    }

    private static void finite(String where, String key, Double v) {
        if (v != null && !Double.isFinite(v)) {
            throw bad(where, key, "expected a finite number of days, got " + v);
        }
    }

    static BadInputException bad(String where, String key, String problem) {
        return new BadInputException(where + ": key '" + key + "': " + problem);
    }
}
