package org.pointcall.replay.archive;

import static org.pointcall.replay.archive.ArchiveFormat.*;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.channels.FileChannel;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Locale;
import java.util.zip.CRC32C;

import org.pointcall.shared.error.PointcallException;

/**
 * Reads a sortie archive. Opening takes the chunk list from the index, or scans the file when the index is
 * missing, damaged or shorter than the file (a recording that was stopped hard, or is still going on): every
 * chunk is checked against its CRC-32Cs, a damaged stretch is skipped and named by its offset in
 * {@link #damage()}, reading goes on after it, and unfinished bytes at the end are reported in {@link #cutTail()}.
 * A rebuilt index is written back when the scan found no damage. One thread at a time.
 */
public final class ArchiveReader implements AutoCloseable {
    private final Path file;
    private final FileChannel channel;
    private final long createdEpochMs;
    private final long clockAtCreationNs;
    private final List<ChunkInfo> chunks;
    private final List<Damage> damage = new ArrayList<>();
    private final CutTail cut;
    private final boolean indexRebuilt;
    private final CRC32C crc = new CRC32C();
    private final RecordView view = new RecordView();
    private ByteBuffer buf = ByteBuffer.allocate(1 << 20).order(ORDER);

    private ArchiveReader(Path file, FileChannel channel, long createdEpochMs, long clockAtCreationNs,
                          List<ChunkInfo> chunks, List<Damage> found, CutTail cut, boolean indexRebuilt) {
        this.file = file;
        this.channel = channel;
        this.createdEpochMs = createdEpochMs;
        this.clockAtCreationNs = clockAtCreationNs;
        this.chunks = Collections.unmodifiableList(chunks);
        this.damage.addAll(found);
        this.cut = cut;
        this.indexRebuilt = indexRebuilt;
    }

    /**
     * Opens an archive.
     *
     * @throws PointcallException when the file cannot be read or is not a sortie archive (one line naming it)
     */
    public static ArchiveReader open(Path file) {
        FileChannel ch;
        try {
            ch = FileChannel.open(file, StandardOpenOption.READ);
        } catch (NoSuchFileException e) {
            throw new PointcallException(file + ": no such archive");
        } catch (IOException e) {
            throw new PointcallException(file + ": cannot read the archive: " + e.getMessage(), e);
        }
        try {
            return open(file, ch);
        } catch (IOException e) {
            close(ch);
            throw new PointcallException(file + ": cannot read the archive: " + e.getMessage(), e);
        } catch (RuntimeException e) {
            close(ch);
            throw e;
        }
    }

    private static ArchiveReader open(Path file, FileChannel ch) throws IOException {
        long size = ch.size();
        ByteBuffer h = ByteBuffer.allocate(FILE_HEADER_BYTES).order(ORDER);
        readFully(ch, h, 0);
        if (size < FILE_HEADER_BYTES || h.getInt(0) != FILE_MAGIC) {
            throw new PointcallException(file + ":0: not a pointcall sortie archive (no 'PCSA' header)");
        }
        int version = h.getShort(FH_VERSION) & 0xffff;
        if (version != VERSION) {
            throw new PointcallException(file + ":0: archive format version " + version
                    + " is not read by this build (it reads version " + VERSION + ")");
        }
        CRC32C c = new CRC32C();
        c.update(h.array(), 0, FH_CRC);
        if ((int) c.getValue() != h.getInt(FH_CRC)) {
            throw new PointcallException(file + ":0: archive header damaged (CRC-32C mismatch)");
        }
        long created = h.getLong(FH_CREATED_EPOCH_MS);
        long clock0 = h.getLong(FH_CLOCK_AT_CREATION_NS);

        ArchiveIndex.Loaded idx = ArchiveIndex.read(file);
        List<ChunkInfo> chunks = new ArrayList<>();
        long scanFrom = FILE_HEADER_BYTES;
        boolean fromIndex = idx != null && idx.coveredBytes() <= size && consistent(idx);
        if (fromIndex) {
            chunks.addAll(idx.chunks());
            scanFrom = idx.coveredBytes();
        }
        boolean rebuilt = !fromIndex || scanFrom < size;
        List<Damage> found = new ArrayList<>();
        CutTail cut = null;
        if (scanFrom < size) {
            Scanner s = new Scanner(file, ch, size);
            cut = s.scan(scanFrom, chunks, found);
            if (found.isEmpty()) {
                long covered = cut == null ? size : cut.offset();
                try {
                    ArchiveIndex.write(file, covered, chunks);
                } catch (IOException | UnsupportedOperationException ignored) {
                    // a read-only place: the index lives in memory for this reader only
                }
            }
        }
        return new ArchiveReader(file, ch, created, clock0, chunks, found, cut, rebuilt);
    }

