package org.pointcall.ui.console;

/** How the strip charts feed ChartFX. */
public enum TraceDrawing {
    /** The console's own min/max envelope: at most two points per pixel column reach ChartFX. */
    ENVELOPE,
    /** Every sample of the span, ChartFX's own point reduction off: the plain baseline of the benchmark. */
    RAW
}
