package org.fabspread.report;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import org.fabspread.analysis.ScreeningResult;
import org.fabspread.analysis.SobolResult;
import org.fabspread.model.OutputDef;
import org.fabspread.pipeline.StudyResults;
import org.fabspread.sampling.RunSummary;
import org.fabspread.study.Study;
import org.fabspread.study.Target;

/** Lookups into the study results shared by the report's sections: the followed output, stats, targets. */
final class ResultLookup {

    private ResultLookup() {
    }

    /** The output the report follows: the first target's, else {@code jsc}, else the first output. */
    static String focusOutput(StudyResults r) {
        if (!r.study().targets().isEmpty()) {
            return r.study().targets().get(0).output();
        }
        for (OutputDef o : r.outputs()) {
            if (o.id().equals("jsc")) {
                return o.id();
            }
        }
        return r.outputs().get(0).id();
    }

    /** Inputs in order of variance contribution (Sobol total, else screening first-order, else none). */
    static List<String> topInputs(StudyResults r, String out) {
        List<String> ids = new ArrayList<>();
        if (r.sobol() != null && hasOutput(r.sobol(), out)) {
            List<SobolResult.IndexEstimate> e = new ArrayList<>(r.sobol().output(out).indices());
            e.sort(Comparator.comparingDouble(SobolResult.IndexEstimate::total).reversed());
            e.forEach(x -> ids.add(x.input()));
        } else if (r.screening() != null && hasOutput(r.screening(), out)) {
            List<ScreeningResult.InputScreening> e = new ArrayList<>(r.screening().output(out).inputs());
            e.sort(Comparator.comparingDouble((ScreeningResult.InputScreening x) -> x.firstOrder()).reversed());
            e.forEach(x -> ids.add(x.input()));
        }
        if (r.table() != null) {
            ids.removeIf(id -> !r.table().inputIds().contains(id));
        }
        return ids;
    }

    static boolean hasOutput(SobolResult s, String out) {
        return s.outputs().stream().anyMatch(o -> o.output().equals(out));
    }

    static boolean hasOutput(ScreeningResult s, String out) {
        return s.outputs().stream().anyMatch(o -> o.output().equals(out));
    }

    static OutputDef outputDef(StudyResults r, String id) {
        for (OutputDef o : r.outputs()) {
            if (o.id().equals(id)) {
                return o;
            }
        }
        throw new IllegalArgumentException("the results have no output " + id);
    }

    static RunSummary.OutputStats stats(RunSummary s, String id) {
        RunSummary.OutputStats st = statsOrNull(s, id);
        if (st == null) {
            throw new IllegalArgumentException("the run summary has no output " + id);
        }
        return st;
    }

    static RunSummary.OutputStats statsOrNull(RunSummary s, String id) {
        for (RunSummary.OutputStats o : s.outputs()) {
            if (o.id().equals(id)) {
                return o;
            }
        }
        return null;
    }

    static double quantile(RunSummary.OutputStats st, double p) {
        for (RunSummary.QuantileStats q : st.quantiles()) {
            if (Math.abs(q.p() - p) < 1e-9) {
                return q.value();
            }
        }
        return Double.NaN;
    }

    static Target targetOf(Study s, String out) {
        for (Target t : s.targets()) {
            if (t.output().equals(out)) {
                return t;
            }
        }
        return null;
    }
}
