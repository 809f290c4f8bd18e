/**
 * Airframe profiles of the synthetic sortie simulator: mass, inertia, geometry, stability and control derivatives,
 * stall characteristics, engine, control-surface limits and the static-source position error, as immutable
 * records read from one YAML file per airframe ({@link org.pointcall.ingest.sim.airframe.Airframes}).
 *
 * <p>Conventions: SI inside; body axes x forward, y right, z down; angles in radians (the files carry degrees in
 * keys ending {@code Deg}); aerodynamic derivatives are per radian, and rate derivatives per nondimensional rate
 * (p b/2V, q c/2V, r b/2V, alpha-dot c/2V). A positive surface deflection gives a negative moment about its own
 * axis (elevator trailing edge down pitches nose down, positive aileron rolls left, rudder trailing edge left yaws
 * nose left), the convention of the stability-derivative textbooks (Nelson; Etkin and Reid).
 */
package org.pointcall.ingest.sim.airframe;
