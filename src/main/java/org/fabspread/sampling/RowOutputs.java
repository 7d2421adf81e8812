package org.fabspread.sampling;

import java.io.Serializable;

/**
 * The model outputs of one chunk of a {@link RowBatch}, row for row with its {@link RowInputs}:
 * {@code y[r * outputs + m]} is output m of row r as the model returned it (NaN or infinite values
 * included) when the row ran, NaN otherwise; {@code outcome[r]} says whether it ran ({@link #RAN}), the
 * model refused it ({@link #REFUSED}, with its reason key in {@code refusal[r]}) or it was not evaluated
 * because an earlier row of its group failed ({@link #SKIPPED}). A plain value object, returned from
 * another machine as it is.
 */
public record RowOutputs(long chunk, int rows, int outputs, double[] y, byte[] outcome, String[] refusal)
        implements Serializable {

    /** The model returned outputs. */
    public static final byte RAN = 0;
    /** The model refused the inputs (a model exception). */
    public static final byte REFUSED = 1;
    /** Not evaluated: an earlier row of its group failed. */
    public static final byte SKIPPED = 2;

    /** True when row r ran. */
    public boolean ran(int row) {
        return outcome[row] == RAN;
    }

    /** True when row r ran and every output is finite. */
    public boolean finite(int row) {
        if (outcome[row] != RAN) {
            return false;
        }
        for (int m = row * outputs, end = m + outputs; m < end; m++) {
            if (!Double.isFinite(y[m])) {
                return false;
            }
        }
        return true;
    }

    /** Output m of row r. */
    public double value(int row, int m) {
        return y[row * outputs + m];
    }

    /**
     * The failure status of row r in the words of {@code samples.csv}: null for a good row, the model's
     * reason key for a refusal, {@code nan-output} or {@code infinite-output} (the first non-finite output).
     */
    public String status(int row) {
        if (outcome[row] == REFUSED) {
            return refusal[row];
        }
        if (outcome[row] == SKIPPED) {
            return "skipped";
        }
        for (int m = row * outputs, end = m + outputs; m < end; m++) {
            if (Double.isNaN(y[m])) {
                return "nan-output";
            }
            if (Double.isInfinite(y[m])) {
                return "infinite-output";
            }
        }
        return null;
    }
}
