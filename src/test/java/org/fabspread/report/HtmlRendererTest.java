package org.fabspread.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.StringReader;
import java.util.HashSet;
import java.util.List;
import java.util.Locale;
import java.util.Set;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.w3c.dom.Document;
import org.w3c.dom.Element;
import org.w3c.dom.NodeList;
import org.xml.sax.InputSource;

class HtmlRendererTest {

    private static final String EVIL = "<script>alert(1)</script>";
    private static ReportDocument sample;
    private static String sampleHtml;

    @BeforeAll
    static void render() {
        sample = new ReportDocument("Study \"demo\" & co.", "subtitle with 'quotes'", List.of(
                new Section("summary", "Summary",
                        new Paragraph("J_sc ≥ 15 mA/cm² in 87 % of samples."),
                        new KeyValues(List.of(KeyValues.pair("Yield", "87.3 %"))),
                        new Figure(TestCharts.small("one", "First chart"), "The first chart."),
                        new Figure(TestCharts.small("two", "Second \"chart\" <b>"), "The second chart.")),
                new Section("limits", "Limits of this model and cautions",
                        new BulletList(List.of("laterally homogeneous layer")),
                        new Caution("Dipole estimate of the near field."),
                        new Preformatted("study:\n  name: demo\n"))));
        sampleHtml = new HtmlRenderer().render(sample);
    }

    /** Parses the page with the JDK's XML parser after removing the HTML5 doctype line. */
    static Document parse(String html) throws Exception {
        assertTrue(html.startsWith("<!DOCTYPE html>\n"));
        return ChartFactoryTest.xmlParser().parse(new InputSource(new StringReader(html.substring("<!DOCTYPE html>".length()))));
    }

    @Test
    void pageIsWellFormedXml() throws Exception {
        // common practice: XHTML-compatible markup is read by any XML parser
        Document d = parse(sampleHtml);
        assertEquals("html", d.getDocumentElement().getTagName());
        assertEquals("Study \"demo\" & co.", d.getElementsByTagName("title").item(0).getTextContent());
    }

    @Test
    void everyFigureIsEmbeddedAsDataUri() throws Exception {
        // common practice: one self-contained file, every figure inline
        Document d = parse(sampleHtml);
        NodeList imgs = d.getElementsByTagName("img");
        NodeList svgs = d.getElementsByTagName("svg");
        assertEquals(sample.figures().size(), imgs.getLength() + svgs.getLength());
        assertEquals(sample.figures().size(), d.getElementsByTagName("figure").getLength());
        for (int i = 0; i < imgs.getLength(); i++) {
            Element img = (Element) imgs.item(i);
            assertTrue(img.getAttribute("src").startsWith("data:image/png;base64,"));
            assertFalse(img.getAttribute("alt").isBlank());
        }
        assertEquals("Second \"chart\" <b>", ((Element) imgs.item(1)).getAttribute("alt"));
    }

    @Test
    void noExternalResourceAndNoScript() throws Exception {
        // common practice: nothing is fetched from outside the file, nothing runs
        String lower = sampleHtml.toLowerCase(Locale.ROOT);
        assertFalse(lower.contains("http:"));
        assertFalse(lower.contains("https:"));
        assertFalse(lower.contains("url("));
        assertFalse(lower.contains("@import"));
        assertFalse(lower.contains("<script"));
        assertFalse(lower.contains("<link"));
        Document d = parse(sampleHtml);
        for (String tag : new String[] {"img", "a", "iframe", "object", "embed", "source"}) {
            NodeList l = d.getElementsByTagName(tag);
            for (int i = 0; i < l.getLength(); i++) {
                Element e = (Element) l.item(i);
                String src = e.getAttribute("src");
                String href = e.getAttribute("href");
                assertTrue(src.isEmpty() || src.startsWith("data:"), tag + " src " + src);
                // links go to a section or to a file beside the report, never out of its folder
                assertTrue(href.isEmpty() || href.startsWith("#") || (!href.contains(":") && !href.startsWith("/")
                        && !List.of(href.split("/")).contains("..")), tag + " href " + href);
            }
        }
    }

    @Test
    void tableOfContentsPointsAtTheSections() throws Exception {
        Document d = parse(sampleHtml);
        Set<String> ids = new HashSet<>();
        NodeList secs = d.getElementsByTagName("section");
        for (int i = 0; i < secs.getLength(); i++) {
            ids.add(((Element) secs.item(i)).getAttribute("id"));
        }
        NodeList navs = d.getElementsByTagName("nav");
        assertEquals(1, navs.getLength());
        NodeList links = ((Element) navs.item(0)).getElementsByTagName("a");
        assertEquals(2, links.getLength());
        for (int i = 0; i < links.getLength(); i++) {
            String href = ((Element) links.item(i)).getAttribute("href");
            assertTrue(ids.contains(href.substring(1)), href);
        }
    }

    @Test
    void cautionIsADistinctBox() throws Exception {
        Document d = parse(sampleHtml);
        NodeList divs = d.getElementsByTagName("div");
        int cautions = 0;
        for (int i = 0; i < divs.getLength(); i++) {
            Element e = (Element) divs.item(i);
            if (e.getAttribute("class").equals("caution")) {
                cautions++;
                assertTrue(e.getTextContent().contains("Dipole estimate"));
                assertTrue(e.getTextContent().startsWith("\nCaution"));
            }
        }
        assertEquals(1, cautions);
        // common practice: the box stands out without colour, by its heavy border
        assertTrue(HtmlRenderer.CSS.contains("div.caution { border: 2px solid"));
    }

    @Test
    void scriptInUserTextAppearsOnlyEscaped() throws Exception {
        // common practice: user text never becomes markup
        Table t = Table.of(EVIL, List.of(EVIL, "value"), List.of(List.of(EVIL, "1.0")));
        ReportDocument doc = new ReportDocument(EVIL, EVIL, List.of(new Section("s1", EVIL,
                new Paragraph(EVIL), t, new Caution(EVIL), new BulletList(List.of(EVIL)),
                new KeyValues(List.of(KeyValues.pair(EVIL, EVIL))), new Preformatted(EVIL),
                new Figure(TestCharts.small("evil", EVIL), EVIL))));
        String html = new HtmlRenderer().render(doc);
        assertFalse(html.toLowerCase(Locale.ROOT).contains("<script"));
        assertTrue(html.contains("&lt;script&gt;alert(1)&lt;/script&gt;"));
        Document d = parse(html);
        assertEquals(0, d.getElementsByTagName("script").getLength());
        assertEquals(EVIL, d.getElementsByTagName("title").item(0).getTextContent());
        assertEquals(EVIL, d.getElementsByTagName("p").item(1).getTextContent());
        assertEquals(EVIL, d.getElementsByTagName("td").item(0).getTextContent());
    }

    @Test
    void escapeCoversTheFiveCharactersAndInvalidXml() throws Exception {
        assertEquals("&amp;&lt;&gt;&quot;&#39;", HtmlRenderer.escape("&<>\"'"));
        assertEquals("a\uFFFDb", HtmlRenderer.escape("a\u0001b"));
        assertEquals("\uFFFD", HtmlRenderer.escape("\uD800"));
        assertEquals("😀", HtmlRenderer.escape("😀"));
        String html = new HtmlRenderer().render(new ReportDocument("bell\u0007", "", List.of()));
        assertEquals("bell\uFFFD", parse(html).getElementsByTagName("title").item(0).getTextContent());
    }
}
