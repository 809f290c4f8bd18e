package org.pointcall.models.detect;

import java.util.Objects;

import org.pointcall.shared.kind.ManoeuvreKind;

/**
 * Permission for an open point of kind {@code from} to become {@code to} when {@code to} takes over, instead of
 * ending it and beginning another point. For example the slow, level, 1 g entry of a wings-level stall looks like a
 * level acceleration to a classifier until the AoA builds: {@code level-accel > stall-level} keeps it one point.
 */
public record KindSwitch(ManoeuvreKind from, ManoeuvreKind to) {
    public KindSwitch {
        Objects.requireNonNull(from, "from");
        Objects.requireNonNull(to, "to");
        if (from == to) {
            throw new IllegalArgumentException("a kind switch needs two different kinds, got " + from.key());
        }
    }

    /** Parses {@code from>to}, with kind keys ({@code level-accel>stall-level}). */
    public static KindSwitch parse(String text) {
        int i = text.indexOf('>');
        if (i < 0) {
            throw new IllegalArgumentException("kind switch '" + text + "' must read from>to, for example "
                    + "level-accel>stall-level");
        }
        return new KindSwitch(kind(text.substring(0, i).trim(), text), kind(text.substring(i + 1).trim(), text));
    }

    private static ManoeuvreKind kind(String key, String text) {
        return ManoeuvreKind.byKey(key).orElseThrow(() -> new IllegalArgumentException("kind switch '" + text
                + "' names unknown kind '" + key + "'; known: " + ManoeuvreKind.keys()));
    }

    @Override
    public String toString() {
        return from.key() + ">" + to.key();
    }
}
