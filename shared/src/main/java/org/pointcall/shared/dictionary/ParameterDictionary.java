package org.pointcall.shared.dictionary;

import java.nio.charset.StandardCharsets;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;

/**
 * The ordered list of a stream's parameters. A parameter's index is its slot in every frame. Everything downstream
 * resolves names to indices once, at bind time, through {@link #indexOf(String)}.
 */
public final class ParameterDictionary {
    private final String name;
    private final List<Parameter> parameters;
    private final Map<String, Integer> index;
    private final long hash;

    public ParameterDictionary(String name, List<Parameter> parameters) {
        this.name = Objects.requireNonNull(name, "name");
        this.parameters = List.copyOf(parameters);
        if (this.parameters.isEmpty()) {
            throw new IllegalArgumentException("a dictionary needs at least one parameter");
        }
        Map<String, Integer> idx = new HashMap<>();
        for (int i = 0; i < this.parameters.size(); i++) {
            if (idx.put(this.parameters.get(i).name(), i) != null) {
                throw new IllegalArgumentException("duplicate parameter " + this.parameters.get(i).name());
            }
        }
        this.index = Map.copyOf(idx);
        this.hash = computeHash(this.parameters);
    }

    public String name() {
        return name;
    }

    public int size() {
        return parameters.size();
    }

    public Parameter parameter(int slot) {
        return parameters.get(slot);
    }

    public List<Parameter> parameters() {
        return parameters;
    }

    /** Slot of the named parameter, or -1. */
    public int indexOf(String parameterName) {
        Integer i = index.get(parameterName);
        return i == null ? -1 : i;
    }

    public Optional<Parameter> find(String parameterName) {
        int i = indexOf(parameterName);
        return i < 0 ? Optional.empty() : Optional.of(parameters.get(i));
    }

    /**
     * 64-bit identity of the slot layout: names, units and order (first 8 bytes of SHA-256 over them). Two streams
     * with the same hash carry the same meaning in the same slots. Descriptions and ranges do not change it.
     */
    public long hash() {
        return hash;
    }

    private static long computeHash(List<Parameter> ps) {
        StringBuilder sb = new StringBuilder();
        for (Parameter p : ps) {
            sb.append(p.name()).append('\u001f').append(p.unit().symbol()).append('\u001e');
        }
        try {
            byte[] d = MessageDigest.getInstance("SHA-256").digest(sb.toString().getBytes(StandardCharsets.UTF_8));
            long h = 0;
            for (int i = 0; i < 8; i++) {
                h = (h << 8) | (d[i] & 0xff);
            }
            return h;
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("SHA-256 is required of every Java platform", e);
        }
    }

    /** Equal when the name and every parameter, in order, are equal (files round-trip to an equal dictionary). */
    @Override
    public boolean equals(Object o) {
        return o instanceof ParameterDictionary d && name.equals(d.name) && parameters.equals(d.parameters);
    }

    @Override
    public int hashCode() {
        return 31 * name.hashCode() + parameters.hashCode();
    }

    @Override
    public String toString() {
        return "ParameterDictionary[" + name + ", " + parameters.size() + " parameters, hash "
                + Long.toHexString(hash) + "]";
    }
}
