package org.pointcall.shared.demo;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import org.pointcall.shared.card.CardFiles;
import org.pointcall.shared.card.TestCard;
import org.pointcall.shared.dictionary.DictionaryFiles;
import org.pointcall.shared.dictionary.ParameterDictionary;

/**
 * The demo dictionary and test card of the Veskarn, a fictional two-seat jet trainer, shipped on the classpath. Their
 * values are invented; they serve demos, the simulator and tests.
 */
public final class DemoFiles {
    /** File name of the demo parameter dictionary. */
    public static final String DICTIONARY_FILE = "veskarn-dictionary.yaml";
    /** File name of the demo test card. */
    public static final String CARD_FILE = "veskarn-card.yaml";

    private DemoFiles() {
    }

    /** The demo dictionary text, exactly as shipped. */
    public static String dictionaryText() {
        return text(DICTIONARY_FILE);
    }

    /** The demo card text, exactly as shipped. */
    public static String cardText() {
        return text(CARD_FILE);
    }

    public static ParameterDictionary dictionary() {
        return DictionaryFiles.parse(dictionaryText(), DICTIONARY_FILE);
    }

    /** The demo card, read against the demo dictionary. */
    public static TestCard card() {
        return CardFiles.parse(cardText(), CARD_FILE, dictionary());
    }

    /**
     * Copies both files into {@code dir} (created if missing), replacing files of the same names, and returns their
     * paths (dictionary first), so a user can start a card of their own from them.
     */
    public static List<Path> writeTo(Path dir) throws IOException {
        Files.createDirectories(dir);
        Path d = dir.resolve(DICTIONARY_FILE);
        Path c = dir.resolve(CARD_FILE);
        Files.writeString(d, dictionaryText(), StandardCharsets.UTF_8);
        Files.writeString(c, cardText(), StandardCharsets.UTF_8);
        return List.of(d, c);
    }

    private static String text(String name) {
        try (InputStream in = DemoFiles.class.getResourceAsStream(name)) {
            if (in == null) {
                throw new IllegalStateException("demo file " + name + " is missing from the classpath");
            }
            return new String(in.readAllBytes(), StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw new UncheckedIOException("cannot read the demo file " + name, e);
        }
    }
}
