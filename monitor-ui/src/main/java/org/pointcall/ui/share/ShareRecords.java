package org.pointcall.ui.share;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.util.Objects;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.DeserializationFeature;
import com.fasterxml.jackson.databind.ObjectMapper;

import org.pointcall.models.card.SessionSnapshot;
import org.pointcall.shared.error.PointcallException;

/**
 * The records a shared session puts on {@code <prefix>.events}, besides the frames and dictionaries. Every record
 * is keyed by its stream id (4 bytes, as the frames) and carries two headers: {@value #TYPE_HEADER} (what it is)
 * and {@value #SESSION_HEADER} (which session it belongs to). Values are UTF-8 JSON, one object each:
 * <ul>
 * <li>{@value #START} — a card session begins: the card and the dictionary as text, the stream, the source;
 * <li>{@value #EVENT} — one session event, exactly as the sortie archive stores it ({@code PointsFiles.eventToJson});
 * <li>{@value #VIEW} — the live state of the active point (gauges with value, margin, status, time outside), at
 * most a few times a second while a point is flown.
 * </ul>
 * {@code <prefix>.dictionary} holds each dictionary's text keyed by its hash (8 bytes, big-endian).
 */
public final class ShareRecords {
    public static final String TYPE_HEADER = "pointcall.type";
    public static final String SESSION_HEADER = "pointcall.session";
    public static final String START = "session.start";
    public static final String EVENT = "session.event";
    public static final String VIEW = "session.view";
    /** Version of the start record's layout. */
    public static final int FORMAT = 1;

    private static final ObjectMapper JSON = new ObjectMapper()
            .disable(DeserializationFeature.FAIL_ON_UNKNOWN_PROPERTIES);

    private ShareRecords() {
    }

    /**
     * What a watcher needs to follow a session: the card that is flown and the dictionary it was checked against.
     *
     * @param format         {@value #FORMAT}
     * @param session        the session's id, the same in every record's {@value #SESSION_HEADER} header
     * @param startedAtMs    wall time the session began, ms since the epoch (a watcher follows the latest)
     * @param source         where the first session's telemetry comes from, in words
     * @param streamId       the stream the session follows
     * @param sortie         the card's sortie id
     * @param cardText       the test card file's text
     * @param dictionaryText the stream's dictionary file's text
     */
    public record SessionStart(int format, String session, long startedAtMs, String source, int streamId,
                               String sortie, String cardText, String dictionaryText) {
        public SessionStart {
            Objects.requireNonNull(session, "session");
            Objects.requireNonNull(cardText, "cardText");
            Objects.requireNonNull(dictionaryText, "dictionaryText");
            source = source == null ? "" : source;
            sortie = sortie == null ? "" : sortie;
        }
    }

    /**
     * The active point as the first session sees it at data time {@code timeNs}; {@code active} is null between
     * points.
     */
    public record ActiveView(long timeNs, SessionSnapshot.ActivePoint active) {
    }

    public static byte[] start(SessionStart s) {
        return write(s);
    }

    public static byte[] view(ActiveView v) {
        return write(v);
    }

    /** @throws PointcallException when the bytes are not a start record */
    public static SessionStart readStart(byte[] json) {
        SessionStart s = read(json, SessionStart.class, "session start");
        if (s.format() != FORMAT) {
            throw new PointcallException("session start record of format " + s.format() + ", this build reads "
                    + FORMAT);
        }
        return s;
    }

    /** @throws PointcallException when the bytes are not a view record */
    public static ActiveView readView(byte[] json) {
        return read(json, ActiveView.class, "active point view");
    }

    private static byte[] write(Object o) {
        try {
            return JSON.writeValueAsBytes(o);
        } catch (JsonProcessingException e) {
            throw new IllegalStateException("record cannot be written as JSON", e);
        }
    }

    private static <T> T read(byte[] json, Class<T> type, String what) {
        try {
            T v = JSON.readValue(json, type);
            if (v == null) {
                throw new PointcallException("empty " + what + " record");
            }
            return v;
        } catch (IOException | IllegalArgumentException e) {
            String m = e.getMessage() == null ? e.getClass().getSimpleName() : e.getMessage().lines().findFirst()
                    .orElse("");
            throw new PointcallException("not a " + what + " record: " + m, e);
        }
    }

    /** A header's value as text, or null. */
    static String text(byte[] header) {
        return header == null ? null : new String(header, StandardCharsets.UTF_8);
    }

    /** The dictionary topic's key: the hash, 8 bytes big-endian. */
    static byte[] hashKey(long hash) {
        byte[] b = new byte[8];
        for (int i = 0; i < 8; i++) {
            b[i] = (byte) (hash >>> (56 - 8 * i));
        }
        return b;
    }
}
