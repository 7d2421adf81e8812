package org.fabspread.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;

import org.fabspread.device.DeviceModel;
import org.fabspread.device.EnvelopeReason;
import org.fabspread.device.EnvelopeStatus;
import org.fabspread.io.AtomicFiles;
import org.fabspread.model.OutputDef;
import org.fabspread.pipeline.RunValidation;
import org.fabspread.pipeline.StudyRun;
import org.fabspread.study.Describe;
import org.fabspread.study.DisplayUnit;
import org.fabspread.study.Layer;
import org.fabspread.study.MaterialRef;
import org.fabspread.study.NkCsv;
import org.fabspread.study.Parameter;
import org.fabspread.study.Printable;
import org.fabspread.study.Study;
import org.fabspread.study.StudyReader;
import org.fabspread.study.Target;
import org.fabspread.study.Units;
import org.fabspread.study.WavelengthGrid;

import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/**
 * {@code check STUDY [--out DIR]}: reads and validates a study with the same pass as {@code run}
 * ({@link RunValidation}: everything {@code run} refuses before writing, {@code check} refuses), prints what it describes and, with
 * {@code --out}, writes {@code inputs.csv} listing the uncertain inputs. Nothing is written unless the
 * study is valid.
 */
@Command(name = "check", mixinStandardHelpOptions = true,
        description = "Validate a study file and show its grid, stack and uncertain inputs.")
public final class CheckCommand implements Callable<Integer> {

    /**
     * One block of the check report. The sections run in order after the study is validated (and
     * solved at its nominal point, which is printed last with the targets); a new block is added to
     * {@link #SECTIONS}.
     */
    @FunctionalInterface
    public interface Section {
        void print(Study study, PrintWriter out);
    }

    /** The report's sections, in order. */
    static final List<Section> SECTIONS = List.of(CheckCommand::printHeader, CheckCommand::printStack,
            CheckCommand::printTables, CheckCommand::printInputs);

    @Spec
    CommandSpec spec;

    @Parameters(index = "0", paramLabel = "STUDY", description = "The study file (YAML).")
    Path study;

    @Mixin
    DataFileOptions dataFiles = new DataFileOptions();

    @Option(names = "--out", paramLabel = "DIR", description = "Also write DIR/inputs.csv listing the uncertain inputs.")
    Path out;

    @Override
    public Integer call() throws IOException {
        Study s = StudyReader.read(study, dataFiles.forRun());
        // the run's own validation pass (the model solved at the nominal point, what-ifs, designs, plan
        // budget, sizes) before anything is printed, so that check refuses what run would, in one line
        RunValidation run = RunValidation.of(s, StudyRun.Options.of(0, null,
                Runtime.getRuntime().availableProcessors(), false, "fabspread check"), out != null ? out : DefaultFolder.of(s));
        Nominal nominal = Nominal.of(run.model());
        PrintWriter w = spec.commandLine().getOut();
        for (Section section : SECTIONS) {
            section.print(s, w);
        }
        nominal.print(s, w);
        w.println(run.estimate().describe() + " (fabspread run with the study's settings)");
        if (out != null) {
            Path csv = out.resolve("inputs.csv");
            AtomicFiles.writeString(csv, inputsCsv(s));
            w.println("wrote " + csv);
        }
        w.println("study is valid");
        w.flush();
        return ExitCodes.OK;
    }

    /** The device model at the nominal point: every output, and each target against it with its margin. */
    record Nominal(List<OutputDef> outputs, double[] values, List<String> warnings, EnvelopeStatus envelope) {

        static Nominal of(DeviceModel model) {
            boolean builtIn = model.study().particleLayer().isPresent() && model.enhancementTable().isEmpty();
            return new Nominal(model.outputs(), model.evaluate(model.nominalInputs()), model.warnings(),
                    builtIn ? model.nominalEnvelope() : null);
        }

        void print(Study s, PrintWriter w) {
            for (String warning : warnings) {
                w.println("warning: " + Printable.escape(warning));
            }
            w.println("nominal result:");
            for (int i = 0; i < outputs.size(); i++) {
                OutputDef o = outputs.get(i);
                w.printf(Locale.ROOT, "  %-22s %12.5g %-10s %s%n", o.id(), values[i], o.unit(), o.description());
            }
            printTargets(s, w);
            printEnvelope(w);
        }

        /** One line per violated reason of the validity envelope, or that the nominal point is inside it. */
        void printEnvelope(PrintWriter w) {
            if (envelope == null) {
                return;
            }
            if (envelope.inside()) {
                w.println("nominal particles: inside the validity envelope");
                return;
            }
            for (EnvelopeReason r : envelope.violated()) {
                w.println("nominal particles outside the validity envelope: " + r.sentence());
            }
        }

        /** "jsc >= 13.3 mA/cm^2: nominal 13.87 mA/cm^2, margin +0.5742 mA/cm^2 (met)". */
        void printTargets(Study s, PrintWriter w) {
            if (s.targets().isEmpty()) {
                return;
            }
            w.println("nominal against the targets:");
            for (Target t : s.targets()) {
                int i = indexOf(t.output());
                Units.Quantity q = Describe.quantity(t.unit());
                DisplayUnit u = DisplayUnit.tradeUnit(q, t.value());
                double margin = t.atLeast() ? values[i] - t.value() : t.value() - values[i];
                w.printf(Locale.ROOT, "  %-28s nominal %-16s margin %-16s %s%n",
                        t.output() + (t.atLeast() ? " >= " : " <= ") + u.format(t.value()), u.format(values[i]),
                        (margin >= 0 ? "+" : "") + u.format(margin),
                        t.isMet(values[i]) ? "met" : "NOT MET at the nominal point");
            }
        }

        private int indexOf(String id) {
            for (int i = 0; i < outputs.size(); i++) {
                if (outputs.get(i).id().equals(id)) {
                    return i;
                }
            }
            throw new IllegalStateException("the device model has no output " + id);
        }
    }

    static void printHeader(Study s, PrintWriter w) {
        w.println("study: " + Printable.escape(s.name()));
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

    /** One line per user n,k table: what its header was read as. */
    static void printTables(Study s, PrintWriter w) {
        for (Layer l : s.stack()) {
            printTable(l.material(), "layer '" + l.name() + "'", w);
        }
        s.particleLayer().ifPresent(p -> printTable(p.metal(), "particles", w));
    }

    private static void printTable(MaterialRef m, String usedBy, PrintWriter w) {
        if (!m.isBundled()) {
            w.println("table " + Printable.escape(m.csvFile().getFileName().toString()) + " (" + usedBy + "): "
                    + NkCsv.read(m.csvFile()).layout());
        }
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
