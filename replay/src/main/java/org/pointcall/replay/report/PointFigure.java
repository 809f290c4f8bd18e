package org.pointcall.replay.report;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.Graphics2D;
import java.awt.RenderingHints;
import java.awt.geom.Rectangle2D;
import java.awt.image.BufferedImage;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.text.DecimalFormat;
import java.text.DecimalFormatSymbols;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Map;

import javax.imageio.ImageIO;

import org.jfree.chart.JFreeChart;
import org.jfree.chart.annotations.XYBoxAnnotation;
import org.jfree.chart.annotations.XYPolygonAnnotation;
import org.jfree.chart.annotations.XYTextAnnotation;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.plot.CombinedDomainXYPlot;
import org.jfree.chart.plot.IntervalMarker;
import org.jfree.chart.plot.ValueMarker;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.XYLineAndShapeRenderer;
import org.jfree.chart.title.TextTitle;
import org.jfree.chart.ui.Layer;
import org.jfree.chart.ui.RectangleAnchor;
import org.jfree.chart.ui.RectangleInsets;
import org.jfree.chart.ui.TextAnchor;
import org.jfree.data.xy.DefaultXYDataset;
import org.pointcall.models.card.PhaseJudge;
import org.pointcall.replay.report.FrameTimeline.Gap;
import org.pointcall.shared.card.Band;
import org.pointcall.shared.card.BandPhase;
import org.pointcall.shared.card.TestPoint;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.kind.ManoeuvreKind;
import org.pointcall.shared.outcome.BandResult;
import org.pointcall.shared.outcome.PointOutcome;
import org.pointcall.shared.units.Unit;

/**
 * One point's figure: its kind's parameters ({@link FigurePlan}) over time on a shared time axis, one panel each,
 * the card point's parameter bands shaded over the span each applies to (as {@link PhaseJudge} judges them: entry
 * over the second before the begin, throughout from the begin to where the technique ends, a rate band as the fan
 * of slopes it allows, an instant band around its instant), green where the band held and red where not; key
 * instants as dashed lines, begin and end as grey lines, time with no frame as grey strips. Drawn into an image
 * with no screen (Java2D, headless).
 */
public final class PointFigure {
    /** Image width, px. */
    public static final int WIDTH_PX = 1200;
    /** Height of one panel, px. */
    public static final int PANEL_PX = 125;
    /** Height of the title and the time axis, px. */
    public static final int FRAME_PX = 80;
    /** Time shown before the begin and after the end: this share of the point's length, at least {@link #PAD_S}. */
    public static final double PAD_SHARE = 0.1;
    /** Least time shown each side of a point, s. */
    public static final double PAD_S = 3.0;

    static final Color LINE = new Color(0x1F, 0x3B, 0x73);
    static final Color HELD = new Color(0x2E, 0x7D, 0x32);
    static final Color NOT_HELD = new Color(0xC6, 0x28, 0x28);
    static final Color INSTANT = new Color(0xB3, 0x5C, 0x00);
    static final Color EDGE = new Color(0x75, 0x75, 0x75);
    static final Color NO_DATA = new Color(0x9E, 0x9E, 0x9E);
    private static final Color CLEAR = new Color(255, 255, 255, 0);
    private static final Font TICKS = new Font(Font.SANS_SERIF, Font.PLAIN, 14);
    private static final Font LABEL = new Font(Font.SANS_SERIF, Font.PLAIN, 15);
    private static final Font SMALL = new Font(Font.SANS_SERIF, Font.PLAIN, 13);
    private static final Font TITLE = new Font(Font.SANS_SERIF, Font.BOLD, 17);

    private PointFigure() {
    }

    /** The time span a point's figure shows, data time. */
    public record Window(long fromNs, long toNs) {
    }

