package org.fabspread.device;

import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

class DeviceBenchmarkTest {

    @Test
    void measuresSpeedAndAllocation() {
        // common practice: a hot loop on primitive arrays allocates nothing per evaluation
        DemoStudy d = new DemoStudy();
        d.normal("particles.coverage", 0.05, 0.01).normal("stack.absorber.thickness", 100, 5)
                .normal("particles.diameter", 20, 2);
        DeviceBenchmark.Result r = DeviceBenchmark.run(d.build(), 2.0);
        System.out.printf("device model: %.0f evaluations/s, %.1f bytes/evaluation%n", r.evaluationsPerSecond(),
                r.bytesPerEvaluation());
        assertTrue(r.evaluationsPerSecond() > 10, "at least some evaluations");
        // the device code allocates nothing; a few bytes may come from callees the JIT has not compiled yet
        assertTrue(r.bytesPerEvaluation() < 256, "allocation-free evaluation, got " + r.bytesPerEvaluation());
    }
}
