/**
 * Labelled test points of recorded sorties: the label file a user writes ({@link
 * org.pointcall.models.label.LabelFiles}), the intervals on a recording's time line ({@link
 * org.pointcall.models.label.Labels}) and the same built from a simulated sortie's truth. The format is documented
 * in the models README and in {@code LabelFiles}.
 */
package org.pointcall.models.label;
