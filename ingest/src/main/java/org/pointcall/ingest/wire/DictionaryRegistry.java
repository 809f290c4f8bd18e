package org.pointcall.ingest.wire;

import java.util.List;
import java.util.concurrent.ConcurrentHashMap;

import org.pointcall.shared.dictionary.ParameterDictionary;

/**
 * Dictionaries a receiver can decode, by {@link ParameterDictionary#hash()}: registered up front (from the local
 * dictionary files) or learnt from announces. Thread-safe; the decoder looks here only when a stream's hash
 * changes, never per packet.
 */
public final class DictionaryRegistry {
    private final ConcurrentHashMap<Long, ParameterDictionary> byHash = new ConcurrentHashMap<>();

    public DictionaryRegistry() {
    }

    public DictionaryRegistry(List<ParameterDictionary> dictionaries) {
        dictionaries.forEach(this::register);
    }

    public void register(ParameterDictionary dictionary) {
        byHash.put(dictionary.hash(), dictionary);
    }

    /** The dictionary with this hash, or null. */
    public ParameterDictionary find(long hash) {
        return byHash.get(hash);
    }

    public int size() {
        return byHash.size();
    }
}
