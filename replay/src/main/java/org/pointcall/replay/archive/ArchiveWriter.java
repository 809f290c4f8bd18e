package org.pointcall.replay.archive;

import static org.pointcall.replay.archive.ArchiveFormat.*;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.channels.FileChannel;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.ArrayList;
import java.util.List;

/**
 * Appends sealed chunks to a new archive file. Each chunk is written at the end of what was written whole before
 * (positional writes), so a write that fails half-way leaves nothing that a retry does not overwrite or cut off.
 * Closing cuts any such remnant, syncs, and writes the index. Single-threaded.
 */
public final class ArchiveWriter implements AutoCloseable {
    private final Path file;
    private final FileChannel channel;
    private final List<ChunkInfo> chunks = new ArrayList<>();
    private volatile long committed;
    private boolean remnant;

    private ArchiveWriter(Path file, FileChannel channel, long committed) {
        this.file = file;
        this.channel = channel;
        this.committed = committed;
    }

    /** Creates {@code file} (it must not exist) and writes its header, synced. */
    public static ArchiveWriter create(Path file, long createdEpochMs, long clockNowNs) throws IOException {
        FileChannel ch = FileChannel.open(file, StandardOpenOption.CREATE_NEW, StandardOpenOption.WRITE);
        try {
            ByteBuffer h = ByteBuffer.wrap(ChunkBuilder.fileHeader(createdEpochMs, clockNowNs));
            while (h.hasRemaining()) {
                ch.write(h, h.position());
            }
            ch.force(true);
        } catch (IOException | RuntimeException e) {
            ch.close();
            throw e;
        }
        return new ArchiveWriter(file, ch, FILE_HEADER_BYTES);
    }

    public Path file() {
        return file;
    }

    /** Bytes written whole: header and every chunk written so far. */
    public long committedBytes() {
        return committed;
    }

    public int chunksWritten() {
        return chunks.size();
    }

    /**
     * Writes one chunk from {@link ChunkBuilder#seal}. On failure the chunk counts as not written (write it again
     * later) and the bytes that did reach the file are cut off if the file system lets us.
     */
    public void write(byte[] sealed) throws IOException {
        if (remnant) {
            channel.truncate(committed);
            remnant = false;
        }
        ByteBuffer b = ByteBuffer.wrap(sealed);
        try {
            long pos = committed;
            while (b.hasRemaining()) {
                pos += channel.write(b, pos);
            }
        } catch (IOException e) {
            remnant = true;
            try {
                channel.truncate(committed);
                remnant = false;
            } catch (IOException ignored) {
                // retried before the next write and on close; the first error is the one to report
            }
            throw e;
        }
        ByteBuffer h = ByteBuffer.wrap(sealed).order(ORDER);
        chunks.add(new ChunkInfo(committed, h.getInt(CH_NUMBER), h.getInt(CH_RECORDS), h.getInt(CH_PAYLOAD_BYTES),
                h.getLong(CH_FIRST_TIME_NS), h.getLong(CH_LAST_TIME_NS)));
        committed += sealed.length;
    }

    /** Forces what was written to the device. */
    public void sync() throws IOException {
        channel.force(false);
    }

    /** Cuts any remnant, syncs, closes, then writes the index (an index that fails to write is rebuilt on open). */
    @Override
    public void close() throws IOException {
        try {
            if (remnant || channel.size() > committed) {
                channel.truncate(committed);
            }
            channel.force(true);
        } finally {
            channel.close();
        }
        ArchiveIndex.write(file, committed, chunks);
    }
}
