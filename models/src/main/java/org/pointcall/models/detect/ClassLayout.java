package org.pointcall.models.detect;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashSet;
import java.util.List;
import java.util.Objects;
import java.util.Set;

import org.pointcall.shared.error.PointcallException;
import org.pointcall.shared.kind.ManoeuvreKind;

/**
 * What each entry of a class-probability vector is: {@code none} (no test point) or a manoeuvre kind, in the
 * classifier's order. Immutable.
 */
public final class ClassLayout {
    /** Name of the class "no test point". */
    public static final String NONE = "none";

    private final List<String> names;
    private final ManoeuvreKind[] kinds;
    private final int[] indexOfKind;
    private final int noneIndex;

    private ClassLayout(List<String> names) {
        this.names = List.copyOf(names);
        this.kinds = new ManoeuvreKind[names.size()];
        this.indexOfKind = new int[ManoeuvreKind.values().length];
        Arrays.fill(indexOfKind, -1);
        int none = -1;
        Set<String> seen = new HashSet<>();
        List<String> unknown = new ArrayList<>();
        for (int i = 0; i < names.size(); i++) {
            String n = Objects.requireNonNull(names.get(i), "class name");
            if (!seen.add(n)) {
                throw new PointcallException("class '" + n + "' appears twice in the class list " + names);
            }
            if (n.equals(NONE)) {
                none = i;
                continue;
            }
            ManoeuvreKind k = ManoeuvreKind.byKey(n).orElse(null);
            if (k == null) {
                unknown.add(n);
                continue;
            }
            kinds[i] = k;
            indexOfKind[k.ordinal()] = i;
        }
        if (!unknown.isEmpty()) {
            throw new PointcallException("unknown classes " + unknown + " in the class list; known: " + NONE + ", "
                    + ManoeuvreKind.keys());
        }
        if (seen.size() - (none >= 0 ? 1 : 0) == 0) {
            throw new PointcallException("the class list needs at least one manoeuvre kind, got " + names);
        }
        this.noneIndex = none;
    }

    /** {@code none} first, then every kind in {@link ManoeuvreKind} declaration order. */
    public static ClassLayout standard() {
        List<String> n = new ArrayList<>();
        n.add(NONE);
        for (ManoeuvreKind k : ManoeuvreKind.values()) {
            n.add(k.key());
        }
        return new ClassLayout(n);
    }

    /**
     * A layout from class names in vector order: {@code none} and kind keys, each at most once.
     *
     * @throws PointcallException naming unknown or repeated classes
     */
    public static ClassLayout of(List<String> classNames) {
        return new ClassLayout(Objects.requireNonNull(classNames, "classNames"));
    }

    /** Length of the probability vector. */
    public int size() {
        return names.size();
    }

    public List<String> names() {
        return names;
    }

    public String name(int index) {
        return names.get(index);
    }

    /** The kind at {@code index}, or null for {@code none}. */
    public ManoeuvreKind kind(int index) {
        return kinds[index];
    }

    /** Index of a kind, or -1 when the classifier does not know it. */
    public int indexOf(ManoeuvreKind kind) {
        return indexOfKind[kind.ordinal()];
    }

    /** Index of {@code none}, or -1 when the layout has none. */
    public int noneIndex() {
        return noneIndex;
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof ClassLayout c && c.names.equals(names);
    }

    @Override
    public int hashCode() {
        return names.hashCode();
    }

    @Override
    public String toString() {
        return "ClassLayout" + names;
    }
}
