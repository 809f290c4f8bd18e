package org.pointcall.ui.demo;

import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.locks.LockSupport;
import java.util.function.LongSupplier;

import org.pointcall.ui.desk.DeskCommand;
import org.pointcall.ui.desk.DeskLink;
import org.pointcall.ui.desk.DeskSnapshot;
import org.pointcall.ui.desk.LogEntry;
import org.pointcall.ui.desk.StreamHealth;

/**
 * Its own thread: every 40 ms it hands the engineer's commands to the {@link DeskModel}, reads stream health and
 * publishes one {@link DeskSnapshot} on the {@link DeskLink}. Neither the pipeline nor the screen waits for it; it
 * only reads what the session already published. Stream faults (gaps, drops, silence) become log lines here.
 */
public final class DeskPublisher implements AutoCloseable {
    /** Publication period: the console never needs more than 25 snapshots a second. */
    public static final long PERIOD_NS = 40_000_000L;
    private static final int LOG_KEPT = 400;

    private final DeskLink link;
    private final DeskModel model;
    private final HealthReader health;
    private final LongSupplier dataTimeS100;
    private final Thread thread;
    private final ArrayDeque<LogEntry> streamLog = new ArrayDeque<>();
    private volatile boolean stopping;
    private long version;
    private StreamHealth last = StreamHealth.NONE;

    /**
     * @param dataTimeCs data time of the newest frame in hundredths of a second (a plain long the pipeline
     *                   thread writes), for the log's times
     */
    public DeskPublisher(DeskLink link, DeskModel model, HealthReader health, LongSupplier dataTimeCs) {
        this.link = link;
        this.model = model;
        this.health = health;
        this.dataTimeS100 = dataTimeCs;
        this.thread = new Thread(this::loop, "console-publisher");
        this.thread.setDaemon(true);
    }

    public void start() {
        thread.start();
    }

    private void loop() {
        long next = System.nanoTime();
        while (!stopping) {
            publishOnce(System.nanoTime());
            next += PERIOD_NS;
            long wait = next - System.nanoTime();
            if (wait > 0) {
                LockSupport.parkNanos(wait);
            } else {
                next = System.nanoTime();
            }
        }
    }

    /** One round: commands, health, snapshot. Public for a deterministic drive in tests. */
    public void publishOnce(long nowNs) {
        for (DeskCommand c; (c = link.poll()) != null; ) {
            model.accept(c);
        }
        double t = dataTimeS100.getAsLong() / 100.0;
        StreamHealth h = health.read(nowNs);
        noteStream(t, h);
        last = h;
        List<LogEntry> log = merge(model.events(), streamLog);
        link.publish(new DeskSnapshot(++version, model.sortie(), t, model.card(), model.active(), model.verdict(),
                model.alarms(), log, model.spans(), h, model.transport()));
    }

    private void noteStream(double t, StreamHealth h) {
        if (last.framesSeen() == 0 && h.framesSeen() > 0) {
            add(new LogEntry(t, LogEntry.Kind.STREAM, "stream: first frames received"));
        }
        if (h.sequenceGaps() > last.sequenceGaps()) {
            add(new LogEntry(t, LogEntry.Kind.STREAM, String.format(Locale.ROOT,
                    "stream: sequence gap (%d lost so far)", h.lostPackets())));
        }
        if (h.droppedPackets() > last.droppedPackets()) {
            add(new LogEntry(t, LogEntry.Kind.STREAM, String.format(Locale.ROOT,
                    "stream: %d datagrams dropped, pipeline behind", h.droppedPackets() - last.droppedPackets())));
        }
        if (!last.silent() && h.silent() && h.framesSeen() > 0) {
            add(new LogEntry(t, LogEntry.Kind.STREAM, "stream: no frames in the last half second"));
        }
    }

    private void add(LogEntry e) {
        streamLog.addLast(e);
        while (streamLog.size() > LOG_KEPT) {
            streamLog.removeFirst();
        }
    }

    /** Both logs by time, the last {@value #LOG_KEPT}. */
    private static List<LogEntry> merge(List<LogEntry> a, ArrayDeque<LogEntry> b) {
        List<LogEntry> out = new ArrayList<>(a.size() + b.size());
        int i = 0;
        java.util.Iterator<LogEntry> it = b.iterator();
        LogEntry nb = it.hasNext() ? it.next() : null;
        while (i < a.size() || nb != null) {
            if (nb == null || (i < a.size() && a.get(i).timeS() <= nb.timeS())) {
                out.add(a.get(i++));
            } else {
                out.add(nb);
                nb = it.hasNext() ? it.next() : null;
            }
        }
        return out.size() > LOG_KEPT ? out.subList(out.size() - LOG_KEPT, out.size()) : out;
    }

    @Override
    public void close() {
        stopping = true;
        try {
            thread.join(2000);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
        }
    }
}
