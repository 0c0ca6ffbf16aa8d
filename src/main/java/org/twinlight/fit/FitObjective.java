package org.twinlight.fit;

import java.util.ArrayList;
import java.util.List;
import java.util.function.UnaryOperator;

/**
 * The one objective every solver of a fit evaluates: the weighted residuals of its data sets
 * ({@link FitDataSet}: the light curves, with their baselines solved inside, and in a joint fit
 * the radial velocities, {@link VelocityResiduals}) and its priors ({@link Priors}).
 *
 * <ul>
 * <li>For least squares ({@link LeastSquaresSolver}, the global search): {@link #evaluate(double[])}
 * in the internal coordinates of the {@link ParameterLayout}, the data's residuals followed by one
 * pseudo-residual (x − μ)/σ per normal prior; uniform priors are hard bounds kept by the
 * {@link #validator(double[])}.</li>
 * <li>For a sampler: {@link #logLikelihood(double[])} and {@link #logPrior(double[])} of an
 * external vector (every parameter in the contract's units, the order of {@link #parameters()}).
 * The log-likelihood is the full Gaussian one, −½χ² − Σ ln σᵢ − ½n ln 2π, so that a noise scale
 * could later be sampled with it; the baselines are solved at each point (profiled, not
 * marginalised).</li>
 * </ul>
 * Design and sources: docs/fitting.md.
 */
public final class FitObjective {
    private final ParameterLayout layout;
    private final WeightedResiduals lightCurves;
    private final VelocityResiduals velocities;
    private final List<FitDataSet> sets;
    private final PriorTerms priors;
    private final Priors priorValues;
    private final int size;

    FitObjective(ParameterLayout layout, WeightedResiduals lightCurves, Priors priors) {
        this(layout, lightCurves, PriorTerms.bind(priors, layout), priors);
    }

    private FitObjective(ParameterLayout layout, WeightedResiduals lightCurves, PriorTerms terms, Priors priors) {
        this.layout = layout;
        this.lightCurves = lightCurves;
        this.velocities = layout.velocities() == null ? null
                : new VelocityResiduals(layout.velocities(), layout.velocityBase());
        this.sets = velocities == null ? List.of(lightCurves) : List.of(lightCurves, velocities);
        this.priors = terms;
        this.priorValues = priors;
        this.size = sets.stream().mapToInt(FitDataSet::size).sum() + terms.residualCount();
    }

    /**
     * χ² of every data set at an external vector, the sampler's lean path: the light curves through
     * their per-thread work arrays, the velocities (a few dozen rows) directly.
     */
    double dataChi2(double[] ext, WeightedResiduals.Workspace work) {
        double s = lightCurves.chi2External(ext, work);
        if (velocities != null) {
            double[] r = new double[velocities.size()];
            velocities.residuals(ext, r, 0);
            s += sumOfSquares(r, r.length);
        }
        return s;
    }

    /** The same objective with another layout (a parameter held fixed for a profile). */
    FitObjective withLayout(ParameterLayout other) {
        return new FitObjective(other, lightCurves, priors, priorValues);
    }

    /**
     * The same objective started from {@code ext} with one more prior (a global search holds k on
     * one side of 1 so).
     *
     * @throws org.twinlight.BadInputException when the prior excludes {@code ext}
     */
    FitObjective startingAt(double[] ext, String name, Prior extra) {
        java.util.Map<String, Prior> all = new java.util.LinkedHashMap<>(priorValues.byName());
        all.put(name, extra);
        return new FitObjective(layout.startingAt(ext), lightCurves, new Priors(all, priorValues.source()));
    }

    /** The same objective with the light-curve points flagged in {@code leftOut} unused. */
    FitObjective withLeftOut(List<boolean[]> leftOut) {
        return new FitObjective(layout, lightCurves.withLeftOut(leftOut), priors, priorValues);
    }

    /**
     * The objective as the least-squares fit left it: the points it clipped as outliers (flagged in
     * the result's curves) left out. This is what a sampler started from {@code result} should use.
     */
    public FitObjective withClippingOf(FitResult result) {
        List<boolean[]> flags = new ArrayList<>();
        for (FittedCurve c : result.curves()) {
            flags.add(c.clipped());
        }
        return withLeftOut(flags);
    }

    ParameterLayout layout() {
        return layout;
    }

    WeightedResiduals lightCurves() {
        return lightCurves;
    }

    /** The radial velocities of a joint fit, or null. */
    VelocityResiduals velocities() {
        return velocities;
    }

    /** Whether some data's errors were estimated from their scatter (light curves or velocities). */
    boolean errorsEstimated() {
        return lightCurves.errorsEstimated() || velocities != null && velocities.errorsEstimated();
    }

    /** Every parameter, free and fixed, in the order of the external vector. */
    public List<FitParameter> parameters() {
        return layout.parameters();
    }

    /** Whether the fit has several bands (parameter labels then carry {@code @BAND}). */
    public boolean multiBand() {
        return layout.bands().size() > 1;
    }

    /** The priors the objective holds. */
    public Priors priors() {
        return priorValues;
    }

    /** The starting point as an external vector. */
    public double[] startExternal() {
        return layout.startExternal();
    }

