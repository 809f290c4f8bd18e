package org.pointcall.ingest.file;

import java.util.List;

import org.pointcall.shared.dictionary.Calibration;
import org.pointcall.shared.dictionary.Derivation;
import org.pointcall.shared.dictionary.DerivationMethod;
import org.pointcall.shared.dictionary.Parameter;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.units.Unit;

/** The dictionary the file tests read against, built in code; columns named the way a user's export names them. */
final class SortieDictionary {
    static final int KCAS = 0;
    static final int HP = 1;
    static final int AOA = 2;
    static final int NZ = 3;
    static final int OAT = 4;
    static final int MACH = 5;
    static final int PS = 6;
    static final int KTAS = 7;

    private SortieDictionary() {
    }

    static ParameterDictionary create() {
        return new ParameterDictionary("test-airframe", List.of(
                new Parameter("KCAS", Unit.KNOT, "calibrated airspeed", 20, 0, 600, null, null, null),
                new Parameter("Hp", Unit.FOOT, "pressure altitude", 20, -2000, 60000, null, null, null),
                new Parameter("AoA", Unit.DEGREE, "angle of attack", 50, -20, 40, "alpha_deg", null, null),
                new Parameter("Nz", Unit.G, "normal load factor", 50, -5, 10, "NZ", null, null),
                new Parameter("OAT", Unit.DEGREE_CELSIUS, "outside air temperature", 5, -80, 60, null, null, null),
                new Parameter("Mach", Unit.MACH, "Mach number", 20, 0, 3, null, null, null),
                new Parameter("Ps", Unit.PASCAL, "static pressure from transducer counts", 20, 0, 120000,
                        "PS_COUNTS", new Calibration.Polynomial(new double[] {100.0, 2.0}), null),
                new Parameter("KTAS", Unit.KNOT, "true airspeed", 20, 0, 1000, null, null,
                        new Derivation(DerivationMethod.TRUE_AIRSPEED, List.of("Mach", "OAT")))));
    }
}
