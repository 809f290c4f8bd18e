package org.pointcall.replay.archive;

import java.nio.charset.StandardCharsets;
import java.util.Objects;

/**
 * A typed record kept apart from the reader: an event, verdict, alarm, operator call or note.
 *
 * @param type       its type tag
 * @param timeNs     archive time (when the recorder took it)
 * @param dataTimeNs the time its producer gave
 * @param json       its payload, JSON as UTF-8
 */
public record TypedRecord(String type, long timeNs, long dataTimeNs, byte[] json) {
    public TypedRecord {
        Objects.requireNonNull(type, "type");
        json = json.clone();
    }

    @Override
    public byte[] json() {
        return json.clone();
    }

    public String jsonText() {
        return new String(json, StandardCharsets.UTF_8);
    }
}
