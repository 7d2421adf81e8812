package org.fabspread.report;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.awt.Color;
import java.awt.image.BufferedImage;
import java.io.ByteArrayInputStream;
import java.io.StringReader;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashSet;
import java.util.Iterator;
import java.util.List;
import java.util.Set;
import java.util.regex.Pattern;
import javax.imageio.ImageIO;
import javax.imageio.ImageReader;
import javax.imageio.metadata.IIOMetadata;
import javax.imageio.stream.ImageInputStream;
import javax.xml.parsers.DocumentBuilder;
import javax.xml.parsers.DocumentBuilderFactory;
import org.apache.commons.math3.special.Erf;
import org.junit.jupiter.api.BeforeAll;
import org.fabspread.sampling.Interval;
import org.junit.jupiter.api.Test;
import org.w3c.dom.Document;
import org.w3c.dom.Element;
import org.w3c.dom.Node;
import org.xml.sax.InputSource;

class ChartFactoryTest {

    private static final ChartFactory F = new ChartFactory();
    private static List<Chart> charts;

    @BeforeAll
    static void renderSample() {
        charts = new ArrayList<>();
        for (Figure f : SampleDocument.build(F).figures()) {
            charts.add(f.chart());
        }
    }

    static DocumentBuilder xmlParser() throws Exception {
        DocumentBuilderFactory dbf = DocumentBuilderFactory.newInstance();
        dbf.setNamespaceAware(true);
        dbf.setValidating(false);
        dbf.setFeature("http://apache.org/xml/features/nonvalidating/load-external-dtd", false);
        dbf.setExpandEntityReferences(false);
        DocumentBuilder db = dbf.newDocumentBuilder();
        db.setEntityResolver((publicId, systemId) -> new InputSource(new StringReader("")));
        return db;
    }

    @Test
    void everyKindOfChartIsDrawn() {
        // the ten kinds of the report, histogram and scatter included; common practice
        Set<String> names = new HashSet<>();
        for (Chart c : charts) {
            names.add(c.name());
        }
        assertEquals(Set.of("jsc-histogram", "jsc-vs-absorber", "variance-contributions", "index-convergence",
                "tolerance-ranking", "allocation-tradeoff", "absorption-spectra", "generation-profile",
                "particle-cross-sections", "predicted-effects", "half-normal"), names);
    }

    @Test
    void pngDecodesAtTheExpectedSizeAndIsNotBlank() throws Exception {
        // common practice: a chart image must decode and show more than a background
        for (Chart c : charts) {
            BufferedImage img = ImageIO.read(new ByteArrayInputStream(c.png()));
            assertNotNull(img, c.name());
            assertEquals(ChartFactory.DEFAULT_WIDTH, img.getWidth(), c.name());
            assertEquals(ChartFactory.DEFAULT_HEIGHT, img.getHeight(), c.name());
            int dark = 0;
            for (int y = 0; y < img.getHeight(); y += 4) {
                for (int x = 0; x < img.getWidth(); x += 4) {
                    if (ChartStyle.lightness(new Color(img.getRGB(x, y))) < 50) {
                        dark++;
                    }
                }
            }
            assertTrue(dark > 120, c.name() + " has only " + dark + " dark pixels");
        }
    }

    @Test
    void pngRecordsTheResolution() throws Exception {
        // source: PNG specification (ISO/IEC 15948:2004) §11.3.5.3, pHYs in pixels per metre
        ImageReader reader = ImageIO.getImageReadersByFormatName("png").next();
        try (ImageInputStream in = ImageIO.createImageInputStream(new ByteArrayInputStream(charts.get(0).png()))) {
            reader.setInput(in);
            IIOMetadata md = reader.getImageMetadata(0);
            Node root = md.getAsTree("javax_imageio_png_1.0");
            Element phys = null;
            for (Node n = root.getFirstChild(); n != null; n = n.getNextSibling()) {
                if (n.getNodeName().equals("pHYs")) {
                    phys = (Element) n;
                }
            }
            assertNotNull(phys);
            assertEquals("meter", phys.getAttribute("unitSpecifier"));
            assertEquals(Math.round(ChartFactory.DPI / 0.0254), Long.parseLong(phys.getAttribute("pixelsPerUnitXAxis")));
        } finally {
            reader.dispose();
        }
    }

