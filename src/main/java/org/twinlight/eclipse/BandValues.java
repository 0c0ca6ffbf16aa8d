package org.twinlight.eclipse;

/**
 * The values of a model that depend on the photometric band; null where the band takes the
 * model's common value.
 *
 * @param surfaceBrightnessRatio J in this band, or null
 * @param thirdLight ℓ₃ in this band, or null
 * @param limbDarkening1 star 1's law in this band, or null
 * @param limbDarkening2 star 2's law in this band, or null
 */
public record BandValues(Double surfaceBrightnessRatio, Double thirdLight, LimbDarkening limbDarkening1,
        LimbDarkening limbDarkening2) {

    /** The common parameters with this band's values put in. */
    public BinaryParameters applyTo(BinaryParameters common) {
        BinaryParameters p = common;
        if (surfaceBrightnessRatio != null) {
            p = p.withSurfaceBrightnessRatio(surfaceBrightnessRatio);
        }
        if (thirdLight != null) {
            p = p.withThirdLight(thirdLight);
        }
        if (limbDarkening1 != null || limbDarkening2 != null) {
            p = p.withLimbDarkening(limbDarkening1 != null ? limbDarkening1 : p.limbDarkening1(),
                    limbDarkening2 != null ? limbDarkening2 : p.limbDarkening2());
        }
        return p;
    }

    /** The band values taken from full parameters. */
    public static BandValues of(BinaryParameters p) {
        return new BandValues(p.surfaceBrightnessRatio(), p.thirdLight(), p.limbDarkening1(), p.limbDarkening2());
    }
}
