package org.fabspread.cli;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Set;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.networknt.schema.JsonSchemaFactory;
import com.networknt.schema.SpecVersion;
import com.networknt.schema.ValidationMessage;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The crescent demo through the user's path ({@code fabspread run}), on a coarser variant so the table solves in
 * seconds (one uncertain shape parameter, 5 nm lattice, 50 nm table step): the discrete-dipole table is solved,
 * cached beside the study and read back bit for bit, and the results carry the two in-plane resonances.
 *
 * <p>Physics checked here: a crescent has one resonance per in-plane polarisation, apart from each other (common
 * practice for template-made crescents). Which one lies to the red, and how both shift with size, is checked at
 * the solver level by {@code dda.CrescentResonanceTest}; this lattice is too coarse to resolve the tips for that.
 */
class CrescentStudyRunTest {

    private static final ObjectMapper JSON = new ObjectMapper();
    private static final Path DEMO = Path.of("demo-studies/silver-crescents-conventional.yaml");

    @TempDir
    static Path tmp;

    private static Path study;
    private static String firstLog;
    private static String secondLog;

    @BeforeAll
    static void runTwice() throws IOException {
        study = tmp.resolve("crescents.yaml");
        String text = Files.readString(DEMO)
                .replace("wavelengths: {from: 350 nm, to: 850 nm, step: 10 nm}", "wavelengths: {from: 400 nm, to: 850 nm, step: 25 nm}")
                .replace("bite_offset: 22 nm ± 4 nm at 3 sigma", "bite_offset: 22 nm")
                .replace("lattice_pitch: 4 nm", "lattice_pitch: 5 nm")
                .replace("table_wavelength_step: 25 nm", "table_wavelength_step: 50 nm");
        assertTrue(text.contains("bite_offset: 22 nm\n") && text.contains("lattice_pitch: 5 nm"), "the variant applies");
        Files.writeString(study, text);
        firstLog = run("first");
        secondLog = run("second");
    }

    private static String run(String out) {
        StringWriter so = new StringWriter();
        StringWriter se = new StringWriter();
        int code = Main.run(new String[] {"run", study.toString(), "--out", tmp.resolve(out).toString(), "--samples", "128",
            "--threads", "2"}, new PrintWriter(so), new PrintWriter(se));
        assertEquals(0, code, se::toString);
        return so.toString() + se;
    }

    @Test
    void theTableIsSolvedOnceThenReadFromTheCacheWithIdenticalResults() throws IOException {
        assertTrue(firstLog.contains("discrete-dipole table (3 shapes x 10 wavelengths x 2 polarisations) was solved"
                + " and saved to the cache in " + tmp.resolve(".fabspread-cache")), firstLog);
        assertTrue(secondLog.contains("was read from the cache in"), secondLog);
        for (String f : new String[] {"summary.json", "sensitivity.csv", "samples.csv"}) {
            assertArrayEquals(Files.readAllBytes(tmp.resolve("first").resolve(f)),
                    Files.readAllBytes(tmp.resolve("second").resolve(f)), f + " from the cached table");
        }
    }

    @Test
    void theSummaryCarriesBothResonancesAndFollowsTheSchema() throws IOException {
        JsonNode summary = JSON.readTree(tmp.resolve("first/summary.json").toFile());
        Set<ValidationMessage> errors = JsonSchemaFactory.getInstance(SpecVersion.VersionFlag.V202012)
                .getSchema(JSON.readTree(Path.of("shared/schema/summary.schema.json").toFile())).validate(summary);
        assertTrue(errors.isEmpty(), errors::toString);
        JsonNode shape = summary.get("particle_shape");
        assertEquals("crescent", shape.get("kind").asText());
        double x = shape.get("resonance").get("x_nm").asDouble();
        double y = shape.get("resonance").get("y_nm").asDouble();
        assertTrue(Math.abs(y - x) >= 40, "one resonance per in-plane polarisation, apart: x " + x + " nm, y " + y + " nm");
        assertEquals(1, shape.get("tabulated").size());
        assertEquals("particles.shape.outer_diameter", shape.get("tabulated").get(0).get("input").asText());
        assertEquals(3, shape.get("tabulated").get(0).get("nodes").asInt());
        double err = shape.get("worst_interpolation_error").asDouble();
        assertTrue(err > 0 && err < 10, "a leave-one-out estimate was made: " + err);
        assertEquals(0, summary.get("validity_envelope").get("outside").asInt(),
                "20 nm thick crescents lie flat inside 45 nm of PEDOT:PSS");
    }

    @Test
    void theReportShowsTheParticleShapeSection() throws IOException {
        String html = Files.readString(tmp.resolve("first/report.html"));
        assertTrue(html.contains("Particle shape"), "section title");
        assertTrue(html.contains("resonates at"), "the resonance sentence");
        assertTrue(html.contains("particles.shape.outer_diameter"), "the shape input's row");
        assertTrue(Files.isRegularFile(tmp.resolve("first/charts/shape-polarisations.svg")), "the per-polarisation chart");
    }

    @Test
    void theShippedDemoTableIsCurrent() {
        // the demo's table ships in demo-studies/.fabspread-cache; a change of solver, materials or study changes its
        // key, and this says so (after re-solving it, minutes) instead of every check of the demo silently solving
        String origin = org.fabspread.device.DeviceModel.of(org.fabspread.study.StudyReader.read(DEMO)).shapeTableOrigin()
                .orElseThrow();
        assertTrue(origin.contains("was read from the cache in"), "replace the shipped table with the new one: " + origin);
    }

    @Test
    void aFlatCrescentThinnerThanItsFilmIsInsideTheEnvelope() {
        // 20 nm thick crescents lying flat in 45 nm of PEDOT:PSS: the layer height is the thickness, not the
        // 60 nm outer diameter (the envelope once judged shapes as spheres of the diameter slot)
        StringWriter so = new StringWriter();
        StringWriter se = new StringWriter();
        assertEquals(0, Main.run(new String[] {"check", study.toString()}, new PrintWriter(so), new PrintWriter(se)), se::toString);
        assertTrue(so.toString().contains("nominal particles: inside the validity envelope"), so::toString);
    }
}
