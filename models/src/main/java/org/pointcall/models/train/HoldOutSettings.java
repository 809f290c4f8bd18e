package org.pointcall.models.train;

import java.util.List;
import java.util.function.Predicate;

import org.pointcall.models.data.SortieInfo;

/**
 * Which sorties make the held-out test set: those flown by one of {@code airframes} or named in {@code sorties}
 * (for example an airframe the model has never seen). Both empty: no held-out set.
 */
public record HoldOutSettings(List<String> airframes, List<String> sorties) implements Predicate<SortieInfo> {
    public HoldOutSettings {
        airframes = List.copyOf(airframes);
        sorties = List.copyOf(sorties);
    }

    public static HoldOutSettings nothing() {
        return new HoldOutSettings(List.of(), List.of());
    }

    public boolean isEmpty() {
        return airframes.isEmpty() && sorties.isEmpty();
    }

    @Override
    public boolean test(SortieInfo s) {
        return airframes.contains(s.airframe()) || sorties.contains(s.name());
    }

    public String describe() {
        StringBuilder b = new StringBuilder();
        if (!airframes.isEmpty()) {
            b.append("airframes ").append(String.join(", ", airframes));
        }
        if (!sorties.isEmpty()) {
            b.append(b.length() > 0 ? "; " : "").append("sorties ").append(String.join(", ", sorties));
        }
        return b.length() == 0 ? "none" : b.toString();
    }
}
