/**
 * The 1976 U.S. Standard Atmosphere: temperature, pressure, density, speed of sound and viscosity by geopotential
 * altitude, the geometric/geopotential relation, and the pressure- and density-altitude inverses. Static,
 * SI and allocation-free, for use per sample.
 */
package org.pointcall.shared.atmosphere;
