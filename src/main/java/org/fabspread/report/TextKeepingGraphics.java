package org.fabspread.report;

import java.awt.Color;
import java.awt.Composite;
import java.awt.Font;
import java.awt.FontMetrics;
import java.awt.Graphics;
import java.awt.Graphics2D;
import java.awt.GraphicsConfiguration;
import java.awt.Image;
import java.awt.Paint;
import java.awt.Rectangle;
import java.awt.RenderingHints;
import java.awt.Shape;
import java.awt.Stroke;
import java.awt.font.FontRenderContext;
import java.awt.font.GlyphVector;
import java.awt.font.TextLayout;
import java.awt.geom.AffineTransform;
import java.awt.geom.PathIterator;
import java.awt.geom.Rectangle2D;
import java.awt.image.BufferedImage;
import java.awt.image.BufferedImageOp;
import java.awt.image.ImageObserver;
import java.awt.image.RenderedImage;
import java.awt.image.renderable.RenderableImage;
import java.text.AttributedCharacterIterator;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * A {@link Graphics2D} that passes every call to another one, except one: the chart library draws
 * each string as the filled outline of its glyphs ({@code TextLayout.getOutline}), which a vector file
 * then holds as curves, not text. When a filled shape is exactly the outline of one of the chart's own
 * strings in one of its fonts, this graphics draws the string instead, so the SVG keeps real,
 * editable text in the same place, font and colour. Other shapes are filled as given.
 */
final class TextKeepingGraphics extends Graphics2D {

    /** A string in a font, one of the texts the chart may draw. */
    record Text(String text, Font font) {
    }

    private final Graphics2D g;
    private final List<Text> texts;
    /** A known text with its outline in the indexed render context, upright or turned a quarter left. */
    private record Candidate(Text text, Shape outline, boolean turned) {
    }

    /** The library draws a vertical axis title as the outline turned by −90° about its origin. */
    private static final AffineTransform TURN = AffineTransform.getRotateInstance(-Math.PI / 2, 0, 0);

    /** Outline bounds (rounded) → candidate texts with their outlines, built for one render context. */
    private Map<String, List<Candidate>> index;
    private FontRenderContext indexed;

    TextKeepingGraphics(Graphics2D g, List<Text> texts) {
        this.g = g;
        this.texts = List.copyOf(texts);
    }

    private TextKeepingGraphics(Graphics2D g, List<Text> texts, Map<String, List<Candidate>> index,
                                FontRenderContext indexed) {
        this(g, texts);
        this.index = index;
        this.indexed = indexed;
    }

    @Override
    public void fill(Shape s) {
        Candidate c = match(s);
        if (c == null) {
            g.fill(s);
            return;
        }
        Font font = g.getFont();
        AffineTransform at = g.getTransform();
        g.setFont(c.text().font());
        if (c.turned()) {
            g.transform(TURN);
        }
        g.drawString(c.text().text(), 0f, 0f);
        g.setTransform(at);
        g.setFont(font);
    }

    /** The known text whose outline is {@code s}, or null. */
    private Candidate match(Shape s) {
        FontRenderContext frc = g.getFontRenderContext();
        if (index == null || !frc.equals(indexed)) {
            index = new HashMap<>();
            indexed = frc;
            for (Text t : texts) {
                if (t.text().isEmpty()) {
                    continue;
                }
                TextLayout layout = new TextLayout(t.text(), t.font(), frc);
                Shape upright = layout.getOutline(null);
                index.computeIfAbsent(key(upright.getBounds2D()), k -> new ArrayList<>())
                        .add(new Candidate(t, upright, false));
                Shape turned = layout.getOutline(TURN);
                index.computeIfAbsent(key(turned.getBounds2D()), k -> new ArrayList<>()).add(new Candidate(t, turned, true));
            }
        }
        List<Candidate> candidates = index.get(key(s.getBounds2D()));
        if (candidates == null) {
            return null;
        }
        for (Candidate c : candidates) {
            if (samePath(s, c.outline())) {
                return c;
            }
        }
        return null;
    }

    private static String key(Rectangle2D b) {
        return Math.round(b.getX() * 100) + ":" + Math.round(b.getY() * 100) + ":" + Math.round(b.getWidth() * 100)
                + ":" + Math.round(b.getHeight() * 100);
    }