    private static boolean consistent(ArchiveIndex.Loaded idx) {
        long prevEnd = FILE_HEADER_BYTES;
        for (ChunkInfo ci : idx.chunks()) {
            if (ci.offset() < prevEnd || ci.end() > idx.coveredBytes()) {
                return false;
            }
            prevEnd = ci.end();
        }
        return true;
    }

    public Path file() {
        return file;
    }

    /** Wall-clock time the archive was created, ms since 1970. */
    public long createdEpochMs() {
        return createdEpochMs;
    }

    /** The archive clock's reading when the archive was created: maps archive times to wall-clock time. */
    public long clockAtCreationNs() {
        return clockAtCreationNs;
    }

    /** Whole chunks in file order. */
    public List<ChunkInfo> chunks() {
        return chunks;
    }

    /** Stretches skipped, at open and while reading, in the order found. */
    public List<Damage> damage() {
        return Collections.unmodifiableList(damage);
    }

    /** Unfinished bytes at the end, or null when the archive ends on a whole chunk. */
    public CutTail cutTail() {
        return cut;
    }

    /** Whether the chunk list came (wholly or partly) from scanning rather than the index. */
    public boolean indexRebuilt() {
        return indexRebuilt;
    }

    public long records() {
        long n = 0;
        for (ChunkInfo c : chunks) {
            n += c.records();
        }
        return n;
    }

    /** Earliest record time, or Long.MIN_VALUE when there is none. */
    public long firstTimeNs() {
        long t = Long.MAX_VALUE;
        for (ChunkInfo c : chunks) {
            t = Math.min(t, c.firstTimeNs());
        }
        return chunks.isEmpty() ? Long.MIN_VALUE : t;
    }

    /** Latest record time, or Long.MIN_VALUE when there is none. */
    public long lastTimeNs() {
        long t = Long.MIN_VALUE;
        for (ChunkInfo c : chunks) {
            t = Math.max(t, c.lastTimeNs());
        }
        return t;
    }

    /** Chunk numbers missing between whole chunks (lost before they were written, or in damage). */
    public long chunkNumbersMissing() {
        long missing = 0;
        for (int i = 1; i < chunks.size(); i++) {
            long step = (chunks.get(i).number() & 0xffffffffL) - (chunks.get(i - 1).number() & 0xffffffffL);
            if (step > 1) {
                missing += step - 1;
            }
        }
        return missing;
    }

    /** Visits every record in file order. */
    public void read(RecordVisitor visitor) {
        readFrom(Long.MIN_VALUE, visitor);
    }

    /**
     * Visits the records from archive time {@code timeNs} on: the index finds the first chunk that reaches that
     * time, and records before it in that chunk are passed over.
     */
    public void readFrom(long timeNs, RecordVisitor visitor) {
        int first = 0;
        if (timeNs != Long.MIN_VALUE) {
            while (first < chunks.size() && chunks.get(first).lastTimeNs() < timeNs) {
                first++;
            }
        }
        for (int i = first; i < chunks.size(); i++) {
            if (!visitChunk(chunks.get(i), timeNs, visitor)) {
                return;
            }
        }
    }

