package org.pointcall.ingest.sim.airframe;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.io.Reader;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.pointcall.shared.error.InputRejectedException;
import org.pointcall.shared.error.PointcallException;

/**
 * The airframe profiles: the built-in ones shipped as resources ({@code airframes/<name>.yaml}, listed in
 * {@code airframes/index.txt}) and any profile file a user writes in the same format. A bad file is refused whole
 * with every problem located ({@link InputRejectedException}).
 */
public final class Airframes {
    private Airframes() {
    }

    private static final String DIR = "/org/pointcall/ingest/sim/airframes/";

    /** The built-in airframes, in the order of the index. */
    public static List<AirframeSummary> list() {
        List<AirframeSummary> out = new ArrayList<>();
        for (String name : builtInNames()) {
            Airframe a = load(name);
            out.add(new AirframeSummary(a.name(), a.description()));
        }
        return List.copyOf(out);
    }

    /** A built-in airframe by name. */
    public static Airframe load(String name) {
        if (name == null || !name.matches(Airframe.NAME_PATTERN) || !builtInNames().contains(name)) {
            throw new PointcallException("no built-in airframe named '" + name + "'; built in: "
                    + String.join(", ", builtInNames()));
        }
        String resource = DIR + name + ".yaml";
        try (InputStream in = Airframes.class.getResourceAsStream(resource)) {
            if (in == null) {
                throw new IllegalStateException("built-in airframe " + name + " is listed but not packaged");
            }
            Airframe a = AirframeReader.read(name + ".yaml", new InputStreamReader(in, StandardCharsets.UTF_8));
            if (!a.name().equals(name)) {
                throw new IllegalStateException("built-in airframe file " + name + ".yaml names itself " + a.name());
            }
            return a;
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    /** A profile file; problems are reported against the path as given. */
    public static Airframe load(Path file) {
        String source = file.toString();
        try (Reader r = Files.newBufferedReader(file, StandardCharsets.UTF_8)) {
            return AirframeReader.read(source, r);
        } catch (NoSuchFileException e) {
            throw new PointcallException(source + ": no such file");
        } catch (IOException | UncheckedIOException e) {
            throw new PointcallException(source + ": cannot be read (" + e.getMessage() + ")");
        }
    }

    private static List<String> builtInNames() {
        try (InputStream in = Airframes.class.getResourceAsStream(DIR + "index.txt")) {
            if (in == null) {
                throw new IllegalStateException("airframe index is not packaged");
            }
            List<String> names = new ArrayList<>();
            BufferedReader r = new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8));
            for (String line = r.readLine(); line != null; line = r.readLine()) {
                String s = line.strip();
                if (!s.isEmpty() && !s.startsWith("#")) {
                    names.add(s);
                }
            }
            return names;
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}
