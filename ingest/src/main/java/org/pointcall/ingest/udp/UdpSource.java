package org.pointcall.ingest.udp;

import java.io.IOException;
import java.net.InetAddress;
import java.net.InetSocketAddress;
import java.net.SocketAddress;
import java.net.StandardSocketOptions;
import java.nio.ByteBuffer;
import java.nio.channels.ClosedChannelException;
import java.nio.channels.DatagramChannel;
import java.util.Set;
import java.util.concurrent.atomic.AtomicLongArray;
import java.util.function.LongSupplier;

import org.pointcall.ingest.wire.FaultLog;
import org.pointcall.ingest.wire.PacketDecoder;
import org.pointcall.shared.error.PointcallException;

/**
 * Receives wire-format datagrams on a {@link DatagramChannel} and feeds them to a {@link PacketDecoder}, on one
 * receive thread (its own after {@link #start()}, or the caller's in {@link #run()}). Datagrams from senders not on
 * the allow-list are counted and dropped before decoding. Each datagram is stamped with {@code nowNs} as it is taken
 * from the socket, and the stamp reaches the decoder's sink as the receive time.
 *
 * <p>The socket is open and bound from construction, so {@link #localPort()} is known before the first packet.
 * The receive buffer holds 65,536 bytes, more than any UDP payload, so the OS never cuts a datagram short unseen:
 * oversize ones reach the decoder and are counted there.
 */
public final class UdpSource implements AutoCloseable {
    private static final int DATAGRAMS = 0;
    private static final int BYTES = 1;
    private static final int REJECTED = 2;
    private static final int RECEIVE_ERRORS = 3;
    private static final int SINK_ERRORS = 4;

    private final PacketDecoder decoder;
    private final DatagramHandler handler;
    private final LongSupplier nowNs;
    private final DatagramChannel channel;
    private final FaultLog log;
    private final Set<InetAddress> allowed;
    private final boolean anySender;
    private final int receiveBufferBytes;
    private final InetSocketAddress localAddress;
    private final AtomicLongArray c = new AtomicLongArray(5);
    private volatile boolean stopping;
    private Thread thread;

    /** @param nowNs receive-time clock, for example {@code System::nanoTime} */
    public UdpSource(UdpSourceConfig config, PacketDecoder decoder, LongSupplier nowNs) {
        this(config, DatagramHandler.decoding(decoder), decoder, decoder.log(), nowNs);
    }

    /**
     * A source that hands each accepted datagram to {@code handler} (for example the enqueueing side of a
     * pipeline) instead of decoding it on the receive thread.
     */
    public UdpSource(UdpSourceConfig config, DatagramHandler handler, FaultLog log, LongSupplier nowNs) {
        this(config, handler, null, log, nowNs);
    }

    private UdpSource(UdpSourceConfig config, DatagramHandler handler, PacketDecoder decoder, FaultLog log,
                      LongSupplier nowNs) {
        this.decoder = decoder;
        this.handler = handler;
        this.nowNs = nowNs;
        this.log = log;
        this.allowed = config.allowedSenders();
        this.anySender = config.anySender();
        DatagramChannel ch = null;
        try {
            ch = DatagramChannel.open();
            if (config.receiveBufferBytes() > 0) {
                ch.setOption(StandardSocketOptions.SO_RCVBUF, config.receiveBufferBytes());
            }
            ch.bind(config.bind());
            this.receiveBufferBytes = ch.getOption(StandardSocketOptions.SO_RCVBUF);
            this.localAddress = (InetSocketAddress) ch.getLocalAddress();
        } catch (IOException | RuntimeException e) {
            closeQuietly(ch);
            throw new PointcallException("cannot receive UDP on " + hostPort(config.bind()) + ": "
                    + e.getMessage(), e);
        }
        this.channel = ch;
    }

    public int localPort() {
        return localAddress.getPort();
    }

