package org.pointcall.ingest.file;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.error.InputRejectedException;

class RecordedFilesTest {
    @TempDir
    Path dir;

    private final ParameterDictionary dictionary = SortieDictionary.create();

    @Test
    void choosesTheReaderByExtension() throws IOException {
        for (String name : new String[] {"a.csv", "b.TXT", "c.tsv"}) {
            Path p = dir.resolve(name);
            Files.writeString(p, "time\tKCAS\n0\t1\n");
            try (RecordedFileSource src = RecordedFiles.open(p, dictionary)) {
                assertInstanceOf(CsvSource.class, src, name);
                assertEquals(1, src.readAll(f -> { }).framesDelivered());
            }
        }
    }

    @Test
    void refusesOtherKindsOfFileByName() throws IOException {
        Path dat = dir.resolve("sortie.dat");
        Files.writeString(dat, "time,KCAS\n");
        InputRejectedException e = assertThrows(InputRejectedException.class,
                () -> RecordedFiles.open(dat, dictionary, ReadOptions.DEFAULTS.withSourceName("sortie.dat")));
        assertEquals("sortie.dat: unknown kind of file: pointcall reads time histories from .csv, .txt, .tsv (comma, "
                + "semicolon or tab separated) and .xlsx files", e.getMessage());
        Path xls = dir.resolve("sortie.xls");
        Files.writeString(xls, "x");
        assertEquals("sortie.xls: old binary Excel (.xls) files are not read; save the sheet as .xlsx or .csv",
                assertThrows(InputRejectedException.class, () -> RecordedFiles.open(xls, dictionary,
                        ReadOptions.DEFAULTS.withSourceName("sortie.xls"))).getMessage());
    }

    @Test
    void optionsAreValidated() {
        assertThrows(IllegalArgumentException.class, () -> ReadOptions.DEFAULTS.withProblemLimit(-1));
        assertEquals(null, ReadOptions.DEFAULTS.withTimeColumn("  ").timeColumn());
    }
}
