package org.twinlight.fit;

/**
 * What is known about a parameter (or a derived quantity) before the data: a flat range or a
 * Gaussian. The least-squares solver uses a uniform prior as a hard bound and a normal prior as one
 * more weighted residual (x − μ)/σ; a sampler uses {@link #logDensity(double)}.
 */
public sealed interface Prior permits Prior.Uniform, Prior.Normal {

    /** ln p(x), normalised; −∞ where the prior excludes x. */
    double logDensity(double x);

    /** Whether the prior allows x at all. */
    default boolean allows(double x) {
        return logDensity(x) > Double.NEGATIVE_INFINITY;
    }

    /**
     * Flat between two values, zero outside.
     *
     * @param lower lowest allowed value
     * @param upper highest allowed value, above {@code lower}
     */
    record Uniform(double lower, double upper) implements Prior {
        public Uniform {
            if (!Double.isFinite(lower) || !Double.isFinite(upper) || !(lower < upper)) {
                throw new IllegalArgumentException("a uniform prior needs finite bounds lo < hi, got [" + lower + ", "
                        + upper + "]");
            }
        }

        @Override
        public double logDensity(double x) {
            return x >= lower && x <= upper ? -Math.log(upper - lower) : Double.NEGATIVE_INFINITY;
        }
    }

    /**
     * Gaussian with a mean and a standard deviation.
     *
     * @param mean the most probable value
     * @param sigma standard deviation, positive and finite
     */
    record Normal(double mean, double sigma) implements Prior {
        private static final double LN_SQRT_2PI = 0.5 * Math.log(2 * Math.PI);

        public Normal {
            if (!Double.isFinite(mean)) {
                throw new IllegalArgumentException("a normal prior needs a finite mean, got " + mean);
            }
            if (!(sigma > 0) || !Double.isFinite(sigma)) {
                throw new IllegalArgumentException("a normal prior needs a positive, finite sigma, got " + sigma);
            }
        }

        @Override
        public double logDensity(double x) {
            double z = (x - mean) / sigma;
            return -0.5 * z * z - Math.log(sigma) - LN_SQRT_2PI;
        }

        /** The prior as a weighted residual for least squares: (x − μ)/σ. */
        public double residual(double x) {
            return (x - mean) / sigma;
        }
    }
}
