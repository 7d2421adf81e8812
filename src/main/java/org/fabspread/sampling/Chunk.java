package org.fabspread.sampling;

import java.io.Serializable;

/**
 * The evaluated samples {@code first .. first + count − 1} of one chunk, in sample order:
 * {@code x[r * inputs + i]} is input i (input-space order) of row r, {@code y[r * outputs + m]}
 * output m (NaN when the row failed), {@code status[r]} null for a good row or the failure reason,
 * and {@code csv} the rows already formatted for {@code samples.csv}. Built by a worker, read by the
 * ordered consumer; never modified after it is handed over. Serializable, so a cluster engine can
 * return it from another machine.
 */
public record Chunk(long index, long first, int count, int inputs, int outputs, double[] x, double[] y,
                    String[] status, byte[] csv) implements Serializable {

    public boolean ok(int row) {
        return status[row] == null;
    }
}