    /** Rows of {@link #evaluate(double[])}: data points (used or not) and normal priors. */
    int size() {
        return size;
    }

    /** Data points that take part in the fit. */
    int usedCount() {
        return sets.stream().mapToInt(FitDataSet::usedCount).sum();
    }

    /** Coefficients solved inside the data sets (baselines). */
    int nuisanceCount() {
        return sets.stream().mapToInt(FitDataSet::nuisanceCount).sum();
    }

    /** Weighted residuals of the data, then the normal priors' pseudo-residuals, at an internal point. */
    double[] evaluate(double[] internal) {
        double[] ext = layout.toExternal(internal);
        double[] out = new double[size];
        int off = 0;
        for (FitDataSet d : sets) {
            d.residuals(ext, out, off);
            off += d.size();
        }
        priors.residuals(ext, out, off);
        return out;
    }

    /** The sum of squares the solver minimises (data and normal priors) at an internal point. */
    double chi2(double[] internal) {
        return sumOfSquares(evaluate(internal), size);
    }

    /** χ² of the data alone at an internal point. */
    double dataChi2(double[] internal) {
        return sumOfSquares(evaluate(internal), size - priors.residualCount());
    }

    private static double sumOfSquares(double[] r, int rows) {
        double s = 0;
        for (int i = 0; i < rows; i++) {
            s += r[i] * r[i];
        }
        return s;
    }

    /**
     * The parameter validator of one solver run started at {@code start}: the layout's domain, and
     * every uniform prior as a hard bound. A trial point outside a uniform prior is moved back along
     * the line from the last point inside, by bisection, to just inside the bound. Each run needs
     * its own (it remembers that last point); runs in parallel each take one.
     */
    UnaryOperator<double[]> validator(double[] start) {
        if (!priors.hasBounds()) {
            return layout::validate;
        }
        double[] first = layout.validate(start);
        if (!priors.allows(layout.toExternal(first))) {
            first = layout.validate(layout.toInternal(layout.startExternal()));
        }
        double[][] inside = {first};
        return proposal -> {
            double[] q = layout.validate(proposal);
            if (priors.allows(layout.toExternal(q))) {
                inside[0] = q;
                return q;
            }
            double[] a = inside[0];
            double lo = 0;
            double hi = 1;
            for (int k = 0; k < 40; k++) {
                double mid = 0.5 * (lo + hi);
                if (priors.allows(layout.toExternal(layout.validate(along(a, q, mid))))) {
                    lo = mid;
                } else {
                    hi = mid;
                }
            }
            double[] x = layout.validate(along(a, q, lo));
            inside[0] = x;
            return x;
        };
    }

    private static double[] along(double[] a, double[] b, double t) {
        double[] x = new double[a.length];
        for (int j = 0; j < a.length; j++) {
            x[j] = a[j] + t * (b[j] - a[j]);
        }
        return x;
    }

    /**
     * ln L of the data at an external vector: −½χ² − Σ ln σᵢ − ½n ln 2π over the used points, the
     * baselines solved for this model; −∞ outside the model's domain.
     */
    public double logLikelihood(double[] ext) {
        if (!layout.inDomain(ext)) {
            return Double.NEGATIVE_INFINITY;
        }
        double s = 0;
        for (FitDataSet d : sets) {
            double[] r = new double[d.size()];
            d.residuals(ext, r, 0);
            s += -0.5 * sumOfSquares(r, r.length) + d.logNormalisation();
        }
        return s;
    }

    /**
     * ln of the prior density at an external vector: the sum over the priors of the model file,
     * flat (improper) for a free parameter without one, −∞ outside a free parameter's physical
     * range or the model's domain.
     */
    public double logPrior(double[] ext) {
        if (!layout.inDomain(ext)) {
            return Double.NEGATIVE_INFINITY;
        }
        return priors.logDensity(ext);
    }

    /** ln prior + ln likelihood; −∞ where the prior excludes the point (the model is then not evaluated). */
    public double logPosterior(double[] ext) {
        double p = logPrior(ext);
        return p == Double.NEGATIVE_INFINITY ? p : p + logLikelihood(ext);
    }

    /** Names of the derived quantities {@link #derivedValues(double[])} gives, with their band when multi-band. */
    public List<String> derivedNames() {
        List<String> out = new ArrayList<>();
        for (String name : Priors.DERIVED_NAMES) {
            if (Derived.perBand(name)) {
                for (String b : layout.bands()) {
                    out.add(multiBand() ? name + "@" + b : name);
                }
            } else {
                out.add(name);
            }
        }
        return out;
    }

    /** The derived quantities at an external vector, in the order of {@link #derivedNames()}. */
    public double[] derivedValues(double[] ext) {
        List<Double> out = new ArrayList<>();
        for (String name : Priors.DERIVED_NAMES) {
            if (Derived.perBand(name)) {
                for (int b = 0; b < layout.bands().size(); b++) {
                    out.add(Derived.value(name, layout.parameters(ext, b)));
                }
            } else {
                out.add(Derived.value(name, layout.parameters(ext, 0)));
            }
        }
        return out.stream().mapToDouble(Double::doubleValue).toArray();
    }
}
