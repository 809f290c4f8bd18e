package org.pointcall.shared.units;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import org.junit.jupiter.api.Test;

class UnitsTest {

    @Test
    void exactConstantsAreTheDefinedValues() {
        // NIST SP 811 (2008), Appendix B.8: exact by definition, so compared with no tolerance at all
        assertEquals(0.3048, Units.M_PER_FT, 0.0);
        assertEquals(1852.0, Units.M_PER_NMI, 0.0);
        assertEquals(1852.0 / 3600.0, Units.MPS_PER_KT, 0.0);
        assertEquals(0.45359237, Units.KG_PER_LB, 0.0);
        assertEquals(4.4482216152605, Units.N_PER_LBF, 0.0);
        assertEquals(100.0, Units.PA_PER_HPA, 0.0);
        // NIST SP 811 (2008), standard acceleration of gravity, exact
        assertEquals(9.80665, Units.G0_MPS2, 0.0);
        assertEquals(273.15, Units.K_AT_0_DEGC, 0.0);
    }

    @Test
    void derivedConstantsAgreeWithTheirDefinitions() {
        // NIST SP 811 (2008), B.8: the pound-force is the avoirdupois pound times standard gravity, exactly; the
        // decimal product has 14 digits, so one ulp of rounding is all that may separate them
        assertEquals(Units.KG_PER_LB * Units.G0_MPS2, Units.N_PER_LBF, Math.ulp(Units.N_PER_LBF));
        // NIST SP 811 (2008), B.8: psi 6.894 757 E+03 Pa and lbf/ft^2 4.788 026 E+01 Pa, 7 printed digits
        assertEquals(6894.757, Units.PA_PER_PSI, 0.0005);
        assertEquals(47.88026, Units.PA_PER_PSF, 0.000005);
        // NIST SP 811 (2008), B.8: inch of mercury, conventional, 3.386 389 E+03 Pa (7 printed digits). It is
        // 25.4 mm of the conventional millimetre of mercury, 133.322 387 415 Pa ([memory]), which must round to it
        assertEquals(3386.389, Units.PA_PER_INHG, 0.0005);
        assertEquals(25.4 * 133.322387415, Units.PA_PER_INHG, 0.0005);
        // NIST SP 811 (2008), B.8: knot 5.144 444 E-01 m/s (7 printed digits)
        assertEquals(0.5144444, Units.MPS_PER_KT, 0.00000005);
    }

    @Test
    void knotsAndMetresPerSecond() {
        assertEquals(51.44444444444444, Unit.KNOT.toSi(100), 1e-12);
        assertEquals(100, Unit.KNOT.fromSi(Unit.KNOT.toSi(100)), 1e-12);
        assertEquals(1852.0 / 3600.0 * 250, Unit.KNOT.convert(250, Unit.METRE_PER_SECOND), 1e-12);
        assertEquals(Units.ktToMps(250), Unit.KNOT.convert(250, Unit.METRE_PER_SECOND), 0.0);
        assertEquals(250, Units.mpsToKt(Units.ktToMps(250)), 1e-12);
        // 1 kt = 6076.12 ft/min (1852 / 0.3048 / 60 = 101.2685 ft/min), exact ratio of the definitions
        assertEquals(1852.0 / 0.3048 / 60.0, Unit.KNOT.convert(1, Unit.FOOT_PER_MINUTE), 1e-10);
    }

    @Test
    void feetAndMetres() {
        assertEquals(9144.0, Unit.FOOT.toSi(30_000), 1e-9);
        assertEquals(30_000, Unit.METRE.convert(9144.0, Unit.FOOT), 1e-9);
        assertEquals(9144.0, Units.ftToM(30_000), 1e-9);
        assertEquals(1852.0 / 0.3048, Unit.NAUTICAL_MILE.convert(1, Unit.FOOT), 1e-9);
    }

    @Test
    void pressures() {
        // 1976 U.S. Standard Atmosphere [table]: p0 = 29.9213 inHg = 1013.25 hPa
        assertEquals(29.9213, Unit.PASCAL.convert(101325, Unit.INCH_OF_MERCURY), 0.00005);
        assertEquals(1013.25, Unit.PASCAL.convert(101325, Unit.HECTOPASCAL), 1e-12);
        assertEquals(101325, Unit.HECTOPASCAL.toSi(1013.25), 1e-9);
        assertEquals(3386.389 * 29.92, Unit.INCH_OF_MERCURY.toSi(29.92), 1e-9);
        assertEquals(Unit.INCH_OF_MERCURY.convert(29.92, Unit.HECTOPASCAL), 29.92 * 33.86389, 1e-9);
    }

    @Test
    void temperaturesUseTheOffsetButDifferencesDoNot() {
        assertEquals(288.15, Unit.DEGREE_CELSIUS.toSi(15), 1e-12);
        assertEquals(-56.5, Unit.KELVIN.convert(216.65, Unit.DEGREE_CELSIUS), 1e-12);
        assertEquals(15, Unit.DEGREE_CELSIUS.fromSi(288.15), 1e-12);
        assertEquals(10, Unit.DEGREE_CELSIUS.deltaToSi(10), 0.0);
        assertEquals(10, Unit.DEGREE_CELSIUS.deltaFromSi(10), 0.0);
        assertEquals(Units.degCToK(-40), Unit.DEGREE_CELSIUS.toSi(-40), 0.0);
        assertEquals(-40, Units.kToDegC(Units.degCToK(-40)), 1e-12);
        // a 20 kt band is 10.29 m/s wide; a speed difference has no offset to drop, but it must not gain one either
        assertEquals(20 * 1852.0 / 3600.0, Unit.KNOT.deltaToSi(20), 1e-12);
    }

    @Test
    void convertRefusesDifferentDimensions() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> Unit.KNOT.convert(100, Unit.FOOT));
        assertEquals("cannot convert kt (SPEED) to ft (LENGTH)", e.getMessage());
        e = assertThrows(IllegalArgumentException.class, () -> Unit.DEGREE_CELSIUS.convert(15, Unit.PASCAL));
        assertEquals("cannot convert degC (TEMPERATURE) to Pa (PRESSURE)", e.getMessage());
    }

    @Test
    void symbolsAndAliasesAreFound() {
        assertEquals(Unit.KNOT, Unit.bySymbol("kt").orElseThrow());
        assertEquals(Unit.KNOT, Unit.bySymbol(" knots ").orElseThrow());
        assertEquals(Unit.HECTOPASCAL, Unit.bySymbol("mbar").orElseThrow());
        assertEquals(Unit.INCH_OF_MERCURY, Unit.bySymbol("INHG").orElseThrow());
        assertEquals(Unit.DEGREE_CELSIUS, Unit.bySymbol("degC").orElseThrow());
        assertEquals(true, Unit.bySymbol("furlong").isEmpty());
        assertEquals(true, Unit.bySymbol(null).isEmpty());
    }
}