    /** What the figure shows of a point, before drawing. */
    public static Window window(PointOutcome o, TestPoint point) {
        long padNs = Math.round(Math.max(PAD_S, PAD_SHARE * (o.endNs() - o.beginNs()) * 1e-9) * 1e9);
        long from = o.beginNs() - Math.max(padNs, Math.round(PhaseJudge.ENTRY_SPAN_S * 1e9) + padNs / 2);
        if (point != null) {
            for (Band b : point.bands()) {
                Long at = b.instant() == null ? null : o.instantsNs().get(b.instant());
                if (b.phase() == BandPhase.RATE && at != null) {
                    from = Math.min(from, at - Math.round(b.overS() * 1e9) - padNs / 2);
                }
            }
        }
        return new Window(from, o.endNs() + padNs);
    }

    /**
     * Draws a point's figure.
     *
     * @param point the card point the outcome was bound to, or null (no bands then)
     * @param gaps  time with no frame, for the grey strips
     * @return the image, or null when the trace has none of the figure's parameters
     */
    public static BufferedImage render(PointOutcome o, TestPoint point, SortieTrace trace, List<Gap> gaps,
                                       ParameterDictionary dictionary) {
        ManoeuvreKind kind = ManoeuvreKind.byKey(o.kind()).orElse(null);
        List<String> panels = new ArrayList<>();
        for (String p : kind == null ? List.<String>of() : FigurePlan.panels(kind, point, dictionary)) {
            if (trace.column(p) >= 0) {
                panels.add(p);
            }
        }
        if (panels.isEmpty()) {
            return null;
        }
        Window w = window(o, point);
        double x0 = w.fromNs() * 1e-9;
        double x1 = w.toNs() * 1e-9;
        NumberAxis time = new NumberAxis("data time, s");
        time.setAutoRangeIncludesZero(false);
        time.setRange(x0, x1);
        time.setNumberFormatOverride(new DecimalFormat("0.#", DecimalFormatSymbols.getInstance(Locale.ROOT)));
        style(time);
        CombinedDomainXYPlot plot = new CombinedDomainXYPlot(time);
        plot.setGap(6);
        for (int i = 0; i < panels.size(); i++) {
            plot.add(panel(o, point, trace, gaps, panels.get(i), w, i == 0), 1);
        }
        JFreeChart chart = new JFreeChart(null, TITLE, plot, false);
        chart.setBackgroundPaint(Color.WHITE);
        String title = (o.cardId() == null ? "unplanned" : o.cardId()) + "   " + o.title() + "   "
                + String.format(Locale.ROOT, "%.1f to %.1f s", o.beginNs() * 1e-9, o.endNs() * 1e-9);
        chart.setTitle(new TextTitle(title, TITLE));
        chart.setPadding(new RectangleInsets(4, 4, 4, 12));
        int height = FRAME_PX + PANEL_PX * panels.size();
        BufferedImage img = new BufferedImage(WIDTH_PX, height, BufferedImage.TYPE_INT_RGB);
        Graphics2D g = img.createGraphics();
        try {
            g.setRenderingHint(RenderingHints.KEY_ANTIALIASING, RenderingHints.VALUE_ANTIALIAS_ON);
            g.setRenderingHint(RenderingHints.KEY_TEXT_ANTIALIASING, RenderingHints.VALUE_TEXT_ANTIALIAS_ON);
            chart.draw(g, new Rectangle2D.Double(0, 0, WIDTH_PX, height));
        } finally {
            g.dispose();
        }
        return img;
    }

    /** The image as PNG bytes. */
    public static byte[] png(BufferedImage img) {
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        try {
            ImageIO.write(img, "png", out);
        } catch (IOException e) {
            throw new UncheckedIOException("cannot encode a figure as PNG", e);
        }
        return out.toByteArray();
    }

