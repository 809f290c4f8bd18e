/**
 * Runs a trained model over recordings exactly as the live pipeline does (read, derive, windows, classifier,
 * detector) and scores what comes out: {@link org.pointcall.models.run.StreamingScorer} per sortie,
 * {@link org.pointcall.models.run.Evaluation} over many; {@link org.pointcall.models.run.SortieSets} generates
 * labelled simulated sorties; {@link org.pointcall.models.run.ModelTraining} turns sortie folders into a model file.
 */
package org.pointcall.models.run;
