/**
 * pointcall's model file ({@link org.pointcall.models.modelfile.ModelFiles}): a small binary header, a JSON
 * metadata block ({@link org.pointcall.models.modelfile.ModelMetadata}: parameters, windows, decision settings,
 * features, classes, training summary, library versions, creation time, payload hash) and the Java-serialised model,
 * loaded only through an allow-list. {@link org.pointcall.models.modelfile.ModelRequirements} checks that a source's
 * dictionary carries what a model needs.
 */
package org.pointcall.models.modelfile;
