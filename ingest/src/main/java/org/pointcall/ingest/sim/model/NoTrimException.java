package org.pointcall.ingest.sim.model;

import org.pointcall.shared.error.PointcallException;

/** No steady flight exists at the asked condition; the message says which limit stops it. */
public class NoTrimException extends PointcallException {
    private static final long serialVersionUID = 1L;

    public NoTrimException(String message) {
        super(message);
    }
}
