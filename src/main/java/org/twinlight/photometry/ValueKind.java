package org.twinlight.photometry;

/** What the value column of a photometry file held before it was turned into relative flux. */
public enum ValueKind {
    /** Flux in any linear unit (normalised or not). */
    FLUX,
    /** Magnitudes; turned into relative flux 10^(−0.4 m). */
    MAGNITUDE
}
