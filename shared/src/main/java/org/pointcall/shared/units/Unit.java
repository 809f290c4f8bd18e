package org.pointcall.shared.units;

import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.TreeMap;

/**
 * Units a user may write in a dictionary, a card or a file header. Each converts linearly (plus an offset for the
 * temperature scales) to the SI unit of its dimension. Symbols are the usual ones of the trade; aliases cover common
 * spellings.
 */
public enum Unit {
    NONE("1", Dimension.DIMENSIONLESS, 1.0, 0.0, "-", "none", "count"),
    MACH("Mach", Dimension.DIMENSIONLESS, 1.0, 0.0, "M"),
    PERCENT("%", Dimension.FRACTION, 0.01, 0.0, "pct", "percent"),
    FRACTION("fraction", Dimension.FRACTION, 1.0, 0.0),

    METRE("m", Dimension.LENGTH, 1.0, 0.0, "meter", "metre"),
    FOOT("ft", Dimension.LENGTH, Units.M_PER_FT, 0.0, "feet", "foot"),
    NAUTICAL_MILE("nmi", Dimension.LENGTH, Units.M_PER_NMI, 0.0, "NM"),

    METRE_PER_SECOND("m/s", Dimension.SPEED, 1.0, 0.0, "mps"),
    KNOT("kt", Dimension.SPEED, Units.MPS_PER_KT, 0.0, "kn", "kts", "knot", "knots"),
    FOOT_PER_MINUTE("ft/min", Dimension.SPEED, Units.M_PER_FT / 60.0, 0.0, "fpm"),
    FOOT_PER_SECOND("ft/s", Dimension.SPEED, Units.M_PER_FT, 0.0, "fps"),

    KNOT_PER_SECOND("kt/s", Dimension.RATE_OF_SPEED, Units.MPS_PER_KT, 0.0),
    METRE_PER_SECOND_SQUARED_RATE("m/s/s", Dimension.RATE_OF_SPEED, 1.0, 0.0),
    KNOT_PER_MINUTE("kt/min", Dimension.RATE_OF_SPEED, Units.MPS_PER_KT / 60.0, 0.0),

    METRE_PER_SECOND_SQUARED("m/s^2", Dimension.ACCELERATION, 1.0, 0.0, "m/s2"),

    G("g", Dimension.LOAD_FACTOR, 1.0, 0.0, "G"),

    DEGREE("deg", Dimension.ANGLE, Units.RAD_PER_DEG, 0.0, "degree", "degrees", "°"),
    RADIAN("rad", Dimension.ANGLE, 1.0, 0.0, "radian", "radians"),

    DEGREE_PER_SECOND("deg/s", Dimension.ANGULAR_RATE, Units.RAD_PER_DEG, 0.0, "dps"),
    RADIAN_PER_SECOND("rad/s", Dimension.ANGULAR_RATE, 1.0, 0.0),
    DEGREE_PER_MINUTE("deg/min", Dimension.ANGULAR_RATE, Units.RAD_PER_DEG / 60.0, 0.0),

    PASCAL("Pa", Dimension.PRESSURE, 1.0, 0.0, "pa"),
    HECTOPASCAL("hPa", Dimension.PRESSURE, Units.PA_PER_HPA, 0.0, "mbar", "hpa"),
    INCH_OF_MERCURY("inHg", Dimension.PRESSURE, Units.PA_PER_INHG, 0.0, "inhg"),
    POUND_PER_SQUARE_FOOT("psf", Dimension.PRESSURE, Units.PA_PER_PSF, 0.0, "lbf/ft^2"),
    POUND_PER_SQUARE_INCH("psi", Dimension.PRESSURE, Units.PA_PER_PSI, 0.0, "lbf/in^2"),

    KELVIN("K", Dimension.TEMPERATURE, 1.0, 0.0, "kelvin"),
    DEGREE_CELSIUS("degC", Dimension.TEMPERATURE, 1.0, Units.K_AT_0_DEGC, "C", "°C", "celsius"),

