package org.twinlight.sampling;

/**
 * The integrated autocorrelation time τ = 1 + 2 Σ ρ(t) of a quantity along an ensemble's chain
 * (Sokal 1997, "Monte Carlo methods in statistical mechanics", in Functional Integration, NATO
 * ASI Series B 361, 131, Sect. 3; Goodman &amp; Weare 2010, Comm. App. Math. Comp. Sci. 5, 65,
 * Sect. 4). The normalised autocorrelation function ρ(t) of each walker's series is computed with
 * a fast Fourier transform (zero-padded to avoid wrap-around) and averaged over the walkers; the
 * sum runs to Sokal's automatic window, the smallest M with M ≥ c τ(M), c = 5.
 */
public final class AutocorrelationTime {
    /** Sokal's window constant c (Sokal 1997 suggests c ≈ 4–10; 5 is the usual choice). */
    public static final double WINDOW_CONSTANT = 5.0;

    private AutocorrelationTime() {
    }

    /**
     * τ of one quantity from several walkers' series of equal length, in steps.
     *
     * @param series series[w][t], the value at step t of walker w (at least 2 steps)
     */
    public static double of(double[][] series) {
        int n = series[0].length;
        if (n < 2) {
            return Double.NaN;
        }
        double[] rho = new double[n];
        int used = 0;
        // two real series per complex transform: the first in the real part, the second in the imaginary
        for (int w = 0; w < series.length; w += 2) {
            double[][] c = autocovariances(series[w], w + 1 < series.length ? series[w + 1] : null);
            for (double[] cw : c) {
                if (cw != null && cw[0] > 0) {
                    for (int t = 0; t < n; t++) {
                        rho[t] += cw[t] / cw[0];
                    }
                    used++;
                }
            }
        }
        if (used == 0) {
            // a quantity that never moved: no information, τ undefined
            return Double.NaN;
        }
        for (int t = 0; t < n; t++) {
            rho[t] /= used;
        }
        return windowed(rho, WINDOW_CONSTANT);
    }

    /** τ of a single series. */
    public static double of(double[] series) {
        return of(new double[][] {series});
    }

    /**
     * τ from a normalised autocorrelation function with Sokal's automatic window: τ(M) = 1 + 2
     * Σ_{t=1..M} ρ(t) for the smallest M ≥ c τ(M) (the whole function if no M qualifies).
     */
    static double windowed(double[] rho, double c) {
        double tau = 1;
        for (int m = 1; m < rho.length; m++) {
            tau += 2 * rho[m];
            if (m >= c * tau) {
                return tau;
            }
        }
        return tau;
    }

    /**
     * Biased autocovariance c(t) = (1/n) Σ (x_i − x̄)(x_{i+t} − x̄), t = 0..n−1, through the
     * Wiener–Khinchin theorem on a series zero-padded to a power of two ≥ 2n.
     */
    static double[] autocovariance(double[] x) {
        return autocovariances(x, null)[0];
    }

    /**
     * The autocovariances of two series of equal length ({@code b} may be null) from one complex
     * transform of a + ib: with Z its transform, A_k = (Z_k + conj Z_{N−k})/2 and B_k = (Z_k −
     * conj Z_{N−k})/(2i); the inverse transform of |A|² + i|B|² holds both autocovariances.
     */
    static double[][] autocovariances(double[] a, double[] b) {
        int n = a.length;
        int size = Integer.highestOneBit(Math.max(1, 2 * n - 1)) << 1;
        double[] re = new double[size];
        double[] im = new double[size];
        double ma = mean(a);
        double mb = b == null ? 0 : mean(b);
        for (int i = 0; i < n; i++) {
            re[i] = a[i] - ma;
            im[i] = b == null ? 0 : b[i] - mb;
        }
        fft(re, im, false);
        double[] pa = new double[size];
        double[] pb = new double[size];
        for (int k = 0; k < size; k++) {
            int m = (size - k) & (size - 1);
            double ar = 0.5 * (re[k] + re[m]);
            double ai = 0.5 * (im[k] - im[m]);
            double br = 0.5 * (im[k] + im[m]);
            double bi = -0.5 * (re[k] - re[m]);
            pa[k] = ar * ar + ai * ai;
            pb[k] = br * br + bi * bi;
        }
        fft(pa, pb, true);
        double[] ca = new double[n];
        double[] cb = b == null ? null : new double[n];
        for (int t = 0; t < n; t++) {
            ca[t] = pa[t] / size / n;
            if (cb != null) {
                cb[t] = pb[t] / size / n;
            }
        }
        return new double[][] {ca, cb};
    }

    private static double mean(double[] x) {
        double s = 0;
        for (double v : x) {
            s += v;
        }
        return s / x.length;
    }

    /** In-place iterative radix-2 Cooley–Tukey transform; {@code inverse} flips the sign (no 1/n). */
    static void fft(double[] re, double[] im, boolean inverse) {
        int n = re.length;
        for (int i = 1, j = 0; i < n; i++) {
            int bit = n >> 1;
            for (; (j & bit) != 0; bit >>= 1) {
                j ^= bit;
            }
            j ^= bit;
            if (i < j) {
                double t = re[i];
                re[i] = re[j];
                re[j] = t;
                t = im[i];
                im[i] = im[j];
                im[j] = t;
            }
        }
        for (int len = 2; len <= n; len <<= 1) {
            double ang = 2 * Math.PI / len * (inverse ? 1 : -1);
            double wr = Math.cos(ang);
            double wi = Math.sin(ang);
            int half = len >> 1;
            for (int i = 0; i < n; i += len) {
                double cr = 1;
                double ci = 0;
                for (int k = 0; k < half; k++) {
                    int a = i + k;
                    int b = a + half;
                    double xr = re[b] * cr - im[b] * ci;
                    double xi = re[b] * ci + im[b] * cr;
                    re[b] = re[a] - xr;
                    im[b] = im[a] - xi;
                    re[a] += xr;
                    im[a] += xi;
                    double nr = cr * wr - ci * wi;
                    ci = cr * wi + ci * wr;
                    cr = nr;
                }
            }
        }
    }
}
