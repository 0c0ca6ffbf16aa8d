/**
 * Orbits: Kepler's equation, the sky-projected separation of the two stars and which one is in
 * front, and radial velocities.
 *
 * <p>Independent of every other twinlight package.
 */
package org.twinlight.orbit;
