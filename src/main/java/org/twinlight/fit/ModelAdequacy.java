package org.twinlight.fit;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.apache.commons.math3.distribution.ChiSquaredDistribution;
import org.apache.commons.math3.distribution.NormalDistribution;
import org.twinlight.eclipse.BinaryParameters;

/**
 * Whether the fitted model describes the data, from three checks of the residuals of the used
 * points, each at a false-alarm probability of {@link #FALSE_ALARM} (so the three together raise a
 * false alarm for a correct model in well under 1% of cases):
 * <ul>
 * <li>χ²ν against its expected spread √(2/ν) for ν degrees of freedom (skipped when the errors
 * were estimated from the scatter: χ²ν is then 1 by construction);</li>
 * <li>the runs test on the signs of the residuals in time order (Wald &amp; Wolfowitz 1940, Ann.
 * Math. Stat. 11, 147): too few runs mean structure or correlated noise;</li>
 * <li>binned residuals by phase: in each phase bin the mean normalised residual, whose
 * √n-weighted squares sum to χ² with one degree of freedom per bin for a correct model. Each
 * eclipse gets its own bins so that a mismatch of its shape is not diluted.</li>
 * </ul>
 * When a check fails, the likely cause is named from where the structure lies: inside the eclipses
 * (third light or limb darkening), out of eclipse with the orbital harmonics of proximity effects
 * (cos 2φ: ellipsoidal; cos φ: reflection), or in time but not in phase (correlated noise).
 */
public final class ModelAdequacy {
    /** False-alarm probability of each check (one-sided). */
    public static final double FALSE_ALARM = 0.001;
    private static final int BINS_PER_ECLIPSE = 8;
    private static final int BINS_OUT_OF_ECLIPSE = 20;
    private static final int MIN_PER_BIN = 5;

    /**
     * The outcome.
     *
     * @param describesData false when any check failed
     * @param reducedChi2 χ²ν of the used points
     * @param expectedSpread √(2/ν)
     * @param chi2Tested whether the χ² check applied (errors given, not estimated)
     * @param chi2Passed result of the χ² check (true when not tested)
     * @param runs number of runs of residual signs
     * @param expectedRuns expected number for independent residuals
     * @param runsZ standardised deviation of the runs (negative: too few)
     * @param runsPassed result of the runs test
     * @param binnedChi2 χ² of the binned residuals (scaled by χ²ν)
     * @param bins number of bins
     * @param binnedProbability probability of so large a binned χ² for a correct model
     * @param binnedPassed result of the binned test
     * @param inEclipseChi2 part of the binned χ² from the eclipse bins
     * @param inEclipseBins number of eclipse bins
     * @param largestBinnedResidual largest |mean residual| of a bin, normalised flux
     * @param largestBinPhase phase of that bin
     * @param note the note for the user when a check failed, else null
     */
    public record Result(boolean describesData, double reducedChi2, double expectedSpread, boolean chi2Tested,
            boolean chi2Passed, int runs, double expectedRuns, double runsZ, boolean runsPassed, double binnedChi2,
            int bins, double binnedProbability, boolean binnedPassed, double inEclipseChi2, int inEclipseBins,
            double largestBinnedResidual, double largestBinPhase, String note) {
    }

    private ModelAdequacy() {
    }

    /**
     * Runs the checks on the fitted curves.
     *
     * @param modelOfCurve the fitted parameters of the curve at each index
     * @param fittedQuantities number of fitted quantities (degrees of freedom are n minus this)
     * @param errorsEstimated whether the errors were estimated from the scatter (no χ² check then)
     */
    public static Result check(List<FittedCurve> curves, java.util.function.IntFunction<BinaryParameters> modelOfCurve,
            int fittedQuantities, boolean errorsEstimated) {
        double chi2 = 0;
        int n = 0;
        int runs = 0;
        int plus = 0;
        int minus = 0;
        for (FittedCurve c : curves) {
            int lastSign = 0;
            for (int i = 0; i < c.size(); i++) {
                if (c.clipped()[i]) {
                    continue;
                }
                double z = c.residual(i) / c.errors()[i];
                chi2 += z * z;
                n++;
                int sign = z >= 0 ? 1 : -1;
                if (sign > 0) {
                    plus++;
                } else {
                    minus++;
                }
                if (sign != lastSign) {
                    runs++;
                    lastSign = sign;
                }
            }
        }
        int dof = Math.max(1, n - fittedQuantities);
        double reduced = chi2 / dof;
        double spread = Math.sqrt(2.0 / dof);
        double zCrit = new NormalDistribution().inverseCumulativeProbability(1 - FALSE_ALARM);
        boolean chi2Passed = errorsEstimated || (reduced - 1) / spread <= zCrit;

        // Wald & Wolfowitz (1940): mean 2n₊n₋/n + 1, variance (μ − 1)(μ − 2)/(n − 1); each curve
        // starts a new run, so the count is compared per curve pooled (the boundaries add < 1 run each).
        double mu = 2.0 * plus * minus / Math.max(1, n) + curves.size();
        double var = (mu - 1) * (mu - 2) / Math.max(1, n - 1);
        double runsZ = var > 0 ? (runs - mu) / Math.sqrt(var) : 0;
        boolean runsPassed = runsZ >= -zCrit;

        Binned binned = binned(curves, modelOfCurve, Math.max(reduced, 1e-12));
        double pBinned = binned.bins > 0 ? 1 - new ChiSquaredDistribution(binned.bins).cumulativeProbability(binned.chi2)
                : 1;
        boolean binnedPassed = pBinned >= FALSE_ALARM;
        boolean ok = chi2Passed && runsPassed && binnedPassed;
        Result draft = new Result(ok, reduced, spread, !errorsEstimated, chi2Passed, runs, mu, runsZ, runsPassed,
                binned.chi2, binned.bins, pBinned, binnedPassed, binned.inEclipseChi2, binned.inEclipseBins,
                binned.largest, binned.largestPhase, null);
        return ok ? draft : withNote(draft, binned);
    }

