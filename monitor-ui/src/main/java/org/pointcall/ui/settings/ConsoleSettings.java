package org.pointcall.ui.settings;

import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Set;

/**
 * What the console remembers between runs: chart groups, time span, window size and the split of its columns.
 *
 * @param groups       chart groups, top to bottom
 * @param spanS        time span of the strip charts, 10 to 120 s
 * @param widthPx      window width
 * @param heightPx     window height
 * @param cardSplit    share of the width given to the card list, 0.1 to 0.4
 * @param pointSplit   share of the width given to the active-point panel, 0.15 to 0.45
 */
public record ConsoleSettings(List<TraceGroup> groups, double spanS, double widthPx, double heightPx,
                              double cardSplit, double pointSplit) {
    public static final double MIN_SPAN_S = 10;
    public static final double MAX_SPAN_S = 120;

    public ConsoleSettings {
        groups = List.copyOf(groups);
        if (groups.isEmpty()) {
            throw new IllegalArgumentException("the console needs at least one chart group");
        }
        if (!(spanS >= MIN_SPAN_S && spanS <= MAX_SPAN_S)) {
            throw new IllegalArgumentException("chart span must be 10 to 120 s, got " + spanS);
        }
        if (!(widthPx >= 800 && widthPx <= 8000) || !(heightPx >= 500 && heightPx <= 8000)) {
            throw new IllegalArgumentException("window must be 800x500 to 8000x8000 px, got " + widthPx + "x"
                    + heightPx);
        }
        if (!(cardSplit >= 0.1 && cardSplit <= 0.4) || !(pointSplit >= 0.15 && pointSplit <= 0.45)) {
            throw new IllegalArgumentException("column shares must be 0.1 to 0.4 (card) and 0.15 to 0.45 (point)");
        }
    }

    /** Energy and pitch groups over 30 s in a 1500x940 window. */
    public static ConsoleSettings defaults() {
        return new ConsoleSettings(List.of(
                new TraceGroup("energy", List.of("Hp", "KCAS", "Mach")),
                new TraceGroup("pitch", List.of("AoA", "Pitch", "Nz", "Elevator"))), 30, 1500, 940, 0.2, 0.27);
    }

    public ConsoleSettings withSpanS(double s) {
        return new ConsoleSettings(groups, Math.max(MIN_SPAN_S, Math.min(MAX_SPAN_S, s)), widthPx, heightPx,
                cardSplit, pointSplit);
    }

    public ConsoleSettings withGroups(List<TraceGroup> g) {
        return new ConsoleSettings(g, spanS, widthPx, heightPx, cardSplit, pointSplit);
    }

    public ConsoleSettings withWindow(double w, double h) {
        return new ConsoleSettings(groups, spanS, Math.max(800, Math.min(8000, w)), Math.max(500, Math.min(8000, h)),
                cardSplit, pointSplit);
    }

    public ConsoleSettings withSplits(double card, double point) {
        return new ConsoleSettings(groups, spanS, widthPx, heightPx, Math.max(0.1, Math.min(0.4, card)),
                Math.max(0.15, Math.min(0.45, point)));
    }

    /** Every charted parameter once, in group order. */
    public List<String> chartedParameters() {
        Set<String> s = new LinkedHashSet<>();
        for (TraceGroup g : groups) {
            s.addAll(g.parameters());
        }
        return new ArrayList<>(s);
    }
}
