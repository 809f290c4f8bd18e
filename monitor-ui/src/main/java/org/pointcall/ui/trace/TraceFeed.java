package org.pointcall.ui.trace;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;

import org.pointcall.shared.dictionary.ParameterDictionary;

/**
 * What the charts read: a {@link SampleRing} whose channel 0 carries the layout number each sample was written
 * under and whose other channels carry the parameters of that layout. The screen picks the parameters
 * ({@link #select}, JavaFX thread); the pipeline thread's {@link TraceTap} takes the new layout at its next frame,
 * and a sample written under an older layout is recognised by its number and left out, so a lane never shows
 * another parameter's values.
 */
public final class TraceFeed {
    /** Parameters one layout can carry (lanes on the screen at once). */
    public static final int MAX_LANES = 24;

    /** One layout: the parameter of each channel after channel 0, and its dictionary slot. */
    record Layout(int number, List<String> parameters, List<String> units, int[] slots) {
    }

    private volatile ParameterDictionary dictionary;
    private final SampleRing ring;
    private volatile Layout layout;

    TraceFeed(ParameterDictionary dictionary, List<String> parameters, SampleRing ring) {
        this.dictionary = Objects.requireNonNull(dictionary, "dictionary");
        this.ring = Objects.requireNonNull(ring, "ring");
        if (ring.channels() != MAX_LANES + 1) {
            throw new IllegalArgumentException("a trace feed's ring has one channel per lane and one for the layout");
        }
        this.layout = layout(0, parameters);
    }

    private Layout layout(int number, List<String> parameters) {
        return layout(number, parameters, true);
    }

    /** @param strict refuse a parameter the dictionary lacks; else chart it as an empty lane (NaN) */
    private Layout layout(int number, List<String> parameters, boolean strict) {
        List<String> problems = new ArrayList<>();
        if (parameters.size() > MAX_LANES) {
            problems.add(parameters.size() + " parameters: at most " + MAX_LANES + " can be charted at once");
        }
        int[] slots = new int[MAX_LANES];
        java.util.Arrays.fill(slots, -1);
        List<String> units = new ArrayList<>();
        for (int i = 0; i < parameters.size() && i < MAX_LANES; i++) {
            String p = parameters.get(i);
            int slot = dictionary.indexOf(p);
            if (slot < 0 && !strict) {
                units.add("");
            } else if (slot < 0) {
                problems.add("'" + p + "' is not a parameter of the dictionary '" + dictionary.name() + "'"
                        + sameIgnoringCase(p));
                units.add("");
            } else {
                slots[i] = slot;
                units.add(dictionary.parameters().get(slot).unit().symbol());
            }
        }
        if (!problems.isEmpty()) {
            throw new IllegalArgumentException(String.join("; ", problems));
        }
        return new Layout(number, List.copyOf(parameters), List.copyOf(units), slots);
    }

    private String sameIgnoringCase(String p) {
        for (String n : names()) {
            if (n.equalsIgnoreCase(p)) {
                return " (names are exact: did you mean '" + n + "'?)";
            }
        }
        return "";
    }

    /**
     * Charts {@code parameters} from now on (JavaFX thread); returns the new layout's number. Refuses, naming
     * each, parameters the dictionary lacks, and more than {@link #MAX_LANES}; the layout then stays as it was.
     */
    public synchronized int select(List<String> parameters) {
        Layout l = layout(layout.number() + 1, parameters);
        layout = l;
        return l.number();
    }

    /**
     * The stream now follows {@code d} (a watched session's new dictionary): the charted names are looked up in it
     * again, a name it lacks becomes an empty lane. Call on the writer's thread before its first frame of {@code d}.
     */
    public synchronized void rebind(ParameterDictionary d) {
        dictionary = Objects.requireNonNull(d, "dictionary");
        Layout now = layout;
        layout = layout(now.number(), now.parameters(), false);
    }

    Layout layout() {
        return layout;
    }

    /** Number of the layout now selected. */
    public int layoutNumber() {
        return layout.number();
    }

    /** Channel of a parameter in the current layout, or -1. */
    public int channel(String parameter) {
        int i = layout.parameters().indexOf(parameter);
        return i < 0 ? -1 : i + 1;
    }

    /** Unit symbol of a parameter, from the dictionary; empty when it has none. */
    public String unit(String parameter) {
        int slot = dictionary.indexOf(parameter);
        return slot < 0 ? "" : dictionary.parameters().get(slot).unit().symbol();
    }

    /** The parameters charted now, in channel order. */
    public List<String> parameters() {
        return layout.parameters();
    }

    /** Every parameter the stream carries, in dictionary order (what can be charted). */
    public List<String> names() {
        List<String> out = new ArrayList<>();
        dictionary.parameters().forEach(p -> out.add(p.name()));
        return out;
    }

    public SampleRing ring() {
        return ring;
    }
}
