package org.pointcall.shared.card;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.Random;

import org.junit.jupiter.api.Test;
import org.pointcall.shared.units.Unit;

class DecimalsTest {

    @Test
    void shortestDecimalThatConvertsBackExactly() {
        assertEquals("250", Decimals.inUnit(Unit.KNOT.toSi(250), Unit.KNOT, false));
        assertEquals("0.25", Decimals.inUnit(Unit.KNOT_PER_SECOND.deltaToSi(0.25), Unit.KNOT_PER_SECOND, true));
        assertEquals("760", Decimals.inUnit(Unit.DEGREE_CELSIUS.toSi(760), Unit.DEGREE_CELSIUS, false));
        assertEquals("-56.5", Decimals.inUnit(Unit.DEGREE_CELSIUS.toSi(-56.5), Unit.DEGREE_CELSIUS, false));
        assertEquals("-.inf", Decimals.inUnit(Double.NEGATIVE_INFINITY, Unit.FOOT, false));
    }

    @Test
    void seededRandomValuesInEveryUnitComeBackToTheSameSiBits() {
        Random rnd = new Random(99);
        for (int i = 0; i < 20000; i++) {
            Unit u = Unit.values()[rnd.nextInt(Unit.values().length)];
            double v = rnd.nextInt(4) == 0 ? Math.round(rnd.nextGaussian() * 1e5) / 100.0
                    : rnd.nextGaussian() * Math.pow(10, rnd.nextInt(20) - 10);
            boolean delta = rnd.nextBoolean();
            double si = delta ? u.deltaToSi(v) : u.toSi(v);
            String text = Decimals.inUnit(si, u, delta);
            double back = Double.parseDouble(text);
            assertEquals(si, delta ? u.deltaToSi(back) : u.toSi(back), 0.0, u + " " + v + " -> " + text);
        }
    }
}
