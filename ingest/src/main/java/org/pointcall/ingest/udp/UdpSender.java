package org.pointcall.ingest.udp;

import java.io.IOException;
import java.net.InetSocketAddress;
import java.net.StandardSocketOptions;
import java.nio.ByteBuffer;
import java.nio.channels.DatagramChannel;
import java.util.concurrent.atomic.AtomicLongArray;

import org.pointcall.ingest.wire.FaultLog;
import org.pointcall.ingest.wire.PacketSink;
import org.pointcall.ingest.wire.StreamEncoder;
import org.pointcall.ingest.wire.WireOptions;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.error.PointcallException;
import org.slf4j.LoggerFactory;

/**
 * Sends wire-format packets to one receiver over a connected {@link DatagramChannel}, paced by
 * {@link UdpSenderConfig#packetsPerSecond()}. Streams opened with {@link #openStream} encode into reused buffers
 * and send through it, so sending allocates nothing per packet. A failed send (for example the receiver's port
 * closed) is counted and logged, rate-limited, and sending goes on. One sending thread.
 */
public final class UdpSender implements PacketSink, AutoCloseable {
    private static final int SENT = 0;
    private static final int BYTES = 1;
    private static final int ERRORS = 2;

    private final DatagramChannel channel;
    private final Pacer pacer;
    private final FaultLog log = FaultLog.toLogger(LoggerFactory.getLogger(UdpSender.class));
    private final InetSocketAddress target;
    private final InetSocketAddress localAddress;
    private final AtomicLongArray c = new AtomicLongArray(3);

    public UdpSender(UdpSenderConfig config) {
        this.target = config.target();
        this.pacer = new Pacer(config.packetsPerSecond(), System::nanoTime);
        DatagramChannel ch = null;
        try {
            ch = DatagramChannel.open();
            if (config.sendBufferBytes() > 0) {
                ch.setOption(StandardSocketOptions.SO_SNDBUF, config.sendBufferBytes());
            }
            ch.bind(config.bind());
            ch.connect(config.target());
            this.localAddress = (InetSocketAddress) ch.getLocalAddress();
        } catch (IOException | RuntimeException e) {
            if (ch != null) {
                try {
                    ch.close();
                } catch (IOException ignored) {
                    // already failing: the first error is the one to report
                }
            }
            throw new PointcallException("cannot send UDP to " + UdpSource.hostPort(config.target()) + ": "
                    + e.getMessage(), e);
        }
        this.channel = ch;
    }

    /** A stream encoder sending through this sender, with a fresh epoch. */
    public StreamEncoder openStream(int streamId, ParameterDictionary dictionary, String dictionaryText,
                                    WireOptions options) {
        return new StreamEncoder(streamId, StreamEncoder.newEpoch(), dictionary, dictionaryText, options, this);
    }

    /** Sends one datagram, after waiting for its pacing slot. */
    @Override
    public void onPacket(ByteBuffer packet) {
        pacer.awaitNext();
        int n = packet.remaining();
        try {
            int w = channel.write(packet);
            if (w == n) {
                c.lazySet(SENT, c.get(SENT) + 1);
                c.lazySet(BYTES, c.get(BYTES) + n);
                return;
            }
            fail(n + "-byte datagram not sent (socket buffer full)");
        } catch (IOException e) {
            fail(e.getClass().getSimpleName() + (e.getMessage() != null ? ": " + e.getMessage() : ""));
        }
    }

    private void fail(String why) {
        c.lazySet(ERRORS, c.get(ERRORS) + 1);
        long now = System.nanoTime();
        if (log.admit(now)) {
            log.emit("send to " + UdpSource.hostPort(target) + " failed: " + why);
        }
    }

    public InetSocketAddress localAddress() {
        return localAddress;
    }

    public long sentPackets() {
        return c.get(SENT);
    }

    public long sentBytes() {
        return c.get(BYTES);
    }

    public long sendErrors() {
        return c.get(ERRORS);
    }

    @Override
    public void close() {
        try {
            channel.close();
        } catch (IOException ignored) {
            // nothing to flush on a datagram socket
        }
    }
}
