package org.twinlight.report;

/** The software version written into every result file. */
public final class SoftwareVersion {
    private SoftwareVersion() {
    }

    /** The version from the jar manifest, or "development" when run from classes. */
    public static String version() {
        String v = SoftwareVersion.class.getPackage().getImplementationVersion();
        return v == null ? "development" : v;
    }
}
