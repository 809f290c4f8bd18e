package org.pointcall.models.rank;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.FontMetrics;
import java.awt.Graphics2D;
import java.awt.RenderingHints;
import java.awt.image.BufferedImage;
import java.io.IOException;
import java.nio.file.Path;
import java.util.Locale;

import javax.imageio.ImageIO;

import org.pointcall.shared.error.PointcallException;

/**
 * Draws a {@link FeatureRanking} as a heat map PNG: one row per feature in ranking order, one column per class, each
 * cell coloured by the correlation on a diverging scale (blue -1, white 0, red +1) with its value written in it,
 * the forest importance (if any) as a bar beside each row, and a colour key below. Rendered off screen with
 * {@link BufferedImage} (the models module draws nothing on screen and uses no UI toolkit); Java's
 * {@code java.awt.headless} is set to true when nothing has set it.
 */
public final class HeatMap {
    private static final int MARGIN = 20;
    private static final int ROW_H = 22;
    private static final int PAD = 10;
    private static final int IMPORTANCE_W = 170;
    private static final Color NEGATIVE = new Color(33, 102, 172);
    private static final Color ZERO = new Color(247, 247, 247);
    private static final Color POSITIVE = new Color(178, 24, 43);
    private static final Color UNDEFINED = new Color(210, 210, 210);
    private static final Color GRID = new Color(255, 255, 255);
    private static final Color TEXT = new Color(25, 25, 25);
    private static final Color BAR = new Color(90, 90, 90);

    private static final String KEY_CAPTION = "r (grey: undefined, the feature is constant)";

    private HeatMap() {
    }

    private static int captionWidth(Font font) {
        BufferedImage probe = new BufferedImage(1, 1, BufferedImage.TYPE_INT_RGB);
        Graphics2D g = probe.createGraphics();
        try {
            return g.getFontMetrics(font).stringWidth(KEY_CAPTION);
        } finally {
            g.dispose();
        }
    }

    /** The colour of correlation {@code r}: linear from white at 0 to the end colour at -1 or +1. */
    static Color colour(double r) {
        if (Double.isNaN(r)) {
            return UNDEFINED;
        }
        double t = Math.min(1.0, Math.abs(r));
        Color end = r < 0 ? NEGATIVE : POSITIVE;
        return new Color(mix(ZERO.getRed(), end.getRed(), t), mix(ZERO.getGreen(), end.getGreen(), t),
                mix(ZERO.getBlue(), end.getBlue(), t));
    }

    private static int mix(int a, int b, double t) {
        return (int) Math.round(a + (b - a) * t);
    }

    /** Dark text on light cells, white on dark ones (relative luminance of sRGB, ITU-R BT.709 weights). */
    private static Color textOn(Color c) {
        double y = 0.2126 * c.getRed() + 0.7152 * c.getGreen() + 0.0722 * c.getBlue();
        return y < 140 ? Color.WHITE : TEXT;
    }

