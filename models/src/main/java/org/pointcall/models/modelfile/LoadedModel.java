package org.pointcall.models.modelfile;

/**
 * A model read from a file: its metadata and the model object, of a class the file format allows.
 *
 * @param metadata what the file says about the model
 * @param model    the deserialised model
 */
public record LoadedModel<T>(ModelMetadata metadata, T model) {
}
