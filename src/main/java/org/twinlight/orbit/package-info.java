/**
 * Orbits: Kepler's equation, the sky-projected separation of the two stars and which one is in
 * front, radial velocities, and the Roche-lobe radius (Eggleton 1983) that the fit and the
 * dimensions both compare radii with.
 *
 * <p>Independent of every other twinlight package.
 */
package org.twinlight.orbit;