    private record Binned(double chi2, int bins, double inEclipseChi2, int inEclipseBins, double outChi2,
            int outBins, double largest, double largestPhase, double cos1Sigmas, double cos2Sigmas) {
    }

    /** Mean normalised residuals in phase bins; every residual divided by √χ²ν so that the error scale cancels. */
    private static Binned binned(List<FittedCurve> curves, java.util.function.IntFunction<BinaryParameters> modelOf,
            double reduced) {
        double scale = Math.sqrt(reduced);
        int total = 2 * BINS_PER_ECLIPSE + BINS_OUT_OF_ECLIPSE;
        double[] sumZ = new double[total];
        double[] sumR = new double[total];
        double[] sumPhase = new double[total];
        int[] count = new int[total];
        // out-of-eclipse harmonics: weighted sums for cos φ and cos 2φ (orthogonal enough for a check)
        double c1 = 0;
        double c1n = 0;
        double c2 = 0;
        double c2n = 0;
        for (int k = 0; k < curves.size(); k++) {
            FittedCurve c = curves.get(k);
            BinaryParameters p = modelOf.apply(k);
            double sec = p.orbit().secondaryPhase();
            double[] half = eclipseHalfWidths(c, p, sec);
            for (int i = 0; i < c.size(); i++) {
                if (c.clipped()[i]) {
                    continue;
                }
                double ph = (c.timesDays()[i] - p.epochDays()) / p.periodDays();
                ph -= Math.floor(ph);
                double z = c.residual(i) / c.errors()[i] / scale;
                double d1 = wrap(ph);
                double d2 = wrap(ph - sec);
                int bin;
                if (half[0] > 0 && Math.abs(d1) <= half[0]) {
                    bin = Math.min(BINS_PER_ECLIPSE - 1, (int) ((d1 + half[0]) / (2 * half[0]) * BINS_PER_ECLIPSE));
                } else if (half[1] > 0 && Math.abs(d2) <= half[1]) {
                    bin = BINS_PER_ECLIPSE
                            + Math.min(BINS_PER_ECLIPSE - 1, (int) ((d2 + half[1]) / (2 * half[1]) * BINS_PER_ECLIPSE));
                } else {
                    bin = 2 * BINS_PER_ECLIPSE + Math.min(BINS_OUT_OF_ECLIPSE - 1, (int) (ph * BINS_OUT_OF_ECLIPSE));
                    double a1 = Math.cos(2 * Math.PI * ph);
                    double a2 = Math.cos(4 * Math.PI * ph);
                    c1 += z * a1;
                    c1n += a1 * a1;
                    c2 += z * a2;
                    c2n += a2 * a2;
                }
                sumZ[bin] += z;
                sumR[bin] += c.residual(i);
                sumPhase[bin] += ph;
                count[bin]++;
            }
        }
        double chi2 = 0;
        double inChi2 = 0;
        double outChi2 = 0;
        int bins = 0;
        int inBins = 0;
        int outBins = 0;
        double largest = 0;
        double largestPhase = Double.NaN;
        for (int b = 0; b < total; b++) {
            if (count[b] < MIN_PER_BIN) {
                continue;
            }
            double term = sumZ[b] * sumZ[b] / count[b];
            chi2 += term;
            bins++;
            if (b < 2 * BINS_PER_ECLIPSE) {
                inChi2 += term;
                inBins++;
            } else {
                outChi2 += term;
                outBins++;
            }
            double mean = sumR[b] / count[b];
            if (Math.abs(mean) > Math.abs(largest)) {
                largest = mean;
                largestPhase = sumPhase[b] / count[b];
            }
        }
        return new Binned(chi2, bins, inChi2, inBins, outChi2, outBins, largest, largestPhase,
                c1n > 0 ? c1 / Math.sqrt(c1n) : 0, c2n > 0 ? c2 / Math.sqrt(c2n) : 0);
    }

