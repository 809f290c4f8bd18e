package org.pointcall.ingest.window;

/**
 * Double-ended queue of sample sequence numbers on a power-of-two primitive ring: the index deque behind the
 * monotonic min/max of a track. Positions and sequence numbers are absolute counters, so the ring can grow without
 * renumbering and a window can hold a position into it.
 */
final class SeqDeque {
    private long[] seqs;
    private int mask;
    private long head;
    private long tail;

    SeqDeque(int capacity) {
        seqs = new long[capacity];
        mask = capacity - 1;
    }

    long headPos() {
        return head;
    }

    long tailPos() {
        return tail;
    }

    long seqAt(long pos) {
        return seqs[(int) (pos & mask)];
    }

    boolean isEmpty() {
        return head == tail;
    }

    long first() {
        return seqs[(int) (head & mask)];
    }

    long last() {
        return seqs[(int) ((tail - 1) & mask)];
    }

    void pushLast(long seq) {
        seqs[(int) (tail & mask)] = seq;
        tail++;
    }

    void popLast() {
        tail--;
    }

    void popFirst() {
        head++;
    }

    void clear() {
        head = 0;
        tail = 0;
    }

    void grow(int capacity) {
        long[] n = new long[capacity];
        int m = capacity - 1;
        for (long i = head; i < tail; i++) {
            n[(int) (i & m)] = seqs[(int) (i & mask)];
        }
        seqs = n;
        mask = m;
    }
}
