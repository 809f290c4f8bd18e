package org.pointcall.ingest.udp;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.net.InetAddress;
import java.net.InetSocketAddress;
import java.nio.ByteBuffer;
import java.nio.channels.DatagramChannel;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import java.util.SplittableRandom;
import java.util.concurrent.atomic.AtomicLong;
import java.util.function.BooleanSupplier;
import java.util.function.LongSupplier;

import org.junit.jupiter.api.Test;
import org.pointcall.ingest.frame.Frame;
import org.pointcall.ingest.wire.DecodeCounters;
import org.pointcall.ingest.wire.DecoderOptions;
import org.pointcall.ingest.wire.DictionaryRegistry;
import org.pointcall.ingest.wire.FaultLog;
import org.pointcall.ingest.wire.PacketDecoder;
import org.pointcall.ingest.wire.StreamEncoder;
import org.pointcall.ingest.wire.StreamFrameSink;
import org.pointcall.ingest.wire.WireFormat;
import org.pointcall.ingest.wire.WireOptions;
import org.pointcall.shared.dictionary.Parameter;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.error.PointcallException;
import org.pointcall.shared.units.Unit;

/** Real sockets on 127.0.0.1. Waits are bounded by a generous deadline; nothing here asserts a time. */
class UdpLoopbackTest {
    private static final InetAddress LO = InetAddress.getLoopbackAddress();
    private static final long DEADLINE_NS = 20_000_000_000L;

    private final ParameterDictionary dict = dictionary(24);
    private final List<String> log = new ArrayList<>();
    private final Received received = new Received();

    private PacketDecoder decoder(StreamFrameSink sink) {
        return new PacketDecoder(new DictionaryRegistry(List.of(dict)), (text, source) -> {
            throw new PointcallException("no reader in this test");
        }, sink, DecoderOptions.DEFAULT, new FaultLog(line -> {
            synchronized (log) {
                log.add(line);
            }
        }, 1000, 1_000_000_000L));
    }

    @Test
    void everyPacketSentArrivesIntactWithTheInjectedReceiveTime() {
        AtomicLong clock = new AtomicLong();
        LongSupplier ticks = clock::incrementAndGet; // a clock that counts receives
        List<Frame> sent = frames(5000, 11);
        try (UdpSource source = new UdpSource(UdpSourceConfig.loopback(0), decoder(received), ticks);
             UdpSender sender = new UdpSender(UdpSenderConfig.loopback(source.localPort())
                     .withPacketsPerSecond(20_000))) {
            assertTrue(source.localPort() > 0);
            source.start();
            StreamEncoder enc = sender.openStream(4, dict, "preloaded", WireOptions.DEFAULT.withMaxFramesPerPacket(1));
            sent.forEach(enc::onFrame);
            awaitTrue(() -> source.datagrams() >= sender.sentPackets());
            source.stop();
            assertEquals(sender.sentPackets(), source.datagrams());
            assertEquals(0, sender.sendErrors());
            assertEquals(0, source.decoder().counters().faults());
            assertEquals(0, source.decoder().tracker(4).lost());
        }
        assertEquals(sent.size(), received.frames.size());
        long lastTick = 0;
        for (int i = 0; i < sent.size(); i++) {
            Frame s = sent.get(i);
            Frame b = received.frames.get(i);
            assertEquals(s.timeNs(), b.timeNs());
            assertArrayEquals(bits(s), bits(b));
            long tick = received.receiveNs.get(i);
            assertTrue(tick > lastTick, "receive times come from the injected clock, one tick per datagram");
            lastTick = tick;
        }
        assertEquals(clock.get(), lastTick);
    }