    KILOGRAM_PER_CUBIC_METRE("kg/m^3", Dimension.DENSITY, 1.0, 0.0, "kg/m3"),

    SECOND("s", Dimension.TIME, 1.0, 0.0, "sec", "seconds"),
    MINUTE("min", Dimension.TIME, 60.0, 0.0),

    NEWTON("N", Dimension.FORCE, 1.0, 0.0),
    POUND_FORCE("lbf", Dimension.FORCE, Units.N_PER_LBF, 0.0),

    KILOGRAM("kg", Dimension.MASS, 1.0, 0.0),
    POUND("lb", Dimension.MASS, Units.KG_PER_LB, 0.0, "lbm"),

    KILOGRAM_PER_SECOND("kg/s", Dimension.MASS_FLOW, 1.0, 0.0),
    KILOGRAM_PER_HOUR("kg/h", Dimension.MASS_FLOW, 1.0 / 3600.0, 0.0),
    POUND_PER_HOUR("lb/h", Dimension.MASS_FLOW, Units.KG_PER_LB / 3600.0, 0.0, "pph", "lb/hr");

    private static final Map<String, Unit> BY_SYMBOL = new TreeMap<>();

    static {
        for (Unit u : values()) {
            BY_SYMBOL.put(u.symbol, u);
            for (String a : u.aliases) {
                BY_SYMBOL.putIfAbsent(a, u);
            }
        }
    }

    private final String symbol;
    private final Dimension dimension;
    private final double siPerUnit;
    private final double siOffset;
    private final String[] aliases;

    Unit(String symbol, Dimension dimension, double siPerUnit, double siOffset, String... aliases) {
        this.symbol = symbol;
        this.dimension = dimension;
        this.siPerUnit = siPerUnit;
        this.siOffset = siOffset;
        this.aliases = aliases;
    }

    public String symbol() {
        return symbol;
    }

    public Dimension dimension() {
        return dimension;
    }

    /** Value in this unit to the SI unit of its dimension. */
    public double toSi(double value) {
        return value * siPerUnit + siOffset;
    }

    /** Value in the SI unit of this dimension to this unit. */
    public double fromSi(double si) {
        return (si - siOffset) / siPerUnit;
    }

    /** Converts a difference (a band width, a rate) rather than an absolute value: offsets do not apply. */
    public double deltaToSi(double delta) {
        return delta * siPerUnit;
    }

    public double deltaFromSi(double deltaSi) {
        return deltaSi / siPerUnit;
    }

    /** Converts {@code value} in this unit to {@code target}; throws when the dimensions differ. */
    public double convert(double value, Unit target) {
        if (target.dimension != dimension) {
            throw new IllegalArgumentException("cannot convert " + symbol + " (" + dimension + ") to " + target.symbol
                    + " (" + target.dimension + ")");
        }
        return target.fromSi(toSi(value));
    }

    /** Looks a unit up by symbol or alias, exactly first and then ignoring case. */
    public static Optional<Unit> bySymbol(String text) {
        if (text == null) {
            return Optional.empty();
        }
        String t = text.trim();
        Unit u = BY_SYMBOL.get(t);
        if (u == null) {
            for (Map.Entry<String, Unit> e : BY_SYMBOL.entrySet()) {
                if (e.getKey().toLowerCase(Locale.ROOT).equals(t.toLowerCase(Locale.ROOT))) {
                    return Optional.of(e.getValue());
                }
            }
        }
        return Optional.ofNullable(u);
    }

    /** All symbols, for error messages that list what is accepted. */
    public static String knownSymbols() {
        StringBuilder sb = new StringBuilder();
        for (Unit u : values()) {
            if (sb.length() > 0) {
                sb.append(", ");
            }
            sb.append(u.symbol);
        }
        return sb.toString();
    }
}