    private static XYPlot panel(PointOutcome o, TestPoint point, SortieTrace trace, List<Gap> gaps, String name,
                                Window w, boolean top) {
        int col = trace.column(name);
        Unit unit = trace.unit(col);
        double[][] xy = samples(trace, col, w);
        DefaultXYDataset data = new DefaultXYDataset();
        data.addSeries(name, xy);
        double lo = Double.POSITIVE_INFINITY;
        double hi = Double.NEGATIVE_INFINITY;
        for (double v : xy[1]) {
            if (Double.isFinite(v)) {
                lo = Math.min(lo, v);
                hi = Math.max(hi, v);
            }
        }
        List<Shade> shades = shades(o, point, name, unit, trace, col);
        for (Shade s : shades) {
            if (s.band.phase() == BandPhase.RATE) {
                continue; // its limits are slopes, not values: the fan is drawn within the data's range
            }
            if (Double.isFinite(s.low)) {
                lo = Math.min(lo, s.low);
                hi = Math.max(hi, s.low);
            }
            if (Double.isFinite(s.high)) {
                lo = Math.min(lo, s.high);
                hi = Math.max(hi, s.high);
            }
        }
        if (!(lo <= hi)) {
            lo = 0;
            hi = 1;
        }
        double span = hi - lo;
        double margin = span > 0 ? span * 0.08 : Math.max(1e-3, Math.abs(hi) * 0.02);
        String symbol = unit.symbol();
        NumberAxis axis = new NumberAxis(symbol.equals("1") || symbol.equals(name) ? name : name + ", " + symbol);
        axis.setAutoRangeIncludesZero(false);
        axis.setRange(lo - margin, hi + margin);
        style(axis);
        XYLineAndShapeRenderer r = new XYLineAndShapeRenderer(true, false);
        r.setSeriesPaint(0, LINE);
        r.setSeriesStroke(0, new BasicStroke(1.6f));
        XYPlot p = new XYPlot(data, null, axis, r);
        p.setBackgroundPaint(Color.WHITE);
        p.setDomainGridlinePaint(new Color(0xDD, 0xDD, 0xDD));
        p.setRangeGridlinePaint(new Color(0xDD, 0xDD, 0xDD));
        p.setOutlinePaint(EDGE);
        double yLo = lo - margin;
        double yHi = hi + margin;
        for (Shade s : shades) {
            s.draw(p, yLo, yHi);
        }
        for (Gap g : gaps) {
            if (g.toNs() > w.fromNs() && g.fromNs() < w.toNs()) {
                IntervalMarker m = new IntervalMarker(g.fromNs() * 1e-9, g.toNs() * 1e-9, withAlpha(NO_DATA, 90));
                p.addDomainMarker(m, Layer.BACKGROUND);
            }
        }
        edge(p, o.beginNs(), top ? "begin" : null, TextAnchor.TOP_LEFT);
        edge(p, o.endNs(), top ? "end" : null, TextAnchor.TOP_RIGHT);
        for (Map.Entry<String, Long> e : o.instantsNs().entrySet()) {
            ValueMarker m = new ValueMarker(e.getValue() * 1e-9, INSTANT, new BasicStroke(1.4f,
                    BasicStroke.CAP_BUTT, BasicStroke.JOIN_MITER, 10f, new float[] {6f, 4f}, 0f));
            if (top) {
                m.setLabel(e.getKey());
                m.setLabelFont(SMALL);
                m.setLabelPaint(INSTANT);
                m.setLabelBackgroundColor(CLEAR);
                m.setLabelAnchor(RectangleAnchor.TOP_RIGHT);
                m.setLabelTextAnchor(TextAnchor.TOP_LEFT);
                // below the begin and end labels, which may sit at the same time (a held point's start and end)
                m.setLabelOffset(new RectangleInsets(18, 2, 2, 2));
            }
            p.addDomainMarker(m, Layer.FOREGROUND);
        }
        if (xy[0].length == 0) {
            XYTextAnnotation none = new XYTextAnnotation("no " + name + " samples in this span",
                    (w.fromNs() + w.toNs()) * 0.5e-9, (yLo + yHi) / 2);
            none.setFont(LABEL);
            none.setPaint(EDGE);
            p.addAnnotation(none);
        }
        return p;
    }

