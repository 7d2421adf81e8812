package org.fabspread.sampling;

import java.util.List;

import org.fabspread.model.Evaluator;
import org.fabspread.model.Model;
import org.fabspread.model.ModelException;
import org.fabspread.model.OutputDef;

/** Closed-form models for the runner tests. */
final class TestModels {

    private TestModels() {
    }

    /**
     * y = Σ c_i x_i and z = y² ; fails with reason {@code below-floor} when x_0 &lt; floor, returns NaN
     * for z when x_0 &gt; nanAbove.
     */
    record Linear(List<String> inputIds, double[] c, double floor, double nanAbove) implements Model {
        @Override public List<OutputDef> outputs() {
            return List.of(new OutputDef("y", "1", "linear sum"), new OutputDef("z", "1", "its square"));
        }

        @Override public Evaluator newEvaluator() {
            return (x, out) -> {
                if (x[0] < floor) {
                    throw new ModelException("below-floor", "x0 below " + floor);
                }
                double s = 0;
                for (int i = 0; i < c.length; i++) {
                    s += c[i] * x[i];
                }
                out[0] = s;
                out[1] = x[0] > nanAbove ? Double.NaN : s * s;
            };
        }
    }

    /** Ishigami &amp; Homma (1990): f = sin x1 + a sin² x2 + b x3⁴ sin x1 on [−π, π]³. */
    record Ishigami(double a, double b) implements Model {
        @Override public List<String> inputIds() { return List.of("x1", "x2", "x3"); }

        @Override public List<OutputDef> outputs() { return List.of(new OutputDef("f", "1", "Ishigami function")); }

        static double f(double a, double b, double x1, double x2, double x3) {
            double s2 = Math.sin(x2);
            return Math.sin(x1) + a * s2 * s2 + b * x3 * x3 * x3 * x3 * Math.sin(x1);
        }

        @Override public Evaluator newEvaluator() {
            return (x, out) -> out[0] = f(a, b, x[0], x[1], x[2]);
        }
    }
}
