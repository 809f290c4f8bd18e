package org.pointcall.models.detect;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import java.util.Set;

import org.junit.jupiter.api.Test;
import org.pointcall.ingest.frame.Frame;
import org.pointcall.shared.dictionary.Parameter;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.error.PointcallException;
import org.pointcall.shared.kind.ManoeuvreKind;
import org.pointcall.shared.units.Unit;

class SettingsAndBindingTest {

    @Test
    void settingsListEveryProblemInOneMessage() {
        DetectorSettings d = DetectorSettings.defaults();
        Map<ManoeuvreKind, Double> md = new EnumMap<>(d.minDurationS());
        md.remove(ManoeuvreKind.PHUGOID);
        PointcallException e = assertThrows(PointcallException.class, () -> new DetectorSettings(d.smoothing(),
                -1, 0.3, d.enterS(), 0.5, d.leaveS(), 0.6, d.edgeDebounceS(), d.maxRefineS(), d.mergeGapS(),
                d.switchMargin(), d.switches(), md, d.maxTickGapS(), Set.of("loop-pitch-45"), d.guards(),
                d.boundaries()));
        String m = e.getMessage();
        assertTrue(m.contains("smoothingS must be a positive number"), m);
        assertTrue(m.contains("leaveProbability (0.5) must be below enterProbability (0.3)"), m);
        assertTrue(m.contains("edgeProbability (0.6) must not exceed leaveProbability (0.5)"), m);
        assertTrue(m.contains("minDurationS has no value for phugoid"), m);
        assertTrue(m.contains("unknown rules [loop-pitch-45]"), m);
    }

    @Test
    void copiesChangeOneThingAndValidate() {
        DetectorSettings d = DetectorSettings.defaults();
        DetectorSettings e = d.withMinDurationS(ManoeuvreKind.LOOP, 3.0);
        assertEquals(3.0, e.minDurationS(ManoeuvreKind.LOOP));
        assertEquals(d.minDurationS(ManoeuvreKind.PHUGOID), e.minDurationS(ManoeuvreKind.PHUGOID));
        assertEquals(8.0, d.minDurationS(ManoeuvreKind.LOOP), "the original is unchanged");
        assertFalse(d.withDisabledRules(Set.of(GuardRules.ROLL_360)).ruleEnabled(GuardRules.ROLL_360));
        assertThrows(PointcallException.class, () -> d.withEnter(0.3, 0.5));
        assertThrows(PointcallException.class, () -> d.withGuards(d.guards().withWindupNz(0.9)));
        assertTrue(d.allowsSwitch(ManoeuvreKind.LEVEL_ACCEL, ManoeuvreKind.STALL_LEVEL));
        assertFalse(d.allowsSwitch(ManoeuvreKind.STALL_LEVEL, ManoeuvreKind.LEVEL_ACCEL));
        assertEquals(new KindSwitch(ManoeuvreKind.WIND_UP_TURN, ManoeuvreKind.STALL_TURN),
                KindSwitch.parse("wind-up-turn > stall-turn"));
        assertThrows(IllegalArgumentException.class, () -> KindSwitch.parse("loop>barrel-roll"));
    }

