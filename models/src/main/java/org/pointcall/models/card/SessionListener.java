package org.pointcall.models.card;

import org.pointcall.shared.outcome.SessionEvent;

/**
 * Receives a card session's events on the session's thread, in the order they happen. Events are immutable and may
 * be handed to other threads; a listener must be quick (queue the event when it has slow work to do).
 */
@FunctionalInterface
public interface SessionListener {
    void onEvent(SessionEvent event);
}
