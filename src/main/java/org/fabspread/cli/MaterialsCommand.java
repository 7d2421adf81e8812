package org.fabspread.cli;

import java.io.PrintWriter;
import java.util.concurrent.Callable;

import org.fabspread.optics.MaterialLibrary;
import org.fabspread.optics.NkTable;

import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Spec;

/** Lists the bundled optical constants. */
@Command(name = "materials", mixinStandardHelpOptions = true,
        description = "List the bundled optical-constant tables: id, description, wavelength range, source.")
public final class MaterialsCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Override
    public Integer call() {
        PrintWriter out = spec.commandLine().getOut();
        MaterialLibrary lib = MaterialLibrary.bundled();
        for (String id : lib.ids()) {
            NkTable t = lib.get(id);
            out.printf("%-24s %7.1f-%-8.1f nm  %s%n", id, t.minWavelength(), t.maxWavelength(), t.description());
            out.printf("%-24s source: %s%n", "", t.source());
            if (t.negativeKRows() > 0) {
                out.printf("%-24s note: %d rows with k < 0 (digitisation noise) read as k = 0%n", "", t.negativeKRows());
            }
        }
        out.flush();
        return ExitCodes.OK;
    }
}
