package org.twinlight.fit;

import java.util.Objects;
import org.twinlight.photometry.LightCurve;

/**
 * One light curve to fit and the band whose parameters it uses.
 *
 * @param lightCurve the photometry
 * @param band band name (several files may share one band)
 */
public record FitData(LightCurve lightCurve, String band) {
    public FitData {
        Objects.requireNonNull(lightCurve, "lightCurve");
        Objects.requireNonNull(band, "band");
    }
}
