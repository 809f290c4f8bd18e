/**
 * Evaluation: row-level scores of a classifier ({@link org.pointcall.models.metrics.ClassConfusion}: confusion
 * matrix, per-class and macro precision, recall and F1) and event-level scores of a detector
 * ({@link org.pointcall.models.metrics.EventScoring}: points matched by kind and intersection over union, per-kind
 * and overall precision, recall and F1, begin and end errors, live-begin latency, false points per hour of
 * non-point time). Both print {@code name: value} lines.
 */
package org.pointcall.models.metrics;
