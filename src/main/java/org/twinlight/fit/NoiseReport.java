package org.twinlight.fit;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * The correlated-noise diagnostics of a fit ({@link NoiseDiagnostics}) and the error they say to
 * quote.
 *
 * <p>The rule: quote σ = max(σ_cov · max(1, β), σ_perm), σ_cov the covariance error scaled by the
 * reduced χ², β the adopted time-averaging factor and σ_perm the residual-permutation spread.
 * Its calibration over synthetic light curves with white and with correlated noise is in
 * docs/uncertainties.md.
 *
 * @param beta the adopted β: the largest β_w over the bin widths, from 10 min (or three cadences)
 *     up to the eclipse duration, the time scales on which the eclipse's shape is decided (NaN when
 *     no width could be measured). The largest rather than the median: with noise correlated over
 *     tens of minutes β_w grows with the width, and the median left the errors of total eclipses
 *     about 30 % too small (docs/uncertainties.md)
 * @param betaByBinMinutes β_w per bin width in minutes (NaN for a width with too few bins)
 * @param eclipseMinutes the longer eclipse's duration from the fitted model, minutes (NaN when the
 *     model does not eclipse); the bin widths run up to it
 * @param permutationSigma the residual-permutation spread per free parameter (label as in the
 *     correlation table)
 * @param shifts the number of cyclic shifts refitted (0 when the data were too few)
 * @param appliedFactor the factor already applied to the reported covariance errors (1, or
 *     max(1, β) after {@code --inflate-errors beta})
 */
public record NoiseReport(double beta, Map<Double, Double> betaByBinMinutes, double eclipseMinutes,
        Map<String, Double> permutationSigma, int shifts, double appliedFactor) {

    /** β above this is reported as correlated noise (common practice, no source). */
    public static final double BETA_NOTE_LEVEL = 1.2;

    /** How β is adopted from the widths, as written in fit.json. */
    public static final String BETA_RULE = "largest beta over the bin widths";

    /**
     * A permutation spread is reported as exceeding the covariance error when larger by this
     * factor: from 40 shifts the spread itself is uncertain by 10–20 % (common practice, no source).
     */
    public static final double PERMUTATION_NOTE_RATIO = 1.2;

    /** The quoting rule as written in fit.json and on the terminal. */
    public static final String QUOTE_RULE = "quote the larger of the covariance error times max(1, beta) and the "
            + "residual-permutation spread";

    public NoiseReport {
        betaByBinMinutes = java.util.Collections.unmodifiableMap(new java.util.LinkedHashMap<>(betaByBinMinutes));
        permutationSigma = java.util.Collections.unmodifiableMap(new java.util.LinkedHashMap<>(permutationSigma));
    }

    /** The factor the covariance errors need for correlated noise: max(1, β), 1 when β is unknown. */
    public double inflation() {
        return Double.isFinite(beta) ? Math.max(1, beta) : 1;
    }

    /** The same report after the covariance errors were multiplied by {@link #inflation()}. */
    public NoiseReport withInflationApplied() {
        return new NoiseReport(beta, betaByBinMinutes, eclipseMinutes, permutationSigma, shifts, inflation());
    }

    /**
     * The error to quote for a free parameter whose reported (covariance) error is {@code sigma}:
     * max(σ_cov · max(1, β), σ_perm), counting a factor already applied once.
     */
    public double quoted(String label, double sigma) {
        double perm = permutationSigma.getOrDefault(label, Double.NaN);
        double scaled = sigma * inflation() / appliedFactor;
        return Double.isFinite(perm) ? Math.max(scaled, perm) : scaled;
    }

    /** Remarks for the user: β above {@value #BETA_NOTE_LEVEL}, permutation spreads well above the covariance errors. */
    public List<String> notes(FitResult r) {
        List<String> notes = new ArrayList<>();
        if (beta > BETA_NOTE_LEVEL) {
            notes.add(String.format(Locale.ROOT, "correlated noise: the residuals averaged over %s min scatter "
                    + "beta = %.2f times more than white noise would; the covariance errors are too small by about "
                    + "that factor%s; quote the larger error (noise.quoted in fit.json)%s", widths(), beta,
                    appliedFactor > 1 ? " (already applied: --inflate-errors beta)" : "",
                    appliedFactor > 1 ? "" : ", and sample a posterior only with --inflate-errors beta"));
        }
        List<String> larger = new ArrayList<>();
        boolean multiBand = r.curves().stream().map(FittedCurve::band).distinct().count() > 1;
        for (Estimate e : r.parameters()) {
            String label = e.band() == null || !multiBand ? e.name() : e.name() + "@" + e.band();
            Double perm = permutationSigma.get(label);
            if (e.free() && !e.isLimit() && perm != null && perm > PERMUTATION_NOTE_RATIO * e.uncertainty()) {
                larger.add(String.format(Locale.ROOT, "%s (%.3g against %.3g)", label, perm, e.uncertainty()));
            }
        }
        if (!larger.isEmpty()) {
            notes.add("correlated noise: the residual-permutation spread over " + shifts + " shifts exceeds the "
                    + "covariance error by more than " + Math.round(100 * (PERMUTATION_NOTE_RATIO - 1)) + " % for " + String.join(", ", larger) + "; quote the larger error "
                    + "(noise.quoted in fit.json)");
        }
        return notes;
    }

    /** "10–60" or "30": the range of bin widths measured, minutes. */
    public String widths() {
        double lo = betaByBinMinutes.keySet().stream().mapToDouble(Double::doubleValue).min().orElse(Double.NaN);
        double hi = betaByBinMinutes.keySet().stream().mapToDouble(Double::doubleValue).max().orElse(Double.NaN);
        return lo == hi ? String.format(Locale.ROOT, "%.0f", lo) : String.format(Locale.ROOT, "%.0f–%.0f", lo, hi);
    }
}