    @Test
    void aSenderNotOnTheAllowListIsCountedAndDropped() {
        // 192.0.2.1 is in TEST-NET-1, reserved for documentation (RFC 5737): no real sender has it
        InetAddress other = InetAddress.getLoopbackAddress();
        try {
            other = InetAddress.getByName("192.0.2.1");
        } catch (IOException e) {
            throw new AssertionError(e);
        }
        UdpSourceConfig cfg = UdpSourceConfig.loopback(0).withAllowedSenders(Set.of(other));
        try (UdpSource source = new UdpSource(cfg, decoder(received), System::nanoTime);
             UdpSender sender = new UdpSender(UdpSenderConfig.loopback(source.localPort()))) {
            source.start();
            StreamEncoder enc = sender.openStream(4, dict, "preloaded", WireOptions.DEFAULT.withMaxFramesPerPacket(1));
            frames(100, 12).forEach(enc::onFrame);
            awaitTrue(() -> source.datagrams() >= sender.sentPackets());
            source.stop();
            assertEquals(sender.sentPackets(), source.rejectedSenders());
            assertEquals(0, source.decoder().counters().datagrams());
            assertEquals(0, received.frames.size());
            synchronized (log) {
                assertTrue(log.get(0).startsWith("datagram from 127.0.0.1:" + sender.localAddress().getPort()
                        + " (") && log.get(0).endsWith("bytes): sender not on the allow-list, dropped"), log.get(0));
            }
        }
    }

    @Test
    void malformedDatagramsAreCountedAndTheGoodOnesAroundThemKept() throws IOException {
        // good packets captured from an encoder, sent through a raw socket with bad ones in between
        List<byte[]> good = new ArrayList<>();
        StreamEncoder enc = new StreamEncoder(5, 99, dict, "preloaded", WireOptions.DEFAULT, packet -> {
            byte[] b = new byte[packet.remaining()];
            packet.get(b);
            good.add(b);
        });
        List<Frame> sent = frames(600, 13);
        sent.forEach(enc::onFrame);
        enc.flush();
        SplittableRandom r = new SplittableRandom(14);
        int[] bad = new int[4];
        try (UdpSource source = new UdpSource(UdpSourceConfig.loopback(0), decoder(received), System::nanoTime);
             DatagramChannel raw = DatagramChannel.open()) {
            source.start();
            raw.bind(new InetSocketAddress(LO, 0));
            raw.connect(source.localAddress());
            long datagrams = 0;
            for (byte[] g : good) {
                switch (r.nextInt(4)) {
                    case 0 -> { // bit flip
                        byte[] b = g.clone();
                        b[WireFormat.COMMON_HEADER_BYTES + r.nextInt(b.length - WireFormat.COMMON_HEADER_BYTES)]
                                ^= (byte) (1 << r.nextInt(8));
                        raw.write(ByteBuffer.wrap(b));
                        bad[0]++;
                    }
                    case 1 -> { // cut short
                        raw.write(ByteBuffer.wrap(g, 0, g.length / 2));
                        bad[1]++;
                    }
                    case 2 -> { // too big for the receiver's limit
                        raw.write(ByteBuffer.wrap(new byte[2000]));
                        bad[2]++;
                    }
                    default -> { // not ours at all
                        byte[] b = new byte[r.nextInt(WireFormat.MIN_PACKET_BYTES, 200)];
                        r.nextBytes(b);
                        b[0] = 0;
                        raw.write(ByteBuffer.wrap(b));
                        bad[3]++;
                    }
                }
                raw.write(ByteBuffer.wrap(g));
                datagrams += 2;
                if (datagrams % 64 == 0) {
                    long expected = datagrams;
                    awaitTrue(() -> source.datagrams() >= expected); // keep clear of the receive buffer's limit
                }
            }
            long total = datagrams;
            awaitTrue(() -> source.datagrams() >= total);
            source.stop();
            DecodeCounters c = source.decoder().counters();
            assertEquals(bad[0], c.badCrc());
            assertEquals(bad[1], c.truncated());
            assertEquals(bad[2], c.oversize());
            assertEquals(bad[3], c.badMagic());
            assertEquals(bad[0] + bad[1] + bad[2] + bad[3], c.faults());
            assertEquals(good.size(), source.decoder().tracker(5).received());
        }
        assertEquals(sent.size(), received.frames.size());
        for (int i = 0; i < sent.size(); i++) {
            assertArrayEquals(bits(sent.get(i)), bits(received.frames.get(i)));
        }
    }

