package org.twinlight.cli;

import java.util.LinkedHashMap;
import java.util.Map;
import picocli.CommandLine.Option;

/**
 * The options of the absolute dimensions shared by {@code dimensions} and {@code analyse}: K1 and
 * K2 given with their errors, the effective temperatures with theirs, and the number of draws of
 * the error propagation. Null when not given.
 */
final class DimensionsOptions {

    @Option(names = "--k1", paramLabel = "KMS", description = "K1 in km/s, instead of --velocities.")
    Double k1;

    @Option(names = "--k1-error", paramLabel = "KMS",
            description = "1-sigma error of --k1 (default 0: mass errors are then understated).")
    Double k1Error;

    @Option(names = "--k2", paramLabel = "KMS", description = "K2 in km/s, with --k1.")
    Double k2;

    @Option(names = "--k2-error", paramLabel = "KMS", description = "1-sigma error of --k2 (default 0).")
    Double k2Error;

    @Option(names = "--teff1", paramLabel = "K",
            description = "Effective temperature of star 1 (the star eclipsed at primary eclipse): luminosities.")
    Double teff1;

    @Option(names = "--teff1-error", paramLabel = "K", description = "Its 1-sigma error (default 0).")
    Double teff1Error;

    @Option(names = "--teff2", paramLabel = "K", description = "Effective temperature of star 2 (default: Teff1 "
            + "times the fourth root of the fitted surface-brightness ratio, an approximation).")
    Double teff2;

    @Option(names = "--teff2-error", paramLabel = "K", description = "Its 1-sigma error (default 0).")
    Double teff2Error;

    @Option(names = "--draws", paramLabel = "N",
            description = "Number of draws for the error propagation (default: 10000).")
    Integer draws;

    /** An error given, or 0. */
    static double orZero(Double error) {
        return error == null ? 0 : error;
    }

    /** The options by their key in analyse's settings file (null where not given). */
    Map<String, Object> settingsEntries() {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("k1", k1);
        m.put("k1Error", k1Error);
        m.put("k2", k2);
        m.put("k2Error", k2Error);
        m.put("teff1", teff1);
        m.put("teff1Error", teff1Error);
        m.put("teff2", teff2);
        m.put("teff2Error", teff2Error);
        m.put("draws", draws);
        return m;
    }
}