    private static boolean samePath(Shape a, Shape b) {
        PathIterator pa = a.getPathIterator(null);
        PathIterator pb = b.getPathIterator(null);
        double[] ca = new double[6];
        double[] cb = new double[6];
        while (!pa.isDone() && !pb.isDone()) {
            int ta = pa.currentSegment(ca);
            int tb = pb.currentSegment(cb);
            if (ta != tb) {
                return false;
            }
            for (int i = 0; i < 6; i++) {
                if (Math.abs(ca[i] - cb[i]) > 1e-6) {
                    return false;
                }
            }
            pa.next();
            pb.next();
        }
        return pa.isDone() && pb.isDone();
    }

    @Override
    public Graphics create() {
        return new TextKeepingGraphics((Graphics2D) g.create(), texts, index, indexed);
    }

    @Override
    public void dispose() {
        g.dispose();
    }

    @Override
    public void addRenderingHints(Map<?, ?> a0) {
        g.addRenderingHints(a0);
    }

    @Override
    public void clearRect(int a0, int a1, int a2, int a3) {
        g.clearRect(a0, a1, a2, a3);
    }

    @Override
    public void clip(Shape a0) {
        g.clip(a0);
    }

    @Override
    public void clipRect(int a0, int a1, int a2, int a3) {
        g.clipRect(a0, a1, a2, a3);
    }

    @Override
    public void copyArea(int a0, int a1, int a2, int a3, int a4, int a5) {
        g.copyArea(a0, a1, a2, a3, a4, a5);
    }

    @Override
    public void draw(Shape a0) {
        g.draw(a0);
    }

    @Override
    public void drawArc(int a0, int a1, int a2, int a3, int a4, int a5) {
        g.drawArc(a0, a1, a2, a3, a4, a5);
    }

    @Override
    public void drawGlyphVector(GlyphVector a0, float a1, float a2) {
        g.drawGlyphVector(a0, a1, a2);
    }

    @Override
    public boolean drawImage(Image a0, AffineTransform a1, ImageObserver a2) {
        return g.drawImage(a0, a1, a2);
    }

    @Override
    public void drawImage(BufferedImage a0, BufferedImageOp a1, int a2, int a3) {
        g.drawImage(a0, a1, a2, a3);
    }

    @Override
    public boolean drawImage(Image a0, int a1, int a2, ImageObserver a3) {
        return g.drawImage(a0, a1, a2, a3);
    }

    @Override
    public boolean drawImage(Image a0, int a1, int a2, Color a3, ImageObserver a4) {
        return g.drawImage(a0, a1, a2, a3, a4);
    }

    @Override
    public boolean drawImage(Image a0, int a1, int a2, int a3, int a4, ImageObserver a5) {
        return g.drawImage(a0, a1, a2, a3, a4, a5);
    }

    @Override
    public boolean drawImage(Image a0, int a1, int a2, int a3, int a4, Color a5, ImageObserver a6) {
        return g.drawImage(a0, a1, a2, a3, a4, a5, a6);
    }

    @Override
    public boolean drawImage(Image a0, int a1, int a2, int a3, int a4, int a5, int a6, int a7, int a8, ImageObserver a9) {
        return g.drawImage(a0, a1, a2, a3, a4, a5, a6, a7, a8, a9);
    }

    @Override
    public boolean drawImage(Image a0, int a1, int a2, int a3, int a4, int a5, int a6, int a7, int a8, Color a9, ImageObserver a10) {
        return g.drawImage(a0, a1, a2, a3, a4, a5, a6, a7, a8, a9, a10);
    }

    @Override
    public void drawLine(int a0, int a1, int a2, int a3) {
        g.drawLine(a0, a1, a2, a3);
    }

    @Override
    public void drawOval(int a0, int a1, int a2, int a3) {
        g.drawOval(a0, a1, a2, a3);
    }

    @Override
    public void drawPolygon(int[] a0, int[] a1, int a2) {
        g.drawPolygon(a0, a1, a2);
    }

    @Override
    public void drawPolyline(int[] a0, int[] a1, int a2) {
        g.drawPolyline(a0, a1, a2);
    }

    @Override
    public void drawRenderableImage(RenderableImage a0, AffineTransform a1) {
        g.drawRenderableImage(a0, a1);
    }

    @Override
    public void drawRenderedImage(RenderedImage a0, AffineTransform a1) {
        g.drawRenderedImage(a0, a1);
    }

    @Override
    public void drawRoundRect(int a0, int a1, int a2, int a3, int a4, int a5) {
        g.drawRoundRect(a0, a1, a2, a3, a4, a5);
    }

    @Override
    public void drawString(String a0, int a1, int a2) {
        g.drawString(a0, a1, a2);
    }

