package org.fabspread.sampling;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;

import org.fabspread.io.AtomicFiles;
import org.fabspread.model.Evaluator;
import org.fabspread.model.Model;
import org.fabspread.model.ModelException;
import org.fabspread.model.OutputDef;
import org.fabspread.study.Study;
import org.fabspread.study.StudyException;

/**
 * Evaluates the model on points the user lists: a CSV whose header names uncertain inputs of the
 * study (any subset, any order, values with or without units) and any ID columns ({@link EvalInputs});
 * inputs without a column take their nominal value. The whole input file is read and checked before
 * anything is written. The output CSV has {@code row} (1-based data row), the ID columns as given, every
 * uncertain input (canonical unit), every output and {@code status}, numbers in round-trip form.
 */
public final class EvalJob {

    /** @param rows data rows evaluated; @param failures failed rows by reason */
    public record Result(int rows, Map<String, Long> failures) {
    }

    private final Model model;
    private final Path output;
    private final StudyInputSpace space;
    private final EvalInputs inputs;
    private final int[] modelToSpace;

    /** Reads and validates the input file; writes nothing. */
    public EvalJob(Study study, Model model, Path inputCsv, Path outputCsv) throws IOException {
        this.model = model;
        this.output = outputCsv;
        this.space = StudyInputSpace.of(study);
        List<String> ids = space.ids();
        this.modelToSpace = new int[model.inputIds().size()];
        for (int i = 0; i < modelToSpace.length; i++) {
            modelToSpace[i] = ids.indexOf(model.inputIds().get(i));
            if (modelToSpace[i] < 0) {
                throw new StudyException("the model needs input '" + model.inputIds().get(i)
                        + "', which is not an uncertain input of the study");
            }
        }
        List<String> written = new ArrayList<>(List.of("row", "status"));
        written.addAll(ids);
        for (OutputDef o : model.outputs()) {
            written.add(o.id());
        }
        this.inputs = EvalInputs.read(inputCsv, space, study.parameters(), written);
    }

    /** Evaluates every row and writes the output file atomically. */
    public Result run() throws IOException {
        List<String> outIds = new ArrayList<>();
        for (OutputDef o : model.outputs()) {
            outIds.add(o.id());
        }
        Evaluator ev = model.newEvaluator();
        int k = space.dimension();
        int m = outIds.size();
        double[] xm = new double[modelToSpace.length];
        double[] y = new double[m];
        Map<String, Long> failures = new TreeMap<>();
        List<double[]> points = inputs.points();
        String ids = inputs.idHeaders().isEmpty() ? "" : "," + String.join(",", inputs.idHeaders());
        StringBuilder sb = new StringBuilder(SamplesCsv.header(space.ids(), outIds).replaceFirst("^sample", "row" + ids));
        for (int r = 0; r < points.size(); r++) {
            double[] x = points.get(r);
            for (int i = 0; i < xm.length; i++) {
                xm[i] = x[modelToSpace[i]];
            }
            String st = null;
            try {
                ev.evaluate(xm, y);
                for (double v : y) {
                    if (!Double.isFinite(v)) {
                        st = Double.isNaN(v) ? "nan-output" : "infinite-output";
                        break;
                    }
                }
            } catch (ModelException e) {
                st = SamplesCsv.reasonKey(e.reason());
            }
            if (st != null) {
                failures.merge(st, 1L, Long::sum);
                java.util.Arrays.fill(y, Double.NaN);
            }
            int rowStart = sb.length();
            SamplesCsv.appendRow(sb, r + 1, x, 0, k, y, 0, m, st);
            List<String> passed = inputs.idCells().get(r);
            if (!passed.isEmpty()) {
                sb.insert(sb.indexOf(",", rowStart), "," + String.join(",", passed));
            }
        }
        AtomicFiles.writeString(output, sb.toString());
        return new Result(points.size(), failures);
    }
}
