package org.pointcall.models.card;

import java.util.ArrayList;
import java.util.List;
import java.util.function.Consumer;

import org.pointcall.ingest.frame.Frame;
import org.pointcall.shared.card.SafetyLimit;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.error.Plain;
import org.pointcall.shared.outcome.LimitAlarm;
import org.pointcall.shared.units.Unit;

/**
 * Watches the card's safety limits on every frame, point or not. An alarm is raised on the first frame beyond a
 * limit and cleared once the value has stayed inside for {@link #CLEAR_AFTER_S} (so noise at the limit does not
 * chatter); the peak beyond the limit is kept. Slots are resolved once; a frame costs one comparison per limit and
 * allocates nothing unless an alarm changes. Single-threaded.
 */
public final class LimitWatch {
    /** An alarm clears after the value has been back inside this long, s. */
    public static final double CLEAR_AFTER_S = 0.5;

    private final SafetyLimit[] limits;
    private final int[] slots;
    private final Unit[] frameUnits;
    private final String[] words;
    private final boolean[] raised;
    private final double[] peakSi;
    private final long[] insideSinceNs;
    private final long clearAfterNs = Math.round(CLEAR_AFTER_S * 1e9);
    private final Consumer<LimitAlarm> out;

    /** Limits on parameters the dictionary lacks are left out ({@link #unwatched()}). */
    public LimitWatch(List<SafetyLimit> limits, ParameterDictionary dictionary, Consumer<LimitAlarm> out) {
        this.out = out;
        List<SafetyLimit> kept = new ArrayList<>();
        List<Integer> s = new ArrayList<>();
        unwatched = new ArrayList<>();
        for (SafetyLimit l : limits) {
            int slot = dictionary.indexOf(l.parameter());
            if (slot < 0) {
                unwatched.add(l.parameter());
                continue;
            }
            kept.add(l);
            s.add(slot);
        }
        int n = kept.size();
        this.limits = kept.toArray(new SafetyLimit[0]);
        this.slots = new int[n];
        this.frameUnits = new Unit[n];
        this.words = new String[n];
        for (int i = 0; i < n; i++) {
            slots[i] = s.get(i);
            frameUnits[i] = dictionary.parameter(slots[i]).unit();
            words[i] = describe(this.limits[i]);
        }
        this.raised = new boolean[n];
        this.peakSi = new double[n];
        this.insideSinceNs = new long[n];
    }

    private final List<String> unwatched;

    /** Parameters of limits the dictionary does not carry. */
    public List<String> unwatched() {
        return List.copyOf(unwatched);
    }

    /** {@code at most 6 g}, {@code at least 6000 ft}, {@code -2 to 6 g}. */
    public static String describe(SafetyLimit l) {
        String u = l.unit().symbol().equals("1") ? "" : " " + l.unit().symbol();
        if (!l.hasMin()) {
            return "at most " + Plain.of(l.unit().fromSi(l.maxSi())) + u;
        }
        if (!l.hasMax()) {
            return "at least " + Plain.of(l.unit().fromSi(l.minSi())) + u;
        }
        return Plain.of(l.unit().fromSi(l.minSi())) + " to " + Plain.of(l.unit().fromSi(l.maxSi())) + u;
    }

    /** Checks one (derived) frame; {@code cardId} is the point being flown, or null. */
    public void onFrame(Frame f, String cardId) {
        long t = f.timeNs();
        for (int i = 0; i < slots.length; i++) {
            double v = f.value(slots[i]);
            if (Double.isNaN(v)) {
                continue;
            }
            double si = frameUnits[i].toSi(v);
            SafetyLimit l = limits[i];
            if (l.isExceededBy(si)) {
                insideSinceNs[i] = Long.MIN_VALUE;
                if (!raised[i]) {
                    raised[i] = true;
                    peakSi[i] = si;
                    out.accept(alarm(i, true, t, si, cardId));
                } else if (beyond(l, si) > beyond(l, peakSi[i])) {
                    peakSi[i] = si;
                }
            } else if (raised[i]) {
                if (insideSinceNs[i] == Long.MIN_VALUE) {
                    insideSinceNs[i] = t;
                } else if (t - insideSinceNs[i] >= clearAfterNs) {
                    raised[i] = false;
                    out.accept(alarm(i, false, t, si, cardId));
                }
            }
        }
    }

    /** True while any alarm is raised. */
    public boolean anyRaised() {
        for (boolean r : raised) {
            if (r) {
                return true;
            }
        }
        return false;
    }

    /** The limit descriptions of the alarms raised now, {@code Nz at most 6 g}. */
    public List<String> raisedNow() {
        List<String> r = new ArrayList<>();
        for (int i = 0; i < raised.length; i++) {
            if (raised[i]) {
                r.add(limits[i].parameter() + " " + words[i]);
            }
        }
        return r;
    }

    private static double beyond(SafetyLimit l, double si) {
        return Math.max(si - l.maxSi(), l.minSi() - si);
    }

    private LimitAlarm alarm(int i, boolean up, long t, double si, String cardId) {
        Unit u = limits[i].unit();
        return new LimitAlarm(limits[i].parameter(), u.symbol(), words[i], up, t, u.fromSi(si), u.fromSi(peakSi[i]),
                cardId);
    }
}
