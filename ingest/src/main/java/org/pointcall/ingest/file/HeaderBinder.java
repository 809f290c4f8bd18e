package org.pointcall.ingest.file;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

import org.pointcall.shared.dictionary.Calibration;
import org.pointcall.shared.dictionary.Parameter;
import org.pointcall.shared.dictionary.DimensionRules;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.error.InputRejectedException;
import org.pointcall.shared.error.Problem;
import org.pointcall.shared.units.Unit;
import org.pointcall.shared.units.Units;

/** Binds a header row to the dictionary, collecting every fatal problem before giving up. */
final class HeaderBinder {
    /** {@code NAME [unit]} or {@code NAME (unit)}. */
    private static final Pattern UNIT_SUFFIX = Pattern.compile("(.*?)\\s*(?:\\[([^\\[\\]]*)]|\\(([^()]*)\\))\\s*");

    /** Header names taken for time when none is given, compared ignoring case, units stripped. */
    static final List<String> TIME_NAMES = List.of("time", "t", "timestamp", "time_s", "elapsed", "elapsed time",
            "elapsed_time", "tod", "time of day", "time_of_day", "irig time", "irig_time", "irigtime", "utc",
            "utc time", "utc_time");

    private static final Map<String, Long> TIME_UNITS = new LinkedHashMap<>();

    static {
        for (String s : List.of("s", "sec", "secs", "second", "seconds")) {
            TIME_UNITS.put(s, Units.NS_PER_S);
        }
        for (String s : List.of("ms", "msec", "millisecond", "milliseconds")) {
            TIME_UNITS.put(s, 1_000_000L);
        }
        for (String s : List.of("us", "\u00b5s", "\u03bcs", "usec", "microsecond", "microseconds")) {
            TIME_UNITS.put(s, 1_000L);
        }
        for (String s : List.of("ns", "nanosecond", "nanoseconds")) {
            TIME_UNITS.put(s, 1L);
        }
        for (String s : List.of("min", "minute", "minutes")) {
            TIME_UNITS.put(s, 60L * Units.NS_PER_S);
        }
        for (String s : List.of("h", "hr", "hour", "hours")) {
            TIME_UNITS.put(s, 3600L * Units.NS_PER_S);
        }
    }

    private HeaderBinder() {
    }

