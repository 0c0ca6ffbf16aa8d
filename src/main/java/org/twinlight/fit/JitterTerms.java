package org.twinlight.fit;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.twinlight.BadInputException;

/**
 * The jitter terms of a sampled posterior ({@code fit --posterior --jitter}): an extra scatter s,
 * one per light-curve band ({@code jitter}, or {@code jitter@BAND} with several bands) and one per
 * velocity file of a joint fit ({@code jitterVelocity}, or {@code jitterVelocity@FILE} with
 * several), added in quadrature to every stated error of its data, σᵢ² → σᵢ² + s². The likelihood
 * is then the Gaussian one with that variance, normalisation included,
 * ln L = −½ Σ [rᵢ²/(σᵢ² + s²) + ln(σᵢ² + s²) + ln 2π]; without the ln(σᵢ² + s²) term a larger s would
 * always fit better and the jitter would run to infinity (the Gaussian likelihood with an added
 * variance: Gregory 2005, ApJ 631, 1198, §2; Gelman et al. 2013, Bayesian Data Analysis, 3rd ed.,
 * §14 — recalled from memory).
 *
 * <p>The sampler moves in ln s. The default prior is uniform in ln s (log-uniform in s) from
 * {@value #LOWER_FACTOR}× to {@value #UPPER_FACTOR}× the median stated error of the term's data; a
 * prior in the model file on the term's name (or on {@code jitter} / {@code jitterVelocity} for every
 * band or file) replaces it: a prior density p(s) is p(s)·s in ln s.
 */
final class JitterTerms {
    /** The light curves' jitter, in the units of the flux (relative to the out-of-eclipse level). */
    static final String LIGHT = "jitter";
    /** A velocity file's jitter, km/s. */
    static final String VELOCITY = "jitterVelocity";
    /** Lower end of the default prior, in units of the median stated error. */
    static final double LOWER_FACTOR = 0.001;
    /** Upper end of the default prior, in units of the median stated error. */
    static final double UPPER_FACTOR = 100;

    /**
     * One jitter.
     *
     * @param label its name in the results
     * @param medianError the median stated error of its data
     * @param prior the model file's prior on s, or null for the default log-uniform one
     */
    record Term(String label, double medianError, Prior prior) {
        /** ln of the prior density of ln s; −∞ outside it. */
        double logPrior(double lnS) {
            if (prior == null) {
                double lo = Math.log(LOWER_FACTOR * medianError);
                double hi = Math.log(UPPER_FACTOR * medianError);
                return lnS >= lo && lnS <= hi ? -Math.log(hi - lo) : Double.NEGATIVE_INFINITY;
            }
            return prior.logDensity(Math.exp(lnS)) + lnS;
        }

        /** A starting s inside the prior, near {@code guess}. */
        double start(double guess) {
            if (logPrior(Math.log(guess)) > Double.NEGATIVE_INFINITY) {
                return guess;
            }
            if (prior instanceof Prior.Uniform u) {
                return 0.5 * (Math.max(u.lower(), 0) + u.upper());
            }
            if (prior instanceof Prior.Normal n && n.mean() > 0) {
                return n.mean();
            }
            return medianError;
        }
    }

    private final List<Term> terms;
    private final int bands;

    private JitterTerms(List<Term> terms, int bands) {
        this.terms = List.copyOf(terms);
        this.bands = bands;
    }

    /** No jitter: the likelihood takes the errors as stated (scaled by the fit's rule). */
    static JitterTerms none() {
        return new JitterTerms(List.of(), 0);
    }

    /** Whether a prior's name is a jitter's ({@code jitter}, {@code jitterVelocity@FILE}, ...). */
    static boolean isJitterName(String name) {
        String base = Priors.baseName(name);
        return base.equals(LIGHT) || base.equals(VELOCITY);
    }

