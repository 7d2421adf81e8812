package org.fabspread.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;

import org.fabspread.study.Parameter;
import org.fabspread.study.ParticleShape;
import org.fabspread.study.Study;
import org.fabspread.study.StudyReader;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The {@code particles.shape} key: read into parameters with their own ids, and located errors from the command. */
class ShapeStudyTest {
    private static final Path STUDY = Path.of("src/test/resources/shapes/crescent-study.yaml");

    @TempDir
    Path tmp;

    @Test
    void crescentParametersAreInputsWithTheirOwnIds() {
        Study s = StudyReader.read(STUDY);
        ParticleShape shape = s.particleLayer().orElseThrow().shape();
        assertEquals("crescent", shape.kind());
        Parameter offset = s.parameters().get("particles.shape.bite_offset");
        // 22 nm ± 4 nm at 3 sigma: sigma = 4/3 nm (the study's own statement)
        assertEquals(22.0, offset.nominal(), 1e-12);
        assertTrue(s.parameters().containsKey("particles.shape.outer_diameter"));
        assertEquals(20.0, shape.height(), 1e-12, "a crescent's layer height is its thickness");
    }

    @Test
    void mistypedShapeKeyIsOneLocatedLineWithASuggestion() throws Exception {
        Path bad = tmp.resolve("bad.yaml");
        Files.writeString(bad, Files.readString(STUDY).replace("    bite_offset:", "    bite_ofset:"));
        int line = lineOf(bad, "bite_ofset:");
        StringWriter so = new StringWriter();
        StringWriter se = new StringWriter();
        int code = Main.run(new String[] {"check", bad.toString()}, new PrintWriter(so), new PrintWriter(se));
        assertEquals(ExitCodes.BAD_INPUT, code, se.toString());
        String err = se.toString().strip();
        assertEquals(1, err.lines().count(), err);
        assertTrue(err.startsWith("fabspread: bad.yaml:" + line + ":5: particles.shape.bite_ofset:"), err);
        assertTrue(err.contains("bite_offset"), err);
    }

    @Test
    void mistypedShapeKindIsRefusedWithASuggestion() throws Exception {
        Path bad = tmp.resolve("kind.yaml");
        Files.writeString(bad, Files.readString(STUDY).replace("kind: crescent", "kind: cresent"));
        StringWriter so = new StringWriter();
        StringWriter se = new StringWriter();
        int code = Main.run(new String[] {"check", bad.toString()}, new PrintWriter(so), new PrintWriter(se));
        assertEquals(ExitCodes.BAD_INPUT, code, se.toString());
        assertTrue(se.toString().contains("particles.shape.kind"), se.toString());
        assertTrue(se.toString().contains("crescent"), se.toString());
    }

    @Test
    void shapeAndDiameterTogetherAreRefused() throws Exception {
        Path bad = tmp.resolve("both.yaml");
        Files.writeString(bad, Files.readString(STUDY).replace("  coverage:", "  diameter: 40 nm\n  coverage:"));
        StringWriter se = new StringWriter();
        int code = Main.run(new String[] {"check", bad.toString()}, new PrintWriter(new StringWriter()), new PrintWriter(se));
        assertEquals(ExitCodes.BAD_INPUT, code, se.toString());
        assertTrue(se.toString().contains("particles.diameter: give either shape or diameter"), se.toString());
    }

    private static int lineOf(Path f, String text) throws Exception {
        var lines = Files.readAllLines(f);
        for (int i = 0; i < lines.size(); i++) {
            if (lines.get(i).contains(text)) {
                return i + 1;
            }
        }
        throw new AssertionError(text);
    }
}
