package org.pointcall.ui.cli;

import java.io.PrintWriter;
import java.util.Locale;
import java.util.OptionalDouble;

import org.pointcall.shared.airdata.AirDataInput;
import org.pointcall.shared.airdata.AirDataSolver;
import org.pointcall.shared.airdata.AirDataState;
import org.pointcall.shared.atmosphere.StandardAtmosphere;
import org.pointcall.shared.units.Units;

import picocli.CommandLine.ArgGroup;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

/** Standard-atmosphere and air-data calculator: one flight condition in, every air-data quantity out. */
@Command(name = "airdata",
        header = "Standard atmosphere and air data for one flight condition.",
        mixinStandardHelpOptions = true,
        description = {
            "Works out one flight condition from pressure altitude (or static pressure) and one speed,",
            "on the 1976 U.S. Standard Atmosphere, with an optional OAT or ISA deviation.",
            "Prints each quantity as 'name: value unit'."
        },
        footer = {"", "Example: airdata --hp-ft 20000 --kcas 250"})
public final class AirDataCommand implements Runnable {

    static final class Altitude {
        @Option(names = "--hp-ft", paramLabel = "FT", description = "pressure altitude, ft") Double hpFt;
        @Option(names = "--hp-m", paramLabel = "M", description = "pressure altitude, m") Double hpM;
        @Option(names = "--ps-hpa", paramLabel = "HPA", description = "static pressure, hPa") Double psHpa;
        @Option(names = "--ps-inhg", paramLabel = "INHG", description = "static pressure, inHg") Double psInHg;
        @Option(names = "--ps-pa", paramLabel = "PA", description = "static pressure, Pa") Double psPa;
    }

    static final class Speed {
        @Option(names = "--kcas", paramLabel = "KT", description = "calibrated airspeed, kt") Double kcas;
        @Option(names = "--mach", paramLabel = "M", description = "Mach number") Double mach;
        @Option(names = "--ktas", paramLabel = "KT", description = "true airspeed, kt") Double ktas;
    }

    static final class Temperature {
        @Option(names = "--oat-c", paramLabel = "DEGC", description = "outside (static) air temperature, degC")
        Double oatC;
        @Option(names = "--isa-dev-c", paramLabel = "DEGC",
                description = "ISA deviation: OAT minus the standard temperature at this pressure altitude, degC")
        Double isaDevC;
    }

    @ArgGroup(exclusive = true, multiplicity = "1", heading = "Altitude (one of):%n")
    Altitude altitude;

    @ArgGroup(exclusive = true, multiplicity = "1", heading = "Speed (one of):%n")
    Speed speed;

    @ArgGroup(exclusive = true, multiplicity = "0..1", heading = "Temperature (optional, standard day without):%n")
    Temperature temperature;

    @Spec
    CommandSpec spec;

    @Override
    public void run() {
        AirDataState s = AirDataSolver.solve(input());
        PrintWriter out = spec.commandLine().getOut();
        line(out, "pressure altitude", Units.mToFt(s.pressureAltitudeM()), "%.1f", "ft");
        line(out, "static pressure", s.staticPressurePa(), "%.1f", "Pa");
        line(out, "static temperature", Units.kToDegC(s.staticTemperatureK()), "%.2f", "degC");
        line(out, "ISA deviation", s.isaDeviationK(), "%.2f", "K");
        line(out, "density", s.densityKgM3(), "%.6f", "kg/m^3");
        line(out, "density ratio", s.densityKgM3() / StandardAtmosphere.densityKgM3(0.0), "%.6f", "");
        line(out, "speed of sound", Units.mpsToKt(s.speedOfSoundMps()), "%.2f", "kt");
        line(out, "impact pressure", s.impactPressurePa(), "%.1f", "Pa");
        line(out, "qc/p", s.impactPressureRatio(), "%.5f", "");
        line(out, "Mach", s.mach(), "%.4f", "");
        line(out, "KCAS", Units.mpsToKt(s.casMps()), "%.2f", "kt");
        line(out, "KEAS", Units.mpsToKt(s.easMps()), "%.2f", "kt");
        line(out, "KTAS", Units.mpsToKt(s.tasMps()), "%.2f", "kt");
        if (Double.isNaN(s.densityAltitudeM())) {
            out.println("density altitude: outside the standard atmosphere model");
        } else {
            line(out, "density altitude", Units.mToFt(s.densityAltitudeM()), "%.0f", "ft");
        }
        out.flush();
    }

    private static void line(PrintWriter out, String name, double value, String format, String unit) {
        String v = String.format(Locale.ROOT, format, value);
        out.println(unit.isEmpty() ? name + ": " + v : name + ": " + v + " " + unit);
    }

    AirDataInput input() {
        OptionalDouble hpM = OptionalDouble.empty();
        OptionalDouble psPa = OptionalDouble.empty();
        if (altitude.hpFt != null) {
            hpM = OptionalDouble.of(Units.ftToM(altitude.hpFt));
        } else if (altitude.hpM != null) {
            hpM = OptionalDouble.of(altitude.hpM);
        } else if (altitude.psHpa != null) {
            psPa = OptionalDouble.of(altitude.psHpa * Units.PA_PER_HPA);
        } else if (altitude.psInHg != null) {
            psPa = OptionalDouble.of(altitude.psInHg * Units.PA_PER_INHG);
        } else {
            psPa = OptionalDouble.of(altitude.psPa);
        }
        OptionalDouble cas = speed.kcas == null ? OptionalDouble.empty() : OptionalDouble.of(Units.ktToMps(speed.kcas));
        OptionalDouble mach = speed.mach == null ? OptionalDouble.empty() : OptionalDouble.of(speed.mach);
        OptionalDouble tas = speed.ktas == null ? OptionalDouble.empty() : OptionalDouble.of(Units.ktToMps(speed.ktas));
        OptionalDouble oatK = OptionalDouble.empty();
        OptionalDouble isaDevK = OptionalDouble.empty();
        if (temperature != null && temperature.oatC != null) {
            oatK = OptionalDouble.of(Units.degCToK(temperature.oatC));
        } else if (temperature != null && temperature.isaDevC != null) {
            isaDevK = OptionalDouble.of(temperature.isaDevC); // a difference: degC and K steps are equal
        }
        return new AirDataInput(hpM, psPa, cas, mach, tas, oatK, isaDevK);
    }
}
