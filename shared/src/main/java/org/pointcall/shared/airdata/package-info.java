/**
 * Pitot-static air data: impact pressure, CAS, Mach, TAS and EAS in both the subsonic and the supersonic (Rayleigh)
 * regimes, total-temperature recovery, static-source position error correction, and a solver that works out a whole
 * flight condition from what is known of it. SI throughout; unit conversion happens at the edges.
 */
package org.pointcall.shared.airdata;
