package org.pointcall.shared.dictionary;

import java.util.ArrayList;
import java.util.List;

import org.pointcall.shared.units.Dimension;
import org.pointcall.shared.units.Unit;

/**
 * What the loaders need to know about dimensions: how one reads in a message, which dimensions a rate of change of
 * a quantity may be written in, and which units belong to a dimension.
 */
public final class DimensionRules {
    private DimensionRules() {
    }

    /** The dimension as a noun with its article, for messages ("a pressure", "an angle"). */
    public static String phrase(Dimension d) {
        switch (d) {
            case DIMENSIONLESS: return "a dimensionless number";
            case LENGTH: return "a length";
            case SPEED: return "a speed";
            case ACCELERATION: return "an acceleration";
            case LOAD_FACTOR: return "a load factor";
            case ANGLE: return "an angle";
            case ANGULAR_RATE: return "an angular rate";
            case PRESSURE: return "a pressure";
            case TEMPERATURE: return "a temperature";
            case DENSITY: return "a density";
            case TIME: return "a time";
            case FORCE: return "a force";
            case MASS: return "a mass";
            case FRACTION: return "a fraction";
            case RATE_OF_SPEED: return "a rate of change of speed";
            case MASS_FLOW: return "a mass flow";
            default: return d.name().toLowerCase(java.util.Locale.ROOT);
        }
    }

    /**
     * Dimensions in which the time derivative of a quantity of dimension {@code d} may be written: a length per
     * second is a speed (ft/min), a speed per second a rate of change of speed (kt/s) or an acceleration (m/s^2),
     * an angle per second an angular rate (deg/s). Empty when no unit exists for it.
     */
    public static List<Dimension> perSecond(Dimension d) {
        switch (d) {
            case LENGTH: return List.of(Dimension.SPEED);
            case SPEED: return List.of(Dimension.RATE_OF_SPEED, Dimension.ACCELERATION);
            case ANGLE: return List.of(Dimension.ANGULAR_RATE);
            default: return List.of();
        }
    }

    /** The units of a dimension, by symbol, in declaration order. */
    public static List<String> symbols(Dimension d) {
        List<String> out = new ArrayList<>();
        for (Unit u : Unit.values()) {
            if (u.dimension() == d) {
                out.add(u.symbol());
            }
        }
        return out;
    }
}
