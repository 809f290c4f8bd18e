/**
 * Replay: a sortie archive or a recorded CSV/XLSX file re-streamed at 0.1x to 100x real time or as fast as the
 * target takes it, paced on an injected clock, steered from any thread through a transport control (play, pause,
 * speed, seek, stop), into the in-process pipeline, over UDP in the wire format, or to Kafka.
 */
package org.pointcall.replay.play;
