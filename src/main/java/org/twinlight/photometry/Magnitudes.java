package org.twinlight.photometry;

/**
 * Magnitudes and relative flux. Pogson's definition m = −2.5 log10 F (Pogson 1856, MNRAS 17, 12)
 * gives the relative flux F = 10^(−0.4 m); its 1σ error follows from first-order error
 * propagation σ_F = |dF/dm| σ_m = 0.4 ln 10 · F · σ_m (Bevington &amp; Robinson 2003, Data
 * Reduction and Error Analysis for the Physical Sciences, 3rd ed., ch. 3, eq. 3.14).
 */
public final class Magnitudes {

    /** 0.4 ln 10 = ln(10)/2.5: the factor between a magnitude error and a relative flux error. */
    public static final double FLUX_PER_MAGNITUDE = 0.4 * Math.log(10.0);

    private Magnitudes() {
    }

    /** Relative flux 10^(−0.4 m) of magnitude {@code m}. */
    public static double toRelativeFlux(double magnitude) {
        return Math.pow(10.0, -0.4 * magnitude);
    }

    /** The 1σ error of the relative flux {@code flux} whose magnitude has error {@code magnitudeError}. */
    public static double toFluxError(double flux, double magnitudeError) {
        return FLUX_PER_MAGNITUDE * flux * magnitudeError;
    }

    /** Magnitude −2.5 log10 F of the relative flux {@code flux} (which must be positive). */
    public static double fromRelativeFlux(double flux) {
        return -2.5 * Math.log10(flux);
    }

    /** The 1σ magnitude error of a relative flux {@code flux} with error {@code fluxError}. */
    public static double toMagnitudeError(double flux, double fluxError) {
        return fluxError / (FLUX_PER_MAGNITUDE * flux);
    }
}