    /** Half-widths in phase of the primary and secondary eclipse of the model (0 where none). */
    private static double[] eclipseHalfWidths(FittedCurve c, BinaryParameters p, double sec) {
        double h1 = 0;
        double h2 = 0;
        for (int i = 0; i < c.size(); i++) {
            if (c.model()[i] < 1 - 1e-9) {
                double ph = (c.timesDays()[i] - p.epochDays()) / p.periodDays();
                ph -= Math.floor(ph);
                double d1 = Math.abs(wrap(ph));
                double d2 = Math.abs(wrap(ph - sec));
                if (d1 <= d2) {
                    h1 = Math.max(h1, d1);
                } else {
                    h2 = Math.max(h2, d2);
                }
            }
        }
        return new double[] {h1, h2};
    }

    private static double wrap(double d) {
        return d - Math.rint(d);
    }

    private static Result withNote(Result r, Binned b) {
        List<String> failed = new ArrayList<>();
        if (!r.chi2Passed()) {
            failed.add(String.format(Locale.ROOT, "reduced chi-square %.3f where a correct model with correct errors "
                    + "gives 1 ± %.3f", r.reducedChi2(), r.expectedSpread()));
        }
        if (!r.runsPassed()) {
            failed.add(String.format(Locale.ROOT, "%d runs of residual signs where %.0f are expected (z = %.1f)",
                    r.runs(), r.expectedRuns(), r.runsZ()));
        }
        if (!r.binnedPassed()) {
            failed.add(String.format(Locale.ROOT, "binned residuals by phase give chi-square %.1f over %d bins "
                    + "(largest mean residual %.0f ppm at phase %.3f)", r.binnedChi2(), r.bins(),
                    r.largestBinnedResidual() * 1e6, r.largestBinPhase()));
        }
        List<String> causes = new ArrayList<>();
        double critOne = new ChiSquaredDistribution(Math.max(1, b.inEclipseBins))
                .inverseCumulativeProbability(1 - FALSE_ALARM);
        if (b.inEclipseBins > 0 && b.inEclipseChi2 > critOne) {
            causes.add(String.format(Locale.ROOT, "the eclipse shapes are not matched (chi-square %.1f over the %d "
                    + "in-eclipse bins): the usual causes are third light held at a wrong value (try --free thirdLight) "
                    + "or a wrong limb-darkening law or coefficients (try freeing limbDarkening1 and limbDarkening2, or "
                    + "another law)", b.inEclipseChi2, b.inEclipseBins));
        }
        double zCrit = new NormalDistribution().inverseCumulativeProbability(1 - FALSE_ALARM / 2);
        if (Math.abs(b.cos2Sigmas) > zCrit || Math.abs(b.cos1Sigmas) > zCrit) {
            causes.add(String.format(Locale.ROOT, "out of eclipse the residuals follow the orbit (cos 2φ at %.1fσ, "
                    + "cos φ at %.1fσ): proximity effects (ellipsoidal variation, reflection) that two spheres do "
                    + "not model", b.cos2Sigmas, b.cos1Sigmas));
        }
        if (!r.runsPassed() && r.binnedPassed()) {
            causes.add("the residuals are correlated in time but not in phase: correlated noise (instrumental or "
                    + "stellar); the uncertainties are then too small");
        }
        if (causes.isEmpty() && !r.chi2Passed() && r.runsPassed() && r.binnedPassed()) {
            causes.add("no structure in the residuals: the given errors look too small rather than the model wrong");
        }
        if (causes.isEmpty()) {
            causes.add("the structure is not clearly in the eclipses or out of them: look at the residuals in fit.png");
        }
        String note = "the model does not describe the data: " + String.join("; ", failed) + ". Likely cause: "
                + String.join("; ", causes) + ". The fitted values and their uncertainties are then biased";
        return new Result(false, r.reducedChi2(), r.expectedSpread(), r.chi2Tested(), r.chi2Passed(), r.runs(),
                r.expectedRuns(), r.runsZ(), r.runsPassed(), r.binnedChi2(), r.bins(), r.binnedProbability(),
                r.binnedPassed(), r.inEclipseChi2(), r.inEclipseBins(), r.largestBinnedResidual(),
                r.largestBinPhase(), note);
    }
}
