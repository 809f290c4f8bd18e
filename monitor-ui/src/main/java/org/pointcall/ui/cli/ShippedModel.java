package org.pointcall.ui.cli;

import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;

import org.pointcall.models.modelfile.LoadedModel;
import org.pointcall.models.modelfile.ModelFiles;
import org.pointcall.models.train.Classifier;
import org.pointcall.shared.error.PointcallException;

/**
 * The default model shipped inside the jar ({@value #RESOURCE}), loaded through the same checks as any model file:
 * it is copied to a temporary file first, because {@link ModelFiles} reads files, and the copy is deleted at once.
 */
final class ShippedModel {
    /** Resource name of the shipped model. */
    static final String RESOURCE = "/org/pointcall/ui/models/default.pcm";
    /** How the shipped model is named in messages and reports. */
    static final String NAME = "the shipped default model";

    private ShippedModel() {
    }

    static LoadedModel<Classifier> load() {
        Path tmp = null;
        try (InputStream in = ShippedModel.class.getResourceAsStream(RESOURCE)) {
            if (in == null) {
                throw new PointcallException(NAME + " is missing from the build (" + RESOURCE + ")");
            }
            tmp = Files.createTempFile("pointcall-default-", ".pcm");
            Files.copy(in, tmp, StandardCopyOption.REPLACE_EXISTING);
            return ModelFiles.load(tmp, Classifier.class);
        } catch (IOException e) {
            throw new PointcallException(NAME + ": cannot be read (" + e.getMessage() + ")", e);
        } finally {
            if (tmp != null) {
                try {
                    Files.deleteIfExists(tmp);
                } catch (IOException e) {
                    // a leftover temporary copy is harmless; the model is already in memory
                }
            }
        }
    }
}
