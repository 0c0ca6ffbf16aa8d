package org.twinlight.analysis;

import java.util.List;
import org.twinlight.BadInputException;

/**
 * The choices of the stages after the least-squares fit, one field per key of the settings file
 * ({@code docs/analyse.md}): the posterior sample, the joint fit with radial velocities, and the
 * absolute dimensions. Immutable; {@link #with} copies. The seed of the sampler is the analysis'
 * one seed ({@link AnalysisSettings#seed}).
 *
 * @param posterior whether the posterior is sampled after the fit
 * @param jitter whether the sampler adds an extra scatter per band and velocity file ({@code fit --jitter})
 * @param maxSteps steps per walker at most (null: {@link #DEFAULT_MAX_STEPS})
 * @param walkers number of walkers, even (null: max(32, 4 × the free parameters))
 * @param threads threads evaluating the model while sampling (null: the processors); the chain is
 *     the same with any number
 * @param velocities radial-velocity files fitted jointly with the light curves (absolute paths)
 * @param k1Kms K1 given, km/s (null: none given)
 * @param k1ErrorKms its 1σ error
 * @param k2Kms K2 given, km/s
 * @param k2ErrorKms its 1σ error
 * @param teff1K effective temperature of star 1, K (null: no luminosities)
 * @param teff1ErrorK its 1σ error
 * @param teff2K effective temperature of star 2, K (null: from Teff1 and the surface-brightness ratio)
 * @param teff2ErrorK its 1σ error
 * @param draws draws of the error propagation of the dimensions
 */
