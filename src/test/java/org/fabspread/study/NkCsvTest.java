package org.fabspread.study;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.StringReader;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class NkCsvTest {

    private static NkCsv.Rows read(String text) throws IOException {
        return NkCsv.read("t.csv", new StringReader(text));
    }

    private static String error(String text) {
        return assertThrows(StudyException.class, () -> read(text)).getMessage();
    }

    @Test
    void readsRowsMetadataAndClampsNegativeK() throws IOException {
        NkCsv.Rows r = read("# material: test film\n# source: made up\n# material: ignored\n\n"
                + "Wavelength_nm, n, k\n400,2.0,0.1\n500,1.9,-0.001\n600,1.8,0\n");
        assertArrayEquals(new double[] {400, 500, 600}, r.wavelength());
        assertArrayEquals(new double[] {2.0, 1.9, 1.8}, r.n());
        assertArrayEquals(new double[] {0.1, 0, 0}, r.k());
        assertEquals(1, r.clamped());
        assertEquals("test film", r.meta().get("material"));
        assertEquals("made up", r.meta().get("source"));
    }

    @Test
    void malformedTablesNameFileAndLine() {
        assertEquals("t.csv:1: header must name a wavelength (nm, µm) or photon-energy (eV) column and n, k or ε1, ε2"
                + " columns, as 'wavelength_nm,n,k', got 'lambda,n,R'", error("lambda,n,R\n400,1,0\n"));
        assertEquals("t.csv:3: expected 3 columns wavelength_nm,n,k, got 2", error("wavelength_nm,n,k\n400,1,0\n500,1\n"));
        assertEquals("t.csv:2: n: not a number: 'one'", error("wavelength_nm,n,k\n400,one,0\n500,1,0\n"));
        assertEquals("t.csv:2: k: not a finite number", error("wavelength_nm,n,k\n400,1,NaN\n500,1,0\n"));
        assertEquals("t.csv:2: wavelength_nm must be > 0", error("wavelength_nm,n,k\n0,1,0\n500,1,0\n"));
        assertEquals("t.csv:3: wavelength_nm must increase", error("wavelength_nm,n,k\n500,1,0\n500,1,0\n"));
        assertEquals("t.csv: a material table needs at least two data rows", error("wavelength_nm,n,k\n500,1,0\n"));
    }

    @Test
    void headerVariantsSeparatorsUnitsAndPermittivityAreDetected() throws IOException {
        NkCsv.Rows plain = read("wavelength_nm,n,k\n400,2.0,0.1\n500,1.9,0.05\n");
        NkCsv.Rows tab = read("Wavelength (µm)\tn\tk\n0.4\t2.0\t0.1\n0.5\t1.9\t0.05\n");
        assertEquals("tab-separated, wavelength in µm, n and k", tab.layout());
        assertArrayEquals(plain.wavelength(), tab.wavelength(), 1e-9);
        assertArrayEquals(plain.n(), tab.n(), 0);
        NkCsv.Rows semi = read("Wavelength (nm);n;k\n400;2.0;0.1\n500;1.9;0.05\n");
        assertEquals("semicolon-separated, wavelength in nm, n and k", semi.layout());
        assertArrayEquals(plain.k(), semi.k(), 0);
        // photon energy: lambda = hc/E, hc = 1239.841984 eV nm (source: CODATA 2018 exact h, c, e);
        // 3.0996 eV is 400 nm, 2.47968 eV is 500 nm; rising energies are read backwards
        NkCsv.Rows ev = read("E (eV),n,k\n2.479683968,1.9,0.05\n3.09960496,2.0,0.1\n");
        assertEquals("comma-separated, photon energy in eV (converted to wavelength), n and k", ev.layout());
        assertArrayEquals(new double[] {400, 500}, ev.wavelength(), 1e-6);
        assertArrayEquals(plain.n(), ev.n(), 0);
        // permittivity: eps = N^2, so N = 2.0 + 0.1i gives eps1 = n^2 - k^2 = 3.99, eps2 = 2nk = 0.4
        // (source: Born and Wolf, Principles of Optics, 7th ed., §14.1); cross-check: N = 1.9 + 0.05i
        NkCsv.Rows eps = read("wavelength_nm,eps1,eps2\n400,3.99,0.4\n500,3.6075,0.19\n");
        assertEquals("comma-separated, wavelength in nm, ε1 and ε2 (converted to n and k)", eps.layout());
        assertArrayEquals(plain.n(), eps.n(), 1e-12);
        assertArrayEquals(plain.k(), eps.k(), 1e-12);
    }

    @Test
    void catalogRangesComeFromTheSameReader(@TempDir Path tmp) throws IOException {
        List<String> ids = NkCsv.bundledIds();
        assertTrue(ids.size() > 1);
        assertEquals(ids, MaterialCatalog.bundled().ids());
        NkCsv.Rows first = NkCsv.readBundled(ids.get(0));
        assertArrayEquals(new double[] {first.wavelength()[0], first.wavelength()[first.wavelength().length - 1]},
                MaterialCatalog.bundled().range(ids.get(0)));
        Path csv = tmp.resolve("mine.csv");
        Files.writeString(csv, "wavelength_nm,n,k\n450,2.0,0.01\n900,1.9,0\n");
        assertArrayEquals(new double[] {450, 900}, MaterialCatalog.bundled().rangeOfFile(csv));
        Files.writeString(csv, "wavelength_nm,n,k\n450,2.0,0.01\n400,1.9,0\n");
        StudyException e = assertThrows(StudyException.class, () -> MaterialCatalog.bundled().rangeOfFile(csv));
        assertEquals("mine.csv:3: wavelength_nm must increase", e.getMessage());
    }
}
