/**
 * Photometry: the {@link org.twinlight.photometry.LightCurve} value, readers for delimited text
 * and FITS binary tables, segments and cleaning.
 *
 * <p>May depend on {@code org.twinlight.time}; nothing here knows of commands or plots.
 */
package org.twinlight.photometry;