    @Override
    public void drawString(String a0, float a1, float a2) {
        g.drawString(a0, a1, a2);
    }

    @Override
    public void drawString(AttributedCharacterIterator a0, int a1, int a2) {
        g.drawString(a0, a1, a2);
    }

    @Override
    public void drawString(AttributedCharacterIterator a0, float a1, float a2) {
        g.drawString(a0, a1, a2);
    }

    @Override
    public void fillArc(int a0, int a1, int a2, int a3, int a4, int a5) {
        g.fillArc(a0, a1, a2, a3, a4, a5);
    }

    @Override
    public void fillOval(int a0, int a1, int a2, int a3) {
        g.fillOval(a0, a1, a2, a3);
    }

    @Override
    public void fillPolygon(int[] a0, int[] a1, int a2) {
        g.fillPolygon(a0, a1, a2);
    }

    @Override
    public void fillRect(int a0, int a1, int a2, int a3) {
        g.fillRect(a0, a1, a2, a3);
    }

    @Override
    public void fillRoundRect(int a0, int a1, int a2, int a3, int a4, int a5) {
        g.fillRoundRect(a0, a1, a2, a3, a4, a5);
    }

    @Override
    public Color getBackground() {
        return g.getBackground();
    }

    @Override
    public Shape getClip() {
        return g.getClip();
    }

    @Override
    public Rectangle getClipBounds() {
        return g.getClipBounds();
    }

    @Override
    public Color getColor() {
        return g.getColor();
    }

    @Override
    public Composite getComposite() {
        return g.getComposite();
    }

    @Override
    public GraphicsConfiguration getDeviceConfiguration() {
        return g.getDeviceConfiguration();
    }

    @Override
    public Font getFont() {
        return g.getFont();
    }

    @Override
    public FontMetrics getFontMetrics(Font a0) {
        return g.getFontMetrics(a0);
    }

    @Override
    public FontRenderContext getFontRenderContext() {
        return g.getFontRenderContext();
    }

    @Override
    public Paint getPaint() {
        return g.getPaint();
    }

    @Override
    public Object getRenderingHint(RenderingHints.Key a0) {
        return g.getRenderingHint(a0);
    }

    @Override
    public RenderingHints getRenderingHints() {
        return g.getRenderingHints();
    }

    @Override
    public Stroke getStroke() {
        return g.getStroke();
    }

    @Override
    public AffineTransform getTransform() {
        return g.getTransform();
    }

    @Override
    public boolean hit(Rectangle a0, Shape a1, boolean a2) {
        return g.hit(a0, a1, a2);
    }

    @Override
    public void rotate(double a0) {
        g.rotate(a0);
    }

    @Override
    public void rotate(double a0, double a1, double a2) {
        g.rotate(a0, a1, a2);
    }

    @Override
    public void scale(double a0, double a1) {
        g.scale(a0, a1);
    }

    @Override
    public void setBackground(Color a0) {
        g.setBackground(a0);
    }

    @Override
    public void setClip(Shape a0) {
        g.setClip(a0);
    }

    @Override
    public void setClip(int a0, int a1, int a2, int a3) {
        g.setClip(a0, a1, a2, a3);
    }

    @Override
    public void setColor(Color a0) {
        g.setColor(a0);
    }

    @Override
    public void setComposite(Composite a0) {
        g.setComposite(a0);
    }

    @Override
    public void setFont(Font a0) {
        g.setFont(a0);
    }

    @Override
    public void setPaint(Paint a0) {
        g.setPaint(a0);
    }

    @Override
    public void setPaintMode() {
        g.setPaintMode();
    }

    @Override
    public void setRenderingHint(RenderingHints.Key a0, Object a1) {
        g.setRenderingHint(a0, a1);
    }

    @Override
    public void setRenderingHints(Map<?, ?> a0) {
        g.setRenderingHints(a0);
    }

    @Override
    public void setStroke(Stroke a0) {
        g.setStroke(a0);
    }

    @Override
    public void setTransform(AffineTransform a0) {
        g.setTransform(a0);
    }

    @Override
    public void setXORMode(Color a0) {
        g.setXORMode(a0);
    }

    @Override
    public void shear(double a0, double a1) {
        g.shear(a0, a1);
    }

    @Override
    public void transform(AffineTransform a0) {
        g.transform(a0);
    }

    @Override
    public void translate(int a0, int a1) {
        g.translate(a0, a1);
    }

    @Override
    public void translate(double a0, double a1) {
        g.translate(a0, a1);
    }
}