    public static BufferedImage render(FeatureRanking ranking, String title) {
        if (System.getProperty("java.awt.headless") == null) {
            System.setProperty("java.awt.headless", "true");
        }
        Font plain = new Font(Font.SANS_SERIF, Font.PLAIN, 13);
        Font small = new Font(Font.SANS_SERIF, Font.PLAIN, 12);
        Font bold = new Font(Font.SANS_SERIF, Font.BOLD, 16);
        Font head = new Font(Font.SANS_SERIF, Font.BOLD, 13);
        BufferedImage probe = new BufferedImage(1, 1, BufferedImage.TYPE_INT_RGB);
        Graphics2D pg = probe.createGraphics();
        FontMetrics fm = pg.getFontMetrics(plain);
        FontMetrics hm = pg.getFontMetrics(head);
        int labelW = 0;
        for (String f : ranking.features()) {
            labelW = Math.max(labelW, fm.stringWidth(f));
        }
        int cellW = 64;
        for (String c : ranking.classes()) {
            cellW = Math.max(cellW, hm.stringWidth(c) + 14);
        }
        int titleW = pg.getFontMetrics(bold).stringWidth(title);
        pg.dispose();

        int nf = ranking.features().size();
        int nc = ranking.classes().size();
        int gridX = MARGIN + labelW + PAD;
        int gridY = MARGIN + 34 + 26;
        int impX = gridX + nc * cellW + 16;
        int width = Math.max(impX + (ranking.hasImportance() ? IMPORTANCE_W : 0) + MARGIN, MARGIN * 2 + titleW);
        // room for the colour key and its caption
        width = Math.max(width, MARGIN + 14 + 320 + 12 + captionWidth(small) + MARGIN);
        int keyY = gridY + nf * ROW_H + 30;
        int height = keyY + 60 + MARGIN;

        BufferedImage img = new BufferedImage(width, height, BufferedImage.TYPE_INT_RGB);
        Graphics2D g = img.createGraphics();
        try {
            g.setRenderingHint(RenderingHints.KEY_TEXT_ANTIALIASING, RenderingHints.VALUE_TEXT_ANTIALIAS_ON);
            g.setRenderingHint(RenderingHints.KEY_ANTIALIASING, RenderingHints.VALUE_ANTIALIAS_ON);
            g.setColor(Color.WHITE);
            g.fillRect(0, 0, width, height);

            g.setColor(TEXT);
            g.setFont(bold);
            g.drawString(title, MARGIN, MARGIN + 16);
            g.setFont(small);
            g.drawString("point-biserial r of each feature with each class indicator, " + ranking.rows()
                    + " rows" + (ranking.hasImportance() ? "; rows by forest importance" : "; rows by largest |r|"),
                    MARGIN, MARGIN + 34);

            g.setFont(head);
            for (int j = 0; j < nc; j++) {
                String c = ranking.classes().get(j);
                int x = gridX + j * cellW + (cellW - hm.stringWidth(c)) / 2;
                g.drawString(c, x, gridY - 8);
            }
            if (ranking.hasImportance()) {
                g.drawString("forest importance", impX, gridY - 8);
            }

            double maxImp = 0;
            if (ranking.hasImportance()) {
                for (int i = 0; i < nf; i++) {
                    maxImp = Math.max(maxImp, ranking.importance(i));
                }
            }
            for (int i = 0; i < nf; i++) {
                int y = gridY + i * ROW_H;
                g.setFont(plain);
                g.setColor(TEXT);
                String f = ranking.features().get(i);
                g.drawString(f, gridX - PAD - fm.stringWidth(f), y + ROW_H / 2 + fm.getAscent() / 2 - 2);
                for (int j = 0; j < nc; j++) {
                    double r = ranking.correlation(i, j);
                    Color c = colour(r);
                    g.setColor(c);
                    g.fillRect(gridX + j * cellW, y, cellW, ROW_H);
                    // no "-0.00": a value that rounds to zero is written as zero
                    String v = Double.isNaN(r) ? "-"
                            : String.format(Locale.ROOT, "%.2f", Math.abs(r) < 0.005 ? 0.0 : r);
                    g.setFont(small);
                    g.setColor(textOn(c));
                    FontMetrics sm = g.getFontMetrics();
                    g.drawString(v, gridX + j * cellW + (cellW - sm.stringWidth(v)) / 2,
                            y + ROW_H / 2 + sm.getAscent() / 2 - 2);
                }
                if (ranking.hasImportance()) {
                    double share = ranking.importance(i);
                    int barMax = IMPORTANCE_W - 56;
                    int w = maxImp > 0 ? (int) Math.round(barMax * share / maxImp) : 0;
                    g.setColor(BAR);
                    g.fillRect(impX, y + 5, Math.max(w, 1), ROW_H - 10);
                    g.setColor(TEXT);
                    g.setFont(small);
                    g.drawString(String.format(Locale.ROOT, "%.1f%%", 100 * share), impX + w + 6,
                            y + ROW_H / 2 + g.getFontMetrics().getAscent() / 2 - 2);
                }
            }
            g.setColor(GRID);
            g.setStroke(new BasicStroke(1f));
            for (int j = 0; j <= nc; j++) {
                g.drawLine(gridX + j * cellW, gridY, gridX + j * cellW, gridY + nf * ROW_H);
            }
            for (int i = 0; i <= nf; i++) {
                g.drawLine(gridX, gridY + i * ROW_H, gridX + nc * cellW, gridY + i * ROW_H);
            }

            drawKey(g, MARGIN + 14, keyY, 320, small);
        } finally {
            g.dispose();
        }
        return img;
    }

    private static void drawKey(Graphics2D g, int x, int y, int w, Font font) {
        int h = 14;
        for (int i = 0; i < w; i++) {
            g.setColor(colour(-1 + 2.0 * i / (w - 1)));
            g.fillRect(x + i, y, 1, h);
        }
        g.setColor(TEXT);
        g.drawRect(x, y, w - 1, h);
        g.setFont(font);
        FontMetrics m = g.getFontMetrics();
        double[] ticks = {-1, -0.5, 0, 0.5, 1};
        for (double t : ticks) {
            int tx = x + (int) Math.round((t + 1) / 2 * (w - 1));
            g.drawLine(tx, y + h, tx, y + h + 4);
            String s = t == 0 ? "0" : String.format(Locale.ROOT, "%+.1f", t);
            g.drawString(s, tx - m.stringWidth(s) / 2, y + h + 6 + m.getAscent());
        }
        g.drawString(KEY_CAPTION, x + w + 12, y + h - 2);
    }

    /** Renders and writes a PNG. */
    public static void writePng(FeatureRanking ranking, String title, Path file) {
        BufferedImage img = render(ranking, title);
        try {
            if (!ImageIO.write(img, "png", file.toFile())) {
                throw new PointcallException("cannot write " + file + ": no PNG writer in this Java");
            }
        } catch (IOException e) {
            throw new PointcallException("cannot write " + file + ": " + e.getMessage(), e);
        }
    }
}
