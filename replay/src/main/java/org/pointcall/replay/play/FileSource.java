package org.pointcall.replay.play;

import java.nio.ByteBuffer;
import java.nio.file.Path;

import org.pointcall.ingest.file.ReadOptions;
import org.pointcall.ingest.file.ReadReport;
import org.pointcall.ingest.file.RecordedFileSource;
import org.pointcall.ingest.file.RecordedFiles;
import org.pointcall.ingest.wire.StreamEncoder;
import org.pointcall.ingest.wire.WireOptions;
import org.pointcall.shared.dictionary.DictionaryFiles;
import org.pointcall.shared.dictionary.ParameterDictionary;

/**
 * Plays a recorded CSV/XLSX file as a wire stream on its frame times: each play (each seek) opens the file again
 * and encodes its frames with a fresh epoch, marked synthetic, announcing the dictionary first.
 */
public final class FileSource implements ReplaySource {
    private final Path file;
    private final ParameterDictionary dictionary;
    private final String dictionaryText;
    private final ReadOptions options;
    private final int streamId;
    private final WireOptions wire;
    private volatile ReadReport lastReport;

    public FileSource(Path file, ParameterDictionary dictionary, ReadOptions options, int streamId, WireOptions wire) {
        this.file = file;
        this.dictionary = dictionary;
        this.dictionaryText = DictionaryFiles.toYaml(dictionary);
        this.options = options;
        this.streamId = streamId;
        this.wire = wire.withSynthetic(true);
    }

    @Override
    public void play(long fromNs, PacketEmitter emitter) {
        try (RecordedFileSource src = RecordedFiles.open(file, dictionary, options)) {
            long[] frameTime = new long[1];
            boolean[] stop = new boolean[1];
            StreamEncoder enc = new StreamEncoder(streamId, StreamEncoder.newEpoch(), dictionary, dictionaryText,
                    wire, (ByteBuffer p) -> {
                        if (!stop[0] && !emitter.emit(p, frameTime[0])) {
                            stop[0] = true;
                            src.stop();
                        }
                    });
            lastReport = src.readAll(f -> {
                if (stop[0] || f.timeNs() < fromNs) {
                    return;
                }
                frameTime[0] = f.timeNs();
                enc.onFrame(f);
            });
            if (!stop[0]) {
                enc.flush();
            }
        }
    }

    /** What the last play read, or null before the first. */
    public ReadReport lastReport() {
        return lastReport;
    }

    public ParameterDictionary dictionary() {
        return dictionary;
    }

    @Override
    public String name() {
        return file.toString();
    }
}