    @Test
    void bindingConvertsToSiAndSkipsAbsentValues() {
        ParameterDictionary d = new ParameterDictionary("bind", List.of(
                new Parameter("Hp", Unit.FOOT, "", 10, -2000, 60000, null, null, null),
                new Parameter("KCAS", Unit.KNOT, "", 10, 0, 700, null, null, null),
                new Parameter("Bank", Unit.DEGREE, "", 10, -180, 180, null, null, null),
                new Parameter("Q", Unit.RADIAN_PER_SECOND, "", 10, -5, 5, null, null, null)));
        StateBinder b = StateBinder.bind(d, Map.of(PhysicalQuantity.ROLL, "Bank"));
        assertTrue(b.isBound(PhysicalQuantity.ROLL));
        assertEquals(2, b.slot(PhysicalQuantity.ROLL));
        assertFalse(b.isBound(PhysicalQuantity.AOA));
        assertTrue(b.missing().contains(PhysicalQuantity.PITCH));
        Frame f = Frame.forDictionary(d);
        PhysicalState s = new PhysicalState();
        f.timeNs(1_000L);
        f.value(0, 10000.0);
        f.value(1, 250.0);
        f.value(2, -90.0);
        f.value(3, 0.1);
        b.fill(f, s);
        // exact definitions: 1 ft = 0.3048 m, 1 kt = 1852/3600 m/s (NIST SP 811, Appendix B.8), 1 deg = pi/180
        assertEquals(3048.0, s.hpM(), 1e-9);
        assertEquals(250.0 * 1852.0 / 3600.0, s.casMps(), 1e-12);
        assertEquals(-Math.PI / 2, s.rollRad(), 1e-15);
        assertEquals(0.1, s.qRadS(), 0.0);
        assertTrue(s.fresh(PhysicalQuantity.HP));
        f.clear();
        f.timeNs(2_000L);
        f.value(1, 260.0);
        b.fill(f, s);
        assertFalse(s.fresh(PhysicalQuantity.HP), "Hp not sampled in this frame");
        assertEquals(3048.0, s.hpM(), 1e-9, "but its last value is held");
        assertEquals(1_000L, s.sampledNs(PhysicalQuantity.HP));
        assertTrue(s.fresh(PhysicalQuantity.CAS));
        assertTrue(Double.isNaN(s.aoaRad()));
    }

    @Test
    void bindingRefusesAParameterOfTheWrongDimension() {
        ParameterDictionary d = new ParameterDictionary("bad", List.of(
                new Parameter("AoA", Unit.KNOT, "", 10, 0, 700, null, null, null),
                new Parameter("Nz", Unit.METRE, "", 10, 0, 700, null, null, null)));
        PointcallException e = assertThrows(PointcallException.class, () -> StateBinder.bind(d));
        assertTrue(e.getMessage().contains("parameter 'AoA' is in kt"), e.getMessage());
        assertTrue(e.getMessage().contains("parameter 'Nz' is in m"), e.getMessage());
    }

    @Test
    void classLayoutsNameEveryClassOnce() {
        ClassLayout std = ClassLayout.standard();
        assertEquals(ManoeuvreKind.values().length + 1, std.size());
        assertNull(std.kind(std.noneIndex()));
        assertEquals(ManoeuvreKind.LOOP, std.kind(std.indexOf(ManoeuvreKind.LOOP)));
        ClassLayout some = ClassLayout.of(List.of("loop", "none", "aileron-roll"));
        assertEquals(1, some.noneIndex());
        assertEquals(-1, some.indexOf(ManoeuvreKind.PHUGOID));
        PointcallException e = assertThrows(PointcallException.class,
                () -> ClassLayout.of(List.of("none", "loop", "hammerhead")));
        assertTrue(e.getMessage().contains("unknown classes [hammerhead]"), e.getMessage());
        assertThrows(PointcallException.class, () -> ClassLayout.of(List.of("none")));
        assertThrows(PointcallException.class, () -> ClassLayout.of(List.of("loop", "loop")));
    }

    @Test
    void pointEventsRefuseInconsistentTimes() {
        assertThrows(IllegalArgumentException.class, () -> new PointEvent(PointEvent.Type.ENDED, 1,
                ManoeuvreKind.LOOP, 10, PointEvent.UNKNOWN_NS, 20, 15, 0.5, List.of(), List.of()));
        assertThrows(IllegalArgumentException.class, () -> new PointEvent(PointEvent.Type.BEGUN, 1,
                ManoeuvreKind.LOOP, 10, 12, 20, 20, 0.5, List.of(), List.of()));
        assertThrows(IllegalArgumentException.class, () -> new PointEvent(PointEvent.Type.ENDED, 1,
                ManoeuvreKind.LOOP, 10, 5, 20, 15, 0.5, List.of(), List.of()));
    }
}
