package org.ringsweep.runner.cli;

import picocli.CommandLine.IVersionProvider;

/** Reads the version from the jar manifest (set by the build), never from a literal. */
public final class VersionProvider implements IVersionProvider {
    @Override
    public String[] getVersion() {
        String v = Main.class.getPackage().getImplementationVersion();
        return new String[] {"ringsweep " + (v == null ? "(development build)" : v)};
    }
}
