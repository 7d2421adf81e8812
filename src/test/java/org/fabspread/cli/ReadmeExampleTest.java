package org.fabspread.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The study shown in README.md must stay a valid study (common practice: documentation that runs). */
class ReadmeExampleTest {

    @TempDir
    Path tmp;

    @Test
    void readmeStudyExampleIsValid() throws IOException {
        String readme = Files.readString(Path.of("README.md"), StandardCharsets.UTF_8);
        int a = readme.indexOf("```yaml\n");
        assertTrue(a >= 0, "README has a yaml example");
        int b = readme.indexOf("```", a + 8);
        Path study = tmp.resolve("readme-study.yaml");
        Files.writeString(study, readme.substring(a + 8, b), StandardCharsets.UTF_8);
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code = Main.run(new String[] {"check", study.toString()}, new PrintWriter(out), new PrintWriter(err));
        assertEquals(0, code, err.toString());
        assertTrue(out.toString().contains("study is valid"));
    }

    @Test
    void readmeNamesTheTwoCommandsAndCiRunsTheTestCommand() throws IOException {
        String readme = Files.readString(Path.of("README.md"), StandardCharsets.UTF_8);
        assertTrue(readme.contains("./fabspread demo"));
        assertTrue(readme.contains("mvn -B verify"));
        String ci = Files.readString(Path.of(".ci/run"), StandardCharsets.UTF_8);
        assertTrue(ci.contains("set -euo pipefail"));
        assertTrue(ci.strip().endsWith("mvn -B verify"), ci);
    }
}
