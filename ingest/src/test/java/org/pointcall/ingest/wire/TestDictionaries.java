package org.pointcall.ingest.wire;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

import org.pointcall.shared.dictionary.Parameter;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.error.PointcallException;
import org.pointcall.shared.units.Unit;

/**
 * Dictionaries for the wire tests and a small tab-separated text form for them. The wire treats announce text as
 * opaque and hands it to a pluggable {@link DictionaryDecoder}; this line format is a real reader and writer pair
 * for that slot, kept to the tests so the application's own dictionary file format stays with its owner.
 */
final class TestDictionaries {
    private static final Unit[] UNITS = {Unit.KNOT, Unit.DEGREE, Unit.G, Unit.FOOT, Unit.MACH, Unit.DEGREE_PER_SECOND,
        Unit.PASCAL, Unit.KELVIN, Unit.PERCENT, Unit.NONE};

    /** Reads the text of {@link #toText}; rejects anything else with a line number. */
    static final DictionaryDecoder READER = TestDictionaries::fromText;

    private TestDictionaries() {
    }

    /** {@code slots} parameters named {@code <prefix>.p0...}, units cycling through a fixed list. */
    static ParameterDictionary dictionary(String name, int slots) {
        List<Parameter> ps = new ArrayList<>(slots);
        for (int i = 0; i < slots; i++) {
            ps.add(new Parameter(name + ".p" + i, UNITS[i % UNITS.length], "test parameter " + i + " of " + name,
                    20 + i % 5, -1e6, 1e6, null, null, null));
        }
        return new ParameterDictionary(name, ps);
    }

    static String toText(ParameterDictionary d) {
        StringBuilder sb = new StringBuilder("dictionary\t").append(d.name()).append('\n');
        for (Parameter p : d.parameters()) {
            sb.append(p.name()).append('\t').append(p.unit().symbol()).append('\t').append(p.rateHz()).append('\t')
                    .append(p.validMin()).append('\t').append(p.validMax()).append('\t').append(p.description())
                    .append('\n');
        }
        return sb.toString();
    }

    static ParameterDictionary fromText(String text, String source) {
        String[] lines = text.split("\n", -1);
        if (lines.length < 2 || !lines[0].startsWith("dictionary\t")) {
            throw new PointcallException(source + ":1:1: expected 'dictionary<TAB>name' on the first line");
        }
        List<Parameter> ps = new ArrayList<>();
        for (int i = 1; i < lines.length; i++) {
            if (lines[i].isEmpty()) {
                continue;
            }
            String[] f = lines[i].split("\t", -1);
            if (f.length != 6) {
                throw new PointcallException(source + ":" + (i + 1) + ":1: expected 6 tab-separated fields, got "
                        + f.length);
            }
            Unit u = Unit.bySymbol(f[1]).orElseThrow(() -> new PointcallException("unknown unit " + f[1]));
            try {
                ps.add(new Parameter(f[0], u, f[5], Double.parseDouble(f[2]), Double.parseDouble(f[3]),
                        Double.parseDouble(f[4]), null, null, null));
            } catch (IllegalArgumentException e) {
                throw new PointcallException(String.format(Locale.ROOT, "%s:%d:1: %s", source, i + 1,
                        e.getMessage()));
            }
        }
        return new ParameterDictionary(lines[0].substring("dictionary\t".length()), ps);
    }
}
