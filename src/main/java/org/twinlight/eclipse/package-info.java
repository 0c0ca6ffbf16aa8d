/**
 * The eclipse model: limb-darkening laws, the light hidden when one limb-darkened sphere passes
 * in front of another (exactly, or from a table built per evaluation of many times), and the normalised flux of the binary with third light and exposure
 * smearing, and the proximity effects of close pairs (ellipsoidal variation, reflection, Doppler
 * beaming, light-travel time).
 *
 * <p>Depends on {@code org.twinlight.orbit} for positions and on the constants of
 * {@code org.twinlight.dimensions.AstronomicalConstants} (c, R☉); nothing here knows of files,
 * commands or plots.
 */
package org.twinlight.eclipse;
