package org.pointcall.replay.archive;

import java.nio.ByteOrder;

/**
 * Every offset and constant of the sortie archive, version 1 (ARCHIVE-FORMAT.md in the replay module describes
 * them; {@code ArchiveLayoutTest} checks the two agree).
 */
public final class ArchiveFormat {
    public static final ByteOrder ORDER = ByteOrder.LITTLE_ENDIAN;
    public static final String EXTENSION = ".pcsa";
    public static final String INDEX_SUFFIX = ".idx";
    public static final int VERSION = 1;

    /** "PCSA" read little-endian. */
    public static final int FILE_MAGIC = 0x41534350;
    public static final int FILE_HEADER_BYTES = 32;
    static final int FH_VERSION = 4;
    static final int FH_HEADER_BYTES = 6;
    static final int FH_CREATED_EPOCH_MS = 8;
    static final int FH_CLOCK_AT_CREATION_NS = 16;
    static final int FH_RESERVED = 24;
    static final int FH_CRC = 28;

    /** "PCCK" read little-endian. */
    public static final int CHUNK_MAGIC = 0x4b434350;
    public static final int CHUNK_HEADER_BYTES = 40;
    static final int CH_NUMBER = 4;
    static final int CH_PAYLOAD_BYTES = 8;
    static final int CH_RECORDS = 12;
    static final int CH_FIRST_TIME_NS = 16;
    static final int CH_LAST_TIME_NS = 24;
    static final int CH_PAYLOAD_CRC = 32;
    static final int CH_HEADER_CRC = 36;
    /** A chunk header claiming more payload than this is taken for damage, not trusted. */
    public static final int MAX_PAYLOAD_BYTES = 64 << 20;

    public static final int RECORD_HEADER_BYTES = 24;
    static final int R_KIND = 0;
    static final int R_TAG_BYTES = 1;
    static final int R_RESERVED = 2;
    static final int R_BODY_BYTES = 4;
    static final int R_TIME_NS = 8;
    static final int R_EXTRA = 16;
    public static final int MAX_TAG_BYTES = 64;
    public static final int MAX_BODY_BYTES = 1 << 20;

    public static final int KIND_PACKET = 1;
    public static final int KIND_DICTIONARY = 2;
    public static final int KIND_TYPED = 3;

    /** "PCSI" read little-endian. */
    public static final int INDEX_MAGIC = 0x49534350;
    public static final int INDEX_HEADER_BYTES = 24;
    public static final int INDEX_ENTRY_BYTES = 40;

    private ArchiveFormat() {
    }
}
