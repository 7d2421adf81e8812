package org.fabspread.spark;

import java.nio.ByteBuffer;
import java.nio.charset.StandardCharsets;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HexFormat;

import org.fabspread.model.OutputDef;
import org.fabspread.sampling.InputSpace;
import org.fabspread.sampling.Runner;

/**
 * A digest that tells two runners apart without evaluating the model: the point set (name, size), seed,
 * chunk size, failure policy, the model's class, inputs and outputs, and the bits of the input space's
 * map at fixed probe points (so a what-if re-run, whose input space is changed, never passes for the main
 * Monte Carlo).
 */
final class RunnerFingerprint {

    /** Probe points in the unit cube (each coordinate strictly inside (0, 1)). */
    private static final double[] PROBES = {0.5, 0.1, 0.9, 0.27, 0.73};

    private RunnerFingerprint() {
    }

    static String of(Runner r) {
        try {
            MessageDigest md = MessageDigest.getInstance("SHA-256");
            StringBuilder sb = new StringBuilder();
            sb.append(r.points().name()).append('/').append(r.points().size()).append('/').append(r.seed())
                    .append('/').append(r.config().chunkSize()).append('/').append(r.config().policy())
                    .append('/').append(r.model().getClass().getName()).append('/').append(r.model().inputIds())
                    .append('/').append(r.space().ids());
            for (OutputDef o : r.model().outputs()) {
                sb.append(' ').append(o.id());
            }
            md.update(sb.toString().getBytes(StandardCharsets.UTF_8));
            InputSpace s = r.space();
            int k = s.dimension();
            double[] u = new double[k];
            double[] x = new double[k];
            ByteBuffer b = ByteBuffer.allocate(8 * k);
            for (int p = 0; p < PROBES.length; p++) {
                for (int i = 0; i < k; i++) {
                    u[i] = PROBES[(p + i) % PROBES.length];
                }
                s.map(u, x);
                b.clear();
                for (double v : x) {
                    b.putDouble(v);
                }
                md.update(b.array());
            }
            return HexFormat.of().formatHex(md.digest());
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException(e);
        }
    }
}
