package org.fabspread.sampling;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

/**
 * The {@code samples.csv} format: a header {@code sample,<input ids>,<output ids>,status}, then one
 * row per sample in sample order; numbers written with {@link Double#toString(double)}, which reads
 * back to the identical double (Java Language Specification, Double.toString: "as many digits as
 * needed to uniquely distinguish"), so files are byte-identical between runs and resumed runs read
 * back exactly what was written. Status is {@code ok} or the failure reason.
 */
public final class SamplesCsv {

    public static final String OK = "ok";

    private SamplesCsv() {
    }

    public static String header(List<String> inputIds, List<String> outputIds) {
        StringBuilder sb = new StringBuilder("sample");
        for (String id : inputIds) {
            sb.append(',').append(id);
        }
        for (String id : outputIds) {
            sb.append(',').append(id);
        }
        return sb.append(",status\n").toString();
    }

    /** A failure reason made safe for a CSV cell: letters, digits, '.', '_' and '-' only. */
    public static String reasonKey(String reason) {
        if (reason == null || reason.isEmpty()) {
            return "failed";
        }
        StringBuilder sb = new StringBuilder(reason.length());
        for (int i = 0; i < reason.length(); i++) {
            char c = reason.charAt(i);
            sb.append(Character.isLetterOrDigit(c) || c == '.' || c == '_' || c == '-' ? c : '-');
        }
        String s = sb.toString();
        return s.equals(OK) ? "ok-reason" : s;
    }

    static void appendRow(StringBuilder sb, long sample, double[] x, int offX, int k, double[] y, int offY, int m,
                          String status) {
        sb.append(sample);
        for (int i = 0; i < k; i++) {
            sb.append(',').append(x[offX + i]);
        }
        for (int i = 0; i < m; i++) {
            sb.append(',').append(y[offY + i]);
        }
        sb.append(',').append(status == null ? OK : status).append('\n');
    }

    /**
     * Reads rows of a samples file written by this class, up to {@code maxBytes} bytes (a whole
     * number of rows), feeding them to the sink. Returns the number of rows.
     */
    public static long read(Path file, long maxBytes, int k, int m, RowSink sink) throws IOException {
        double[] x = new double[k];
        double[] y = new double[m];
        long rows = 0;
        try (InputStream in = Files.newInputStream(file);
             BufferedReader r = new BufferedReader(new InputStreamReader(new Bounded(in, maxBytes), StandardCharsets.UTF_8), 1 << 16)) {
            String line = r.readLine();
            if (line == null) {
                return 0;
            }
            int expected = k + m + 2;
            long lineNo = 1;
            while ((line = r.readLine()) != null) {
                lineNo++;
                int pos = 0;
                int field = 0;
                long sample = -1;
                String status = null;
                for (int f = 0; f < expected; f++) {
                    int end = line.indexOf(',', pos);
                    if (end < 0) {
                        end = line.length();
                    }
                    String cell = line.substring(pos, end);
                    try {
                        if (f == 0) {
                            sample = Long.parseLong(cell);
                        } else if (f <= k) {
                            x[f - 1] = Double.parseDouble(cell);
                        } else if (f <= k + m) {
                            y[f - 1 - k] = Double.parseDouble(cell);
                        } else {
                            status = cell.equals(OK) ? null : cell;
                        }
                    } catch (NumberFormatException e) {
                        throw new IOException(file + ":" + lineNo + ": damaged samples file: " + e.getMessage());
                    }
                    field++;
                    pos = end + 1;
                }
                if (field != expected || pos != line.length() + 1) {
                    throw new IOException(file + ":" + lineNo + ": damaged samples file: wrong number of columns");
                }
                sink.row(sample, x, 0, y, 0, status);
                rows++;
            }
        }
        return rows;
    }

    /** Receives one output value of a good row. */
    @FunctionalInterface
    public interface ValueSink {
        void value(int output, double v);
    }

    /**
     * Reads only outputs {@code lo .. hi−1} of the good rows (status {@code ok}), in file order, parsing no
     * other number: the quantile pass over a file too large for memory reads it once per batch of columns.
     */
    public static void readOutputs(Path file, int k, int m, int lo, int hi, ValueSink sink) throws IOException {
        try (BufferedReader r = Files.newBufferedReader(file, StandardCharsets.UTF_8)) {
            String line = r.readLine();
            long lineNo = 1;
            while ((line = r.readLine()) != null) {
                lineNo++;
                int statusAt = line.lastIndexOf(',') + 1;
                if (statusAt <= 0) {
                    throw new IOException(file + ":" + lineNo + ": damaged samples file: wrong number of columns");
                }
                if (!line.startsWith(OK, statusAt) || line.length() != statusAt + OK.length()) {
                    continue;
                }
                int pos = 0;
                // skip the sample number, the k inputs and the outputs before lo
                for (int f = 0; f < 1 + k + lo; f++) {
                    pos = line.indexOf(',', pos) + 1;
                }
                for (int o = lo; o < hi; o++) {
                    int end = line.indexOf(',', pos);
                    if (end < 0) {
                        throw new IOException(file + ":" + lineNo + ": damaged samples file: wrong number of columns");
                    }
                    try {
                        sink.value(o, Double.parseDouble(line.substring(pos, end)));
                    } catch (NumberFormatException e) {
                        throw new IOException(file + ":" + lineNo + ": damaged samples file: " + e.getMessage());
                    }
                    pos = end + 1;
                }
            }
        }
    }

    /** An input stream that stops after a byte limit. */
    private static final class Bounded extends java.io.FilterInputStream {
        private long left;

        Bounded(InputStream in, long limit) {
            super(in);
            this.left = limit;
        }

        @Override public int read() throws IOException {
            if (left <= 0) {
                return -1;
            }
            int b = super.read();
            if (b >= 0) {
                left--;
            }
            return b;
        }

        @Override public int read(byte[] b, int off, int len) throws IOException {
            if (left <= 0) {
                return -1;
            }
            int n = super.read(b, off, (int) Math.min(len, left));
            if (n > 0) {
                left -= n;
            }
            return n;
        }
    }
}
