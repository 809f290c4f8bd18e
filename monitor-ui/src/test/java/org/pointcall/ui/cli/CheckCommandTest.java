package org.pointcall.ui.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class CheckCommandTest {

    @Test
    void demoFilesAreValidAndListed() {
        CommandRun r = CommandRun.of("check");
        assertEquals(0, r.exitCode(), r.err());
        assertTrue(r.out().contains("12 points, 7 safety limits"), r.out());
        assertTrue(r.out().contains("KCAS           entry                          320 +/- 10 kt"), r.out());
    }

    @Test
    void examplesWrittenOutCheckCleanAndABrokenCopyIsRefusedWithEveryProblem(@TempDir Path dir) throws Exception {
        CommandRun w = CommandRun.of("examples", "--out", dir.toString());
        assertEquals(0, w.exitCode(), w.err());
        Path dict = dir.resolve("veskarn-dictionary.yaml");
        Path card = dir.resolve("veskarn-card.yaml");
        CommandRun ok = CommandRun.of("check", "--dictionary", dict.toString(), "--card", card.toString());
        assertEquals(0, ok.exitCode(), ok.err());

        String text = Files.readString(card, StandardCharsets.UTF_8);
        String broken = text.replace("{parameter: KCAS, phase: entry, target: 320, tol: 10, unit: kt}",
                "{parameter: KCAS, phase: entry, target: 320, tol: 0, unit: ft}");
        assertFalse(broken.equals(text), "the demo card changed: update this test's edit");
        Files.writeString(card, broken, StandardCharsets.UTF_8);
        CommandRun bad = CommandRun.of("check", "--dictionary", dict.toString(), "--card", card.toString());
        assertEquals(2, bad.exitCode());
        assertTrue(bad.err().contains("band on KCAS has no width (tol: 0)"), bad.err());
        assertTrue(bad.err().contains("unit mismatch: band on KCAS is in ft, but KCAS is a speed"), bad.err());
        assertFalse(bad.err().contains("Exception"), bad.err());
    }

    @Test
    void missingFileIsOneLine(@TempDir Path dir) {
        CommandRun r = CommandRun.of("check", "--dictionary", dir.resolve("nope.yaml").toString());
        assertEquals(2, r.exitCode());
        assertEquals(1, r.err().strip().lines().count(), r.err());
    }
}
