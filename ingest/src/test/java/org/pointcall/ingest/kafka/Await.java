package org.pointcall.ingest.kafka;

import java.util.function.BooleanSupplier;
import java.util.function.Supplier;

import static org.junit.jupiter.api.Assertions.fail;

/** Waits for a condition with a generous guard time: a hang fails the test, a slow machine does not. */
final class Await {
    private Await() {
    }

    static void until(BooleanSupplier condition, long guardMs, Supplier<String> state) throws InterruptedException {
        long deadline = System.nanoTime() + guardMs * 1_000_000L;
        while (!condition.getAsBoolean()) {
            if (System.nanoTime() > deadline) {
                fail("not reached within the " + guardMs + " ms guard: " + state.get());
            }
            Thread.sleep(20);
        }
    }
}
