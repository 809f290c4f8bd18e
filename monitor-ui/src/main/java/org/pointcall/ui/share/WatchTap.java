package org.pointcall.ui.share;

import java.util.ArrayList;
import java.util.List;

import org.pointcall.ingest.frame.Frame;
import org.pointcall.ingest.frame.FrameSink;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.ui.trace.TraceFeed;
import org.pointcall.ui.trace.TraceTap;

/**
 * The chart tap of a watching console: a {@link TraceTap} bound by parameter name to whichever dictionary the
 * watched stream has now (a new session may bring another layout). A charted parameter the dictionary lacks reads
 * NaN (an empty lane). One thread (the feed's).
 */
final class WatchTap implements FrameSink {
    private final TraceTap tap;

    /** @param parameters the charted parameters; those {@code first} lacks are left out */
    WatchTap(ParameterDictionary first, List<String> parameters, int capacity) {
        List<String> kept = new ArrayList<>();
        for (String p : parameters) {
            if (first.indexOf(p) >= 0) {
                kept.add(p);
            }
        }
        if (kept.isEmpty()) {
            kept.add(first.parameters().get(0).name());
        }
        this.tap = new TraceTap(first, kept, capacity);
    }

    TraceFeed feed() {
        return tap.feed();
    }

    List<String> parameters() {
        return tap.parameters();
    }

    void bind(ParameterDictionary d) {
        tap.feed().rebind(d);
    }

    @Override
    public void onFrame(Frame frame) {
        tap.onFrame(frame);
    }

    @Override
    public String toString() {
        return "WatchTap" + tap.parameters();
    }
}
