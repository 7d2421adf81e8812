package org.fabspread.report;

import static org.fabspread.report.ReportText.*;
import static org.fabspread.report.ResultLookup.*;

import java.util.ArrayList;
import java.util.List;
import java.util.Set;

import org.fabspread.pipeline.StudyResults;
import org.fabspread.model.OutputDef;
import org.fabspread.sampling.RunSummary;

/**
 * The report's "Every output" section: the statistics of every output the model gives over the
 * samples (nominal, mean, standard deviation, quantiles, range) and the distribution of each device
 * output a reader decides on besides the followed one (V_oc, FF, efficiency, J_sc, the enhancement).
 */
final class OutputsSection {

    /** Outputs drawn as a distribution when the study has them (the followed output has its own). */
    static final List<String> DRAWN = List.of("jsc", "voc", "ff", "efficiency", "jsc_planar", "enhancement");
    /** Outputs in a fraction unit that read better as a percentage. */
    private static final Set<String> FRACTION = Set.of("fraction");

    private final ChartFactory charts;

    OutputsSection(ChartFactory charts) {
        this.charts = charts;
    }

    Section section(StudyResults r) {
        List<Block> b = new ArrayList<>();
        b.add(Table.of("Every output over the " + r.summary().samplesOk() + " samples", List.of("output", "unit",
                "nominal device", "mean", "standard deviation", "5 %", "50 %", "95 %", "min", "max"), rows(r)));
        String focus = focusOutput(r);
        if (r.table() != null) {
            for (String id : DRAWN) {
                if (id.equals(focus) || !r.table().outputIds().contains(id)) {
                    continue;
                }
                OutputDef od = outputDef(r, id);
                boolean pct = FRACTION.contains(od.unit());
                double[] v = r.table().output(id).clone();
                if (pct) {
                    for (int i = 0; i < v.length; i++) {
                        v[i] *= 100;
                    }
                }
                String unit = pct ? "%" : od.unit();
                b.add(new Figure(charts.distribution("distribution-" + safe(id), "Spread of " + label(id),
                        Numbers.quantity(label(id), unit), v), "Histogram of " + label(id) + " (" + od.description()
                        + ") over the samples, with its mean and its 5 % and 95 % quantiles."));
            }
        }
        return new Section(StudyReport.OUTPUTS, "Every output: distributions and statistics", b);
    }

    private static List<List<String>> rows(StudyResults r) {
        List<List<String>> rows = new ArrayList<>();
        for (OutputDef od : r.outputs()) {
            RunSummary.OutputStats st = statsOrNull(r.summary(), od.id());
            if (st == null) {
                continue;
            }
            boolean pct = FRACTION.contains(od.unit());
            double nominal = r.nominal(od.id());
            rows.add(List.of(label(od.id()), pct ? "%" : Numbers.unit(od.unit()), value(nominal, pct),
                    value(st.mean(), pct), value(st.sd(), pct), value(quantile(st, 0.05), pct),
                    value(quantile(st, 0.5), pct), value(quantile(st, 0.95), pct), value(st.min(), pct),
                    value(st.max(), pct)));
        }
        return rows;
    }

    private static String value(double v, boolean pct) {
        if (!Double.isFinite(v)) {
            return "–";
        }
        return pct ? Numbers.num(100 * v) : Numbers.num(v);
    }
}
