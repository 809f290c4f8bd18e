package org.pointcall.ingest.wire;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.net.InetAddress;
import java.net.InetSocketAddress;
import java.net.UnknownHostException;
import java.nio.ByteBuffer;
import java.util.ArrayList;
import java.util.List;
import java.util.zip.CRC32C;

import org.junit.jupiter.api.Test;
import org.pointcall.shared.dictionary.ParameterDictionary;

class LogLineTest {
    private final ParameterDictionary dict = TestDictionaries.dictionary("log", 4);
    private final List<String> lines = new ArrayList<>();
    private final PacketDecoder dec = new PacketDecoder(new DictionaryRegistry(List.of(dict)),
            TestDictionaries.READER, new Collected(), DecoderOptions.DEFAULT,
            new FaultLog(lines::add, 10, 1_000_000_000L));
    private final InetSocketAddress from;

    LogLineTest() throws UnknownHostException {
        from = new InetSocketAddress(InetAddress.getByName("127.0.0.1"), 40123);
    }

    private byte[] packet(int seq) {
        PacketEncoder enc = new PacketEncoder(1472);
        ByteBuffer b = enc.encodeFrames(new StreamIdentity(7, 1, dict.hash(), 4), 0, seq, 0, new long[] {0},
                new double[] {1, 2, 3, 4}, 1, 0, 4);
        byte[] p = new byte[b.remaining()];
        b.get(p);
        return p;
    }

    @Test
    void aCrcMismatchNamesSenderStreamSequenceAndBothCrcs() {
        byte[] p = packet(1234);
        p[70] ^= 0x10;
        CRC32C c = new CRC32C();
        c.update(p, 0, p.length - 4);
        int carried = ByteBuffer.wrap(p).order(WireFormat.ORDER).getInt(p.length - 4);
        assertEquals(DecodeResult.BAD_CRC, dec.decode(ByteBuffer.wrap(p), from, 0));
        assertEquals(String.format("packet from 127.0.0.1:40123 stream 7 seq 1234: CRC mismatch (computed 0x%08x, "
                + "carried 0x%08x)", (int) c.getValue(), carried), lines.get(0));
    }

    @Test
    void gapsAndTruncationGetOneLineEach() {
        dec.decode(ByteBuffer.wrap(packet(5)), from, 0);
        dec.decode(ByteBuffer.wrap(packet(11)), from, 0);
        dec.decode(ByteBuffer.wrap(packet(12), 0, 20), from, 0);
        assertEquals(List.of("packet from 127.0.0.1:40123 stream 7 seq 11: 5 packets missing before it",
                "packet from 127.0.0.1:40123 (20 bytes): truncated, shorter than the 38-byte minimum of header and "
                        + "trailer"), lines);
    }

    @Test
    void aFloodIsCutToTheLimitPerWindowWithACountOfWhatWasLeftOutWhileCountersStayExact() {
        byte[] junk = new byte[100];
        for (int i = 0; i < 5000; i++) {
            dec.decode(ByteBuffer.wrap(junk), from, i * 1000L); // 5,000 in 5 ms
        }
        assertEquals(10, lines.size());
        dec.decode(ByteBuffer.wrap(junk), from, 1_000_000_000L);
        assertEquals(12, lines.size());
        assertEquals("4990 more problem lines suppressed in the last 1000 ms (counters stay exact)", lines.get(10));
        assertEquals("packet from 127.0.0.1:40123 (100 bytes): bad magic 0x00000000, expected 0x574c4350 ('PCLW'): "
                + "not a pointcall packet", lines.get(11));
        assertEquals(5001, dec.counters().badMagic());
        assertEquals(4990, dec.log().suppressed());
    }
}