    /**
     * @param headers   header cells, trimmed, unescaped
     * @param positions 1-based column of each cell
     * @param letters   spreadsheet column letters of each cell, or {@code null} for CSV
     */
    static ColumnPlan bind(String source, int line, List<String> headers, int[] positions, String[] letters,
                           ParameterDictionary dictionary, ReadOptions options) {
        List<Problem> fatal = new ArrayList<>();
        int n = headers.size();
        String[] base = new String[n];
        String[] unitText = new String[n];
        for (int i = 0; i < n; i++) {
            String h = headers.get(i);
            Matcher m = UNIT_SUFFIX.matcher(h);
            if (m.matches() && !m.group(1).isBlank()) {
                base[i] = m.group(1).trim();
                String u = (m.group(2) != null ? m.group(2) : m.group(3)).trim();
                unitText[i] = u.isEmpty() ? null : u;
            } else {
                base[i] = h;
            }
        }

        Map<String, List<Integer>> exact = new HashMap<>();
        Map<String, List<Integer>> folded = new HashMap<>();
        for (int s = 0; s < dictionary.size(); s++) {
            String c = dictionary.parameter(s).column();
            exact.computeIfAbsent(c, k -> new ArrayList<>()).add(s);
            folded.computeIfAbsent(fold(c), k -> new ArrayList<>()).add(s);
        }

        // candidate slot per header cell; exact matches claim their parameter before case-insensitive ones
        int[] slotOf = new int[n];
        boolean[] exactMatch = new boolean[n];
        boolean[] unitApplies = new boolean[n];
        for (int i = 0; i < n; i++) {
            slotOf[i] = -1;
            String h = headers.get(i);
            List<Integer> hit = exact.get(h);
            boolean isExact = true;
            boolean withUnit = false;
            if (hit == null && unitText[i] != null) {
                hit = exact.get(base[i]);
                withUnit = hit != null;
            }
            if (hit == null) {
                isExact = false;
                hit = folded.get(fold(h));
            }
            if (hit == null && unitText[i] != null) {
                hit = folded.get(fold(base[i]));
                withUnit = hit != null;
            }
            if (hit == null || h.isEmpty()) {
                continue;
            }
            if (hit.size() > 1) {
                fatal.add(new Problem(source, line, positions[i], "column '" + h + "' matches "
                        + names(dictionary, hit) + (isExact ? " (the dictionary gives them the same column)"
                        : " ignoring case; write it exactly as one of them")));
                continue;
            }
            slotOf[i] = hit.get(0);
            exactMatch[i] = isExact;
            unitApplies[i] = withUnit;
        }
        int[] owner = new int[dictionary.size()];
        java.util.Arrays.fill(owner, -1);
        String[] ignoredNote = new String[n];
        for (int pass = 0; pass < 2; pass++) {
            for (int i = 0; i < n; i++) {
                if (slotOf[i] < 0 || exactMatch[i] != (pass == 0)) {
                    continue;
                }
                int s = slotOf[i];
                if (owner[s] < 0) {
                    owner[s] = i;
                } else if (pass == 0) {
                    fatal.add(new Problem(source, line, positions[i], "column '" + headers.get(i) + "' repeats column '"
                            + headers.get(owner[s]) + "' at " + positions[owner[s]] + ": both would feed "
                            + dictionary.parameter(s).name() + "; remove or rename one"));
                    slotOf[i] = -1;
                } else {
                    ignoredNote[i] = headers.get(i) + " (" + dictionary.parameter(s).name()
                            + " is already read from column '" + headers.get(owner[s]) + "')";
                    slotOf[i] = -1;
                }
            }
        }

        // time column
        int timeColumn = findTimeColumn(headers, base, options.timeColumn());
        long timeNsPerUnit = Units.NS_PER_S;
        String timeUnit = "s";
        if (timeColumn < 0) {
            if (options.timeColumn() != null) {
                fatal.add(new Problem(source, line, 0, "no column '" + options.timeColumn()
                        + "' for the time; the header has " + quotedList(headers)));
            } else {
                fatal.add(new Problem(source, line, 0, "no time column: no column is named "
                        + String.join(", ", TIME_NAMES) + " (case and a unit in brackets do not matter); "
                        + "name the column that holds time"));
            }
        } else if (unitText[timeColumn] != null) {
            Long perUnit = TIME_UNITS.get(unitText[timeColumn].toLowerCase(Locale.ROOT));
            if (perUnit == null) {
                fatal.add(new Problem(source, line, positions[timeColumn], "time column '" + headers.get(timeColumn)
                        + "' is in " + unitText[timeColumn] + ", but time must be in s, ms, us, ns, min or h"));
            } else {
                timeNsPerUnit = perUnit;
                timeUnit = unitText[timeColumn];
            }
        }

        // units of the bound columns
        List<BoundColumn> bound = new ArrayList<>();
        List<Unit> from = new ArrayList<>();
        List<Integer> boundIndex = new ArrayList<>();
        boolean[] isBound = new boolean[n];
        boolean[] slotBound = new boolean[dictionary.size()];
        boolean anyCandidate = false;
        for (int i = 0; i < n; i++) {
            if (slotOf[i] < 0) {
                continue;
            }
            anyCandidate = true;
            Parameter p = dictionary.parameter(slotOf[i]);
            Unit fileUnit = p.unit();
            boolean declared = false;
            if (unitApplies[i]) {
                Optional<Unit> u = Unit.bySymbol(unitText[i]);
                if (u.isEmpty()) {
                    fatal.add(new Problem(source, line, positions[i], "column '" + headers.get(i) + "': '" + unitText[i]
                            + "' is not a unit pointcall knows (" + Unit.knownSymbols() + "); correct it, or give '"
                            + headers.get(i) + "' whole as the column of " + p.name() + " in the dictionary"));
                    continue;
                }
                fileUnit = u.get();
                declared = true;
                if (fileUnit.dimension() != p.unit().dimension()) {
                    fatal.add(new Problem(source, line, positions[i], "column '" + headers.get(i) + "' is in "
                            + fileUnit.symbol() + ", but " + p.name() + " is " + DimensionRules.phrase(p.unit().dimension()) + " ("
                            + p.unit().symbol() + ")"));
                    continue;
                }
                if (fileUnit != p.unit() && !(p.calibration() instanceof Calibration.Identity)) {
                    fatal.add(new Problem(source, line, positions[i], "column '" + headers.get(i) + "' is in "
                            + fileUnit.symbol() + ", but " + p.name() + " has a calibration from raw values to "
                            + p.unit().symbol() + "; remove the unit from the header if the column holds raw values"));
                    continue;
                }
            }
            bound.add(new BoundColumn(headers.get(i), positions[i], p.name(), slotOf[i], fileUnit, declared));
            from.add(fileUnit == p.unit() ? null : fileUnit);
            boundIndex.add(i);
            isBound[i] = true;
            slotBound[slotOf[i]] = true;
        }

        List<String> ignored = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            if (i == timeColumn || isBound[i]) {
                continue;
            }
            String h = headers.get(i);
            if (ignoredNote[i] != null) {
                ignored.add(ignoredNote[i]);
            } else if (h.isEmpty()) {
                ignored.add(letters != null ? "(column " + letters[i] + ", no header)"
                        : "(field " + (i + 1) + ", no header)");
            } else {
                ignored.add(h);
            }
        }