    @Test
    void aFailingSinkIsCountedAndReceivingGoesOn() {
        int[] calls = new int[1];
        StreamFrameSink failing = (streamId, frame, receiveTimeNs) -> {
            if (++calls[0] % 2 == 0) {
                throw new IllegalStateException("consumer broke on frame " + frame.sequence());
            }
        };
        try (UdpSource source = new UdpSource(UdpSourceConfig.loopback(0), decoder(failing), System::nanoTime);
             UdpSender sender = new UdpSender(UdpSenderConfig.loopback(source.localPort()))) {
            source.start();
            StreamEncoder enc = sender.openStream(4, dict, "preloaded", WireOptions.DEFAULT.withMaxFramesPerPacket(1));
            frames(50, 15).forEach(enc::onFrame);
            awaitTrue(() -> source.datagrams() >= sender.sentPackets());
            source.stop();
            assertEquals(50, calls[0]);
            assertEquals(25, source.sinkErrors());
        }
    }

    @Test
    void sendingToAClosedPortNeverThrowsAndEveryPacketIsAccountedFor() throws IOException {
        int port;
        try (DatagramChannel gone = DatagramChannel.open()) {
            gone.bind(new InetSocketAddress(LO, 0));
            port = ((InetSocketAddress) gone.getLocalAddress()).getPort();
        }
        try (UdpSender sender = new UdpSender(UdpSenderConfig.loopback(port))) {
            StreamEncoder enc = sender.openStream(4, dict, "preloaded", WireOptions.DEFAULT.withMaxFramesPerPacket(1));
            frames(10, 16).forEach(enc::onFrame);
            assertEquals(enc.packets(), sender.sentPackets() + sender.sendErrors());
        }
    }

    @Test
    void aBusyPortIsAPlainError() {
        try (UdpSource first = new UdpSource(UdpSourceConfig.loopback(0), decoder(received), System::nanoTime)) {
            PointcallException e = org.junit.jupiter.api.Assertions.assertThrows(PointcallException.class,
                    () -> new UdpSource(UdpSourceConfig.loopback(first.localPort()), decoder(received),
                            System::nanoTime));
            assertTrue(e.getMessage().startsWith("cannot receive UDP on 127.0.0.1:" + first.localPort() + ": "),
                    e.getMessage());
        }
    }

    static ParameterDictionary dictionary(int slots) {
        List<Parameter> ps = new ArrayList<>();
        for (int i = 0; i < slots; i++) {
            ps.add(new Parameter("udp.p" + i, Unit.NONE, "", 20, -1e9, 1e9, null, null, null));
        }
        return new ParameterDictionary("udp-test", ps);
    }

    private List<Frame> frames(int n, long seed) {
        SplittableRandom r = new SplittableRandom(seed);
        List<Frame> out = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            Frame f = Frame.forDictionary(dict);
            for (int k = 0; k < f.slots(); k++) {
                f.value(k, r.nextInt(10) == 0 ? Double.NaN : r.nextDouble() * 1000);
            }
            f.timeNs(1_000_000L * i + r.nextInt(1000));
            out.add(f);
        }
        return out;
    }

    private static long[] bits(Frame f) {
        long[] b = new long[f.slots()];
        for (int k = 0; k < b.length; k++) {
            b[k] = Double.doubleToRawLongBits(f.value(k));
        }
        return b;
    }

    private static void awaitTrue(BooleanSupplier condition) {
        long end = System.nanoTime() + DEADLINE_NS;
        while (!condition.getAsBoolean()) {
            if (System.nanoTime() > end) {
                throw new AssertionError("condition not met within the deadline");
            }
            Thread.onSpinWait();
            try {
                Thread.sleep(1);
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
                throw new AssertionError(e);
            }
        }
    }

    /** Copies of frames with their receive times; read only after the source has stopped. */
    private static final class Received implements StreamFrameSink {
        final List<Frame> frames = new ArrayList<>();
        final List<Long> receiveNs = new ArrayList<>();

        @Override
        public void onFrame(int streamId, Frame frame, long receiveTimeNs) {
            frames.add(frame.copy());
            receiveNs.add(receiveTimeNs);
        }
    }
}