public record AfterFitSettings(boolean posterior, boolean jitter, Integer maxSteps, Integer walkers, Integer threads,
        List<String> velocities, Double k1Kms, double k1ErrorKms, Double k2Kms, double k2ErrorKms, Double teff1K,
        double teff1ErrorK, Double teff2K, double teff2ErrorK, int draws) {

    /** The keys of the settings file these settings answer to, in order. */
    public static final List<String> KEYS = List.of("posterior", "jitter", "maxSteps", "walkers", "threads", "velocities", "k1",
            "k1Error", "k2", "k2Error", "teff1", "teff1Error", "teff2", "teff2Error", "draws");
    /** Steps per walker at most when not given (as {@code fit --posterior}). */
    public static final int DEFAULT_MAX_STEPS = 20_000;
    /** Draws of the dimensions' error propagation when not given (as {@code dimensions}). */
    public static final int DEFAULT_DRAWS = 10_000;

    public AfterFitSettings {
        velocities = velocities == null ? List.of() : List.copyOf(velocities);
    }

    /** No posterior, no velocities, no dimensions. */
    public static AfterFitSettings defaults() {
        return new AfterFitSettings(false, false, null, null, null, List.of(), null, 0, null, 0, null, 0, null, 0,
                DEFAULT_DRAWS);
    }

    /** Whether the dimensions are computed: K1 and K2 from velocities or given. */
    public boolean dimensions() {
        return !velocities.isEmpty() || k1Kms != null;
    }

    /** A copy with the setting named {@code key} (one of {@link #KEYS}) set to {@code v}. */
    @SuppressWarnings("unchecked")
    public AfterFitSettings with(String key, Object v) {
        if (!KEYS.contains(key)) {
            throw new IllegalArgumentException("not a key of the stages after the fit: " + key);
        }
        return new AfterFitSettings(key.equals("posterior") ? (Boolean) v : posterior,
                key.equals("jitter") ? (Boolean) v : jitter,
                key.equals("maxSteps") ? (Integer) v : maxSteps,
                key.equals("walkers") ? (Integer) v : walkers,
                key.equals("threads") ? (Integer) v : threads,
                key.equals("velocities") ? (List<String>) v : velocities,
                key.equals("k1") ? (Double) v : k1Kms,
                key.equals("k1Error") ? (Double) v : k1ErrorKms,
                key.equals("k2") ? (Double) v : k2Kms,
                key.equals("k2Error") ? (Double) v : k2ErrorKms,
                key.equals("teff1") ? (Double) v : teff1K,
                key.equals("teff1Error") ? (Double) v : teff1ErrorK,
                key.equals("teff2") ? (Double) v : teff2K,
                key.equals("teff2Error") ? (Double) v : teff2ErrorK,
                key.equals("draws") ? (Integer) v : draws);
    }

    /**
     * Checks the values that do not depend on the data; a bad one is a {@link BadInputException}
     * naming its key ({@code where} says where the settings came from).
     */
    public AfterFitSettings validated(String where) {
        if (!posterior) {
            for (Object[] o : new Object[][] {{"jitter", jitter ? Boolean.TRUE : null}, {"maxSteps", maxSteps},
                    {"walkers", walkers}}) {
                if (o[1] != null) {
                    throw AnalysisSettings.bad(where, (String) o[0], "sets the posterior sampler; set 'posterior' "
                            + "to true (option --posterior), or leave it out");
                }
            }
        }
        if (maxSteps != null && maxSteps < 1) {
            throw AnalysisSettings.bad(where, "maxSteps", "expected a positive integer, got " + maxSteps);
        }
        if (walkers != null && (walkers < 4 || walkers % 2 != 0)) {
            throw AnalysisSettings.bad(where, "walkers", "expected an even number of at least twice the free "
                    + "parameters plus 2, got " + walkers);
        }
        if (threads != null && threads < 1) {
            throw AnalysisSettings.bad(where, "threads", "expected a positive integer, got " + threads);
        }
        boolean givenK = k1Kms != null || k2Kms != null;
        if (!velocities.isEmpty() && givenK) {
            throw AnalysisSettings.bad(where, k1Kms != null ? "k1" : "k2", "K1 and K2 come either from the velocities "
                    + "('velocities', option --velocities) or given ('k1', 'k2'), not both");
        }
        if (givenK && (k1Kms == null || k2Kms == null)) {
            throw AnalysisSettings.bad(where, k1Kms == null ? "k1" : "k2", "missing; the masses need the "
                    + "semi-amplitudes of both stars (no second star: a single-lined orbit gives only the mass "
                    + "function; give k1 and k2 together)");
        }
        positive(where, "k1", k1Kms, "a semi-amplitude > 0 km/s");
        positive(where, "k2", k2Kms, "a semi-amplitude > 0 km/s");
        positive(where, "teff1", teff1K, "a temperature > 0 K");
        positive(where, "teff2", teff2K, "a temperature > 0 K");
        if ((teff1K != null || teff2K != null) && !dimensions()) {
            throw AnalysisSettings.bad(where, teff1K != null ? "teff1" : "teff2", "temperatures give luminosities "
                    + "with the dimensions, which need K1 and K2: give 'velocities' or 'k1' and 'k2' too");
        }
        if (teff2K != null && teff1K == null) {
            throw AnalysisSettings.bad(where, "teff2", "give teff1 too (the temperature of star 1)");
        }
        String[] errorKeys = {"k1Error", "k2Error", "teff1Error", "teff2Error"};
        double[] errors = {k1ErrorKms, k2ErrorKms, teff1ErrorK, teff2ErrorK};
        Double[] values = {k1Kms, k2Kms, teff1K, teff2K};
        for (int i = 0; i < errors.length; i++) {
            if (!(errors[i] >= 0) || Double.isInfinite(errors[i])) {
                throw AnalysisSettings.bad(where, errorKeys[i], "expected an error >= 0, got " + errors[i]);
            }
            if (errors[i] > 0 && values[i] == null) {
                String key = errorKeys[i].substring(0, errorKeys[i].length() - "Error".length());
                throw AnalysisSettings.bad(where, errorKeys[i], "an error without its value: give '" + key
                        + "' too, or leave the error out");
            }
        }
        if (draws < 100) {
            throw AnalysisSettings.bad(where, "draws", "expected at least 100 draws, got " + draws);
        }
        return this;
    }

    private static void positive(String where, String key, Double v, String expected) {
        if (v != null && !(v > 0 && Double.isFinite(v))) {
            throw AnalysisSettings.bad(where, key, "expected " + expected + ", got " + v);
        }
    }
}
