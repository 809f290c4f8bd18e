package org.pointcall.ui.console;

import java.util.Locale;

import javafx.scene.shape.SVGPath;

import org.pointcall.ui.desk.Outcome;
import org.pointcall.ui.desk.PointMark;

/** The shapes of the point states and verdicts, drawn (not font glyphs) so they look the same everywhere. */
final class Marks {
    private Marks() {
    }

    /** A shape of {@code size} px for a point state, with the state's style class. */
    static SVGPath of(PointMark m, double size) {
        SVGPath p = new SVGPath();
        p.setContent(path(m.shape()));
        double k = size / 12.0;
        p.setScaleX(k);
        p.setScaleY(k);
        p.setStrokeWidth(1.6);
        // the check in the disc is a hole: it must read in the same colour as the disc
        p.setFillRule(javafx.scene.shape.FillRule.EVEN_ODD);
        style(p, m);
        return p;
    }

    static void restyle(SVGPath p, PointMark m) {
        p.setContent(path(m.shape()));
        style(p, m);
    }

    private static void style(SVGPath p, PointMark m) {
        p.getStyleClass().removeIf(c -> c.startsWith("mark-"));
        p.getStyleClass().add("mark-" + m.name().toLowerCase(Locale.ROOT));
    }

    static PointMark markOf(Outcome o) {
        return o.mark();
    }

    /** Paths in a 12 x 12 box. */
    static String path(PointMark.Shape s) {
        return switch (s) {
            case RING -> "M6 1.5 A4.5 4.5 0 1 1 5.99 1.5 Z";
            case DIAMOND -> "M6 0.5 L11.5 6 L6 11.5 L0.5 6 Z";
            case WEDGE -> "M1.5 1 L11 6 L1.5 11 Z";
            case DISC -> "M6 0.5 A5.5 5.5 0 1 1 5.99 0.5 Z M2.8 6.3 L5.1 8.8 L9.4 4.0 L8.4 3.1 L5.1 6.8 L3.8 5.4 Z";
            case CROSS -> "M1.5 3.5 L3.5 1.5 L6 4 L8.5 1.5 L10.5 3.5 L8 6 L10.5 8.5 L8.5 10.5 L6 8 L3.5 10.5 L1.5 8.5 L4 6 Z";
            case HALF -> "M6 0.5 A5.5 5.5 0 0 0 6 11.5 Z M6 0.5 A5.5 5.5 0 0 1 6 11.5 L6 10 A4 4 0 0 0 6 2 Z";
            case BAR -> "M0.5 4.5 L11.5 4.5 L11.5 7.5 L0.5 7.5 Z";
        };
    }
}
