package org.pointcall.ingest.file;

import java.util.ArrayList;
import java.util.List;

import org.pointcall.shared.error.Problem;
import org.slf4j.Logger;

/**
 * Counts problems by kind exactly, and logs and keeps only the first {@code limit} of each kind, so a file that is
 * bad on every line neither floods the log nor fills the heap.
 */
final class ProblemLog {
    static final int NOT_A_NUMBER = SkipReason.values().length;
    static final int WILD_POINT = NOT_A_NUMBER + 1;
    static final int OUTSIDE_HEADER = NOT_A_NUMBER + 2;
    static final int READ_FAILURE = NOT_A_NUMBER + 3;
    private static final int KINDS = NOT_A_NUMBER + 4;

    private final String source;
    private final int limit;
    private final Logger logger;
    private final long[] counts = new long[KINDS];
    private final List<Problem> kept = new ArrayList<>();
    private long notKept;

    ProblemLog(String source, int limit, Logger logger) {
        this.source = source;
        this.limit = limit;
        this.logger = logger;
    }

    /** Counts one problem of {@code kind}; true when the caller should build it and {@link #record} it. */
    boolean admit(int kind) {
        long n = ++counts[kind];
        if (n <= limit) {
            return true;
        }
        notKept++;
        if (n == limit + 1L) {
            logger.warn("{}: further problems of this kind ({}) are counted, not logged", source, label(kind));
        }
        return false;
    }

    void record(Problem problem) {
        kept.add(problem);
        logger.warn("{}", problem);
    }

    List<Problem> kept() {
        return List.copyOf(kept);
    }

    long notKept() {
        return notKept;
    }

    private static String label(int kind) {
        if (kind < NOT_A_NUMBER) {
            return SkipReason.values()[kind].label();
        }
        if (kind == NOT_A_NUMBER) {
            return "cell not a number";
        }
        if (kind == WILD_POINT) {
            return "wild point";
        }
        return kind == OUTSIDE_HEADER ? "cell outside the header" : "read failure";
    }
}
