package org.fabspread.report;

import static org.fabspread.report.ReportText.*;
import static org.fabspread.report.ResultLookup.*;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.fabspread.pipeline.StudyResults;
import org.fabspread.sampling.Distributions;
import org.fabspread.sampling.RunSummary;
import org.fabspread.study.Describe;
import org.fabspread.study.Layer;
import org.fabspread.study.Parameter;
import org.fabspread.study.ParticleLayer;
import org.fabspread.study.Study;
import org.fabspread.study.Target;

/** The report's "What was studied" section: the stack, the particle layer, the inputs, the targets, the run. */
final class StudiedSection {

    private StudiedSection() {
    }

    static Section build(StudyResults r) {
        Study s = r.study();
        List<Block> b = new ArrayList<>();
        b.add(new KeyValues(List.of(KeyValues.pair("Study", s.name()),
                KeyValues.pair("Study file", s.file() == null ? "(built in code)" : s.file().getFileName().toString()))));
        if (s.description() != null && !s.description().isBlank()) {
            b.add(new Paragraph(s.description().strip()));
        }
        List<List<String>> rows = new ArrayList<>();
        for (Layer l : s.stack()) {
            Parameter t = l.thickness();
            String spread = t.isUncertain() ? Describe.distribution(t) : "fixed";
            String role = l.role().name().toLowerCase(Locale.ROOT).replace('_', '-');
            if (l.incoherent()) {
                role += " (incoherent)";
            }
            rows.add(List.of(l.name(), l.material().id(), show(t.nominal(), t.unit()), spread, role));
        }
        b.add(Table.of("The stack, in the order light meets it", List.of("layer", "material", "thickness",
                "spread", "role"), rows));
        ParticleLayer p = s.particles();
        if (p != null) {
            List<KeyValues.Pair> kv = new ArrayList<>();
            kv.add(KeyValues.pair("Metal", p.metal().id()));
            kv.add(KeyValues.pair("Host layer", p.host() + ", placed at its "
                    + (p.placement() == ParticleLayer.Placement.OFFSET ? "offset " + show(p.offset().nominal(),
                    p.offset().unit()) : p.placement().name().toLowerCase(Locale.ROOT) + " face")));
            kv.add(KeyValues.pair("Diameter (median)", describe(p.diameter())));
            kv.add(KeyValues.pair("Size spread within a device (CV)", describe(p.sizeCv())));
            kv.add(KeyValues.pair("Aspect ratios (in plane, out of plane)", describe(p.inPlaneAspect()) + "; "
                    + describe(p.outOfPlaneAspect())));
            kv.add(KeyValues.pair("Coverage", describe(p.coverage())));
            kv.add(KeyValues.pair("Forward share of scattered light", p.forwardFraction() == null
                    ? "from the Mie series (forward hemisphere)" : describe(p.forwardFraction())));
            kv.add(KeyValues.pair("Orientation", p.aligned() ? "aligned in plane" : "random in plane"));
            kv.add(KeyValues.pair("Mixing rule", p.mixingRule() == ParticleLayer.MixingRule.BRUGGEMAN
                    ? "Bruggeman" : "Maxwell Garnett"));
            if (p.enhancementTable() != null) {
                kv.add(KeyValues.pair("Enhancement table", p.enhancementTable().getFileName().toString()));
            }
            b.add(new Paragraph("The metal nanoparticle layer:"));
            b.add(new KeyValues(kv));
        } else {
            b.add(new Paragraph("The study has no particle layer."));
        }
        List<Parameter> inputs = s.uncertainInputs();
        if (inputs.isEmpty()) {
            b.add(new Paragraph("Every number of the study is fixed: there are no uncertain inputs."));
        } else {
            List<List<String>> in = new ArrayList<>();
            for (Parameter q : inputs) {
                double sd = Distributions.of(q.distribution()).standardDeviation();
                in.add(List.of(q.id(), Describe.distribution(q), show(q.nominal(), q.unit()), show(sd, q.unit()),
                        Numbers.unit(q.unit())));
            }
            b.add(Table.of("The uncertain inputs (" + inputs.size() + ")", List.of("input", "distribution",
                    "nominal", "standard deviation", "unit"), in));
        }
        if (!s.correlations().isEmpty()) {
            List<List<String>> c = new ArrayList<>();
            s.correlations().forEach(x -> c.add(List.of(x.first(), x.second(), Numbers.num3(x.spearman()))));
            b.add(Table.of("Correlated inputs (Spearman rank correlation)", List.of("input", "with", "Spearman ρ"), c));
        }
        if (s.targets().isEmpty()) {
            b.add(new Paragraph("The study sets no targets, so no yield is computed."));
        } else {
            List<String> t = new ArrayList<>();
            for (Target g : s.targets()) {
                t.add(target(g));
            }
            b.add(new Paragraph("Targets (a device passes when it meets all of them):"));
            b.add(new BulletList(t));
        }
        RunSummary sum = r.summary();
        List<KeyValues.Pair> run = new ArrayList<>();
        run.add(KeyValues.pair("Samples", sum.samplesOk() + " evaluated of " + sum.samplesRequested() + " drawn"));
        run.add(KeyValues.pair("Sampler", sampler(sum.sampler())));
        run.add(KeyValues.pair("Seed", Long.toString(sum.seed())));
        run.add(KeyValues.pair("Confidence of intervals", Numbers.level(sum.confidence())));
        if (r.sobol() != null) {
            run.add(KeyValues.pair("Sobol design", "base N = " + r.sobol().n() + ", " + r.sobol().modelRuns()
                    + " model runs"));
        }
        b.add(new KeyValues(run));
        return new Section(StudyReport.STUDIED, "What was studied", b);
    }
}
