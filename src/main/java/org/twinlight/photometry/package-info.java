/**
 * Photometry: the {@link org.twinlight.photometry.LightCurve} value, readers for delimited text
 * and FITS binary tables ({@link org.twinlight.photometry.LightCurveReader}), segments and the
 * light-curve summary.
 *
 * <p>May depend on {@code org.twinlight.time} and, for FITS, on nom-tam-fits; nothing here knows
 * of commands or plots. Readers never modify their input and never drop a row silently: unusable
 * rows are counted by {@link org.twinlight.photometry.RowRejection reason}.
 */
package org.twinlight.photometry;