    @Test
    void svgIsWellFormedXml() throws Exception {
        // common practice: an SVG is an XML document whose root is <svg>
        DocumentBuilder db = xmlParser();
        for (Chart c : charts) {
            Document d = db.parse(new InputSource(new StringReader(c.svg())));
            assertEquals("svg", d.getDocumentElement().getLocalName(), c.name());
        }
    }

    @Test
    void axesAreTitledWithUnits() {
        // common practice: every axis says what it shows and in which unit
        Pattern withUnit = Pattern.compile(".*\\S \\([^()]+\\)");
        for (Chart c : charts) {
            assertTrue(withUnit.matcher(c.xAxisTitle()).matches(), c.name() + ": " + c.xAxisTitle());
            assertTrue(withUnit.matcher(c.yAxisTitle()).matches(), c.name() + ": " + c.yAxisTitle());
            assertFalse(c.title().isBlank());
            assertTrue(c.seriesCount() >= 1 && c.pointCount() > 0, c.toString());
        }
        Chart spectra = byName("absorption-spectra");
        assertEquals("wavelength (nm)", spectra.xAxisTitle());
        assertEquals(List.of("Ag contact", "Ag particles", "ZnO", "absorber", "PEDOT:PSS", "ITO", "EQE (absorber)", "1 − R"),
                spectra.seriesNames());
        assertEquals("generation rate (10²¹ cm⁻³ s⁻¹)", byName("generation-profile").yAxisTitle());
        assertTrue(byName("index-convergence").xAxisTitle().contains("log₂"));
    }

    @Test
    void histogramShowsYieldAndTargetAndCountsFiniteSamples() {
        double[] v = new double[1000];
        for (int i = 0; i < v.length; i++) {
            v[i] = 14 + 2.0 * i / (v.length - 1);
        }
        v[3] = Double.NaN;
        Chart c = F.histogram("h", "J_sc", Quantity.of("J_sc", "mA/cm²"), v, 15, true, 0.873, new Interval(0.851, 0.892));
        assertEquals("J_sc — yield 87.3 % (85.1–89.2)", c.title());
        assertEquals(999, c.pointCount());
        assertEquals(2, c.seriesCount());
        assertTrue(c.seriesNames().get(1).startsWith("target: J_sc ≥ 15"));
        assertEquals("J_sc (mA/cm²)", c.xAxisTitle());
    }

    @Test
    void freedmanDiaconisBins() {
        // source: Freedman & Diaconis, Z. Wahrscheinlichkeitstheorie verw. Gebiete 57, 453 (1981): h = 2 IQR n^(-1/3).
        // Evenly spread values on [0, 1], n = 1000: IQR = 0.5 so h = 2 * 0.5 / 10 = 0.1.
        int n = 1000;
        double[] v = new double[n];
        for (int i = 0; i < n; i++) {
            v[i] = i / (n - 1.0);
        }
        assertEquals(0.5, ChartFactory.quantileSorted(v, 0.75) - ChartFactory.quantileSorted(v, 0.25), 1e-12);
        double[] e = ChartFactory.histogramEdges(v);
        assertEquals(0.1, e[1] - e[0], 1e-12);
        assertEquals(0.0, e[0], 1e-12);
        assertTrue(e[e.length - 1] > 1.0, "the largest value lies inside the last half-open bin");
        assertEquals(11, e.length - 1);
        // a single repeated value gets one bin around it
        double[] one = ChartFactory.histogramEdges(new double[] {2, 2, 2});
        assertEquals(2, one.length);
        assertTrue(one[0] < 2 && one[1] > 2);
    }

    @Test
    void niceSteps() {
        // common practice: bin widths and ticks are 1, 2, 2.5 or 5 times a power of ten
        assertEquals(0.1, ChartFactory.niceStep(0.1), 1e-15);
        assertEquals(0.2, ChartFactory.niceStep(0.13), 1e-15);
        assertEquals(25, ChartFactory.niceStep(21), 1e-12);
        assertEquals(50, ChartFactory.niceStep(26), 1e-12);
    }

