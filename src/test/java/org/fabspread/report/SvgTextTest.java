package org.fabspread.report;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.StringReader;
import java.util.HashSet;
import java.util.Set;
import org.w3c.dom.Document;
import org.w3c.dom.NodeList;
import org.junit.jupiter.api.Test;
import org.xml.sax.InputSource;

class SvgTextTest {

    @Test
    void chartStringsStayTextInTheSvg() throws Exception {
        // source: W3C SVG 1.1 §10 (text is a <text> element, editable and searchable; outlines are <path>)
        double[] x = new double[120];
        double[] y = new double[120];
        for (int i = 0; i < x.length; i++) {
            x[i] = 400 + 3 * i;
            y[i] = 0.5 + 0.4 * Math.sin(i / 15.0);
        }
        Chart c = new ChartFactory().crossSections("svg-text", "Cross-sections in words", x, y, y, y, "nm²");
        Document d = ChartFactoryTest.xmlParser().parse(new InputSource(new StringReader(c.svg())));
        NodeList texts = d.getElementsByTagNameNS("*", "text");
        Set<String> shown = new HashSet<>();
        for (int i = 0; i < texts.getLength(); i++) {
            shown.add(texts.item(i).getTextContent());
        }
        for (String s : new String[] {"Cross-sections in words", "wavelength (nm)", "cross-section (nm²)", "extinction",
                "scattering", "absorption", "400", "700"}) {
            assertTrue(shown.contains(s), s + " is not a text element; found " + shown);
        }
    }
}
