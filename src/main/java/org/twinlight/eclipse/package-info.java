/**
 * The eclipse model: limb-darkening laws, the light hidden when one limb-darkened sphere passes
 * in front of another, and the normalised flux of the binary with third light and exposure
 * smearing.
 *
 * <p>Depends on {@code org.twinlight.orbit} for positions; nothing here knows of files, commands
 * or plots.
 */
package org.twinlight.eclipse;
