package org.pointcall.shared.airdata;

import org.pointcall.shared.error.Plain;
import org.pointcall.shared.table.LinearTable;
import java.util.Arrays;

/**
 * Static-source position error of an airframe, as flight test calibrates it: the pressure coefficient
 * dPp/qc as a function of instrument-corrected indicated Mach.
 *
 * <p>Sign convention, the usual one in flight test (common practice; the form of NASA RP-1046 and TM-104316
 * [memory]): {@code dPp = p_indicated - p_ambient}. A positive dPp
 * means the static port reads high, so the altimeter reads low and the airspeed low. Correcting:
 * <pre>
 *   dPp       = (dPp/qc)(M_ic) * qc_ic
 *   p_ambient = p_ic - dPp
 *   qc        = qc_ic + dPp
 * </pre>
 * where {@code p_ic} and {@code qc_ic} are the instrument-corrected static and impact pressures and {@code M_ic}
 * the Mach they give. The total (pitot) pressure is taken as free of error, so {@code p + qc} is unchanged.
 */
public interface PositionErrorCorrection {

    /** dPp/qc at instrument-corrected indicated Mach {@code mach}. */
    double deltaPpOverQc(double mach);

    /** The ambient static pressure, Pa, from the instrument-corrected static and impact pressures. */
    default double ambientStaticPressurePa(double indicatedStaticPa, double indicatedImpactPa) {
        return indicatedStaticPa - deltaPp(indicatedStaticPa, indicatedImpactPa);
    }

    /** The corrected impact pressure, Pa, from the instrument-corrected static and impact pressures. */
    default double correctedImpactPressurePa(double indicatedStaticPa, double indicatedImpactPa) {
        return indicatedImpactPa + deltaPp(indicatedStaticPa, indicatedImpactPa);
    }

    /** dPp = p_indicated - p_ambient, Pa. */
    default double deltaPp(double indicatedStaticPa, double indicatedImpactPa) {
        double mic = AirData.machFromImpactPressure(indicatedImpactPa, indicatedStaticPa);
        return deltaPpOverQc(mic) * indicatedImpactPa;
    }

    /** No correction: the static source reads ambient pressure. */
    PositionErrorCorrection NONE = new PositionErrorCorrection() {
        @Override
        public double deltaPpOverQc(double mach) {
            return 0.0;
        }

        @Override
        public String toString() {
            return "no position error correction";
        }
    };

    /**
     * A calibration table: linear between breakpoints, held flat beyond the first and last (extrapolating a
     * calibration outside the flown range would invent data). Arrays are copied in and out.
     *
     * @param mach          breakpoints of instrument-corrected Mach, strictly increasing, at least two, each >= 0
     * @param deltaPpOverQc dPp/qc at each breakpoint
     */
    record Table(double[] mach, double[] deltaPpOverQc) implements PositionErrorCorrection {
        public Table {
            if (mach == null || deltaPpOverQc == null) {
                throw new IllegalArgumentException("position error table needs Mach and dPp/qc columns");
            }
            if (mach.length != deltaPpOverQc.length) {
                throw new IllegalArgumentException("position error table has " + mach.length + " Mach values but "
                        + deltaPpOverQc.length + " dPp/qc values");
            }
            if (mach.length < 2) {
                throw new IllegalArgumentException("position error table needs at least 2 points, got "
                        + mach.length);
            }
            mach = mach.clone();
            deltaPpOverQc = deltaPpOverQc.clone();
            for (int i = 0; i < mach.length; i++) {
                if (!(mach[i] >= 0.0 && mach[i] < Double.POSITIVE_INFINITY)) {
                    throw new IllegalArgumentException("position error table point " + (i + 1)
                            + ": Mach must be a finite number >= 0, got " + Plain.of(mach[i]));
                }
                if (!Double.isFinite(deltaPpOverQc[i])) {
                    throw new IllegalArgumentException("position error table point " + (i + 1)
                            + ": dPp/qc must be a finite number, got " + Plain.of(deltaPpOverQc[i]));
                }
                if (i > 0 && !(mach[i] > mach[i - 1])) {
                    throw new IllegalArgumentException("position error table point " + (i + 1) + ": Mach "
                            + Plain.of(mach[i]) + " must be greater than the previous " + Plain.of(mach[i - 1]));
                }
            }
        }

        @Override
        public double[] mach() {
            return mach.clone();
        }

        @Override
        public double[] deltaPpOverQc() {
            return deltaPpOverQc.clone();
        }

        @Override
        public double deltaPpOverQc(double m) {
            return LinearTable.at(mach, deltaPpOverQc, m, LinearTable.Ends.FLAT);
        }

        @Override
        public boolean equals(Object o) {
            return o instanceof Table t && Arrays.equals(mach, t.mach) && Arrays.equals(deltaPpOverQc,
                    t.deltaPpOverQc);
        }

        @Override
        public int hashCode() {
            return 31 * Arrays.hashCode(mach) + Arrays.hashCode(deltaPpOverQc);
        }

        @Override
        public String toString() {
            return "position error table " + Arrays.toString(mach) + " -> " + Arrays.toString(deltaPpOverQc);
        }
    }
}
