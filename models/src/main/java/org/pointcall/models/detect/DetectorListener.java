package org.pointcall.models.detect;

/**
 * Receives point events on the detector's thread (the stream's pipeline thread), in the order they happen. Events
 * are immutable and may be kept or handed to another thread.
 */
@FunctionalInterface
public interface DetectorListener {
    void onPointEvent(PointEvent event);
}
