package org.twinlight.cli;

import picocli.CommandLine;

/** The version printed by {@code --version} and written into result files. */
public final class VersionInfo implements CommandLine.IVersionProvider {

    /** The software version, from the jar manifest, or "development" when run from classes. */
    public static String version() {
        return org.twinlight.report.SoftwareVersion.version();
    }

    @Override
    public String[] getVersion() {
        return new String[] {"twinlight " + version()};
    }
}
