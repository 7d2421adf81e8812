package org.fabspread.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.awt.image.BufferedImage;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import javax.imageio.ImageIO;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** {@code fabspread particles --shape}: per-polarisation spectra of any shape and a picture of its lattice. */
class ShapeSpectraTest {

    private static int run(StringWriter err, String... args) {
        return Main.run(args, new PrintWriter(new StringWriter()), new PrintWriter(err));
    }

    /** source: energy balance C_ext = C_abs + C_sca (Draine 1988) in every written row; mirror symmetry x ≠ y. */
    @Test
    void writesPerPolarisationSpectraAndAPicture(@TempDir Path out) throws Exception {
        StringWriter err = new StringWriter();
        int code = run(err, "particles", "demo-studies/pilot-line-inverted.yaml", "--out", out.toString(), "--shape",
                "crescent:outer_diameter=40,bite_diameter=28,bite_offset=12 nm,thickness=10", "--pitch", "5",
                "--step", "150");
        assertEquals(0, code, err.toString());
        List<String> lines = Files.readAllLines(out.resolve("shape-spectra.csv"));
        assertTrue(lines.get(0).startsWith("wavelength_nm,extinction_x_nm2,absorption_x_nm2,scattering_x_nm2"));
        assertTrue(lines.size() >= 3);
        boolean differ = false;
        for (String l : lines.subList(1, lines.size())) {
            String[] f = l.split(",");
            double ext = Double.parseDouble(f[1]);
            assertEquals(ext, Double.parseDouble(f[2]) + Double.parseDouble(f[3]), 1e-3 * ext, l);
            differ |= Math.abs(ext / Double.parseDouble(f[6]) - 1) > 0.01;
        }
        assertTrue(differ, "a crescent answers the two in-plane polarisations differently");
        BufferedImage img = ImageIO.read(out.resolve("shape.png").toFile());
        assertTrue(img.getWidth() > 300 && img.getHeight() > 200);
    }

    @Test
    void badShapeIsOneLineAndExitTwo(@TempDir Path out) {
        StringWriter err = new StringWriter();
        int code = run(err, "particles", "demo-studies/pilot-line-inverted.yaml", "--out", out.resolve("o").toString(),
                "--shape", "crescent:outer_diameter=40,bite_diameter=wide,bite_offset=12,thickness=10");
        assertEquals(2, code);
        assertTrue(err.toString().contains("--shape: bite_diameter: expected a length in nm, got 'wide'"), err.toString());
        assertFalse(Files.exists(out.resolve("o").resolve("particles.csv")), "no half-written output");
    }
}
