/**
 * The flight model of the synthetic sortie simulator: a six-degree-of-freedom rigid body over a flat earth (NED,
 * fine for one test area) with quaternion attitude, integrated by fixed-step fourth-order Runge-Kutta (500 Hz by
 * default) through the 1976 standard atmosphere, with steady wind and Dryden turbulence; aerodynamics from the
 * airframe profile's derivatives, a Goman-Khrabrov flow-separation state for the stall, actuators with travel and
 * rate limits, and an engine with a power lag. {@link org.pointcall.ingest.sim.model.FlightModel} is the entry
 * point for the pilot (controls in, one step at a time) and for the sensor models (every measured quantity out);
 * it also trims and linearises itself.
 *
 * <p>A model is single-threaded and allocation-free per step. Body axes x forward, y right, z down; NED north, east,
 * down; SI units; angles in radians.
 */
package org.pointcall.ingest.sim.model;
