package org.fabspread.cli;

import org.fabspread.pipeline.BuildInfo;

/** Provides {@code --version}. */
public final class VersionProvider implements picocli.CommandLine.IVersionProvider {
    @Override
    public String[] getVersion() {
        return new String[] {"fabspread " + BuildInfo.version() + " (commit " + BuildInfo.commit() + ", built "
                + BuildInfo.date() + ")"};
    }
}
