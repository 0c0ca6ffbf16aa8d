package org.twinlight.timing.minima;

/** The ephemeris models fitted to an O−C diagram. */
public enum EphemerisModel {
    /** T = T₀ + P·E. */
    LINEAR("linear"),
    /** T = T₀ + P·E + Q·E²; dP/dE = 2Q. */
    QUADRATIC("quadratic"),
    /** T = T₀ + P·E + light-time delay of a third body (Irwin 1952, ApJ 116, 211). */
    LIGHT_TIME("lightTime");

    private final String label;

    EphemerisModel(String label) {
        this.label = label;
    }

    /** Name used in files. */
    public String label() {
        return label;
    }
}
