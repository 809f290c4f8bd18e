package org.pointcall.ui.demo;

import java.util.ArrayList;
import java.util.List;
import java.util.function.Consumer;

import org.pointcall.ingest.frame.FrameSink;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.ui.desk.DeskLink;
import org.pointcall.ui.settings.ConsoleSettings;
import org.pointcall.ui.trace.TraceFeed;
import org.pointcall.ui.trace.TraceTap;

/**
 * The live side of a console, wired: UDP receive and pipeline ({@link LiveRig}) with the chart tap and the data
 * clock on the pipeline thread, and the snapshot publisher on its own thread. The window, if any, attaches to
 * {@link #link()} and {@link #traces()}.
 */
public final class LiveConsole implements AutoCloseable {
    /** About 16 s of 1,000 samples/s: the screen may stall that long before it skips samples. */
    static final int RING_SAMPLES = 1 << 14;

    private final DeskLink link = new DeskLink();
    private final TraceTap tap;
    private final DataClock clock = new DataClock();
    private final LiveRig rig;
    private final DeskPublisher publisher;

    /**
     * @param dictionary the stream's dictionary (the charted parameters are checked against it)
     * @param extraTaps  more frame consumers on the pipeline thread (session, recorder)
     */
    public LiveConsole(int port, ParameterDictionary dictionary, ConsoleSettings settings, DeskModel model,
                       List<FrameSink> extraTaps, Consumer<String> faults) {
        List<String> charted = new ArrayList<>();
        for (String p : settings.chartedParameters()) {
            if (dictionary.indexOf(p) >= 0) {
                charted.add(p);
            } else {
                faults.accept("chart parameter '" + p + "' is not in the dictionary; its lane stays empty");
            }
        }
        tap = new TraceTap(dictionary, charted.isEmpty() ? List.of(dictionary.parameters().get(0).name()) : charted,
                RING_SAMPLES);
        List<FrameSink> taps = new ArrayList<>();
        taps.add(clock);
        taps.add(tap);
        taps.addAll(extraTaps);
        // One short window so that arrival-to-features latency is measured even before a session consumes them.
        rig = new LiveRig(port, taps, List.of(org.pointcall.ingest.window.WindowSpec.of(charted.isEmpty()
                ? dictionary.parameters().get(0).name() : charted.get(0), 1.0)), (t, f, v, c) -> { }, faults);
        publisher = new DeskPublisher(link, model, new HealthReader(rig.meters()), clock::timeCs);
    }

    public void start() {
        rig.start();
        publisher.start();
    }

    public DeskLink link() {
        return link;
    }

    public TraceFeed traces() {
        return tap.feed();
    }

    public LiveRig rig() {
        return rig;
    }

    public DataClock clock() {
        return clock;
    }

    @Override
    public void close() {
        publisher.close();
        rig.close();
    }
}
