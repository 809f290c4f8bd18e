package org.pointcall.shared.kind;

import java.util.Objects;
import java.util.regex.Pattern;

import org.pointcall.shared.units.Unit;

/**
 * One result a manoeuvre kind's analysis reports, and that a card band may bound.
 *
 * @param name        key used in card files ({@code stall-kcas}); lower case words joined by '-'
 * @param unit        the unit the analysis reports it in (a card band may use any unit of the same dimension)
 * @param description plain words, including the sign convention where one is needed
 */
public record MetricSpec(String name, Unit unit, String description) {
    private static final Pattern KEY = Pattern.compile("[a-z][a-z0-9]*(-[a-z0-9]+)*");

    public MetricSpec {
        Objects.requireNonNull(unit, "unit");
        Objects.requireNonNull(description, "description");
        if (name == null || !KEY.matcher(name).matches()) {
            throw new IllegalArgumentException("metric name '" + name + "' must be lower-case words joined by '-'");
        }
    }
}