    @Test
    void scatterIsThinnedDeterministically() {
        Chart c = byName("jsc-vs-absorber");
        assertEquals(ChartFactory.MAX_SCATTER_POINTS, c.pointCount());
        assertTrue(c.seriesNames().get(0).contains("5000 of 11999"));
        int[] a = ChartFactory.subsampleIndices(11999, 5000);
        assertArrayEquals(a, ChartFactory.subsampleIndices(11999, 5000));
        assertEquals(5000, a.length);
        assertEquals(0, a[0]);
        for (int k = 1; k < a.length; k++) {
            assertTrue(a[k] > a[k - 1]);
        }
        assertTrue(a[a.length - 1] >= 11999 - 3);
        assertEquals(10, ChartFactory.subsampleIndices(10, 5000).length);
    }

    @Test
    void halfNormalQuantiles() {
        // source: Daniel, Technometrics 1, 311 (1959): plotting positions of |effects| at
        // Phi^-1(0.5 + 0.5 (i - 0.5)/m). For m = 1 that is the upper quartile of N(0,1),
        // 0.6744897501960817 (from memory), cross-checked by evaluating Phi through erf.
        double[] q1 = ChartFactory.halfNormalQuantiles(1);
        assertEquals(0.6744897501960817, q1[0], 1e-9);
        assertEquals(0.75, 0.5 * (1 + Erf.erf(q1[0] / Math.sqrt(2))), 1e-12);
        double[] q = ChartFactory.halfNormalQuantiles(15);
        for (int i = 0; i < q.length; i++) {
            assertEquals(0.5 + 0.5 * (i + 0.5) / 15, 0.5 * (1 + Erf.erf(q[i] / Math.sqrt(2))), 1e-12);
            assertTrue(i == 0 || q[i] > q[i - 1]);
        }
        Chart hn = byName("half-normal");
        assertEquals(15, hn.pointCount());
        assertTrue(hn.seriesNames().get(1).startsWith("ME "));
        assertTrue(hn.seriesNames().get(2).startsWith("SME "));
    }

    @Test
    void paletteStepsApartInGreyscale() {
        // common practice: series must stay apart when printed in greyscale; consecutive
        // palette colours differ by at least 10 in CIE L*
        double previous = -100;
        for (Color c : ChartStyle.PALETTE) {
            double l = ChartStyle.lightness(c);
            assertTrue(l - previous >= 10, "L* " + l + " after " + previous);
            previous = l;
        }
        // the L* formula: black 0, white 100 (source: CIE 15:2004 §8.2.1); a grey built from L* = 50
        // through the inverse transform comes back at 50
        assertEquals(0, ChartStyle.lightness(Color.BLACK), 1e-9);
        assertEquals(100, ChartStyle.lightness(Color.WHITE), 1e-6);
        assertEquals(50, ChartStyle.lightness(ChartStyle.fromLab(50, 0, 0)), 0.3);
        Color[] ramp = ChartStyle.fillRamp(7);
        for (int k = 1; k < ramp.length; k++) {
            assertTrue(ChartStyle.lightness(ramp[k]) - ChartStyle.lightness(ramp[k - 1]) > 8);
        }
    }

    @Test
    void lineStylesAndMarkersDifferWithoutColour() {
        // common practice: the first five series differ in dash pattern and marker as well as colour
        Set<String> dashes = new HashSet<>();
        Set<Object> markers = new HashSet<>();
        for (int i = 0; i < 5; i++) {
            dashes.add(Arrays.toString(ChartStyle.stroke(i).getDashArray()));
            markers.add(ChartStyle.marker(i).getClass());
        }
        assertEquals(5, dashes.size());
        assertEquals(5, markers.size());
    }

    @Test
    void runsHeadless() {
        // common practice: charts are drawn on build servers without a display
        assertEquals("true", System.getProperty("java.awt.headless"));
    }

