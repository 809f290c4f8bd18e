package org.pointcall.models.modelfile;

import java.io.ObjectInputFilter;
import java.util.Set;

/**
 * The allow-list a model payload is deserialised through. Java deserialisation runs code of every class a stream
 * names, so a file from an untrusted place could otherwise run code: only Smile's own classes, pointcall's
 * classifier wrappers ({@code org.pointcall.models.train.*}), a few basic value and collection types of
 * {@code java.lang} and {@code java.util}, primitives and arrays of allowed types pass, within limits on nesting
 * depth, object count, array length and stream length. Everything else is rejected when its class descriptor is
 * read, before any instance of it exists and before the class is initialised. One filter per stream; it remembers
 * why it rejected.
 */
final class PayloadFilter implements ObjectInputFilter {
    /**
     * Deepest nesting of objects. Smile's trees nest one level per tree level plus about five (a forest of depth-20
     * trees reads 19 deep), so this allows trees far deeper than any we train.
     */
    static final long MAX_DEPTH = 500;
    /** Most object references in one payload. */
    static final long MAX_REFERENCES = 50_000_000;
    /** Longest array. */
    static final long MAX_ARRAY_LENGTH = 200_000_000;

    /** Classes allowed outside {@code smile.*}. */
    static final Set<String> BASICS = Set.of(
            "java.lang.Object", "java.lang.String", "java.lang.Number", "java.lang.Enum",
            "java.lang.Boolean", "java.lang.Byte", "java.lang.Character", "java.lang.Short", "java.lang.Integer",
            "java.lang.Long", "java.lang.Float", "java.lang.Double",
            "java.util.ArrayList", "java.util.LinkedList", "java.util.ArrayDeque", "java.util.HashMap",
            "java.util.LinkedHashMap", "java.util.TreeMap", "java.util.HashSet", "java.util.LinkedHashSet",
            "java.util.TreeSet", "java.util.BitSet", "java.util.Map$Entry", "java.util.Arrays$ArrayList",
            "java.util.CollSer", "java.util.Collections$EmptyList", "java.util.Collections$EmptyMap",
            "java.util.Collections$EmptySet", "java.util.Collections$SingletonList",
            "java.util.Collections$SingletonMap", "java.util.Collections$SingletonSet",
            "java.util.Collections$UnmodifiableCollection", "java.util.Collections$UnmodifiableList",
            "java.util.Collections$UnmodifiableRandomAccessList", "java.util.Collections$UnmodifiableSet",
            "java.util.Collections$UnmodifiableMap");

    /** What the allow-list admits, in words, for messages. */
    static final String ALLOWED = "Smile's classes (smile.*), pointcall's classifiers (org.pointcall.models.train.*), "
            + "basic java.lang and java.util value and collection types, primitives and arrays of these";

    private final long maxStreamBytes;
    private String rejection;

    PayloadFilter(long maxStreamBytes) {
        this.maxStreamBytes = maxStreamBytes;
    }

    /** Whether a class (or an array of it, of any dimension) is on the allow-list. */
    static boolean allowed(Class<?> c) {
        Class<?> e = c;
        while (e.isArray()) {
            e = e.getComponentType();
        }
        return e.isPrimitive() || allowedName(e.getName());
    }

    /**
     * Our own classifier wrappers: they hold only Smile models, primitive arrays and strings, and none of them runs
     * code when read.
     */
    static final String OWN_CLASSES = "org.pointcall.models.train.";

    /** Whether a (non-array) class name is on the allow-list. */
    static boolean allowedName(String name) {
        return name.startsWith("smile.") || name.startsWith(OWN_CLASSES) || BASICS.contains(name);
    }

    @Override
    public Status checkInput(FilterInfo info) {
        if (info.depth() > MAX_DEPTH) {
            return reject("objects nested " + info.depth() + " deep, more than the " + MAX_DEPTH + " allowed");
        }
        if (info.references() > MAX_REFERENCES) {
            return reject("more than " + MAX_REFERENCES + " objects");
        }
        if (info.arrayLength() > MAX_ARRAY_LENGTH) {
            return reject("an array of " + info.arrayLength() + " elements, more than the " + MAX_ARRAY_LENGTH
                    + " allowed");
        }
        if (info.streamBytes() > maxStreamBytes) {
            return reject("more bytes than its declared length");
        }
        Class<?> c = info.serialClass();
        if (c == null || allowed(c)) {
            return Status.ALLOWED;
        }
        return reject("class " + c.getName() + ", which a model file may not hold");
    }

    private Status reject(String why) {
        if (rejection == null) {
            rejection = why;
        }
        return Status.REJECTED;
    }

    /** Why the stream was rejected, or {@code null}. */
    String rejection() {
        return rejection;
    }
}
