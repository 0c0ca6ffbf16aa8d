/**
 * twinlight: eclipsing-binary light curves from raw photometry to times of minimum, ephemerides,
 * a fitted two-sphere model and absolute dimensions.
 *
 * <p>This root package holds only the two exception types shared by every layer:
 * {@link org.twinlight.BadInputException} (exit code 2) and
 * {@link org.twinlight.WorkFailedException} (exit code 1).
 */
package org.twinlight;
