/**
 * The sortie archive: an append-only file of CRC-32C-checked chunks holding every received packet as it came, the
 * dictionaries, and typed records (events, verdicts, alarms, operator calls, notes), with a seek index beside it
 * that is rebuilt by scanning when missing. The layout is in ARCHIVE-FORMAT.md of the replay module.
 */
package org.pointcall.replay.archive;
