package org.fabspread.cli;

import org.fabspread.study.ReadOptions;

import picocli.CommandLine.Option;

/**
 * The option every command that reads a study shares: whether the study's data files (n,k tables,
 * measured values, enhancement tables) may lie outside the study's folder. Used as a picocli mixin.
 */
public final class DataFileOptions {

    @Option(names = "--allow-outside-files",
            description = "Let the study read data files outside its own folder (refused by default).")
    boolean allowOutsideFiles;

    /** Options for commands that look at the device (no spread needed). */
    public ReadOptions forTools() {
        return ReadOptions.defaults().allowingOutsideFiles(allowOutsideFiles);
    }

    /** Options for check and run: everything a run needs. */
    public ReadOptions forRun() {
        return ReadOptions.forRun().allowingOutsideFiles(allowOutsideFiles);
    }
}
