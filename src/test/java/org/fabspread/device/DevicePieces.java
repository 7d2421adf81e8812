package org.fabspread.device;

import java.lang.management.ManagementFactory;
import java.lang.management.ThreadMXBean;
import java.nio.file.Path;

import org.fabspread.study.Study;
import org.fabspread.study.StudyReader;

/**
 * Plain timing harness for the pieces of one device evaluation (not a test: it asserts nothing and only
 * prints). Run after {@code mvn test-compile}: {@code java -cp target/fabspread.jar:target/test-classes
 * org.fabspread.device.DevicePieces STUDY [seconds]}. Times are the thread's CPU time, per evaluation.
 */
public final class DevicePieces {
    private static final ThreadMXBean MX = ManagementFactory.getThreadMXBean();
    private static volatile double sink;

    private DevicePieces() {
    }

    public static void main(String[] args) {
        Study study = StudyReader.read(Path.of(args[0]));
        double seconds = args.length > 1 ? Double.parseDouble(args[1]) : 2;
        DeviceModel model = DeviceModel.of(study);
        DeviceEvaluator e = model.newDeviceEvaluator();
        double[] nominal = model.nominalInputs();
        int k = nominal.length;
        final int cycle = 11;
        double[][] inputs = new double[cycle][k];
        double[][] full = new double[cycle][];
        for (int c = 0; c < cycle; c++) {
            for (int i = 0; i < k; i++) {
                int step = (c + 3 * i) % cycle - cycle / 2;
                inputs[c][i] = nominal[i] * (1 + 0.001 * step);
            }
            full[c] = e.sampleVector(inputs[c]);
        }
        double[] out = new double[model.outputs().size()];
                boolean onlyFull = args.length > 2 && args[2].equals("full");
        boolean onlyParticles = args.length > 2 && args[2].equals("particles");
        for (int round = 0; round < 2; round++) {
            boolean print = round == 1;
            if (!onlyParticles) time("full evaluate", seconds, print, n -> {
                for (int r = 0; r < n; r++) {
                    e.evaluate(inputs[r % cycle], out);
                }
                sink += out[0];
            });
            if (onlyFull) {
                continue;
            }
            if (!onlyParticles) time("prepare only", seconds, print, n -> {
                for (int r = 0; r < n; r++) {
                    e.prepare(full[r % cycle]);
                }
            });
            time("prepare + particles (no cache)", seconds, print, n -> {
                for (int r = 0; r < n; r++) {
                    e.prepare(full[r % cycle]);
                    e.particles().fill(e.optics(), true);
                }
            });
        }
    }

    interface Body {
        void run(int n);
    }

    private static void time(String name, double seconds, boolean print, Body b) {
        long t0 = MX.getCurrentThreadCpuTime();
        long end = t0 + (long) (seconds * 1e9);
        long n = 0;
        long now;
        do {
            b.run(64);
            n += 64;
            now = MX.getCurrentThreadCpuTime();
        } while (now < end);
        if (print) {
            System.out.printf("%-40s %10.1f us/eval%n", name, (now - t0) * 1e-3 / n);
        }
    }
}