    @Test
    void refusesEmptyAndAllNaNData() {
        double[] empty = {};
        double[] nan = {Double.NaN, Double.NaN};
        Quantity q = Quantity.of("J_sc", "mA/cm²");
        Interval y = new Interval(0.8, 0.95);
        String[] one = {"a"};
        String[] two = {"a", "b"};
        List<Runnable> bad = List.of(
                () -> F.histogram("h", "t", q, empty, 15, true, 0.9, y),
                () -> F.histogram("h", "t", q, nan, 15, true, 0.9, y),
                () -> F.scatter("s", "t", q, empty, q, empty),
                () -> F.scatter("s", "t", q, nan, q, new double[] {1, 2}),
                () -> F.varianceContributions("v", "t", new String[0], empty, empty, empty, empty, empty, empty),
                () -> F.varianceContributions("v", "t", one, new double[] {Double.NaN}, new double[] {0}, new double[] {0},
                        new double[] {Double.NaN}, new double[] {0}, new double[] {0}),
                () -> F.convergence("c", "t", Quantity.dimensionless("S"), new double[] {256, 512}, one,
                        new double[][] {nan}),
                () -> F.convergence("c", "t", Quantity.dimensionless("S"), empty, one, new double[][] {empty}),
                () -> F.toleranceRanking("r", "t", two, nan),
                () -> F.toleranceRanking("r", "t", new String[0], empty),
                () -> F.allocationTradeoff("a", "t", q, nan, new double[] {0.9, 0.95}, 0.95),
                () -> F.allocationTradeoff("a", "t", q, empty, empty, 0.95),
                () -> F.absorptionSpectra("p", "t", new double[] {400, 500}, one, new double[][] {nan}, null, null),
                () -> F.absorptionSpectra("p", "t", empty, one, new double[][] {empty}, null, null),
                () -> F.generationProfile("g", "t", new double[] {0, 1}, one, new double[][] {nan}, "cm⁻³ s⁻¹"),
                () -> F.generationProfile("g", "t", empty, one, new double[][] {empty}, "cm⁻³ s⁻¹"),
                () -> F.crossSections("x", "t", new double[] {400, 500}, nan, nan, nan, "nm²"),
                () -> F.crossSections("x", "t", empty, empty, empty, empty, "nm²"),
                () -> F.predictedEffects("e", "t", q, two, nan),
                () -> F.predictedEffects("e", "t", q, new String[0], empty),
                () -> F.halfNormal("n", "t", q, two, nan, 0.1, 0.2, 1),
                () -> F.halfNormal("n", "t", q, new String[0], empty, 0.1, 0.2, 1));
        for (int i = 0; i < bad.size(); i++) {
            int k = i;
            assertThrows(IllegalArgumentException.class, () -> bad.get(k).run(), "case " + k);
        }
    }

    @Test
    void refusesUnsafeNamesAndRepeatedLabels() {
        assertThrows(IllegalArgumentException.class, () -> TestCharts.small("../escape", "t"));
        assertThrows(IllegalArgumentException.class, () -> TestCharts.small("with space", "t"));
        assertThrows(IllegalArgumentException.class, () -> F.toleranceRanking("r", "t", new String[] {"a", "a"},
                new double[] {0.1, 0.2}));
        assertThrows(IllegalArgumentException.class, () -> Quantity.of("J_sc", " "));
    }

    @Test
    void userTextInChartsStaysWellFormedSvg() throws Exception {
        // common practice: a title with markup characters must not break the SVG
        Chart c = TestCharts.small("markup", "<script>alert(1)</script> & \"quotes\"");
        Document d = xmlParser().parse(new InputSource(new StringReader(c.svg())));
        assertEquals("svg", d.getDocumentElement().getLocalName());
        assertFalse(c.svg().contains("<script"));
    }

    private static Chart byName(String name) {
        for (Iterator<Chart> it = charts.iterator(); it.hasNext(); ) {
            Chart c = it.next();
            if (c.name().equals(name)) {
                return c;
            }
        }
        throw new AssertionError("no chart " + name);
    }
}
