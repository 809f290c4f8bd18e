package org.pointcall.shared.card;

import java.util.HashSet;
import java.util.List;
import java.util.Optional;
import java.util.Set;

/**
 * The plan of one sortie: its test points in the order they are to be flown, and the limits that hold all sortie.
 *
 * @param sortie   sortie identifier
 * @param airframe name of the airframe profile the card is written for
 * @param area     range or working area, may be empty
 * @param notes    free text (crew roles, weather minima, brief items), may be empty
 * @param limits   sortie-wide safety limits
 * @param points   test points, at least one, ids unique
 */
public record TestCard(String sortie, String airframe, String area, String notes, List<SafetyLimit> limits,
                       List<TestPoint> points) {
    public TestCard {
        if (sortie == null || sortie.isBlank()) {
            throw new IllegalArgumentException("a card needs a sortie id");
        }
        if (airframe == null || airframe.isBlank()) {
            throw new IllegalArgumentException("a card needs an airframe");
        }
        area = area == null ? "" : area;
        notes = notes == null ? "" : notes;
        limits = List.copyOf(limits);
        points = List.copyOf(points);
        if (points.isEmpty()) {
            throw new IllegalArgumentException("a card needs at least one test point");
        }
        Set<String> ids = new HashSet<>();
        for (TestPoint p : points) {
            if (!ids.add(p.id())) {
                throw new IllegalArgumentException("duplicate point id " + p.id());
            }
        }
    }

    public Optional<TestPoint> point(String id) {
        for (TestPoint p : points) {
            if (p.id().equals(id)) {
                return Optional.of(p);
            }
        }
        return Optional.empty();
    }
}
