/**
 * Labelled feature rows for training and evaluation: {@link org.pointcall.models.data.DatasetBuilder} runs
 * recordings through the same read, derive and window stages as the live pipeline and labels each decision tick
 * ({@link org.pointcall.models.data.LabelledRows}); {@link org.pointcall.models.data.SortieSplits} splits them by
 * sortie for cross-validation and held-out tests; {@link org.pointcall.models.data.DatasetCsv} writes them for a
 * person to look at.
 */
package org.pointcall.models.data;
