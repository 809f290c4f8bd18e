package org.pointcall.replay.play;

import java.util.ArrayList;
import java.util.List;

import org.pointcall.replay.archive.ArchiveReader;
import org.pointcall.replay.archive.TypedRecord;

/** Plays the packets of a sortie archive exactly as they were received, on their arrival time line. */
public final class ArchiveSource implements ReplaySource {
    private final ArchiveReader reader;

    public ArchiveSource(ArchiveReader reader) {
        this.reader = reader;
    }

    @Override
    public void play(long fromNs, PacketEmitter emitter) {
        reader.readFrom(fromNs, r -> !r.isPacket() || emitter.emit(r.body(), r.timeNs()));
    }

    /** Archive times of the typed records of {@code type} (for example events): points to jump to. */
    public List<Long> pointsOf(String type) {
        List<Long> out = new ArrayList<>();
        for (TypedRecord r : reader.typedRecords(type)) {
            out.add(r.timeNs());
        }
        return out;
    }

    public ArchiveReader reader() {
        return reader;
    }

    @Override
    public String name() {
        return reader.file().toString();
    }
}
