package org.pointcall.shared.error;

import java.util.List;
import java.util.stream.Collectors;

/**
 * A whole input (file, arguments) was refused. Carries every problem found, so a user can fix them all at once;
 * nothing of a rejected input is loaded.
 */
public class InputRejectedException extends PointcallException {
    private static final long serialVersionUID = 1L;

    private final transient List<Problem> problems;

    public InputRejectedException(List<Problem> problems) {
        super(summary(problems));
        this.problems = List.copyOf(problems);
    }

    public List<Problem> problems() {
        return problems;
    }

    private static String summary(List<Problem> problems) {
        if (problems.isEmpty()) {
            throw new IllegalArgumentException("an input is rejected for at least one problem");
        }
        return problems.stream().sorted().map(Problem::toString).collect(Collectors.joining(System.lineSeparator()));
    }
}
