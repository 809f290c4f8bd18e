package org.pointcall.shared.card;

import java.math.BigDecimal;
import java.math.MathContext;

import org.pointcall.shared.units.Unit;
import org.pointcall.shared.yaml.YamlWriter;

/**
 * Writes an SI value back in a user's unit as the shortest decimal that converts to exactly the same SI double, so
 * that a card read, written and read again is equal to the first (and shows "250", not "250.00000000000003").
 */
final class Decimals {
    private Decimals() {
    }

    /** An absolute value ({@code delta} false) or a difference ({@code delta} true, no offset). */
    static String inUnit(double si, Unit unit, boolean delta) {
        if (Double.isInfinite(si)) {
            return YamlWriter.number(si);
        }
        double x = delta ? unit.deltaFromSi(si) : unit.fromSi(si);
        for (int digits = 1; digits <= 17; digits++) {
            double c = new BigDecimal(x).round(new MathContext(digits)).doubleValue();
            if (back(c, unit, delta) == si) {
                return YamlWriter.number(c);
            }
        }
        // the value read from a file is within a few ulps of x; look there
        double up = x;
        double down = x;
        for (int i = 0; i < 16; i++) {
            up = Math.nextUp(up);
            down = Math.nextDown(down);
            if (back(up, unit, delta) == si) {
                return YamlWriter.number(up);
            }
            if (back(down, unit, delta) == si) {
                return YamlWriter.number(down);
            }
        }
        // only an SI value computed elsewhere can have no decimal preimage; the nearest is the honest answer then
        return YamlWriter.number(x);
    }

    private static double back(double v, Unit unit, boolean delta) {
        return delta ? unit.deltaToSi(v) : unit.toSi(v);
    }
}