        if (!anyCandidate) {
            List<String> expected = new ArrayList<>();
            for (Parameter p : dictionary.parameters()) {
                if (!p.isDerived()) {
                    expected.add(p.column());
                }
            }
            fatal.add(new Problem(source, line, 0, "none of the columns is a parameter of dictionary '"
                    + dictionary.name() + "': the header has " + quotedList(headers) + ", the dictionary reads "
                    + quotedList(expected)));
        }
        if (!fatal.isEmpty()) {
            throw new InputRejectedException(fatal);
        }

        List<String> missing = new ArrayList<>();
        for (int s = 0; s < dictionary.size(); s++) {
            Parameter p = dictionary.parameter(s);
            if (!p.isDerived() && !slotBound[s]) {
                missing.add(p.name());
            }
        }

        int k = bound.size();
        int[] column = new int[k];
        int[] slot = new int[k];
        String[] header = new String[k];
        Parameter[] parameter = new Parameter[k];
        Calibration[] calibration = new Calibration[k];
        Unit[] fromUnit = new Unit[k];
        for (int j = 0; j < k; j++) {
            column[j] = boundIndex.get(j);
            slot[j] = bound.get(j).slot();
            header[j] = bound.get(j).header();
            parameter[j] = dictionary.parameter(slot[j]);
            calibration[j] = parameter[j].calibration() instanceof Calibration.Identity ? null
                    : parameter[j].calibration();
            fromUnit[j] = from.get(j);
        }
        HeaderBinding binding = new HeaderBinding(source, line, headers.get(timeColumn), timeUnit, bound, ignored,
                missing);
        return new ColumnPlan(binding, n, timeColumn, timeNsPerUnit, column, slot, header, parameter, calibration,
                fromUnit);
    }

    private static int findTimeColumn(List<String> headers, String[] base, String wanted) {
        if (wanted != null) {
            String w = wanted.trim();
            for (int pass = 0; pass < 4; pass++) {
                for (int i = 0; i < headers.size(); i++) {
                    boolean hit = switch (pass) {
                        case 0 -> headers.get(i).equals(w);
                        case 1 -> base[i].equals(w);
                        case 2 -> fold(headers.get(i)).equals(fold(w));
                        default -> fold(base[i]).equals(fold(w));
                    };
                    if (hit) {
                        return i;
                    }
                }
            }
            return -1;
        }
        for (int i = 0; i < headers.size(); i++) {
            if (TIME_NAMES.contains(fold(base[i]))) {
                return i;
            }
        }
        return -1;
    }

    static String fold(String s) {
        return s.trim().toLowerCase(Locale.ROOT);
    }

    private static String names(ParameterDictionary d, List<Integer> slots) {
        List<String> out = new ArrayList<>();
        for (int s : slots) {
            out.add(d.parameter(s).name());
        }
        return String.join(" and ", out);
    }

    private static String quotedList(List<String> items) {
        StringBuilder sb = new StringBuilder();
        int shown = Math.min(items.size(), 12);
        for (int i = 0; i < shown; i++) {
            if (i > 0) {
                sb.append(", ");
            }
            sb.append('\'').append(items.get(i)).append('\'');
        }
        if (items.size() > shown) {
            sb.append(" and ").append(items.size() - shown).append(" more");
        }
        return sb.toString();
    }
}
