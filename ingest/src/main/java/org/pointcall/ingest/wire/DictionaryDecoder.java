package org.pointcall.ingest.wire;

import org.pointcall.shared.dictionary.ParameterDictionary;

/**
 * Reads the dictionary text an announce carries. The wire treats the text as opaque; the application plugs in the
 * reader of its dictionary file format.
 */
@FunctionalInterface
public interface DictionaryDecoder {
    /**
     * @param text   the whole announce text, decoded from UTF-8
     * @param source where it came from, for messages (for example {@code announce from 127.0.0.1:40123 stream 7})
     * @throws RuntimeException with a one-line message when the text is not a valid dictionary; the decoder counts
     *                          it and logs that message
     */
    ParameterDictionary decode(String text, String source);
}
