package org.fabspread.analysis;

import java.io.IOException;
import java.io.Writer;
import java.nio.file.Path;
import java.util.List;

import org.fabspread.io.AtomicFiles;

/**
 * Writes the sensitivity designs row by row, with every input value and output, so that another tool can
 * recompute every index: {@code sobol_design.csv} and {@code shapley_design.csv}. Numbers are written
 * with {@link Double#toString(double)} (they read back to the same bits); a failed run leaves its
 * outputs empty. Written atomically.
 */
public final class DesignCsv {

    public static final String SOBOL_FILE = "sobol_design.csv";
    public static final String SHAPLEY_FILE = "shapley_design.csv";

    private DesignCsv() {
    }

    /**
     * Columns {@code block,replicate,row,swapped,<inputs>,<outputs>}: block A, B or AB; replicate the
     * randomisation (0 for random points); row the base row j (0 … N − 1); swapped the input (or group)
     * whose columns came from B in an AB row, empty otherwise.
     */
    public static void writeSobol(Path file, SobolDesign d, List<String> outputs) throws IOException {
        int k = d.ids().size();
        int cols = k + d.groups().size();
        int per = d.n() / d.replicates();
        double[] ua = new double[k];
        double[] x = new double[k];
        AtomicFiles.writeText(file, w -> {
            w.write("block,replicate,row,swapped");
            header(w, d.ids(), outputs);
            for (int j = 0; j < d.n(); j++) {
                for (int block = 0; block < 2 + cols; block++) {
                    d.inputs(block, j, ua, x);
                    w.write(block == 0 ? "A" : block == 1 ? "B" : "AB");
                    w.write(',');
                    w.write(Integer.toString(j / per));
                    w.write(',');
                    w.write(Integer.toString(j));
                    w.write(',');
                    if (block >= 2) {
                        int c = block - 2;
                        w.write(SensitivityCsv.field(c < k ? d.ids().get(c) : d.groups().get(c - k).name()));
                    }
                    numbers(w, x);
                    for (int q = 0; q < outputs.size(); q++) {
                        double y = block == 0 ? d.fA()[q][j] : block == 1 ? d.fB()[q][j] : d.fAB()[q][block - 2][j];
                        number(w, y);
                    }
                    w.write('\n');
                }
            }
        });
    }

    /**
     * Columns {@code block,permutation,step,outer,joining,order,<inputs>,<outputs>}: block {@code variance}
     * (a draw from the joint law) or {@code conditional}; for a conditional row the order (input ids
     * separated by spaces), the step s (the first s inputs of the order were drawn given the others), the
     * outer draw, and the input that joined at this step.
     */
    public static void writeShapley(Path file, ShapleyDesign d, List<String> outputs) throws IOException {
        int k = d.ids().size();
        double[] x = new double[k];
        AtomicFiles.writeText(file, w -> {
            w.write("block,permutation,step,outer,joining,order");
            header(w, d.ids(), outputs);
            for (int r = 0; r < d.rows(); r++) {
                System.arraycopy(d.inputs(), r * k, x, 0, k);
                int l = d.permutationOf(r);
                if (l < 0) {
                    w.write("variance,,,,,");
                } else {
                    StringBuilder order = new StringBuilder();
                    for (int s = 0; s < k; s++) {
                        order.append(s == 0 ? "" : " ").append(d.ids().get(d.order()[l * k + s]));
                    }
                    w.write("conditional," + l + "," + d.stepOf(r) + "," + d.outerOf(r) + ","
                            + SensitivityCsv.field(d.ids().get(d.joiningInput(r))) + ","
                            + SensitivityCsv.field(order.toString()));
                }
                numbers(w, x);
                for (int q = 0; q < outputs.size(); q++) {
                    number(w, d.outputs()[q][r]);
                }
                w.write('\n');
            }
        });
    }

    private static void header(Writer w, List<String> ids, List<String> outputs) throws IOException {
        for (String id : ids) {
            w.write(',');
            w.write(SensitivityCsv.field(id));
        }
        for (String o : outputs) {
            w.write(',');
            w.write(SensitivityCsv.field(o));
        }
        w.write('\n');
    }

    private static void numbers(Writer w, double[] x) throws IOException {
        for (double v : x) {
            number(w, v);
        }
    }

    private static void number(Writer w, double v) throws IOException {
        w.write(',');
        if (Double.isFinite(v)) {
            w.write(Double.toString(v));
        }
    }
}
