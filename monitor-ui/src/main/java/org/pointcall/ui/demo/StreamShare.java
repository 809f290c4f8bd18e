package org.pointcall.ui.demo;

import java.util.function.Supplier;

import org.pointcall.models.card.SessionListener;
import org.pointcall.models.card.SessionSnapshot;
import org.pointcall.shared.dictionary.ParameterDictionary;

/**
 * Where a live console publishes its sessions for other consoles to watch (the Kafka share in {@code ui.share}
 * implements it); declared here so that the live side does not depend on how it is shared.
 */
public interface StreamShare {
    /** A session of one stream begins. */
    Shared begin(int streamId, ParameterDictionary dictionary, String source);

    /** One stream's session as shared: its events, its live view, its end. */
    interface Shared extends SessionListener {
        /** Where the live view (the active point's gauges) is read from. */
        void follow(Supplier<SessionSnapshot> snapshots);

        void end();
    }
}
