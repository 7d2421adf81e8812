package org.fabspread.shapes;

import java.awt.Color;
import java.awt.Font;
import java.awt.Graphics2D;
import java.awt.RenderingHints;
import java.awt.image.BufferedImage;
import java.io.IOException;
import java.nio.file.Path;

import javax.imageio.ImageIO;

import org.fabspread.io.AtomicFiles;

/**
 * A PNG picture of a voxelised particle: the view from the light's side (x right, y up; the grey level is
 * the share of filled cells along z) beside the view from −y (x right, z up), drawn cell by cell.
 */
public final class VoxelPicture {
    private static final int PANEL = 320;
    private static final int MARGIN = 30;

    private VoxelPicture() {
    }

    public static BufferedImage render(Voxels v, String title) {
        int w = 2 * PANEL + 3 * MARGIN;
        int h = PANEL + 2 * MARGIN + 20;
        BufferedImage img = new BufferedImage(w, h, BufferedImage.TYPE_INT_RGB);
        Graphics2D g = img.createGraphics();
        g.setRenderingHint(RenderingHints.KEY_TEXT_ANTIALIASING, RenderingHints.VALUE_TEXT_ANTIALIAS_ON);
        g.setColor(Color.WHITE);
        g.fillRect(0, 0, w, h);
        int[][] top = new int[v.nx()][v.ny()];
        int[][] side = new int[v.nx()][v.nz()];
        for (int j = 0; j < v.count(); j++) {
            top[v.xOf(j)][v.yOf(j)]++;
            side[v.xOf(j)][v.zOf(j)]++;
        }
        int largest = Math.max(v.nx(), Math.max(v.ny(), v.nz()));
        int cell = Math.max(1, PANEL / largest);
        panel(g, top, v.nz(), MARGIN, MARGIN + 20, cell);
        panel(g, side, v.ny(), 2 * MARGIN + PANEL, MARGIN + 20, cell);
        g.setColor(Color.BLACK);
        g.setFont(new Font(Font.SANS_SERIF, Font.PLAIN, 13));
        g.drawString(title, MARGIN, 20);
        g.drawString("seen along the light (x right, y up)", MARGIN, h - 8);
        g.drawString("seen from the side (x right, z up)", 2 * MARGIN + PANEL, h - 8);
        g.dispose();
        return img;
    }

    private static void panel(Graphics2D g, int[][] counts, int depth, int x0, int y0, int cell) {
        int nu = counts.length;
        int nv = counts[0].length;
        for (int u = 0; u < nu; u++) {
            for (int vv = 0; vv < nv; vv++) {
                int px = x0 + u * cell;
                int py = y0 + (nv - 1 - vv) * cell;
                if (counts[u][vv] > 0) {
                    float share = (float) counts[u][vv] / depth;
                    int grey = (int) (200 - 170 * share);
                    g.setColor(new Color(grey, grey, Math.min(255, grey + 40)));
                    g.fillRect(px, py, cell, cell);
                }
                g.setColor(new Color(225, 225, 225));
                g.drawRect(px, py, cell, cell);
            }
        }
    }

    /** Writes the picture as PNG (atomically). */
    public static void write(Voxels v, String title, Path file) throws IOException {
        BufferedImage img = render(v, title);
        AtomicFiles.write(file, os -> ImageIO.write(img, "png", os));
    }
}