    private static void edge(XYPlot p, long ns, String label, TextAnchor anchor) {
        ValueMarker m = new ValueMarker(ns * 1e-9, EDGE, new BasicStroke(1.2f));
        if (label != null) {
            m.setLabel(label);
            m.setLabelFont(SMALL);
            m.setLabelPaint(EDGE);
            m.setLabelBackgroundColor(CLEAR);
            m.setLabelAnchor(anchor == TextAnchor.TOP_LEFT ? RectangleAnchor.TOP_RIGHT : RectangleAnchor.TOP_LEFT);
            m.setLabelTextAnchor(anchor);
        }
        p.addDomainMarker(m, Layer.FOREGROUND);
    }

    private static void style(NumberAxis a) {
        a.setTickLabelFont(TICKS);
        a.setLabelFont(LABEL);
        a.setLabelPaint(Color.BLACK);
        a.setTickLabelPaint(Color.BLACK);
    }

    /**
     * The finite samples of a column in the window, a NaN put in wherever the samples are further apart than
     * {@link FrameTimeline#GAP_FACTOR} times their usual spacing, so a dropout is not drawn across.
     */
    static double[][] samples(SortieTrace trace, int col, Window w) {
        int a = trace.firstAtOrAfter(w.fromNs());
        int b = trace.firstAtOrAfter(w.toNs() + 1);
        long[] t = new long[Math.max(0, b - a)];
        double[] v = new double[t.length];
        int n = 0;
        for (int i = a; i < b; i++) {
            double x = trace.value(col, i);
            if (Double.isFinite(x)) {
                t[n] = trace.timeNs(i);
                v[n++] = x;
            }
        }
        if (n == 0) {
            return new double[][] {new double[0], new double[0]};
        }
        long usual = usualSpacing(t, n);
        double[] xs = new double[2 * n];
        double[] ys = new double[2 * n];
        int m = 0;
        for (int i = 0; i < n; i++) {
            if (i > 0 && usual > 0 && t[i] - t[i - 1] >= FrameTimeline.GAP_FACTOR * usual) {
                xs[m] = (t[i - 1] + t[i]) * 0.5e-9;
                ys[m++] = Double.NaN;
            }
            xs[m] = t[i] * 1e-9;
            ys[m++] = v[i];
        }
        return new double[][] {Arrays.copyOf(xs, m), Arrays.copyOf(ys, m)};
    }

    private static long usualSpacing(long[] t, int n) {
        if (n < 2) {
            return 0;
        }
        long[] d = new long[n - 1];
        for (int i = 1; i < n; i++) {
            d[i - 1] = t[i] - t[i - 1];
        }
        Arrays.sort(d);
        return d[d.length / 2];
    }

    /** A band drawn on a panel, in the panel's unit. */
    private record Shade(Band band, BandResult result, double fromS, double toS, double low, double high,
                         double anchor, String text) {
        Color colour() {
            return result == null || result.value() == null ? NO_DATA : result.held() ? HELD : NOT_HELD;
        }

        void draw(XYPlot p, double yLo, double yHi) {
            Color c = colour();
            double lo = Double.isFinite(low) ? low : (low < 0 ? yLo : yHi);
            double hi = Double.isFinite(high) ? high : (high < 0 ? yLo : yHi);
            if (band.phase() == BandPhase.RATE) {
                double over = toS - fromS;
                // an open side of a rate band: the fan opens to twice the panel's height over the interval
                double steep = 2 * (yHi - yLo) / over;
                double rLo = Double.isFinite(low) ? low : -steep;
                double rHi = Double.isFinite(high) ? high : steep;
                double[] fan = {fromS, anchor, toS, anchor + rLo * over, toS, anchor + rHi * over};
                p.addAnnotation(new XYPolygonAnnotation(fan, new BasicStroke(1f), withAlpha(c, 200),
                        withAlpha(c, 55)));
                label(p, fromS, Math.min(yHi, Math.max(anchor, Math.max(anchor + rLo * over, anchor + rHi * over))),
                        c, TextAnchor.BOTTOM_LEFT);
                return;
            }
            p.addAnnotation(new XYBoxAnnotation(fromS, lo, toS, hi, new BasicStroke(1f), withAlpha(c, 170),
                    withAlpha(c, 50)), false);
            // at the box's foot: its top edge is where the begin, end and instant labels are
            label(p, fromS, Math.max(lo, yLo), c, TextAnchor.BOTTOM_LEFT);
        }

        private void label(XYPlot p, double x, double y, Color c, TextAnchor anchor) {
            XYTextAnnotation t = new XYTextAnnotation(" " + text, x, y);
            t.setFont(SMALL);
            t.setPaint(c.darker());
            t.setTextAnchor(anchor);
            p.addAnnotation(t, false);
        }
    }

