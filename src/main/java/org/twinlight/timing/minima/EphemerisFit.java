package org.twinlight.timing.minima;

import org.twinlight.timing.Ephemeris;
import org.twinlight.timing.MinimumType;

import java.util.List;
import java.util.Objects;
import java.util.Optional;

/**
 * An ephemeris model fitted to times of minimum. The model is written as a correction to the
 * reference ephemeris, in days: O−C(E) = ΔT₀ + ΔP·E + Q·E² + s·[secondary] + Δt_LTT(T_ref(E)),
 * where the terms a model does not have are 0 (or null for the light time).
 *
 * @param model which model
 * @param reference the ephemeris the O−C are taken against
 * @param offsetDays ΔT₀, days
 * @param periodCorrectionDays ΔP, days
 * @param quadraticDays Q, days
 * @param secondaryOffsetDays s, the displacement of secondary minima from phase 0.5, days (0 when not fitted)
 * @param lightTime the third-body orbit, or null
 * @param parameters the fitted and derived quantities with uncertainties, for files and people
 * @param chi2 χ² with the timing errors as given
 * @param n number of timings
 * @param freeParameters number of free parameters k
 * @param bic Bayesian information criterion χ² + k·ln n (Schwarz 1978, Ann. Stat. 6, 461)
 * @param errorScale factor the formal uncertainties were multiplied by: max(1, √(χ²/(n − k)))
 * @param epochPeriodCovarianceDays2 covariance of the fitted epoch and period (d², scaled like their
 *        uncertainties), NaN when it could not be computed; what predictions many cycles ahead need
 */
public record EphemerisFit(EphemerisModel model, Ephemeris reference, double offsetDays, double periodCorrectionDays,
        double quadraticDays, double secondaryOffsetDays, EphemerisLightTime lightTime,
        List<EphemerisParameter> parameters, double chi2, int n, int freeParameters, double bic, double errorScale,
        double epochPeriodCovarianceDays2) {

    public EphemerisFit {
        Objects.requireNonNull(model, "model");
        Objects.requireNonNull(reference, "reference");
        parameters = List.copyOf(parameters);
    }

    /** The model's O−C (days) against the reference at cycle E for a minimum of this type. */
    public double ocModelDays(double cycle, MinimumType type) {
        double oc = offsetDays + periodCorrectionDays * cycle + quadraticDays * cycle * cycle;
        if (type == MinimumType.SECONDARY) {
            oc += secondaryOffsetDays;
        }
        if (lightTime != null) {
            oc += lightTime.delayDays(reference.timeOf(cycle));
        }
        return oc;
    }

    /** The fitted linear part as an ephemeris: T₀ + ΔT₀, P + ΔP. */
    public Ephemeris linearPart() {
        return new Ephemeris(reference.epochDays() + offsetDays, reference.periodDays() + periodCorrectionDays);
    }

    /**
     * This fit, made on O−C from which a fixed secondary offset {@code secondaryDays} had been
     * subtracted, expressed against the original O−C: the offset is added back and listed as a
     * parameter without uncertainty (it was not fitted).
     */
    public EphemerisFit withFixedSecondaryOffset(double secondaryDays) {
        List<EphemerisParameter> p = new java.util.ArrayList<>(parameters);
        p.removeIf(q -> q.name().equals("secondaryOffset"));
        p.add(new EphemerisParameter("secondaryOffset", secondaryDays, Double.NaN, "d"));
        return new EphemerisFit(model, reference, offsetDays, periodCorrectionDays, quadraticDays, secondaryDays,
                lightTime, p, chi2, n, freeParameters, bic, errorScale, epochPeriodCovarianceDays2);
    }

    /**
     * This fit (made with a fixed secondary offset) with the uncertainty of that offset carried into
     * every parameter: {@code plus} and {@code minus} are the same fit with the offset moved by
     * ±{@code offsetErrorDays}; each parameter's uncertainty becomes σ ⊕ |Δ|/2 and the epoch–period
     * covariance gains the product of the epoch's and period's half-differences.
     */
    public EphemerisFit withFixedOffsetError(EphemerisFit plus, EphemerisFit minus, double offsetErrorDays) {
        List<EphemerisParameter> p = new java.util.ArrayList<>();
        for (EphemerisParameter q : parameters) {
            if (q.name().equals("secondaryOffset")) {
                p.add(new EphemerisParameter(q.name(), q.value(), offsetErrorDays, q.unit()));
                continue;
            }
            double half = halfDifference(plus, minus, q.name());
            p.add(new EphemerisParameter(q.name(), q.value(), Math.hypot(q.uncertainty(), half), q.unit()));
        }
        double cov = epochPeriodCovarianceDays2
                + halfDifference(plus, minus, "epoch") * halfDifference(plus, minus, "period");
        return new EphemerisFit(model, reference, offsetDays, periodCorrectionDays, quadraticDays, secondaryOffsetDays,
                lightTime, p, chi2, n, freeParameters, bic, errorScale, cov);
    }

    private static double halfDifference(EphemerisFit plus, EphemerisFit minus, String name) {
        return (plus.parameter(name).orElseThrow().value() - minus.parameter(name).orElseThrow().value()) / 2;
    }

    /** χ²/(n − k), NaN when n ≤ k. */
    public double reducedChi2() {
        return n > freeParameters ? chi2 / (n - freeParameters) : Double.NaN;
    }

    /** The parameter with this name. */
    public Optional<EphemerisParameter> parameter(String name) {
        return parameters.stream().filter(p -> p.name().equals(name)).findFirst();
    }
}
