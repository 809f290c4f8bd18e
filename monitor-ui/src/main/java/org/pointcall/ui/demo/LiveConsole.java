package org.pointcall.ui.demo;

import java.util.ArrayList;
import java.util.List;
import java.util.function.Consumer;
import java.util.function.Function;

import org.pointcall.ingest.frame.FrameSink;
import org.pointcall.ingest.udp.DatagramHandler;
import org.pointcall.models.card.CardSession;
import org.pointcall.models.card.SessionListener;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.ui.desk.DeskLink;
import org.pointcall.ui.settings.ConsoleSettings;
import org.pointcall.ui.trace.TraceFeed;
import org.pointcall.ui.trace.TraceTap;

/**
 * The live side of a console, wired: UDP receive (and recorder tee) into the pipeline; per stream the card
 * session, then the data clock and the chart tap, all on the pipeline thread; the snapshot publisher on its own
 * thread. The window, if any, attaches to {@link #link()} and {@link #traces()}.
 */
public final class LiveConsole implements AutoCloseable {
    /** About 16 s of 1,000 samples/s: the screen may stall that long before it skips samples. */
    static final int RING_SAMPLES = 1 << 14;

    /** Makes the card session of a stream, reporting to the given listener. */
    @FunctionalInterface
    public interface SessionFactory {
        CardSession create(ParameterDictionary dictionary, SessionListener listener);
    }

    private final DeskLink link;
    private final TraceTap tap;
    private final DataClock clock = new DataClock();
    private final LiveRig rig;
    private final DeskPublisher publisher;
    private final SessionDesk desk;
    private volatile CardSession session;
    private volatile StreamShare share;
    private volatile String shareSource = "";
    private StreamShare.Shared shared;

    /**
     * @param dictionary the expected stream dictionary (the charted parameters are checked against it)
     * @param sessions   makes the card session of a stream
     * @param tee        recorder tee, or {@code null}
     */
    public LiveConsole(int port, ParameterDictionary dictionary, ConsoleSettings settings, SessionDesk desk,
                       SessionFactory sessions, Function<DatagramHandler, DatagramHandler> tee,
                       Consumer<String> faults) {
        this(port, dictionary, settings, desk, sessions, tee, faults, true);
    }

    /** @param live false for a replay fed into the pipeline (no arrival latency) */
    public LiveConsole(int port, ParameterDictionary dictionary, ConsoleSettings settings, SessionDesk desk,
                       SessionFactory sessions, Function<DatagramHandler, DatagramHandler> tee,
                       Consumer<String> faults, boolean live) {
        this(port, new DeskLink(), tapFor(dictionary, settings, faults), desk, sessions, tee, faults, live);
    }

    /**
     * On a link and chart tap of the caller's (a replay keeps them over a jump back, so the window stays as it
     * is): the tap must not be written by another live side at the same time.
     */
    public LiveConsole(int port, DeskLink link, TraceTap tap, SessionDesk desk, SessionFactory sessions,
                       Function<DatagramHandler, DatagramHandler> tee, Consumer<String> faults, boolean live) {
        this.desk = desk;
        this.link = link;
        this.tap = tap;
        rig = new LiveRig(port, (id, d) -> {
            CardSession old = session;
            if (old != null) {
                old.finish();
            }
            StreamShare sh = share;
            if (shared != null) {
                shared.end();
                shared = null;
            }
            StreamShare.Shared ss = sh == null ? null : sh.begin(id, d, shareSource + " stream " + id);
            CardSession s = sessions.create(d, ss == null ? desk : e -> {
                desk.onEvent(e);
                ss.onEvent(e);
            });
            if (ss != null) {
                ss.follow(s::snapshot);
                shared = ss;
            }
            desk.bind(s);
            session = s;
            FrameSink[] after = {s::onFrame, clock, tap};
            return f -> {
                for (FrameSink x : after) {
                    x.onFrame(f);
                }
            };
        }, tee, faults, live);
        publisher = new DeskPublisher(link, desk, new HealthReader(rig.meters()), clock::timeCs);
    }

    /** The chart tap for the settings' charted parameters; one named in no dictionary is reported and left out. */
    public static TraceTap tapFor(ParameterDictionary dictionary, ConsoleSettings settings, Consumer<String> faults) {
        List<String> charted = new ArrayList<>();
        for (String p : settings.chartedParameters()) {
            if (dictionary.indexOf(p) >= 0) {
                charted.add(p);
            } else {
                faults.accept("chart parameter '" + p + "' is not in the dictionary; its lane stays empty");
            }
        }
        return new TraceTap(dictionary, charted.isEmpty() ? List.of(dictionary.parameters().get(0).name()) : charted,
                RING_SAMPLES);
    }

    /**
     * Shares every session of this console on Kafka (its events, card and live view); give the same share's
     * {@code SessionShare.tee} as the tee so the datagrams go too. Call before {@link #start}.
     *
     * @param source where the telemetry comes from, in words
     */
    public void share(StreamShare s, String source) {
        this.shareSource = source;
        this.share = s;
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

    public SessionDesk desk() {
        return desk;
    }

    /** The current stream's session, or null before the first dictionary. */
    public CardSession session() {
        return session;
    }

    public DataClock clock() {
        return clock;
    }

    private boolean closed;

    /**
     * Stops receiving, drains the pipeline and ends the session (a point in flight becomes incomplete, unless it has
     * already lasted its hold). Once; later calls do nothing.
     */
    @Override
    public void close() {
        if (closed) {
            return;
        }
        closed = true;
        endStream();
        publisher.publishOnce(System.nanoTime());
        publisher.close();
    }

    private boolean ended;

    /**
     * The stream is over (a simulated sortie has an end): stops receiving, drains the pipeline and ends the session,
     * while the screen goes on being published (it shows the last point judged and the data gone). Once.
     */
    public synchronized void endStream() {
        if (ended) {
            return;
        }
        ended = true;
        rig.close();
        CardSession s = session;
        if (s != null) {
            s.finish();
        }
    }
}
