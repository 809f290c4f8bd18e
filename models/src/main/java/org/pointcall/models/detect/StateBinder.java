package org.pointcall.models.detect;

import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;

import org.pointcall.ingest.frame.Frame;
import org.pointcall.shared.dictionary.Parameter;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.error.PointcallException;
import org.pointcall.shared.units.Unit;

/**
 * Fills a {@link PhysicalState} from frames. Names are resolved to frame slots once, here; per frame the work is one
 * read and one unit conversion per bound quantity, nothing allocated. A quantity whose parameter the dictionary does
 * not hold stays NaN, and the rules that need it say they could not be checked.
 */
public final class StateBinder {
    private static final PhysicalQuantity[] QUANTITIES = PhysicalQuantity.values();

    private final int[] slots = new int[PhysicalQuantity.COUNT];
    private final Unit[] units = new Unit[PhysicalQuantity.COUNT];
    private final String[] names = new String[PhysicalQuantity.COUNT];
    private final int frameSlots;

    private StateBinder(ParameterDictionary dictionary, Map<PhysicalQuantity, String> overrides) {
        frameSlots = dictionary.size();
        List<String> wrong = new ArrayList<>();
        for (PhysicalQuantity q : PhysicalQuantity.values()) {
            String name = overrides.getOrDefault(q, q.defaultName());
            names[q.ordinal()] = name;
            int slot = dictionary.indexOf(name);
            slots[q.ordinal()] = slot;
            if (slot >= 0) {
                Parameter p = dictionary.parameter(slot);
                if (!q.dimensions().contains(p.unit().dimension())) {
                    wrong.add("parameter '" + name + "' is in " + p.unit().symbol() + " (" + p.unit().dimension()
                            + "), but " + q + " needs " + q.dimensions());
                }
                units[q.ordinal()] = p.unit();
            }
        }
        if (!wrong.isEmpty()) {
            throw new PointcallException("dictionary '" + dictionary.name() + "' cannot feed the detector: "
                    + String.join("; ", wrong));
        }
    }

    /** Binds every quantity to its {@link PhysicalQuantity#defaultName() default name}. */
    public static StateBinder bind(ParameterDictionary dictionary) {
        return bind(dictionary, Map.of());
    }

    /**
     * Binds with some names replaced ({@code ROLL -> "Bank"}).
     *
     * @throws PointcallException naming every bound parameter whose unit has the wrong dimension
     */
    public static StateBinder bind(ParameterDictionary dictionary, Map<PhysicalQuantity, String> names) {
        Objects.requireNonNull(dictionary, "dictionary");
        Map<PhysicalQuantity, String> copy = new EnumMap<>(PhysicalQuantity.class);
        copy.putAll(Objects.requireNonNull(names, "names"));
        return new StateBinder(dictionary, copy);
    }

    /** Moves the state to the frame's time and copies every finite bound value, converted to SI. */
    public void fill(Frame frame, PhysicalState state) {
        if (frame.slots() != frameSlots) {
            throw new IllegalArgumentException("frame has " + frame.slots() + " slots, the bound dictionary "
                    + frameSlots);
        }
        state.advance(frame.timeNs());
        PhysicalQuantity[] qs = QUANTITIES;
        for (int i = 0; i < qs.length; i++) {
            int slot = slots[i];
            if (slot >= 0) {
                double v = frame.value(slot);
                if (Double.isFinite(v)) {
                    state.set(qs[i], units[i].toSi(v));
                }
            }
        }
    }

    public boolean isBound(PhysicalQuantity q) {
        return slots[q.ordinal()] >= 0;
    }

    /** Frame slot of the quantity, or -1 when the dictionary does not hold it. */
    public int slot(PhysicalQuantity q) {
        return slots[q.ordinal()];
    }

    /** Parameter name the quantity was looked up under. */
    public String parameterName(PhysicalQuantity q) {
        return names[q.ordinal()];
    }

    /** Quantities the dictionary does not hold, in declaration order. */
    public List<PhysicalQuantity> missing() {
        List<PhysicalQuantity> out = new ArrayList<>();
        for (PhysicalQuantity q : QUANTITIES) {
            if (slots[q.ordinal()] < 0) {
                out.add(q);
            }
        }
        return out;
    }
}
