package org.pointcall.ui.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.pointcall.shared.airdata.AirData;
import org.pointcall.shared.atmosphere.StandardAtmosphere;
import org.pointcall.shared.units.Units;

class InspectCommandTest {

    private static String row(double t, double hpFt, double kcas) {
        double h = Units.ftToM(hpFt);
        return String.format(Locale.ROOT, "%.3f,%.4f,%.4f,%.3f", t, StandardAtmosphere.pressurePa(h) / 100.0,
                AirData.impactPressureFromCas(Units.ktToMps(kcas)) / 100.0,
                Units.kToDegC(StandardAtmosphere.temperatureK(h)));
    }

    @Test
    void aRecordedFileIsReadDerivedAndItsBadRowNamedWhileTheRestIsKept(@TempDir Path dir) throws Exception {
        StringBuilder csv = new StringBuilder("time,PS_ADC [hPa],QC_ADC [hPa],OAT_ADC [degC]\n");
        for (int i = 0; i < 64; i++) {
            csv.append(row(i / 32.0, 10000, 250)).append('\n');
            if (i == 10) {
                csv.append("0.1,garbage\n"); // line 13: too few cells
            }
        }
        Path file = dir.resolve("sortie.csv");
        Files.writeString(file, csv, StandardCharsets.UTF_8);
        CommandRun r = CommandRun.of("inspect", "--input", file.toString());
        assertEquals(2, r.exitCode(), "a skipped row is bad input: exit code 2");
        assertTrue(r.out().contains("64 data rows read, 64 frames delivered, 1 skipped")
                || r.out().contains("65 data rows read, 64 frames delivered, 1 skipped"), r.out());
        assertTrue(r.err().contains("sortie.csv:13"), r.err());
        assertFalse(r.err().contains("Exception"), r.err());
        String hpLine = r.out().lines().filter(l -> l.startsWith("Hp ")).findFirst().orElseThrow();
        assertTrue(hpLine.contains("(derived)") && hpLine.contains("10000.0"), hpLine);
        String kcasLine = r.out().lines().filter(l -> l.startsWith("KCAS ")).findFirst().orElseThrow();
        assertTrue(kcasLine.contains("250.000"), kcasLine);
    }

    @Test
    void aWrongUnitInTheHeaderRefusesTheFile(@TempDir Path dir) throws Exception {
        Path file = dir.resolve("bad.csv");
        Files.writeString(file, "time,PS_ADC [kt]\n0,1\n", StandardCharsets.UTF_8);
        CommandRun r = CommandRun.of("inspect", "--input", file.toString());
        assertEquals(2, r.exitCode());
        assertTrue(r.err().contains("bad.csv:1:6: column 'PS_ADC [kt]' is in kt, but Ps is a pressure"), r.err());
    }
}
