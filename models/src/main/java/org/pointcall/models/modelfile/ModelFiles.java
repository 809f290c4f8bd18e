package org.pointcall.models.modelfile;

import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.InvalidClassException;
import java.io.NotSerializableException;
import java.io.ObjectInputStream;
import java.io.ObjectOutputStream;
import java.io.Serializable;
import java.nio.ByteBuffer;
import java.nio.charset.StandardCharsets;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.time.Instant;
import java.util.Arrays;
import java.util.HexFormat;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;

import org.pointcall.shared.error.InputRejectedException;
import org.pointcall.shared.error.PointcallException;
import org.pointcall.shared.error.Problem;

/**
 * pointcall's model file: a trained detector model with everything needed to feed it as it was trained.
 *
 * <pre>
 * offset      size  content (integers big-endian)
 * 0           16    magic: the ASCII text "pointcall-model" and a line feed
 * 16          2     format version, unsigned (1)
 * 18          4     metadata length M, unsigned, at most 1 MiB
 * 22          M     metadata: UTF-8 JSON (see the models README)
 * 22 + M      8     payload length P, at most 1 GiB
 * 30 + M      P     payload: the model object in Java serialisation
 * 30 + M + P        end of file: nothing may follow
 * </pre>
 *
 * <p>Smile's models can only be saved by Java serialisation, which runs code of every class a stream names. So
 * loading checks everything else first (magic, version, metadata, lengths, the payload's SHA-256 against the one in
 * the metadata) and then deserialises through an allow-list ({@code smile.*}, our classifiers in
 * {@code org.pointcall.models.train}, basic {@code java.lang} and {@code java.util} types, primitive arrays; limits
 * on depth, object count and array length): a file naming any other class is refused before any object of that
 * class exists. The hash detects corruption, not tampering (anyone can recompute it); the allow-list is what keeps a
 * crafted file from running code. Writing checks the same way, so a file that is written can be read.
 *
 * <p>Every refusal is one {@link InputRejectedException} naming the file. Stateless; safe from any thread.
 */
public final class ModelFiles {
    /** The first 16 bytes of every model file. */
    public static final byte[] MAGIC = "pointcall-model\n".getBytes(StandardCharsets.US_ASCII);
    /** The format version this build writes and the newest it reads. */
    public static final int FORMAT_VERSION = 1;
    public static final int MAX_METADATA_BYTES = 1 << 20;
    public static final long MAX_PAYLOAD_BYTES = 1L << 30;

    private static final int HEADER_BYTES = MAGIC.length + 2 + 4;

    private ModelFiles() {
    }

    /**
     * Writes {@code model} with its description to {@code file} (through a temporary file beside it, so a reader
     * never sees half a file).
     *
     * @param created the time to record as the file's creation (passed in, as time always is)
     * @return the metadata written
     * @throws PointcallException when the model cannot be serialised or holds a class the format does not allow,
     *                            or the file cannot be written
     */
    public static ModelMetadata write(Path file, ModelDescription description, Serializable model, Instant created) {
        Objects.requireNonNull(description, "description");
        Objects.requireNonNull(model, "model");
        byte[] payload = serialise(model);
        try {
            deserialise(payload, "the model to write");
        } catch (InputRejectedException e) {
            throw new PointcallException("cannot write " + file + ": " + e.problems().get(0).message());
        }
        ModelMetadata meta = new ModelMetadata(FORMAT_VERSION, description, libraries(), created,
                model.getClass().getName(), payload.length, sha256(payload));
        byte[] json = MetadataJson.write(meta);
        if (json.length > MAX_METADATA_BYTES) {
            throw new PointcallException("cannot write " + file + ": metadata of " + json.length
                    + " bytes is over the " + MAX_METADATA_BYTES + " allowed");
        }
        ByteBuffer head = ByteBuffer.allocate(HEADER_BYTES);
        head.put(MAGIC).putShort((short) FORMAT_VERSION).putInt(json.length);
        ByteBuffer len = ByteBuffer.allocate(8).putLong(payload.length);
        Path dir = file.toAbsolutePath().getParent();
        try {
            Path tmp = Files.createTempFile(dir, ".model-", ".part");
            try {
                try (var out = Files.newOutputStream(tmp)) {
                    out.write(head.array());
                    out.write(json);
                    out.write(len.array());
                    out.write(payload);
                }
                try {
                    Files.move(tmp, file, StandardCopyOption.ATOMIC_MOVE, StandardCopyOption.REPLACE_EXISTING);
                } catch (AtomicMoveNotSupportedException e) {
                    Files.move(tmp, file, StandardCopyOption.REPLACE_EXISTING);
                }
            } finally {
                Files.deleteIfExists(tmp);
            }
        } catch (IOException e) {
            throw new PointcallException("cannot write " + file + ": " + e.getMessage(), e);
        }
        return meta;
    }