    private boolean visitChunk(ChunkInfo ci, long fromNs, RecordVisitor visitor) {
        int len = CHUNK_HEADER_BYTES + ci.payloadBytes();
        if (buf.capacity() < len) {
            buf = ByteBuffer.allocate(len).order(ORDER);
        }
        buf.clear().limit(len);
        try {
            readFully(channel, buf, ci.offset());
        } catch (IOException e) {
            addDamage(new Damage(ci.offset(), len, "chunk " + ci.number() + " at offset " + ci.offset()
                    + ": read failed (" + e.getMessage() + "), skipped"));
            return true;
        }
        String bad = checkChunk(buf, 0, len, crc);
        if (bad != null) {
            addDamage(new Damage(ci.offset(), len, "chunk " + ci.number() + " at offset " + ci.offset() + ": " + bad
                    + ", " + ci.records() + " records skipped"));
            return true;
        }
        int p = CHUNK_HEADER_BYTES;
        int end = len;
        int r = 0;
        while (p < end) {
            if (end - p < RECORD_HEADER_BYTES) {
                return malformed(ci, r, p);
            }
            int kind = buf.get(p + R_KIND) & 0xff;
            int tag = buf.get(p + R_TAG_BYTES) & 0xff;
            int body = buf.getInt(p + R_BODY_BYTES);
            if (kind < KIND_PACKET || kind > KIND_TYPED || tag > MAX_TAG_BYTES || body < 0 || body > MAX_BODY_BYTES
                    || buf.getShort(p + R_RESERVED) != 0 || p + RECORD_HEADER_BYTES + tag + body > end) {
                return malformed(ci, r, p);
            }
            long t = buf.getLong(p + R_TIME_NS);
            if (t >= fromNs) {
                view.set(buf, kind, t, buf.getLong(p + R_EXTRA), p + RECORD_HEADER_BYTES, tag,
                        p + RECORD_HEADER_BYTES + tag, body, ci.number());
                if (!visitor.onRecord(view)) {
                    return false;
                }
            }
            p += RECORD_HEADER_BYTES + tag + body;
            r++;
        }
        return true;
    }

    /** Reading twice finds the same damage twice: keep it once. */
    private void addDamage(Damage d) {
        for (Damage known : damage) {
            if (known.offset() == d.offset()) {
                return;
            }
        }
        damage.add(d);
    }

    private boolean malformed(ChunkInfo ci, int record, int at) {
        addDamage(new Damage(ci.offset() + at, ci.end() - ci.offset() - at, "chunk " + ci.number() + " at offset "
                + ci.offset() + ": record " + record + " malformed at offset " + (ci.offset() + at)
                + ", rest of the chunk skipped"));
        return true;
    }

    /** Checks a chunk held in {@code b} from {@code off}; returns what is wrong, or null. */
    static String checkChunk(ByteBuffer b, int off, int len, CRC32C crc) {
        crc.reset();
        crc.update(b.array(), off, CH_HEADER_CRC);
        if ((int) crc.getValue() != b.getInt(off + CH_HEADER_CRC) || b.getInt(off) != CHUNK_MAGIC) {
            return "header CRC-32C mismatch";
        }
        crc.reset();
        crc.update(b.array(), off + CHUNK_HEADER_BYTES, len - CHUNK_HEADER_BYTES);
        if ((int) crc.getValue() != b.getInt(off + CH_PAYLOAD_CRC)) {
            return String.format(Locale.ROOT, "payload CRC-32C mismatch (computed 0x%08x, stored 0x%08x)",
                    (int) crc.getValue(), b.getInt(off + CH_PAYLOAD_CRC));
        }
        return null;
    }

    /** Every typed record, or those of one type ({@code null} for all), in file order. */
    public List<TypedRecord> typedRecords(String type) {
        byte[] t = type == null ? null : ChunkBuilder.tagBytes(type);
        List<TypedRecord> out = new ArrayList<>();
        read(r -> {
            if (r.kind() == KIND_TYPED && (t == null || r.isType(t))) {
                out.add(new TypedRecord(r.type(), r.timeNs(), r.dataTimeNs(), r.bodyBytes()));
            }
            return true;
        });
        return out;
    }

    /** A dictionary stored in the archive: its hash and its text as announced. */
    public record StoredDictionary(long hash, long timeNs, String text) {
    }

    public List<StoredDictionary> dictionaries() {
        List<StoredDictionary> out = new ArrayList<>();
        read(r -> {
            if (r.kind() == KIND_DICTIONARY) {
                out.add(new StoredDictionary(r.extra(), r.timeNs(),
                        new String(r.bodyBytes(), java.nio.charset.StandardCharsets.UTF_8)));
            }
            return true;
        });
        return out;
    }

    /** Lines for a user: what was found on opening. */
    public List<String> healthLines() {
        List<String> out = new ArrayList<>();
        for (Damage d : damage) {
            out.add(file + ": " + d.message());
        }
        if (cut != null) {
            out.add(file + ": recording stopped mid-chunk: " + cut.describe());
        }
        long missing = chunkNumbersMissing();
        if (missing > 0) {
            out.add(file + ": " + missing + " chunk numbers missing between whole chunks");
        }
        return out;
    }

