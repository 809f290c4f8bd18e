package org.pointcall.ingest.file;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.pointcall.ingest.frame.Frame;
import org.pointcall.shared.demo.DemoFiles;
import org.pointcall.shared.dictionary.Calibration;
import org.pointcall.shared.dictionary.ParameterDictionary;

class CsvWriterTest {
    @Test
    void framesWrittenAreTheFramesReadBackBitForBit(@TempDir Path dir) throws Exception {
        ParameterDictionary dict = DemoFiles.dictionary();
        Random rnd = new Random(11);
        List<Frame> written = new ArrayList<>();
        Path file = dir.resolve("sortie.csv");
        try (CsvWriter w = CsvWriter.create(file, dict)) {
            long t = 1_234_567_891L;
            for (int i = 0; i < 2000; i++) {
                Frame f = Frame.forDictionary(dict);
                t += 1 + rnd.nextInt(20_000_000);
                f.timeNs(t);
                for (int s = 0; s < dict.size(); s++) {
                    var p = dict.parameter(s);
                    if (!p.isDerived() && rnd.nextInt(3) > 0) {
                        f.value(s, p.validMin() + rnd.nextDouble() * (p.validMax() - p.validMin()));
                    }
                }
                w.onFrame(f);
                written.add(f);
            }
        }
        List<Frame> read = new ArrayList<>();
        try (RecordedFileSource src = RecordedFiles.open(file, dict)) {
            ReadReport r = src.readAll(f -> read.add(f.copy()));
            assertEquals(0, r.rowsSkipped());
            assertEquals(0, r.wildPoints());
        }
        assertEquals(written.size(), read.size());
        for (int i = 0; i < read.size(); i++) {
            assertEquals(written.get(i).timeNs(), read.get(i).timeNs(), "time exact to the nanosecond");
            for (int s = 0; s < dict.size(); s++) {
                double w = written.get(i).value(s);
                double r = read.get(i).value(s);
                if (Double.isNaN(w)) {
                    assertEquals(Double.NaN, r, "not sampled stays blank");
                } else if (dict.parameter(s).calibration() instanceof Calibration.Identity) {
                    assertEquals(Double.doubleToLongBits(w), Double.doubleToLongBits(r), "row " + i + " slot " + s);
                } else {
                    // through raw and back: exact up to the rounding of two linear maps
                    assertEquals(w, r, 1e-9 * Math.max(1, Math.abs(w)), "row " + i + " slot " + s);
                }
            }
        }
        assertEquals(Files.readString(file).lines().findFirst().orElseThrow().split(",")[1], "PS_ADC [hPa]");
    }

    @Test
    void secondsAreExactDecimals() {
        StringBuilder sb = new StringBuilder();
        CsvWriter.appendSeconds(sb, 12_000_000_001L);
        assertEquals("12.000000001", sb.toString());
        sb.setLength(0);
        CsvWriter.appendSeconds(sb, -1_500_000_000L);
        assertEquals("-1.500000000", sb.toString());
    }
}
