package org.pointcall.ingest.wire;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.net.InetAddress;
import java.net.InetSocketAddress;
import java.net.UnknownHostException;
import java.nio.ByteBuffer;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

import org.junit.jupiter.api.Test;
import org.pointcall.shared.dictionary.ParameterDictionary;

class AnnounceTest {
    private final ParameterDictionary dict = TestDictionaries.dictionary("ann", 200);
    private final byte[] text = TestDictionaries.toText(dict).getBytes(StandardCharsets.UTF_8);
    private final List<String> lines = new ArrayList<>();
    private final DictionaryRegistry registry = new DictionaryRegistry();
    private final PacketDecoder dec = new PacketDecoder(registry, TestDictionaries.READER, new Collected(),
            DecoderOptions.DEFAULT.withMaxAnnounceTextBytes(100_000), new FaultLog(lines::add, 100, 1));
    private final PacketEncoder enc = new PacketEncoder(1472);
    private final InetSocketAddress from;
    private int seq;

    AnnounceTest() throws UnknownHostException {
        from = new InetSocketAddress(InetAddress.getByName("127.0.0.1"), 40123);
    }

    private DecodeResult send(long hash, int slots, byte[] t, int crc, int fragment) {
        ByteBuffer p = enc.encodeAnnounce(new StreamIdentity(7, 1, hash, slots), 0, seq++, t, crc, fragment);
        return dec.decode(p, from, 0);
    }

    private DecodeResult sendAll(long hash, int slots, byte[] t, int crc) {
        DecodeResult last = null;
        for (int i = 0; i < enc.announceFragments(t.length); i++) {
            last = send(hash, slots, t, crc, i);
        }
        return last;
    }

    @Test
    void aFragmentedAnnounceTeachesTheDictionary() {
        assertTrue(enc.announceFragments(text.length) > 3, "this dictionary needs several fragments");
        assertEquals(DecodeResult.ANNOUNCE, sendAll(dict.hash(), 200, text, PacketEncoder.textCrc(text)));
        assertEquals(1, dec.counters().dictionariesLearnt());
        assertEquals(dict.hash(), registry.find(dict.hash()).hash());
        assertEquals(200, registry.find(dict.hash()).size());
    }

    @Test
    void aFragmentLostInOneRoundIsFilledByTheNextRound() {
        int n = enc.announceFragments(text.length);
        int crc = PacketEncoder.textCrc(text);
        for (int i = 0; i < n; i++) {
            if (i != 2) {
                send(dict.hash(), 200, text, crc, i);
            } else {
                seq++; // lost on the way
            }
        }
        assertEquals(0, dec.counters().dictionariesLearnt());
        for (int i = 0; i < 3; i++) {
            send(dict.hash(), 200, text, crc, i);
        }
        assertEquals(1, dec.counters().dictionariesLearnt());
        assertEquals(0, dec.counters().faults());
    }

    @Test
    void aTextWhoseCrcDoesNotMatchIsRefused() {
        assertEquals(DecodeResult.BAD_ANNOUNCE, sendAll(dict.hash(), 200, text, PacketEncoder.textCrc(text) ^ 1));
        assertEquals(1, dec.counters().badAnnounce());
        assertEquals(null, registry.find(dict.hash()));
        assertTrue(lines.get(lines.size() - 1).contains("text CRC mismatch"), lines.toString());
    }

    @Test
    void aTextThatIsNotUtf8IsRefused() {
        byte[] bad = {'d', 'i', (byte) 0xC3, (byte) 0x28, 'x'};
        assertEquals(DecodeResult.BAD_ANNOUNCE, sendAll(dict.hash(), 200, bad, PacketEncoder.textCrc(bad)));
        assertTrue(lines.get(lines.size() - 1).endsWith("not valid UTF-8"), lines.toString());
    }

    @Test
    void aTextTheReaderRejectsIsRefusedWithTheReadersReasonAndWhereItCameFrom() {
        byte[] bad = "dictionary\tx\nAoA\tdeg\t20\n".getBytes(StandardCharsets.UTF_8);
        assertEquals(DecodeResult.BAD_ANNOUNCE, sendAll(dict.hash(), 200, bad, PacketEncoder.textCrc(bad)));
        assertEquals("packet from 127.0.0.1:40123 stream 7 seq 0: announce of dictionary 0x"
                + String.format("%016x", dict.hash()) + " refused: dictionary text rejected: announce from "
                + "127.0.0.1:40123 stream 7:2:1: expected 6 tab-separated fields, got 3", lines.get(0));
    }

    @Test
    void aTextOfAnotherDictionaryThanItsHashSaysIsRefused() {
        ParameterDictionary other = TestDictionaries.dictionary("other", 200);
        assertEquals(DecodeResult.BAD_ANNOUNCE, sendAll(other.hash(), 200, text, PacketEncoder.textCrc(text)));
        assertTrue(lines.get(0).contains("gives hash"), lines.toString());
        assertEquals(0, registry.size());
    }

    @Test
    void aSlotCountThatDisagreesWithTheTextIsASlotCountMismatch() {
        assertEquals(DecodeResult.SLOT_COUNT_MISMATCH, sendAll(dict.hash(), 199, text, PacketEncoder.textCrc(text)));
        assertEquals(1, dec.counters().slotCountMismatch());
    }

    @Test
    void aTextOverTheLimitIsOversizeOnItsFirstFragment() {
        byte[] big = new byte[100_001];
        Arrays.fill(big, (byte) 'a');
        assertEquals(DecodeResult.OVERSIZE, send(dict.hash(), 200, big, PacketEncoder.textCrc(big), 0));
    }

    @Test
    void anAnnounceInterruptedByAnotherIsAbandonedAndCounted() {
        ParameterDictionary other = TestDictionaries.dictionary("other", 50);
        byte[] t2 = TestDictionaries.toText(other).getBytes(StandardCharsets.UTF_8);
        send(dict.hash(), 200, text, PacketEncoder.textCrc(text), 0);
        assertEquals(DecodeResult.ANNOUNCE, sendAll(other.hash(), 50, t2, PacketEncoder.textCrc(t2)));
        assertEquals(1, dec.counters().announcesAbandoned());
        assertEquals(1, dec.counters().dictionariesLearnt());
        assertEquals(50, registry.find(other.hash()).size());
    }
}
