package org.pointcall.shared.card;

import java.util.List;
import java.util.Objects;
import java.util.regex.Pattern;

import org.pointcall.shared.kind.ManoeuvreKind;
import org.pointcall.shared.kind.MetricSpec;

/**
 * One test point of a card: the manoeuvre to fly and the bands it is judged by.
 *
 * @param id     unique in the card; letters, digits, '-', '_' and '.'
 * @param kind   the manoeuvre
 * @param title  one line for the screen
 * @param config configuration notes (gear, flaps, power, stores), may be empty
 * @param holdS  how long to hold the condition, seconds; NaN when the card gives none
 * @param bands  tolerance bands, in card order
 */
public record TestPoint(String id, ManoeuvreKind kind, String title, String config, double holdS, List<Band> bands) {
    static final Pattern ID = Pattern.compile("[A-Za-z0-9][A-Za-z0-9_.-]*");

    public TestPoint {
        Objects.requireNonNull(kind, "kind");
        if (id == null || !ID.matcher(id).matches()) {
            throw new IllegalArgumentException("point id '" + id
                    + "' must start with a letter or digit and hold only letters, digits, '-', '_' and '.'");
        }
        if (title == null || title.isBlank()) {
            throw new IllegalArgumentException("point " + id + " needs a title");
        }
        config = config == null ? "" : config;
        if (!Double.isNaN(holdS) && !(holdS > 0 && Double.isFinite(holdS))) {
            throw new IllegalArgumentException("hold time of " + id + " must be a positive number of seconds");
        }
        bands = List.copyOf(bands);
        for (Band b : bands) {
            if (b.instant() != null && !kind.hasInstant(b.instant())) {
                throw new IllegalArgumentException("band on " + b.subject() + ": " + kind.key()
                        + " has no key instant " + b.instant());
            }
            if (b.metric() != null) {
                MetricSpec ms = kind.metric(b.metric()).orElseThrow(() -> new IllegalArgumentException(
                        kind.key() + " has no metric " + b.metric()));
                if (ms.unit().dimension() != b.unit().dimension()) {
                    throw new IllegalArgumentException("band on " + b.metric() + " is in " + b.unit().symbol()
                            + ", not in a unit of " + ms.unit().symbol());
                }
            }
        }
    }

    public boolean hasHold() {
        return !Double.isNaN(holdS);
    }
}
