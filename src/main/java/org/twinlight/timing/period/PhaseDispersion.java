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

    /** Θ and the degrees of freedom of the pooled in-bin variance. */
    record Theta(double theta, long degreesOfFreedom) {
    }

    /**
     * Θ at {@code periodDays} with {@code bins} equal phase bins in each of {@link #COVERS} covers (the
     * bin grid shifted by 1/COVERS of a bin per cover; Stellingwerf's (N<sub>b</sub>, N<sub>c</sub>)
     * scheme), pooled over all bins of all covers. The covers make Θ less sensitive to where the bin
     * edges fall on an eclipse.
     */
    Theta theta(double periodDays, int bins) {
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
            return new Theta(Double.NaN, 0);
        }
        return new Theta(pooled / dof / totalVariance, dof / COVERS);
    }

    /**
     * Θ with bins of a fixed width in days, so that trial periods are compared at the same time
     * resolution (bins with fewer than two points drop out of the pooled variance, which stays an
     * unbiased estimate however many bins are empty). At least 10 bins, at most twice as many as points.
     */
    Theta thetaWithBinWidth(double periodDays, double binWidthDays) {
        long bins = (long) Math.ceil(periodDays / binWidthDays);
        bins = Math.max(10, Math.min(bins, 2L * flux.length));
        return theta(periodDays, (int) bins);
    }

    /**
     * Dispersion inside the eclipses against outside, F = s²<sub>dip</sub>/s²<sub>out</sub>: the pooled
     * in-bin variances (bins of {@code binWidthDays}) of the bins whose mean lies more than 5σ of a mean
     * below the out-of-eclipse level (the median of the bin means), and of the others. A period that folds
     * eclipses onto out-of-eclipse data from other cycles mixes both levels in its eclipse bins, which
     * raises F however few bins are mixed; correlated noise (nightly zero points) raises both variances
     * alike. At a true period F stays near its value at any multiple of it.
     *
     * @param noiseSigma the point-to-point scatter of the data (for the 5σ selection)
     */
    Theta eclipseDispersion(double periodDays, double binWidthDays, double noiseSigma) {
        int bins = (int) Math.max(10, Math.min(Math.ceil(periodDays / binWidthDays), 2L * flux.length));
        double[] sum = new double[bins];
        double[] sumSq = new double[bins];
        int[] count = new int[bins];
        double t0 = timesDays[0];
        for (int i = 0; i < flux.length; i++) {
            double p = (timesDays[i] - t0) / periodDays;
            int b = Math.min(bins - 1, (int) ((p - Math.floor(p)) * bins));
            sum[b] += flux[i];
            sumSq[b] += flux[i] * flux[i];
            count[b]++;
        }
        double[] means = new double[bins];
        int filled = 0;
        for (int b = 0; b < bins; b++) {
            if (count[b] > 0) {
                means[filled++] = sum[b] / count[b];
            }
        }
        double level = org.twinlight.photometry.RobustStatistics.medianInPlace(means, filled);
        double dipSs = 0;
        long dipDof = 0;
        double outSs = 0;
        long outDof = 0;
        for (int b = 0; b < bins; b++) {
            if (count[b] < 2) {
                continue;
            }
            double m = sum[b] / count[b];
            double ss = Math.max(0, sumSq[b] - count[b] * m * m);
            if (level - m > 5 * noiseSigma / Math.sqrt(count[b])) {
                dipSs += ss;
                dipDof += count[b] - 1;
            } else {
                outSs += ss;
                outDof += count[b] - 1;
            }
        }
        if (dipDof == 0 || outDof == 0 || outSs == 0) {
            return new Theta(Double.NaN, 0);
        }
        return new Theta((dipSs / dipDof) / (outSs / outDof), dipDof);
    }
}
