package org.pointcall.ui.share;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

import org.pointcall.ingest.frame.Frame;
import org.pointcall.ingest.frame.FrameSink;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.ui.trace.SampleRing;
import org.pointcall.ui.trace.TraceFeed;

/**
 * The chart tap of a watching console: as {@link org.pointcall.ui.trace.TraceTap}, but bound by parameter name
 * to whichever dictionary the watched stream has now (a new session may bring another layout). A charted
 * parameter the dictionary lacks reads NaN (an empty lane). Channels and units are fixed at the first dictionary.
 * One thread (the feed's).
 */
final class WatchTap implements FrameSink {
    private final List<String> parameters;
    private final SampleRing ring;
    private final TraceFeed feed;
    private final double[] row;
    private int[] slots;

    /** @param parameters the charted parameters; those {@code first} lacks are left out */
    WatchTap(ParameterDictionary first, List<String> parameters, int capacity) {
        List<String> kept = new ArrayList<>();
        List<String> units = new ArrayList<>();
        for (String p : parameters) {
            int i = first.indexOf(p);
            if (i >= 0) {
                kept.add(p);
                units.add(first.parameters().get(i).unit().symbol());
            }
        }
        if (kept.isEmpty()) {
            kept.add(first.parameters().get(0).name());
            units.add(first.parameters().get(0).unit().symbol());
        }
        this.parameters = List.copyOf(kept);
        this.ring = new SampleRing(kept.size(), capacity);
        this.feed = new TraceFeed(this.parameters, units, ring);
        this.row = new double[kept.size()];
        bind(first);
    }

    TraceFeed feed() {
        return feed;
    }

    List<String> parameters() {
        return parameters;
    }

    void bind(ParameterDictionary d) {
        int[] s = new int[parameters.size()];
        for (int c = 0; c < s.length; c++) {
            s[c] = d.indexOf(parameters.get(c));
        }
        slots = s;
    }

    @Override
    public void onFrame(Frame frame) {
        double[] v = frame.values();
        int[] s = slots;
        for (int c = 0; c < s.length; c++) {
            row[c] = s[c] < 0 || s[c] >= v.length ? Double.NaN : v[s[c]];
        }
        ring.write(frame.timeNs(), row, 0);
    }

    @Override
    public String toString() {
        return "WatchTap" + parameters + Arrays.toString(slots);
    }
}
