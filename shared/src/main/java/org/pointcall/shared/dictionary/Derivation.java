package org.pointcall.shared.dictionary;

import java.util.List;
import java.util.Objects;

/**
 * How a derived parameter is computed from others: the method and its inputs, by parameter name in the order the
 * method expects them. The ingest stage resolves the names to slots once, when it binds a stream.
 */
public record Derivation(DerivationMethod method, List<String> inputs) {
    public Derivation {
        Objects.requireNonNull(method, "method");
        inputs = List.copyOf(inputs);
        if (inputs.size() != method.inputRoles().size()) {
            throw new IllegalArgumentException(method.key() + " takes " + method.inputRoles().size() + " inputs "
                    + method.inputRoles() + ", got " + inputs.size());
        }
    }
}