    @Override
    public void close() {
        close(channel);
    }

    private static void close(FileChannel ch) {
        try {
            ch.close();
        } catch (IOException ignored) {
            // read-only channel: nothing to lose
        }
    }

    static void readFully(FileChannel ch, ByteBuffer b, long pos) throws IOException {
        long p = pos;
        while (b.hasRemaining()) {
            int n = ch.read(b, p);
            if (n < 0) {
                break;
            }
            p += n;
        }
        b.flip();
    }

    /** Walks chunk by chunk from an offset, resynchronising on the next valid header after damage. */
    private static final class Scanner {
        private final Path file;
        private final FileChannel ch;
        private final long size;
        private final CRC32C crc = new CRC32C();
        private ByteBuffer b = ByteBuffer.allocate(1 << 20).order(ORDER);

        Scanner(Path file, FileChannel ch, long size) {
            this.file = file;
            this.ch = ch;
            this.size = size;
        }

        CutTail scan(long from, List<ChunkInfo> chunks, List<Damage> found) throws IOException {
            long pos = from;
            ByteBuffer h = ByteBuffer.allocate(CHUNK_HEADER_BYTES).order(ORDER);
            while (pos < size) {
                if (size - pos < CHUNK_HEADER_BYTES) {
                    return new CutTail(pos, size - pos, -1, 0, 0);
                }
                h.clear();
                readFully(ch, h, pos);
                if (headerValid(h, 0)) {
                    int payload = h.getInt(CH_PAYLOAD_BYTES);
                    int number = h.getInt(CH_NUMBER);
                    int records = h.getInt(CH_RECORDS);
                    long t0 = h.getLong(CH_FIRST_TIME_NS);
                    long t1 = h.getLong(CH_LAST_TIME_NS);
                    long end = pos + CHUNK_HEADER_BYTES + payload;
                    if (end > size) {
                        return new CutTail(pos, size - pos, records, t0, t1);
                    }
                    int len = CHUNK_HEADER_BYTES + payload;
                    if (b.capacity() < len) {
                        b = ByteBuffer.allocate(len).order(ORDER);
                    }
                    b.clear().limit(len);
                    readFully(ch, b, pos);
                    String bad = checkChunk(b, 0, len, crc);
                    if (bad == null) {
                        chunks.add(new ChunkInfo(pos, number, records, payload, t0, t1));
                    } else {
                        found.add(new Damage(pos, len, "chunk " + number + " at offset " + pos + ": " + bad + ", "
                                + records + " records skipped"));
                    }
                    pos = end;
                    continue;
                }
                long next = nextHeader(pos + 1);
                if (next < 0) {
                    return new CutTail(pos, size - pos, -1, 0, 0);
                }
                found.add(new Damage(pos, next - pos, "offset " + pos + ": " + (next - pos)
                        + " bytes without a valid chunk header, skipped; reading goes on at offset " + next));
                pos = next;
            }
            return null;
        }

        private boolean headerValid(ByteBuffer hb, int off) {
            if (hb.getInt(off) != CHUNK_MAGIC) {
                return false;
            }
            crc.reset();
            crc.update(hb.array(), off, CH_HEADER_CRC);
            int payload = hb.getInt(off + CH_PAYLOAD_BYTES);
            return (int) crc.getValue() == hb.getInt(off + CH_HEADER_CRC) && payload >= 0
                    && payload <= MAX_PAYLOAD_BYTES;
        }

        /** Offset of the next whole, valid chunk header at or after {@code from}, or -1. */
        private long nextHeader(long from) throws IOException {
            int block = 1 << 20;
            ByteBuffer w = ByteBuffer.allocate(block + CHUNK_HEADER_BYTES).order(ORDER);
            long base = from;
            while (base + CHUNK_HEADER_BYTES <= size) {
                w.clear();
                readFully(ch, w, base);
                int n = w.limit();
                for (int i = 0; i + CHUNK_HEADER_BYTES <= n; i++) {
                    if (w.get(i) == 'P' && w.get(i + 1) == 'C' && w.get(i + 2) == 'C' && w.get(i + 3) == 'K'
                            && headerValid(w, i)) {
                        return base + i;
                    }
                }
                base += block;
            }
            return -1;
        }

        @Override
        public String toString() {
            return "scanner of " + file;
        }
    }
}