    public InetSocketAddress localAddress() {
        return localAddress;
    }

    /** SO_RCVBUF as the OS reports it after the request (it may cap it, Linux at net.core.rmem_max). */
    public int receiveBufferBytes() {
        return receiveBufferBytes;
    }

    /** The decoder of a source that decodes on its receive thread, else {@code null}. */
    public PacketDecoder decoder() {
        return decoder;
    }

    /** Starts the receive thread. */
    public synchronized void start() {
        if (thread != null) {
            throw new IllegalStateException("already started");
        }
        thread = new Thread(this::run, "udp-source-" + localPort());
        thread.setDaemon(true);
        thread.start();
    }

    /** Receives until {@link #stop()}; then tells the handler (a decoder hands its half-assembled frames on). */
    public void run() {
        ByteBuffer buf = ByteBuffer.allocateDirect(1 << 16);
        while (!stopping) {
            buf.clear();
            SocketAddress from;
            try {
                from = channel.receive(buf);
            } catch (ClosedChannelException e) {
                break;
            } catch (IOException e) {
                c.lazySet(RECEIVE_ERRORS, c.get(RECEIVE_ERRORS) + 1);
                long now = nowNs.getAsLong();
                if (log.admit(now)) {
                    log.emit("UDP receive on port " + localPort() + " failed: " + e.getMessage());
                }
                continue;
            }
            long now = nowNs.getAsLong();
            buf.flip();
            c.lazySet(DATAGRAMS, c.get(DATAGRAMS) + 1);
            c.lazySet(BYTES, c.get(BYTES) + buf.remaining());
            InetSocketAddress sender = (InetSocketAddress) from;
            if (!anySender && !allowed.contains(sender.getAddress())) {
                c.lazySet(REJECTED, c.get(REJECTED) + 1);
                if (log.admit(now)) {
                    log.emit("datagram from " + hostPort(sender) + " ("
                            + buf.remaining() + " bytes): sender not on the allow-list, dropped");
                }
                continue;
            }
            try {
                handler.onDatagram(buf, sender, now);
            } catch (RuntimeException e) {
                c.lazySet(SINK_ERRORS, c.get(SINK_ERRORS) + 1);
                if (log.admit(now)) {
                    log.emit("packet from " + hostPort(sender)
                            + ": the frame consumer failed (" + e + "); receiving goes on");
                }
            }
        }
        handler.onStop();
    }

    /** Same as {@link #stop()}. */
    @Override
    public void close() {
        stop();
    }

    /**
     * Stops receiving, closes the socket and waits for the receive thread to end (it hands on half-assembled frames
     * first). Counters and the sink's data are then stable. Idempotent.
     */
    public void stop() {
        stopping = true;
        closeQuietly(channel);
        Thread t;
        synchronized (this) {
            t = thread;
        }
        if (t != null && t != Thread.currentThread()) {
            try {
                t.join();
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
            }
        }
    }

    /** Datagrams taken from the socket, allowed or not. */
    public long datagrams() {
        return c.get(DATAGRAMS);
    }

    public long bytes() {
        return c.get(BYTES);
    }

    /** Datagrams dropped because their sender is not on the allow-list. */
    public long rejectedSenders() {
        return c.get(REJECTED);
    }

    public long receiveErrors() {
        return c.get(RECEIVE_ERRORS);
    }

    /** Datagrams whose frames made the sink throw. */
    public long sinkErrors() {
        return c.get(SINK_ERRORS);
    }

    private static void closeQuietly(DatagramChannel ch) {
        if (ch == null) {
            return;
        }
        try {
            ch.close();
        } catch (IOException ignored) {
            // closing a datagram socket has nothing left to report
        }
    }

    /** host:port with the address as digits (no name lookup). */
    static String hostPort(InetSocketAddress a) {
        return (a.getAddress() != null ? a.getAddress().getHostAddress() : a.getHostString()) + ":" + a.getPort();
    }
}
