package org.pointcall.models.modelfile;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;

import org.junit.jupiter.api.Test;
import org.pointcall.shared.dictionary.Parameter;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.error.InputRejectedException;
import org.pointcall.shared.units.Unit;

class ModelRequirementsTest {
    private static final ModelRequirements NEEDS = new ModelRequirements(List.of(
            new RequiredParameter("KCAS", Unit.KNOT), new RequiredParameter("AoA", Unit.DEGREE),
            new RequiredParameter("Nz", Unit.G)));

    private static Parameter p(String name, Unit unit) {
        return new Parameter(name, unit, "", 20, -1e6, 1e6, null, null, null);
    }

    @Test
    void aSourceWithEveryParameterBindsAndConvertibleUnitsAreFine() {
        ParameterDictionary dict = new ParameterDictionary("demo-a", List.of(p("Hp", Unit.FOOT),
                p("Nz", Unit.G), p("KCAS", Unit.METRE_PER_SECOND), p("AoA", Unit.DEGREE)));
        List<BoundParameter> bound = NEEDS.check(dict, "detector.model");
        assertEquals(List.of(new BoundParameter("KCAS", 2, Unit.KNOT, Unit.METRE_PER_SECOND),
                new BoundParameter("AoA", 3, Unit.DEGREE, Unit.DEGREE),
                new BoundParameter("Nz", 1, Unit.G, Unit.G)), bound);
        assertTrue(bound.get(0).needsConversion());
        assertFalse(bound.get(1).needsConversion());
    }

    @Test
    void aSourceLackingAParameterOrCarryingAnotherDimensionIsRefusedNamingEach() {
        ParameterDictionary dict = new ParameterDictionary("demo-b", List.of(p("KCAS", Unit.FOOT),
                p("Nz", Unit.G)));
        InputRejectedException e = assertThrows(InputRejectedException.class,
                () -> NEEDS.check(dict, "detector.model"));
        assertEquals(2, e.problems().size());
        assertEquals("detector.model: the model needs parameter 'KCAS' in kt (speed), but dictionary 'demo-b' has it "
                + "in ft (length), which cannot be converted", e.problems().get(0).toString());
        assertEquals("detector.model: the model needs parameter 'AoA' in deg (angle), which dictionary 'demo-b' does "
                + "not have; add it to the dictionary or use a model trained without it",
                e.problems().get(1).toString());
    }
}
