package org.twinlight.eclipse;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.Map;

/**
 * A model of the interface contract: the common parameters and optional per-band values (the
 * JSON model file is read and written by the report layer). A model whose bands each give their
 * own surface-brightness ratio need not give a common one; such a model has no values for a band
 * it does not list.
 *
 * @param common the parameters shared by all bands (and the values of a band not listed)
 * @param bands per-band values by band name, in file order
 * @param commonComplete false when the common surface-brightness ratio was not given (every band
 *     gives its own); {@code common} then carries the first band's value
 */
public record ModelFile(BinaryParameters common, Map<String, BandValues> bands, boolean commonComplete) {

    public ModelFile {
        bands = Collections.unmodifiableMap(new LinkedHashMap<>(bands == null ? Map.of() : bands));
        if (!commonComplete && bands.values().stream().anyMatch(b -> b.surfaceBrightnessRatio() == null)) {
            throw new IllegalArgumentException("without a common surfaceBrightnessRatio every band must give its own");
        }
    }

    /** A model whose common parameters are complete. */
    public ModelFile(BinaryParameters common, Map<String, BandValues> bands) {
        this(common, bands, true);
    }

    /** A model with no per-band values. */
    public static ModelFile of(BinaryParameters common) {
        return new ModelFile(common, Map.of());
    }

    /** Whether {@link #forBand} can give parameters for this band (null: the common ones). */
    public boolean covers(String band) {
        return commonComplete || band != null && bands.containsKey(band);
    }

    /**
     * The parameters for a band: the common ones with the band's values put in.
     *
     * @throws IllegalArgumentException for a band the model does not list when it gives no common
     *     surface-brightness ratio
     */
    public BinaryParameters forBand(String band) {
        BandValues v = band == null ? null : bands.get(band);
        if (v == null && !commonComplete) {
            throw new IllegalArgumentException("the model gives surfaceBrightnessRatio only per band (for "
                    + String.join(", ", bands.keySet()) + ")" + (band == null ? "; name one of those bands"
                            : ", not for band '" + band + "'"));
        }
        return v == null ? common : v.applyTo(common);
    }
}