    /**
     * The jitter terms of an objective, with the priors its model file puts on them.
     *
     * @throws BadInputException for a jitter prior on a band or velocity file the fit does not have,
     *     or one that allows no positive s
     */
    static JitterTerms of(FitObjective objective) {
        ParameterLayout layout = objective.layout();
        Priors priors = objective.priors();
        List<String> bandNames = layout.bands();
        double[] median = objective.lightCurves().medianErrorByBand();
        VelocityResiduals v = objective.velocities();
        List<String> files = new ArrayList<>();
        for (int f = 0; v != null && f < v.fileCount(); f++) {
            files.add(v.fileLabel(f));
        }
        checkNames(priors, LIGHT, bandNames, "band");
        checkNames(priors, VELOCITY, files, "velocity file");
        List<Term> out = new ArrayList<>();
        for (int b = 0; b < bandNames.size(); b++) {
            String label = bandNames.size() > 1 ? LIGHT + "@" + bandNames.get(b) : LIGHT;
            out.add(new Term(label, median[b], priorOf(priors, LIGHT, bandNames.get(b))));
        }
        for (int f = 0; f < files.size(); f++) {
            String label = files.size() > 1 ? VELOCITY + "@" + files.get(f) : VELOCITY;
            out.add(new Term(label, v.medianErrorKms(f), priorOf(priors, VELOCITY, files.get(f))));
        }
        return new JitterTerms(out, bandNames.size());
    }

    /**
     * Refuses jitter priors when the posterior has no jitter term.
     *
     * @throws BadInputException naming the prior, when {@code jitter} is false and a prior is on a jitter
     */
    static void checkPriors(Priors priors, boolean jitter) {
        if (jitter) {
            return;
        }
        for (String name : priors.byName().keySet()) {
            if (isJitterName(name)) {
                throw new BadInputException(where(priors, name) + "a prior on " + name + " needs a jitter term to act "
                        + "on; add --posterior --jitter, or remove the prior");
            }
        }
    }

    private static String where(Priors priors, String name) {
        return (priors.source().isEmpty() ? "" : priors.source() + ": ") + "key 'priors." + name + "': ";
    }

    private static void checkNames(Priors priors, String base, List<String> known, String what) {
        for (var e : priors.byName().entrySet()) {
            String name = e.getKey();
            if (!Priors.baseName(name).equals(base)) {
                continue;
            }
            String qualifier = Priors.bandOf(name);
            if (qualifier != null && !known.contains(qualifier)) {
                throw new BadInputException(where(priors, name) + "the fit has no " + what + " '" + qualifier + "'"
                        + (known.isEmpty() ? "" : "; its " + what + "s are " + String.join(", ", known)));
            }
            if (e.getValue() instanceof Prior.Uniform u && !(u.upper() > 0)) {
                throw new BadInputException(where(priors, name) + String.format(Locale.ROOT, "a jitter is a scatter, "
                        + "at least 0, and the uniform prior [%s, %s] allows no positive value; give a range with a "
                        + "positive upper end", u.lower(), u.upper()));
            }
        }
    }

    /** The prior on {@code base@qualifier}, else on {@code base}, else null (the default). */
    private static Prior priorOf(Priors priors, String base, String qualifier) {
        Prior p = priors.get(base + "@" + qualifier);
        return p != null ? p : priors.get(base);
    }

    /** Number of jitter terms (sampled coordinates). */
    int size() {
        return terms.size();
    }

    /** The terms: the bands in the layout's order, then the velocity files. */
    List<Term> terms() {
        return terms;
    }

    /** Σ ln prior of the sampled ln s in {@code u[off ..]}; −∞ outside a prior. */
    double logPrior(double[] u, int off) {
        double s = 0;
        for (int k = 0; k < terms.size(); k++) {
            s += terms.get(k).logPrior(u[off + k]);
        }
        return s;
    }

    /**
     * ln L of every data set of the objective at {@code ext}, each with its jitter exp(u[off + k])
     * added in quadrature to the errors.
     */
    double logLikelihood(FitObjective objective, double[] ext, double[] u, int off,
            WeightedResiduals.Workspace work) {
        double[] light = new double[bands];
        for (int b = 0; b < bands; b++) {
            light[b] = Math.exp(u[off + b]);
        }
        double s = objective.lightCurves().logLikelihood(ext, work, light);
        VelocityResiduals v = objective.velocities();
        if (v != null) {
            double[] kms = new double[terms.size() - bands];
            for (int f = 0; f < kms.length; f++) {
                kms[f] = Math.exp(u[off + bands + f]);
            }
            s += v.logLikelihood(ext, kms);
        }
        return s;
    }
}
