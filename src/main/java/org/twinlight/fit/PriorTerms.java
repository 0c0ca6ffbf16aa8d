package org.twinlight.fit;

import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Set;
import java.util.function.ToDoubleFunction;
import org.twinlight.BadInputException;

/**
 * The priors of a fit bound to its parameters: each term is a prior and the function of the
 * external vector it applies to (a parameter, or a derived quantity of one band). Built once per
 * problem; the names are checked here.
 */
final class PriorTerms {

    /** One prior on one quantity; {@code label} is the name with its band where it has one. */
    record Term(String label, Prior prior, ToDoubleFunction<double[]> quantity) {
        double value(double[] ext) {
            return quantity.applyAsDouble(ext);
        }
    }

    private final List<Term> terms;
    private final List<Term> normal;
    private final List<Term> uniform;

    private PriorTerms(List<Term> terms) {
        this.terms = List.copyOf(terms);
        this.normal = terms.stream().filter(t -> t.prior() instanceof Prior.Normal).toList();
        this.uniform = terms.stream().filter(t -> t.prior() instanceof Prior.Uniform).toList();
    }

    static PriorTerms none() {
        return new PriorTerms(List.of());
    }

    /**
     * Binds the priors to the layout's parameters.
     *
     * @throws BadInputException naming the source and key for an unknown name, a prior on a fixed
     *     parameter (or on a derived quantity no free parameter moves), or a starting value outside
     *     a uniform prior
     */
    static PriorTerms bind(Priors priors, ParameterLayout layout) {
        List<Term> out = new ArrayList<>();
        double[] start = layout.startExternal();
        for (var e : priors.byName().entrySet()) {
            String name = e.getKey();
            if (JitterTerms.isJitterName(name)) {
                // a jitter is no parameter of the model: the sampler's JitterTerms take its prior
                continue;
            }
            Prior prior = e.getValue();
            String key = (priors.source().isEmpty() ? "" : priors.source() + ": ") + "key 'priors." + name + "': ";
            String base = Priors.baseName(name);
            String band = Priors.bandOf(name);
            List<Term> bound = new ArrayList<>();
            if (layout.indexOf(base, null) >= 0) {
                bound.addAll(parameterTerms(layout, base, band, prior, key));
            } else if (Priors.DERIVED_NAMES.contains(base)) {
                bound.addAll(derivedTerms(layout, base, band, prior, key));
            } else {
                Set<String> known = new LinkedHashSet<>();
                layout.parameters().forEach(p -> known.add(p.name()));
                known.addAll(Priors.DERIVED_NAMES);
                throw new BadInputException(key + "unknown name '" + base + "'; a prior goes on a parameter or a "
                        + "derived quantity: " + String.join(", ", known) + " (NAME@BAND for one band)");
            }
            for (Term t : bound) {
                double v = t.value(start);
                if (prior instanceof Prior.Uniform u && !u.allows(v)) {
                    throw new BadInputException(key + String.format(Locale.ROOT, "the starting value of %s, %.6g, "
                            + "lies outside the uniform prior [%s, %s]; start inside it or widen the prior",
                            t.label(), v, u.lower(), u.upper()));
                }
            }
            out.addAll(bound);
        }
        return new PriorTerms(out);
    }

    private static List<Term> parameterTerms(ParameterLayout layout, String base, String band, Prior prior,
            String key) {
        List<Term> out = new ArrayList<>();
        boolean multiBand = layout.bands().size() > 1;
        for (int i = 0; i < layout.externalSize(); i++) {
            FitParameter p = layout.parameter(i);
            if (!p.name().equals(base)) {
                continue;
            }
            if (p.band() == null && band != null) {
                throw new BadInputException(key + base + " is common to every band; give its prior without @" + band);
            }
            if (band != null && !band.equals(p.band())) {
                continue;
            }
            if (!p.free()) {
                throw new BadInputException(key + "the prior is on " + p.label(multiBand) + ", which is fixed; free "
                        + "it (--free " + base + ") or remove the prior");
            }
            int index = i;
            out.add(new Term(p.label(multiBand), prior, ext -> ext[index]));
        }
        if (out.isEmpty()) {
            throw new BadInputException(key + "the fit has no band '" + band + "'; its bands are "
                    + String.join(", ", layout.bands()));
        }
        return out;
    }

    private static List<Term> derivedTerms(ParameterLayout layout, String base, String band, Prior prior,
            String key) {
        boolean perBand = Derived.perBand(base);
        if (!perBand && band != null) {
            throw new BadInputException(key + base + " is common to every band; give its prior without @" + band);
        }
        if (band != null && !layout.bands().contains(band)) {
            throw new BadInputException(key + "the fit has no band '" + band + "'; its bands are "
                    + String.join(", ", layout.bands()));
        }
        List<Term> out = new ArrayList<>();
        boolean multiBand = layout.bands().size() > 1;
        for (int b = 0; b < layout.bands().size(); b++) {
            String bandName = layout.bands().get(b);
            if (!perBand && b > 0 || band != null && !band.equals(bandName)) {
                continue;
            }
            int bb = b;
            Term t = new Term(perBand && multiBand ? base + "@" + bandName : base, prior,
                    ext -> Derived.value(base, layout.parameters(ext, bb)));
            if (!movedByFreeParameters(layout, t)) {
                throw new BadInputException(key + t.label() + " depends on no free parameter; free the parameters "
                        + "it is made of or remove the prior");
            }
            out.add(t);
        }
        return out;
    }

    /** Whether a step in any internal coordinate changes the quantity. */
    private static boolean movedByFreeParameters(ParameterLayout layout, Term t) {
        double[] x = layout.startInternal();
        double v0 = t.value(layout.toExternal(x));
        double[] steps = layout.steps();
        for (int j = 0; j < x.length; j++) {
            double[] y = x.clone();
            y[j] += 10 * steps[j];
            if (t.value(layout.toExternal(layout.validate(y))) != v0) {
                return true;
            }
        }
        return false;
    }

    boolean isEmpty() {
        return terms.isEmpty();
    }

    List<Term> terms() {
        return terms;
    }

    /** Number of pseudo-residuals: one per normal prior. */
    int residualCount() {
        return normal.size();
    }

    /** Fills out[off..] with (x − μ)/σ of every normal prior. */
    void residuals(double[] ext, double[] out, int off) {
        for (int k = 0; k < normal.size(); k++) {
            Term t = normal.get(k);
            out[off + k] = ((Prior.Normal) t.prior()).residual(t.value(ext));
        }
    }

    boolean hasBounds() {
        return !uniform.isEmpty();
    }

    /** Whether every uniform prior allows the external vector. */
    boolean allows(double[] ext) {
        for (Term t : uniform) {
            if (!t.prior().allows(t.value(ext))) {
                return false;
            }
        }
        return true;
    }

    /** Σ ln p of every prior; −∞ when a uniform prior excludes the point. */
    double logDensity(double[] ext) {
        double s = 0;
        for (Term t : terms) {
            s += t.prior().logDensity(t.value(ext));
            if (s == Double.NEGATIVE_INFINITY) {
                return s;
            }
        }
        return s;
    }
}