    private static List<Shade> shades(PointOutcome o, TestPoint point, String name, Unit unit, SortieTrace trace,
                                      int col) {
        List<Shade> out = new ArrayList<>();
        if (point == null) {
            return out;
        }
        ManoeuvreKind kind = point.kind();
        for (int i = 0; i < point.bands().size(); i++) {
            Band b = point.bands().get(i);
            if (!name.equals(b.parameter())) {
                continue;
            }
            BandResult result = null;
            for (BandResult r : o.bands()) {
                if (r.index() == i) {
                    result = r;
                }
            }
            String text = b.phase().key() + (b.instant() == null ? "" : " " + b.instant()) + " " + b.describe();
            double low = b.lowSi();
            double high = b.highSi();
            switch (b.phase()) {
                case ENTRY -> out.add(new Shade(b, result, (o.beginNs() * 1e-9) - PhaseJudge.ENTRY_SPAN_S,
                        o.beginNs() * 1e-9, value(unit, low), value(unit, high), Double.NaN, text));
                case THROUGHOUT -> out.add(new Shade(b, result, o.beginNs() * 1e-9,
                        PhaseJudge.throughoutEndNs(kind, o.instantsNs(), o.endNs()) * 1e-9, value(unit, low),
                        value(unit, high), Double.NaN, text));
                case INSTANT -> {
                    Long at = o.instantsNs().get(b.instant());
                    if (at != null) {
                        // the judged span is the 0.25 s up to the instant: widened so the box can be seen at a
                        // figure's scale
                        double span = Math.max(PhaseJudge.INSTANT_SPAN_S, (o.endNs() - o.beginNs()) * 1e-9 * 0.02);
                        out.add(new Shade(b, result, at * 1e-9 - span, at * 1e-9, value(unit, low),
                                value(unit, high), Double.NaN, text));
                    }
                }
                case RATE -> {
                    Long at = o.instantsNs().get(b.instant());
                    if (at != null) {
                        long from = at - Math.round(b.overS() * 1e9);
                        double anchor = meanNear(trace, col, from, from + 500_000_000L);
                        if (Double.isFinite(anchor)) {
                            out.add(new Shade(b, result, from * 1e-9, at * 1e-9, rate(unit, low), rate(unit, high),
                                    anchor, text));
                        }
                    }
                }
                default -> {
                }
            }
        }
        return out;
    }

    private static double value(Unit u, double si) {
        return Double.isInfinite(si) ? si : u.fromSi(si);
    }

    private static double rate(Unit u, double siPerS) {
        return Double.isInfinite(siPerS) ? siPerS : u.deltaFromSi(siPerS);
    }

    private static double meanNear(SortieTrace trace, int col, long fromNs, long toNs) {
        double sum = 0;
        int n = 0;
        for (int i = trace.firstAtOrAfter(fromNs); i < trace.size() && trace.timeNs(i) <= toNs; i++) {
            double v = trace.value(col, i);
            if (Double.isFinite(v)) {
                sum += v;
                n++;
            }
        }
        return n == 0 ? Double.NaN : sum / n;
    }

    static Color withAlpha(Color c, int alpha) {
        return new Color(c.getRed(), c.getGreen(), c.getBlue(), alpha);
    }
}
