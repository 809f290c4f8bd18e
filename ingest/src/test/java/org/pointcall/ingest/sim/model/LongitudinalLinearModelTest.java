package org.pointcall.ingest.sim.model;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.EigenDecomposition;
import org.junit.jupiter.api.Test;
import org.pointcall.ingest.sim.airframe.Airframe;
import org.pointcall.ingest.sim.airframe.Airframes;
import org.pointcall.ingest.sim.airframe.LongitudinalAero;
import org.pointcall.shared.atmosphere.StandardAtmosphere;

/**
 * The nonlinear model, trimmed and linearised numerically, against published small-perturbation results and the
 * textbook mode approximations.
 */
class LongitudinalLinearModelTest {
    private static final double G0 = StandardAtmosphere.G0_MPS2;

    /** A mode as a complex pair: re + i im, with its natural frequency and damping. */
    private record Mode(double re, double im) {
        double wn() {
            return Math.hypot(re, im);
        }

        double zeta() {
            return -re / wn();
        }
    }

    /** {short period, phugoid}: the oscillatory pairs, the faster first. */
    private static Mode[] modes(double[][] a) {
        EigenDecomposition ed = new EigenDecomposition(new Array2DRowRealMatrix(a));
        Mode fast = null;
        Mode slow = null;
        for (int i = 0; i < 4; i++) {
            double im = ed.getImagEigenvalue(i);
            if (im <= 0) {
                continue;
            }
            Mode m = new Mode(ed.getRealEigenvalue(i), im);
            if (fast == null || m.wn() > fast.wn()) {
                slow = fast;
                fast = m;
            } else {
                slow = m;
            }
        }
        assertTrue(fast != null && slow != null, "expected two oscillatory modes");
        return new Mode[] {fast, slow};
    }

    @Test
    void textbookLightAircraftConfiguredFromItsDerivativesReproducesTheirMatrixEntries() {
        FlightModel m = new FlightModel(TextbookLightAircraft.airframe(), SimulationSettings.DEFAULT);
        TrimPoint t = m.trim(TextbookLightAircraft.U0_MPS, 0.0, 0.0);
        LongitudinalLinearModel lin = LongitudinalLinearModel.about(m, t);
        double u0 = TextbookLightAircraft.U0_MPS;
        // Nelson, Flight Stability and Automatic Control, 2nd ed., ch. 4: the longitudinal matrix is
        // [Xu Xw 0 -g; Zu Zw u0 0; Mu+Mwdot Zu, Mw+Mwdot Zw, Mq+Mwdot u0, 0; 0 0 1 0]. Central differences of a
        // smooth model are good to about 1e-8 relative; 1e-6 leaves room.
        assertEquals(TextbookLightAircraft.XU, lin.element(0, 0), 1e-6 * 0.045);
        assertEquals(TextbookLightAircraft.XW, lin.element(0, 1), 1e-6 * 0.036);
        assertEquals(-G0, lin.element(0, 3), 1e-6 * G0);
        assertEquals(TextbookLightAircraft.ZW, lin.element(1, 1), 1e-6 * 2.02);
        assertEquals(u0, lin.element(1, 2), 1e-6 * u0);
        assertEquals(TextbookLightAircraft.MW + TextbookLightAircraft.MWDOT * TextbookLightAircraft.ZW, lin.element(2, 1), 1e-6 * 0.2);
        assertEquals(TextbookLightAircraft.MQ + TextbookLightAircraft.MWDOT * u0, lin.element(2, 2), 1e-6 * 3.0);
        // a model whose lift equals its weight has Zu = -2 CL0 qS/(m u0) = -2 g/u0 (Nelson's expression with
        // CLu = 0): -0.3656/s, where the book prints -0.369 (it rounds CL0 = W/(qS) = 0.406 to 0.41)
        double zu = -2.0 * G0 / u0;
        assertEquals(zu, lin.element(1, 0), 1e-6 * 0.37);
        assertEquals(TextbookLightAircraft.MWDOT * zu, lin.element(2, 0), 1e-6 * 0.01);
        assertEquals(1.0, lin.element(3, 2), 0.0);
    }

    @Test
    void textbookLightAircraftModesMatchThePublishedEigenvalues() {
        FlightModel m = new FlightModel(TextbookLightAircraft.airframe(), SimulationSettings.DEFAULT);
        Mode[] modes = modes(LongitudinalLinearModel.about(m, m.trim(TextbookLightAircraft.U0_MPS, 0.0, 0.0)).a());
        Mode sp = modes[0];
        Mode ph = modes[1];
        // published short period -2.489 +/- 2.601i, omega_n 3.600, zeta 0.691 (check-values.md, Nelson's example,
        // [computed] from the book's derivatives). The short period hardly depends on Zu or g, the two places the
        // model departs from the book, so it must agree to the 4 printed digits: 0.1%.
        assertEquals(-2.489, sp.re(), 0.001 * 2.489);
        assertEquals(2.601, sp.im(), 0.001 * 2.601);
        assertEquals(3.600, sp.wn(), 0.001 * 3.600);
        assertEquals(0.691, sp.zeta(), 0.001 * 0.691);
        // published phugoid -0.01705 +/- 0.2134i, omega_n 0.2141, zeta 0.0796. The phugoid goes about as
        // sqrt(-Zu g / u0): the model's Zu is 0.9% smaller than the printed one (see the test above) and its g0 is
        // 0.08% below 32.2 ft/s^2, so omega_n should come out about 0.5% low and zeta about 1% high; 2% covers
        // both with margin and is well inside the 5% asked of this check.
        assertEquals(0.2141, ph.wn(), 0.02 * 0.2141);
        assertEquals(0.0796, ph.zeta(), 0.02 * 0.0796);
        assertEquals(2.0 * Math.PI / 0.2134, 2.0 * Math.PI / ph.im(), 0.02 * 29.4);
    }

