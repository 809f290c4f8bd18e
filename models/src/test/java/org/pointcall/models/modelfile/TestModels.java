package org.pointcall.models.modelfile;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.ObjectInputStream;
import java.io.ObjectOutputStream;
import java.io.Serializable;
import java.io.UncheckedIOException;
import java.nio.ByteBuffer;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.util.HashMap;
import java.util.HexFormat;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.atomic.AtomicBoolean;

import org.pointcall.ingest.window.ExtractorSettings;
import org.pointcall.ingest.window.WindowSpec;
import org.pointcall.shared.units.Unit;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ObjectNode;

/** Descriptions, payloads and hand-crafted files for the model-file tests. */
final class TestModels {
    private TestModels() {
    }

    static final List<WindowSpec> WINDOWS = List.of(WindowSpec.of("KCAS", 2.0), WindowSpec.of("AoA", 1.0));
    static final List<String> CLASSES = List.of("none", "stall-level", "loop");

    static ModelDescription description() {
        Map<String, Long> rows = new LinkedHashMap<>();
        rows.put("none", 900L);
        rows.put("stall-level", 300L);
        rows.put("loop", 300L);
        return new ModelDescription(
                List.of(new RequiredParameter("KCAS", Unit.KNOT), new RequiredParameter("AoA", Unit.DEGREE)),
                WINDOWS, ExtractorSettings.defaults(), ModelDescription.featureNames(WINDOWS), CLASSES,
                new TrainingSummary(List.of("sortie-1", "sortie-2"), rows, "undersample none 3:1",
                        "smile.classification.RandomForest", Map.of("trees", "10"), Map.of("macro-f1-mean", 0.91)));
    }

    /** Set when an {@link EvilMap} is deserialised: it must never be. */
    static final AtomicBoolean EVIL_RAN = new AtomicBoolean();

    /** A HashMap subclass outside the allow-list whose deserialisation leaves a trace. */
    static final class EvilMap extends HashMap<String, String> {
        private static final long serialVersionUID = 1L;

        private void readObject(ObjectInputStream in) throws IOException, ClassNotFoundException {
            EVIL_RAN.set(true);
            in.defaultReadObject();
        }
    }

    static byte[] serialise(Serializable o) {
        ByteArrayOutputStream bos = new ByteArrayOutputStream();
        try (ObjectOutputStream out = new ObjectOutputStream(bos)) {
            out.writeObject(o);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        return bos.toByteArray();
    }

    /** {@link #serialise} on a thread with a large stack, for deeply nested objects. */
    static byte[] serialiseDeep(Serializable o) throws InterruptedException {
        byte[][] out = new byte[1][];
        Thread t = new Thread(null, () -> out[0] = serialise(o), "deep-serialise", 64L << 20);
        t.start();
        t.join();
        return out[0];
    }

    /**
     * A copy of the good model file {@code good} with another payload, its length and SHA-256 made consistent in
     * the metadata, laid out as the format documents it (16-byte magic, u16 version, u32 metadata length, JSON,
     * u64 payload length, payload).
     */
    static Path withPayload(Path good, byte[] payload, String payloadClass, Path out) throws Exception {
        ByteBuffer b = ByteBuffer.wrap(Files.readAllBytes(good));
        byte[] magic = new byte[16];
        b.get(magic);
        short version = b.getShort();
        byte[] json = new byte[b.getInt()];
        b.get(json);
        ObjectMapper mapper = new ObjectMapper();
        ObjectNode meta = (ObjectNode) mapper.readTree(json);
        ((ObjectNode) meta.get("payload")).put("class", payloadClass).put("bytes", payload.length)
                .put("sha256", HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(payload)));
        byte[] newJson = mapper.writeValueAsBytes(meta);
        ByteBuffer o = ByteBuffer.allocate(16 + 2 + 4 + newJson.length + 8 + payload.length);
        o.put(magic).putShort(version).putInt(newJson.length).put(newJson).putLong(payload.length).put(payload);
        return Files.write(out, o.array());
    }

    /** The metadata JSON of a model file, as a tree to edit, and a writer back. */
    static ObjectNode metadata(Path file) throws IOException {
        ByteBuffer b = ByteBuffer.wrap(Files.readAllBytes(file));
        b.position(18);
        byte[] json = new byte[b.getInt()];
        b.get(json);
        return (ObjectNode) new ObjectMapper().readTree(json);
    }

    static Path withMetadata(Path good, ObjectNode meta, Path out) throws IOException {
        ByteBuffer b = ByteBuffer.wrap(Files.readAllBytes(good));
        byte[] head = new byte[18];
        b.get(head);
        b.position(b.position() + b.getInt());
        byte[] rest = new byte[b.remaining()];
        b.get(rest);
        byte[] json = new ObjectMapper().writeValueAsBytes(meta);
        ByteBuffer o = ByteBuffer.allocate(18 + 4 + json.length + rest.length);
        o.put(head).putInt(json.length).put(json).put(rest);
        return Files.write(out, o.array());
    }
}
