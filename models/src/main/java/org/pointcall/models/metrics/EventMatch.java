package org.pointcall.models.metrics;

/**
 * A detected point matched to a true one.
 *
 * @param truth    index into the true points
 * @param detected index into the detected points
 * @param iou      intersection over union of their intervals
 */
public record EventMatch(int truth, int detected, double iou) {
}
