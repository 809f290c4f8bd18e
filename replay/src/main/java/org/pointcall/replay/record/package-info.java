/**
 * The recorder: takes raw packets from the receiving thread through a bounded single-producer/single-consumer
 * queue that never blocks it, and writes them into a sortie archive on its own thread, with configurable chunking
 * and sync, operator alarms when it falls behind or the disk refuses writes, and memory held until it can write.
 */
package org.pointcall.replay.record;
