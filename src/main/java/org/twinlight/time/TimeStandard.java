package org.twinlight.time;

/** The clock whose seconds the times count. */
public enum TimeStandard {
    /** Coordinated Universal Time, with leap seconds. */
    UTC,
    /** International Atomic Time. */
    TAI,
    /** Terrestrial Time, TT = TAI + 32.184 s. */
    TT,
    /** Barycentric Dynamical Time. */
    TDB
}
