package org.pointcall.models.modelfile;

import java.time.Instant;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Objects;

/**
 * The metadata block of a model file: the model's description plus what the file itself records.
 *
 * @param formatVersion  the file's format version
 * @param description    what the model needs and is
 * @param libraries      library versions it was written with, by name ({@code smile}, {@code java})
 * @param created        when the file was written
 * @param payloadClass   class of the serialised model object
 * @param payloadBytes   length of the payload
 * @param payloadSha256  SHA-256 of the payload, lower-case hex
 */
public record ModelMetadata(int formatVersion, ModelDescription description, Map<String, String> libraries,
                            Instant created, String payloadClass, long payloadBytes, String payloadSha256) {
    public ModelMetadata {
        Objects.requireNonNull(description, "description");
        libraries = Collections.unmodifiableMap(new LinkedHashMap<>(libraries));
        Objects.requireNonNull(created, "created");
        Objects.requireNonNull(payloadClass, "payloadClass");
        Objects.requireNonNull(payloadSha256, "payloadSha256");
        if (!payloadSha256.matches("[0-9a-f]{64}")) {
            throw new IllegalArgumentException("payload hash must be 64 lower-case hex digits");
        }
        if (payloadBytes < 0) {
            throw new IllegalArgumentException("payload length must be >= 0");
        }
    }

    /** The model's parameter requirements. */
    public ModelRequirements requirements() {
        return description.requirements();
    }
}