    /** Versions recorded in every file: Smile's and Java's. */
    static Map<String, String> libraries() {
        Map<String, String> m = new LinkedHashMap<>();
        String smile = smile.classification.Classifier.class.getPackage().getImplementationVersion();
        m.put("smile", smile == null ? "unknown" : smile);
        m.put("java", Runtime.version().toString());
        return m;
    }

    /**
     * Reads the header and metadata only, deserialising nothing: to show what a model is.
     *
     * @throws InputRejectedException naming the file when it is not a model file this build reads
     */
    public static ModelMetadata readMetadata(Path file) {
        return parse(file, false).metadata;
    }

    /**
     * Reads a model file: checks its header, metadata, lengths and payload hash, then deserialises the payload
     * through the allow-list.
     *
     * @throws InputRejectedException naming the file and what is wrong; nothing of a refused file is returned
     */
    public static LoadedModel<Object> load(Path file) {
        Parsed p = parse(file, true);
        Object model = deserialise(p.payload, file.toString());
        if (!model.getClass().getName().equals(p.metadata.payloadClass())) {
            throw reject(file, "the payload is a " + model.getClass().getName() + " but the metadata says "
                    + p.metadata.payloadClass());
        }
        return new LoadedModel<>(p.metadata, model);
    }

    /** {@link #load(Path)}, refusing a model that is not a {@code type}. */
    public static <T> LoadedModel<T> load(Path file, Class<T> type) {
        Parsed p = parse(file, true);
        if (!PayloadFilter.allowedName(p.metadata.payloadClass())) {
            throw reject(file, "the payload is a " + p.metadata.payloadClass() + ", which a model file may not hold");
        }
        Object model = deserialise(p.payload, file.toString());
        if (!type.isInstance(model)) {
            throw reject(file, "the model is a " + model.getClass().getName() + ", not a " + type.getName());
        }
        if (!model.getClass().getName().equals(p.metadata.payloadClass())) {
            throw reject(file, "the payload is a " + model.getClass().getName() + " but the metadata says "
                    + p.metadata.payloadClass());
        }
        return new LoadedModel<>(p.metadata, type.cast(model));
    }

    private record Parsed(ModelMetadata metadata, byte[] payload) {
    }

    private static Parsed parse(Path file, boolean withPayload) {
        byte[] bytes;
        try {
            long size = Files.size(file);
            if (size > MAX_PAYLOAD_BYTES + MAX_METADATA_BYTES + 64) {
                throw reject(file, "file of " + size + " bytes is larger than any model file");
            }
            bytes = Files.readAllBytes(file);
        } catch (java.nio.file.NoSuchFileException e) {
            throw reject(file, "no such model file");
        } catch (IOException e) {
            throw reject(file, "cannot read the model file: " + e.getMessage());
        }
        if (bytes.length < MAGIC.length || !Arrays.equals(bytes, 0, MAGIC.length, MAGIC, 0, MAGIC.length)) {
            throw reject(file, "not a pointcall model file (it does not start with 'pointcall-model')");
        }
        if (bytes.length < HEADER_BYTES) {
            throw reject(file, "truncated: the file ends inside its header");
        }
        ByteBuffer b = ByteBuffer.wrap(bytes);
        b.position(MAGIC.length);
        int version = Short.toUnsignedInt(b.getShort());
        if (version != FORMAT_VERSION) {
            throw reject(file, "model file format version " + version + (version > FORMAT_VERSION
                    ? " is newer than this build reads (" + FORMAT_VERSION + "); use a newer pointcall"
                    : " is not one this build reads (" + FORMAT_VERSION + ")"));
        }
        long metaLength = Integer.toUnsignedLong(b.getInt());
        if (metaLength > MAX_METADATA_BYTES) {
            throw reject(file, "metadata length " + metaLength + " is over the " + MAX_METADATA_BYTES + " allowed");
        }
        if (b.remaining() < metaLength + 8) {
            throw reject(file, "truncated: the file ends inside its metadata");
        }
        byte[] json = new byte[(int) metaLength];
        b.get(json);
        ModelMetadata meta;
        try {
            meta = MetadataJson.read(json);
        } catch (MetadataJson.BadMetadata | MetadataJson.BadMetadataUnchecked | IllegalArgumentException e) {
            throw reject(file, "metadata: " + e.getMessage());
        }
        if (meta.formatVersion() != version) {
            throw reject(file, "metadata says format version " + meta.formatVersion() + ", the header " + version);
        }
        long payloadLength = b.getLong();
        if (payloadLength < 0 || payloadLength > MAX_PAYLOAD_BYTES) {
            throw reject(file, "payload length " + payloadLength + " is out of range");
        }
        if (payloadLength != meta.payloadBytes()) {
            throw reject(file, "payload length " + payloadLength + " differs from the metadata's "
                    + meta.payloadBytes());
        }
        if (b.remaining() < payloadLength) {
            throw reject(file, "truncated: the payload has " + b.remaining() + " of its " + payloadLength + " bytes");
        }
        if (b.remaining() > payloadLength) {
            throw reject(file, (b.remaining() - payloadLength) + " bytes follow the payload; a model file ends with"
                    + " it");
        }
        if (!withPayload) {
            return new Parsed(meta, null);
        }
        byte[] payload = new byte[(int) payloadLength];
        b.get(payload);
        String hash = sha256(payload);
        if (!hash.equals(meta.payloadSha256())) {
            throw reject(file, "the payload's SHA-256 does not match the metadata (the file is corrupted or was "
                    + "altered); refused, nothing loaded");
        }
        return new Parsed(meta, payload);
    }

