package org.pointcall.replay.report;

import java.util.ArrayList;
import java.util.EnumMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;

import org.pointcall.shared.card.Band;
import org.pointcall.shared.card.TestCard;
import org.pointcall.shared.card.TestPoint;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.kind.ManoeuvreKind;

/**
 * Which parameters a point's figure plots, by kind: the ones an engineer reads the technique from, top panel first,
 * then any other parameter the card point has a band on (so every parameter band is drawn). Parameters the
 * dictionary lacks are left out.
 */
public final class FigurePlan {
    /** At most this many panels in one figure: past it a figure is too tall to read on one page. */
    public static final int MAX_PANELS = 6;

    private static final Map<ManoeuvreKind, List<String>> BY_KIND = new EnumMap<>(ManoeuvreKind.class);

    static {
        // common practice: the speed and the angle the manoeuvre is flown to first, then load and attitude
        BY_KIND.put(ManoeuvreKind.STALL_LEVEL, List.of("KCAS", "AoA", "Nz", "Hp", "Roll"));
        BY_KIND.put(ManoeuvreKind.STALL_TURN, List.of("KCAS", "AoA", "Nz", "Hp", "Roll"));
        BY_KIND.put(ManoeuvreKind.LOOP, List.of("Hp", "KCAS", "Nz", "Pitch", "Heading"));
        BY_KIND.put(ManoeuvreKind.WIND_UP_TURN, List.of("Mach", "Nz", "AoA", "Hp", "Roll"));
        BY_KIND.put(ManoeuvreKind.LEVEL_ACCEL, List.of("Mach", "Hp", "Nz", "Throttle"));
        BY_KIND.put(ManoeuvreKind.PITCH_DOUBLET, List.of("Elevator", "Q", "AoA", "Nz"));
        BY_KIND.put(ManoeuvreKind.PHUGOID, List.of("KCAS", "Hp", "Pitch", "Elevator"));
        BY_KIND.put(ManoeuvreKind.SIDESLIP, List.of("AoS", "Rudder", "Aileron", "Roll", "Heading"));
        BY_KIND.put(ManoeuvreKind.AILERON_ROLL, List.of("Aileron", "P", "Roll", "AoS", "Hp"));
        BY_KIND.put(ManoeuvreKind.STABILISED, List.of("Hp", "KCAS", "Heading", "Nz"));
        for (ManoeuvreKind k : ManoeuvreKind.values()) {
            if (!BY_KIND.containsKey(k)) {
                throw new IllegalStateException("no figure plan for kind " + k.key());
            }
        }
    }

    private FigurePlan() {
    }

    /** The kind's own parameters, top panel first (before the card's bands are added). */
    public static List<String> forKind(ManoeuvreKind kind) {
        return BY_KIND.get(kind);
    }

    /**
     * The panels of a point's figure.
     *
     * @param point the card point, or null for an unplanned one
     */
    public static List<String> panels(ManoeuvreKind kind, TestPoint point, ParameterDictionary dictionary) {
        Set<String> out = new LinkedHashSet<>();
        for (String p : BY_KIND.get(kind)) {
            if (dictionary.find(p).isPresent()) {
                out.add(p);
            }
        }
        if (point != null) {
            for (Band b : point.bands()) {
                if (b.parameter() != null && dictionary.find(b.parameter()).isPresent()) {
                    out.add(b.parameter());
                }
            }
        }
        List<String> list = new ArrayList<>(out);
        if (list.size() <= MAX_PANELS) {
            return List.copyOf(list);
        }
        // too many: a band's parameter beats the kind's last ones, a band must be seen
        Set<String> keep = new LinkedHashSet<>();
        for (Band b : point == null ? List.<Band>of() : point.bands()) {
            if (b.parameter() != null && list.contains(b.parameter()) && keep.size() < MAX_PANELS) {
                keep.add(b.parameter());
            }
        }
        for (String p : list) {
            if (keep.size() < MAX_PANELS) {
                keep.add(p);
            }
        }
        return list.stream().filter(keep::contains).toList();
    }

    /** Every parameter any figure of this card (or of any kind, without a card) may plot, for the trace. */
    public static List<String> traced(TestCard card, ParameterDictionary dictionary) {
        Set<String> out = new LinkedHashSet<>();
        for (ManoeuvreKind k : ManoeuvreKind.values()) {
            out.addAll(panels(k, null, dictionary));
        }
        if (card != null) {
            for (TestPoint p : card.points()) {
                out.addAll(panels(p.kind(), p, dictionary));
            }
        }
        return List.copyOf(out);
    }
}
