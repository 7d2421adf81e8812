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
 * study (any subset, any order); inputs without a column take their nominal value. The whole input
 * file is read and checked before anything is written. The output CSV has {@code row} (1-based data
 * row), every uncertain input, every output and {@code status}, numbers in round-trip form.
 */
public final class EvalJob {

    /** @param rows data rows evaluated; @param failures failed rows by reason */
    public record Result(int rows, Map<String, Long> failures) {
    }

    private final Model model;
    private final Path output;
    private final StudyInputSpace space;
    private final List<double[]> points = new ArrayList<>();
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
        String name = inputCsv.getFileName().toString();
        if (!Files.isRegularFile(inputCsv)) {
            throw new StudyException(name + ": no such file");
        }
        List<String> lines = org.fabspread.study.TextFiles.read(inputCsv).lines().toList();
        int headerLine = 0;
        while (headerLine < lines.size() && lines.get(headerLine).isBlank()) {
            headerLine++;
        }
        if (headerLine == lines.size()) {
            throw new StudyException(name + ": empty file, expected a header of input ids");
        }
        String header = lines.get(headerLine);
        if (header.startsWith("\uFEFF")) {
            header = header.substring(1);
        }
        List<String> cols = split(header);
        int[] target = new int[cols.size()];
        for (int c = 0; c < cols.size(); c++) {
            String col = cols.get(c).trim();
            int at = ids.indexOf(col);
            if (at < 0) {
                throw new StudyException(name + ":" + (headerLine + 1) + ": column " + (c + 1) + " '" + col
                        + "' is not an uncertain input of the study (inputs: " + String.join(", ", ids) + ")");
            }
            for (int e = 0; e < c; e++) {
                if (target[e] == at) {
                    throw new StudyException(name + ":" + (headerLine + 1) + ": column '" + col + "' appears twice");
                }
            }
            target[c] = at;
        }
        double[] nominal = space.nominal();
        for (int l = headerLine + 1; l < lines.size(); l++) {
            String line = lines.get(l);
            if (line.isBlank()) {
                continue;
            }
            List<String> cells = split(line);
            if (cells.size() != cols.size()) {
                throw new StudyException(name + ":" + (l + 1) + ": expected " + cols.size() + " values, got " + cells.size());
            }
            double[] x = nominal.clone();
            int charCol = 1;
            for (int c = 0; c < cells.size(); c++) {
                String cell = cells.get(c).trim();
                try {
                    x[target[c]] = Double.parseDouble(cell);
                } catch (NumberFormatException e) {
                    throw new StudyException(name + ":" + (l + 1) + ":" + charCol + ": " + cols.get(c).trim()
                            + ": not a number: '" + cell + "'");
                }
                if (!Double.isFinite(x[target[c]])) {
                    throw new StudyException(name + ":" + (l + 1) + ":" + charCol + ": " + cols.get(c).trim()
                            + ": must be a finite number, got '" + cell + "'");
                }
                charCol += cells.get(c).length() + 1;
            }
            points.add(x);
        }
    }

    private static List<String> split(String line) {
        List<String> out = new ArrayList<>();
        int pos = 0;
        while (true) {
            int end = line.indexOf(',', pos);
            if (end < 0) {
                out.add(line.substring(pos));
                return out;
            }
            out.add(line.substring(pos, end));
            pos = end + 1;
        }
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
        StringBuilder sb = new StringBuilder(SamplesCsv.header(space.ids(), outIds).replaceFirst("^sample", "row"));
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
            SamplesCsv.appendRow(sb, r + 1, x, 0, k, y, 0, m, st);
        }
        AtomicFiles.writeString(output, sb.toString());
        return new Result(points.size(), failures);
    }
}