    /** Stack of the thread that (de)serialises: deep object graphs recurse deeply in Java serialisation. */
    private static final long IO_STACK_BYTES = 64L << 20;

    /**
     * Runs {@code task} on a thread of its own with a large stack, so that a model nested up to
     * {@link PayloadFilter#MAX_DEPTH} levels is read whatever the caller's stack, and a deeper one fails cleanly.
     */
    private static <T> T onIoThread(java.util.concurrent.Callable<T> task) {
        Object[] result = new Object[1];
        Throwable[] failure = new Throwable[1];
        Thread t = new Thread(null, () -> {
            try {
                result[0] = task.call();
            } catch (Throwable e) {
                failure[0] = e;
            }
        }, "pointcall-model-io", IO_STACK_BYTES);
        t.setDaemon(true);
        t.start();
        try {
            t.join();
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new PointcallException("interrupted while reading or writing a model");
        }
        if (failure[0] instanceof RuntimeException re) {
            throw re;
        }
        if (failure[0] instanceof Error err) {
            throw err;
        }
        if (failure[0] != null) {
            throw new IllegalStateException(failure[0]);
        }
        @SuppressWarnings("unchecked")
        T r = (T) result[0];
        return r;
    }

    private static byte[] serialise(Serializable model) {
        return onIoThread(() -> serialiseHere(model));
    }

    private static byte[] serialiseHere(Serializable model) {
        ByteArrayOutputStream bos = new ByteArrayOutputStream(1 << 16);
        try (ObjectOutputStream out = new ObjectOutputStream(bos)) {
            out.writeObject(model);
        } catch (NotSerializableException e) {
            throw new PointcallException("the model holds a " + e.getMessage() + ", which cannot be serialised");
        } catch (IOException e) {
            throw new PointcallException("the model cannot be serialised: " + e.getMessage(), e);
        } catch (StackOverflowError e) {
            throw new PointcallException("the model is nested too deeply to serialise");
        }
        return bos.toByteArray();
    }

    private static Object deserialise(byte[] payload, String source) {
        return onIoThread(() -> deserialiseHere(payload, source));
    }

    private static Object deserialiseHere(byte[] payload, String source) {
        PayloadFilter filter = new PayloadFilter(payload.length);
        try (ObjectInputStream in = new ObjectInputStream(new ByteArrayInputStream(payload))) {
            in.setObjectInputFilter(filter);
            Object o = in.readObject();
            if (in.read() != -1) {
                throw rejectSource(source, "the payload has data after the model object");
            }
            if (o == null) {
                throw rejectSource(source, "the payload holds no model");
            }
            return o;
        } catch (InvalidClassException e) {
            if (filter.rejection() != null) {
                throw rejectSource(source, "the payload holds " + filter.rejection() + " (allowed: "
                        + PayloadFilter.ALLOWED + "); refused, nothing loaded");
            }
            throw rejectSource(source, "class " + e.classname + " in the payload is not the version this build has"
                    + " (written by another Smile version?); refused");
        } catch (ClassNotFoundException e) {
            throw rejectSource(source, "the payload names class " + e.getMessage() + ", which this build does not "
                    + "have; refused");
        } catch (IOException | RuntimeException e) {
            if (e instanceof InputRejectedException ire) {
                throw ire;
            }
            throw rejectSource(source, "the payload cannot be read as a model: " + e);
        } catch (StackOverflowError e) {
            throw rejectSource(source, "the payload is nested too deeply to read; refused");
        }
    }

    private static String sha256(byte[] data) {
        try {
            return HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(data));
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("SHA-256 is required of every Java platform", e);
        }
    }

    private static InputRejectedException reject(Path file, String message) {
        return rejectSource(file.toString(), message);
    }

    private static InputRejectedException rejectSource(String source, String message) {
        return new InputRejectedException(List.of(new Problem(source, 0, 0, message)));
    }
}
