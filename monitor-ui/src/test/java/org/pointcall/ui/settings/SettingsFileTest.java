package org.pointcall.ui.settings;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The console's layout file: round trip, and bad lines named by file and line with the defaults kept. */
class SettingsFileTest {
    @Test
    void settingsSurviveARoundTrip(@TempDir Path dir) {
        ConsoleSettings s = ConsoleSettings.defaults().withSpanS(60).withWindow(1234, 777).withSplits(0.25, 0.3)
                .withGroups(List.of(new TraceGroup("handling", List.of("P", "Q", "R")),
                        new TraceGroup("engine", List.of("N1", "EGT"))));
        Path f = dir.resolve("sub").resolve("console.conf");
        SettingsFile.save(f, s);
        List<String> problems = new ArrayList<>();
        assertEquals(s, SettingsFile.load(f, problems));
        assertTrue(problems.isEmpty(), problems.toString());
    }

    @Test
    void aMissingFileGivesTheDefaults(@TempDir Path dir) {
        List<String> problems = new ArrayList<>();
        assertEquals(ConsoleSettings.defaults(), SettingsFile.load(dir.resolve("none.conf"), problems));
        assertTrue(problems.isEmpty());
    }

    @Test
    void badLinesAreNamedAndTheRestIsKept(@TempDir Path dir) throws Exception {
        Path f = dir.resolve("console.conf");
        Files.writeString(f, "# mine\nspan-s = 500\nwindow = 1600 x 1000\ncolour = dark\ngroup.1 = speeds\n");
        List<String> problems = new ArrayList<>();
        ConsoleSettings s = SettingsFile.load(f, problems);
        assertEquals(3, problems.size(), problems.toString());
        assertTrue(problems.get(0).startsWith(f + ":2: span-s"), problems.get(0));
        assertTrue(problems.get(1).startsWith(f + ":4: unknown key 'colour'"), problems.get(1));
        assertTrue(problems.get(2).startsWith(f + ":5: group.1"), problems.get(2));
        assertEquals(30, s.spanS(), "the default span is kept");
        assertEquals(1600, s.widthPx(), "the good line is taken");
        assertEquals(ConsoleSettings.defaults().groups(), s.groups());
    }
}
