package org.fabspread.analysis;

import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.atomic.AtomicLong;

import org.fabspread.model.Evaluator;
import org.fabspread.model.Model;
import org.fabspread.model.OutputDef;

/** Closed-form test functions used to hold the estimators to published values. */
final class TestModels {

    private TestModels() {
    }

    static List<String> ids(int k) {
        List<String> ids = new ArrayList<>();
        for (int i = 1; i <= k; i++) {
            ids.add("x" + i);
        }
        return ids;
    }

    /** f = sin x1 + a sin² x2 + b x3⁴ sin x1 (+ offset), and a second output 2 f. */
    record Ishigami(double a, double b, double offset, AtomicLong calls) implements Model {
        Ishigami(double a, double b) {
            this(a, b, 0, new AtomicLong());
        }

        @Override public List<String> inputIds() {
            return ids(3);
        }

        @Override public List<OutputDef> outputs() {
            return List.of(new OutputDef("f", "1", "Ishigami function"), new OutputDef("twice", "1", "2 f"));
        }

        @Override public Evaluator newEvaluator() {
            return (x, out) -> {
                calls.incrementAndGet();
                double s1 = Math.sin(x[0]);
                double s2 = Math.sin(x[1]);
                double x3 = x[2] * x[2];
                double f = s1 + a * s2 * s2 + b * x3 * x3 * s1 + offset;
                out[0] = f;
                out[1] = 2 * f;
            };
        }
    }

    /** Sobol g-function g = Π (|4x_i − 2| + a_i)/(1 + a_i). */
    record SobolG(double[] a) implements Model {
        @Override public List<String> inputIds() {
            return ids(a.length);
        }

        @Override public List<OutputDef> outputs() {
            return List.of(new OutputDef("g", "1", "Sobol g-function"));
        }

        @Override public Evaluator newEvaluator() {
            return (x, out) -> {
                double g = 1;
                for (int i = 0; i < a.length; i++) {
                    g *= (Math.abs(4 * x[i] - 2) + a[i]) / (1 + a[i]);
                }
                out[0] = g;
            };
        }
    }

    /** y = Σ c_i x_i, with a second output z = y + x1² (nonlinear, for multi-output checks). */
    record Linear(double[] c) implements Model {
        @Override public List<String> inputIds() {
            return ids(c.length);
        }

        @Override public List<OutputDef> outputs() {
            return List.of(new OutputDef("y", "mA/cm^2", "linear sum"), new OutputDef("z", "1", "y + x1^2"));
        }

        @Override public Evaluator newEvaluator() {
            return (x, out) -> {
                double y = 0;
                for (int i = 0; i < c.length; i++) {
                    y += c[i] * x[i];
                }
                out[0] = y;
                out[1] = y + x[0] * x[0];
            };
        }
    }
}
