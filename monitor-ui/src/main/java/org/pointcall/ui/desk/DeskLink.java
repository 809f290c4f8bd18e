package org.pointcall.ui.desk;

import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.ConcurrentLinkedQueue;
import java.util.concurrent.atomic.AtomicLong;
import java.util.concurrent.atomic.AtomicReference;

/**
 * The only connection between the console and the session: the latest snapshot one way, a command queue the
 * other. Both sides are wait-free: publishing replaces the previous snapshot (the screen drops what it did not draw)
 * and sending a command only enqueues it. The session drains commands on its own thread.
 */
public final class DeskLink {
    private final AtomicReference<DeskSnapshot> latest = new AtomicReference<>(DeskSnapshot.empty());
    private final ConcurrentLinkedQueue<DeskCommand> commands = new ConcurrentLinkedQueue<>();
    private final AtomicLong published = new AtomicLong();
    private final AtomicLong sent = new AtomicLong();

    /** Session side: the newest state. Never blocks. */
    public void publish(DeskSnapshot s) {
        latest.set(s);
        published.incrementAndGet();
    }

    /** Console side: the newest state, whatever came before it. */
    public DeskSnapshot latest() {
        return latest.get();
    }

    /** Console side: forwards an engineer's request. Never blocks. */
    public void send(DeskCommand c) {
        commands.add(c);
        sent.incrementAndGet();
    }

    /** Session side: the next command, or {@code null} when none waits. */
    public DeskCommand poll() {
        return commands.poll();
    }

    /** Session side: every waiting command, oldest first. */
    public List<DeskCommand> drain() {
        List<DeskCommand> out = new ArrayList<>();
        for (DeskCommand c; (c = commands.poll()) != null; ) {
            out.add(c);
        }
        return out;
    }

    public long publishedCount() {
        return published.get();
    }

    public long sentCount() {
        return sent.get();
    }
}