    @Test
    void jetTrainerShortPeriodMatchesTheTwoDegreeOfFreedomApproximation() {
        for (double speed : new double[] {104.0, 139.0, 209.0}) {
            Case c = new Case("veskarn-02", speed, 3000.0);
            Mode sp = modes(c.lin.a())[0];
            // Nelson ch. 4 short-period approximation: omega = sqrt(Zalpha Mq / u0 - Malpha),
            // zeta = -(Mq + Malphadot + Zalpha / u0) / (2 omega), with Zalpha = -(CLalpha + CD) qS/m,
            // Malpha = Cmalpha qSc/Iyy, Mq = Cmq (c/2u0) qSc/Iyy, Malphadot = Cmalphadot (c/2u0) qSc/Iyy.
            double omega = Math.sqrt(c.zAlpha * c.mq / c.u0 - c.mAlpha);
            double zeta = -(c.mq + c.mAlphaDot + c.zAlpha / c.u0) / (2.0 * omega);
            // it neglects Zq (from CLq) against u0 and the coupling with the phugoid: Zq/u0 = CLq rho S c/(4m) is
            // about 1% here, which moves omega^2 by about as much (omega by half); (omega_p/omega_sp)^2 is 0.3%.
            // 1.5% on both; the textbook airframe above, with Zq = 0, agrees to 0.1%.
            assertTrue(c.zqOverU0 < 0.015, "Zq/u0 " + c.zqOverU0);
            assertEquals(omega, sp.wn(), 0.015 * omega, "short-period frequency at " + speed + " m/s");
            assertEquals(zeta, sp.zeta(), 0.015 * zeta, "short-period damping at " + speed + " m/s");
        }
    }

    @Test
    void jetTrainerPhugoidDiffersFromLanchesterByTheTwoEffectsHisModelLeavesOut() {
        for (double speed : new double[] {104.0, 139.0}) {
            Case c = new Case("veskarn-02", speed, 3000.0);
            Mode[] modes = modes(c.lin.a());
            Mode ph = modes[1];
            // Lanchester: omega_p = sqrt(2) g / u0 (check-values.md). His model holds the angle of attack constant
            // (infinitely stiff in pitch) and the lift slope independent of speed. The finite stiffness lowers the
            // frequency by sqrt(-Malpha / omega_sp^2) (the two-mode factorisation of the longitudinal quartic;
            // with the textbook light aircraft's derivatives it turns Lanchester's 0.2598 rad/s into 0.2142 against the exact
            // 0.2141 [computed]); Prandtl-Glauert adds CLu = CL M^2/(1 - M^2) to Zu = -(2 CL + CLu) qS/(m u0)
            // (Nelson), raising it by sqrt(1 + CLu / 2CL).
            double lanchester = Math.sqrt(2.0) * G0 / c.u0;
            double spOmega = Math.sqrt(c.zAlpha * c.mq / c.u0 - c.mAlpha);
            double stiffness = Math.sqrt(-c.mAlpha / (spOmega * spOmega));
            double compressibility = Math.sqrt(1.0 + c.clU / (2.0 * c.clTrim));
            double known = Math.abs(1.0 - stiffness * compressibility);
            // Lanchester alone is off by about the size of those two effects (the textbook light aircraft's is 21%,
            // with a stiffness factor of 0.82; this jet's is 0.92)...
            assertTrue(Math.abs(ph.wn() / lanchester - 1.0) < known + 0.02,
                    "Lanchester off by " + (ph.wn() / lanchester - 1.0) + ", known effects " + known);
            // ...and with them the approximation agrees within 2%: what is left is the thrust's change with Mach and
            // the alpha-dot and Zq terms, each under 1% here
            assertEquals(lanchester * stiffness * compressibility, ph.wn(), 0.02 * ph.wn(),
                    "phugoid frequency at " + speed + " m/s");
        }
    }

    /** One trimmed condition with the textbook dimensional derivatives computed from the profile. */
    private static final class Case {
        final LongitudinalLinearModel lin;
        final double u0;
        final double zAlpha;
        final double mAlpha;
        final double mq;
        final double mAlphaDot;
        final double zqOverU0;
        final double clTrim;
        final double clU;

        Case(String airframe, double speed, double altitude) {
            Airframe af = Airframes.load(airframe);
            FlightModel m = new FlightModel(af, SimulationSettings.DEFAULT);
            TrimPoint t = m.trim(speed, altitude, 0.0);
            lin = LongitudinalLinearModel.about(m, t);
            m.initialise(t, 0, 0, 0);
            LongitudinalAero lon = af.longitudinal();
            u0 = speed;
            double mach = m.mach();
            double pg = 1.0 / Math.sqrt(1.0 - mach * mach);
            double qs = m.dynamicPressurePa() * af.geometry().wingAreaM2();
            double c = af.geometry().chordM();
            double mass = m.massKg();
            double iyy = af.mass().iyyKgM2();
            zAlpha = -(lon.cLAlpha() * pg + m.dragCoefficient()) * qs / mass;
            mAlpha = lon.cmAlpha() * qs * c / iyy;
            mq = lon.cmQ() * c / (2.0 * u0) * qs * c / iyy;
            mAlphaDot = lon.cmAlphaDot() * c / (2.0 * u0) * qs * c / iyy;
            zqOverU0 = lon.cLQ() * c * m.densityKgM3() * af.geometry().wingAreaM2() / (4.0 * mass);
            clTrim = m.liftCoefficient();
            double clWing = lon.cLAlpha() * pg * (t.alphaRad() - lon.alphaZeroLiftRad());
            clU = clWing * mach * mach / (1.0 - mach * mach);
        }
    }
}
