package org.fabspread.sampling;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;

import org.fabspread.study.AnalysisSettings.FailurePolicy;
import org.fabspread.study.AnalysisSettings.Sampler;
import org.fabspread.study.Study;
import org.fabspread.study.StudyException;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class EvalJobTest {

    @TempDir
    Path tmp;

    private final Study study = RunJobTest.linearStudy(10, Sampler.RANDOM, FailurePolicy.REJECT, List.of());

    @Test
    void evaluatesGivenRowsWithNominalDefaults() throws IOException {
        Path in = tmp.resolve("in.csv");
        Files.writeString(in, "x2, x0\n-4,10\n0,7\n\n1e1,11\n");
        Path out = tmp.resolve("out.csv");
        EvalJob.Result r = new EvalJob(study, RunJobTest.linear(8.0, 10.5), in, out).run();
        assertEquals(3, r.rows());
        assertEquals(Map.of("below-floor", 1L, "nan-output", 1L), r.failures());
        List<String> lines = Files.readAllLines(out);
        assertEquals("row,x0,x1,x2,y,z,status", lines.get(0));
        // x1 absent: nominal 3; y = 10 − 2·3 + 0.5·(−4) = 2 (exact in binary)
        assertEquals("1,10.0,3.0,-4.0,2.0,4.0,ok", lines.get(1));
        assertTrue(lines.get(2).endsWith(",NaN,NaN,below-floor"), lines.get(2));
        assertTrue(lines.get(3).endsWith(",nan-output"), lines.get(3));
    }

    @Test
    void unknownColumnAndBadNumberAreOneLineErrorsAndWriteNothing() throws IOException {
        Path out = tmp.resolve("out.csv");
        Path in = tmp.resolve("in.csv");
        // a dotted name is a mistyped input (input ids are dotted, ID columns such as 'wafer' are not)
        Files.writeString(in, "x0,stack.x4\n1,2\n");
        StudyException e = assertThrows(StudyException.class, () -> new EvalJob(study, RunJobTest.linear(0, 1), in, out));
        assertEquals("in.csv:1: column 2 'stack.x4' is not an uncertain input of the study (inputs: x0, x1, x2);"
                + " ID columns such as 'wafer' pass through to the output", e.getMessage());
        // within two edits of an input id: refused with the suggestion
        Files.writeString(in, "x0,x7\n1,2\n");
        e = assertThrows(StudyException.class, () -> new EvalJob(study, RunJobTest.linear(0, 1), in, out));
        assertEquals("in.csv:1: column 2 'x7' is not an uncertain input of the study; did you mean 'x0' or 'x1' or"
                + " 'x2'? (inputs: x0, x1, x2); ID columns such as 'wafer' pass through to the output", e.getMessage());
        Files.writeString(in, "x0,x1\n1,2\n3,abc\n");
        e = assertThrows(StudyException.class, () -> new EvalJob(study, RunJobTest.linear(0, 1), in, out));
        assertEquals("in.csv:3:3: x1: not a number: 'abc'", e.getMessage());
        Files.writeString(in, "x0,x1\n1\n");
        e = assertThrows(StudyException.class, () -> new EvalJob(study, RunJobTest.linear(0, 1), in, out));
        assertEquals("in.csv:2: expected 2 values, got 1", e.getMessage());
        assertFalse(Files.exists(out));
    }
}
