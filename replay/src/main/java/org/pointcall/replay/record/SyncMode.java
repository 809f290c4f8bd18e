package org.pointcall.replay.record;

/** When the recorder forces written chunks to the device. */
public enum SyncMode {
    /** After every chunk written: the data at risk in a power cut is the chunk being filled. */
    EACH_CHUNK,
    /** Never asks; the operating system writes back when it chooses (a process crash still loses nothing written). */
    OS_DECIDES
}
