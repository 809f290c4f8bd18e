package org.pointcall.models.card;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.Optional;

import org.pointcall.shared.card.TestCard;
import org.pointcall.shared.card.TestPoint;
import org.pointcall.shared.kind.ManoeuvreKind;
import org.pointcall.shared.outcome.Verdict;

/**
 * Binds detections to card points. A detection of a kind takes, in this order: the armed point when it is of that
 * kind; else the first point of that kind in card order still waiting for a completed flight (pending or
 * abandoned); else the first point of that kind whose latest call is repeat (flown again). A detection that finds
 * none is an unplanned manoeuvre. Single-threaded (the session's thread).
 */
public final class CardMatcher {
    private final TestCard card;
    private final CardPointState[] states;
    private final CardPointState[] before;
    private int armed = -1;
    /** Index of the point of the latest completed flight (good or repeat), or -1. */
    private int lastCompleted = -1;
    /** The candidates of one bind, reused: the binding order is {@link #candidates}'s alone. */
    private final List<TestPoint> scratch = new java.util.ArrayList<>();

    public CardMatcher(TestCard card) {
        this.card = Objects.requireNonNull(card, "card");
        this.states = new CardPointState[card.points().size()];
        this.before = new CardPointState[states.length];
        java.util.Arrays.fill(states, CardPointState.PENDING);
    }

    public TestCard card() {
        return card;
    }

    /** Arms the point: it takes the next detection of its kind. Arming another point disarms this one. */
    public void arm(String cardId) {
        int i = index(cardId);
        if (states[i] == CardPointState.FLYING) {
            throw new IllegalArgumentException("card point " + cardId + " is being flown; arm it after it ends");
        }
        disarm();
        armed = i;
        before[i] = states[i];
        states[i] = CardPointState.ARMED;
    }

    /** Takes the arming back; the point returns to what it was. */
    public void disarm() {
        if (armed >= 0 && states[armed] == CardPointState.ARMED) {
            states[armed] = before[armed];
        }
        armed = -1;
    }

    /** The armed point, if any. */
    public Optional<TestPoint> armed() {
        return armed < 0 ? Optional.empty() : Optional.of(card.points().get(armed));
    }

    /** Binds a detection of {@code kind}: the card point it is, marked flying; empty for an unplanned one. */
    public Optional<TestPoint> bind(ManoeuvreKind kind) {
        int i = choose(kind);
        if (i < 0) {
            return Optional.empty();
        }
        if (i == armed) {
            armed = -1;
            states[i] = before[i];
        }
        before[i] = states[i];
        states[i] = CardPointState.FLYING;
        return Optional.of(card.points().get(i));
    }

    /**
     * Binds a detection of {@code kind} to the first card point {@link #bind(ManoeuvreKind)} would take that
     * {@code accept} accepts; an armed point of that kind is taken whatever {@code accept} says (the engineer chose
     * it). Empty, binding nothing, when none is accepted.
     */
    public Optional<TestPoint> bind(ManoeuvreKind kind, java.util.function.Predicate<TestPoint> accept) {
        if (armed >= 0 && card.points().get(armed).kind() == kind) {
            return bind(kind);
        }
        candidates(kind, scratch);
        for (TestPoint p : scratch) {
            if (accept.test(p)) {
                int j = index(p.id());
                before[j] = states[j];
                states[j] = CardPointState.FLYING;
                return Optional.of(p);
            }
        }
        return Optional.empty();
    }

    /**
     * Fills {@code out} with every card point a detection of {@code kind} could bind to now, in the order
     * {@link #bind(ManoeuvreKind, java.util.function.Predicate)} tries them: the armed point of that kind alone, else
     * each awaiting flight in card order, then each to repeat. Changes nothing; allocates nothing.
     */
    public void candidates(ManoeuvreKind kind, List<TestPoint> out) {
        out.clear();
        if (armed >= 0 && card.points().get(armed).kind() == kind) {
            out.add(card.points().get(armed));
            return;
        }
        for (int j = 0; j < states.length; j++) {
            if (card.points().get(j).kind() == kind && states[j].awaitsFlight() && j != armed) {
                out.add(card.points().get(j));
            }
        }
        for (int j = 0; j < states.length; j++) {
            if (card.points().get(j).kind() == kind && states[j] == CardPointState.REPEAT) {
                out.add(card.points().get(j));
            }
        }
    }

    /** The armed point of that kind, else the first awaiting flight, else the first to repeat; -1 for none. */
    private int choose(ManoeuvreKind kind) {
        candidates(kind, scratch);
        return scratch.isEmpty() ? -1 : index(scratch.get(0).id());
    }

    /** The flight bound to {@code cardId} is no longer this point (its detection changed kind): undo the bind. */
    public void unbind(String cardId) {
        int i = index(cardId);
        if (states[i] == CardPointState.FLYING) {
            states[i] = before[i];
        }
    }

    /**
     * The point the card goes on with: the armed one, else the first in card order after the latest completed flight
     * (good or repeat; from the start of the card before any) still waiting for a flight, else the first waiting
     * anywhere; empty when none waits.
     */
    public Optional<TestPoint> next() {
        if (armed >= 0) {
            return Optional.of(card.points().get(armed));
        }
        for (int k = 1; k <= states.length; k++) {
            int j = (lastCompleted + k) % states.length;
            if (states[j].awaitsFlight()) {
                return Optional.of(card.points().get(j));
            }
        }
        return Optional.empty();
    }

    /** The flight bound to {@code cardId} is over with {@code verdict}: where the card stands and goes on from. */
    public void settle(String cardId, Verdict verdict) {
        int i = index(cardId);
        overrule(cardId, verdict);
        if (verdict != Verdict.INCOMPLETE) {
            lastCompleted = i;
        }
    }

    /** The engineer called the latest flight of {@code cardId}: its state, not where the card goes on from. */
    public void overrule(String cardId, Verdict verdict) {
        int i = index(cardId);
        states[i] = switch (verdict) {
            case GOOD -> CardPointState.GOOD;
            case REPEAT -> CardPointState.REPEAT;
            case INCOMPLETE -> CardPointState.INCOMPLETE;
        };
        if (armed == i) {
            armed = -1;
        }
    }

    public CardPointState state(String cardId) {
        return states[index(cardId)];
    }

    /** States in card order. */
    public List<CardPointState> states() {
        return List.of(states);
    }

    /** Card points with no completed flight (never flown, or only abandoned), in card order. */
    public List<String> notFlown() {
        List<String> out = new ArrayList<>();
        for (int i = 0; i < states.length; i++) {
            if (states[i].awaitsFlight() || states[i] == CardPointState.FLYING) {
                out.add(card.points().get(i).id());
            }
        }
        return out;
    }

    private int index(String cardId) {
        for (int i = 0; i < states.length; i++) {
            if (card.points().get(i).id().equals(cardId)) {
                return i;
            }
        }
        throw new IllegalArgumentException("card " + card.sortie() + " has no point '" + cardId + "'");
    }
}
