package org.fabspread.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;

import org.fabspread.device.DeviceModel;
import org.fabspread.io.AtomicFiles;
import org.fabspread.model.OutputDef;
import org.fabspread.study.Describe;
import org.fabspread.study.Layer;
import org.fabspread.study.Parameter;
import org.fabspread.study.Study;
import org.fabspread.study.StudyReader;
import org.fabspread.study.Units;
import org.fabspread.study.WavelengthGrid;

import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/**
 * {@code check STUDY [--out DIR]}: reads and validates a study, prints what it describes and, with
 * {@code --out}, writes {@code inputs.csv} listing the uncertain inputs. Nothing is written unless the
 * study is valid.
 */
@Command(name = "check", mixinStandardHelpOptions = true,
        description = "Validate a study file and show its grid, stack and uncertain inputs.")
public final class CheckCommand implements Callable<Integer> {

    /**
     * One block of the check report. The sections run in order after the study is validated; a new
     * block (for example the nominal device result) is added to {@link #SECTIONS}.
     */
    @FunctionalInterface
    public interface Section {
        void print(Study study, PrintWriter out);
    }

    /** The report's sections, in order. */
    static final List<Section> SECTIONS = List.of(CheckCommand::printHeader, CheckCommand::printStack,
            CheckCommand::printInputs, CheckCommand::printNominal);

    @Spec
    CommandSpec spec;

    @Parameters(index = "0", paramLabel = "STUDY", description = "The study file (YAML).")
    Path study;

    @Option(names = "--out", paramLabel = "DIR", description = "Also write DIR/inputs.csv listing the uncertain inputs.")
    Path out;

    @Override
    public Integer call() throws IOException {
        Study s = StudyReader.read(study);
        PrintWriter w = spec.commandLine().getOut();
        for (Section section : SECTIONS) {
            section.print(s, w);
        }
        if (out != null) {
            Path csv = out.resolve("inputs.csv");
            AtomicFiles.writeString(csv, inputsCsv(s));
            w.println("wrote " + csv);
        }
        w.println("study is valid");
        w.flush();
        return ExitCodes.OK;
    }

    /** The device model at the nominal point: every output with its unit. */
    static void printNominal(Study s, PrintWriter w) {
        DeviceModel model = DeviceModel.of(s);
        double[] y = model.evaluate(model.nominalInputs());
        for (String warning : model.warnings()) {
            w.println("warning: " + warning);
        }
        w.println("nominal result:");
        List<OutputDef> outs = model.outputs();
        for (int i = 0; i < outs.size(); i++) {
            OutputDef o = outs.get(i);
            w.printf(Locale.ROOT, "  %-22s %12.5g %-10s %s%n", o.id(), y[i], o.unit(), o.description());
        }
    }

    static void printHeader(Study s, PrintWriter w) {
        w.println("study: " + s.name());
        WavelengthGrid g = s.grid();
        w.printf(Locale.ROOT, "grid: %s to %s nm, step %s nm (%d wavelengths)%n", Units.format(g.startNm()),
                Units.format(g.stopNm()), Units.format(g.stepNm()), g.count());
    }

    static void printStack(Study s, PrintWriter w) {
        w.println("stack (in the order light meets it):");
        for (Layer l : s.stack()) {
            String role = l.role().name().toLowerCase(Locale.ROOT).replace('_', '-');
            w.printf(Locale.ROOT, "  %-12s %-24s %14s  %s%s%n", l.name(), l.material().id(),
                    Units.format(l.thickness().nominal()) + " nm", role, l.incoherent() ? ", incoherent" : "");
        }
        s.particleLayer().ifPresent(p -> w.printf(Locale.ROOT,
                "particles: %s in '%s' (%s), diameter %s nm, coverage %s%n", p.metal().id(), p.host(),
                p.placement().name().toLowerCase(Locale.ROOT), Units.format(p.diameter().nominal()),
                Units.Quantity.FRACTION.show(p.coverage().nominal())));
    }

    static void printInputs(Study s, PrintWriter w) {
        List<Parameter> in = s.uncertainInputs();
        if (in.isEmpty()) {
            w.println("uncertain inputs: none (every number is fixed)");
            return;
        }
        w.println("uncertain inputs (" + in.size() + "):");
        int width = 2;
        for (Parameter p : in) {
            width = Math.max(width, p.id().length());
        }
        String fmt = "  %-" + width + "s  %-12s  %-10s  %s%n";
        w.printf(Locale.ROOT, fmt, "id", "nominal", "unit", "distribution");
        for (Parameter p : in) {
            w.printf(Locale.ROOT, fmt, p.id(), Units.format(p.nominal()), p.unit(), Describe.distribution(p));
        }
    }

    /** id,unit,nominal,distribution — one row per uncertain input (RFC 4180 quoting). */
    static String inputsCsv(Study s) {
        StringBuilder b = new StringBuilder("id,unit,nominal,distribution\n");
        for (Parameter p : s.uncertainInputs()) {
            b.append(p.id()).append(',').append(csv(p.unit())).append(',').append(Units.format(p.nominal()))
                    .append(',').append(csv(Describe.distribution(p))).append('\n');
        }
        return b.toString();
    }

    private static String csv(String v) {
        return v.contains(",") || v.contains("\"") ? "\"" + v.replace("\"", "\"\"") + "\"" : v;
    }
}
