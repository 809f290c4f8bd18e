package org.pointcall.models.modelfile;

import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;

import org.pointcall.shared.dictionary.Parameter;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.error.InputRejectedException;
import org.pointcall.shared.error.Problem;

/**
 * The parameters a model needs from a source, by name and unit. A source whose dictionary lacks one, or carries it
 * in a unit of another dimension, cannot feed the model; a unit of the same dimension (knots for metres per second)
 * is fine and converted.
 *
 * @param parameters each needed parameter once
 */
public record ModelRequirements(List<RequiredParameter> parameters) {
    public ModelRequirements {
        parameters = List.copyOf(parameters);
        Set<String> seen = new HashSet<>();
        for (RequiredParameter p : parameters) {
            if (!seen.add(p.name())) {
                throw new IllegalArgumentException("parameter " + p.name() + " is required twice");
            }
        }
    }

    /** {@link #check(ParameterDictionary, String)} naming the model "model". */
    public List<BoundParameter> check(ParameterDictionary dictionary) {
        return check(dictionary, "model");
    }

    /**
     * Binds every required parameter to its slot in {@code dictionary}.
     *
     * @param modelName names the model in problems (its file, usually)
     * @throws InputRejectedException with one problem per parameter the dictionary lacks or carries in a unit of
     *                                another dimension, each naming the parameter, the unit and its dimension
     */
    public List<BoundParameter> check(ParameterDictionary dictionary, String modelName) {
        List<Problem> problems = new ArrayList<>();
        List<BoundParameter> bound = new ArrayList<>();
        for (RequiredParameter r : parameters) {
            int slot = dictionary.indexOf(r.name());
            String needs = "the model needs parameter '" + r.name() + "' in " + r.unit().symbol() + " ("
                    + dimension(r) + ")";
            if (slot < 0) {
                problems.add(new Problem(modelName, 0, 0, needs + ", which dictionary '" + dictionary.name()
                        + "' does not have; add it to the dictionary or use a model trained without it"));
                continue;
            }
            Parameter p = dictionary.parameter(slot);
            if (p.unit().dimension() != r.unit().dimension()) {
                problems.add(new Problem(modelName, 0, 0, needs + ", but dictionary '" + dictionary.name()
                        + "' has it in " + p.unit().symbol() + " (" + p.unit().dimension().name().toLowerCase(
                        java.util.Locale.ROOT).replace('_', ' ') + "), which cannot be converted"));
                continue;
            }
            bound.add(new BoundParameter(r.name(), slot, r.unit(), p.unit()));
        }
        if (!problems.isEmpty()) {
            throw new InputRejectedException(problems);
        }
        return List.copyOf(bound);
    }

    private static String dimension(RequiredParameter r) {
        return r.unit().dimension().name().toLowerCase(java.util.Locale.ROOT).replace('_', ' ');
    }
}
