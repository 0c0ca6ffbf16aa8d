package org.twinlight.timing.period;

/**
 * Phase dispersion minimisation statistic of Stellingwerf (1978, ApJ 224, 953):
 * Θ = s²/σ², with σ² = Σ(x<sub>i</sub> − x̄)²/(N − 1) the total variance and
 * s² = Σ<sub>j</sub>(n<sub>j</sub> − 1)s<sub>j</sub>² / (Σ<sub>j</sub>n<sub>j</sub> − M) the pooled
 * variance inside the M phase bins (bins with fewer than two points are left
 * out), pooled over shifted covers. Θ ≈ 1 for a wrong period and falls towards the noise share of
 * the variance at the true one.
 * It is independent of the box model of BLS: it uses no eclipse shape at all.
 */
final class PhaseDispersion {
    /** Covers (shifted bin grids) pooled in Θ. */
    static final int COVERS = 2;
    private final double[] timesDays;
    private final double[] flux;
    private final double totalVariance;

    PhaseDispersion(double[] timesDays, double[] flux) {
        this.timesDays = timesDays;
        double mean = 0;
        for (double x : flux) {
            mean += x;
        }
        mean /= flux.length;
        // Values about the mean: the bin sums of squares below then do not cancel.
        this.flux = new double[flux.length];
        double ss = 0;
        for (int i = 0; i < flux.length; i++) {
            this.flux[i] = flux[i] - mean;
            ss += this.flux[i] * this.flux[i];
        }
        this.totalVariance = ss / (flux.length - 1);
    }

    /**
     * Θ at {@code periodDays} with {@code bins} equal phase bins in each of {@link #COVERS} covers (the
     * bin grid shifted by 1/COVERS of a bin per cover; Stellingwerf's (N<sub>b</sub>, N<sub>c</sub>)
     * scheme), pooled over all bins of all covers. The covers make Θ less sensitive to where the bin
     * edges fall on an eclipse.
     */
    double theta(double periodDays, int bins) {
        double pooled = 0;
        long dof = 0;
        double[] sum = new double[bins];
        double[] sumSq = new double[bins];
        int[] count = new int[bins];
        double t0 = timesDays[0];
        for (int cover = 0; cover < COVERS; cover++) {
            java.util.Arrays.fill(sum, 0);
            java.util.Arrays.fill(sumSq, 0);
            java.util.Arrays.fill(count, 0);
            double offset = (double) cover / (COVERS * bins);
            for (int i = 0; i < flux.length; i++) {
                double p = (timesDays[i] - t0) / periodDays + offset;
                int b = Math.min(bins - 1, (int) ((p - Math.floor(p)) * bins));
                sum[b] += flux[i];
                sumSq[b] += flux[i] * flux[i];
                count[b]++;
            }
            for (int b = 0; b < bins; b++) {
                if (count[b] < 2) {
                    continue;
                }
                double m = sum[b] / count[b];
                pooled += Math.max(0, sumSq[b] - count[b] * m * m);
                dof += count[b] - 1;
            }
        }
        if (dof == 0 || totalVariance == 0) {
            return Double.NaN;
        }
        return pooled / dof / totalVariance;
    }

    /**
     * Θ with bins of a fixed width in days (so P, P/2 and 2P are compared at the same time
     * resolution), at least 10 bins and on average at least 5 points per bin.
     */
    double thetaWithBinWidth(double periodDays, double binWidthDays) {
        int bins = (int) Math.ceil(periodDays / binWidthDays);
        bins = Math.max(10, Math.min(bins, flux.length / 5));
        return theta(periodDays, Math.max(2, bins));
    }
}
